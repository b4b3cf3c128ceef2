#include "study/progress.hpp"

#include <cmath>
#include <cstdio>

#include <fmt/format.h>
#include <unistd.h>

namespace tf::study {
namespace {

/// "8 s", "2 min 05 s", "1 h 02 min".
std::string duration(double seconds) {
  const long s = std::lround(std::max(0.0, seconds));
  if (s < 60) return fmt::format("{} s", s);
  if (s < 3600) return fmt::format("{} min {:02} s", s / 60, s % 60);
  return fmt::format("{} h {:02} min", s / 3600, (s % 3600) / 60);
}

}  // namespace

std::string progress_line(const std::string& what, int done, int total, double elapsed_seconds) {
  std::string line = fmt::format("{} {}/{}", what, done, total);
  if (done <= 0 || done >= total || elapsed_seconds < Progress::kShowAfter) return line;
  const double left = elapsed_seconds / done * (total - done);
  return line + fmt::format(", {} so far, about {} left", duration(elapsed_seconds), duration(left));
}

Progress::Progress() : on_terminal_(isatty(fileno(stderr)) != 0) {}

void Progress::stage(const std::string& what) {
  if (!on_terminal_) return;
  std::fprintf(stderr, "\r\033[K%s ...", what.c_str());
  std::fflush(stderr);
  line_open_ = true;
  counting_.clear();
}

void Progress::count(const std::string& what, int done, int total) {
  if (!on_terminal_) return;
  const auto now = std::chrono::steady_clock::now();
  if (what != counting_) {
    counting_ = what;
    count_start_ = now;
  }
  const double elapsed = std::chrono::duration<double>(now - count_start_).count();
  std::fprintf(stderr, "\r\033[K%s", progress_line(what, done, total, elapsed).c_str());
  std::fflush(stderr);
  line_open_ = true;
}

void Progress::finish() {
  if (on_terminal_ && line_open_) std::fprintf(stderr, "\r\033[K");
  line_open_ = false;
  counting_.clear();
}

}  // namespace tf::study
