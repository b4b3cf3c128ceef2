#pragma once
// Copies of meshed sectors turned round the axis and joined into one mesh.

#include "mesh/geometry.hpp"
#include "mesh/mesh.hpp"
#include "mesh/sector.hpp"

namespace tf::mesh::detail {

/// n_stator_copies copies of the stator sector (copy k is centred on slot k + 1) and
/// n_rotor_copies of the rotor sector; nodes on matching cuts are merged. Throws MeshError
/// when the cuts or the sliding circle do not match up.
/// Fewer stator copies than slots make a sector model (Mesh::symmetry): the copies are not closed
/// into a ring, the last end cuts are paired with the first start cuts, and the field is taken as
/// anti-periodic from sector to sector when anti_periodic. The rotor copies must tile the same angle.
/// With `image`, the exterior image sector is copied round too, drawn beside the machine, and its
/// arc tied to the boundary circle node by node (Mesh::ties); A = 0 then holds at its centre only.
Mesh replicate(const Geometry& g, const SectorMesh& stator, int n_stator_copies, const SectorMesh& rotor,
               int n_rotor_copies, const SectorMesh* image = nullptr, bool anti_periodic = false);

}  // namespace tf::mesh::detail
