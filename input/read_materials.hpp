#pragma once
// The [materials] table of a case file: permeabilities or B-H curves, conductivities.

#include "input/toml_fields.hpp"
#include "mesh/geometry.hpp"
#include "solver/materials.hpp"

namespace tf::input {

/// [materials] with [materials.stator_iron] required and the rotor's parts optional. An iron part
/// gives either relative_permeability or a [materials.<part>.bh_curve] table (h, b, source,
/// optional stacking_factor).
solver::Materials read_materials(const Fields& root, const mesh::RotorGeometry& rotor);

}  // namespace tf::input
