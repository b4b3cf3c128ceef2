#include "study/drive.hpp"

#include <algorithm>
#include <cmath>

#include <numbers>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "post/sequence.hpp"
#include "post/tables.hpp"
#include "post/study.hpp"
#include "solver/flux_linkage.hpp"
#include "solver/split_phase.hpp"

namespace tf::study {
namespace {

constexpr double kDeg = 180.0 / std::numbers::pi;
const char* kElements[] = {"resistor", "inductor", "capacitor"};  // solver::SeriesElement order

}  // namespace

solver::Supply resolve_supply(const input::Case& c, const mesh::Mesh& m, const mesh::Winding& w,
                              const solver::PhaseFields& fields, DriveReport& report) {
  report.inductance = solver::inductance_matrix(m, w, fields, c.stack_length);
  solver::Supply s = c.supply;
  if (s.kind != solver::SupplyKind::split_phase) return s;
  const Eigen::Matrix2d L = report.inductance.topLeftCorner<2, 2>();
  report.element_value = s.split.element_value;
  if (s.split.element == solver::SeriesElement::capacitor && s.split.element_value == 0.0) {
    const auto unit = post::unit_fundamentals(m, fields, w.spec.pole_pairs());
    report.element_value = post::best_series_capacitance(s.split, s.frequency, L, unit);
    report.element_sized = true;
  }
  s.phasors = solver::split_phase_currents(s.split, s.frequency, L, report.element_value);
  return s;
}

std::string drive_to_json(const solver::Supply& resolved, int n_phases, const DriveReport& report) {
  nlohmann::json j;
  j["inductance_H"] = nlohmann::json::array();
  for (Eigen::Index r = 0; r < report.inductance.rows(); ++r) {
    std::vector<double> row(report.inductance.cols());
    for (Eigen::Index k = 0; k < report.inductance.cols(); ++k) row[k] = report.inductance(r, k);
    j["inductance_H"].push_back(row);
  }
  j["inductance_note"] = "2D field only (slots and gap), per the stack length; end windings are not included";
  if (resolved.kind == solver::SupplyKind::stepped_dc) return j.dump();
  const auto phasors = solver::supply_phasors(resolved, n_phases);
  for (std::size_t k = 0; k < phasors.size(); ++k)
    j["phase_currents"].push_back({{"phase", std::string(1, static_cast<char>('A' + k))},
                                   {"peak_A", std::abs(phasors[k])},
                                   {"angle_deg", std::arg(phasors[k]) * kDeg}});
  if (n_phases >= 2) {
    const auto seq = post::sequence_components(phasors);
    j["sequence_components_peak_A"] = {{"positive", std::abs(seq.positive)}, {"negative", std::abs(seq.negative)},
                                       {"zero", std::abs(seq.zero)}};
  }
  if (resolved.kind == solver::SupplyKind::split_phase) {
    j["series_element"] = {{"kind", kElements[static_cast<int>(resolved.split.element)]},
                           {"value", report.element_value},
                           {"sized_for_best_field", report.element_sized}};
    const int aux = resolved.split.element_phase;
    j["auxiliary_current_leads_main_deg"] = std::arg(phasors[aux] / phasors[1 - aux]) * kDeg;
  }
  return j.dump();
}

/// Lines on the currents when they are not a plain balanced set.
std::vector<std::string> drive_notes(const solver::Supply& s, int n_phases, const DriveReport& d) {
  std::vector<std::string> out;
  if (s.kind == solver::SupplyKind::balanced) return out;
  if (s.kind == solver::SupplyKind::stepped_dc) {
    out.push_back(fmt::format("stepped DC, {} states", s.states.size()));
    return out;
  }
  const auto ph = solver::supply_phasors(s, n_phases);
  if (s.kind == solver::SupplyKind::split_phase) {
    const char* unit[] = {"ohm", "H", "F"};
    const int aux = s.split.element_phase, main = 1 - aux;
    out.push_back(fmt::format("split phase: {} {:.4g} {} in phase {}{}; its current leads phase {}'s by {:.2f} deg",
                       s.split.element == solver::SeriesElement::capacitor ? "capacitor"
                       : s.split.element == solver::SeriesElement::inductor ? "inductor" : "resistor",
                       d.element_value, unit[static_cast<int>(s.split.element)], post::phase_name(aux), d.element_sized ? " (sized for the best field)" : "",
                       post::phase_name(main), std::arg(ph[aux] / ph[main]) * 180 / std::numbers::pi));
  }
  const auto seq = post::sequence_components(ph);
  out.push_back(fmt::format("current sequence components: positive {:.4g} A, negative {:.4g} A{}", std::abs(seq.positive),
                     std::abs(seq.negative), n_phases == 3 ? fmt::format(", zero {:.4g} A", std::abs(seq.zero)) : ""));
  return out;
}

}  // namespace tf::study
