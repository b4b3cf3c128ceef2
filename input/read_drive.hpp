#pragma once
// Reading the [winding] and [supply] tables: what drives the field.

#include "input/case.hpp"
#include "input/toml_fields.hpp"

namespace tf::input {

/// [winding]: phases, poles, layers, and either coil_pitch with turns_per_coil (laid out by rule)
/// or a slot table `sides` (rows [slot, layer, "phase", "+"/"-", turns]).
mesh::WindingSpec read_winding(const Fields& root, const mesh::StatorGeometry& stator);

/// [supply]: kind "balanced" (peak_current), "phasors" (peak_currents, phase_angles_deg),
/// "stepped_dc" (states) or "split_phase" (voltage_rms, resistances, series_element, series_value,
/// series_phase), with the frequency.
solver::Supply read_supply(const Fields& root, int n_phases);

}  // namespace tf::input
