// A thick conducting wall in a sinusoidal surface field: the field's decay and the loss per area
// against the one-dimensional closed form of a half-space.

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <complex>
#include <numbers>

#include "solver/assemble.hpp"
#include "solver/time_harmonic.hpp"
#include "support/conducting_wall.hpp"
#include "support/joule_loss.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;
using Complex = std::complex<double>;

namespace {

constexpr double kPi = std::numbers::pi;
constexpr double kMu0 = 4e-7 * kPi;

}  // namespace

TEST_CASE("half-space: |H| falls as e^(-x/delta) and the loss per area is H0^2 / (2 sigma delta)") {
  // Closed form (R. L. Stoll, The Analysis of Eddy Currents, 1974, from
  // memory): copper, sigma = 5.80e7 S/m, 50 Hz: delta = 9.3459 mm, and H0 = 1000 A/m (peak) gives
  // 0.922403 W/m^2. The wall is a copper tube ten skin depths thick whose inner face, 2 m from the
  // axis, is 200 skin depths round (curvature a 0.1 % effect); a line current on the axis makes
  // H0 = I / (2 pi R) there. The tube is an open-ended conductor: its net current is held at zero
  // by superposing a uniform driving field, found from the two solutions' net currents. With no net
  // current in the wall, its outer face (radius R2) sees the line current's field too, H0 R/R2:
  // ten skin depths apart, the two faces dissipate independently.
  const double sigma = 5.8e7, f = 50.0, omega = 2 * kPi * f;
  const double delta = std::sqrt(2.0 / (omega * kMu0 * sigma));
  CHECK(delta == doctest::Approx(9.3459e-3).epsilon(1e-4).scale(0));
  const double r_wall = 2.0, wall = 10 * delta, h0 = 1000.0, current = 2 * kPi * r_wall * h0;
  const mesh::Mesh m = testing::polar_mesh(0.0, {{0.01, 4, mesh::RegionKind::coil, "line current"},
                                                 {0.5, 20, mesh::RegionKind::slot_air, "air"},
                                                 {r_wall, 20, mesh::RegionKind::slot_air, "more air"},
                                                 {r_wall + wall, 100, mesh::RegionKind::stator_iron, "wall"},
                                                 {3.0, 20, mesh::RegionKind::outer_air, "outside"}},
                                           512);
  auto [materials, coefficients, s] = testing::conductor_system(m, sigma);
  const double wire_area = mesh::region_areas(m)[0];
  s.unit_loads.resize(s.dofs.n_dofs, 2);
  s.unit_loads.col(0) = solver::region_current_load(m, s.dofs, {current / wire_area, 0, 0, 0, 0});
  s.unit_loads.col(1) = solver::region_current_load(m, s.dofs, {0, 0, 0, 1.0, 0});  // J_s = 1 A/m^2 in the wall
  solver::TimeHarmonicStats stats;
  const auto solutions = solver::solve_time_harmonic(m, s, {{{1.0, 0.0}, omega, 0.0}, {{0.0, 1.0}, omega, 0.0}}, stats);
  const Eigen::VectorXcd& by_wire = solutions[0];
  const Eigen::VectorXcd& by_field = solutions[1];
  auto wall_current = [&](const Eigen::VectorXcd& a, double source) {
    Complex sum = 0.0;
    for (int t = 0; t < m.n_triangles(); ++t) {
      if (m.triangle_region(t) != 3) continue;
      Complex mean = 0.0;
      for (int i = 0; i < 3; ++i) mean += a(m.triangles(t, i)) / 3.0;
      sum += mesh::triangle_area(m, t) * (source - Complex(0.0, omega * sigma) * mean);
    }
    return sum;
  };
  const Complex c = -wall_current(by_wire, 0.0) / wall_current(by_field, 1.0);
  const Eigen::VectorXcd a = by_wire + c * by_field;
  // Loss of J = c J_s - j omega sigma A: region_joule_losses integrates |sigma j omega A'|^2/(2 sigma)
  // with A' = A + j c / (omega sigma).
  const Eigen::VectorXcd shifted = a.array() + Complex(0.0, 1.0) * c / (omega * sigma);
  const auto loss = testing::region_joule_losses(m, shifted, coefficients.sigma, omega);
  const double r_out = r_wall + wall;
  const double per_area = loss[3] / (2 * kPi * (r_wall + r_wall * r_wall / r_out));  // both faces, H0 and H0 R/R2
  MESSAGE("loss per area " << per_area << " W/m^2 (closed form 0.922403)");
  CHECK(per_area == doctest::Approx(0.922403).epsilon(0.01).scale(0));

  // Decay: B_theta between neighbouring nodes on one ray, (A_k+1 - A_k)/dr, against e^(-x/delta).
  std::vector<int> ray;  // nodes at angle 0 in the wall, from its inner face outwards
  for (int node = 0; node < m.n_nodes(); ++node) {
    const double r = m.nodes(node, 0);
    if (std::abs(m.nodes(node, 1)) < 1e-12 && r >= r_wall - 1e-9 && r <= r_out + 1e-9) ray.push_back(node);
  }
  std::sort(ray.begin(), ray.end(), [&](int p, int q) { return m.nodes(p, 0) < m.nodes(q, 0); });
  REQUIRE(ray.size() == 101);
  auto b = [&](int k) { return std::abs(a(ray[k + 1]) - a(ray[k])); };
  // Depths delta/2, delta and 2 delta (ten rings per delta); deeper, where |B| is a few percent of
  // the face value, the curved wall's field departs from the half-space's by more than 1 %.
  for (int k : {5, 10, 20}) {
    const double ratio = b(k) / b(0), exact = std::exp(-k * wall / 100 / delta);
    MESSAGE("|B| at " << k / 10.0 << " delta: " << ratio << " of the face value, closed form " << exact);
    CHECK(ratio == doctest::Approx(exact).epsilon(0.01).scale(0));
  }
}
