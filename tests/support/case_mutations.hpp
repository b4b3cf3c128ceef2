#pragma once
// Mutations of case files for the fuzz runs: byte flips, deleted and duplicated lines, numbers
// scaled by 1e+-6 or sign-flipped; the bundled cases to start from.

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <random>
#include <regex>
#include <sstream>
#include <string>
#include <utility>
#include <vector>

namespace tf::testing {

inline std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> lines;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) lines.push_back(line);
  return lines;
}

inline std::string joined(const std::vector<std::string>& lines) {
  std::string out;
  for (const auto& l : lines) out += l + '\n';
  return out;
}

/// One mutation of `text`, chosen by `kind` (0 .. 4), at places drawn from `rng`.
inline std::string mutate(const std::string& text, int kind, std::mt19937& rng) {
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

/// The case files in cases/ as (file name, text), sorted by name: the same inputs on every machine.
inline std::vector<std::pair<std::string, std::string>> bundled_cases(const std::filesystem::path& cases) {
  std::vector<std::pair<std::string, std::string>> out;
  for (const auto& entry : std::filesystem::directory_iterator(cases)) {
    if (entry.path().extension() != ".toml") continue;
    std::ifstream in(entry.path());
    std::stringstream text;
    text << in.rdbuf();
    out.emplace_back(entry.path().filename().string(), text.str());
  }
  std::sort(out.begin(), out.end());
  return out;
}

}  // namespace tf::testing
