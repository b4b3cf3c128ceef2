// Note on tolerances: every doctest::Approx with a non-zero target carries .scale(0), which makes
// its epsilon purely relative; doctest's default adds 1 to the scale, an absolute slack that would
// hide errors in quantities well below 1 (tesla, webers).
#define DOCTEST_CONFIG_IMPLEMENT_WITH_MAIN
#include <doctest/doctest.h>
