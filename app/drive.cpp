#include "app/drive.hpp"

#include <algorithm>
#include <cmath>

#include "post/sequence.hpp"
#include "post/study.hpp"
#include "solver/flux_linkage.hpp"
#include "solver/split_phase.hpp"

namespace tf::app {
namespace {

/// Smaller over larger of the two rotating waves: 0 for a circular field, 1 for a pulsating one,
/// whichever way it turns.
double ellipticity(const std::vector<std::complex<double>>& currents, const std::vector<std::complex<double>>& unit) {
  const post::Waves w = post::rotating_waves(currents, unit);
  const double big = std::max(w.forward, w.backward);
  return big > 0.0 ? std::min(w.forward, w.backward) / big : 1.0;
}

/// The capacitance [F] between 1 nF and 10 mF with the most nearly circular field: a scan on a
/// logarithmic grid, then golden-section refinement around the best grid point.
double best_capacitance(const solver::SplitPhase& s, double frequency, const Eigen::Matrix2d& L,
                        const std::vector<std::complex<double>>& unit) {
  auto cost = [&](double log_c) {
    return ellipticity(solver::split_phase_currents(s, frequency, L, std::pow(10.0, log_c)), unit);
  };
  const double lo = -9.0, hi = -2.0;
  const int n = 700;
  int best = 0;
  for (int i = 1; i <= n; ++i)
    if (cost(lo + (hi - lo) * i / n) < cost(lo + (hi - lo) * best / n)) best = i;
  double a = lo + (hi - lo) * std::max(0, best - 1) / n, b = lo + (hi - lo) * std::min(n, best + 1) / n;
  const double g = 0.5 * (std::sqrt(5.0) - 1.0);
  for (int it = 0; it < 60; ++it) {
    const double x1 = b - g * (b - a), x2 = a + g * (b - a);
    if (cost(x1) < cost(x2))
      b = x2;
    else
      a = x1;
  }
  return std::pow(10.0, 0.5 * (a + b));
}

}  // namespace

solver::Supply resolve_supply(const Case& c, const mesh::Mesh& m, const mesh::Winding& w,
                              const solver::PhaseFields& fields, DriveReport& report) {
  report.inductance = solver::inductance_matrix(m, w, fields, c.stack_length);
  solver::Supply s = c.supply;
  if (s.kind != solver::SupplyKind::split_phase) return s;
  const Eigen::Matrix2d L = report.inductance.topLeftCorner<2, 2>();
  report.element_value = s.split.element_value;
  if (s.split.element == solver::SeriesElement::capacitor && s.split.element_value == 0.0) {
    const auto unit = post::unit_fundamentals(m, fields, w.spec.pole_pairs());
    report.element_value = best_capacitance(s.split, s.frequency, L, unit);
    report.element_sized = true;
  }
  s.phasors = solver::split_phase_currents(s.split, s.frequency, L, report.element_value);
  return s;
}

}  // namespace tf::app
