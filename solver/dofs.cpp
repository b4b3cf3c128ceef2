#include "solver/dofs.hpp"

#include <cassert>

namespace tf::solver {
namespace {

/// A node that takes another node's unknown, times a sign.
struct Link {
  int master = -1;
  int sign = 1;
};

/// Follows links to a node with its own unknown (or a fixed one), multiplying the signs.
void resolve(int node, std::vector<Link>& links, DofMap& d, std::vector<char>& done) {
  if (done[node]) return;
  const Link link = links[node];
  assert(link.master >= 0 && link.master != node);
  resolve(link.master, links, d, done);
  d.dof_of_node[node] = d.dof_of_node[link.master];
  d.sign_of_node[node] = static_cast<signed char>(link.sign * d.sign_of_node[link.master]);
  done[node] = 1;
}

}  // namespace

DofMap number_dofs(const mesh::Mesh& m, int rotor_shift) {
  DofMap d;
  const int n_nodes = m.n_nodes();
  d.dof_of_node.assign(n_nodes, -1);
  d.sign_of_node.assign(n_nodes, 1);
  std::vector<Link> links(n_nodes);
  const auto& rotor = m.sliding.rotor_nodes;
  const int n = static_cast<int>(rotor.size());
  const bool anti = m.symmetry.anti_periodic;
  for (int i = 0; i < n; ++i) {
    // Position on the stator side; floor division counts the wraps round the sector.
    const int p = m.sliding.rotor_first + i + rotor_shift;
    const int wraps = p >= 0 ? p / n : -((-p + n - 1) / n);
    links[rotor[i]] = {m.sliding.stator_nodes[p - wraps * n], anti && wraps % 2 != 0 ? -1 : 1};
  }
  const int cut_sign = anti ? -1 : 1;
  std::vector<char> done(n_nodes, 0);
  for (int node : m.outer_nodes) done[node] = 1;  // A = 0 wins over any link
  for (const auto& [node, image] : m.symmetry.cut_pairs) {
    // The centre lies on both cuts of a rotor sector: its own image. Anti-periodic, A = -A there: 0.
    if (node == image) done[node] = anti ? 1 : done[node];
    else links[node] = {image, cut_sign};
  }
  for (const auto& [node, partner] : m.ties) links[node] = {partner, 1};
  for (int node = 0; node < n_nodes; ++node)
    if (!done[node] && links[node].master < 0) {
      d.dof_of_node[node] = d.n_dofs++;
      done[node] = 1;
    }
  for (int node = 0; node < n_nodes; ++node) resolve(node, links, d, done);
  return d;
}

Eigen::MatrixXd to_nodes(const DofMap& d, const Eigen::MatrixXd& x) {
  Eigen::MatrixXd a = Eigen::MatrixXd::Zero(static_cast<Eigen::Index>(d.dof_of_node.size()), x.cols());
  for (std::size_t node = 0; node < d.dof_of_node.size(); ++node)
    if (d.dof_of_node[node] >= 0)
      a.row(static_cast<Eigen::Index>(node)) = d.sign(static_cast<int>(node)) * x.row(d.dof_of_node[node]);
  return a;
}

Eigen::VectorXd gather(const DofMap& d, const Eigen::VectorXd& nodal) {
  Eigen::VectorXd f = Eigen::VectorXd::Zero(d.n_dofs);
  for (std::size_t node = 0; node < d.dof_of_node.size(); ++node)
    if (d.dof_of_node[node] >= 0) f(d.dof_of_node[node]) += d.sign(static_cast<int>(node)) * nodal(static_cast<Eigen::Index>(node));
  return f;
}

}  // namespace tf::solver
