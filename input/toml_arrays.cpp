#include "input/toml_arrays.hpp"

#include <cmath>
#include <set>
#include <string>

#include <fmt/format.h>

namespace tf::input {
namespace {

double number(const Fields& f, const toml::node& node, std::string_view key, const std::string& index,
              const RealRange& range) {
  const std::optional<double> v = number_value(node);
  if (!v) f.fail_at(node, key, index, "not a number", describe(range));
  if (!std::isfinite(*v) || !within(*v, range)) f.fail_at(node, key, index, "out of range", describe(range));
  return *v;
}

int whole(const Fields& f, const toml::node& node, std::string_view key, const std::string& index, long long lo,
          long long hi, std::string_view what) {
  const auto* i = node.as_integer();
  if (!i || i->get() < lo || i->get() > hi)
    f.fail_at(node, key, index, fmt::format("not a valid {}", what), fmt::format("an integer from {} to {}", lo, hi));
  return static_cast<int>(i->get());
}

std::string text(const Fields& f, const toml::node& node, std::string_view key, const std::string& index,
                 const std::vector<std::string>& choices, std::string_view what) {
  const auto* s = node.as_string();
  std::string expected = what.empty() ? "" : std::string(what) + ": ";
  for (std::size_t k = 0; k < choices.size(); ++k) expected += (k ? ", \"" : "\"") + choices[k] + "\"";
  if (!s) f.fail_at(node, key, index, "not a string", expected);
  for (const auto& c : choices)
    if (s->get() == c) return c;
  f.fail_at(node, key, index, "not one of the choices", expected);
}

}  // namespace

std::vector<double> read_reals(const Fields& f, std::string_view key, const RealRange& range, std::size_t size) {
  const std::string expected = size > 0 ? fmt::format("an array of {} numbers, each {}", size, describe(range))
                                        : fmt::format("an array of numbers, each {}", describe(range));
  const toml::array& a = f.array(key, expected);
  if ((size > 0 && a.size() != size) || a.empty())
    f.fail(key, fmt::format("{} values", a.size()), expected);
  std::vector<double> values;
  for (std::size_t i = 0; i < a.size(); ++i) values.push_back(number(f, *a.get(i), key, std::to_string(i), range));
  return values;
}

std::vector<std::vector<double>> read_real_rows(const Fields& f, std::string_view key, const RealRange& range,
                                                std::size_t row_size) {
  const std::string expected = fmt::format("an array of rows of {} numbers", row_size);
  const toml::array& a = f.array(key, expected);
  if (a.empty()) f.fail(key, "no rows", expected);
  std::vector<std::vector<double>> rows;
  for (std::size_t r = 0; r < a.size(); ++r) {
    const auto* row = a.get(r)->as_array();
    if (!row || row->size() != row_size)
      f.fail_at(*a.get(r), key, std::to_string(r),
                row ? fmt::format("a row of {} values", row->size()) : std::string("not a row"), expected);
    std::vector<double> values;
    for (std::size_t c = 0; c < row_size; ++c)
      values.push_back(number(f, *row->get(c), key, fmt::format("{}][{}", r, c), range));
    rows.push_back(values);
  }
  return rows;
}

std::vector<mesh::CoilSide> read_slot_table(const Fields& f, std::string_view key, int n_slots, int n_layers,
                                            int n_phases) {
  const std::string expected = "rows [slot, layer, \"phase\", \"+\" or \"-\", turns]";
  const toml::array& a = f.array(key, expected);
  if (a.empty()) f.fail(key, "no rows", expected);
  std::vector<std::string> phases;
  for (int k = 0; k < n_phases; ++k) phases.push_back(std::string(1, static_cast<char>('A' + k)));
  std::set<std::pair<int, int>> used;
  std::vector<mesh::CoilSide> sides;
  for (std::size_t r = 0; r < a.size(); ++r) {
    const std::string at = std::to_string(r);
    const auto* row = a.get(r)->as_array();
    if (!row || row->size() != 5) f.fail_at(*a.get(r), key, at, "not a row of five values", expected);
    mesh::CoilSide s;
    s.slot = whole(f, *row->get(0), key, at + "][0", 1, n_slots, "slot number");
    s.layer = whole(f, *row->get(1), key, at + "][1", 1, n_layers, "layer");
    const std::string phase = text(f, *row->get(2), key, at + "][2", phases, "a phase of [winding] phases");
    s.phase = phase[0] - 'A';
    s.direction = text(f, *row->get(3), key, at + "][3", {"+", "-"}, "the direction") == "+" ? 1 : -1;
    s.turns = whole(f, *row->get(4), key, at + "][4", 1, 100000, "number of turns");
    if (!used.insert({s.slot, s.layer}).second)
      f.fail_at(*a.get(r), key, at, fmt::format("slot {} layer {} is used twice", s.slot, s.layer),
                "each slot-layer in at most one row");
    sides.push_back(s);
  }
  return sides;
}

}  // namespace tf::input
