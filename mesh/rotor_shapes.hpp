#pragma once
// OpenCASCADE shapes of one sector of a surface-magnet or slotted (squirrel-cage) rotor, inside an
// open Gmsh session, and the choices that make every sector copy the same geometry.

#include <vector>

#include <Eigen/Core>

#include "mesh/geometry.hpp"
#include "mesh/sector_shapes.hpp"

namespace tf::mesh::detail {

/// How many identical sectors the rotor is cut into: the largest divisor of the repeating count
/// (slots Q for a smooth rotor or none, poles for magnets, bars for a cage) up to 36 (apex angle at
/// least 10°); the count itself when it has no such divisor above 1. For a sector model of the
/// machine (`copies` sectors round it) the count must be a multiple of copies, so that whole rotor
/// sectors tile the model; 0 when the rotor does not repeat `copies` times.
int rotor_sector_count(const Geometry& g, int copies = 1);

/// The angle [rad] where the rotor sector starts: one of the sliding-circle node angles
/// first_node + 2*pi*i/n_sliding (so the rotor's arc carries the circle's nodes), chosen as far as
/// possible from the magnets' side faces or the bars, so that no cut makes a sliver. Smooth rotors
/// (and none) start at first_node, as the stator does.
double rotor_start_angle(const Geometry& g, double first_node, int n_sliding, int n_sectors);

/// The surface-magnet rotor between angles a0 < a1 (a1 - a0 <= pi): shaft (if any) and iron up to
/// outer_radius - thickness, the magnet layer cut into magnet and rotor_air pieces, and the gap band
/// up to the sliding circle. Magnets crossing the cuts are cut too (copies rejoin them).
std::vector<Piece> build_magnet_rotor_pieces(const Geometry& g, double a0, double a1);

/// The slotted rotor between angles a0 < a1: shaft (if any), iron with the bars (rotor_bar) and
/// their openings (rotor_air) cut out, and the gap band up to the sliding circle.
std::vector<Piece> build_slotted_rotor_pieces(const Geometry& g, double a0, double a1);

/// 1-based number of the magnet pole or bar whose centre angle is nearest to point p [m].
int rotor_feature_number(const RotorGeometry& r, const Eigen::Vector2d& p);

}  // namespace tf::mesh::detail
