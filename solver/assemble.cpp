#include "solver/assemble.hpp"

#include <cassert>
#include <string>

#include "solver/errors.hpp"

namespace tf::solver {

TriangleXY triangle_xy(const mesh::Mesh& m, int t) {
  TriangleXY xy;
  for (int i = 0; i < 3; ++i) xy.row(i) = m.nodes.row(m.triangles(t, i));
  return xy;
}

ElementDofs element_dofs(const mesh::Mesh& m, const DofMap& d, int t) {
  ElementDofs e;
  for (int i = 0; i < 3; ++i) {
    const int node = m.triangles(t, i);
    e.dofs(i) = d.dof_of_node[static_cast<std::size_t>(node)];
    e.signs(i) = d.sign(node);
  }
  return e;
}

Eigen::SparseMatrix<double> assemble_matrix(const mesh::Mesh& m, const DofMap& d,
                                            const std::vector<double>& coefficient, ElementKernel kernel) {
  assert(coefficient.size() == m.regions.size());
  std::vector<Eigen::Triplet<double>> triplets;
  triplets.reserve(9 * static_cast<std::size_t>(m.n_triangles()));
  for (int t = 0; t < m.n_triangles(); ++t) {
    const double c = coefficient[static_cast<std::size_t>(m.triangle_region(t))];
    if (c == 0.0) continue;
    const Eigen::Matrix3d k = kernel(triangle_xy(m, t), c);
    const ElementDofs e = element_dofs(m, d, t);
    for (int i = 0; i < 3; ++i) {
      if (e.dofs(i) < 0) continue;
      for (int j = 0; j < 3; ++j)
        if (e.dofs(j) >= 0) triplets.emplace_back(e.dofs(i), e.dofs(j), e.signs(i) * e.signs(j) * k(i, j));
    }
  }
  Eigen::SparseMatrix<double> matrix(d.n_dofs, d.n_dofs);
  matrix.setFromTriplets(triplets.begin(), triplets.end());
  return matrix;
}

Eigen::SparseMatrix<double> assemble_stiffness(const mesh::Mesh& m, const DofMap& d, const std::vector<double>& nu) {
  return assemble_matrix(m, d, nu, p1_stiffness);
}

Eigen::VectorXd region_current_load(const mesh::Mesh& m, const DofMap& d, const std::vector<double>& j) {
  Eigen::VectorXd f = Eigen::VectorXd::Zero(d.n_dofs);
  for (int t = 0; t < m.n_triangles(); ++t) {
    const double jt = j[static_cast<std::size_t>(m.triangle_region(t))];
    if (jt == 0.0) continue;
    // int_e J phi_i = J * area / 3 for each vertex of a first-order triangle.
    const double share = jt * mesh::triangle_area(m, t) / 3.0;
    const ElementDofs e = element_dofs(m, d, t);
    for (int i = 0; i < 3; ++i)
      if (e.dofs(i) >= 0) f(e.dofs(i)) += e.signs(i) * share;
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
