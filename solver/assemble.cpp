#include "solver/assemble.hpp"

#include <numbers>
#include <string>

#include "solver/errors.hpp"
#include "solver/p1.hpp"

namespace tf::solver {
namespace {

constexpr double kMu0 = 4e-7 * std::numbers::pi;

TriangleXY vertices(const mesh::Mesh& m, int t) {
  TriangleXY xy;
  for (int i = 0; i < 3; ++i) xy.row(i) = m.nodes.row(m.triangles(t, i));
  return xy;
}

double relative_permeability(const mesh::Region& r, const Materials& mat) {
  switch (r.kind) {
    case mesh::RegionKind::stator_iron: return mat.stator_iron_mu_r;
    case mesh::RegionKind::rotor_iron: return mat.rotor_iron_mu_r;
    case mesh::RegionKind::shaft: return mat.shaft_mu_r;
    case mesh::RegionKind::rotor_sleeve: return mat.sleeve_mu_r;
    case mesh::RegionKind::magnet: return mat.magnet_mu_rec;
    // Air and copper or aluminium: the permeability of free space.
    case mesh::RegionKind::coil:
    case mesh::RegionKind::slot_air:
    case mesh::RegionKind::gap:
    case mesh::RegionKind::bore_air:
    case mesh::RegionKind::outer_air:
    case mesh::RegionKind::rotor_air:
    case mesh::RegionKind::rotor_bar: return 1.0;
  }
  return 1.0;
}

}  // namespace

std::vector<double> region_reluctivity(const mesh::Mesh& m, const Materials& materials) {
  std::vector<double> nu;
  for (const auto& r : m.regions) nu.push_back(1.0 / (kMu0 * relative_permeability(r, materials)));
  return nu;
}

Eigen::SparseMatrix<double> assemble_stiffness(const mesh::Mesh& m, const DofMap& d, const std::vector<double>& nu) {
  std::vector<Eigen::Triplet<double>> triplets;
  triplets.reserve(9 * static_cast<std::size_t>(m.n_triangles()));
  for (int t = 0; t < m.n_triangles(); ++t) {
    const Eigen::Matrix3d k = p1_stiffness(vertices(m, t), nu[m.triangle_region(t)]);
    for (int i = 0; i < 3; ++i) {
      const int di = d.dof_of_node[m.triangles(t, i)];
      if (di < 0) continue;
      const double si = d.sign(m.triangles(t, i));
      for (int j = 0; j < 3; ++j) {
        const int dj = d.dof_of_node[m.triangles(t, j)];
        if (dj >= 0) triplets.emplace_back(di, dj, si * d.sign(m.triangles(t, j)) * k(i, j));
      }
    }
  }
  Eigen::SparseMatrix<double> K(d.n_dofs, d.n_dofs);
  K.setFromTriplets(triplets.begin(), triplets.end());
  return K;
}

Eigen::VectorXd region_current_load(const mesh::Mesh& m, const DofMap& d, const std::vector<double>& j) {
  Eigen::VectorXd f = Eigen::VectorXd::Zero(d.n_dofs);
  for (int t = 0; t < m.n_triangles(); ++t) {
    const double jt = j[m.triangle_region(t)];
    if (jt == 0.0) continue;
    // int_e J phi_i = J * area / 3 for each vertex of a first-order triangle.
    const double share = jt * mesh::triangle_area(m, t) / 3.0;
    for (int i = 0; i < 3; ++i) {
      const int di = d.dof_of_node[m.triangles(t, i)];
      if (di >= 0) f(di) += d.sign(m.triangles(t, i)) * share;
    }
  }
  return f;
}

Eigen::MatrixXd phase_loads(const mesh::Mesh& m, const DofMap& d, const mesh::Winding& w) {
  const std::vector<double> area = mesh::region_areas(m);
  Eigen::MatrixXd f(d.n_dofs, w.spec.n_phases);
  for (int phase = 0; phase < w.spec.n_phases; ++phase) {
    std::vector<double> j(m.regions.size(), 0.0);
    for (const mesh::CoilSide& s : w.sides) {
      if (s.phase != phase) continue;
      const int r = mesh::find_region(m, mesh::RegionKind::coil, s.slot, s.layer);
      // A sector model holds the coil sides of its own slots; the others are their images.
      if (r < 0 && m.symmetry.copies > 1) continue;
      if (r < 0)
        throw SolveError("the winding puts a coil side in slot " + std::to_string(s.slot) + " layer " +
                         std::to_string(s.layer) + ", which the mesh does not have");
      j[r] += s.direction * s.turns / (w.spec.parallel_paths * area[r]);
    }
    f.col(phase) = region_current_load(m, d, j);
  }
  return f;
}

}  // namespace tf::solver
