// The pole pitch of a salient-pole stator as OpenCASCADE surfaces, labelled like the pieces of a
// slot pitch: the fragment map, not point probing, says which piece is iron, coil or air.

#include "mesh/salient_shapes.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <string>

#include <gmsh.h>

#include "mesh/salient_outline.hpp"

namespace tf::mesh::detail {
namespace {

namespace occ = gmsh::model::occ;

/// Shoe, body and yoke fused into one surface, so that no seam runs through the iron. The shoe and
/// the body reach in past the bore and the body out into the yoke: the bore arc and the outer arc
/// of the pole pitch then trim them, rather than arcs that merely coincide, and what lies outside
/// is dropped with the fragment.
int add_pole_iron(const StatorGeometry& s, const PoleOutline& o) {
  const double a = std::numbers::pi / s.n_positions;
  const double low = 0.5 * s.bore_radius;
  const int shoe = add_annular_sector(low, o.shoe_back_radius, -o.half_shoe_arc, o.half_shoe_arc);
  // The body starts inside the shoe: its inner corners sit halfway between the shoe back and the
  // smallest radius at which a corner is still within the shoe's angle, so the body never shows
  // beside the shoe between the bore and the shoe back.
  const double w = o.body_half_width;
  const double within_angle = std::max(low, w / std::sin(o.half_shoe_arc));
  const double corner = 0.5 * (within_angle + o.shoe_back_radius);
  const double x0 = std::sqrt(corner * corner - w * w);
  const double x1 = 0.5 * (o.yoke_radius + s.outer_radius);
  const int body = occ::addRectangle(x0, -w, 0.0, x1 - x0, 2 * w);
  const int yoke = add_annular_sector(o.yoke_radius, s.outer_radius, -a, a);
  gmsh::vectorpair fused;
  std::vector<gmsh::vectorpair> map;
  occ::fuse({{2, shoe}}, {{2, body}, {2, yoke}}, fused, map);
  if (fused.size() != 1 || fused[0].first != 2)
    throw MeshError("the iron of a salient pole did not fuse into one surface (" + std::to_string(fused.size()) +
                    " pieces)");
  return fused[0].second;
}

}  // namespace

std::vector<Piece> build_salient_pieces(const Geometry& g) {
  const StatorGeometry& s = g.stator;
  const PoleOutline o = pole_outline(s);
  const double a = std::numbers::pi / s.n_positions;
  const double height = o.coil_top - o.coil_floor;
  const double width = o.coil_outer_y - o.body_half_width;
  const std::vector<Piece> shapes = {
      {add_pole_iron(s, o), {RegionKind::stator_iron, 0}},
      // Layer 1 counter-clockwise of the body (y > 0), layer 2 clockwise; both touch the body.
      {occ::addRectangle(o.coil_floor, o.body_half_width, 0.0, height, width), {RegionKind::coil, 1}},
      {occ::addRectangle(o.coil_floor, -o.coil_outer_y, 0.0, height, width), {RegionKind::coil, 2}},
  };
  // Whatever of the pole pitch is neither iron nor coil is the air between the poles.
  const int pitch = add_annular_sector(s.bore_radius, s.outer_radius, -a, a);
  const std::vector<Piece> pieces = fragment_domain(pitch, shapes, {RegionKind::slot_air, 0});
  const int gap = add_annular_sector(g.mid_gap_radius(), s.bore_radius, -a, a);
  return fragment_pieces(pieces, {gap, {RegionKind::gap, 0}});
}

}  // namespace tf::mesh::detail
