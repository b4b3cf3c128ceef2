#pragma once
#include <ostream>

#include "input/case.hpp"

namespace tf::app {

/// The slot table, the winding factors up to the 13th electrical order and, order by order, whether
/// the resultant field of the m phases with the case's currents turns forward, backward, pulsates or
/// cancels, and why (post/resultant_waves.hpp); as text or JSON.
void print_winding(const input::Case& c, bool as_json, std::ostream& out);

}  // namespace tf::app
