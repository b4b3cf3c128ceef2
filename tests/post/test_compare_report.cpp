// The comparison page: every case drawn on each figure, B_r on an angle axis ending at 360°, the
// locus of a forward plus a backward wave drawn as the ellipse of axis ratio (F - B)/(F + B), bars
// for every order either case carries, and one column per case in the headline table.

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <complex>
#include <numbers>
#include <string>
#include <vector>

#include "post/compare_report.hpp"
#include "post/html_report.hpp"
#include "post/svg_plot.hpp"
#include "support/svg_paths.hpp"

using namespace tf;
namespace svg = tf::post::svg;
using tf::testing::data_paths;

namespace {

constexpr double kPi = std::numbers::pi;

/// A 4-pole case whose fundamental is a forward wave F and a backward wave B, sampled at 36 steps:
/// c_p(t) = F e^{jωt} + B e^{-jωt}; B_r at ωt = 0 is (F + B) cos 2θ; two harmonics besides.
post::ComparedCase hand_built(const std::string& name, double forward, double backward) {
  post::ComparedCase c;
  c.name = name;
  c.title = "hand-built " + name;
  c.study = "phase_angles";
  c.solved_by = "superposition";
  c.pole_pairs = 2;
  c.metrics.forward = forward, c.metrics.backward = backward;
  c.metrics.mean_fundamental = forward;
  c.winding_factor = 0.933;
  for (int j = 0; j < 720; ++j) {
    c.sample_angles.push_back(2 * kPi * j / 720);
    c.br.push_back((forward + backward) * std::cos(2 * c.sample_angles.back()));
  }
  for (int k = 0; k < 36; ++k) {
    const double wt = 2 * kPi * k / 36;
    c.locus.push_back(forward * std::polar(1.0, wt) + backward * std::polar(1.0, -wt));
  }
  c.harmonics = {{2, 1.0, forward, 1.0, forward, backward, 1500, 0.933}, {10, 5.0, 0.05, 0.05 / forward, 0, 0.05, -300, 0.067}};
  return c;
}

const post::Figure& figure(const post::Page& page, const std::string& name) {
  const auto it = std::find_if(page.figures.begin(), page.figures.end(), [&](const post::Figure& f) { return f.name == name; });
  REQUIRE(it != page.figures.end());
  return *it;
}

}  // namespace

TEST_CASE("locus axis ratio: (F - B)/(F + B) of the forward and backward waves") {
  // Derived: |F e^{jωt} + B e^{-jωt}| = |F + B e^{-2jωt}| runs between F - B and F + B.
  post::RotationMetrics m;
  m.forward = 0.6, m.backward = 0.2;
  CHECK(post::locus_axis_ratio(m) == doctest::Approx(0.5).epsilon(1e-12).scale(0));
  m.backward = 0.0;
  CHECK(post::locus_axis_ratio(m) == 1.0);
  m.backward = 0.6;
  CHECK(post::locus_axis_ratio(m) == 0.0);  // pulsating: a line
}

TEST_CASE("the comparison page draws every case on each figure, with one column per case") {
  const std::vector<post::ComparedCase> cases = {hand_built("circle", 0.8, 0.0), hand_built("ellipse", 0.6, 0.2)};
  const post::Page page = post::comparison_page(cases);

  // B_r: one curve per case, closed at 360°, which is the right end of the frame (ticks 0 .. 360).
  const auto gap = data_paths(figure(page, "gap_field").svg);
  REQUIRE(gap.size() == 2);
  for (const auto& curve : gap) {
    REQUIRE(curve.size() == 721);
    CHECK(curve.front().x == doctest::Approx(svg::kPlotLeft).epsilon(1e-9));
    CHECK(curve.back().x == doctest::Approx(svg::kPlotRight).epsilon(1e-9));
    CHECK(curve.back().y == doctest::Approx(curve.front().y).epsilon(1e-9));
  }
  CHECK(figure(page, "gap_field").svg.find(">360</text>") != std::string::npos);

  // The loci: a circle, and the ellipse whose radii run from F - B to F + B (ratio 0.5), in pixels
  // about the origin of the equal-scale plane (0.1 px rounding on radii of about 100 px).
  const std::string& loci_svg = figure(page, "loci").svg;
  const auto loci = data_paths(loci_svg);
  REQUIRE(loci.size() == 2);
  const auto [cx, cy] = testing::locus_centre(loci_svg);
  REQUIRE(std::isfinite(cx));
  for (std::size_t k = 0; k < 2; ++k) {
    REQUIRE(loci[k].size() == 36);
    const auto [r_min, r_max] = testing::radius_range(loci[k], cx, cy);
    CHECK(r_max > 50);
    CHECK(r_min / r_max == doctest::Approx(post::locus_axis_ratio(cases[k].metrics)).epsilon(3e-3).scale(0));
  }

  // Spectra: a bar for each order of each case (the fundamental and the 5th), grouped by order.
  const std::string& bars = figure(page, "spectra").svg;
  std::size_t n_bars = 0;
  const std::string bar = "<rect class=\"data\"";
  for (auto pos = bars.find(bar); pos != std::string::npos; pos = bars.find(bar, pos + 1)) ++n_bars;
  CHECK(n_bars == 4);
  CHECK(bars.find("ellipse, 5: 0.05") != std::string::npos);

  // Headline table: quantity, one column per case, unit; the locus row holds each case's ratio.
  REQUIRE(!page.tables.empty());
  const post::Table& head = page.tables.front();
  CHECK(head.columns == std::vector<std::string>{"quantity", "circle", "ellipse", "unit"});
  const auto row = std::find_if(head.rows.begin(), head.rows.end(),
                                [](const auto& r) { return r[0].text == "locus axis ratio (minor/major)"; });
  REQUIRE(row != head.rows.end());
  CHECK((*row)[1].text == "1");
  CHECK((*row)[2].text == "0.5");
  CHECK(page.tables.size() == 3);  // and each case's space-harmonic table

  const std::string html = post::render_html(page);
  CHECK(html.find(post::html_escape(post::kSafetyCaution)) < html.find("<h2"));
  // No cases: still a whole page with the caution, figures saying "no data".
  const std::string none = post::render_html(post::comparison_page({}));
  CHECK(none.find(post::html_escape(post::kSafetyCaution)) != std::string::npos);
  CHECK(none.find("class=\"data\"") == std::string::npos);
}
