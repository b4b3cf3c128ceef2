#include "solver/slip.hpp"

#include <cmath>
#include <numbers>

namespace tf::solver {

double end_ring_factor(const Cage& cage, const EndRings& rings) {
  const double pi = std::numbers::pi;
  const double r_bar = cage.stack_length / (cage.bar_sigma * cage.bar_area);
  const double r_segment = pi * rings.mean_diameter / (cage.n_bars * rings.conductivity * rings.area);
  const double s = std::sin(pi * cage.pole_pairs / cage.n_bars);
  return r_bar / (r_bar + r_segment / (2.0 * s * s));
}

}  // namespace tf::solver
