#include "solver/dofs.hpp"

namespace tf::solver {

DofMap number_dofs(const mesh::Mesh& m, int rotor_shift) {
  DofMap d;
  constexpr int unset = -2;
  d.dof_of_node.assign(m.n_nodes(), unset);
  for (int node : m.outer_nodes) d.dof_of_node[node] = -1;
  const auto& rotor = m.sliding.rotor_nodes;
  for (int node : rotor) d.dof_of_node[node] = -3;  // filled in below
  for (const auto& [node, partner] : m.ties) d.dof_of_node[node] = -3;
  for (int node = 0; node < m.n_nodes(); ++node)
    if (d.dof_of_node[node] == unset) d.dof_of_node[node] = d.n_dofs++;
  const int n = static_cast<int>(rotor.size());
  for (int i = 0; i < n; ++i) {
    const int facing = m.sliding.stator_nodes[((i + rotor_shift) % n + n) % n];
    d.dof_of_node[rotor[i]] = d.dof_of_node[facing];
  }
  for (const auto& [node, partner] : m.ties) d.dof_of_node[node] = d.dof_of_node[partner];
  return d;
}

Eigen::MatrixXd to_nodes(const DofMap& d, const Eigen::MatrixXd& x) {
  Eigen::MatrixXd a = Eigen::MatrixXd::Zero(static_cast<Eigen::Index>(d.dof_of_node.size()), x.cols());
  for (std::size_t node = 0; node < d.dof_of_node.size(); ++node)
    if (d.dof_of_node[node] >= 0) a.row(static_cast<Eigen::Index>(node)) = x.row(d.dof_of_node[node]);
  return a;
}

}  // namespace tf::solver
