// The Gmsh-built cross-section: regions, replication, the sliding circle and the gap layers.

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <set>

#include "mesh/build.hpp"
#include "support/sample_geometry.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

void check_mesh(const mesh::Geometry& g, int n_layers, const mesh::Mesh& m) {
  const int Q = g.stator.n_slots;
  const auto area = mesh::region_areas(m);
  // Every triangle is counter-clockwise and belongs to a region.
  for (int t = 0; t < m.n_triangles(); ++t) REQUIRE(mesh::triangle_area(m, t) > 0.0);
  // The pieces fill the disc of the outer radius (chords cut the arcs by ~(h/R)^2/6).
  double total = 0.0;
  for (double a : area) total += a;
  CHECK(total == doctest::Approx(kPi * std::pow(g.stator.outer_radius, 2)).epsilon(2e-4));
  // Every slot has each layer, all with the same area: the copies are identical.
  for (int l = 1; l <= n_layers; ++l) {
    const int first = mesh::find_region(m, mesh::RegionKind::coil, 1, l);
    REQUIRE(first >= 0);
    for (int s = 2; s <= Q; ++s) {
      const int r = mesh::find_region(m, mesh::RegionKind::coil, s, l);
      REQUIRE(r >= 0);
      CHECK(area[r] == doctest::Approx(area[first]).epsilon(1e-9));
    }
  }
  CHECK(mesh::find_region(m, mesh::RegionKind::coil, 1, n_layers + 1) < 0);
  // Coil area: the slot body above the tips and wedge (parallel-sided rectangle).
  const auto& sl = g.stator.slot;
  const double coil_height = sl.shape == mesh::SlotShape::open ? sl.depth : sl.depth - sl.tip_height - sl.wedge_height;
  double coil_area = 0.0;
  for (int l = 1; l <= n_layers; ++l) coil_area += area[mesh::find_region(m, mesh::RegionKind::coil, 1, l)];
  CHECK(coil_area == doctest::Approx(sl.width * coil_height).epsilon(sl.shape == mesh::SlotShape::open ? 2e-3 : 1e-9));
}

void check_sliding_circle(const mesh::Geometry& g, const mesh::Mesh& m) {
  const auto& s = m.sliding;
  REQUIRE(s.stator_nodes.size() == s.rotor_nodes.size());
  const int n = static_cast<int>(s.stator_nodes.size());
  CHECK(n % g.stator.n_slots == 0);
  std::set<int> distinct(s.stator_nodes.begin(), s.stator_nodes.end());
  distinct.insert(s.rotor_nodes.begin(), s.rotor_nodes.end());
  CHECK(distinct.size() == static_cast<std::size_t>(2 * n));  // two sides, no shared node
  for (int i = 0; i < n; ++i) {
    const double a = s.start_angle + 2 * kPi * i / n;
    for (int node : {s.stator_nodes[i], s.rotor_nodes[i]}) {
      CHECK(m.nodes(node, 0) == doctest::Approx(s.radius * std::cos(a)).epsilon(1e-9).scale(s.radius));
      CHECK(m.nodes(node, 1) == doctest::Approx(s.radius * std::sin(a)).epsilon(1e-9).scale(s.radius));
    }
  }
}

/// At least three elements across the gap: no gap triangle spans more than a third of it radially.
void check_gap_layers(const mesh::Geometry& g, const mesh::Mesh& m) {
  double widest = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    if (m.regions[m.triangle_region(t)].kind != mesh::RegionKind::gap) continue;
    double lo = 1e9, hi = 0.0;
    for (int i = 0; i < 3; ++i) {
      const double r = m.nodes.row(m.triangles(t, i)).norm();
      lo = std::min(lo, r);
      hi = std::max(hi, r);
    }
    widest = std::max(widest, hi - lo);
  }
  CHECK(widest <= g.gap_length() / 3 * (1 + 1e-9));
}

/// No two nodes at one place, except the two sides of the sliding circle.
void check_merged(const mesh::Mesh& m) {
  std::vector<std::pair<long long, long long>> keys;
  const double grid = 1e-9;
  for (int i = 0; i < m.n_nodes(); ++i) keys.push_back({std::llround(m.nodes(i, 0) / grid), std::llround(m.nodes(i, 1) / grid)});
  std::sort(keys.begin(), keys.end());
  const auto duplicates = keys.size() - std::set(keys.begin(), keys.end()).size();
  CHECK(duplicates == m.sliding.stator_nodes.size());
}

}  // namespace

TEST_CASE("open-slot stator, two layers: regions, identical slots, sliding circle, gap layers") {
  const auto g = testing::open_slot_stator();
  const mesh::Mesh m = mesh::build(g, {2}, {0.5});
  check_mesh(g, 2, m);
  check_sliding_circle(g, m);
  check_gap_layers(g, m);
  check_merged(m);
  CHECK(m.outer_nodes.size() > static_cast<std::size_t>(g.stator.n_slots));
  for (int node : m.outer_nodes) CHECK(m.nodes.row(node).norm() == doctest::Approx(g.stator.outer_radius).epsilon(1e-9));
}

TEST_CASE("semi-closed stator, one layer, and a bore with no rotor") {
  auto g = testing::semi_closed_stator();
  const mesh::Mesh m = mesh::build(g, {1}, {0.5});
  check_mesh(g, 1, m);
  check_sliding_circle(g, m);
  check_gap_layers(g, m);
  CHECK(mesh::find_region(m, mesh::RegionKind::slot_air, 7) >= 0);
  CHECK(mesh::find_region(m, mesh::RegionKind::shaft) >= 0);

  g.rotor.kind = mesh::RotorKind::none;
  const mesh::Mesh air = mesh::build(g, {2}, {0.5});
  check_mesh(g, 2, air);
  CHECK(mesh::find_region(air, mesh::RegionKind::bore_air) >= 0);
  CHECK(mesh::find_region(air, mesh::RegionKind::rotor_iron) < 0);
}

TEST_CASE("the fineness knob refines the mesh") {
  const auto g = testing::semi_closed_stator();
  const auto coarse = mesh::build(g, {2}, {0.5});
  const auto fine = mesh::build(g, {2}, {1.5});
  CHECK(fine.n_triangles() > 1.5 * coarse.n_triangles());
  CHECK(fine.sliding.stator_nodes.size() > coarse.sliding.stator_nodes.size());
}
