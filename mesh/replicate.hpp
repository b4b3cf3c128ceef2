#pragma once
// Copies of meshed sectors turned round the axis and joined into one mesh.

#include "mesh/geometry.hpp"
#include "mesh/mesh.hpp"
#include "mesh/sector.hpp"

namespace tf::mesh::detail {

/// n_stator_copies copies of the stator sector (copy k is centred on slot k + 1) and
/// n_rotor_copies of the rotor sector; nodes on matching cuts are merged. Throws MeshError
/// when the cuts or the sliding circle do not match up.
/// With `image`, the exterior image sector is copied round too, drawn beside the machine, and its
/// arc tied to the boundary circle node by node (Mesh::ties); A = 0 then holds at its centre only.
Mesh replicate(const Geometry& g, const SectorMesh& stator, int n_stator_copies, const SectorMesh& rotor,
               int n_rotor_copies, const SectorMesh* image = nullptr);

}  // namespace tf::mesh::detail
