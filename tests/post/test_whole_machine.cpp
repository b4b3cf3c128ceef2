// The whole machine drawn from a sector model, checked against the whole model solved as such.
// The reference is the symmetry argument of tests/post/test_sector_field.cpp: the copies of an
// anti-periodic sector are the very triangles of the whole mesh, and the field in copy k is the
// model's field times (-1)^k (Salon, "Finite Element Analysis of Electrical Machines", 1995,
// sec. 6.2 on periodic and anti-periodic boundaries; from memory). So after unfolding, every node
// and triangle of the whole model must be found at the same place with the same A_z and B.

#include <cmath>
#include <map>
#include <numbers>
#include <utility>

#include <doctest/doctest.h>

#include "mesh/build.hpp"
#include "post/flux_density.hpp"
#include "post/whole_machine.hpp"
#include "support/sector_machine.hpp"

using namespace tf;

namespace {

/// Positions rounded to 0.1 µm as map keys.
std::pair<long, long> key(const Eigen::Vector2d& p) { return {std::lround(p.x() * 1e7), std::lround(p.y() * 1e7)}; }

Eigen::Vector2d centroid(const Eigen::MatrixX2d& xy, const Eigen::MatrixX3i& tri, int t) {
  return (xy.row(tri(t, 0)) + xy.row(tri(t, 1)) + xy.row(tri(t, 2))).transpose() / 3.0;
}

}  // namespace

TEST_CASE("an anti-periodic quarter model unfolds into the whole model's field, signs applied") {
  const mesh::Geometry g = testing::magnet_machine();
  const mesh::Winding w = testing::magnet_machine_winding(g);
  const auto [full, sector] = testing::full_and_sector(g, w);
  REQUIRE(sector.symmetry.copies == 4);
  REQUIRE(sector.symmetry.anti_periodic);
  const std::vector<double> currents = testing::three_phase_currents(20.0, std::numbers::pi / 6);
  const double pitch = 2 * std::numbers::pi / static_cast<double>(full.sliding.stator_nodes.size());
  for (int shift : {0, 5}) {
    CAPTURE(shift);
    const mesh::Mesh full_drawn = mesh::with_rotor_turned(full, shift * pitch);
    const mesh::Mesh sector_drawn = mesh::with_rotor_turned(sector, shift * pitch);
    const Eigen::VectorXd a_full = testing::linear_field(full, g, w, currents, shift);
    const Eigen::VectorXd a_sector = testing::linear_field(sector, g, w, currents, shift);
    const post::WholeMachine whole = post::unfold(sector_drawn);
    CHECK(whole.n_triangles() == full.n_triangles());
    CHECK(whole.n_nodes() == full.n_nodes());  // the cuts are merged, not drawn twice

    std::multimap<std::pair<long, long>, int> full_node;
    for (int i = 0; i < full.n_nodes(); ++i) full_node.emplace(key(full_drawn.nodes.row(i)), i);
    const Eigen::VectorXd a = post::unfold_nodal(whole, a_sector);
    const double scale = a_full.cwiseAbs().maxCoeff();
    REQUIRE(scale > 1e-4);  // a real field [Wb/m]
    double worst = 0.0;
    int unmatched = 0;
    for (int i = 0; i < whole.n_nodes(); ++i) {
      const auto it = full_node.find(key(whole.nodes.row(i)));
      if (it == full_node.end()) { ++unmatched; continue; }
      worst = std::max(worst, std::abs(a(i) - a_full(it->second)) / scale);
    }
    CHECK(unmatched == 0);
    CHECK(worst < 1e-6);

    std::map<std::pair<long, long>, int> full_triangle;
    for (int t = 0; t < full.n_triangles(); ++t) full_triangle.emplace(key(centroid(full_drawn.nodes, full.triangles, t)), t);
    const Eigen::MatrixX2d b_full = post::flux_density(full_drawn, a_full);
    const Eigen::MatrixX2d b = post::unfold_cell_vectors(whole, post::flux_density(sector_drawn, a_sector));
    const double b_scale = b_full.rowwise().norm().maxCoeff();
    double worst_b = 0.0;
    unmatched = 0;
    for (int t = 0; t < whole.n_triangles(); ++t) {
      const auto it = full_triangle.find(key(centroid(whole.nodes, whole.triangles, t)));
      if (it == full_triangle.end()) { ++unmatched; continue; }
      CHECK(whole.triangle_region(t) >= 0);
      worst_b = std::max(worst_b, (b.row(t) - b_full.row(it->second)).norm() / b_scale);
    }
    CHECK(unmatched == 0);
    CHECK(worst_b < 1e-6);
  }
}

TEST_CASE("the whole model unfolds into itself") {
  const mesh::Geometry g = testing::magnet_machine();
  const mesh::Winding w = testing::magnet_machine_winding(g);
  const mesh::Mesh full = mesh::build(g, {2, false}, {});
  const post::WholeMachine whole = post::unfold(full);
  CHECK(whole.n_triangles() == full.n_triangles());
  CHECK(whole.n_nodes() == full.n_nodes());
  const Eigen::VectorXd a = Eigen::VectorXd::LinSpaced(full.n_nodes(), -1.0, 1.0);
  const Eigen::VectorXd unfolded = post::unfold_nodal(whole, a);
  double worst = 0.0;
  for (int i = 0; i < whole.n_nodes(); ++i) worst = std::max(worst, std::abs(unfolded(i) - a(whole.node_source[i])));
  CHECK(worst == 0.0);
  CHECK((whole.nodes.row(0) - full.nodes.row(whole.node_source[0])).norm() == 0.0);
}
