#include "app/winding_report.hpp"

#include <cmath>
#include <numeric>
#include <optional>
#include <vector>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "mesh/winding.hpp"
#include "post/resultant_waves.hpp"
#include "post/tables.hpp"

namespace tf::app {
namespace {

constexpr int kMaxOrder = 13;  // electrical orders reported, as in the design brief

const char* rule_name(mesh::LayoutRule r) {
  switch (r) {
    case mesh::LayoutRule::phase_belts: return "phase belts (integral slot)";
    case mesh::LayoutRule::star_of_slots: return "star of slots";
    case mesh::LayoutRule::pole_coils: return "one coil per salient pole, by the star of slots";
    case mesh::LayoutRule::table: return "the case file's slot table";
  }
  return "";
}

std::string side_label(const mesh::CoilSide& s) { return (s.direction > 0 ? "+" : "-") + post::phase_name(s.phase); }

std::string q_text(const mesh::Winding& w) {
  const int num = w.n_positions, den = w.spec.n_poles * w.spec.n_phases, g = std::gcd(num, den);
  return den / g == 1 ? fmt::format("{}", num / g) : fmt::format("{}/{}", num / g, den / g);
}

void print_header(const mesh::Winding& w, bool sectors, std::ostream& out) {
  const char* slots = sectors ? "winding sectors" : "slots";
  const auto& spec = w.spec;
  if (w.rule == mesh::LayoutRule::pole_coils)
    out << fmt::format("{} salient poles, a {}-pole field, {} phases", w.n_positions, spec.n_poles, spec.n_phases);
  else
    out << fmt::format("{} {}, {} poles, {} phases, {} layer{}", w.n_positions, slots, spec.n_poles, spec.n_phases,
                       spec.n_layers, spec.n_layers > 1 ? "s" : "");
  if (w.rule != mesh::LayoutRule::table && w.rule != mesh::LayoutRule::pole_coils)
    out << fmt::format(", coil pitch {} {}", spec.coil_pitch, slots);
  if (w.rule == mesh::LayoutRule::pole_coils)
    out << "\n";
  else
    out << fmt::format(" (pole pitch {:g} {})\n", static_cast<double>(w.n_positions) / spec.n_poles, slots);
  out << fmt::format("layout: {}; q = {} slots per pole per phase; periodicity t = gcd(Q, p) = {}\n",
                     rule_name(w.rule), q_text(w), w.periodicity());
  out << fmt::format("{:g} series turns per phase; {} parallel path{}\n\n", w.series_turns(), spec.parallel_paths,
                     spec.parallel_paths > 1 ? "s" : "");
}

void print_table(const mesh::Winding& w, std::ostream& out) {
  out << (w.rule == mesh::LayoutRule::pole_coils ? "pole" : "slot");
  for (int l = 1; l <= w.spec.n_layers; ++l) out << fmt::format("  layer {}", l);
  out << (w.rule == mesh::LayoutRule::pole_coils ? "   (layer 1: counter-clockwise side of the pole body)\n" : "\n");
  out << "(+: positive phase current flows along +z, out of the page)\n";
  for (int s = 1; s <= w.n_positions; ++s) {
    out << fmt::format("{:>4}", s);
    for (int l = 1; l <= w.spec.n_layers; ++l) {
      std::string label = "-";
      for (const auto& side : w.sides)
        if (side.slot == s && side.layer == l) label = side_label(side);
      out << fmt::format("  {:>7}", label);
    }
    out << '\n';
  }
}

void print_factors(const mesh::Winding& w, std::ostream& out) {
  const int p = w.spec.pole_pairs();
  if (w.rule == mesh::LayoutRule::phase_belts) {
    out << "\nelectrical order  distribution   pitch     winding   (star of slots)\n";
    for (const auto& f : mesh::winding_factors(w, kMaxOrder))
      out << fmt::format("{:>16}  {:>12.5f}  {:>7.5f}  {:>8.5f}   {:>8.5f}\n", f.order, f.distribution, f.pitch,
                         f.total, f.from_layout);
  }
  out << "\nspace orders present (phase A, star of slots), sub-harmonics included:\n";
  out << "mechanical order  electrical order  winding factor\n";
  for (const auto& [n, k] : mesh::space_orders(w, kMaxOrder * p))
    out << fmt::format("{:>16}  {:>16g}  {:>14.5f}{}\n", n, static_cast<double>(n) / p, k,
                       n == p ? "   fundamental" : (n < p ? "   sub-harmonic" : ""));
}

/// The resultant waves of the whole winding with the case's currents: every whole electrical order up
/// to kMaxOrder, and any other mechanical order (sub-harmonics) some phase carries.
std::optional<std::vector<post::ResultantWave>> resultant(const input::Case& c, const mesh::Winding& w) {
  const auto currents = post::fundamental_currents(c.supply, w.spec.n_phases);
  if (!currents) return std::nullopt;
  const int p = w.spec.pole_pairs();
  std::vector<int> orders;
  for (int n = 1; n <= kMaxOrder * p; ++n) orders.push_back(n);
  std::vector<post::ResultantWave> shown;
  for (auto& r : post::resultant_waves(w, *currents, c.supply.frequency, orders))
    if (r.order % p == 0 || r.carried > 1e-9) shown.push_back(std::move(r));
  return shown;
}

std::string speed_text(const post::ResultantWave& r) {
  if (r.field == "absent" || r.field == "cancels") return "–";
  if (r.field == "pulsating") return fmt::format("±{:.5g}", std::abs(r.speed_rpm));  // both ways alike
  return fmt::format("{:.5g}", r.speed_rpm);
}

void print_waves(const input::Case& c, const mesh::Winding& w, std::ostream& out) {
  const auto waves = resultant(c, w);
  const int m = w.spec.n_phases, p = w.spec.pole_pairs();
  if (!waves) {
    out << fmt::format("\nresultant field of the {} phases: the currents of a split-phase supply follow from the "
                       "solved field; run the case (space_harmonics.csv splits each order)\n", m);
    return;
  }
  out << fmt::format("\nresultant field of the {} phases with the case's currents ({}{:g} Hz, n_s = {:.5g} rpm); "
                     "forward and backward as fractions of the phases' waves all in step:\n",
                     m, c.supply.kind == solver::SupplyKind::stepped_dc ? "the DC sequence's fundamental, " : "",
                     c.supply.frequency, 60.0 * c.supply.frequency / p);
  out << "electrical order  mechanical  forward  backward  field      speed [rpm]  why\n";
  for (const auto& r : *waves) {
    const bool turns = r.field != "absent" && r.field != "cancels";
    out << fmt::format("{:>16g}  {:>10}  {:>7.4f}  {:>8.4f}  {:<9}  {:>11}  {}{}\n", r.electrical_order, r.order,
                       r.forward, r.backward, r.field, speed_text(r),
                       turns ? fmt::format("turns at n_s/{:g}: ", r.electrical_order) : "", r.reason);
  }
}

void print_json(const input::Case& c, const mesh::Winding& w, std::ostream& out) {
  nlohmann::json sides = nlohmann::json::array(), factors = nlohmann::json::array(), orders = nlohmann::json::array();
  for (const auto& s : w.sides)
    sides.push_back({{"slot", s.slot}, {"layer", s.layer}, {"phase", post::phase_name(s.phase)},
                     {"direction", s.direction > 0 ? "+" : "-"}, {"turns", s.turns}});
  for (const auto& f : mesh::winding_factors(w, kMaxOrder)) {
    nlohmann::json row = {{"electrical_order", f.order}, {"from_layout", f.from_layout}};
    if (!std::isnan(f.total)) {
      row["distribution"] = f.distribution;
      row["pitch"] = f.pitch;
      row["total"] = f.total;
    }
    factors.push_back(row);
  }
  for (const auto& [n, k] : mesh::space_orders(w, kMaxOrder * w.spec.pole_pairs()))
    orders.push_back({{"mechanical_order", n}, {"winding_factor", k}});
  nlohmann::json waves = nullptr;  // null: the currents follow from the solved field (split phase)
  if (const auto resultant_orders = resultant(c, w)) {
    waves = nlohmann::json::array();
    for (const auto& r : *resultant_orders) {
      const bool still = r.field == "absent" || r.field == "cancels";
      waves.push_back({{"mechanical_order", r.order}, {"electrical_order", r.electrical_order}, {"field", r.field},
                       {"forward", r.forward}, {"backward", r.backward}, {"carried", r.carried},
                       {"speed_rpm", still ? nlohmann::json(nullptr) : nlohmann::json(r.speed_rpm)}, {"reason", r.reason}});
    }
  }
  const nlohmann::json j = {{"slots", w.n_positions},
                            {"poles", w.spec.n_poles},
                            {"phases", w.spec.n_phases},
                            {"layers", w.spec.n_layers},
                            {"coil_pitch_slots", w.spec.coil_pitch},
                            {"layout", rule_name(w.rule)},
                            {"slots_per_pole_per_phase", q_text(w)},
                            {"periodicity", w.periodicity()},
                            {"series_turns_per_phase", w.series_turns()},
                            {"coil_sides", sides},
                            {"winding_factors", factors},
                            {"space_orders", orders},
                            {"resultant_waves", waves}};
  out << j.dump(2) << '\n';
}

}  // namespace

void print_winding(const input::Case& c, bool as_json, std::ostream& out) {
  const mesh::Winding w = mesh::lay_out(c.winding, c.geometry.stator);
  if (as_json) return print_json(c, w, out);
  print_header(w, c.geometry.stator.kind == mesh::StatorKind::slotless, out);
  print_table(w, out);
  print_factors(w, out);
  print_waves(c, w, out);
}

}  // namespace tf::app
