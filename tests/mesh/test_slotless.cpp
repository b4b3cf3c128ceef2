// Slotless (air-cored) stators, the air ring out to a far boundary and the rotor sleeve: every region
// against its drawn outline to rounding (the arcs' chords accounted for exactly), A = 0 on the
// boundary circle, and the same sliding circle, gap layers and merged cuts as slotted stators.

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <string>
#include <vector>

#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "support/mesh_checks.hpp"
#include "support/winding_spec.hpp"
#include "support/sample_geometry.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

/// TEAM Workshop Problem 30a (K. R. Davey, "TEAM Problem 30a: Induction Motor Analyses", TEAM problem
/// set; docs/references.md §1): rotor steel 0-20 mm in an aluminium sleeve 20-30 mm, gap 30-32 mm,
/// six 45° conductor sectors 32-52 mm, stator steel 52-57 mm; A = 0 at `boundary` (0: on the
/// stator's outer surface).
mesh::Geometry team30a(double boundary) {
  mesh::Geometry g;
  g.stator.kind = mesh::StatorKind::slotless;
  g.stator.bore_radius = 0.032;
  g.stator.outer_radius = 0.057;
  g.stator.n_positions = 6;
  g.stator.belts = {.outer_radius = 0.052, .span = kPi / 4};
  g.stator.boundary_radius = boundary;
  g.rotor.outer_radius = 0.030;
  g.rotor.sleeve_thickness = 0.010;
  return g;
}

/// An annular sector r_in .. r_out (r_in = 0: a pie slice) centred on angle `centre`, spanning
/// `span` [rad]; a span of 2 pi is a whole ring (or disc).
struct Sector {
  double r_in, r_out, centre, span;
};

/// Angles [rad] from s.centre of the nodes of `region` on the circle of radius r, sorted.
std::vector<double> angles_on_circle(const mesh::Mesh& m, int region, double r, double centre) {
  std::vector<double> angles;
  for (int t = 0; t < m.n_triangles(); ++t) {
    if (m.triangle_region(t) != region) continue;
    for (int i = 0; i < 3; ++i) {
      const Eigen::Vector2d p = m.nodes.row(m.triangles(t, i));
      if (std::abs(p.norm() - r) < 1e-9 * r)
        angles.push_back(std::remainder(std::atan2(p(1), p(0)) - centre, 2 * kPi));
    }
  }
  std::sort(angles.begin(), angles.end());
  angles.erase(std::unique(angles.begin(), angles.end()), angles.end());
  return angles;
}

/// Area of the circular segments between an arc of radius r and the chords joining `angles`
/// (a chord spanning d cuts off r^2 (d - sin d)/2); a whole ring also closes through +-pi.
double segments(double r, const std::vector<double>& angles, bool whole_ring) {
  double sum = 0.0;
  for (std::size_t i = 0; i + 1 < angles.size(); ++i) {
    const double d = angles[i + 1] - angles[i];
    sum += d - std::sin(d);
  }
  if (whole_ring) {
    const double d = angles.front() + 2 * kPi - angles.back();
    sum += d - std::sin(d);
  }
  return 0.5 * r * r * sum;
}

/// The region tiles exactly the sector drawn with chords for arcs: its area is the sector's less the
/// segments cut off its outer arc plus those its inner arc's chords add; and no node lies outside.
void check_sector(const mesh::Mesh& m, int region, const Sector& s) {
  REQUIRE(region >= 0);
  CAPTURE(m.regions[region].name);
  const bool whole = s.span > 2 * kPi - 1e-12;
  const double exact = 0.5 * s.span * (s.r_out * s.r_out - s.r_in * s.r_in);
  double chorded = exact - segments(s.r_out, angles_on_circle(m, region, s.r_out, s.centre), whole);
  if (s.r_in > 0.0) chorded += segments(s.r_in, angles_on_circle(m, region, s.r_in, s.centre), whole);
  const double area = mesh::region_areas(m)[region];
  CHECK(area == doctest::Approx(chorded).epsilon(1e-9).scale(0));
  for (int t = 0; t < m.n_triangles(); ++t) {
    if (m.triangle_region(t) != region) continue;
    for (int i = 0; i < 3; ++i) {
      const Eigen::Vector2d p = m.nodes.row(m.triangles(t, i));
      CHECK(p.norm() >= s.r_in * (1 - 1e-9));
      CHECK(p.norm() <= s.r_out * (1 + 1e-9));
      if (!whole && p.norm() > 1e-12)
        CHECK(std::abs(std::remainder(std::atan2(p(1), p(0)) - s.centre, 2 * kPi)) <= 0.5 * s.span + 1e-9);
    }
  }
}

int region_named(const mesh::Mesh& m, const std::string& name) {
  for (std::size_t r = 0; r < m.regions.size(); ++r)
    if (m.regions[r].name == name) return static_cast<int>(r);
  return -1;
}

/// Every A = 0 node lies on the circle of radius r.
void check_outer_nodes_on(const mesh::Mesh& m, double r) {
  REQUIRE(m.outer_nodes.size() > 6);
  for (int node : m.outer_nodes) CHECK(m.nodes.row(node).norm() == doctest::Approx(r).epsilon(1e-9).scale(0));
}

void check_common(const mesh::Geometry& g, const mesh::Mesh& m) {
  testing::check_fills_disc(g, m);
  testing::check_sliding_circle(g, m);
  testing::check_gap_layers(g, m);
  testing::check_merged(m);
}

}  // namespace

TEST_CASE("TEAM 30a: six conductor sectors, the air between them, the iron ring and air out to 1 m") {
  const mesh::Geometry g = team30a(1.0);
  const mesh::Mesh m = mesh::build(g, {1}, {1.0});
  check_common(g, m);
  const double r_b = 0.032, r_w = 0.052;
  for (int k = 1; k <= 6; ++k) {
    const int r = mesh::find_region(m, mesh::RegionKind::coil, k, 1);
    REQUIRE(r >= 0);
    CHECK(m.regions[r].name == "sector_" + std::to_string(k) + "_layer_1");
    check_sector(m, r, {r_b, r_w, kPi / 3 * (k - 1), kPi / 4});
  }
  CHECK(mesh::find_region(m, mesh::RegionKind::coil, 1, 2) < 0);
  CHECK(mesh::find_region(m, mesh::RegionKind::coil, 7, 1) < 0);
  // The air between the sectors belongs to no single sector: one region, a quarter of the winding
  // annulus (six 15° gaps). Its exact outline follows from the others, each exact, and the whole
  // disc, exact too.
  const int air = region_named(m, "winding_air");
  REQUIRE(air >= 0);
  CHECK(m.regions[air].kind == mesh::RegionKind::slot_air);
  CHECK(m.regions[air].slot == 0);
  CHECK(mesh::region_areas(m)[air] == doctest::Approx(kPi * (r_w * r_w - r_b * r_b) / 4).epsilon(2e-3).scale(0));
  check_sector(m, region_named(m, "stator_iron"), {r_w, 0.057, 0.0, 2 * kPi});
  check_sector(m, region_named(m, "outer_air"), {0.057, 1.0, 0.0, 2 * kPi});
  check_sector(m, region_named(m, "rotor_sleeve"), {0.020, 0.030, 0.0, 2 * kPi});
  check_sector(m, region_named(m, "rotor_iron"), {0.0, 0.020, 0.0, 2 * kPi});
  check_sector(m, region_named(m, "gap_rotor_side"), {0.030, 0.031, 0.0, 2 * kPi});
  check_sector(m, region_named(m, "gap_stator_side"), {0.031, r_b, 0.0, 2 * kPi});
  CHECK(m.regions[region_named(m, "rotor_sleeve")].kind == mesh::RegionKind::rotor_sleeve);
  CHECK(m.regions[region_named(m, "outer_air")].kind == mesh::RegionKind::outer_air);
  CHECK(m.regions.size() == 13);
  check_outer_nodes_on(m, 1.0);
}

TEST_CASE("without a boundary radius A = 0 lies on the stator's outer surface and there is no outer air") {
  const mesh::Geometry g = team30a(0.0);
  const mesh::Mesh m = mesh::build(g, {1}, {1.0});
  check_common(g, m);
  CHECK(region_named(m, "outer_air") < 0);
  CHECK(mesh::find_region(m, mesh::RegionKind::outer_air) < 0);
  check_sector(m, region_named(m, "stator_iron"), {0.052, 0.057, 0.0, 2 * kPi});
  check_outer_nodes_on(m, 0.057);
}

TEST_CASE("a slotted stator in air out to 1 m: the air ring costs few elements, which grow with the radius") {
  mesh::Geometry g = testing::open_slot_stator();
  const mesh::Mesh inside = mesh::build(g, {2}, {0.5});
  g.stator.boundary_radius = 1.0;
  const mesh::Mesh m = mesh::build(g, {2}, {0.5});
  check_common(g, m);
  const int air = region_named(m, "outer_air");
  check_sector(m, air, {0.100, 1.0, 0.0, 2 * kPi});
  check_outer_nodes_on(m, 1.0);
  // Beyond the stator elements grow by a quarter of the distance, up to half the 10° sector's width
  // (mesh/build.cpp): on the boundary they are over ten times the largest element of the stator
  // (measured: 87 mm against 5 mm), and the whole ring from 0.1 m to 1 m takes under a tenth of
  // the mesh (measured: 6 %).
  const double largest = mesh::element_sizes(g, {0.5}).largest;
  CHECK(2 * kPi * 1.0 / static_cast<double>(m.outer_nodes.size()) > 10 * largest);
  int n_air = 0;
  for (int t = 0; t < m.n_triangles(); ++t) n_air += m.triangle_region(t) == air;
  MESSAGE(n_air << " of " << m.n_triangles() << " triangles in the outer air, " << m.outer_nodes.size()
                << " nodes on the boundary");
  CHECK(n_air < m.n_triangles() / 10);
  CHECK(m.n_triangles() - n_air == doctest::Approx(inside.n_triangles()).epsilon(0.02).scale(0));
}

TEST_CASE("two layers in a conductor sector: radial halves, or side by side for tooth coils") {
  const mesh::Geometry g = team30a(0.0);
  const double r_mid = 0.042, half = kPi / 8;
  const mesh::Mesh radial = mesh::build(g, {2}, {1.0});
  testing::check_fills_disc(g, radial);
  for (int k = 1; k <= 6; ++k) {
    const double centre = kPi / 3 * (k - 1);
    check_sector(radial, mesh::find_region(radial, mesh::RegionKind::coil, k, 1), {0.032, r_mid, centre, kPi / 4});
    check_sector(radial, mesh::find_region(radial, mesh::RegionKind::coil, k, 2), {r_mid, 0.052, centre, kPi / 4});
  }
  const mesh::Mesh side = mesh::build(g, {2, true}, {1.0});
  testing::check_fills_disc(g, side);
  for (int k = 1; k <= 6; ++k) {
    const double centre = kPi / 3 * (k - 1);
    // Layer 1 is the counter-clockwise half.
    check_sector(side, mesh::find_region(side, mesh::RegionKind::coil, k, 1), {0.032, 0.052, centre + half / 2, half});
    check_sector(side, mesh::find_region(side, mesh::RegionKind::coil, k, 2), {0.032, 0.052, centre - half / 2, half});
  }
}

TEST_CASE("a sleeve on an iron rotor with a shaft; two conductor sectors of half a turn each") {
  mesh::Geometry g = team30a(0.2);
  g.rotor.shaft_radius = 0.008;
  g.stator.n_positions = 2;
  g.stator.belts.span = 2 * kPi / 3;
  const mesh::Mesh m = mesh::build(g, {1}, {1.0});
  check_common(g, m);
  check_sector(m, region_named(m, "shaft"), {0.0, 0.008, 0.0, 2 * kPi});
  check_sector(m, region_named(m, "rotor_iron"), {0.008, 0.020, 0.0, 2 * kPi});
  check_sector(m, region_named(m, "rotor_sleeve"), {0.020, 0.030, 0.0, 2 * kPi});
  check_sector(m, mesh::find_region(m, mesh::RegionKind::coil, 1, 1), {0.032, 0.052, 0.0, 2 * kPi / 3});
  check_sector(m, mesh::find_region(m, mesh::RegionKind::coil, 2, 1), {0.032, 0.052, kPi, 2 * kPi / 3});
  check_outer_nodes_on(m, 0.2);
}

TEST_CASE("far from the gap, elements resolve a slotless stator's iron ring, but no finer than the gap") {
  mesh::Geometry g = team30a(1.0);
  const mesh::ElementSizes h = mesh::element_sizes(g, {1.0});
  CHECK(h.gap == doctest::Approx(0.0005).scale(0));  // four elements across the 2 mm gap
  CHECK(h.largest == doctest::Approx(0.0025).scale(0));  // half the 5 mm ring
  g.stator.outer_radius = 0.0521;  // a 0.1 mm ring, thinner than the 2 mm gap
  CHECK(mesh::element_sizes(g, {1.0}).largest == doctest::Approx(0.001).scale(0));  // half the gap
}

TEST_CASE("phase belts on six conductor sectors: +A, -C, +B, -A, +C, -B, TEAM 30a's arrangement") {
  // K. R. Davey, TEAM Problem 30a (docs/references.md §1): counter-clockwise from 0° in 60° steps,
  // A+, C-, B+, A-, C+, B-. An integral-slot single layer, q = 6/(2·3) = 1, full pitch.
  const mesh::Winding w = mesh::lay_out(testing::winding_spec(3, 2, 1, 3, 1), team30a(1.0).stator);
  CHECK(w.rule == mesh::LayoutRule::phase_belts);
  REQUIRE(w.sides.size() == 6);
  const int phase[] = {0, 2, 1, 0, 2, 1}, direction[] = {1, -1, 1, -1, 1, -1};
  for (const mesh::CoilSide& side : w.sides) {
    CAPTURE(side.slot);
    CHECK(side.layer == 1);
    CHECK(side.phase == phase[side.slot - 1]);
    CHECK(side.direction == direction[side.slot - 1]);
    CHECK(std::abs(side.angle - kPi / 3 * (side.slot - 1)) < 1e-12);
  }
  // Full pitch on single sectors: every odd order has winding factor 1 (distribution and pitch 1).
  for (const auto& k : mesh::winding_factors(w, 7))
    if (k.order % 2) CHECK(k.from_layout == doctest::Approx(1.0).epsilon(1e-12).scale(0));
}
