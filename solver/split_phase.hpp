#pragma once
// A single-phase voltage feeding two windings in parallel, one of them through an added series
// element: the winding currents from the voltage, the winding resistances and the inductance
// matrix of the field (linear field-circuit coupling: the field is linear and carries no eddy
// currents, so the FE inductances describe it completely):
//   V = (R_0 + Z_0 + j w L_00) I_0 + j w L_01 I_1
//   V = j w L_10 I_0 + (R_1 + Z_1 + j w L_11) I_1,   Z = the series element in its phase, else 0.

#include <complex>
#include <vector>

#include <Eigen/Core>

#include "solver/supply.hpp"

namespace tf::solver {

/// Impedance [ohm] of the series element at angular frequency omega [rad/s].
std::complex<double> element_impedance(SeriesElement e, double value, double omega);

/// Peak current phasors [A] of the two windings, the voltage taken as the phase reference.
/// inductance: 2 by 2 [H].
std::vector<std::complex<double>> split_phase_currents(const SplitPhase& s, double frequency,
                                                       const Eigen::Matrix2d& inductance, double element_value);

}  // namespace tf::solver
