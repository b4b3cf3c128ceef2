#include "solver/eddy.hpp"

#include "solver/complex_sequence.hpp"

#include <chrono>
#include <numbers>

#include <Eigen/UmfPackSupport>

#include "solver/assemble.hpp"
#include "solver/errors.hpp"
#include "solver/p1.hpp"

namespace tf::solver {
namespace {


TriangleXY vertices(const mesh::Mesh& m, int t) {
  TriangleXY xy;
  for (int i = 0; i < 3; ++i) xy.row(i) = m.nodes.row(m.triangles(t, i));
  return xy;
}

/// Element mass int phi_i phi_j = area/12 (1 + delta_ij), and motion int phi_i dphi_j/dtheta
/// with dphi_j/dtheta = x dphi_j/dy - y dphi_j/dx and int phi_i x = area/12 (x_1 + x_2 + x_3 + x_i).
void element_matrices(const TriangleXY& xy, Eigen::Matrix3d& mass, Eigen::Matrix3d& motion) {
  double twice_area = 0.0;
  const auto g = p1_gradients(xy, twice_area);
  const double area = 0.5 * twice_area;
  const Eigen::Vector2d sum = xy.colwise().sum().transpose();
  for (int i = 0; i < 3; ++i) {
    const double x_int = area / 12 * (sum(0) + xy(i, 0)), y_int = area / 12 * (sum(1) + xy(i, 1));
    for (int j = 0; j < 3; ++j) {
      mass(i, j) = area / 12 * (i == j ? 2.0 : 1.0);
      motion(i, j) = x_int * g(j, 1) - y_int * g(j, 0);
    }
  }
}

bool moves(mesh::RegionKind k) {
  return k == mesh::RegionKind::rotor_iron || k == mesh::RegionKind::shaft || k == mesh::RegionKind::rotor_sleeve;
}

}  // namespace

std::vector<double> region_conductivity(const mesh::Mesh& m, const Materials& mat) {
  std::vector<double> sigma;
  for (const auto& r : m.regions) {
    switch (r.kind) {
      case mesh::RegionKind::stator_iron: sigma.push_back(mat.stator_iron_sigma); break;
      case mesh::RegionKind::rotor_iron: sigma.push_back(mat.rotor_iron_sigma); break;
      case mesh::RegionKind::shaft: sigma.push_back(mat.shaft_sigma); break;
      case mesh::RegionKind::rotor_sleeve: sigma.push_back(mat.sleeve_sigma); break;
      // Air, coils (whose current is given), magnets (taken as non-conducting) and rotor bars: the
      // motion term here is exact only for smooth rotors, so a cage waits for the slip-frequency method.
      default: sigma.push_back(0.0);
    }
  }
  return sigma;
}

std::vector<bool> region_on_rotor(const mesh::Mesh& m) {
  std::vector<bool> on;
  for (const auto& r : m.regions) on.push_back(moves(r.kind));
  return on;
}

EddySystem assemble_eddy(const mesh::Mesh& m, const mesh::Winding& w, const Materials& materials) {
  // The motion term sigma omega_r dA/dtheta couples a node to its neighbours along the arc, and
  // phasors of a rotating field are not simply periodic across a cut (each harmonic turns the
  // phase by its own angle), so a sector's cut conditions are not plain signs here.
  if (m.symmetry.copies > 1)
    throw SolveError("eddy-current studies need the full model: a sector's cut conditions are not a sign for "
                     "time-harmonic fields of every space order");
  EddySystem s;
  s.dofs = number_dofs(m);
  s.stiffness = assemble_stiffness(m, s.dofs, region_reluctivity(m, materials));
  s.unit_loads = phase_loads(m, s.dofs, w);
  const auto sigma = region_conductivity(m, materials);
  const auto rotor = region_on_rotor(m);
  std::vector<Eigen::Triplet<double>> mass, motion;
  for (int t = 0; t < m.n_triangles(); ++t) {
    const int r = m.triangle_region(t);
    if (sigma[r] == 0.0) continue;
    Eigen::Matrix3d me, ce;
    element_matrices(vertices(m, t), me, ce);
    for (int i = 0; i < 3; ++i) {
      const int di = s.dofs.dof_of_node[m.triangles(t, i)];
      if (di < 0) continue;
      for (int j = 0; j < 3; ++j) {
        const int dj = s.dofs.dof_of_node[m.triangles(t, j)];
        if (dj < 0) continue;
        mass.emplace_back(di, dj, sigma[r] * me(i, j));
        if (rotor[r]) motion.emplace_back(di, dj, sigma[r] * ce(i, j));
      }
    }
  }
  s.mass.resize(s.dofs.n_dofs, s.dofs.n_dofs);
  s.mass.setFromTriplets(mass.begin(), mass.end());
  s.motion.resize(s.dofs.n_dofs, s.dofs.n_dofs);
  s.motion.setFromTriplets(motion.begin(), motion.end());
  return s;
}

std::vector<EddySolution> solve_eddy(const mesh::Mesh& m, const EddySystem& s,
                                     const std::vector<std::complex<double>>& currents, double frequency,
                                     const std::vector<double>& rotor_speeds, EddyStats& stats) {
  using Complex = std::complex<double>;
  using Matrix = Eigen::SparseMatrix<Complex>;
  const double omega = 2 * std::numbers::pi * frequency;
  const Eigen::VectorXcd load =
      s.unit_loads.cast<Complex>() * Eigen::Map<const Eigen::VectorXcd>(currents.data(), Eigen::Index(currents.size()));
  // The same structure at every speed (M and C always included), so one symbolic analysis serves all.
  const Matrix base = s.stiffness.cast<Complex>() + Complex(0.0, omega) * s.mass.cast<Complex>();
  const Matrix motion = s.motion.cast<Complex>();
  ComplexSequence lu("the time-harmonic system");
  std::vector<EddySolution> out;
  stats.n_dofs = s.dofs.n_dofs;
  for (double speed : rotor_speeds) {
    const Matrix system = base + Complex(speed, 0.0) * motion;
    out.push_back({speed, complex_to_nodes(s.dofs, lu.solve(system, load, stats), m.n_nodes())});
  }
  return out;
}

}  // namespace tf::solver
