#pragma once
// An eddy-current study: one time-harmonic solution per rotor speed.

#include <ostream>

#include "app/case.hpp"
#include "app/run_case.hpp"

namespace tf::app {

/// Solves the case at each rotor speed and writes torque_speed.csv, field_NNNN.vtu (one per speed,
/// up to study.field_files), field.pvd and summary.json; prints a short summary to `out`.
void run_eddy_case(const Case& c, const RunOptions& options, std::ostream& out);

}  // namespace tf::app
