#include "solver/slip.hpp"

#include <chrono>
#include <cmath>
#include <numbers>

#include <Eigen/UmfPackSupport>

#include "solver/assemble.hpp"
#include "solver/errors.hpp"
#include "solver/p1.hpp"

namespace tf::solver {
namespace {

using Clock = std::chrono::steady_clock;
double since(Clock::time_point t) { return std::chrono::duration<double>(Clock::now() - t).count(); }

/// Element mass int phi_i phi_j = area/12 (1 + delta_ij) of a first-order triangle.
Eigen::Matrix3d p1_mass(const mesh::Mesh& m, int t) {
  TriangleXY xy;
  for (int i = 0; i < 3; ++i) xy.row(i) = m.nodes.row(m.triangles(t, i));
  double twice_area = 0.0;
  p1_gradients(xy, twice_area);
  return (Eigen::Matrix3d::Ones() + Eigen::Matrix3d::Identity()) * (twice_area / 24.0);
}

Eigen::SparseMatrix<double> assemble_mass(const mesh::Mesh& m, const DofMap& d, const std::vector<double>& sigma) {
  std::vector<Eigen::Triplet<double>> triplets;
  for (int t = 0; t < m.n_triangles(); ++t) {
    const double s = sigma[m.triangle_region(t)];
    if (s == 0.0) continue;
    const Eigen::Matrix3d me = p1_mass(m, t);
    for (int i = 0; i < 3; ++i) {
      const int di = d.dof_of_node[m.triangles(t, i)];
      if (di < 0) continue;
      for (int j = 0; j < 3; ++j) {
        const int dj = d.dof_of_node[m.triangles(t, j)];
        if (dj >= 0) triplets.emplace_back(di, dj, s * me(i, j));
      }
    }
  }
  Eigen::SparseMatrix<double> M(d.n_dofs, d.n_dofs);
  M.setFromTriplets(triplets.begin(), triplets.end());
  return M;
}

}  // namespace

double end_ring_factor(const Cage& cage, const EndRings& rings) {
  const double pi = std::numbers::pi;
  const double r_bar = cage.stack_length / (cage.bar_sigma * cage.bar_area);
  const double r_segment = pi * rings.mean_diameter / (cage.n_bars * rings.conductivity * rings.area);
  const double s = std::sin(pi * cage.pole_pairs / cage.n_bars);
  return r_bar / (r_bar + r_segment / (2.0 * s * s));
}

std::vector<double> slip_conductivity(const mesh::Mesh& m, const Materials& materials) {
  std::vector<double> sigma = region_conductivity(m, materials);
  const auto on_rotor = region_on_rotor(m);
  for (std::size_t r = 0; r < m.regions.size(); ++r) {
    if (m.regions[r].kind == mesh::RegionKind::rotor_bar)
      sigma[r] = materials.bar_sigma;
    else if (!on_rotor[r])
      sigma[r] = 0.0;  // stator: laminated iron and stranded coils
  }
  return sigma;
}

std::vector<bool> slip_on_rotor(const mesh::Mesh& m) {
  std::vector<bool> on = region_on_rotor(m);
  for (std::size_t r = 0; r < m.regions.size(); ++r)
    if (m.regions[r].kind == mesh::RegionKind::rotor_bar) on[r] = true;
  return on;
}

SlipSystem assemble_slip(const mesh::Mesh& m, const mesh::Winding& w, const Materials& materials) {
  SlipSystem s;
  s.dofs = number_dofs(m);
  s.stiffness = assemble_stiffness(m, s.dofs, region_reluctivity(m, materials));
  s.rotor_mass = assemble_mass(m, s.dofs, slip_conductivity(m, materials));
  s.unit_loads = phase_loads(m, s.dofs, w);
  return s;
}

std::vector<Eigen::VectorXcd> solve_slip(const mesh::Mesh& m, const SlipSystem& s,
                                         const std::vector<SlipProblem>& problems, EddyStats& stats) {
  using Complex = std::complex<double>;
  using Matrix = Eigen::SparseMatrix<Complex>;
  const Matrix stiffness = s.stiffness.cast<Complex>(), mass = s.rotor_mass.cast<Complex>();
  Eigen::UmfPackLU<Matrix> lu;
  std::vector<Eigen::VectorXcd> out;
  stats.n_dofs = s.dofs.n_dofs;
  for (std::size_t k = 0; k < problems.size(); ++k) {
    const auto& currents = problems[k].currents;
    // M_rotor always added (also at zero slip), so every problem has the same pattern.
    const Matrix system = stiffness + Complex(0.0, problems[k].rotor_omega) * mass;
    auto t = Clock::now();
    if (k == 0) {
      lu.analyzePattern(system);
      stats.analyse_seconds += since(t);
      t = Clock::now();
    }
    lu.factorize(system);
    stats.factorize_seconds += since(t);
    if (lu.info() != Eigen::Success)
      throw SolveError("the slip-frequency system could not be factorized (UMFPACK); usual causes: a region with "
                       "no fixed potential, or a zero permeability");
    t = Clock::now();
    const Eigen::VectorXcd load =
        s.unit_loads.cast<Complex>() * Eigen::Map<const Eigen::VectorXcd>(currents.data(), Eigen::Index(currents.size()));
    const Eigen::VectorXcd x = lu.solve(load);
    stats.solve_seconds += since(t);
    Eigen::VectorXcd a = Eigen::VectorXcd::Zero(m.n_nodes());
    for (int node = 0; node < m.n_nodes(); ++node)
      if (s.dofs.dof_of_node[node] >= 0) a(node) = x(s.dofs.dof_of_node[node]);
    out.push_back(a);
  }
  return out;
}

}  // namespace tf::solver
