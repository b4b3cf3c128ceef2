#include "solver/bh_curve.hpp"
#include "solver/materials.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>
#include <numbers>
#include <sstream>
#include <stdexcept>

namespace tf::solver {
namespace {


std::string point(std::size_t i) { return "point " + std::to_string(i + 1) + ": "; }

std::string number(double x) {
  std::ostringstream s;
  s << x;
  return s.str();
}

// Slopes dH/dB at the points (Fritsch and Carlson 1980): three-point parabola slopes, then every
// interval's pair scaled into the disc alpha^2 + beta^2 <= 9, which is sufficient for a monotone
// cubic. The end slopes come from the one-sided three-point formula, replaced by the secant when
// that formula is not in (0, 3 * secant] (it would give a flat start, nu = 0, or overshoot).
std::vector<double> monotone_slopes(const std::vector<double>& x, const std::vector<double>& y) {
  const std::size_t n = x.size();
  std::vector<double> dx(n - 1), secant(n - 1), d(n);
  for (std::size_t k = 0; k + 1 < n; ++k) {
    dx[k] = x[k + 1] - x[k];
    secant[k] = (y[k + 1] - y[k]) / dx[k];
  }
  for (std::size_t k = 1; k + 1 < n; ++k)
    d[k] = (dx[k] * secant[k - 1] + dx[k - 1] * secant[k]) / (dx[k - 1] + dx[k]);
  auto end_slope = [](double h0, double h1, double s0, double s1) {
    const double three_point = ((2 * h0 + h1) * s0 - h0 * s1) / (h0 + h1);
    return (three_point > 0 && three_point <= 3 * s0) ? three_point : s0;
  };
  d[0] = end_slope(dx[0], dx[1], secant[0], secant[1]);
  d[n - 1] = end_slope(dx[n - 2], dx[n - 3], secant[n - 2], secant[n - 3]);
  for (std::size_t k = 0; k + 1 < n; ++k) {
    const double alpha = d[k] / secant[k], beta = d[k + 1] / secant[k];
    const double r2 = alpha * alpha + beta * beta;
    if (r2 > 9.0) {
      const double tau = 3.0 / std::sqrt(r2);
      d[k] = tau * alpha * secant[k];
      d[k + 1] = tau * beta * secant[k];
    }
  }
  return d;
}

}  // namespace

std::optional<std::string> BhCurve::table_problem(const std::vector<double>& h, const std::vector<double>& b) {
  if (h.size() != b.size())
    return "the table has " + std::to_string(h.size()) + " H values but " + std::to_string(b.size()) +
           " B values; expected pairs (H, B)";
  if (h.size() < 3) return "the table has " + std::to_string(h.size()) + " points; expected at least 3";
  for (std::size_t i = 0; i < h.size(); ++i) {
    if (!std::isfinite(h[i]) || !std::isfinite(b[i])) return point(i) + "H and B must be finite numbers";
    if (h[i] < 0 || b[i] < 0) return point(i) + "H and B must not be negative";
    if (h[i] == 0 && b[i] != 0) return point(i) + "B must be 0 where H is 0";
    if (i > 0 && h[i] <= h[i - 1])
      return point(i) + "H = " + number(h[i]) + " A/m is not above H = " + number(h[i - 1]) +
             " A/m of the previous point; H must increase strictly";
    if (i > 0 && b[i] <= b[i - 1])
      return point(i) + "B = " + number(b[i]) + " T is not above B = " + number(b[i - 1]) +
             " T of the previous point; B must increase strictly";
    if (h[i] > 0 && b[i] < kMu0 * h[i] * (1 - 1e-9))
      return point(i) + "B/H = " + number(b[i] / h[i]) + " H/m is below mu0 = " + number(kMu0) +
             " H/m; a relative permeability of at least 1 is expected";
  }
  return std::nullopt;
}

BhCurve::BhCurve(std::vector<double> h, std::vector<double> b, double stacking_factor) {
  if (const auto problem = table_problem(h, b)) throw std::invalid_argument("B-H curve: " + *problem);
  if (!(stacking_factor > 0 && stacking_factor <= 1))
    throw std::invalid_argument("B-H curve: stacking factor " + number(stacking_factor) + " is not in (0, 1]");
  if (h.front() > 0) {
    h.insert(h.begin(), 0.0);
    b.insert(b.begin(), 0.0);
  }
  for (std::size_t i = 0; i < h.size(); ++i) b[i] = stacking_factor * b[i] + (1 - stacking_factor) * kMu0 * h[i];
  h_ = std::move(h);
  b_ = std::move(b);

  const std::vector<double> d = monotone_slopes(b_, h_);
  energy_at_point_.assign(b_.size(), 0.0);
  for (std::size_t k = 0; k + 1 < b_.size(); ++k) {
    // Hermite cubic in power form of s = B - b_k.
    const double dx = b_[k + 1] - b_[k], secant = (h_[k + 1] - h_[k]) / dx;
    const std::array<double, 4> c{h_[k], d[k], (3 * secant - 2 * d[k] - d[k + 1]) / dx,
                                  (d[k] + d[k + 1] - 2 * secant) / (dx * dx)};
    cubic_.push_back(c);
    energy_at_point_[k + 1] =
        energy_at_point_[k] + dx * (c[0] + dx * (c[1] / 2 + dx * (c[2] / 3 + dx * c[3] / 4)));
  }
}

int BhCurve::piece_of_b(double b) const {
  assert(b >= 0);
  if (b >= b_.back()) return -1;
  return static_cast<int>(std::upper_bound(b_.begin(), b_.end(), b) - b_.begin()) - 1;
}

double BhCurve::h_of_b(double b) const {
  if (b < 0) return -h_of_b(-b);
  const int k = piece_of_b(b);
  if (k < 0) return h_.back() + (b - b_.back()) / kMu0;
  const auto& c = cubic_[static_cast<std::size_t>(k)];
  const double s = b - b_[static_cast<std::size_t>(k)];
  return c[0] + s * (c[1] + s * (c[2] + s * c[3]));
}

double BhCurve::b_of_h(double h) const {
  if (h < 0) return -b_of_h(-h);
  if (h >= h_.back()) return b_.back() + kMu0 * (h - h_.back());
  const auto k = static_cast<std::size_t>(std::upper_bound(h_.begin(), h_.end(), h) - h_.begin()) - 1;
  const auto& c = cubic_[k];
  // H(s) is non-decreasing on [0, width]: Newton steps kept inside a shrinking bracket.
  double lo = 0, hi = b_[k + 1] - b_[k], s = hi * (h - h_[k]) / (h_[k + 1] - h_[k]);
  for (int it = 0; it < 60; ++it) {
    const double value = c[0] + s * (c[1] + s * (c[2] + s * c[3])) - h;
    const double slope = c[1] + s * (2 * c[2] + 3 * s * c[3]);
    (value > 0 ? hi : lo) = s;
    double next = slope > 0 ? s - value / slope : 0.5 * (lo + hi);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (std::abs(next - s) <= 1e-15 * (b_[k] + hi)) return b_[k] + next;
    s = next;
  }
  return b_[k] + s;
}

BhCurve::Reluctivity BhCurve::reluctivity(double b_squared) const {
  assert(b_squared >= 0);
  const double b = std::sqrt(b_squared);
  const int k = piece_of_b(b);
  double nu = 0, dnu_db = 0;
  if (k < 0) {
    const double h = h_.back() + (b - b_.back()) / kMu0;
    nu = h / b;
    dnu_db = (b / kMu0 - h) / b_squared;
  } else if (k == 0) {
    // H(0) = 0 on the first piece, so H/B = c1 + c2 B + c3 B^2 without cancellation near B = 0.
    const auto& c = cubic_[0];
    nu = c[1] + b * (c[2] + b * c[3]);
    dnu_db = c[2] + 2 * b * c[3];
  } else {
    const auto& c = cubic_[static_cast<std::size_t>(k)];
    const double s = b - b_[static_cast<std::size_t>(k)];
    const double h = c[0] + s * (c[1] + s * (c[2] + s * c[3]));
    const double dh_db = c[1] + s * (2 * c[2] + 3 * s * c[3]);
    nu = h / b;
    dnu_db = (dh_db * b - h) / b_squared;
  }
  return {nu, b > 0 ? dnu_db / (2 * b) : 0.0};
}

double BhCurve::energy_density(double b) const {
  b = std::abs(b);
  const int k = piece_of_b(b);
  if (k < 0) {
    const double s = b - b_.back();
    return energy_at_point_.back() + s * (h_.back() + s / (2 * kMu0));
  }
  const auto& c = cubic_[static_cast<std::size_t>(k)];
  const double s = b - b_[static_cast<std::size_t>(k)];
  return energy_at_point_[static_cast<std::size_t>(k)] + s * (c[0] + s * (c[1] / 2 + s * (c[2] / 3 + s * c[3] / 4)));
}

double BhCurve::coenergy_density(double b) const { return b * h_of_b(b) - energy_density(b); }

BhCurve sampled_arctan_law(double js, double mu_ri, int n_points, double h_max) {
  const double h_knee = 2 * js / (std::numbers::pi * (mu_ri - 1) * kMu0);
  if (!(js > 0 && mu_ri > 1 && n_points >= 3 && h_max > h_knee / 100))
    throw std::invalid_argument("sampled_arctan_law: expected Js > 0, mu_ri > 1, n_points >= 3, h_max > h_knee/100");
  std::vector<double> h{0.0}, b{0.0};
  const double log_lo = std::log(h_knee / 100), log_hi = std::log(h_max);
  for (int i = 0; i < n_points - 1; ++i) {
    const double hi = std::exp(log_lo + (log_hi - log_lo) * i / (n_points - 2));
    h.push_back(hi);
    b.push_back(kMu0 * hi + 2 * js / std::numbers::pi * std::atan(hi / h_knee));
  }
  return BhCurve(std::move(h), std::move(b));
}

}  // namespace tf::solver
