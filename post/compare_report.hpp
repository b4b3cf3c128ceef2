#pragma once
// The page of `turnfield compare` (report.html beside comparison.csv): the headline numbers of
// every case side by side, B_r of each case at the same instant on one chart, their spectra in
// electrical orders, the loci of their fundamentals, each case's space-harmonic table and the
// torque statistics where the rotor turns. Built from plain data, one ComparedCase per case.

#include <complex>
#include <optional>
#include <string>
#include <vector>

#include "post/html_report.hpp"
#include "post/motion_result.hpp"
#include "post/rotation_metrics.hpp"
#include "post/space_harmonics.hpp"
#include "post/summary.hpp"

namespace tf::post {

struct ComparedCase {
  std::string name;       ///< the case file's name without extension (its result folder)
  std::string title;
  std::string study;      ///< the study kind as case files spell it
  std::string solved_by;  ///< the strategy's name
  RotationMetrics metrics;
  double winding_factor = 0.0;  ///< fundamental, phase A, star of slots
  int pole_pairs = 1;
  std::vector<double> sample_angles;  ///< mechanical [rad] on the mid-gap circle, ascending over [0, 2π)
  std::vector<double> br;             ///< B_r [T] at the sample angles at the shown step
  double shown_electrical_angle = 0.0;  ///< ωt [rad] of the shown step
  std::vector<std::complex<double>> locus;  ///< fundamental phasor c_p [T] per step, over one period
  std::vector<SpaceHarmonic> harmonics;
  std::optional<TorqueStats> torque;  ///< Arkkio's, where the rotor turns
};

/// Ratio of the minor to the major axis of the fundamental's locus. The locus of
/// c(t) = F e^{jωt} + B e^{-jωt} (the forward and backward waves of the fundamental) is an
/// ellipse with semi-axes F + B and |F − B| (derived: |c| = |F + B e^{-2jωt}|): (F − B)/(F + B),
/// 1 for a circle, 0 for a pulsating field, negative when the backward wave is the stronger.
double locus_axis_ratio(const RotationMetrics& m);

/// The comparison's data of one run whose stator field turns (r.field, r.field_rotates and
/// r.winding set); name and solved_by are left for the caller. The shown step is the one whose
/// ωt is nearest 0 (mod 360°), so every case is drawn at the same electrical instant.
ComparedCase compared_case(const RunRecord& r);

/// The comparison page: one column per case.
Page comparison_page(const std::vector<ComparedCase>& cases);

}  // namespace tf::post
