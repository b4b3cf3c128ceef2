// Surface-magnet and slotted (squirrel-cage) rotors: regions, their areas against the drawn
// outline, pole and bar numbering, and a sliding circle that suits the rotor's sectors.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "mesh/build.hpp"
#include "support/mesh_checks.hpp"
#include "support/sample_geometry.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

/// The area-weighted centroid of region r [m].
Eigen::Vector2d region_centroid(const mesh::Mesh& m, int r) {
  Eigen::Vector2d sum = Eigen::Vector2d::Zero();
  double area = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    if (m.triangle_region(t) != r) continue;
    const double a = mesh::triangle_area(m, t);
    Eigen::Vector2d c = Eigen::Vector2d::Zero();
    for (int j = 0; j < 3; ++j) c += m.nodes.row(m.triangles(t, j)).transpose() / 3.0;
    sum += a * c;
    area += a;
  }
  return sum / area;
}

int count_regions(const mesh::Mesh& m, mesh::RegionKind kind) {
  int n = 0;
  for (const auto& r : m.regions) n += r.kind == kind;
  return n;
}

/// Every region of this kind is numbered 1..n and centred on the angle 2*pi*(k - 1)/n, as the
/// geometry documents (the centroid of a shape symmetric about its centre line lies on it).
void check_numbering(const mesh::Mesh& m, mesh::RegionKind kind, int n) {
  CHECK(count_regions(m, kind) == n);
  for (int k = 1; k <= n; ++k) {
    const int r = mesh::find_region(m, kind, k);
    REQUIRE(r >= 0);
    const Eigen::Vector2d c = region_centroid(m, r);
    const double off = std::remainder(std::atan2(c(1), c(0)) - 2 * kPi * (k - 1) / n, 2 * kPi);
    CHECK(std::abs(off) < 1e-6);
  }
}

/// Node count of the sliding circle: a multiple of the rotor sectors' count and of the requested
/// multiple; then the shared checks (equal spacing, both sides alike, no stray duplicates).
void check_sliding(const mesh::Geometry& g, const mesh::Mesh& m, int n_rotor_sectors, int multiple) {
  const auto n = static_cast<int>(m.sliding.rotor_nodes.size());
  CHECK(n % n_rotor_sectors == 0);
  CHECK(n % multiple == 0);
  testing::check_sliding_circle(g, m);
  testing::check_merged(m);
  testing::check_fills_disc(g, m);
  testing::check_gap_layers(g, m);
}

}  // namespace

TEST_CASE("surface-magnet rotor: one magnet per pole, centred on its pole, with the exact annular-sector area") {
  mesh::Geometry g = testing::open_slot_stator();
  g.rotor.kind = mesh::RotorKind::surface_magnet;
  g.rotor.magnets = {.n_poles = 4, .thickness = 0.004, .arc = 0.8 * kPi / 2, .direction = mesh::Magnetization::radial};
  const mesh::Mesh m = mesh::build(g, {2}, {.fineness = 0.5, .sliding_multiple = 7});
  // Four poles make four rotor sectors (the largest divisor of 4 up to 36).
  check_sliding(g, m, 4, 7);
  check_numbering(m, mesh::RegionKind::magnet, 4);
  // Magnet area arc/2 (R_o^2 - R_i^2): the side faces are radial lines, drawn exactly; the arcs are
  // polygons whose chords of angle d cut off R^2 (d - sin d)/2 ~ R^2 d^3/12 each, a relative error
  // of R^2 d^2 / (6 (R_o^2 - R_i^2)) per arc. Elements grow away from the gap to about 1 mm at the
  // inner arc (d ~ 0.018 on R_i = 55.5 mm): about 4e-4 (measured 4.5e-4). Tolerance 1e-3.
  const double r_o = g.rotor.outer_radius, r_i = r_o - g.rotor.magnets.thickness;
  const double magnet = 0.5 * g.rotor.magnets.arc * (r_o * r_o - r_i * r_i);
  const auto area = mesh::region_areas(m);
  MESSAGE("magnet 1 area / exact - 1 = " << area[mesh::find_region(m, mesh::RegionKind::magnet, 1)] / magnet - 1
          << ", sliding nodes " << m.sliding.rotor_nodes.size());
  for (int k = 1; k <= 4; ++k)
    CHECK(area[mesh::find_region(m, mesh::RegionKind::magnet, k)] == doctest::Approx(magnet).epsilon(1e-3).scale(0));
  // The air between the magnets: the rest of the magnet layer, one region.
  CHECK(count_regions(m, mesh::RegionKind::rotor_air) == 1);
  const double air = 0.5 * (2 * kPi - 4 * g.rotor.magnets.arc) * (r_o * r_o - r_i * r_i);
  CHECK(area[mesh::find_region(m, mesh::RegionKind::rotor_air)] == doctest::Approx(air).epsilon(1e-3).scale(0));
  CHECK(mesh::find_region(m, mesh::RegionKind::shaft) >= 0);
  CHECK(mesh::find_region(m, mesh::RegionKind::rotor_iron) >= 0);
}

TEST_CASE("surface-magnet rotor with magnets spanning the full pole pitch: no air between them") {
  mesh::Geometry g = testing::semi_closed_stator();
  g.rotor.kind = mesh::RotorKind::surface_magnet;
  g.rotor.magnets = {.n_poles = 10, .thickness = 0.003, .arc = 2 * kPi / 10, .direction = mesh::Magnetization::parallel};
  const mesh::Mesh m = mesh::build(g, {2}, {.fineness = 0.5});
  // 24 slots, 10 poles: ten rotor sectors, so 24 * per_slot must be a multiple of 10.
  check_sliding(g, m, 10, 1);
  check_numbering(m, mesh::RegionKind::magnet, 10);
  CHECK(count_regions(m, mesh::RegionKind::rotor_air) == 0);
}

TEST_CASE("two-pole magnet rotor: two sectors of half a turn, a node count divisible by four") {
  mesh::Geometry g = testing::semi_closed_stator();
  g.rotor.kind = mesh::RotorKind::surface_magnet;
  g.rotor.magnets = {.n_poles = 2, .thickness = 0.005, .arc = 0.75 * kPi, .direction = mesh::Magnetization::radial};
  const mesh::Mesh m = mesh::build(g, {2}, {.fineness = 0.5});
  check_sliding(g, m, 4, 1);  // two sectors whose arcs are drawn in two halves each
  check_numbering(m, mesh::RegionKind::magnet, 2);
  CHECK(count_regions(m, mesh::RegionKind::rotor_air) == 1);
}

TEST_CASE("slotted rotor: bars of area width * depth, open and closed slots") {
  mesh::Geometry g = testing::open_slot_stator();
  g.rotor.kind = mesh::RotorKind::slotted;
  g.rotor.bars = {.count = 28, .width = 0.004, .depth = 0.010, .bridge = 0.0006, .opening_width = 0.0015};
  for (const double opening : {0.0015, 0.0}) {
    g.rotor.bars.opening_width = opening;
    CAPTURE(opening);
    const mesh::Mesh m = mesh::build(g, {2}, {.fineness = 0.5, .sliding_multiple = 3});
    check_sliding(g, m, 28, 3);
    check_numbering(m, mesh::RegionKind::rotor_bar, 28);
    // The bar is a rectangle, drawn exactly by straight edges: its area only carries rounding.
    const auto area = mesh::region_areas(m);
    const mesh::RotorBars& s = g.rotor.bars;
    for (int k = 1; k <= 28; ++k)
      CHECK(area[mesh::find_region(m, mesh::RegionKind::rotor_bar, k)] ==
            doctest::Approx(s.width * s.depth).epsilon(1e-9).scale(0));
    const int air = mesh::find_region(m, mesh::RegionKind::rotor_air);
    if (opening == 0.0) {
      CHECK(air < 0);
      continue;
    }
    // 28 openings, each opening_width by bridge measured on the centre line, less the sliver
    // between the surface's tangent there and its arc: s = R - sqrt(R^2 - (w/2)^2) deep at the
    // edges, 0 at the centre, area w s / 3 (the arc is a parabola to this order). All one region.
    const double r = g.rotor.outer_radius, w = opening;
    const double segment = w * (r - std::sqrt(r * r - 0.25 * w * w)) / 3.0;
    REQUIRE(air >= 0);
    MESSAGE("openings area / expected - 1 = " << area[air] / (28 * (w * g.rotor.bars.bridge - segment)) - 1);
    CHECK(area[air] == doctest::Approx(28 * (w * g.rotor.bars.bridge - segment)).epsilon(1e-3).scale(0));
  }
}

TEST_CASE("sliding_multiple: a smooth rotor's sliding circle becomes a multiple of it; 1 changes nothing") {
  const mesh::Geometry g = testing::open_slot_stator();
  const mesh::Mesh plain = mesh::build(g, {2}, {.fineness = 0.5});
  const mesh::Mesh stepped = mesh::build(g, {2}, {.fineness = 0.5, .sliding_multiple = 25});
  const auto n_plain = plain.sliding.rotor_nodes.size(), n_stepped = stepped.sliding.rotor_nodes.size();
  CHECK(n_stepped % 25 == 0);
  // The smallest count per slot at least the plain one: 36 per_slot divisible by 25 means per_slot
  // a multiple of 25, the first one at or above the plain count.
  const std::size_t per_slot = n_plain / 36;
  CHECK(n_stepped == 36 * (25 * ((per_slot + 24) / 25)));
  testing::check_sliding_circle(g, stepped);
}
