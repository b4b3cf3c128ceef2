// How the sweep's report draws a metric against a varied key: whole-number keys with a few values
// (phases, coil pitch) as categories with points, continuous keys as lines, and series that
// coincide drawn once with a legend that says so. Tables built here with exact numbers.

#include <doctest/doctest.h>

#include <regex>

#include "post/sweep_report.hpp"

namespace {

using tf::post::SweepTable;

/// The d attributes of the data paths of an SVG.
std::vector<std::string> data_paths(const std::string& svg) {
  std::vector<std::string> out;
  const std::regex path(R"re(<path class="data"[^>]*\bd="([^"]*)")re");
  for (auto it = std::sregex_iterator(svg.begin(), svg.end(), path); it != std::sregex_iterator(); ++it) out.push_back((*it)[1]);
  return out;
}

/// Dots of a data path: one "M x y Z" each.
std::size_t n_points(const std::string& d) { return static_cast<std::size_t>(std::count(d.begin(), d.end(), 'M')); }

/// Whether the chart joins points by lines.
bool has_lines(const std::string& svg) { return svg.find("<path class=\"line\"") != std::string::npos; }

/// The legend's lines joined by spaces.
std::string legend_text(const std::string& svg) {
  std::string out;
  const std::regex text(R"re(<text class="legend"[^>]*>([^<]*)</text>)re");
  for (auto it = std::sregex_iterator(svg.begin(), svg.end(), text); it != std::sregex_iterator(); ++it)
    out += (out.empty() ? "" : " ") + std::string((*it)[1]);
  return out;
}

const tf::post::Figure& figure(const tf::post::Page& page, const std::string& name) {
  for (const auto& f : page.figures)
    if (f.name == name) return f;
  FAIL("no figure " << name);
  return page.figures.front();
}

/// Phases 2 and 3 by coil pitch 5 and 6 by slot opening 2 and 3 mm (a grid of 8). The winding
/// factor of a 24-slot, 4-pole stator depends on the phases and the pitch only, so against the
/// opening the series of each (phases, pitch) are flat; the fundamental is made to depend on the
/// pitch only, so against the phases the two openings' series of one pitch coincide.
SweepTable grid() {
  SweepTable t;
  t.parameters = {"winding.phases", "winding.coil_pitch", "stator.slot.opening"};
  t.metrics = {{"fundamental_T", "B_r fundamental", "T", false}};
  for (const char* phases : {"2", "3"})
    for (const char* pitch : {"5", "6"})
      for (const char* opening : {"0.002", "0.003"}) {
        const double b = std::string(pitch) == "5" ? 0.66 : 0.70;
        t.rows.push_back({std::string("v") + phases + pitch + opening, {phases, pitch, opening}, "ok", "", {b}, 0});
      }
  return t;
}

}  // namespace

TEST_CASE("a key of a few whole numbers is drawn as categories with points, a continuous key as lines") {
  const auto page = tf::post::sweep_page(grid(), "");
  const auto& by_phases = figure(page, "fundamental_T_vs_winding_phases");
  // Two labelled categories, evenly spaced, and no line from 2 to 3 phases.
  CHECK(by_phases.svg.find(">2</text>") != std::string::npos);
  CHECK(by_phases.svg.find(">3</text>") != std::string::npos);
  CHECK(by_phases.svg.find(">2.5</text>") == std::string::npos);
  CHECK_FALSE(has_lines(by_phases.svg));
  CHECK(n_points(data_paths(by_phases.svg).front()) == 2);
  CHECK(by_phases.caption.find("each is a category") != std::string::npos);
  // The opening (0.002, 0.003 m) is continuous: lines.
  const auto& by_opening = figure(page, "fundamental_T_vs_stator_slot_opening");
  CHECK(has_lines(by_opening.svg));
}

TEST_CASE("series that coincide are drawn once and the legend says they coincide") {
  const auto page = tf::post::sweep_page(grid(), "");
  // Against the phases: four series (pitch x opening); the two openings of each pitch coincide.
  const auto& by_phases = figure(page, "fundamental_T_vs_winding_phases");
  CHECK(data_paths(by_phases.svg).size() == 2);
  CHECK(legend_text(by_phases.svg).find("coil_pitch=5: opening=0.002 and 0.003 coincide") != std::string::npos);
  CHECK(legend_text(by_phases.svg).find("coil_pitch=6: opening=0.002 and 0.003 coincide") != std::string::npos);
  // Against the pitch the four (phases, opening) series coincide: one drawn, all four named.
  const auto& by_pitch = figure(page, "fundamental_T_vs_winding_coil_pitch");
  REQUIRE(data_paths(by_pitch.svg).size() == 1);
  CHECK(n_points(data_paths(by_pitch.svg).front()) == 2);
  // Too long for one line: the legend wraps it.
  CHECK(legend_text(by_pitch.svg) == "phases=2, opening=0.002; phases=2, opening=0.003; phases=3, opening=0.002 and "
                                     "phases=3, opening=0.003 coincide");
  // On a numeric axis too: against the opening, the phases' lines of one pitch coincide.
  const auto& by_opening = figure(page, "fundamental_T_vs_stator_slot_opening");
  CHECK(data_paths(by_opening.svg).size() == 2);
  CHECK(legend_text(by_opening.svg) == "coil_pitch=5: phases=2 and 3 coincide coil_pitch=6: phases=2 and 3 coincide");
  // Series that differ anywhere are not merged.
  SweepTable t = grid();
  t.rows[0].metrics[0] = 0.661;
  const auto apart_page = tf::post::sweep_page(t, "");
  const auto& apart = figure(apart_page, "fundamental_T_vs_winding_phases");
  CHECK(data_paths(apart.svg).size() == 3);
}

TEST_CASE("a whole-number key with more values than kMaxIntegerCategories is continuous, a named one never") {
  SweepTable t;
  t.parameters = {"winding.turns"};
  t.metrics = {{"fundamental_T", "B_r fundamental", "T", false}};
  for (std::size_t n = 1; n <= tf::post::kMaxIntegerCategories + 1; ++n)
    t.rows.push_back({"v" + std::to_string(n), {std::to_string(10 * n)}, "ok", "", {0.01 * static_cast<double>(n)}, 0});
  CHECK(has_lines(tf::post::sweep_page(t, "").figures.front().svg));
  t.rows.pop_back();  // now exactly kMaxIntegerCategories values: categories
  const std::string few = tf::post::sweep_page(t, "").figures.front().svg;
  CHECK_FALSE(has_lines(few));
  REQUIRE(data_paths(few).size() == 1);
  CHECK(n_points(data_paths(few).front()) == tf::post::kMaxIntegerCategories);
  // Names are categories however few or many.
  for (auto& r : t.rows) r.inputs.front() = "kind_" + r.inputs.front();
  CHECK_FALSE(has_lines(tf::post::sweep_page(t, "").figures.front().svg));
}
