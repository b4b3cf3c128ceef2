#pragma once
// The air-gap field's space harmonics as a designer reads them: per order, its amplitude, the
// waves turning forward and backward, its speed and the winding factor of that order.
//
// Order n (mechanical; electrical nu = n / p) of the gap field, sampled at K equal steps over one
// electrical period t_k = k / (K f): c_n(t_k). A wave B cos(n theta - omega t - phi) turning forward
// (counter-clockwise) at omega / n has c_n(t) = B e^{j(omega t + phi)} (post/gap_field.hpp), so the
// temporal DFT at +1 and -1 times the supply frequency splits every order into its forward and
// backward waves:  F_n = |(1/K) sum_k c_n(t_k) e^{-j omega t_k}|,  B_n = |(1/K) sum_k c_n(t_k) e^{+j omega t_k}|.
// A space harmonic of electrical order nu turns at n_s / nu, i.e. omega / n mechanical
// (definitional; docs/references.md §6).

#include <filesystem>
#include <string>
#include <vector>

#include "mesh/winding.hpp"
#include "post/study.hpp"

namespace tf::post {

struct SpaceHarmonic {
  int order = 0;                 ///< mechanical n
  double electrical_order = 0;   ///< nu = n / p
  double amplitude = 0.0;        ///< mean over the steps of |c_n| [T]
  double relative = 0.0;         ///< amplitude / the fundamental's
  double forward = 0.0;          ///< the forward-turning wave [T]
  double backward = 0.0;         ///< the backward-turning wave [T]
  double speed_rpm = 0.0;        ///< of the stronger wave, signed (counter-clockwise positive)
  double winding_factor = 0.0;   ///< phase A's, by the star of slots, at order n
};

/// Every order n = 1 .. the largest sampled, for steps that cover one electrical period of
/// `frequency` [Hz] in equal steps (a phase-angle study).
std::vector<SpaceHarmonic> space_harmonics(const StudyResult& r, const mesh::Winding& w, double frequency);

/// "forward", "backward", "pulsating" where neither wave is 10 times the other (common practice
/// for the threshold), or "none" below 1e-9 of the fundamental (round-off).
std::string direction(const SpaceHarmonic& h);

/// space_harmonics.csv: order, electrical_order, amplitude_T, relative_to_fundamental, forward_T,
/// backward_T, direction, speed_rpm, winding_factor.
void write_space_harmonics(const std::filesystem::path& path, const std::vector<SpaceHarmonic>& table);

}  // namespace tf::post
