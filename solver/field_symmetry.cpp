#include "solver/field_symmetry.hpp"

#include <algorithm>
#include <cmath>

namespace tf::solver {
namespace {

/// The sign s with to = s * from for every current (to 1e-9 of the largest); nullopt if neither.
/// With no current at all both signs hold; +1 is returned first.
std::vector<double> current_signs(const std::vector<double>& from, const std::vector<double>& to) {
  if (from.size() != to.size()) return {};
  double largest = 0.0;
  for (std::size_t k = 0; k < from.size(); ++k) largest = std::max({largest, std::abs(from[k]), std::abs(to[k])});
  std::vector<double> signs;
  for (double s : {1.0, -1.0}) {
    bool holds = true;
    for (std::size_t k = 0; k < from.size() && holds; ++k) holds = std::abs(to[k] - s * from[k]) <= 1e-9 * largest;
    if (holds) signs.push_back(s);
  }
  return signs;
}

/// Whether the unknowns of `to` can be those of `from`, each times one sign, such that every node's
/// potential changes by its side's sign: sign_to(node) D(dof) = side(node) sign_from(node).
bool numberings_agree(const std::vector<bool>& rotor_side, const DofMap& from, const DofMap& to, SideSigns s) {
  if (from.dof_of_node != to.dof_of_node) return false;
  std::vector<double> unknown_sign(static_cast<std::size_t>(from.n_dofs), 0.0);
  for (std::size_t node = 0; node < from.dof_of_node.size(); ++node) {
    const int dof = from.dof_of_node[node];
    if (dof < 0) continue;
    const int n = static_cast<int>(node);
    const double wanted = (rotor_side[node] ? s.rotor : s.stator) * from.sign(n) * to.sign(n);
    double& d = unknown_sign[static_cast<std::size_t>(dof)];
    if (d == 0.0) d = wanted;
    else if (d != wanted) return false;
  }
  return true;
}

}  // namespace

std::optional<SideSigns> field_symmetry(const std::vector<bool>& rotor_side, bool magnets, const StepSources& from,
                                        const StepSources& to) {
  for (double stator : current_signs(from.currents, to.currents))
    for (double rotor : {1.0, -1.0}) {
      if (magnets && rotor < 0) continue;  // the magnets do not reverse
      if (numberings_agree(rotor_side, from.dofs, to.dofs, {stator, rotor})) return SideSigns{stator, rotor};
    }
  return std::nullopt;
}

Eigen::VectorXd with_side_signs(const std::vector<bool>& rotor_side, const Eigen::VectorXd& a_nodes, SideSigns s) {
  Eigen::VectorXd out = a_nodes;
  for (Eigen::Index node = 0; node < out.size(); ++node)
    out(node) *= rotor_side[static_cast<std::size_t>(node)] ? s.rotor : s.stator;
  return out;
}

}  // namespace tf::solver
