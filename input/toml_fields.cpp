#include "input/toml_fields.hpp"

#include <algorithm>
#include <cassert>
#include <cerrno>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <cmath>
#include <utility>

#include <fmt/format.h>

#include "input/input_error.hpp"

namespace tf::input {

int line_of(const toml::node& node) {
  // toml++ leaves the line at 0 for nodes that were not parsed from text; point at the file's start.
  const auto line = static_cast<int>(node.source().begin.line);
  return line > 0 ? line : 1;
}

std::string read_input_file(const std::string& path, std::string_view kind) {
  namespace fs = std::filesystem;
  if (path.empty()) throw InputError(fmt::format("no {} given", kind));
  std::error_code ec;
  if (fs::is_directory(path, ec)) throw InputError(fmt::format("{}: is a folder, not a {}", path, kind));
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(fmt::format("{}: cannot read the {}: {}", path, kind, std::strerror(errno)));
  std::ostringstream text;
  text << in.rdbuf();
  return text.str();
}

Document parse_document(const std::string& path, const std::string& text) {
  try {
    return Document{path, toml::parse(text, std::string_view(path))};
  } catch (const toml::parse_error& e) {
    const auto& at = e.source().begin;
    throw InputError(fmt::format("{}:{}: not valid TOML (column {}): {}", path, std::max<int>(1, at.line),
                                 at.column, e.description()));
  }
}

namespace {

std::string type_name(const toml::node& node) {
  switch (node.type()) {
    case toml::node_type::string: return "a string";
    case toml::node_type::integer: return "an integer";
    case toml::node_type::floating_point: return "a floating-point number";
    case toml::node_type::boolean: return "a boolean";
    case toml::node_type::table: return "a table";
    case toml::node_type::array: return "an array";
    case toml::node_type::date: return "a date";
    case toml::node_type::time: return "a time";
    case toml::node_type::date_time: return "a date-time";
    case toml::node_type::none: break;
  }
  return "nothing";
}

std::string format_real(double v) {
  if (std::isnan(v)) return "nan";
  if (std::isinf(v)) return v > 0 ? "inf" : "-inf";
  std::string s = fmt::format("{}", v);
  // TOML tells a float from an integer by its decimal point; keep it, so 36.0 is not shown as 36.
  if (s.find_first_of(".e") == std::string::npos) s += ".0";
  return s;
}

std::string toml_quoted(std::string_view text) {
  std::string s = "\"";
  for (const char ch : text) {
    if (ch == '"' || ch == '\\') s += '\\';
    s += ch;
  }
  return s + "\"";
}

std::string join(const std::vector<std::string>& words, std::string_view separator) {
  std::string s;
  for (std::size_t i = 0; i < words.size(); ++i) s += (i ? std::string(separator) : "") + words[i];
  return s;
}

/// "a", "a or b", "a, b or c".
std::string join_or(const std::vector<std::string>& words) {
  if (words.size() < 2) return join(words, "");
  const std::vector<std::string> head(words.begin(), words.end() - 1);
  return join(head, ", ") + " or " + words.back();
}

std::string table_prefix(std::string_view table_name) {
  return table_name.empty() ? std::string() : fmt::format("[{}] ", table_name);
}

/// The last part of a dotted table name: "slot" for "stator.slot".
std::string_view last_part(std::string_view dotted) {
  const auto dot = dotted.rfind('.');
  return dot == std::string_view::npos ? dotted : dotted.substr(dot + 1);
}

}  // namespace

std::string describe(const RealRange& range) {
  std::string s = "a number";
  if (!range.unit.empty()) s += fmt::format(" in {}", range.unit);
  std::vector<std::string> bounds;
  if (std::isfinite(range.min))
    bounds.push_back(fmt::format("{} {}", range.min_excluded ? ">" : ">=", range.min));
  if (std::isfinite(range.max))
    bounds.push_back(fmt::format("{} {}", range.max_excluded ? "<" : "<=", range.max));
  if (!bounds.empty()) s += (range.unit.empty() ? " " : ", ") + join(bounds, " and ");
  return s;
}

std::string describe(const IntRange& range) {
  const bool has_min = range.min > -kMaxCount;
  const bool has_max = range.max < kMaxCount || has_min;  // a lower limit alone still has kMaxCount above it
  if (has_min && has_max) return fmt::format("an integer from {} to {}", range.min, range.max);
  if (has_min) return fmt::format("an integer >= {}", range.min);
  if (has_max) return fmt::format("an integer <= {}", range.max);
  return "an integer";
}

std::size_t edit_distance(std::string_view a, std::string_view b) {
  // Wagner–Fischer with two rows: row[j] is the distance between a[0, i) and b[0, j).
  std::vector<std::size_t> previous(b.size() + 1), current(b.size() + 1);
  for (std::size_t j = 0; j <= b.size(); ++j) previous[j] = j;
  for (std::size_t i = 1; i <= a.size(); ++i) {
    current[0] = i;
    for (std::size_t j = 1; j <= b.size(); ++j) {
      const std::size_t substitute = previous[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1);
      current[j] = std::min({previous[j] + 1, current[j - 1] + 1, substitute});
    }
    std::swap(previous, current);
  }
  return previous[b.size()];
}

std::string nearest(std::string_view word, const std::vector<std::string>& candidates,
                    std::string_view context) {
  std::string_view bare = word;
  const std::string prefix = std::string(context) + "_";
  if (!context.empty() && word.size() > prefix.size() && word.substr(0, prefix.size()) == prefix)
    bare = word.substr(prefix.size());
  std::string best;
  std::size_t best_distance = std::numeric_limits<std::size_t>::max();
  for (const std::string& candidate : candidates) {
    const std::size_t d = std::min(edit_distance(word, candidate), edit_distance(bare, candidate));
    // A slip of the fingers changes a few letters, not most of the word: allow two edits,
    // or a third of the letters of a long key, and never a rewrite of the whole key.
    const std::size_t limit = std::max<std::size_t>(2, candidate.size() / 3);
    if (d <= limit && d < candidate.size() && d < best_distance) {
      best = candidate;
      best_distance = d;
    }
  }
  return best;
}

std::string format_value(const toml::node& node) {
  if (const auto* s = node.as_string()) return toml_quoted(s->get());
  if (const auto* i = node.as_integer()) return fmt::format("{}", i->get());
  if (const auto* f = node.as_floating_point()) return format_real(f->get());
  if (const auto* b = node.as_boolean()) return b->get() ? "true" : "false";
  return {};  // tables, arrays and dates are named by their type in the message instead
}

void fail(const Document& doc, int line, std::string_view subject, std::string_view problem,
          std::string_view expected) {
  std::string message = fmt::format("{}:{}: ", doc.path, line);
  if (!subject.empty()) message += fmt::format("{}: ", subject);
  message += problem;
  if (!expected.empty()) message += fmt::format("; expected {}", expected);
  throw InputError(message, line);
}

void ErrorLog::note(const InputError& e) {
  for (const Entry& seen : entries_)
    if (e.line > 0 && seen.line == e.line) return;
  entries_.push_back({e.line, e.what()});
}

void ErrorLog::raise(const std::string& path) const {
  assert(!entries_.empty());
  std::vector<Entry> sorted = entries_;
  std::stable_sort(sorted.begin(), sorted.end(), [](const Entry& a, const Entry& b) { return a.line < b.line; });
  if (sorted.size() == 1) throw InputError(sorted[0].message, sorted[0].line);
  std::string message;
  for (std::size_t i = 0; i < std::min(sorted.size(), kMostListed); ++i) message += sorted[i].message + "\n";
  message += fmt::format("{} problems in {}", sorted.size(), path);
  if (sorted.size() > kMostListed) message += fmt::format(" (the first {} listed)", kMostListed);
  throw InputError(message, sorted[0].line);
}

namespace {

/// A value within `range`, for a key whose own value was wrong: reading goes on to find the file's
/// other problems, and the checks across keys are skipped.
double stand_in(const RealRange& r) {
  double v = 0.0;
  if (std::isfinite(r.min)) v = !r.min_excluded ? r.min : std::isfinite(r.max) ? 0.5 * (r.min + r.max) : r.min + 1.0;
  else if (std::isfinite(r.max)) v = r.max_excluded ? r.max - 1.0 : r.max;
  return v != 0.0 && std::abs(v) < r.smallest ? std::copysign(r.smallest, v) : v;
}

int stand_in(const IntRange& r) { return static_cast<int>(std::clamp<long long>(0, r.min, r.max)); }

const toml::table& empty_table() {
  static const toml::table empty;
  return empty;
}

const toml::array& empty_array() {
  static const toml::array empty;
  return empty;
}

}  // namespace

template <class T, class Read>
T Fields::recovered(T stand_in_value, Read read) const {
  if (absent_ || quiet_) return stand_in_value;
  if (!doc_->errors) return read();
  try {
    return read();
  } catch (const InputError& e) {
    doc_->errors->note(e);
  } catch (const Unreported&) {
  }
  return stand_in_value;
}

void fail_at_key(const Document& doc, std::string_view dotted_key, std::string_view problem,
                 std::string_view expected) {
  const auto dot = dotted_key.rfind('.');
  const std::string_view table = dot == std::string_view::npos ? "" : dotted_key.substr(0, dot);
  const std::string subject = table_prefix(table) + std::string(last_part(dotted_key));
  if (const toml::node* node = doc.root.at_path(dotted_key).node()) {
    const std::string value = format_value(*node);
    fail(doc, line_of(*node), value.empty() ? subject : subject + " = " + value, problem, expected);
  }
  // The key is absent and its default was used: point at the nearest enclosing table there is.
  for (std::string_view t = table; !t.empty();) {
    if (const toml::node* node = doc.root.at_path(t).node())
      fail(doc, line_of(*node), subject + " (default)", problem, expected);
    const auto up = t.rfind('.');
    t = up == std::string_view::npos ? std::string_view() : t.substr(0, up);
  }
  fail(doc, 1, subject + " (default)", problem, expected);
}

Fields::Fields(const Document& doc, std::vector<std::string> keys)
    : Fields(doc, doc.root, "", std::move(keys)) {}

Fields::Fields(const Document& doc, const toml::table& table, std::string name, std::vector<std::string> keys,
               bool absent)
    : doc_(&doc), table_(&table), name_(std::move(name)), keys_(std::move(keys)), absent_(absent) {
  check_unknown_keys();
}

int Fields::line() const { return line_of(*table_); }

bool Fields::has(std::string_view key) const {
  check_declared(key);
  return !absent_ && table_->contains(key);
}

void Fields::check_unknown_keys() {
  // Report the unknown key that comes first in the file, so fixes can go from top to bottom; when
  // the document collects its errors, every one of them.
  std::vector<std::pair<std::string, const toml::node*>> unknown;
  for (auto&& [key, node] : *table_)
    if (std::find(keys_.begin(), keys_.end(), key.str()) == keys_.end()) unknown.emplace_back(key.str(), &node);
  std::stable_sort(unknown.begin(), unknown.end(),
                   [](const auto& a, const auto& b) { return line_of(*a.second) < line_of(*b.second); });
  for (const auto& [word, node] : unknown) {
    const std::string guess = nearest(word, keys_, last_part(name_));
    if (guess.empty()) unguessed_ = true;
    else misspelt_.push_back(guess);
  }
  for (const auto& [word, node] : unknown) {
    const InputError e = unknown_key(word, *node);
    if (!doc_->errors) throw e;
    doc_->errors->note(e);
  }
}

bool Fields::stands_for_unknown(std::string_view key) const {
  return unguessed_ || std::find(misspelt_.begin(), misspelt_.end(), key) != misspelt_.end();
}

InputError Fields::unknown_key(const std::string& word, const toml::node& node) const {
  const toml::node* unknown_node = &node;
  const std::string guess = nearest(word, keys_, last_part(name_));
  std::string message = fmt::format("{}:{}: ", doc_->path, line_of(*unknown_node));
  if (unknown_node->is_table()) {
    message += fmt::format("unknown table [{}]", child_name(word));
    if (!guess.empty()) message += fmt::format("; did you mean [{}]?", child_name(guess));
  } else {
    message += fmt::format("{}unknown key '{}'", table_prefix(name_), word);
    if (!guess.empty()) message += fmt::format("; did you mean '{}'?", guess);
  }
  if (guess.empty()) message += fmt::format("\n  expected one of: {}", join(keys_, ", "));
  return InputError(message, line_of(*unknown_node));
}

Fields Fields::table(std::string_view key, std::vector<std::string> keys) const {
  check_declared(key);
  const toml::node* node = table_->get(key);
  const bool fits = node && node->is_table();
  const Fields stand_in_fields(*doc_, empty_table(), child_name(key), keys, true);
  if (absent_) return stand_in_fields;
  return recovered(stand_in_fields, [&] {
    if (!node && stands_for_unknown(key) && doc_->errors) throw Unreported{};  // the misspelt table is blamed
    if (!node)
      input::fail(*doc_, line(), "", fmt::format("missing table [{}]", child_name(key)),
                  fmt::format("a table with the keys {}", join(keys, ", ")));
    if (!fits) fail(key, "found " + type_name(*node), fmt::format("a table [{}]", child_name(key)));
    return Fields(*doc_, *node->as_table(), child_name(key), keys);
  });
}

std::optional<Fields> Fields::optional_table(std::string_view key, std::vector<std::string> keys) const {
  if (!has(key)) return std::nullopt;
  return table(key, std::move(keys));
}

const toml::node& Fields::required(std::string_view key, std::string_view expected) const {
  check_declared(key);
  const toml::node* node = table_->get(key);
  if (!node && stands_for_unknown(key) && doc_->errors) throw Unreported{};  // the misspelt key is blamed
  if (!node)
    input::fail(*doc_, line(), "", fmt::format("{}missing key '{}'", table_prefix(name_), key), expected);
  return *node;
}

const toml::array& Fields::array(std::string_view key, std::string_view expected) const {
  return *recovered(&empty_array(), [&] {
    const toml::node& node = required(key, expected);
    const auto* a = node.as_array();
    if (!a) fail(key, "found " + type_name(node), expected);
    return a;
  });
}

void Fields::fail_at(const toml::node& node, std::string_view key, std::string_view index, std::string_view problem,
                     std::string_view expected) const {
  const int at = std::max<int>(1, static_cast<int>(node.source().begin.line));
  const std::string value = format_value(node);
  const std::string subject = fmt::format("{}{}[{}]", table_prefix(name_), key, index);
  input::fail(*doc_, at, value.empty() ? subject : subject + " = " + value, problem, expected);
}

std::optional<double> number_value(const toml::node& node) {
  if (const auto* i = node.as_integer()) return static_cast<double>(i->get());
  if (const auto* f = node.as_floating_point()) return f->get();
  return std::nullopt;
}

bool within(double v, const RealRange& range) {
  const bool too_low = range.min_excluded ? v <= range.min : v < range.min;
  const bool too_high = range.max_excluded ? v >= range.max : v > range.max;
  return !too_low && !too_high;
}

double Fields::real(std::string_view key, const RealRange& range) const {
  return recovered(stand_in(range), [&] { return strict_real(key, range); });
}

double Fields::strict_real(std::string_view key, const RealRange& range) const {
  const std::string expected = describe(range);
  const toml::node& node = required(key, expected);
  const std::optional<double> value = number_value(node);
  if (!value) fail(key, "found " + type_name(node), expected);
  const double v = *value;
  if (!std::isfinite(v)) fail(key, "not a finite number", expected);
  if (!within(v, range)) fail(key, "out of range", expected);
  if (v != 0.0 && std::abs(v) < range.smallest) {
    // Lengths in millimetres: "0.05 mm" reads better than "5e-05 m".
    const std::string limit = range.unit == "m" ? fmt::format("{:g} mm", 1e3 * range.smallest)
                                                : fmt::format("{:g} {}", range.smallest, range.unit);
    fail(key, "below the smallest part turnfield meshes (" + limit + ")",
         (range.min == 0.0 && !range.min_excluded ? "0 (none), or " : "") + limit + " or more");
  }
  return v;
}

double Fields::real_or(std::string_view key, double fallback, const RealRange& range) const {
  return has(key) ? real(key, range) : fallback;
}

int Fields::integer(std::string_view key, const IntRange& range) const {
  return recovered(stand_in(range), [&] { return strict_integer(key, range); });
}

int Fields::strict_integer(std::string_view key, const IntRange& range) const {
  assert(range.min >= std::numeric_limits<int>::min() && range.max <= std::numeric_limits<int>::max());
  const std::string expected = describe(range);
  const toml::node& node = required(key, expected);
  const auto* i = node.as_integer();
  if (!i) {
    // 36.0 is a float in TOML; a count must be written as a whole number.
    if (node.is_floating_point())
      fail(key, "found a floating-point number", expected + ", written without a decimal point");
    fail(key, "found " + type_name(node), expected);
  }
  if (i->get() < range.min || i->get() > range.max) fail(key, "out of range", expected);
  return static_cast<int>(i->get());
}

int Fields::integer_or(std::string_view key, int fallback, const IntRange& range) const {
  return has(key) ? integer(key, range) : fallback;
}

std::string Fields::text_or(std::string_view key, std::string fallback) const {
  if (!has(key)) return fallback;
  return recovered(fallback, [&] {
    const toml::node& node = *table_->get(key);
    const auto* s = node.as_string();
    if (!s) fail(key, "found " + type_name(node), "a string in double quotes");
    return s->get();
  });
}

bool Fields::boolean_or(std::string_view key, bool fallback) const {
  if (!has(key)) return fallback;
  return recovered(fallback, [&] {
    const toml::node& node = *table_->get(key);
    const auto* b = node.as_boolean();
    if (!b) fail(key, "found " + type_name(node), "true or false (without quotes)");
    return b->get();
  });
}

std::size_t Fields::choice(std::string_view key, const std::vector<std::string>& choices) const {
  const std::size_t noted = doc_->errors ? doc_->errors->size() : 0;
  const std::size_t index = recovered(std::size_t{0}, [&] { return strict_choice(key, choices); });
  // The choice decides which keys the table may hold: read with a stand-in, the rest would be blamed wrongly.
  if (doc_->errors && doc_->errors->size() > noted) quiet_ = true;
  return index;
}

std::size_t Fields::strict_choice(std::string_view key, const std::vector<std::string>& choices) const {
  std::vector<std::string> shown;
  for (const std::string& c : choices) shown.push_back(toml_quoted(c));
  const std::string expected = join_or(shown);
  const toml::node& node = required(key, expected);
  const auto* s = node.as_string();
  if (!s) fail(key, "found " + type_name(node), expected);
  const auto it = std::find(choices.begin(), choices.end(), s->get());
  if (it != choices.end()) return static_cast<std::size_t>(it - choices.begin());
  const std::string guess = nearest(s->get(), choices);
  fail(key,
       guess.empty() ? "not one of the choices"
                     : fmt::format("not one of the choices (did you mean {}?)", toml_quoted(guess)),
       expected);
}

std::size_t Fields::choice_or(std::string_view key, const std::vector<std::string>& choices,
                              std::size_t fallback) const {
  return has(key) ? choice(key, choices) : fallback;
}

void Fields::reject(std::string_view key, std::string_view problem, std::string_view expected) const {
  recovered(0, [&] {
    if (has(key)) fail(key, problem, expected);
    return 0;
  });
}

void Fields::fail(std::string_view key, std::string_view problem, std::string_view expected) const {
  if (quiet_ && doc_->errors) throw Unreported{};
  const toml::node* node = table_->get(key);
  input::fail(*doc_, node ? line_of(*node) : line(), subject(key), problem, expected);
}

std::string Fields::child_name(std::string_view key) const {
  return name_.empty() ? std::string(key) : name_ + "." + std::string(key);
}

std::string Fields::subject(std::string_view key) const {
  const toml::node* node = table_->get(key);
  if (node && node->is_table()) return fmt::format("[{}]", child_name(key));
  std::string s = table_prefix(name_) + std::string(key);
  const std::string value = node ? format_value(*node) : std::string();
  return value.empty() ? s : s + " = " + value;
}

void Fields::check_declared([[maybe_unused]] std::string_view key) const {
  // Reading a key missing from the table's list would reject it as unknown before it is read.
  assert(std::find(keys_.begin(), keys_.end(), key) != keys_.end());
}

}  // namespace tf::input
