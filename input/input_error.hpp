#pragma once
// The error for anything wrong in what the user gave us: a case file that is missing, not TOML,
// or holds keys and values that do not describe a machine we can model.
// The message names the file, the line, the key and what was expected; the command line prints it
// as it is and exits with status 2.

#include <stdexcept>

namespace tf::input {

struct InputError : std::runtime_error {
  using std::runtime_error::runtime_error;
};

}  // namespace tf::input
