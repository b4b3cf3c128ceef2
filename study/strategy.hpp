#pragma once
// How a case's study is solved. One dispatcher picks the strategy from the case; `run`,
// `compare` and every sweep variant go through it.

#include "input/case.hpp"

namespace tf::study {

enum class Strategy {
  superposition,  ///< linear phase angles: m unit phase fields, one factorization, steps superposed
  step_by_step,   ///< magnetostatic steps solved one by one with Newton: saturated phase angles, rotor motion
  motion_term,    ///< time-harmonic with eddy currents, the rotor's motion as sigma omega_r dA/dtheta
  slip_method,    ///< time-harmonic per rotating wave in the rotor's frame at its slip (rotors with bars)
};

/// The strategy of a case: eddy-current studies by the motion term, or by the slip method for a
/// rotor with bars (not rotationally invariant); magnetostatic studies whose rotor turns or whose
/// iron saturates (a B-H curve makes superposing unit fields wrong) step by step; the rest by
/// superposition.
Strategy choose_strategy(const input::Case& c);

/// The strategy's name in files: "superposition", "step_by_step", "motion_term", "slip_method".
const char* strategy_name(Strategy s);

/// The strategy in a few words, for summaries and reports.
const char* strategy_description(Strategy s);

}  // namespace tf::study
