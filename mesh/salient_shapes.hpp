#pragma once
// OpenCASCADE shapes of one pole pitch of a salient-pole stator (inside an open Gmsh session).

#include <vector>

#include "mesh/geometry.hpp"
#include "mesh/sector_shapes.hpp"

namespace tf::mesh::detail {

/// The pole pitch centred on pole 1 (on the +x axis), spanning ±pi/P, from the sliding circle to
/// the outer radius: the iron of shoe, body and yoke (stator_iron), the coil side counter-clockwise
/// of the body (coil, layer 1) and the clockwise one (coil, layer 2), the air between the poles down
/// to the bore (slot_air), and the gap band between the sliding circle and the bore (gap).
/// The outline is mesh::pole_outline (mesh/salient_outline.hpp). Precondition: g.stator.kind is
/// salient and the case checks passed.
std::vector<Piece> build_salient_pieces(const Geometry& g);

}  // namespace tf::mesh::detail
