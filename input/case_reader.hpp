#pragma once
// Reading a case file (TOML) into a Case. The keys, their units and ranges are listed in
// case_reader.cpp beside the code that reads them; cases/ holds complete examples.

#include <string>

#include "input/case.hpp"

namespace tf::input {

/// Reads and validates the case file at `path` (kept exactly as given, for messages and Case::path).
/// Throws InputError when the file is missing or unreadable, is not valid TOML, holds an unknown
/// or misspelt key, lacks a required key, has a value of the wrong type or out of range, or
/// describes a geometry or winding that does not fit together. The message names file and line.
Case read_case(const std::string& path);

/// The same for a case held in memory (a sweep's variant); `path` names it in messages, and line
/// numbers are those of `text`.
Case read_case_text(const std::string& path, const std::string& text);

/// The case with `steps` steps instead of its own (from the command line), checked again.
/// Throws InputError for studies without steps to change, or when the new count does not fit.
void override_steps(Case& c, int steps);

}  // namespace tf::input
