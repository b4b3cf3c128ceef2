#include "post/torque.hpp"

#include <numbers>

#include "post/arkkio_band.hpp"
#include "solver/materials.hpp"

namespace tf::post {

double arkkio_torque_static(const mesh::Mesh& m, const Eigen::VectorXd& a_nodes, double stack_length) {
  return detail::arkkio_band_torque(m, a_nodes, stack_length);
}

double circle_torque(const GapOperators& g, const Eigen::VectorXd& a_nodes, double stack_length) {
  constexpr double mu0 = solver::kMu0;
  const Eigen::VectorXd br = g.br * a_nodes, bt = g.bt * a_nodes;
  const double integral = 2 * std::numbers::pi / static_cast<double>(br.size()) * br.dot(bt);
  return stack_length * g.radius * g.radius / mu0 * integral;
}

double virtual_work_torque(double coenergy_minus, double coenergy_plus, double angle_step) {
  return (coenergy_plus - coenergy_minus) / (2 * angle_step);
}

double linear_coenergy(const Eigen::VectorXd& load, const Eigen::VectorXd& solution, double stack_length,
                       int copies) {
  return 0.5 * copies * stack_length * load.dot(solution);
}

}  // namespace tf::post
