// A bounded fuzz run of the case reader: mutations of the bundled cases (byte flips, deleted and
// duplicated lines, numbers scaled by 1e+-6 or sign-flipped) must each be read or refused with an
// InputError; any other exception, a crash, or (in the sanitizer build) a sanitizer report fails.

#include <doctest/doctest.h>

#include <random>
#include <string>

#include "input/case_reader.hpp"
#include "input/input_error.hpp"
#include "support/case_mutations.hpp"

TEST_CASE("fuzz: 5000 mutated case files are each read or refused with an InputError, never anything else") {
  const auto bases = tf::testing::bundled_cases(std::string(TF_SOURCE_DIR) + "/cases");
  REQUIRE(bases.size() >= 10);
  std::mt19937 rng(20261204);  // fixed seed: a failure names its input number and can be replayed
  int read = 0, refused = 0;
  constexpr int kInputs = 5000;
  for (int n = 0; n < kInputs; ++n) {
    const auto& [name, text] = bases[static_cast<std::size_t>(n) % bases.size()];
    const std::string mutated = tf::testing::mutate(text, n % 5, rng);
    INFO("input " << n << ", a mutation of " << name << " (kind " << n % 5 << ")");
    try {
      tf::input::read_case_text("fuzz_" + name, mutated);
      ++read;
    } catch (const tf::input::InputError& e) {
      ++refused;
      CHECK(std::string(e.what()).find("fuzz_" + name) != std::string::npos);  // the message names the file
    } catch (const std::exception& e) {
      FAIL_CHECK("not an InputError: " << e.what());
    }
  }
  MESSAGE(read << " read, " << refused << " refused");
  CHECK(read + refused == kInputs);
  CHECK(refused > kInputs / 10);  // the mutations do reach the checks
}
