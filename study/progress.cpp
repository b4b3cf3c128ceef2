#include "study/progress.hpp"

#include <cstdio>

#include <unistd.h>

namespace tf::study {

Progress::Progress() : on_terminal_(isatty(fileno(stderr)) != 0) {}

void Progress::stage(const std::string& what) {
  if (!on_terminal_) return;
  std::fprintf(stderr, "\r\033[K%s ...", what.c_str());
  std::fflush(stderr);
  line_open_ = true;
}

void Progress::count(const std::string& what, int done, int total) {
  if (!on_terminal_) return;
  std::fprintf(stderr, "\r\033[K%s %d/%d", what.c_str(), done, total);
  std::fflush(stderr);
  line_open_ = true;
}

void Progress::finish() {
  if (on_terminal_ && line_open_) std::fprintf(stderr, "\r\033[K");
  line_open_ = false;
}

}  // namespace tf::study
