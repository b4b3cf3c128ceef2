#pragma once
// Several cases side by side: each is run into its own folder, then one table of the headline
// field metrics is printed and written as comparison.csv.

#include <filesystem>
#include <ostream>
#include <vector>

#include "input/case.hpp"

namespace tf::study {

/// Runs every case into out_dir/<case name>; throws input::InputError if two cases share a name.
void compare_cases(const std::vector<input::Case>& cases, const std::filesystem::path& out_dir, int field_files,
                   std::ostream& out);

}  // namespace tf::study
