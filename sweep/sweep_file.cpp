#include "sweep/sweep_file.hpp"

#include <algorithm>
#include <cmath>
#include <filesystem>

#include <fmt/format.h>
#include <toml++/toml.h>

#include "input/case_reader.hpp"
#include "input/input_error.hpp"
#include "input/toml_fields.hpp"
#include "sweep/sweep_metrics.hpp"

namespace tf::sweep {
namespace {

// The case reader's typed TOML access, with its file:line messages.
using input::Document;
using input::Fields;
using input::parse_document;
using input::read_input_file;
using input::format_value;
using input::line_of;
using input::nearest;
using input::number_value;

namespace fs = std::filesystem;

/// Fails on any key of `table` not in `keys`.
void only_keys(const Document& doc, const toml::table& table, std::string_view where,
               const std::vector<std::string>& keys) {
  for (const auto& [key, node] : table) {
    if (std::find(keys.begin(), keys.end(), key.str()) != keys.end()) continue;
    const std::string guess = nearest(key.str(), keys);
    fail(doc, line_of(node), fmt::format("{}{}", where, key.str()),
         guess.empty() ? "unknown key" : fmt::format("unknown key (did you mean '{}'?)", guess),
         fmt::format("one of: {}", fmt::join(keys, ", ")));
  }
}

/// The scalar a value list may hold, as a TOML literal.
std::string literal(const Document& doc, const toml::node& node, std::string_view subject) {
  if (node.is_string() || node.is_integer() || node.is_floating_point() || node.is_boolean()) {
    if (const auto v = number_value(node); v && !std::isfinite(*v))
      fail(doc, line_of(node), subject, "not a finite number", "a finite number");
    return format_value(node);
  }
  fail(doc, line_of(node), subject, "not a single value", "a number, a string or true/false");
}

/// start, start + step, ... up to stop, or `count` values from start to stop. Integers stay
/// integers when start and step (or start, stop and count) allow it.
std::vector<std::string> range_values(const Document& doc, const toml::table& range, std::string_view subject) {
  only_keys(doc, range, fmt::format("{} range.", subject), {"start", "stop", "count", "step"});
  const auto number = [&](const char* key) -> std::optional<double> {
    const toml::node* n = range.get(key);
    if (!n) return std::nullopt;
    const auto v = number_value(*n);
    if (!v || !std::isfinite(*v)) fail(doc, line_of(*n), fmt::format("{} range.{}", subject, key), "not a number", "a finite number");
    return v;
  };
  const auto start = number("start"), stop = number("stop"), count = number("count"), step = number("step");
  const int line = line_of(range);
  if (!start || !stop) fail(doc, line, subject, "a range needs start and stop", "range = { start = ..., stop = ..., count = ... }");
  if (count.has_value() == step.has_value())
    fail(doc, line, subject, "a range needs either count or step, not both or neither", "count = N or step = S");
  const bool integers = range.get("start")->is_integer() && range.get("stop")->is_integer();
  double d = 0.0;
  std::size_t n = 0;
  if (count) {
    if (*count < 1 || *count != std::floor(*count) || *count > static_cast<double>(kMaxVariants))
      fail(doc, line, fmt::format("{} range.count", subject), "out of range", fmt::format("an integer from 1 to {}", kMaxVariants));
    n = static_cast<std::size_t>(*count);
    if (n == 1 && *start != *stop) fail(doc, line, subject, "one value cannot span start to stop", "count >= 2, or start = stop");
    d = n > 1 ? (*stop - *start) / static_cast<double>(n - 1) : 0.0;
  } else {
    d = *step;
    if (d == 0.0 || (*stop - *start) * d < 0.0)
      fail(doc, line, fmt::format("{} range.step", subject), "does not lead from start to stop", "a step of the sign of stop - start");
    const double span = (*stop - *start) / d;
    if (span > static_cast<double>(kMaxVariants)) fail(doc, line, subject, "too many values", fmt::format("at most {}", kMaxVariants));
    n = static_cast<std::size_t>(std::floor(span + 1e-9)) + 1;  // stop is included when a step lands on it
  }
  const bool whole = integers && d == std::round(d) && (!step || range.get("step")->is_integer());
  std::vector<std::string> values;
  for (std::size_t i = 0; i < n; ++i) {
    const double v = *start + static_cast<double>(i) * d;
    if (whole) values.push_back(fmt::format("{}", static_cast<long long>(std::llround(v))));
    else values.push_back(format_value(toml::value<double>(std::abs(v) < 1e-15 * std::abs(d) ? 0.0 : v)));
  }
  return values;
}

/// [fixed] as dotted keys, whether written "stator.slot.opening" = ... or as nested tables.
void read_fixed(const Document& doc, const toml::table& table, const std::string& prefix, std::vector<FixedKey>& out) {
  for (const auto& [key, node] : table) {
    const std::string dotted = prefix + std::string(key.str());
    if (const toml::table* inner = node.as_table()) read_fixed(doc, *inner, dotted + ".", out);
    else out.push_back({dotted, literal(doc, node, "[fixed] " + dotted), line_of(node)});
  }
}

VariedKey read_varied(const Document& doc, const toml::node& entry, std::size_t index) {
  const std::string subject = fmt::format("[[vary]] #{}", index + 1);
  const toml::table* t = entry.as_table();
  if (!t) fail(doc, line_of(entry), subject, "not a table", "[[vary]] with key and values (or range)");
  only_keys(doc, *t, subject + " ", {"key", "values", "range"});
  VariedKey v;
  v.line = line_of(entry);
  const toml::node* key = t->get("key");
  if (!key || !key->is_string()) fail(doc, v.line, subject, "no key", "key = \"table.key\" as in the base case");
  v.key = key->as_string()->get();
  v.line = line_of(*key);
  const toml::node* values = t->get("values");
  const toml::node* range = t->get("range");
  if ((values != nullptr) == (range != nullptr))
    fail(doc, v.line, subject + " " + v.key, "needs either values or range", "values = [...] or range = { ... }");
  if (values) {
    const toml::array* list = values->as_array();
    if (!list || list->empty()) fail(doc, line_of(*values), subject + " values", "not a non-empty list", "values = [a, b, ...]");
    for (std::size_t i = 0; i < list->size(); ++i)
      v.values.push_back(literal(doc, *list->get(i), fmt::format("{} values[{}]", subject, i)));
  } else {
    const toml::table* r = range->as_table();
    if (!r) fail(doc, line_of(*range), subject + " range", "not a table", "range = { start = ..., stop = ..., count = ... }");
    v.values = range_values(doc, *r, subject);
  }
  return v;
}

/// The dotted names of every single value the base case sets ("stator.slot.opening").
void value_keys(const toml::table& table, const std::string& prefix, std::vector<std::string>& out) {
  for (const auto& [key, node] : table) {
    const std::string dotted = prefix + std::string(key.str());
    if (const toml::table* inner = node.as_table()) value_keys(*inner, dotted + ".", out);
    else if (!node.is_array()) out.push_back(dotted);
  }
}

/// Every varied and fixed key must be a single value set in the base case.
void check_against_base(const Document& sweep_doc, const SweepFile& s) {
  const Document base = input::parse_document(s.base_case, s.base_text);
  std::vector<std::string> settable;
  value_keys(base.root, "", settable);
  const auto check = [&](const std::string& key, int line) {
    const toml::node* node = base.root.at_path(key).node();
    if (!node) {
      const std::string guess = nearest(key, settable);
      fail(sweep_doc, line, key,
           fmt::format("not set in the base case {}{}", s.base_case,
                       guess.empty() ? "" : fmt::format(" (did you mean '{}'?)", guess)),
           "a key the base case sets (set it there, so the sweep has a value to replace)");
    }
    if (node->is_table() || node->is_array())
      fail(sweep_doc, line, key, "is a table or a list in the base case", "a key holding one number, string or true/false");
  };
  for (const auto& v : s.varied) check(v.key, v.line);
  for (const auto& f : s.fixed) check(f.key, f.line);
}

/// Zipped lists must have one length, and the variants must not exceed kMaxVariants.
void check_variant_count(const Document& doc, const SweepFile& s) {
  std::size_t n = 1;
  for (const auto& v : s.varied) {
    if (s.combine == Combine::zip && v.values.size() != s.varied.front().values.size())
      fail(doc, v.line, v.key, fmt::format("has {} values, the first varied key {}", v.values.size(),
                                           s.varied.front().values.size()),
           "lists of one length when combine = \"zip\"");
    n = s.combine == Combine::zip ? v.values.size() : n * v.values.size();
    if (n > kMaxVariants) fail(doc, v.line, v.key, fmt::format("makes more than {} variants", kMaxVariants), "fewer values");
  }
}

/// A metric spec at `key`, checked against the metrics there are.
std::string metric_spec(const Fields& root, const char* key) {
  const std::string spec = root.text_or(key, "");
  if (const auto p = rank_problem(spec); p && root.has(key)) root.fail(key, p->what, p->expected);
  return spec;
}

/// rank_by, rank_tolerance, tie_break and pareto, each checked where it is written.
RankSpec read_ranking(const Document& doc, const Fields& root) {
  RankSpec r{metric_spec(root, "rank_by"), std::nullopt, metric_spec(root, "tie_break"), {}};
  if (root.has("rank_tolerance")) {
    r.tolerance = root.real("rank_tolerance", {0.0, 1.0, false, true});
  }
  if (root.has("pareto")) {
    const toml::array& pair = root.array("pareto", "two metrics, e.g. [\"peak_field_ripple:lowest\", \"fundamental_T\"]");
    const auto expected = "two different metrics, e.g. [\"peak_field_ripple:lowest\", \"fundamental_T:highest\"]";
    if (pair.size() != 2) root.fail("pareto", fmt::format("has {} entries", pair.size()), expected);
    for (std::size_t i = 0; i < 2; ++i) {
      const toml::node& n = *pair.get(i);
      const std::string subject = fmt::format("pareto[{}]", i);
      if (!n.is_string()) fail(doc, line_of(n), subject, "not a string", expected);
      const std::string spec = n.as_string()->get();
      if (const auto p = rank_problem(spec)) fail(doc, line_of(n), subject + " = \"" + spec + "\"", p->what, p->expected);
      r.pareto.push_back(spec);
    }
    if (split_metric_spec(r.pareto[0]).first == split_metric_spec(r.pareto[1]).first)
      root.fail("pareto", "names one metric twice", expected);
  }
  return r;
}

}  // namespace

SweepFile read_sweep_file(const std::string& path) {
  const Document doc = input::parse_document(path, input::read_input_file(path, "sweep file"));
  const Fields root(doc, {"title", "base_case", "combine", "rank_by", "rank_tolerance", "tie_break", "pareto",
                          "fixed", "vary"});
  SweepFile s;
  s.path = path;
  s.title = root.text_or("title", fs::path(path).stem().string());
  if (!root.has("base_case")) root.fail("base_case", "missing", "base_case = \"<case file>\", relative to the sweep file");
  const fs::path base = fs::path(root.text_or("base_case", ""));
  s.base_case = (base.is_absolute() ? base : fs::path(path).parent_path() / base).lexically_normal().string();
  try {
    s.base_text = input::read_input_file(s.base_case, "case file");
  } catch (const input::InputError& e) {
    root.fail("base_case", e.what(), "a readable case file");
  }
  s.combine = root.choice_or("combine", {"grid", "zip"}, 0) == 0 ? Combine::grid : Combine::zip;
  s.ranking = read_ranking(doc, root);
  if (const toml::table* fixed = doc.root.get_as<toml::table>("fixed")) read_fixed(doc, *fixed, "", s.fixed);
  const toml::array& vary = root.array("vary", "[[vary]] tables");
  if (vary.empty()) root.fail("vary", "no key to vary", "at least one [[vary]] table");
  for (std::size_t i = 0; i < vary.size(); ++i) s.varied.push_back(read_varied(doc, *vary.get(i), i));
  for (std::size_t i = 0; i < s.varied.size(); ++i)
    for (std::size_t j = 0; j < i; ++j)
      if (s.varied[i].key == s.varied[j].key) fail(doc, s.varied[i].line, s.varied[i].key, "varied twice", "each key in one [[vary]]");
  for (const auto& f : s.fixed)
    for (const auto& v : s.varied)
      if (f.key == v.key) fail(doc, f.line, f.key, "both fixed and varied", "the key in one place");
  check_against_base(doc, s);
  check_variant_count(doc, s);
  return s;
}

}  // namespace tf::sweep
