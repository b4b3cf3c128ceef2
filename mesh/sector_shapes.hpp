#pragma once
// OpenCASCADE shapes of one stator slot pitch and one rotor sector (inside an open Gmsh session).

#include <vector>

#include "mesh/geometry.hpp"
#include "mesh/sector.hpp"

namespace tf::mesh::detail {

/// A surface of the current Gmsh model and what it is.
struct Piece {
  int tag;
  PieceKind kind;
};

/// Plane surface between radii r_in (0 for a pie slice) and r_out, angles a0 < a1 [rad], a1 - a0 < pi.
int add_annular_sector(double r_in, double r_out, double a0, double a1);

/// The slot pitch centred on the +x axis, from the sliding circle to the outer radius.
std::vector<Piece> build_stator_pieces(const Geometry& g, const SlotLayers& layers);

/// The rotor sector between angles a0 and a1, from the centre to the sliding circle.
std::vector<Piece> build_rotor_pieces(const Geometry& g, double a0, double a1);

/// Fragments the pieces with one more shape so that all interfaces are conformal; labels follow.
std::vector<Piece> fragment_pieces(const std::vector<Piece>& pieces, const Piece& added);

}  // namespace tf::mesh::detail
