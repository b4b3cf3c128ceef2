#pragma once
// The error for anything wrong in what the user gave us: a case file that is missing, not TOML,
// or holds keys and values that do not describe a machine we can model.
// The message names the file, the line, the key and what was expected; the command line prints it
// as it is and exits with status 2.

#include <stdexcept>
#include <string>

namespace tf::input {

struct InputError : std::runtime_error {
  explicit InputError(const std::string& what, int line = 0) : std::runtime_error(what), line(line) {}
  int line = 0;  ///< the line of the file the message names; 0 when it names none
};

}  // namespace tf::input
