#pragma once
// The first step of every study: the mesh a case is solved on, planned once for every command
// (`mesh`, `run`, `compare`, a sweep's variants) so that each meshes exactly what `run` solves.

#include <optional>
#include <string>

#include "input/case.hpp"
#include "mesh/build.hpp"
#include "mesh/mesh.hpp"
#include "mesh/symmetry.hpp"
#include "mesh/winding.hpp"

namespace tf::study {

/// The sector a case is solved on, if any: the fewest slot pitches over which the winding and
/// the rotor repeat (mesh::choose_sector), unless the case asks for the full model or its study or
/// parts are not yet checked on sectors (eddy currents, salient-pole and slotless stators, bar
/// rotors, sleeves, open boundaries).
std::optional<mesh::SectorChoice> model_sector(const input::Case& c, const mesh::Winding& w);

/// The mesh controls of the case as its study needs them: the sector, a sliding circle whose node
/// count makes every rotor step a whole number of pitches, and elements fine enough for the
/// thinnest skin depth of an eddy-current study.
mesh::MeshControls plan_mesh(const input::Case& c, const mesh::Winding& w);

/// The mesh of a case and its winding laid out on it.
struct MeshedCase {
  mesh::Mesh mesh;
  mesh::Winding winding;
};
MeshedCase mesh_and_wind(const input::Case& c);

/// One line saying which model was solved, e.g. "one sector, 1/4 of the machine, with
/// anti-periodic boundaries".
std::string model_description(const mesh::Mesh& m);

}  // namespace tf::study
