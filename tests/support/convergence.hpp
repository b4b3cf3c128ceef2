#pragma once
// Observed orders of convergence from the errors of successive refinements.

#include <cmath>
#include <vector>

namespace tf::testing {

/// log2(e_k / e_{k+1}) for errors e_0, e_1, ... at element sizes (or steps) halved each time:
/// 2 for a second-order method, 1 for a first-order one. One rate fewer than errors.
inline std::vector<double> convergence_rates(const std::vector<double>& errors) {
  std::vector<double> rates;
  for (std::size_t k = 0; k + 1 < errors.size(); ++k) rates.push_back(std::log2(errors[k] / errors[k + 1]));
  return rates;
}

}  // namespace tf::testing
