#pragma once
// Help the command line gives beyond CLI11's own: what each study kind of `run` does, and the
// nearest command or option to a mistyped one.

#include <string>
#include <vector>

#include <CLI/CLI.hpp>

namespace tf::app {

/// The footer of `run --help`: every study kind a case file may ask for, how it is solved and what
/// it writes.
std::string study_kinds_help();

/// After CLI11 refused `args` (the words after the program's name): "did you mean ...?" lines for
/// a command or option that is not one but is close to one, naming the valid ones otherwise; ""
/// when no word is unknown.
std::string did_you_mean(const CLI::App& cli, const std::vector<std::string>& args);

}  // namespace tf::app
