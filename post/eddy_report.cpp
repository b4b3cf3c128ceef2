// The eddy-current parts of a case report: the per-speed table, and torque, EMF and rotor loss
// against slip on a logarithmic axis (where a cage's curve changes, near synchronism, gets as much
// room as the rest) and torque against speed in rpm.

#include <algorithm>
#include <cmath>
#include <numbers>

#include <fmt/format.h>

#include "post/report_parts.hpp"
#include "post/svg_plot.hpp"
#include "post/tables.hpp"

namespace tf::post {
namespace {

constexpr double kRpm = 60.0 / (2 * std::numbers::pi);

/// Two series of one quantity (a main value, a dashed cross-check) against x.
struct Pair {
  svg::Series main, check;
};

Pair pair(const char* main, const char* check, const std::vector<double>& x, const std::vector<SpeedResult>& rows,
          double SpeedResult::*a, double SpeedResult::*b) {
  Pair p{{main, x, {}, false, true}, {check, x, {}, true, true}};
  for (const auto& r : rows) p.main.y.push_back(r.*a), p.check.y.push_back(r.*b);
  return p;
}

Table speed_table(const std::vector<SpeedResult>& rows) {
  Table table{"Per speed", {"speed [rad/s]", "speed [rpm]", "slip", "torque Arkkio [N·m]", "torque cross-check [N·m]",
                            "rotor loss [W]", "rotor loss, balance [W]", "input power [W]", "EMF A [V rms]"},
              {}, "Values below 1e-9 of their column's largest magnitude (round-off) are shown as 0."};
  std::vector<std::vector<double>> columns(table.columns.size());
  for (const SpeedResult& s : rows) {
    const double emf = s.emf_rms.empty() ? std::nan("") : s.emf_rms.front();
    const double values[] = {s.rotor_speed, s.rotor_speed * kRpm, s.slip, s.torque, s.torque_lorentz, s.rotor_loss,
                             s.rotor_loss_balance, s.input_power, emf};
    for (std::size_t c = 0; c < columns.size(); ++c) columns[c].push_back(values[c]);
  }
  std::vector<std::vector<std::string>> text;
  for (const auto& c : columns) text.push_back(column_text(c, 5));
  for (std::size_t k = 0; k < rows.size(); ++k) {
    std::vector<Cell> row;
    for (const auto& c : text) row.emplace_back(c[k]);
    table.rows.push_back(std::move(row));
  }
  return table;
}

}  // namespace

void add_speed_parts(Page& page, std::vector<KeyValue>& head, const std::vector<SpeedResult>& rows) {
  std::size_t best = 0;
  std::vector<double> slip, rpm;
  for (std::size_t k = 0; k < rows.size(); ++k) {
    slip.push_back(rows[k].slip), rpm.push_back(rows[k].rotor_speed * kRpm);
    if (std::abs(rows[k].torque) > std::abs(rows[best].torque)) best = k;
  }
  head.push_back({"rotor speeds", std::to_string(rows.size()), ""});
  if (!rows.empty()) {
    head.push_back({"largest |torque| (Arkkio)", svg::format_number(rows[best].torque, 5), "N·m"});
    head.push_back({"at speed", svg::format_number(rows[best].rotor_speed * kRpm, 6), "rpm"});
    head.push_back({"at slip", svg::format_number(rows[best].slip, 4), ""});
  }
  page.tables.push_back(speed_table(rows));
  // A log axis needs every slip positive: motoring below synchronous speed. Otherwise a linear one.
  const bool log_slip = !rows.empty() && std::all_of(slip.begin(), slip.end(), [](double s) { return s > 0.0; });
  const svg::Axis slip_axis{log_slip ? "slip s (log scale)" : "slip s", ""};
  const char* scale = log_slip ? " on a logarithmic slip axis, so the speeds near synchronism (small slip), where "
                                 "the curve changes most, are spread out"
                               : " (some slips are zero or negative: a linear slip axis)";
  Pair t = pair("Arkkio", "cross-check", slip, rows, &SpeedResult::torque, &SpeedResult::torque_lorentz);
  svg::LineChart torque{"Torque against slip", slip_axis, {"torque", "N·m"}, {t.main, t.check}, {}};
  torque.log_x = log_slip, torque.include_zero = true;
  page.figures.push_back({"torque_slip", std::string("Time-averaged torque against slip s = 1 − p ω_r / ω") + scale + ".",
                          svg::line_chart(torque)});
  Pair by_speed = pair("Arkkio", "cross-check", rpm, rows, &SpeedResult::torque, &SpeedResult::torque_lorentz);
  svg::LineChart torque_speed{"Torque against rotor speed", {"rotor speed", "rpm"}, {"torque", "N·m"},
                              {by_speed.main, by_speed.check}, {}};
  torque_speed.include_zero = true;
  page.figures.push_back({"torque_speed", "Time-averaged torque against rotor speed on a linear rpm axis: Arkkio's "
                                          "method and its cross-check.",
                          svg::line_chart(torque_speed)});
  svg::LineChart emf{"Phase EMF against slip", slip_axis, {"EMF", "V rms"}, {}, {}};
  for (std::size_t k = 0; !rows.empty() && k < rows.front().emf_rms.size(); ++k) {
    svg::Series s{"phase " + phase_name(static_cast<int>(k)), slip, {}, false, true};
    for (const auto& r : rows) s.y.push_back(r.emf_rms[k]);
    emf.series.push_back(std::move(s));
  }
  emf.log_x = log_slip, emf.include_zero = true;
  page.figures.push_back({"emf_slip", std::string("RMS EMF jωψ of each phase against slip") + scale +
                                          ". The phase currents are impressed (the supply's peak current at every "
                                          "speed), so the EMF is what changes with speed.",
                          svg::line_chart(emf)});
  Pair loss = pair("integrated", "power balance", slip, rows, &SpeedResult::rotor_loss, &SpeedResult::rotor_loss_balance);
  svg::LineChart rotor_loss{"Rotor loss against slip", slip_axis, {"rotor loss", "W"}, {loss.main, loss.check}, {}};
  rotor_loss.log_x = log_slip, rotor_loss.include_zero = true;
  page.figures.push_back({"rotor_loss", std::string("Rotor loss against slip") + scale +
                                            ": integrated from the induced currents, and from the power balance "
                                            "(input − stator loss − mechanical power).",
                          svg::line_chart(rotor_loss)});
}

}  // namespace tf::post
