#pragma once
// Wall-clock stage timing, the one clock every layer reports its seconds with.

#include <chrono>
#include <type_traits>
#include <string>
#include <utility>
#include <vector>

namespace tf::solver {

class Stopwatch {
 public:
  using Clock = std::chrono::steady_clock;

  /// Seconds [s] since construction or the last restart.
  double seconds() const { return std::chrono::duration<double>(Clock::now() - start_).count(); }

  /// Seconds since the last restart, then restarts.
  double lap() {
    const double s = seconds();
    start_ = Clock::now();
    return s;
  }

  void restart() { start_ = Clock::now(); }

 private:
  Clock::time_point start_ = Clock::now();
};

/// Runs `stage` and appends (name, its wall time [s]) to `times`; returns what the stage returns.
template <class Stage>
auto timed(std::vector<std::pair<std::string, double>>& times, const std::string& name, Stage stage) {
  Stopwatch clock;
  if constexpr (std::is_void_v<decltype(stage())>) {
    stage();
    times.emplace_back(name, clock.seconds());
  } else {
    auto result = stage();
    times.emplace_back(name, clock.seconds());
    return result;
  }
}

}  // namespace tf::solver
