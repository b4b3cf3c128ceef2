#include "post/iron_loss.hpp"

#include <cassert>
#include <cmath>
#include <complex>
#include <numbers>

namespace tf::post {

double specific_loss(const solver::IronLossData& c, const Eigen::VectorXd& samples, double frequency) {
  const Eigen::Index k_steps = samples.size();
  double loss = 0.0;
  for (Eigen::Index n = 1; 2 * n <= k_steps; ++n) {
    std::complex<double> sum = 0.0;
    for (Eigen::Index k = 0; k < k_steps; ++k)
      sum += samples(k) * std::polar(1.0, -2 * std::numbers::pi * double(n * k) / double(k_steps));
    // Peak amplitude: 2|X_n|/K, except the Nyquist term (2n == K), which has no mirror image.
    const double amplitude = (2 * n == k_steps ? 1.0 : 2.0) * std::abs(sum) / double(k_steps);
    const double f = double(n) * frequency;
    loss += c.hysteresis * f * std::pow(amplitude, c.exponent) + c.eddy * f * f * amplitude * amplitude;
  }
  return loss;
}

IronLoss iron_loss(const mesh::Mesh& m, const FluxHistory& b, const std::vector<solver::IronLossData>& per_region,
                   double stack_length) {
  assert(b.bx.rows() == m.n_triangles() && b.by.rows() == m.n_triangles() && b.bx.cols() == b.by.cols());
  assert(per_region.size() == m.regions.size());
  IronLoss out;
  out.density = Eigen::VectorXd::Zero(m.n_triangles());
  out.region_loss.assign(m.regions.size(), 0.0);
  for (int t = 0; t < m.n_triangles(); ++t) {
    const int r = m.triangle_region(t);
    const solver::IronLossData& c = per_region[static_cast<std::size_t>(r)];
    if (c.density == 0.0 || (c.hysteresis == 0.0 && c.eddy == 0.0)) continue;
    const double per_kg = specific_loss(c, b.bx.row(t).transpose(), b.frequency) +
                          specific_loss(c, b.by.row(t).transpose(), b.frequency);
    out.density(t) = c.density * per_kg;
    out.region_loss[static_cast<std::size_t>(r)] += out.density(t) * std::abs(mesh::triangle_area(m, t)) * stack_length;
  }
  // A sector model stands for `copies` images of itself: regions and total are the whole machine's.
  for (double& l : out.region_loss) l *= m.symmetry.copies;
  for (double l : out.region_loss) out.total += l;
  return out;
}

}  // namespace tf::post
