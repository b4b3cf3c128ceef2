#pragma once
// The case echoed as JSON (summary.json, reports, `winding --json`).

#include <string>

#include "input/case.hpp"

namespace tf::input {

/// The case as read (SI units, angles in degrees), as a JSON object for summary.json and --json output.
std::string case_to_json(const Case& c);

}  // namespace tf::input
