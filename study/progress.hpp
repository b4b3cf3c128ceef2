#pragma once
// Progress on a terminal: stage names and counts on one rewritten line of standard error, with the
// time taken and an estimate of the time left once a count has run a few seconds.
// Silent when standard error is not a terminal (pipes, CI logs).

#include <chrono>
#include <string>

namespace tf::study {

/// "solving rotor positions 12/90" and, after kShowAfter seconds, ", 8 s so far, about 52 s left":
/// the time left at the mean pace of the `done` items so far.
std::string progress_line(const std::string& what, int done, int total, double elapsed_seconds);

class Progress {
 public:
  static constexpr double kShowAfter = 2.0;  ///< [s] before an estimate means anything
  Progress();
  void stage(const std::string& what);
  /// `done` of `total` items; the clock of the estimate starts at a count's first call.
  void count(const std::string& what, int done, int total);
  void finish();

 private:
  bool on_terminal_;
  bool line_open_ = false;
  std::string counting_;
  std::chrono::steady_clock::time_point count_start_;
};

}  // namespace tf::study
