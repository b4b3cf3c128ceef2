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
  CHECK(n % g.stator.n_slots == 0);
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

/// Every triangle counter-clockwise, and the regions together fill the disc of the outer radius
/// (the chords of the arcs cut off about (h/R)^2/6 of it, well under the tolerance).
inline void check_fills_disc(const mesh::Geometry& g, const mesh::Mesh& m) {
  for (int t = 0; t < m.n_triangles(); ++t) REQUIRE(mesh::triangle_area(m, t) > 0.0);
  double total = 0.0;
  for (double a : mesh::region_areas(m)) total += a;
  CHECK(total == doctest::Approx(std::numbers::pi * std::pow(g.stator.outer_radius, 2)).epsilon(2e-4));
}

}  // namespace tf::testing
