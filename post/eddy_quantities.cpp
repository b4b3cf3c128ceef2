#include "post/eddy_quantities.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <numbers>

#include "post/arkkio_band.hpp"
#include "solver/flux_linkage.hpp"
#include "solver/p1.hpp"
#include "solver/materials.hpp"

namespace tf::post {
namespace {

using Complex = std::complex<double>;
using solver::kMu0;

struct Element {
  solver::TriangleXY xy;
  Eigen::Vector3cd a;
  Eigen::Vector2cd grad;  ///< (dA/dx, dA/dy), constant on a first-order triangle
  double area;
};

Element element(const mesh::Mesh& m, const Eigen::VectorXcd& a, int t) {
  Element e;
  for (int i = 0; i < 3; ++i) {
    e.xy.row(i) = m.nodes.row(m.triangles(t, i));
    e.a(i) = a(m.triangles(t, i));
  }
  double twice_area = 0.0;
  const auto g = solver::p1_gradients(e.xy, twice_area);
  e.area = 0.5 * twice_area;
  e.grad = g.transpose().cast<Complex>() * e.a;
  return e;
}

/// Calls f(E, dA/dtheta, weight) at the three edge midpoints (exact for the quadratic integrands here).
template <class F>
void at_midpoints(const Element& e, double omega, double rotor_speed, F f) {
  for (int k = 0; k < 3; ++k) {
    const int i = k, j = (k + 1) % 3;
    const Eigen::Vector2d x = 0.5 * (e.xy.row(i) + e.xy.row(j)).transpose();
    const Complex a = 0.5 * (e.a(i) + e.a(j));
    const Complex dtheta = x(0) * e.grad(1) - x(1) * e.grad(0);
    f(Complex(0.0, omega) * a + rotor_speed * dtheta, dtheta, e.area / 3.0);
  }
}

}  // namespace

double arkkio_torque(const mesh::Mesh& m, const Eigen::VectorXcd& a, double stack_length) {
  return detail::arkkio_band_torque(m, a, stack_length);
}

std::vector<double> region_losses(const mesh::Mesh& m, const Eigen::VectorXcd& a, const std::vector<double>& sigma,
                                  const std::vector<bool>& on_rotor, double omega, double rotor_speed,
                                  double stack_length) {
  std::vector<double> loss(m.regions.size(), 0.0);
  for (int t = 0; t < m.n_triangles(); ++t) {
    const int r = m.triangle_region(t);
    if (sigma[r] == 0.0) continue;
    at_midpoints(element(m, a, t), omega, on_rotor[r] ? rotor_speed : 0.0,
                 [&](Complex e, Complex, double w) { loss[r] += 0.5 * sigma[r] * std::norm(e) * w; });
  }
  for (double& l : loss) l *= stack_length;
  return loss;
}

double lorentz_torque(const mesh::Mesh& m, const Eigen::VectorXcd& a, const std::vector<double>& sigma,
                      const std::vector<bool>& on_rotor, double omega, double rotor_speed, double stack_length) {
  double torque = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    const int r = m.triangle_region(t);
    if (sigma[r] == 0.0 || !on_rotor[r]) continue;
    at_midpoints(element(m, a, t), omega, rotor_speed, [&](Complex e, Complex dtheta, double w) {
      torque -= 0.5 * sigma[r] * std::real(e * std::conj(dtheta)) * w;
    });
  }
  return torque * stack_length;
}

std::vector<std::complex<double>> flux_linkages(const mesh::Mesh& m, const mesh::Winding& w, const Eigen::VectorXcd& a,
                                                double stack_length) {
  Eigen::MatrixXd parts(a.size(), 2);
  parts.col(0) = a.real();
  parts.col(1) = a.imag();
  const Eigen::MatrixXd psi = solver::flux_linkage(m, w, parts, stack_length);
  std::vector<Complex> out;
  for (Eigen::Index k = 0; k < psi.rows(); ++k) out.push_back({psi(k, 0), psi(k, 1)});
  return out;
}

}  // namespace tf::post

namespace tf::post {

SpeedResult evaluate_speed(const SpeedInputs& in, double rotor_speed, const Eigen::VectorXcd& a) {
  const mesh::Mesh& m = *in.mesh;
  const double omega = 2 * std::numbers::pi * in.frequency;
  SpeedResult r;
  r.rotor_speed = rotor_speed;
  r.slip = 1.0 - in.winding->spec.pole_pairs() * rotor_speed / omega;
  r.torque = arkkio_torque(m, a, in.stack_length);
  r.torque_lorentz = lorentz_torque(m, a, in.sigma, in.on_rotor, omega, rotor_speed, in.stack_length);
  r.region_loss = region_losses(m, a, in.sigma, in.on_rotor, omega, rotor_speed, in.stack_length);
  for (std::size_t k = 0; k < m.regions.size(); ++k) (in.on_rotor[k] ? r.rotor_loss : r.stator_loss) += r.region_loss[k];
  r.flux_linkage = flux_linkages(m, *in.winding, a, in.stack_length);
  for (std::size_t k = 0; k < r.flux_linkage.size(); ++k) {
    const Complex v = Complex(0.0, omega) * r.flux_linkage[k];
    r.emf_rms.push_back(std::abs(v) / std::sqrt(2.0));
    r.input_power += 0.5 * std::real(v * std::conj(in.currents[k]));
  }
  r.rotor_loss_balance = r.input_power - r.stator_loss - r.torque * rotor_speed;
  return r;
}

}  // namespace tf::post

namespace tf::post {

double skin_depth(double omega, double mu_r, double sigma) {
  if (omega * sigma <= 0.0) return std::numeric_limits<double>::infinity();
  return std::sqrt(2.0 / (omega * kMu0 * mu_r * sigma));
}

std::vector<SkinDepth> skin_depths(const mesh::Mesh& m, const std::vector<double>& sigma,
                                   const std::vector<double>& mu_r, const std::vector<bool>& on_rotor,
                                   double frequency, const std::vector<double>& rotor_speeds, int pole_pairs) {
  const double omega = 2 * std::numbers::pi * frequency;
  double slip_omega = 0.0;
  for (double w : rotor_speeds) slip_omega = std::max(slip_omega, std::abs(omega - pole_pairs * w));
  const std::size_t n = m.regions.size();
  std::vector<double> depth(n, INFINITY), r_min(n, INFINITY), r_max(n, 0.0), longest(n, 0.0);
  for (std::size_t r = 0; r < n; ++r) {
    const double w = on_rotor[r] ? slip_omega : omega;
    if (sigma[r] > 0.0 && w > 0.0) depth[r] = skin_depth(w, mu_r[r], sigma[r]);
  }
  for (int t = 0; t < m.n_triangles(); ++t)
    for (int i = 0; i < 3; ++i) {
      const double radius = m.nodes.row(m.triangles(t, i)).norm();
      r_min[m.triangle_region(t)] = std::min(r_min[m.triangle_region(t)], radius);
      r_max[m.triangle_region(t)] = std::max(r_max[m.triangle_region(t)], radius);
    }
  // The currents crowd into the skin facing the gap: the rotor's outside, the stator's inside.
  for (int t = 0; t < m.n_triangles(); ++t) {
    const int r = m.triangle_region(t);
    if (sigma[r] <= 0.0) continue;
    Eigen::Vector2d c = Eigen::Vector2d::Zero();
    double edge = 0.0;
    for (int i = 0; i < 3; ++i) {
      c += m.nodes.row(m.triangles(t, i)).transpose() / 3.0;
      edge = std::max(edge, (m.nodes.row(m.triangles(t, i)) - m.nodes.row(m.triangles(t, (i + 1) % 3))).norm());
    }
    const double from_surface = on_rotor[r] ? r_max[r] - c.norm() : c.norm() - r_min[r];
    if (from_surface <= depth[r]) longest[r] = std::max(longest[r], edge);
  }
  std::vector<SkinDepth> out;
  for (std::size_t r = 0; r < n; ++r) {
    if (sigma[r] <= 0.0) continue;
    const double w = on_rotor[r] ? slip_omega : omega;
    out.push_back({m.regions[r].name, depth[r], w / (2 * std::numbers::pi), longest[r], longest[r] > depth[r] / 3.0});
  }
  return out;
}

}  // namespace tf::post
