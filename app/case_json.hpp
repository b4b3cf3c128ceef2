#pragma once
#include <string>

#include "app/case.hpp"

namespace tf::app {

/// The case as read (SI units, angles in degrees), as a JSON object for summary.json and --json output.
std::string case_to_json(const Case& c);

}  // namespace tf::app
