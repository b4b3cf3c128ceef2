#pragma once
#include <stdexcept>

namespace tf::solver {

/// A solve failed; the message says what usually causes it.
struct SolveError : std::runtime_error {
  using std::runtime_error::runtime_error;
};

}  // namespace tf::solver
