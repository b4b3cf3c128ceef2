#pragma once
// Unknowns of the discrete problem: one per node, except nodes where A = 0 is imposed and the
// rotor side of the sliding circle, whose nodes take the unknowns of the stator-side nodes they
// face after the rotor has turned by a whole number of node pitches.

#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"

namespace tf::solver {

struct DofMap {
  std::vector<int> dof_of_node;  ///< #nodes; -1 where A = 0
  int n_dofs = 0;
};

/// rotor_shift: rotor-side sliding node i is tied to stator-side node (i + rotor_shift) mod n.
DofMap number_dofs(const mesh::Mesh& m, int rotor_shift = 0);

/// Nodal values, #nodes by #columns, from unknowns, #dofs by #columns (A = 0 at fixed nodes).
Eigen::MatrixXd to_nodes(const DofMap& d, const Eigen::MatrixXd& x);

}  // namespace tf::solver
