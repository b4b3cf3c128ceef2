// Permanent magnets: the remanence laws, and the load of a uniformly magnetized magnet is that of
// its equivalent surface current. (The open-circuit gap field is checked in
// tests/post/test_magnet_gap_field.cpp.)

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <complex>
#include <map>
#include <numbers>
#include <utility>
#include <vector>

#include <Eigen/Dense>

#include "mesh/build.hpp"
#include "solver/assemble.hpp"
#include "solver/dofs.hpp"
#include "solver/magnets.hpp"
#include "solver/spd_solver.hpp"
#include "support/sample_geometry.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;
constexpr double kMu0 = 4e-7 * kPi;

/// The load of surface currents K_z = nu (B_rem x n)_z on the boundary of each magnet region, n
/// the outward normal: on each boundary edge K is constant, and int K phi_i ds = K L / 2 at both
/// ends. A boundary edge belongs to one triangle of the region; for a counter-clockwise triangle the
/// edge a -> b has the outward normal (dy, -dx)/L. Uniform magnetization (parallel law) only.
struct SurfaceLoad {
  Eigen::VectorXd load;            ///< #dofs
  std::vector<int> magnet_nodes;   ///< per node: 0 outside magnets, 1 inside, 2 on a magnet's boundary
};

SurfaceLoad surface_current_load(const mesh::Mesh& m, const solver::DofMap& d, const solver::Materials& mat,
                                 const solver::MagnetLayout& layout) {
  const double nu = 1.0 / (kMu0 * mat.magnet_mu_rec);
  struct Edge {
    int a, b, region, uses;
  };
  std::map<std::pair<int, int>, Edge> edges;  // per magnet region, by sorted node pair
  SurfaceLoad out{Eigen::VectorXd::Zero(d.n_dofs), std::vector<int>(m.n_nodes(), 0)};
  for (int t = 0; t < m.n_triangles(); ++t) {
    const int r = m.triangle_region(t);
    if (m.regions[r].kind != mesh::RegionKind::magnet) continue;
    for (int j = 0; j < 3; ++j) {
      const int a = m.triangles(t, j), b = m.triangles(t, (j + 1) % 3);
      out.magnet_nodes[a] = 1;
      auto [it, added] = edges.emplace(std::pair{std::min(a, b), std::max(a, b)}, Edge{a, b, r, 0});
      CHECK((added || it->second.region == r));  // magnets apart: no edge shared by two magnets
      ++it->second.uses;
    }
  }
  for (const auto& [key, e] : edges) {
    if (e.uses != 1) continue;
    const Eigen::Vector2d b_rem =
        solver::remanence(layout, mat.magnet_remanence, m.regions[e.region].slot, Eigen::Vector2d(1.0, 0.0));
    const Eigen::Vector2d along = m.nodes.row(e.b) - m.nodes.row(e.a);
    const Eigen::Vector2d normal_times_length(along(1), -along(0));
    const double k_times_length = nu * (b_rem(0) * normal_times_length(1) - b_rem(1) * normal_times_length(0));
    for (int node : {e.a, e.b}) {
      out.magnet_nodes[node] = 2;
      if (d.dof_of_node[node] >= 0) out.load(d.dof_of_node[node]) += 0.5 * k_times_length;
    }
  }
  return out;
}

}  // namespace

TEST_CASE("remanence: radial and parallel laws, north poles outwards") {
  const solver::MagnetLayout radial{4, mesh::Magnetization::radial, 0.0};
  const Eigen::Vector2d at(0.03, 0.04);  // 5 cm from the axis at atan(4/3)
  const Eigen::Vector2d north = solver::remanence(radial, 1.2, 1, at);
  CHECK(north(0) == doctest::Approx(1.2 * 0.6).epsilon(1e-14).scale(0));
  CHECK(north(1) == doctest::Approx(1.2 * 0.8).epsilon(1e-14).scale(0));
  CHECK((solver::remanence(radial, 1.2, 2, at) + north).norm() < 1e-15);  // south: inwards
  // Parallel: along the pole centre, pole 2 of 4 at 90°, pointing inwards (south).
  const solver::MagnetLayout parallel{4, mesh::Magnetization::parallel, 0.0};
  const Eigen::Vector2d south = solver::remanence(parallel, 1.2, 2, at);
  CHECK(std::abs(south(0)) < 1e-15);
  CHECK(south(1) == doctest::Approx(-1.2).epsilon(1e-14).scale(0));
}

TEST_CASE("uniform magnetization: the magnet load is that of the equivalent surface current, zero inside") {
  // Patch-type property of the weak form (derived): for a uniform B_rem the element terms
  // int_e nu B_rem x grad(phi_i) add up to nu B_rem x int_Omega grad(phi_i) = nu B_rem x oint phi_i n ds
  // (divergence theorem), which vanishes for nodes inside the magnet (phi_i = 0 on its boundary) and
  // is the load of the surface current K = nu (B_rem x n)_z on its boundary nodes.
  mesh::Geometry g = testing::semi_closed_stator();
  g.rotor.kind = mesh::RotorKind::surface_magnet;
  g.rotor.magnets = {.n_poles = 4, .thickness = 0.003, .arc = 0.7 * kPi / 2, .direction = mesh::Magnetization::parallel};
  const mesh::Mesh m = mesh::build(g, {2}, {.fineness = 0.5});
  const solver::DofMap d = solver::number_dofs(m);
  const solver::Materials mat;
  const solver::MagnetLayout layout = solver::magnet_layout(g.rotor);
  const Eigen::VectorXd f = solver::magnet_load(m, d, mat, layout);
  const SurfaceLoad surface = surface_current_load(m, d, mat, layout);
  const double scale = f.cwiseAbs().maxCoeff();
  REQUIRE(scale > 0.0);
  int n_inside = 0, n_boundary = 0;
  double worst_inside = 0.0, worst_boundary = 0.0;
  for (int node = 0; node < m.n_nodes(); ++node) {
    const int i = d.dof_of_node[node];
    if (surface.magnet_nodes[node] == 1) {
      ++n_inside;
      worst_inside = std::max(worst_inside, std::abs(f(i)));
    } else if (surface.magnet_nodes[node] == 2) {
      ++n_boundary;
      worst_boundary = std::max(worst_boundary, std::abs(f(i) - surface.load(i)));
    }
  }
  MESSAGE(n_inside << " nodes inside magnets: max |load| / max load = " << worst_inside / scale << "; "
                   << n_boundary << " on their boundaries: max |load - surface current load| / max load = "
                   << worst_boundary / scale);
  CHECK(n_inside > 100);
  CHECK(n_boundary > 100);
  CHECK(worst_inside < 1e-12 * scale);
  CHECK(worst_boundary < 1e-12 * scale);
  CHECK((f - surface.load).cwiseAbs().maxCoeff() < 1e-12 * scale);  // and nothing elsewhere
}
