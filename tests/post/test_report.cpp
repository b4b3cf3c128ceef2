// The report's charts and pages: data land on the right pixels, ticks are nice, colour bins
// cover the data, an ideal rotating phasor draws a circle, text is escaped, the caution is on
// every page, and a sweep's page holds its ranked table and its figures.

#include <doctest/doctest.h>

#include <cmath>
#include <complex>
#include <filesystem>
#include <fstream>
#include <numbers>
#include <regex>
#include <sstream>
#include <string>
#include <vector>

#include "post/case_report.hpp"
#include "post/html_report.hpp"
#include "post/summary.hpp"
#include "post/svg_plot.hpp"
#include "post/sweep_report.hpp"
#include "support/polar_mesh.hpp"
#include "support/svg_paths.hpp"

using namespace tf;
namespace svg = tf::post::svg;
using tf::testing::data_paths;

namespace {

using testing::Extent;
using testing::Point;
using testing::subpaths;

Extent extent(const std::vector<std::vector<Point>>& paths) {
  Extent e;
  for (const auto& path : paths)
    for (const auto& p : path) e.add(p);
  return e;
}

/// Total area [px^2] of the closed subpaths ("M … Z") of every filled data path, by the shoelace
/// formula: outer loops and holes turn opposite ways, so their signed areas add up to the area covered.
double polygon_area(const std::string& s) {
  double total = 0.0;
  const std::regex path(R"re(<path class="data" fill="#[^>]*\bd="([^"]*)")re");
  for (auto it = std::sregex_iterator(s.begin(), s.end(), path); it != std::sregex_iterator(); ++it) {
    for (const auto& p : subpaths((*it)[1]))
      for (std::size_t i = 0; i < p.size(); ++i) {
        const Point& a = p[i];
        const Point& b = p[(i + 1) % p.size()];
        total += 0.5 * (a.x * b.y - b.x * a.y);
      }
  }
  return std::abs(total);
}

std::size_t count(const std::string& s, const std::string& what) {
  std::size_t n = 0;
  for (auto pos = s.find(what); pos != std::string::npos; pos = s.find(what, pos + 1)) ++n;
  return n;
}

double attribute(const std::string& s, const std::string& element_start, const std::string& name) {
  const auto at = s.find(element_start);
  REQUIRE(at != std::string::npos);
  const auto key = s.find(name + "=\"", at);
  return std::stod(s.substr(key + name.size() + 2));
}

}  // namespace

TEST_CASE("a straight line y = 2x lands on the straight line between the frame's corners") {
  // x in [0, 10] and y in [0, 20] are already nice tick ends, so the frame spans exactly these
  // ranges and the map is x -> left + x/10 (right - left), y -> bottom - y/20 (bottom - top).
  // Exact: the linear map of a straight line, to the 0.1 px the writer rounds to.
  svg::Series line{"y = 2x", {}, {}};
  for (int i = 0; i <= 20; ++i) line.x.push_back(0.5 * i), line.y.push_back(1.0 * i);
  const std::string s = svg::line_chart({"line", {"x", "m"}, {"y", "m"}, {line}, {}});
  const auto paths = data_paths(s);
  REQUIRE(paths.size() == 1);
  REQUIRE(paths[0].size() == 21);
  for (std::size_t i = 0; i < paths[0].size(); ++i) {
    const double x = line.x[i], y = line.y[i];
    // Absolute: half the 0.1 px the coordinates are rounded to.
    CHECK(std::abs(paths[0][i].x - (svg::kPlotLeft + x / 10 * (svg::kPlotRight - svg::kPlotLeft))) <= 0.051);
    CHECK(std::abs(paths[0][i].y - (svg::kPlotBottom - y / 20 * (svg::kPlotBottom - svg::kPlotTop))) <= 0.051);
  }
  CHECK(s.find("x [m]") != std::string::npos);  // the axis label carries its unit
  CHECK(s.find("y = 2x") != std::string::npos);  // the legend names the series
}

TEST_CASE("nice ticks: 1, 2, 2.5 or 5 times a power of ten, equally spaced, covering the data") {
  // Common practice for chart axes: steps of 1, 2, 2.5 or 5 times a power of ten.
  for (const auto& [lo, hi] : std::vector<std::pair<double, double>>{
           {0.0, 0.73}, {-3.7, 12.2}, {0.6663, 0.6665}, {1e-6, 3e-6}, {-250.0, -20.0}, {0.3, 0.9}}) {
    INFO(lo, " .. ", hi);
    const auto t = svg::nice_ticks(lo, hi);
    REQUIRE(t.size() >= 2);
    CHECK(t.size() <= 12);
    CHECK(t.front() <= lo);
    CHECK(t.back() >= hi);
    const double step = t[1] - t[0];
    const double mantissa = step / std::pow(10.0, std::floor(std::log10(step) + 1e-12));
    const bool nice = std::abs(mantissa - 1) < 1e-9 || std::abs(mantissa - 2) < 1e-9 ||
                      std::abs(mantissa - 2.5) < 1e-9 || std::abs(mantissa - 5) < 1e-9;
    CHECK(nice);
    for (std::size_t i = 1; i < t.size(); ++i) CHECK(t[i] - t[i - 1] == doctest::Approx(step).epsilon(1e-9).scale(0));
  }
  CHECK(svg::nice_ticks(0.0, 0.73) == std::vector<double>{0.0, 0.2, 0.4, 0.6000000000000001, 0.8});
  // A flat line (an amplitude without ripple) still gets distinct ticks around it.
  const auto flat = svg::nice_ticks(0.6664, 0.6664 * (1 + 1e-12));
  CHECK(flat.front() < 0.6664);
  CHECK(flat.back() > 0.6664);
}

TEST_CASE("numbers print short but whole numbers keep their digits") {
  CHECK(svg::format_number(1250.0, 3) == "1250");
  CHECK(svg::format_number(0.30000000000000004) == "0.3");
  CHECK(svg::format_number(-0.0) == "0");
  CHECK(svg::format_number(1.5e-5) == "1.5e-05");
  CHECK(svg::format_number(std::nan("")) == "–");
}

TEST_CASE("colour bins cover min .. max and the field map draws every triangle once") {
  CHECK(svg::colour_bin(1.0, 1.0, 3.0, 32) == 0);
  CHECK(svg::colour_bin(3.0, 1.0, 3.0, 32) == 31);
  CHECK(svg::colour_bin(2.0, 1.0, 3.0, 32) == 16);
  for (int k = 0; k < 100; ++k)
    CHECK(svg::colour_bin(1.0 + 0.02 * k, 1.0, 3.0, 32) <= svg::colour_bin(1.0 + 0.02 * (k + 1), 1.0, 3.0, 32));
  CHECK(svg::bin_colour(0, 32) != svg::bin_colour(31, 32));

  const mesh::Mesh m = testing::polar_mesh(0.0, {{0.01, 3, mesh::RegionKind::rotor_iron, "core"}}, 16);
  svg::FieldMap map;
  map.title = "field", map.value = {"|B|", "T"}, map.nodes = &m.nodes, map.triangles = &m.triangles;
  map.values.resize(m.n_triangles());
  for (int t = 0; t < m.n_triangles(); ++t) map.values(t) = 0.1 + 1.4 * t / (m.n_triangles() - 1.0);
  const std::string s = svg::field_map(map);
  const auto paths = data_paths(s);
  CHECK(paths.size() <= static_cast<std::size_t>(svg::kColourBins));
  // Each bin's triangles are merged into polygons: the bins' polygons (even-odd, shoelace formula)
  // cover the mesh's area exactly once, up to the 0.1 px the coordinates are rounded to.
  double mesh_area = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t) mesh_area += mesh::triangle_area(m, t);
  const double drawn_area = polygon_area(s), px_per_m = (extent(paths).x_hi - extent(paths).x_lo) / 0.02;
  CHECK(drawn_area == doctest::Approx(mesh_area * px_per_m * px_per_m).epsilon(0.003).scale(0));
  CHECK(count(s, "Z") < static_cast<std::size_t>(m.n_triangles()) / 2);  // merged, not one polygon per triangle
  // The lowest and the highest value both get drawn, in the first and the last bin's colour.
  CHECK(s.find("fill=\"" + svg::bin_colour(0, 32) + "\" stroke") != std::string::npos);
  CHECK(s.find("fill=\"" + svg::bin_colour(31, 32) + "\" stroke") != std::string::npos);
  CHECK(s.find("|B| [T]") != std::string::npos);
  // Equal scales: the disc of radius 10 mm is as wide as it is tall in pixels.
  const Extent e = extent(paths);
  CHECK(e.x_hi - e.x_lo == doctest::Approx(e.y_hi - e.y_lo).epsilon(0.01).scale(0));
}

TEST_CASE("the locus of an ideal rotating phasor c = 0.8 e^{jωt} T is a circle of constant radius") {
  // Exact: |0.8 e^{jωt}| = 0.8 for every t; with equal scales the pixels keep the distance.
  svg::LocusPlot locus{"locus", "T", {}};
  for (int k = 0; k < 36; ++k) locus.points.push_back(std::polar(0.8, 2 * std::numbers::pi * k / 36));
  const std::string s = svg::locus_plot(locus);
  const double cx = attribute(s, "<circle class=\"reference\"", "cx"), cy = attribute(s, "<circle class=\"reference\"", "cy");
  const double r = attribute(s, "<circle class=\"reference\"", "r");
  const auto paths = data_paths(s);
  REQUIRE(paths.size() == 1);
  REQUIRE(paths[0].size() == 36);
  // Absolute: the 0.1 px rounding of the path's and the circle's coordinates.
  for (const auto& p : paths[0]) CHECK(std::abs(std::hypot(p.x - cx, p.y - cy) - r) <= 0.15);
  CHECK(r > 50);  // not a degenerate dot
}

TEST_CASE("empty data give a complete chart saying so, not a broken file") {
  for (const std::string& s : {svg::line_chart({"nothing", {"x", ""}, {"y", ""}, {}, {}}),
                               svg::stem_chart({"nothing", {"n", ""}, {"c", "T"}, {}, {}}),
                               svg::locus_plot({"nothing", "T", {}}), svg::field_map(svg::FieldMap{})}) {
    CHECK(s.rfind("<svg", 0) == 0);
    CHECK(s.find("</svg>") != std::string::npos);
    CHECK(s.find("no data") != std::string::npos);
    CHECK(s.find("class=\"data\"") == std::string::npos);
  }
}

TEST_CASE("text is escaped and the caution heads every page") {
  CHECK(post::html_escape("a<b & \"c\" 'd'>") == "a&lt;b &amp; &quot;c&quot; &#39;d&#39;&gt;");
  post::Page page;
  page.title = "<script>alert(1)</script>";
  page.sections.push_back({"inputs", {{"width <", "7 & 8", "m"}}, ""});
  const std::string html = post::render_html(page);
  CHECK(html.find("<script>") == std::string::npos);
  CHECK(html.find("&lt;script&gt;alert(1)&lt;/script&gt;") != std::string::npos);
  CHECK(html.find("7 &amp; 8") != std::string::npos);

  // Every page builder, even on empty results.
  const std::string caution = post::html_escape(post::kSafetyCaution);
  post::ReportContext x{"case", "phase_angles", "the whole cross-section", "{}", 2, 0.93, {}};
  post::SweepTable sweep;
  const post::StudyResult field;
  const post::MotionResult motion;
  const post::EddyResult eddy;
  post::RunRecord bodies;
  bodies.field = &field;
  bodies.motion = &motion;
  bodies.eddy = &eddy;
  bodies.field_rotates = bodies.rotor_turns = true;
  for (const post::Page& p : {post::Page{}, post::study_page(x, {}), post::study_page(x, bodies), post::sweep_page(sweep, "")}) {
    const std::string h = post::render_html(p);
    CHECK(h.find(caution) != std::string::npos);
    CHECK(h.find(caution) < h.find("<h2"));  // at the top, before any section
  }
}

TEST_CASE("inputs are echoed with the unit their key's name carries") {
  const post::Section s = post::inputs_section(R"({"supply": {"frequency_Hz": 50, "kind": "balanced"}, "stator": {"bore_radius_m": 0.05}})");
  REQUIRE(s.rows.size() == 3);
  CHECK(s.rows[0].key == "stator.bore_radius");
  CHECK(s.rows[0].unit == "m");
  CHECK(s.rows[1].key == "supply.frequency");
  CHECK(s.rows[1].unit == "Hz");
  CHECK(s.rows[2].value == "balanced");
}

TEST_CASE("a zipped sweep draws each metric as one curve through every variant, not lone points") {
  post::SweepTable t;
  t.parameters = {"winding.coil_pitch", "stator.slot.opening"};  // varied together (zip)
  t.metrics = {{"fundamental_T", "B_r fundamental", "T", false}};
  t.rows = {{"v1", {"4", "0.002"}, "ok", "", {0.60}, 3},
            {"v2", {"5", "0.003"}, "ok", "", {0.66}, 1},
            {"v3", {"6", "0.004"}, "ok", "", {0.64}, 2}};
  t.rank_by = 0;
  const post::Page page = post::sweep_page(t, "");
  REQUIRE(page.figures.size() == 2);
  for (const auto& f : page.figures) {
    const auto paths = data_paths(f.svg);
    REQUIRE(paths.size() == 1);
    CHECK(paths[0].size() == 3);
  }
}

TEST_CASE("a sweep's report: ranked table with links, failed rows with their message, a figure per metric and input") {
  post::SweepTable t;
  t.title = "Slot opening study";
  t.sweep_file = "studies/opening.toml";
  t.base_case = "cases/pump24_three_phase.toml";
  t.parameters = {"stator.slot.opening", "stator.slot.shape"};
  t.metrics = {{"fundamental_T", "B_r fundamental", "T", false},
               {"distortion_percent", "harmonic distortion", "%", true},
               {"torque_N_m", "torque", "N·m", false}};  // NaN everywhere: no figure
  const double nan = post::kNoValue;
  t.rows = {{"v1", {"0.002", "semi_closed"}, "ok", "", {0.66, 26.0, nan}, 3},
            {"v2", {"0.003", "semi_closed"}, "ok", "", {0.65, 24.0, nan}, 2},
            {"v3", {"0.002", "open"}, "failed", "mesh error: slot opening wider than the slot", {nan, nan, nan}, 0},
            {"v4", {"0.003", "open"}, "ok", "", {0.62, 21.0, nan}, 1}};
  t.rank_by = 1;
  const post::Page page = post::sweep_page(t, "v4 has the lowest harmonic distortion");
  CHECK(page.figures.size() == 4);  // 2 metrics with data × 2 inputs
  for (const auto& f : page.figures) CHECK(f.name.find("torque") == std::string::npos);
  const std::string html = post::render_html(page);
  CHECK(html.find("<a href=\"v3/report.html\">v3</a>") != std::string::npos);
  CHECK(html.find("slot opening wider than the slot") != std::string::npos);
  CHECK(html.find(">v4<") < html.find(">v2<"));  // rank 1 first
  CHECK(html.find(">v2<") < html.find(">v1<"));
  CHECK(html.find("harmonic distortion [%]") != std::string::npos);
  // Distortion against the opening: one series per shape, and only the variants that ran drawn.
  const auto& by_opening = page.figures[2];
  CHECK(by_opening.name == "distortion_percent_vs_stator_slot_opening");
  const auto paths = data_paths(by_opening.svg);
  REQUIRE(paths.size() == 2);
  CHECK(paths[0].size() + paths[1].size() == 3);
  CHECK(by_opening.svg.find("shape=open") != std::string::npos);
  // The shape is a choice: its axis shows the names.
  CHECK(page.figures[3].svg.find(">semi_closed</text>") != std::string::npos);

  const auto dir = std::filesystem::temp_directory_path() / "turnfield_test_sweep_report";
  std::filesystem::remove_all(dir);
  post::write_sweep_report(dir, t, "");
  CHECK(std::filesystem::exists(dir / "report.html"));
  for (const auto& f : page.figures) CHECK(std::filesystem::exists(dir / "figures" / (f.name + ".svg")));
}
