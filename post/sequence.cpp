#include "post/sequence.hpp"

#include "solver/supply.hpp"

namespace tf::post {

SequenceComponents sequence_components(const std::vector<std::complex<double>>& phasors) {
  const int m = static_cast<int>(phasors.size());
  const double delta = solver::phase_shift(m);
  SequenceComponents s{0.0, 0.0, 0.0};
  for (int k = 0; k < m; ++k) {
    s.positive += phasors[k] * std::polar(1.0, k * delta);
    s.negative += phasors[k] * std::polar(1.0, -k * delta);
    s.zero += phasors[k];
  }
  s.positive /= double(m);
  s.negative /= double(m);
  s.zero /= double(m);
  return s;
}

Waves rotating_waves(const std::vector<std::complex<double>>& phasors,
                     const std::vector<std::complex<double>>& unit_fundamentals) {
  std::complex<double> f = 0.0, b = 0.0;
  for (std::size_t k = 0; k < phasors.size(); ++k) {
    f += phasors[k] * unit_fundamentals[k];
    b += std::conj(phasors[k]) * unit_fundamentals[k];
  }
  return {0.5 * std::abs(f), 0.5 * std::abs(b)};
}

}  // namespace tf::post
