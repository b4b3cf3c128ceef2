#pragma once
// Several cases side by side: each is run into its own folder, then one table of the headline
// field metrics is printed and written as comparison.csv, and the comparison page (report.html,
// post/compare_report.hpp) beside it.

#include <filesystem>
#include <ostream>
#include <vector>

#include "input/case.hpp"

namespace tf::study {

/// Runs every case into out_dir/<case name>. Throws input::InputError, before solving anything, if two
/// cases share a name or a case's study has no turning stator field to compare (eddy currents, cogging,
/// rotor sweep).
void compare_cases(const std::vector<input::Case>& cases, const std::filesystem::path& out_dir, int field_files,
                   std::ostream& out);

}  // namespace tf::study
