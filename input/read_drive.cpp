#include "input/read_drive.hpp"

#include <cmath>
#include <numbers>
#include <string>

#include <fmt/format.h>

#include "input/toml_arrays.hpp"

namespace tf::input {
namespace {

constexpr RealRange kAmperes{.min = -1e6, .max = 1e6, .unit = "A"};
constexpr RealRange kFrequency{.min = 0, .max = 1e6, .min_excluded = true, .unit = "Hz"};

void read_sinusoid(const Fields& f, solver::Supply& s, int n_phases) {
  const auto peaks = read_reals(f, "peak_currents", {.min = 0, .max = 1e6, .unit = "A"}, n_phases);
  const auto angles = read_reals(f, "phase_angles_deg", {.min = -3600, .max = 3600, .unit = "degrees"}, n_phases);
  for (int k = 0; k < n_phases; ++k) s.phasors.push_back(std::polar(peaks[k], angles[k] * std::numbers::pi / 180));
}

void read_split_phase(const Fields& f, solver::Supply& s, int n_phases) {
  if (n_phases != 2)
    f.fail("kind", fmt::format("a split-phase supply feeds two windings, and [winding] phases = {}", n_phases),
           "phases = 2 (the auxiliary winding, which takes the series element, and the main winding)");
  solver::SplitPhase& p = s.split;
  p.voltage_rms = f.real("voltage_rms", {.min = 0, .max = 1e6, .min_excluded = true, .unit = "V"});
  p.resistance = read_reals(f, "resistances", {.min = 0, .max = 1e6, .unit = "ohm"}, 2);
  p.element = static_cast<solver::SeriesElement>(f.choice("series_element", {"resistor", "inductor", "capacitor"}));
  if (p.element == solver::SeriesElement::capacitor)
    p.element_value = f.real_or("series_value", 0.0, {.min = 0, .max = 1, .min_excluded = true, .unit = "F"});
  else
    p.element_value = f.real("series_value", {.min = 0, .max = 1e6, .min_excluded = true,
                                              .unit = p.element == solver::SeriesElement::resistor ? "ohm" : "H"});
  p.element_phase = static_cast<int>(f.choice_or("series_phase", {"A", "B"}, 0));
}

}  // namespace

mesh::WindingSpec read_winding(const Fields& root, const mesh::StatorGeometry& stator) {
  const Fields f = root.table(
      "winding", {"phases", "poles", "layers", "coil_pitch", "turns_per_coil", "parallel_paths", "sides"});
  mesh::WindingSpec w;
  w.n_phases = f.integer("phases", {.min = 1, .max = 12});
  w.n_poles = f.integer("poles", {.min = 2, .max = 2000});
  if (w.n_poles % 2 != 0) f.fail("poles", "an odd number", "an even number: poles come in north-south pairs (2p)");
  w.n_layers = f.integer("layers", {.min = 1, .max = 2});
  w.parallel_paths = f.integer_or("parallel_paths", 1, {.min = 1, .max = 1000});
  if (f.has("sides")) {
    // A slot table replaces the rule: pitch and turns are in its rows.
    for (const char* key : {"coil_pitch", "turns_per_coil"})
      f.reject(key, "not used with a slot table (sides)", "no such key: the rows give slots and turns");
    w.explicit_sides = read_slot_table(f, "sides", stator.n_positions, w.n_layers, w.n_phases);
    return w;
  }
  // The upper limit of the pitch depends on the slots: checked with the winding layout.
  w.coil_pitch = stator.kind == mesh::StatorKind::salient ? f.integer_or("coil_pitch", 1, {.min = 1, .max = 1})
                                                          : f.integer("coil_pitch", {.min = 1, .max = 1000});
  w.turns_per_coil = f.integer("turns_per_coil", {.min = 1, .max = 100000});
  return w;
}

solver::Supply read_supply(const Fields& root, int n_phases) {
  const Fields f = root.table("supply", {"kind", "frequency", "peak_current", "peak_currents", "phase_angles_deg",
                                         "states", "voltage_rms", "resistances", "series_element", "series_value",
                                         "series_phase"});
  solver::Supply s;
  s.kind = static_cast<solver::SupplyKind>(f.choice_or("kind", {"balanced", "phasors", "stepped_dc", "split_phase"}, 0));
  const std::vector<std::vector<std::string>> keys_of = {
      {"peak_current"}, {"peak_currents", "phase_angles_deg"}, {"states"},
      {"voltage_rms", "resistances", "series_element", "series_value", "series_phase"}};
  for (std::size_t kind = 0; kind < keys_of.size(); ++kind)
    if (kind != static_cast<std::size_t>(s.kind))
      for (const auto& key : keys_of[kind])
        f.reject(key, "not used by this kind of supply", fmt::format("the keys of kind = \"{}\"", f.text_or("kind", "balanced")));
  if (s.kind == solver::SupplyKind::stepped_dc) {
    s.frequency = f.real_or("frequency", 1.0, kFrequency);
    s.states = read_real_rows(f, "states", kAmperes, n_phases);
    if (s.states.size() < 2) f.fail("states", "a single state", "two or more states, one row each");
    return s;
  }
  s.frequency = f.real("frequency", kFrequency);
  if (s.kind == solver::SupplyKind::balanced) s.peak_current = f.real("peak_current", {.min = 0, .max = 1e6, .unit = "A"});
  if (s.kind == solver::SupplyKind::phasors) read_sinusoid(f, s, n_phases);
  if (s.kind == solver::SupplyKind::split_phase) read_split_phase(f, s, n_phases);
  return s;
}

}  // namespace tf::input
