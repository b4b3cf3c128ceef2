#pragma once
// A rotor-motion study (synchronous, cogging or rotor sweep): magnetostatic solutions with the
// rotor turned step by step, nonlinear iron where the case gives B-H curves.

#include <ostream>

#include "app/case.hpp"
#include "app/run_case.hpp"

namespace tf::app {

/// True when the case is solved step by step by the motion solver: a rotor that turns, or iron
/// that saturates (a B-H curve makes superposing unit phase fields wrong).
bool solved_step_by_step(const Case& c);

/// Solves every step and writes steps.csv, gap_field.csv, harmonics.csv, poles.csv, torque.csv,
/// inductances.csv, field files with the rotor drawn where it stands, and summary.json.
void run_motion_case(const Case& c, const RunOptions& options, std::ostream& out);

}  // namespace tf::app
