#pragma once
// The [rotor] table of a case file: a smooth iron rotor, surface magnets, bar slots, or none.

#include <optional>

#include "input/toml_fields.hpp"
#include "mesh/geometry.hpp"
#include "solver/slip.hpp"

namespace tf::input {

/// [rotor] kind = "iron" | "magnets" | "slotted" | "none", with [rotor.magnets] or [rotor.bars].
/// Geometry that must fit together is checked later (case_validation.hpp).
mesh::RotorGeometry read_rotor(const Fields& root);

/// [rotor.end_rings] of a cage (slotted rotors only; read_rotor refuses it elsewhere): area [m^2],
/// mean_diameter [m], conductivity [S/m], all required. Absent: ideal rings of no resistance.
std::optional<solver::EndRings> read_end_rings(const Fields& root);

}  // namespace tf::input
