#include "post/torque.hpp"

#include <numbers>
#include <stdexcept>
#include <string>
#include <vector>

#include "post/arkkio_band.hpp"
#include "solver/materials.hpp"
#include "solver/p1.hpp"

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

double local_virtual_work_torque(const mesh::Mesh& m, const Eigen::VectorXd& a_nodes, double stack_length) {
  std::vector<char> on_circle(static_cast<std::size_t>(m.n_nodes()), 0);
  for (int node : m.sliding.rotor_nodes) on_circle[static_cast<std::size_t>(node)] = 1;
  if (m.sliding.rotor_end >= 0) on_circle[static_cast<std::size_t>(m.sliding.rotor_end)] = 1;
  double rate = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    // Only rotor-side triangles hold rotor-side circle nodes; their other vertices turn.
    solver::TriangleXY xy, v;
    Eigen::Vector3d a;
    int still = 0;
    for (int i = 0; i < 3; ++i) {
      const int node = m.triangles(t, i);
      xy.row(i) = m.nodes.row(node);
      a(i) = a_nodes(node);
      const bool held = on_circle[static_cast<std::size_t>(node)] != 0;
      still += held;
      v.row(i) << (held ? 0.0 : -xy(i, 1)), (held ? 0.0 : xy(i, 0));  // d(x, y)/dtheta of a turn
    }
    if (still == 0 || still == 3) continue;  // turned rigidly, or not at all: no change of energy
    const mesh::Region& region = m.regions[static_cast<std::size_t>(m.triangle_region(t))];
    if (region.kind != mesh::RegionKind::gap)
      throw std::logic_error("local virtual work: region " + region.name + " touches the sliding circle; expected gap air");
    rate += solver::p1_energy_rate(xy, a, v, 1.0 / solver::kMu0);
  }
  return -m.symmetry.copies * stack_length * rate;
}

double virtual_work_torque(double coenergy_minus, double coenergy_plus, double angle_step) {
  return (coenergy_plus - coenergy_minus) / (2 * angle_step);
}

double linear_coenergy(const Eigen::VectorXd& load, const Eigen::VectorXd& solution, double stack_length,
                       int copies) {
  return 0.5 * copies * stack_length * load.dot(solution);
}

}  // namespace tf::post
