#pragma once
// One periodic piece of the cross-section (a stator slot pitch, or a rotor sector), meshed by Gmsh
// with matching nodes on its two radial cuts, so that rotated copies join into the whole model.

#include <functional>
#include <vector>

#include <Eigen/Core>

#include "mesh/geometry.hpp"
#include "mesh/mesh.hpp"

namespace tf::mesh::detail {

/// What a piece of a sector is; the slot number is given when the sector is copied.
struct PieceKind {
  RegionKind kind = RegionKind::stator_iron;
  int layer = 0;
  bool operator==(const PieceKind&) const = default;
};

/// A sector spanning [start_angle, start_angle + span] [rad], meshed.
struct SectorMesh {
  double start_angle = 0.0;
  double span = 0.0;
  Eigen::MatrixX2d nodes;             ///< #nodes by 2 [m]
  Eigen::MatrixX3i triangles;         ///< #triangles by 3, counter-clockwise
  std::vector<int> triangle_piece;    ///< #triangles, index into pieces
  std::vector<PieceKind> pieces;
  std::vector<int> start_cut;         ///< nodes on the cut at start_angle, by increasing radius
  std::vector<int> end_cut;           ///< nodes on the cut at start_angle + span, by increasing radius
  std::vector<int> sliding;           ///< nodes on the sliding arc, by increasing angle
  std::vector<int> outer;             ///< nodes on the outer arc, where A = 0 (stator only)
};

/// Element size [m] at a point (x, y) [m].
using SizeRule = std::function<double(double x, double y)>;

/// The stator slot pitch centred on slot 1 (on the +x axis), the pole pitch centred on pole 1 of a
/// salient-pole stator or the belt pitch centred on conductor sector 1 of a slotless one, from the
/// sliding circle to the outer surface (or to the boundary radius beyond it), with n_sliding_segments
/// equal segments on the sliding arc. Sectors of half a turn (two poles, two rotor sectors) need
/// an even number of segments: their arcs are drawn in two halves.
SectorMesh mesh_stator_sector(const Geometry& g, const SlotLayers& layers, int n_sliding_segments, const SizeRule& size,
                              int n_outer_segments = 0);

/// The Kelvin image of the air beyond the boundary circle (radius R = boundary_radius): the map
/// r -> R^2 / r, theta -> theta turns the exterior into a disc of radius R, and, being conformal in
/// 2D, leaves the weak form of the air's field unchanged; the disc's centre is infinity, where A = 0.
/// (E. M. Freeman and D. A. Lowther, "A novel mapping technique for open boundary finite element
/// solutions to Poisson's equation", IEEE Trans. Magnetics 24(6), 1988, pp. 2934-2936; from memory.)
/// Its triangles form the region exterior_image, apart from the real air round the stator.
/// One sector of the disc, its arc divided into n_outer_segments equal segments to match the stator's.
SectorMesh mesh_exterior_image(const Geometry& g, int n_outer_segments, const SizeRule& size);

/// A rotor sector of span 2*pi/n_sectors starting at start_angle, from the centre to the sliding circle.
SectorMesh mesh_rotor_sector(const Geometry& g, int n_sectors, double start_angle,
                             int n_sliding_segments, const SizeRule& size);

}  // namespace tf::mesh::detail
