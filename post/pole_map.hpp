#pragma once
// Pole map of the stator field on the mid-gap circle (README.md, "Field-rotation metrics"): the north and
// south poles and where they lie. A stator north pole is where flux leaves the bore into the gap,
// so B_r < 0 there (B_r > 0 points outwards, from rotor to stator).

#include <vector>

#include <Eigen/Core>

namespace tf::post {

struct Pole {
  bool north = false;
  double angle = 0.0;  ///< mechanical [rad], counter-clockwise from +x: where half the pole's flux is passed
  double flux = 0.0;   ///< magnitude of r ∫ B_r dθ over the pole [Wb/m]
};

/// Poles of B_r sampled at M equal angles from 0 (angles[j] = 2 pi j / M) on a circle of radius r.
/// A pole is a run of one sign; runs carrying less than `min_share` of the mean run's flux (slot
/// ripple crossing zero) are merged into their neighbours.
std::vector<Pole> pole_map(const Eigen::VectorXd& br, double radius, double min_share = 0.1);

}  // namespace tf::post
