#pragma once
// Load vector of a surface current K(theta) [A/m] along +z on a closed ring of nodes:
// f_i = integral over the ring of K phi_i ds, by two-point Gauss quadrature on each chord.

#include <cmath>
#include <functional>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "solver/dofs.hpp"

namespace tf::testing {

inline Eigen::VectorXd sheet_load(const mesh::Mesh& m, const solver::DofMap& d, const std::vector<int>& ring,
                                  const std::function<double(double theta)>& k) {
  Eigen::VectorXd f = Eigen::VectorXd::Zero(d.n_dofs);
  const double g = 0.5 / std::sqrt(3.0);
  const std::size_t n = ring.size();
  for (std::size_t i = 0; i < n; ++i) {
    const int a = ring[i], b = ring[(i + 1) % n];
    const Eigen::Vector2d pa = m.nodes.row(a), pb = m.nodes.row(b);
    const double length = (pb - pa).norm();
    for (double s : {0.5 - g, 0.5 + g}) {
      const Eigen::Vector2d x = (1 - s) * pa + s * pb;
      const double w = 0.5 * length * k(std::atan2(x(1), x(0)));
      if (d.dof_of_node[a] >= 0) f(d.dof_of_node[a]) += w * (1 - s);
      if (d.dof_of_node[b] >= 0) f(d.dof_of_node[b]) += w * s;
    }
  }
  return f;
}

}  // namespace tf::testing
