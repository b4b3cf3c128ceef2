// The exterior image of an open boundary (Kelvin transformation): tied node by node to the
// boundary circle, with A = 0 only at its centre.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <set>

#include "mesh/build.hpp"
#include "support/team30a_model.hpp"

using namespace tf;

TEST_CASE("open boundary: the image disc's arc faces the boundary circle node by node") {
  const testing::Team30aModel c = testing::team30a_model();  // as cases/team30a_three_phase.toml
  REQUIRE(c.geometry.stator.open_boundary);
  const double r = c.geometry.stator.boundary_radius;
  const mesh::Mesh m = mesh::build(c.geometry, mesh::slot_layers(c.winding), {1.0});
  // A = 0 at one node: the image's centre, drawn three boundary radii to the right.
  REQUIRE(m.outer_nodes.size() == 1);
  CHECK(m.nodes(m.outer_nodes[0], 0) == doctest::Approx(3 * r).scale(0));
  CHECK(std::abs(m.nodes(m.outer_nodes[0], 1)) < 1e-9 * r);
  REQUIRE(m.ties.size() >= 6u * 4u);
  std::set<int> partners;
  for (const auto& [node, partner] : m.ties) {
    const Eigen::Vector2d image = m.nodes.row(node).transpose() - Eigen::Vector2d(3 * r, 0.0);
    const Eigen::Vector2d circle = m.nodes.row(partner).transpose();
    // Both on a circle of radius r, at the same angle (the map r -> r^2/r keeps angles).
    CHECK(image.norm() == doctest::Approx(r).epsilon(1e-9).scale(0));
    CHECK(circle.norm() == doctest::Approx(r).epsilon(1e-9).scale(0));
    CHECK(std::abs(std::remainder(std::atan2(image(1), image(0)) - std::atan2(circle(1), circle(0)), 2 * std::numbers::pi)) < 1e-9);
    partners.insert(partner);
  }
  CHECK(partners.size() == m.ties.size());  // each boundary node once
  // The disc is a region of its own, apart from the real air round the stator.
  const int image = mesh::find_region(m, mesh::RegionKind::exterior_image);
  REQUIRE(image >= 0);
  CHECK(m.regions[image].name == "exterior_image");
  for (const auto& [node, partner] : m.ties) CHECK(m.nodes.row(node).norm() > 1.5 * r);
  for (int t = 0; t < m.n_triangles(); ++t) {
    const bool in_image = m.triangle_region(t) == image;
    const double x = (m.nodes(m.triangles(t, 0), 0) + m.nodes(m.triangles(t, 1), 0) + m.nodes(m.triangles(t, 2), 0)) / 3;
    CHECK(in_image == (x > 1.5 * r));
  }
  // (The unknowns of the ties: tests/solver/test_open_boundary.cpp.)
}
