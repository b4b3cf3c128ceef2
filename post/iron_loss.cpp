#include "post/iron_loss.hpp"

#include <cassert>
#include <cmath>
#include <complex>
#include <numbers>

namespace tf::post {

namespace {

/// The real and imaginary parts of the discrete Fourier transform of K samples, harmonics 1 .. K/2
/// as columns: X_n = sum_k x_k (cos - j sin)(2 pi n k / K).
struct FourierTable {
  Eigen::MatrixXd cos_part, sin_part;  ///< K by K/2
  explicit FourierTable(Eigen::Index k_steps) : cos_part(k_steps, k_steps / 2), sin_part(k_steps, k_steps / 2) {
    for (Eigen::Index k = 0; k < k_steps; ++k)
      for (Eigen::Index n = 1; 2 * n <= k_steps; ++n) {
        const double phase = 2 * std::numbers::pi * double(n * k % k_steps) / double(k_steps);
        cos_part(k, n - 1) = std::cos(phase);
        sin_part(k, n - 1) = -std::sin(phase);
      }
  }
};

/// Specific loss [W/kg] from the Fourier sums X_n (n = 1 .. K/2) of K samples.
double loss_of_spectrum(const solver::IronLossData& c, const Eigen::ArrayXd& re, const Eigen::ArrayXd& im,
                        Eigen::Index k_steps, double frequency) {
  double loss = 0.0;
  for (Eigen::Index n = 1; 2 * n <= k_steps; ++n) {
    // Peak amplitude: 2|X_n|/K, except the Nyquist term (2n == K), which has no mirror image.
    const double amplitude =
        (2 * n == k_steps ? 1.0 : 2.0) * std::hypot(re(n - 1), im(n - 1)) / double(k_steps);
    const double f = double(n) * frequency;
    loss += c.hysteresis * f * std::pow(amplitude, c.exponent) + c.eddy * f * f * amplitude * amplitude;
  }
  return loss;
}

}  // namespace

double specific_loss(const solver::IronLossData& c, const Eigen::VectorXd& samples, double frequency) {
  const FourierTable table(samples.size());
  const Eigen::RowVectorXd x = samples.transpose();
  return loss_of_spectrum(c, (x * table.cos_part).transpose().array(), (x * table.sin_part).transpose().array(),
                          samples.size(), frequency);
}

IronLoss iron_loss(const mesh::Mesh& m, const FluxHistory& b, const std::vector<solver::IronLossData>& per_region,
                   double stack_length) {
  assert(b.bx.rows() == m.n_triangles() && b.by.rows() == m.n_triangles() && b.bx.cols() == b.by.cols());
  assert(per_region.size() == m.regions.size());
  IronLoss out;
  out.density = Eigen::VectorXd::Zero(m.n_triangles());
  out.region_loss.assign(m.regions.size(), 0.0);
  // Every triangle's spectra at once: four products with one table instead of K^2/2 phase factors
  // per triangle and component.
  const Eigen::Index k_steps = b.bx.cols();
  const FourierTable table(k_steps);
  const Eigen::MatrixXd x_re = b.bx * table.cos_part, x_im = b.bx * table.sin_part;
  const Eigen::MatrixXd y_re = b.by * table.cos_part, y_im = b.by * table.sin_part;
  for (int t = 0; t < m.n_triangles(); ++t) {
    const int r = m.triangle_region(t);
    const solver::IronLossData& c = per_region[static_cast<std::size_t>(r)];
    if (c.density == 0.0 || (c.hysteresis == 0.0 && c.eddy == 0.0)) continue;
    const double per_kg =
        loss_of_spectrum(c, x_re.row(t).transpose().array(), x_im.row(t).transpose().array(), k_steps, b.frequency) +
        loss_of_spectrum(c, y_re.row(t).transpose().array(), y_im.row(t).transpose().array(), k_steps, b.frequency);
    out.density(t) = c.density * per_kg;
    out.region_loss[static_cast<std::size_t>(r)] += out.density(t) * std::abs(mesh::triangle_area(m, t)) * stack_length;
  }
  // A sector model stands for `copies` images of itself: regions and total are the whole machine's.
  for (double& l : out.region_loss) l *= m.symmetry.copies;
  for (double l : out.region_loss) out.total += l;
  return out;
}

}  // namespace tf::post
