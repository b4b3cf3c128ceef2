#pragma once
// OpenCASCADE shapes of one stator slot (or pole) pitch and one rotor sector (inside an open Gmsh
// session).

#include <vector>

#include "mesh/geometry.hpp"
#include "mesh/sector.hpp"

namespace tf::mesh::detail {

/// A surface of the current Gmsh model and what it is.
struct Piece {
  int tag;
  PieceKind kind;
};

/// Plane surface between radii r_in (0 for a pie slice) and r_out, angles a0 < a1 [rad], a1 - a0 <= pi.
/// Arcs of 0.9*pi or more are made of two equal halves.
int add_annular_sector(double r_in, double r_out, double a0, double a1);

/// Fragments the surface `domain` with `shapes` and labels its pieces: a piece inside shape i gets
/// shapes[i].kind (the last such shape wins), any other piece `rest`. Parts of the shapes outside
/// the domain are removed from the model.
std::vector<Piece> fragment_domain(int domain, const std::vector<Piece>& shapes, PieceKind rest);

/// The slot pitch (for a salient-pole stator the pole pitch, for a slotless one the belt pitch)
/// centred on the +x axis, from the sliding circle to the outer radius, and on to the boundary
/// radius through air (outer_air) when that is larger. `layers` applies to slotted and slotless
/// stators.
std::vector<Piece> build_stator_pieces(const Geometry& g, const SlotLayers& layers);

/// The exterior image: a pie sector of radius boundary_radius centred on the +x axis, one slot pitch wide.
std::vector<Piece> build_image_pieces(const Geometry& g);

/// The rotor sector between angles a0 and a1, from the centre to the sliding circle (magnet and
/// slotted rotors: mesh/rotor_shapes.hpp).
std::vector<Piece> build_rotor_pieces(const Geometry& g, double a0, double a1);

/// Fragments the pieces with one more shape so that all interfaces are conformal; labels follow.
std::vector<Piece> fragment_pieces(const std::vector<Piece>& pieces, const Piece& added);

}  // namespace tf::mesh::detail
