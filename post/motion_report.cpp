// The rotor-motion parts of a case report: back-EMF and flux linkage per phase against rotor
// angle, the EMF's rms and THD, L_d and L_q, and the iron loss per region.

#include <algorithm>
#include <cmath>
#include <numbers>

#include <fmt/format.h>

#include "post/report_parts.hpp"
#include "post/svg_plot.hpp"
#include "post/tables.hpp"
#include "post/waveform.hpp"

namespace tf::post {
namespace {

constexpr double kDeg = 180.0 / std::numbers::pi;

std::vector<double> angles_deg(const MotionResult& r) {
  std::vector<double> out;
  for (const auto& s : r.steps) out.push_back(s.rotor_angle * kDeg);
  return out;
}

/// Whole electrical periods the equally spaced steps cover (the step after the last would close
/// the period); 0 when they do not.
int whole_periods(const MotionResult& r, int pole_pairs) {
  if (r.steps.size() < 2) return 0;
  const double span = (r.steps[1].rotor_angle - r.steps[0].rotor_angle) * static_cast<double>(r.steps.size());
  const double periods = span * pole_pairs / (2 * std::numbers::pi);
  return std::abs(periods - std::round(periods)) < 1e-6 ? static_cast<int>(std::round(periods)) : 0;
}

/// One series per phase of a per-step quantity.
std::vector<svg::Series> per_phase(const MotionResult& r, std::vector<double> PositionStep::*values) {
  std::vector<svg::Series> out;
  const std::size_t n = (r.steps.front().*values).size();
  for (std::size_t k = 0; k < n; ++k) {
    svg::Series s{"phase " + phase_name(static_cast<int>(k)), angles_deg(r), {}};
    for (const auto& step : r.steps) s.y.push_back((step.*values)[k]);
    out.push_back(std::move(s));
  }
  return out;
}

Table emf_table(const EmfSummary& e) {
  Table t{"Back-EMF per phase", {"phase", "rms [V]", "peak [V]", "THD [%]"}, {},
          fmt::format("e = −dψ/dt at the study's speed over the steps. THD = √(E_2² + … + E_H²) / E_1, E_h the rms of "
                      "harmonic h (IEEE Std 519 and IEC 61000-2-2 definition), H = {} (the steps' Nyquist limit or 50); "
                      "'–' where the steps do not cover whole electrical periods.",
                      e.highest_order)};
  for (std::size_t k = 0; k < e.rms.size(); ++k)
    t.rows.push_back({phase_name(static_cast<int>(k)), svg::format_number(e.rms[k], 5), svg::format_number(e.peak[k], 5),
                      std::isnan(e.thd[k]) ? "–" : svg::format_number(100 * e.thd[k], 4)});
  return t;
}

/// L_d and L_q against rotor angle, apparent (solid) and incremental (dashed).
Figure dq_inductance_figure(const MotionResult& r) {
  svg::Series d{"L_d apparent", angles_deg(r), {}}, q{"L_q apparent", angles_deg(r), {}};
  svg::Series di{"L_d incremental", angles_deg(r), {}, true}, qi{"L_q incremental", angles_deg(r), {}, true};
  for (const auto& s : r.steps) {
    d.y.push_back(1e3 * s.inductance_dq_apparent.d), q.y.push_back(1e3 * s.inductance_dq_apparent.q);
    di.y.push_back(1e3 * s.inductance_dq_incremental.d), qi.y.push_back(1e3 * s.inductance_dq_incremental.q);
  }
  svg::LineChart c{"d- and q-axis inductances", {"rotor angle", "° mech."}, {"inductance", "mH"}, {d, q, di, qi}, {}};
  c.include_zero = true;
  return {"dq_inductance", "L_d and L_q from each step's phase inductance matrix (inductances.csv) turned onto the "
                           "rotor's d axis: apparent (secant permeability) and incremental (differential); 2D part only.",
          svg::line_chart(c)};
}

double mean(const std::vector<double>& v) {
  double sum = 0.0;
  for (double x : v) sum += x;
  return v.empty() ? 0.0 : sum / static_cast<double>(v.size());
}

void add_emf(Page& page, std::vector<KeyValue>& head, const MotionResult& r, int pole_pairs) {
  const EmfSummary e = emf_summary(r, pole_pairs);
  head.push_back({"back-EMF phase A, rms", svg::format_number(e.rms.front(), 5), "V"});
  head.push_back({"back-EMF phase A, THD", std::isnan(e.thd.front()) ? "–" : svg::format_number(100 * e.thd.front()), "%"});
  page.tables.push_back(emf_table(e));
  svg::LineChart emf{"Back-EMF per phase against rotor angle", {"rotor angle", "° mech."}, {"EMF", "V"},
                     per_phase(r, &PositionStep::back_emf), {}};
  page.figures.push_back({"back_emf", fmt::format("Back-EMF e = −dψ/dt of each phase at {} rad/s (torque.csv's emf "
                                                  "columns); rms and THD in the table above.",
                                                  svg::format_number(r.speed, 5)),
                          svg::line_chart(emf)});
  svg::LineChart psi{"Flux linkage per phase against rotor angle", {"rotor angle", "° mech."}, {"ψ", "Wb"},
                     per_phase(r, &PositionStep::flux_linkage), {}};
  page.figures.push_back({"flux_linkage", "Flux linkage of each phase over the stack length at each rotor position "
                                          "(torque.csv).",
                          svg::line_chart(psi)});
}

}  // namespace

EmfSummary emf_summary(const MotionResult& r, int pole_pairs) {
  EmfSummary e;
  e.periods = whole_periods(r, pole_pairs);
  const int n = static_cast<int>(r.steps.size());
  e.highest_order = highest_harmonic(n, e.periods);
  const std::size_t phases = r.steps.empty() ? 0 : r.steps.front().back_emf.size();
  for (std::size_t k = 0; k < phases; ++k) {
    std::vector<double> v;
    for (const auto& s : r.steps) v.push_back(s.back_emf[k]);
    e.rms.push_back(rms(v));
    double peak = 0.0;
    for (double x : v) peak = std::max(peak, std::abs(x));
    e.peak.push_back(peak);
    e.thd.push_back(e.periods > 0 ? total_harmonic_distortion(v, e.periods) : std::nan(""));
  }
  return e;
}

void add_motion_parts(Page& page, std::vector<KeyValue>& head, const MotionResult& r, int pole_pairs, bool rotor_turns) {
  if (r.steps.empty()) return;
  if (rotor_turns && !r.steps.front().back_emf.empty()) add_emf(page, head, r, pole_pairs);
  if (rotor_turns && r.steps.front().flux_linkage.size() >= 2) {
    std::vector<double> ld, lq;
    for (const auto& s : r.steps) ld.push_back(s.inductance_dq_apparent.d), lq.push_back(s.inductance_dq_apparent.q);
    head.push_back({"L_d, apparent (mean over steps)", svg::format_number(1e3 * mean(ld)), "mH"});
    head.push_back({"L_q, apparent (mean over steps)", svg::format_number(1e3 * mean(lq)), "mH"});
    page.figures.push_back(dq_inductance_figure(r));
  }
  if (!r.iron_loss.empty()) {
    Table t{"Iron loss per region", {"region", "iron loss [W]", "share [%]"}, {},
            "Steinmetz-type law per time harmonic and Cartesian component of B in each triangle over one electrical "
            "period (iron_loss.csv; a common approximation, no excess loss)."};
    double total = 0.0;
    for (const auto& [region, watts] : r.iron_loss) total += watts;
    for (const auto& [region, watts] : r.iron_loss)
      t.rows.push_back({region, svg::format_number(watts, 5), svg::format_number(100 * watts / total, 3)});
    t.rows.push_back({"total", svg::format_number(total, 5), "100"});
    head.push_back({"iron loss, total", svg::format_number(total, 5), "W"});
    page.tables.push_back(std::move(t));
  }
}

std::vector<std::string> column_text(const std::vector<double>& values, int digits) {
  double largest = 0.0;
  for (double v : values)
    if (std::isfinite(v)) largest = std::max(largest, std::abs(v));
  std::vector<std::string> out;
  for (double v : values) out.push_back(svg::format_number_against(v, largest, digits));
  return out;
}

}  // namespace tf::post
