#pragma once
// Progress on a terminal: stage names and counts on one rewritten line of standard error.
// Silent when standard error is not a terminal (pipes, CI logs).

#include <string>

namespace tf::study {

class Progress {
 public:
  Progress();
  void stage(const std::string& what);
  void count(const std::string& what, int done, int total);
  void finish();

 private:
  bool on_terminal_;
  bool line_open_ = false;
};

}  // namespace tf::study
