// A bounded fuzz run of the case reader: mutations of the bundled cases (byte flips, deleted and
// duplicated lines, numbers scaled by 1e+-6 or sign-flipped) must each be read or refused with an
// InputError; any other exception, a crash, or (in the sanitizer build) a sanitizer report fails.

#include <doctest/doctest.h>

#include <algorithm>
#include <cstdint>
#include <filesystem>
#include <fstream>
#include <random>
#include <regex>
#include <sstream>
#include <string>
#include <vector>

#include "input/case_reader.hpp"
#include "input/input_error.hpp"

namespace fs = std::filesystem;

namespace {

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> lines;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) lines.push_back(line);
  return lines;
}

std::string joined(const std::vector<std::string>& lines) {
  std::string out;
  for (const auto& l : lines) out += l + '\n';
  return out;
}

/// One mutation of `text`, chosen by `kind` (0 .. 4), at places drawn from `rng`.
std::string mutate(const std::string& text, int kind, std::mt19937& rng) {
  std::vector<std::string> lines = lines_of(text);
  auto pick = [&](std::size_t n) { return std::uniform_int_distribution<std::size_t>(0, n - 1)(rng); };
  switch (kind) {
    case 0: {  // a flipped byte
      std::string t = text;
      t[pick(t.size())] ^= static_cast<char>(1u << pick(8));
      return t;
    }
    case 1:  // a deleted line
      lines.erase(lines.begin() + static_cast<long>(pick(lines.size())));
      return joined(lines);
    case 2: {  // a duplicated line
      const std::size_t i = pick(lines.size());
      lines.insert(lines.begin() + static_cast<long>(i), lines[i]);
      return joined(lines);
    }
    default: {  // a number scaled by 1e+-6 (kind 3) or sign-flipped (kind 4)
      static const std::regex number(R"((^|[=\[, ])(-?[0-9]+(\.[0-9]*)?([eE][-+]?[0-9]+)?))");
      std::string& line = lines[pick(lines.size())];
      std::smatch m;
      if (!std::regex_search(line, m, number)) return joined(lines);
      const std::string value = m[2].str();
      const std::string changed = kind == 3 ? value + (pick(2) ? "e6" : "e-6")
                                            : (value[0] == '-' ? value.substr(1) : "-" + value);
      // "12e6" is an integer-looking float in TOML only when the value had no exponent already.
      line.replace(static_cast<std::size_t>(m.position(2)), value.size(),
                   kind == 3 && value.find_first_of("eE") != std::string::npos ? value : changed);
      return joined(lines);
    }
  }
}

}  // namespace

TEST_CASE("fuzz: 5000 mutated case files are each read or refused with an InputError, never anything else") {
  std::vector<std::pair<std::string, std::string>> bases;
  for (const auto& entry : fs::directory_iterator(fs::path(TF_SOURCE_DIR) / "cases")) {
    if (entry.path().extension() != ".toml") continue;
    std::ifstream in(entry.path());
    std::stringstream text;
    text << in.rdbuf();
    bases.emplace_back(entry.path().filename().string(), text.str());
  }
  std::sort(bases.begin(), bases.end());  // the same inputs on every machine
  REQUIRE(bases.size() >= 10);
  std::mt19937 rng(20261204);  // fixed seed: a failure names its input number and can be replayed
  int read = 0, refused = 0;
  constexpr int kInputs = 5000;
  for (int n = 0; n < kInputs; ++n) {
    const auto& [name, text] = bases[static_cast<std::size_t>(n) % bases.size()];
    const std::string mutated = mutate(text, n % 5, rng);
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
