#pragma once
// What `turnfield check` prints besides "valid": the derived geometry a designer checks by eye.

#include <ostream>

#include "input/case.hpp"

namespace tf::app {

/// Air gap, slot and pole pitch, tooth widths, slot and coil areas, conductors per slot, Carter's
/// factor, q, the model that will be solved (sector and its symmetry) and the synchronous speed.
void print_derived_geometry(const input::Case& c, std::ostream& out);

}  // namespace tf::app
