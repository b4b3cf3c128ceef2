#include "sweep/variants.hpp"

#include <algorithm>
#include <cstdint>
#include <sstream>

#include <fmt/format.h>
#include <toml++/toml.h>

#include "input/input_error.hpp"
#include "input/toml_fields.hpp"

namespace tf::sweep {
namespace {

/// Where a key's value stands in the base case's text: line (0-based) and columns [begin, end).
struct ValueSpot {
  std::size_t line = 0, begin = 0, end = 0;
};

std::vector<std::string> split_lines(const std::string& text) {
  std::vector<std::string> lines;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) lines.push_back(line);
  return lines;
}

/// toml++ gives 1-based columns with an exclusive end; values in a base case are on one line
/// (read_sweep_file refused tables and lists).
ValueSpot spot_of(const toml::table& base, const std::string& key) {
  const toml::source_region r = base.at_path(key).node()->source();
  return {r.begin.line - 1, r.begin.column - 1, r.end.column - 1};
}

/// The base text with each spot's value replaced; right to left within a line keeps columns true.
std::string replaced(const std::vector<std::string>& lines, std::vector<std::pair<ValueSpot, std::string>> edits,
                     bool ends_with_newline) {
  std::sort(edits.begin(), edits.end(), [](const auto& a, const auto& b) {
    return a.first.line != b.first.line ? a.first.line < b.first.line : a.first.begin > b.first.begin;
  });
  std::vector<std::string> out = lines;
  for (const auto& [spot, literal] : edits) out[spot.line].replace(spot.begin, spot.end - spot.begin, literal);
  std::string text;
  for (std::size_t i = 0; i < out.size(); ++i) text += out[i] + (i + 1 < out.size() || ends_with_newline ? "\n" : "");
  return text;
}

/// Per variant, the index of each varied key's value.
std::vector<std::vector<std::size_t>> combinations(const SweepFile& s) {
  std::vector<std::vector<std::size_t>> all;
  if (s.combine == Combine::zip) {
    for (std::size_t i = 0; i < s.varied.front().values.size(); ++i) all.emplace_back(s.varied.size(), i);
    return all;
  }
  std::vector<std::size_t> pick(s.varied.size(), 0);
  while (true) {
    all.push_back(pick);
    std::size_t k = pick.size();  // odometer: the last key turns fastest
    while (k > 0 && ++pick[k - 1] == s.varied[k - 1].values.size()) pick[--k] = 0;
    if (k == 0) return all;
  }
}

}  // namespace

std::string variant_id(const std::string& case_text) {
  std::uint64_t h = 14695981039346656037ull;  // FNV-1a offset basis and prime (64 bit)
  for (const unsigned char ch : case_text) h = (h ^ ch) * 1099511628211ull;
  return fmt::format("v{:016x}", h);
}

std::vector<Variant> expand_variants(const SweepFile& s) {
  const toml::table base = input::parse_document(s.base_case, s.base_text).root;
  const std::vector<std::string> lines = split_lines(s.base_text);
  const bool newline = !s.base_text.empty() && s.base_text.back() == '\n';
  std::vector<std::pair<ValueSpot, std::string>> fixed;
  for (const auto& f : s.fixed) fixed.emplace_back(spot_of(base, f.key), f.value);
  std::vector<ValueSpot> spots;
  for (const auto& v : s.varied) spots.push_back(spot_of(base, v.key));

  std::vector<Variant> variants;
  for (const auto& pick : combinations(s)) {
    Variant v;
    v.index = variants.size();
    auto edits = fixed;
    for (std::size_t k = 0; k < pick.size(); ++k) {
      v.inputs.push_back(s.varied[k].values[pick[k]]);
      edits.emplace_back(spots[k], v.inputs.back());
    }
    v.case_text = replaced(lines, edits, newline);
    v.id = variant_id(v.case_text);
    for (const auto& earlier : variants)
      if (earlier.id == v.id)
        throw input::InputError(fmt::format("{}: variants {} and {} are the same case ({}); each must differ", s.path,
                                     earlier.index + 1, v.index + 1, describe_inputs(s, v)));
    variants.push_back(std::move(v));
  }
  return variants;
}

std::string describe_inputs(const SweepFile& s, const Variant& v) {
  std::vector<std::string> parts;
  for (std::size_t k = 0; k < s.varied.size(); ++k) parts.push_back(s.varied[k].key + " = " + v.inputs[k]);
  return fmt::format("{}", fmt::join(parts, ", "));
}

bool in_shard(std::size_t index, const Shard& shard) {
  return static_cast<int>(index % static_cast<std::size_t>(shard.n)) == shard.k - 1;
}

std::string shard_text(const Shard& shard) { return fmt::format("{}/{}", shard.k, shard.n); }

}  // namespace tf::sweep
