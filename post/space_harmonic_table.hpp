#pragma once
// The space-harmonic table of a report page (the case report and the comparison share it).

#include <string>
#include <vector>

#include "post/html_report.hpp"
#include "post/space_harmonics.hpp"

namespace tf::post {

/// Orders at 0.5 % of the fundamental or more, in electrical orders: order, mechanical order,
/// amplitude [T], % of the fundamental, direction, speed [rpm], winding factor.
Table space_harmonic_table(const std::vector<SpaceHarmonic>& harmonics, const std::string& heading);

}  // namespace tf::post
