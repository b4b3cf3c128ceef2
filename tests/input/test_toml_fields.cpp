// The typed table reader under the case reader: suggestions for misspelt keys, type and range
// rules, and which line an error points at.

#include <doctest/doctest.h>

#include <cmath>
#include <string>

#include "input/input_error.hpp"
#include "input/toml_fields.hpp"

namespace {

using tf::input::Document;
using tf::input::Fields;
using tf::input::InputError;

Document parse(const std::string& text) { return Document{"mem.toml", toml::parse(std::string_view(text))}; }

/// The message of the InputError that `f` throws; "" if it throws nothing.
template <typename F>
std::string error_of(F&& f) {
  try {
    f();
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

}  // namespace

TEST_CASE("edit distance counts single-letter insertions, deletions and substitutions") {
  using tf::input::edit_distance;
  CHECK(edit_distance("kitten", "sitting") == 3);
  CHECK(edit_distance("", "abc") == 3);
  CHECK(edit_distance("width", "width") == 0);
  CHECK(edit_distance("widht", "width") == 2);  // a swap is two edits in Levenshtein's count
  CHECK(edit_distance("slots", "slot") == edit_distance("slot", "slots"));
}

TEST_CASE("a misspelt key gets the nearest valid key, a far-fetched one gets none") {
  using tf::input::nearest;
  const std::vector<std::string> slot_keys = {"shape", "width", "depth", "opening", "tip_height", "wedge_height"};
  CHECK(nearest("widht", slot_keys) == "width");
  CHECK(nearest("depht", slot_keys) == "depth");
  CHECK(nearest("tip_hieght", slot_keys) == "tip_height");
  CHECK(nearest("colour", slot_keys).empty());
  // The table's own name in front of the key is a common slip; it is tried without it.
  CHECK(nearest("slot_widht", slot_keys).empty());
  CHECK(nearest("slot_widht", slot_keys, "slot") == "width");
  CHECK(nearest("stater", {"machine", "stator", "rotor"}) == "stator");
  CHECK(nearest("rotr", {"stator", "rotor"}) == "rotor");
}

TEST_CASE("ranges describe themselves in words") {
  using tf::input::describe;
  CHECK(describe(tf::input::RealRange{.min = 0, .max = 5, .min_excluded = true, .unit = "m"}) ==
        "a number in m, > 0 and <= 5");
  CHECK(describe(tf::input::RealRange{.min = 0.1, .max = 20}) == "a number >= 0.1 and <= 20");
  CHECK(describe(tf::input::IntRange{.min = 3, .max = 2000}) == "an integer from 3 to 2000");
  // No count is unbounded: without a limit of its own a key takes at most kMaxCount.
  CHECK(describe(tf::input::IntRange{.min = 1}) == "an integer from 1 to 1000000");
}

TEST_CASE("a real key accepts an integer; an integer key refuses a float, even a whole one") {
  const Document doc = parse("a = 3\nb = 2.5\nn = 36.0\nm = 36\n");
  const Fields f(doc, {"a", "b", "n", "m"});
  CHECK(f.real("a", {}) == 3.0);
  CHECK(f.real("b", {}) == 2.5);
  CHECK(f.integer("m", {}) == 36);
  const std::string message = error_of([&] { f.integer("n", {.min = 1}); });
  CHECK(message.rfind("mem.toml:3: n = 36.0: found a floating-point number; expected an integer from 1 to 1000000", 0) == 0);
}

TEST_CASE("values outside their range, and nan and inf, are refused") {
  const Document doc = parse("[t]\nlow = -1\nhigh = 7\nedge = 0\nnan_value = nan\ninf_value = inf\nok = 5\n");
  const Fields t = Fields(doc, {"t"}).table("t", {"low", "high", "edge", "nan_value", "inf_value", "ok"});
  const tf::input::RealRange positive{.min = 0, .max = 5, .min_excluded = true};
  CHECK(t.real("ok", positive) == 5.0);  // the upper bound is included
  CHECK(contains(error_of([&] { t.real("low", positive); }), "mem.toml:2: [t] low = -1: out of range"));
  CHECK(contains(error_of([&] { t.real("high", positive); }), "mem.toml:3: [t] high = 7: out of range"));
  CHECK(contains(error_of([&] { t.real("edge", positive); }), "mem.toml:4: [t] edge = 0: out of range"));
  CHECK(contains(error_of([&] { t.real("nan_value", {}); }), ":5: [t] nan_value = nan: not a finite number"));
  CHECK(contains(error_of([&] { t.real("inf_value", {}); }), ":6: [t] inf_value = inf: not a finite number"));
  CHECK(contains(error_of([&] { t.integer("high", {.min = 1, .max = 6}); }), "expected an integer from 1 to 6"));
}

TEST_CASE("a missing key points at its table's header, a missing table at its parent's") {
  const Document doc = parse("# comment\n\n[stator]\nbore_radius = 0.05\n");
  const Fields root(doc, {"stator", "rotor"});
  const Fields stator = root.table("stator", {"bore_radius", "outer_radius", "slot"});
  CHECK(contains(error_of([&] { stator.real("outer_radius", {}); }), "mem.toml:3: [stator] missing key 'outer_radius'"));
  CHECK(contains(error_of([&] { stator.table("slot", {"width"}); }), "mem.toml:3: missing table [stator.slot]"));
  CHECK(contains(error_of([&] { root.table("rotor", {"kind"}); }), "mem.toml:1: missing table [rotor]"));
  CHECK_FALSE(root.optional_table("rotor", {"kind"}).has_value());
  CHECK(stator.real_or("outer_radius", 0.08, {}) == 0.08);
}

TEST_CASE("unknown keys are found when the table is opened, first in file order") {
  const Document doc = parse("[slot]\nwidht = 0.005\naaa = 1\n");
  const Fields root(doc, {"slot"});
  const std::string message = error_of([&] { root.table("slot", {"width", "depth"}); });
  CHECK(message == "mem.toml:2: [slot] unknown key 'widht'; did you mean 'width'?");
  CHECK(contains(error_of([&] { Fields(parse("\n[slott]\nwidth = 1\n"), {"slot"}); }),
                 "mem.toml:2: unknown table [slott]; did you mean [slot]?"));
}

TEST_CASE("a choice must be one of its strings, with the nearest one suggested") {
  const Document doc = parse("shape = \"Open\"\nkind = 3\n");
  const Fields f(doc, {"shape", "kind"});
  CHECK(error_of([&] { f.choice("shape", {"open", "semi_closed"}); }) ==
        "mem.toml:1: shape = \"Open\": not one of the choices (did you mean \"open\"?); "
        "expected \"open\" or \"semi_closed\"");
  CHECK(contains(error_of([&] { f.choice("kind", {"iron", "none"}); }), "kind = 3: found an integer"));
}

TEST_CASE("a key another setting makes meaningless is rejected only when present") {
  const Document doc = parse("[slot]\nopening = 0.002\n");
  const Fields slot = Fields(doc, {"slot"}).table("slot", {"opening", "tip_height"});
  CHECK_NOTHROW(slot.reject("tip_height", "not used", "nothing"));
  CHECK(error_of([&] { slot.reject("opening", "not used by open slots", "no such key"); }) ==
        "mem.toml:2: [slot] opening = 0.002: not used by open slots; expected no such key");
}

TEST_CASE("errors found after reading point at the key, or at its table when the default was used") {
  const Document doc = parse("[stator]\n\n[stator.slot]\nwidth = 0.012\n");
  CHECK(error_of([&] { tf::input::fail_at_key(doc, "stator.slot.width", "too wide", "less"); }) ==
        "mem.toml:4: [stator.slot] width = 0.012: too wide; expected less");
  CHECK(error_of([&] { tf::input::fail_at_key(doc, "stator.slot.wedge_height", "too high", "less"); }) ==
        "mem.toml:3: [stator.slot] wedge_height (default): too high; expected less");
  CHECK(contains(error_of([&] { tf::input::fail_at_key(doc, "study.steps", "few", "more"); }),
                 "mem.toml:1: [study] steps (default)"));
}

TEST_CASE("values are shown as they would be written in TOML") {
  const Document doc = parse("a = 36.0\nb = \"say \\\"hi\\\"\"\nc = -inf\nd = 1e-6\ne = true\n");
  using tf::input::format_value;
  CHECK(format_value(*doc.root.get("a")) == "36.0");
  CHECK(format_value(*doc.root.get("b")) == "\"say \\\"hi\\\"\"");
  CHECK(format_value(*doc.root.get("c")) == "-inf");
  CHECK(format_value(*doc.root.get("d")) == "1e-06");
  CHECK(format_value(*doc.root.get("e")) == "true");
}
