#pragma once
#include <ostream>

#include "input/case.hpp"

namespace tf::app {

/// The slot table and the winding factors up to the 13th electrical order, as text or JSON.
void print_winding(const input::Case& c, bool as_json, std::ostream& out);

}  // namespace tf::app
