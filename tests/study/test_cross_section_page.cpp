// The cross-section of real runs as a browser renders their report.html (headless Chromium, as
// scripts/check_report renders pages), read back from the rendered document: flux lines drawn,
// the whole machine (a sector model unfolded: the drawing spans the outer diameter the case file
// gives, as tall as it is wide), every coil side of the layout labelled, and no exterior image
// (an open boundary's drawing spans the boundary circle, not the image disc beside it).

#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <map>
#include <vector>
#include <sstream>
#include <string>

#include "support/cli_run.hpp"
#include "support/svg_paths.hpp"

using namespace tf::testing;
namespace fs = std::filesystem;

namespace {

const char* const kBrowser = "/usr/bin/chromium";

/// The rendered document of a run's report, or empty without a browser.
std::string rendered_report(const fs::path& out) {
  if (!fs::exists(kBrowser)) return "";
  const fs::path dom = out / "dom.html";
  const Outcome r = run_command(std::string(kBrowser) + " --headless --no-sandbox --disable-gpu --user-data-dir=" +
                                (out / "profile").string() + " --dump-dom file://" +
                                fs::absolute(out / "report.html").string() + " > " + dom.string());
  REQUIRE(r.status == 0);
  std::ifstream in(dom);
  std::stringstream text;
  text << in.rdbuf();
  return text.str();
}

/// The <figure> of the cross-section in a rendered page.
std::string section_figure(const std::string& dom) {
  const auto at = dom.find("data-name=\"cross_section\"");
  REQUIRE(at != std::string::npos);
  return dom.substr(at, dom.find("</figure>", at) - at);
}

/// The d attribute of every element that starts with `start` (std::regex would recurse through
/// paths of a megabyte and overflow the stack, so plain searching).
std::vector<std::string> path_data(const std::string& figure, const std::string& start) {
  std::vector<std::string> out;
  for (auto at = figure.find(start); at != std::string::npos; at = figure.find(start, at + 1)) {
    const auto d = figure.find(" d=\"", at) + 4;
    out.push_back(figure.substr(d, figure.find('"', d) - d));
  }
  return out;
}

/// The box [px] the coloured triangles (class "data" with a fill) cover.
Extent map_extent(const std::string& figure) {
  Extent e;
  for (const std::string& d : path_data(figure, "<path class=\"data\" fill=\"#"))
    for (const auto& sub : subpaths(d))
      for (const Point& p : sub) e.add(p);
  return e;
}

/// The coil labels drawn on the map (not the key's samples), counted by text.
std::map<std::string, int> coil_labels(const std::string& figure) {
  std::map<std::string, int> n;
  const std::string start = "<text class=\"coil-label\"";
  for (auto at = figure.find(start); at != std::string::npos; at = figure.find(start, at + 1)) {
    const auto text = figure.find('>', at) + 1;
    ++n[figure.substr(text, figure.find("</text>", text) - text)];
  }
  return n;
}

/// Points of the flux-line paths.
std::size_t flux_line_points(const std::string& figure) {
  std::size_t n = 0;
  for (const std::string& d : path_data(figure, "<path class=\"data flux-line\""))
    for (const auto& sub : subpaths(d)) n += sub.size();
  return n;
}

fs::path run_case(const std::string& name, const std::string& options) {
  const fs::path out = fresh_folder("cross_section_page_" + name);
  const Outcome r = turnfield("run " + std::string(TF_SOURCE_DIR) + "/cases/" + name + ".toml --fineness 0.5 " +
                              "--field-files 0 " + options + " --out " + out.string());
  INFO(r.output);
  REQUIRE(r.status == 0);
  return out;
}

/// The cross-section figure of the rendered report in `out`, or empty (with a note) without a browser.
std::string rendered_section(const fs::path& out) {
  const std::string dom = rendered_report(out);
  if (dom.empty()) MESSAGE("no Chromium at ", kBrowser, ": the rendered page is not checked");
  return dom.empty() ? dom : section_figure(dom);
}

}  // namespace

TEST_CASE("a quarter-model report draws the whole 36-slot machine with flux lines and all 72 coil sides labelled") {
  const fs::path out = run_case("stator36_three_phase", "--steps 4");
  const std::string figure = rendered_section(out);
  if (figure.empty()) return;
  CHECK(read_summary(out)["study"]["model"].get<std::string>().find("1/4") != std::string::npos);  // solved as a quarter
  CHECK(flux_line_points(figure) > 1000);
  // The case file's stator: outer radius 0.100 m. A quarter sector would be about 100 mm across
  // and as wide as tall only by chance; the whole machine is 200 mm and round.
  CHECK(figure.find(">200 mm across<") != std::string::npos);
  const Extent e = map_extent(figure);
  CHECK(e.x_hi - e.x_lo == doctest::Approx(600).epsilon(0.005).scale(0));  // the map's square [px]
  CHECK(e.y_hi - e.y_lo == doctest::Approx(600).epsilon(0.005).scale(0));
  // A balanced three-phase double layer: 72 coil sides, 12 of each phase and direction.
  const auto labels = coil_labels(figure);
  for (const char* text : {"A+", "A−", "B+", "B−", "C+", "C−"}) {
    CAPTURE(text);
    CHECK(labels.count(text) == 1);
    if (labels.count(text)) CHECK(labels.at(text) == 12);
  }
  CHECK(labels.size() == 6);
}

TEST_CASE("an open boundary's report draws the machine out to the boundary circle and not the exterior image") {
  const fs::path out = run_case("team30a_three_phase", "");
  const std::string figure = rendered_section(out);
  if (figure.empty()) return;
  CHECK(flux_line_points(figure) > 100);
  CHECK(figure.find("Re(A_z)") != std::string::npos);  // an eddy study says which instant its lines show
  // The case file's boundary_radius: 0.1 m. With the image disc drawn beside it the drawing
  // would be twice as wide as tall.
  CHECK(figure.find(">200 mm across<") != std::string::npos);
  const Extent e = map_extent(figure);
  CHECK(e.x_hi - e.x_lo == doctest::Approx(e.y_hi - e.y_lo).epsilon(0.005).scale(0));
  // TEAM 30a's six conductor sectors: +A, −C, +B, −A, +C, −B, one each.
  const auto labels = coil_labels(figure);
  CHECK(labels.size() == 6);
  for (const auto& [text, n] : labels) CHECK(n == 1);
}
