#pragma once
// Unknowns of the discrete problem: one per node, except nodes where A = 0 is imposed and the
// rotor side of the sliding circle, whose nodes take the unknowns of the stator-side nodes they
// face after the rotor has turned by a whole number of node pitches. In a sector model
// (mesh::Symmetry) the nodes of the end cuts take the unknowns of their start-cut images too, and
// a node may carry its unknown with the sign -1: A(node) = sign_of_node * x(dof_of_node).

#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"

namespace tf::solver {

struct DofMap {
  std::vector<int> dof_of_node;          ///< #nodes; -1 where A = 0
  std::vector<signed char> sign_of_node;  ///< #nodes; +1, or -1 for images across an anti-periodic cut;
                                          ///< empty: every sign +1 (a numbering made by hand)
  int n_dofs = 0;
  /// The sign of a node's share in its unknown: A(node) = sign(node) * x(dof_of_node[node]).
  double sign(int node) const { return sign_of_node.empty() ? 1.0 : sign_of_node[static_cast<std::size_t>(node)]; }
};

/// rotor_shift: rotor-side sliding node i (at position p = rotor_first + i) is tied to stator-side
/// node (p + rotor_shift) mod n. In a sector model of n pitches per side the position is wrapped into
/// [0, n), and every wrap of an anti-periodic model flips the sign. Elements assemble with signs:
/// K_ij += s_i s_j k_e, f_i += s_i f_e (a Galerkin test function of a slave node is s times its master's).
DofMap number_dofs(const mesh::Mesh& m, int rotor_shift = 0);

/// Nodal values, #nodes by #columns, from unknowns, #dofs by #columns: s * x(dof) (A = 0 at fixed nodes).
Eigen::MatrixXd to_nodes(const DofMap& d, const Eigen::MatrixXd& x);

/// Sums nodal loads, #nodes (e.g. assembled with one unknown per node), into the unknowns with
/// their signs; fixed nodes drop out.
Eigen::VectorXd gather(const DofMap& d, const Eigen::VectorXd& nodal);

}  // namespace tf::solver
