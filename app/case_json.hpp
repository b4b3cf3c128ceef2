#pragma once
#include <string>

#include "app/case.hpp"
#include "app/drive.hpp"

namespace tf::app {

/// The case as read (SI units, angles in degrees), as a JSON object for summary.json and --json output.
std::string case_to_json(const Case& c);

/// The currents as used (phasors, sequence components, a sized series element) and the
/// inductance matrix of the field, as a JSON object.
std::string drive_to_json(const solver::Supply& resolved, int n_phases, const DriveReport& report);

}  // namespace tf::app
