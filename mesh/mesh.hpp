#pragma once
// The mesh of a whole cross-section, or of a periodic or anti-periodic sector of it: first-order
// triangles, each tagged with a named region.

#include <stdexcept>
#include <string>
#include <utility>
#include <vector>

#include <Eigen/Core>

namespace tf::mesh {

/// Geometry or meshing failed; the message names the region or entity and the likely cause.
struct MeshError : std::runtime_error {
  using std::runtime_error::runtime_error;
};

enum class RegionKind {
  stator_iron,
  rotor_iron,
  shaft,
  coil,      ///< one layer of one slot: a coil side
  slot_air,  ///< slot opening and wedge space, or the air between salient poles; no current
  gap,       ///< air gap, stator or rotor side of the sliding circle
  bore_air,  ///< air filling the bore when there is no rotor
  rotor_sleeve,  ///< a conducting sleeve on the rotor surface
  outer_air,     ///< air outside the stator, out to the boundary radius
  magnet,        ///< one permanent magnet of a surface-magnet rotor; slot = its pole number
  rotor_air,     ///< air in the rotor: between surface magnets, or a rotor bar's slot opening
  rotor_bar,     ///< one bar of a squirrel-cage rotor; slot = its bar number
  /// The Kelvin image of the air beyond the boundary radius (an open boundary): a disc drawn
  /// beside the machine whose rim is tied to the boundary circle. Not part of the cross-section.
  exterior_image,
};

struct Region {
  std::string name;  ///< readable and unique, e.g. "slot_07_layer_2"
  RegionKind kind = RegionKind::stator_iron;
  int slot = 0;   ///< 1-based slot (salient stator: pole) number for coil sides and slot openings;
                  ///< the rotor pole of a magnet, the bar number of a rotor bar; else 0
  int layer = 0;  ///< 1-based layer for coil regions (1 nearest the gap, or counter-clockwise side by side), else 0
};

/// The circle in the middle of the gap where the stator-side and rotor-side meshes meet.
/// Both sides carry n nodes equally spaced in angle: node i of either list sits at
/// start_angle + 2*pi*i/n [rad]. A rotor turned by k node pitches reconnects rotor node i
/// to stator node (i + k) mod n without remeshing.
struct SlidingCircle {
  double radius = 0.0;       ///< [m]
  double start_angle = 0.0;  ///< [rad]
  std::vector<int> stator_nodes;
  std::vector<int> rotor_nodes;
  /// Sector models only (Mesh::symmetry.copies > 1): the lists hold the n/copies nodes of one
  /// sector, stator node i at start_angle + 2*pi*i/n and rotor node i at the position
  /// rotor_first + i (rotor sectors may start a few pitches later than the stator's). The nodes
  /// one pitch past the last, on the end cuts, are stator_end and rotor_end: they are images of
  /// node 0 of their side (Symmetry::cut_pairs) and close the last chord. Full model: 0, -1, -1.
  int rotor_first = 0;
  int stator_end = -1;
  int rotor_end = -1;
};

/// How a sector model stands for the whole cross-section. The mesh spans 2*pi/copies from the
/// stator's start cut; the field in the copy k sectors on (counter-clockwise) is the field of the
/// model times (-1)^k when anti_periodic, else the same. The full model: copies = 1, no pairs.
struct Symmetry {
  int copies = 1;
  bool anti_periodic = false;
  /// (node on an end cut, its image on the start cut of the same side), stator and rotor cuts,
  /// matched by radius: the first shares the second's unknown with the sign -1 when anti_periodic.
  /// The rotor's centre lies on both of its cuts and is paired with itself (A = 0 there when anti-periodic).
  std::vector<std::pair<int, int>> cut_pairs;
  /// Sign of the image of the field `copy` sectors on: -1 for odd copies of an anti-periodic model.
  int sign_of_copy(int copy) const { return anti_periodic && copy % 2 != 0 ? -1 : 1; }
};

struct Mesh {
  Eigen::MatrixX2d nodes;           ///< #nodes by 2, coordinates [m]
  Eigen::MatrixX3i triangles;       ///< #triangles by 3 node indices, counter-clockwise
  Eigen::VectorXi triangle_region;  ///< #triangles, index into regions
  std::vector<Region> regions;
  std::vector<int> outer_nodes;     ///< nodes on the outermost circle, where A = 0: the stator's outer
                                    ///< surface, or the boundary radius when air surrounds the stator
  SlidingCircle sliding;
  /// Pairs (node, partner): the node shares its partner's unknown. Used to join the exterior image
  /// to the boundary circle (the Kelvin transformation), whose nodes sit apart in the drawing.
  std::vector<std::pair<int, int>> ties;
  Symmetry symmetry;                ///< the full model unless mesh::build was asked for a sector
  double gap_inner_radius = 0.0;    ///< rotor surface [m]
  double gap_outer_radius = 0.0;    ///< stator bore [m]

  int n_nodes() const { return static_cast<int>(nodes.rows()); }
  int n_triangles() const { return static_cast<int>(triangles.rows()); }
};

/// Index of the region with this kind, slot and layer; -1 if there is none.
int find_region(const Mesh& m, RegionKind kind, int slot = 0, int layer = 0);

/// True for the parts that turn with the rotor, including the gap band inside the sliding circle.
bool on_rotor_side(const Region& r);

/// Nodes of rotor-side triangles (the rotor side of the sliding circle included), #nodes.
std::vector<bool> rotor_side_nodes(const Mesh& m);

/// The mesh drawn with its rotor turned by `angle` [rad] counter-clockwise: the nodes of every
/// rotor-side triangle rotated (the rotor side of the sliding circle included), the rest unchanged.
Mesh with_rotor_turned(const Mesh& m, double angle);

/// Area of each region [m^2], indexed like m.regions.
std::vector<double> region_areas(const Mesh& m);

/// Signed area of triangle t [m^2]; positive for counter-clockwise nodes.
double triangle_area(const Mesh& m, int t);

}  // namespace tf::mesh
