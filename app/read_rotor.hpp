#pragma once
// The [rotor] table of a case file: a smooth iron rotor, surface magnets, bar slots, or none.

#include "app/toml_fields.hpp"
#include "mesh/geometry.hpp"

namespace tf::app {

/// [rotor] kind = "iron" | "magnets" | "slotted" | "none", with [rotor.magnets] or [rotor.bars].
/// Geometry that must fit together is checked later (case_validation.hpp).
mesh::RotorGeometry read_rotor(const Fields& root);

}  // namespace tf::app
