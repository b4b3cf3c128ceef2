// Surface-magnet and slotted rotor sectors as OpenCASCADE surfaces. The magnets and bars near the
// sector are drawn whole and cut by the fragment with the sector (fragment_domain drops what lies
// outside), so a cut through a magnet or bar needs no special case.

#include "mesh/rotor_shapes.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

#include <gmsh.h>

namespace tf::mesh::detail {
namespace {

namespace occ = gmsh::model::occ;
constexpr double kTwoPi = 2 * std::numbers::pi;

/// The number of repeating features round the rotor: poles, bars, or 0 for a smooth rotor.
int feature_count(const RotorGeometry& r) {
  if (r.kind == RotorKind::surface_magnet) return r.magnets.n_poles;
  if (r.kind == RotorKind::slotted) return r.bars.count;
  return 0;
}

/// Indices i whose feature centre i * pitch may reach into [a0, a1] (a pitch of margin each side).
std::pair<int, int> features_near(double a0, double a1, double pitch) {
  return {static_cast<int>(std::floor(a0 / pitch)) - 1, static_cast<int>(std::ceil(a1 / pitch)) + 1};
}

/// Shaft and iron from the centre to iron_outer; the iron ring alone is returned last.
std::vector<Piece> core_pieces(const RotorGeometry& r, double iron_outer, double a0, double a1) {
  if (r.shaft_radius <= 0.0) return {{add_annular_sector(0.0, iron_outer, a0, a1), {RegionKind::rotor_iron, 0}}};
  return {{add_annular_sector(0.0, r.shaft_radius, a0, a1), {RegionKind::shaft, 0}},
          {add_annular_sector(r.shaft_radius, iron_outer, a0, a1), {RegionKind::rotor_iron, 0}}};
}

/// A rectangle x0..x1 along the radius at angle c, symmetric about it with the given width.
int add_radial_rectangle(double x0, double x1, double width, double c) {
  const int tag = occ::addRectangle(x0, -0.5 * width, 0.0, x1 - x0, width);
  occ::rotate({{2, tag}}, 0.0, 0.0, 0.0, 0.0, 0.0, 1.0, c);
  return tag;
}

/// Angular distance [rad] from the angle a to the nearest side face of a magnet (magnet rotors), or
/// to the nearest bar (slotted rotors: 0 inside the angle a bar spans at its bottom).
double clearance(const RotorGeometry& r, double a) {
  const int n = feature_count(r);
  const double pitch = kTwoPi / n;
  const double off_centre = std::abs(std::remainder(a, pitch));  // from the nearest feature centre
  if (r.kind == RotorKind::surface_magnet) return std::abs(off_centre - 0.5 * r.magnets.arc);
  const RotorBars& s = r.bars;
  const double half_angle = std::atan(0.5 * s.width / (r.outer_radius - s.bridge - s.depth));
  return std::max(0.0, off_centre - half_angle);
}

}  // namespace

int rotor_sector_count(const Geometry& g, int copies) {
  // The more sectors, the less Gmsh has to mesh (measured: a quarter rotor took 1.4 s of a 2.7 s
  // run at 100k unknowns). The copies meet at the centre, so the apex angle 360°/n is kept at 10°
  // or more.
  constexpr int kMostRotorSectors = 36;
  const int n = feature_count(g.rotor) > 0 ? feature_count(g.rotor) : g.stator.n_positions;
  if (n % copies != 0) return 0;
  for (int r = std::min(n, kMostRotorSectors); r > 1; --r)
    if (n % r == 0 && r % copies == 0) return r;
  return n;
}

double rotor_start_angle(const Geometry& g, double first_node, int n_sliding, int n_sectors) {
  if (feature_count(g.rotor) == 0) return first_node;
  double best = first_node, best_clearance = -1.0;
  // Sectors repeat every 2*pi/n_sectors, so the node angles of one sector are all the choices.
  for (int i = 0; i < n_sliding / n_sectors; ++i) {
    const double a = first_node + kTwoPi * i / n_sliding;
    const double c = clearance(g.rotor, a);
    if (c > best_clearance + 1e-12) best = a, best_clearance = c;
  }
  return best;
}

std::vector<Piece> build_magnet_rotor_pieces(const Geometry& g, double a0, double a1) {
  const RotorGeometry& r = g.rotor;
  const SurfaceMagnets& mg = r.magnets;
  const double r_in = r.outer_radius - mg.thickness, pitch = kTwoPi / mg.n_poles;
  std::vector<Piece> magnets;
  const auto [first, last] = features_near(a0, a1, pitch);
  for (int i = first; i <= last; ++i) {
    const double c = i * pitch;
    magnets.push_back({add_annular_sector(r_in, r.outer_radius, c - 0.5 * mg.arc, c + 0.5 * mg.arc),
                       {RegionKind::magnet, 0}});
  }
  // What of the magnet layer is not magnet is air between the poles.
  const int layer = add_annular_sector(r_in, r.outer_radius, a0, a1);
  std::vector<Piece> pieces = fragment_domain(layer, magnets, {RegionKind::rotor_air, 0});
  for (const Piece& p : core_pieces(r, r_in, a0, a1)) pieces = fragment_pieces(pieces, p);
  return fragment_pieces(pieces, {add_annular_sector(r.outer_radius, g.mid_gap_radius(), a0, a1), {RegionKind::gap, 0}});
}

std::vector<Piece> build_slotted_rotor_pieces(const Geometry& g, double a0, double a1) {
  const RotorGeometry& r = g.rotor;
  const RotorBars& s = r.bars;
  const double pitch = kTwoPi / s.count, top = r.outer_radius - s.bridge;
  std::vector<Piece> shapes;
  const auto [first, last] = features_near(a0, a1, pitch);
  for (int i = first; i <= last; ++i) {
    const double c = i * pitch;
    shapes.push_back({add_radial_rectangle(top - s.depth, top, s.width, c), {RegionKind::rotor_bar, 0}});
    // The opening runs from the bar top out past the surface; the fragment trims it at the surface.
    if (s.opening_width > 0.0)
      shapes.push_back({add_radial_rectangle(top, r.outer_radius + s.bridge, s.opening_width, c),
                        {RegionKind::rotor_air, 0}});
  }
  std::vector<Piece> core = core_pieces(r, r.outer_radius, a0, a1);
  const Piece iron = core.back();
  core.pop_back();
  std::vector<Piece> pieces = fragment_domain(iron.tag, shapes, iron.kind);
  for (const Piece& p : core) pieces = fragment_pieces(pieces, p);
  return fragment_pieces(pieces, {add_annular_sector(r.outer_radius, g.mid_gap_radius(), a0, a1), {RegionKind::gap, 0}});
}

int rotor_feature_number(const RotorGeometry& r, const Eigen::Vector2d& p) {
  const int n = feature_count(r);
  const long k = std::lround(std::atan2(p(1), p(0)) / (kTwoPi / n));
  return static_cast<int>(((k % n) + n) % n) + 1;
}

}  // namespace tf::mesh::detail
