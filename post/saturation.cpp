#include "post/saturation.hpp"

#include <algorithm>
#include <numeric>

#include <fmt/format.h>

namespace tf::post {

std::vector<bool> linear_iron_regions(const solver::RegionCoefficients& k) {
  std::vector<bool> out;
  for (std::size_t i = 0; i < k.nu.size(); ++i) {
    const double mu_r = 1.0 / (solver::kMu0 * k.nu[i]);
    out.push_back(mu_r >= 10.0 && !k.curve[i]);
  }
  return out;
}

double area_percentile(const mesh::Mesh& m, const Eigen::VectorXd& values, int region, double percentile) {
  std::vector<std::pair<double, double>> value_area;
  double total = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t)
    if (m.triangle_region(t) == region) {
      const double a = std::abs(mesh::triangle_area(m, t));
      value_area.emplace_back(values(t), a);
      total += a;
    }
  if (value_area.empty()) return 0.0;
  std::sort(value_area.begin(), value_area.end());
  double below = 0.0;
  for (const auto& [v, a] : value_area) {
    below += a;
    // A relative hair of slack: areas that add up to the percentile exactly must count as reaching it.
    if (below >= percentile * total * (1 - 1e-12)) return v;
  }
  return value_area.back().first;
}

double area_fraction_above(const mesh::Mesh& m, const Eigen::VectorXd& values, int region, double threshold) {
  double above = 0.0, total = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t)
    if (m.triangle_region(t) == region) {
      const double a = std::abs(mesh::triangle_area(m, t));
      total += a;
      if (values(t) > threshold) above += a;
    }
  return total > 0.0 ? above / total : 0.0;
}

SaturationWatch::SaturationWatch(const mesh::Mesh& m, std::vector<bool> watched, SaturationLimits limits)
    : m_(&m), watched_(std::move(watched)), limits_(limits) {
  for (std::size_t i = 0; i < watched_.size(); ++i)
    if (watched_[i]) worst_.push_back({static_cast<int>(i), -1.0, 0.0, ""});
}

void SaturationWatch::add_step(const Eigen::VectorXd& b_magnitude, const std::string& when) {
  for (RegionSaturation& r : worst_) {
    const double fraction = area_fraction_above(*m_, b_magnitude, r.region, limits_.threshold);
    const double high = area_percentile(*m_, b_magnitude, r.region, limits_.percentile);
    // The worst step is the one with most area above the threshold; ties by the higher percentile.
    if (fraction > r.fraction_above || (fraction == r.fraction_above && high > r.percentile_b))
      r = {r.region, fraction, high, when};
  }
}

std::vector<std::string> SaturationWatch::warnings(const std::string& steps_checked, const std::string& remedy) const {
  std::vector<std::string> out;
  for (const RegionSaturation& r : worst_) {
    if (r.fraction_above <= limits_.min_fraction) continue;
    out.push_back(fmt::format(
        "{}: {:.3g} % of its area above {:.3g} T in linear iron (up to {:.3g} T at the {:.3g}th percentile, {}; {} "
        "checked): steel saturates near {:.3g} T, so the results overstate the field there; {}",
        m_->regions[static_cast<std::size_t>(r.region)].name, 100 * r.fraction_above, limits_.threshold,
        r.percentile_b, 100 * limits_.percentile, r.when, steps_checked, limits_.threshold, remedy));
  }
  return out;
}

}  // namespace tf::post
