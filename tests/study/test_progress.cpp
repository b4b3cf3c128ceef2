// The terminal's progress line: the estimate of the time left is the mean pace so far times the
// items left (linear extrapolation, common practice for a run of like items).

#include <doctest/doctest.h>

#include "study/progress.hpp"

using tf::study::progress_line;

TEST_CASE("progress line: counts, and the time left once a count has run a few seconds") {
  // 10 of 40 done in 20 s: 2 s each, 30 left, 60 s.
  CHECK(progress_line("solving rotor positions", 10, 40, 20.0) ==
        "solving rotor positions 10/40, 20 s so far, about 1 min 00 s left");
  // 3 of 4 in 2 h: 40 min left.
  CHECK(progress_line("solving", 3, 4, 7200.0) == "solving 3/4, 2 h 00 min so far, about 40 min 00 s left");
  // Too early to say, nothing done yet, or all done: the count alone.
  CHECK(progress_line("solving", 5, 40, 1.0) == "solving 5/40");
  CHECK(progress_line("solving", 0, 40, 30.0) == "solving 0/40");
  CHECK(progress_line("solving", 40, 40, 30.0) == "solving 40/40");
}
