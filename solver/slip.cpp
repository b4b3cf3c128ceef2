#include "solver/slip.hpp"

#include "solver/complex_sequence.hpp"

#include <chrono>
#include <cmath>
#include <numbers>

#include <Eigen/UmfPackSupport>

#include "solver/assemble.hpp"
#include "solver/errors.hpp"
#include "solver/p1.hpp"

namespace tf::solver {
namespace {


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
  ComplexSequence lu("the slip-frequency system");
  std::vector<Eigen::VectorXcd> out;
  stats.n_dofs = s.dofs.n_dofs;
  for (const SlipProblem& problem : problems) {
    // M_rotor always added (also at zero slip), so every problem has the same pattern.
    const Matrix system = stiffness + Complex(0.0, problem.rotor_omega) * mass;
    const Eigen::VectorXcd load = s.unit_loads.cast<Complex>() *
                                  Eigen::Map<const Eigen::VectorXcd>(problem.currents.data(),
                                                                     Eigen::Index(problem.currents.size()));
    out.push_back(complex_to_nodes(s.dofs, lu.solve(system, load, stats), m.n_nodes()));
  }
  return out;
}

}  // namespace tf::solver
