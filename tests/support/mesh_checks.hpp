#pragma once
// Checks every built cross-section must pass, shared by the slotted and salient-pole mesh tests.

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <set>
#include <utility>
#include <vector>

#include "mesh/geometry.hpp"
#include "mesh/mesh.hpp"

namespace tf::testing {

/// The sliding circle: both sides carry the same number of distinct nodes, node i of either side
/// exactly at start_angle + 2*pi*i/n on the circle, a whole number of them per slot (or pole).
inline void check_sliding_circle(const mesh::Geometry& g, const mesh::Mesh& m) {
  const auto& s = m.sliding;
  REQUIRE(s.stator_nodes.size() == s.rotor_nodes.size());
  const int n = static_cast<int>(s.stator_nodes.size());
  CHECK(n % g.stator.n_positions == 0);
  std::set<int> distinct(s.stator_nodes.begin(), s.stator_nodes.end());
  distinct.insert(s.rotor_nodes.begin(), s.rotor_nodes.end());
  CHECK(distinct.size() == static_cast<std::size_t>(2 * n));  // two sides, no shared node
  for (int i = 0; i < n; ++i) {
    const double a = s.start_angle + 2 * std::numbers::pi * i / n;
    for (int node : {s.stator_nodes[i], s.rotor_nodes[i]}) {
      CHECK(m.nodes(node, 0) == doctest::Approx(s.radius * std::cos(a)).epsilon(1e-9).scale(s.radius));
      CHECK(m.nodes(node, 1) == doctest::Approx(s.radius * std::sin(a)).epsilon(1e-9).scale(s.radius));
    }
  }
}

/// At least three elements across the gap: no gap triangle spans more than a third of it radially.
inline void check_gap_layers(const mesh::Geometry& g, const mesh::Mesh& m) {
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
inline void check_merged(const mesh::Mesh& m) {
  std::vector<std::pair<long long, long long>> keys;
  const double grid = 1e-9;
  for (int i = 0; i < m.n_nodes(); ++i)
    keys.push_back({std::llround(m.nodes(i, 0) / grid), std::llround(m.nodes(i, 1) / grid)});
  std::sort(keys.begin(), keys.end());
  const auto duplicates = keys.size() - std::set(keys.begin(), keys.end()).size();
  CHECK(duplicates == m.sliding.stator_nodes.size());
}

/// Every triangle counter-clockwise, and the regions together tile exactly the polygon of the
/// outer boundary nodes (shoelace formula): no gap, no overlap. Those nodes lie on the circle of the
/// stator's outer radius (or of the boundary radius beyond it), so the polygon is that disc less
/// the circular segments cut off by its chords: R^2 (d - sin d)/2 for a chord spanning angle d.
inline void check_fills_disc(const mesh::Geometry& g, const mesh::Mesh& m) {
  for (int t = 0; t < m.n_triangles(); ++t) REQUIRE(mesh::triangle_area(m, t) > 0.0);
  double total = 0.0;
  for (double a : mesh::region_areas(m)) total += a;
  std::vector<std::pair<double, int>> ring;
  for (int node : m.outer_nodes) ring.push_back({std::atan2(m.nodes(node, 1), m.nodes(node, 0)), node});
  std::sort(ring.begin(), ring.end());
  const double outer = std::max(g.stator.outer_radius, g.stator.boundary_radius);
  double polygon = 0.0, segments = 0.0;
  for (std::size_t i = 0; i < ring.size(); ++i) {
    const int a = ring[i].second, b = ring[(i + 1) % ring.size()].second;
    polygon += 0.5 * (m.nodes(a, 0) * m.nodes(b, 1) - m.nodes(b, 0) * m.nodes(a, 1));
    // Angles are sorted; the last chord closes the ring through +-pi.
    double d = ring[(i + 1) % ring.size()].first - ring[i].first;
    if (i + 1 == ring.size()) d += 2 * std::numbers::pi;
    segments += 0.5 * outer * outer * (d - std::sin(d));
  }
  CHECK(total == doctest::Approx(polygon).epsilon(1e-10).scale(0));
  CHECK(polygon == doctest::Approx(std::numbers::pi * outer * outer - segments).epsilon(1e-9).scale(0));
}

}  // namespace tf::testing
