#include "post/pole_map.hpp"

#include <cmath>
#include <numbers>

namespace tf::post {
namespace {

constexpr double kTwoPi = 2 * std::numbers::pi;

struct Run {
  int first, length;  // samples, cyclic
  double flux;        // r * sum B_r dtheta, signed
};

/// Runs of one sign round the circle, starting where the sign changes.
std::vector<Run> sign_runs(const Eigen::VectorXd& br, double radius) {
  const int n = static_cast<int>(br.size());
  int start = 0;
  while (start < n && (br(start) < 0) == (br((start + n - 1) % n) < 0)) ++start;
  if (start == n) return {{0, n, radius * br.sum() * kTwoPi / n}};  // one sign everywhere
  std::vector<Run> runs;
  for (int k = 0; k < n; ++k) {
    const int j = (start + k) % n;
    if (runs.empty() || (br(j) < 0) != (runs.back().flux < 0))
      runs.push_back({j, 0, 0.0});
    runs.back().length += 1;
    runs.back().flux += radius * br(j) * kTwoPi / n;
  }
  return runs;
}

/// Merges the weakest run, if below min_flux, into its two neighbours; true if one was merged.
bool merge_weakest(std::vector<Run>& runs, double min_flux) {
  if (runs.size() <= 2) return false;
  std::size_t weakest = 0;
  for (std::size_t k = 1; k < runs.size(); ++k)
    if (std::abs(runs[k].flux) < std::abs(runs[weakest].flux)) weakest = k;
  if (std::abs(runs[weakest].flux) >= min_flux) return false;
  const std::size_t n = runs.size(), before = (weakest + n - 1) % n, after = (weakest + 1) % n;
  runs[before].length += runs[weakest].length + runs[after].length;
  runs[before].flux += runs[weakest].flux + runs[after].flux;
  // Erase the higher index first so the lower stays valid.
  for (std::size_t k : {std::max(weakest, after), std::min(weakest, after)}) runs.erase(runs.begin() + k);
  return true;
}

}  // namespace

std::vector<Pole> pole_map(const Eigen::VectorXd& br, double radius, double min_share) {
  std::vector<Run> runs = sign_runs(br, radius);
  double total = 0.0;
  for (const auto& r : runs) total += std::abs(r.flux);
  while (merge_weakest(runs, min_share * total / runs.size())) {}
  const int n = static_cast<int>(br.size());
  std::vector<Pole> poles;
  for (const auto& r : runs) {
    // The angle where the run's cumulative flux reaches half its total.
    double passed = 0.0;
    int k = 0;
    for (; k < r.length; ++k) {
      passed += radius * br((r.first + k) % n) * kTwoPi / n;
      if (std::abs(passed) >= 0.5 * std::abs(r.flux)) break;
    }
    const double angle = std::fmod(kTwoPi * (r.first + k) / n, kTwoPi);
    poles.push_back({r.flux < 0, angle, std::abs(r.flux)});
  }
  return poles;
}

}  // namespace tf::post
