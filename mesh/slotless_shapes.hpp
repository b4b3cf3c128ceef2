#pragma once
// OpenCASCADE shapes of one belt pitch of a slotless (air-cored) stator, inside an open Gmsh session.

#include <vector>

#include "mesh/geometry.hpp"
#include "mesh/sector_shapes.hpp"

namespace tf::mesh::detail {

/// The belt pitch centred on conductor sector 1 (on the +x axis), spanning ±pi/n_positions, from the
/// sliding circle to the stator's outer radius: the gap band between the sliding circle and the
/// bore (gap), the conductor sector between the bore and belts.outer_radius over ±belts.span/2
/// (coil, layer 1; with two layers, layer 1 is the half nearest the gap, or the counter-clockwise
/// half when the layers lie side by side), the air beside it (slot_air) and the iron ring from
/// belts.outer_radius to the outer radius (stator_iron). Precondition: g.stator.kind is slotless
/// and the case checks passed.
std::vector<Piece> build_slotless_pieces(const Geometry& g, const SlotLayers& layers);

}  // namespace tf::mesh::detail
