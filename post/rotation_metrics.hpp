#pragma once
// Field-rotation metrics of a study of K steps equally spaced over one electrical period
// (ωt_k = 2πk/K), from the fundamental phasor c(t_k) of B_r on the mid-gap circle
// (see gap_field.hpp for its convention: c = B e^{jφ} for a wave B cos(pθ - φ)).

#include <complex>
#include <vector>

namespace tf::post {

struct RotationMetrics {
  double mean_fundamental = 0.0;  ///< mean_k |c| [T]
  double amplitude_ripple = 0.0;  ///< (max_k |c| - min_k |c|) / mean_k |c|
  double mean_peak = 0.0;         ///< mean_k max_θ |B_r| [T]
  double min_peak = 0.0, max_peak = 0.0;
  double peak_ripple = 0.0;       ///< (max_k peak - min_k peak) / mean_k peak
  double expected_step_deg = 0.0;        ///< ±360°/(p K), mechanical, signed as the stronger wave turns
  double rotation_uniformity_deg = 0.0;  ///< max_k |axis step - expected step|, mechanical degrees
  double forward = 0.0;   ///< |(1/K) Σ c_k e^{-jωt_k}| [T]: counter-clockwise wave
  double backward = 0.0;  ///< |(1/K) Σ c_k e^{+jωt_k}| [T]: clockwise wave
  double backward_forward_ratio = 0.0;  ///< 0 for a perfect rotating field, 1 for a pulsating one
  double mean_distortion = 0.0;         ///< mean_k of sqrt(Σ_{n≠p} |c_n|²) / |c_p|
};

/// fundamental: c(t_k); peak: max_θ |B_r| per step; distortion per step; p: pole pairs.
RotationMetrics rotation_metrics(const std::vector<std::complex<double>>& fundamental, const std::vector<double>& peak,
                                 const std::vector<double>& distortion, int pole_pairs);

/// Mechanical axis angle [rad] of the fundamental: arg(c)/p.
double axis_angle(std::complex<double> c, int pole_pairs);

}  // namespace tf::post
