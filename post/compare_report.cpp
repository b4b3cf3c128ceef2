#include "post/compare_report.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

#include <fmt/format.h>

#include "post/space_harmonic_table.hpp"
#include "post/svg_plot.hpp"

namespace tf::post {
namespace {

constexpr double kDeg = 180.0 / std::numbers::pi;

std::string num(double v) { return svg::format_number(v, 6); }
/// Ratios and ripples against 1 (their fundamental), the axis deviation against the axis step, as
/// the case report shows them: round-off prints as 0.
std::string ratio(double v) { return svg::format_number_against(v, 1, 6); }
std::string percent(double v) { return svg::format_number_against(100 * v, 100, 6); }

/// ωt folded into (-180°, 180°] [rad].
double folded(double angle) { return std::remainder(angle, 2 * std::numbers::pi); }

std::size_t step_nearest_zero(const StudyResult& r) {
  std::size_t best = 0;
  for (std::size_t k = 1; k < r.steps.size(); ++k)
    if (std::abs(folded(r.steps[k].electrical_angle)) < std::abs(folded(r.steps[best].electrical_angle))) best = k;
  return best;
}

struct Row {
  std::string quantity, unit;
  std::vector<std::string> values = {};
};

std::vector<Row> headline_rows(const std::vector<ComparedCase>& cases) {
  std::vector<Row> rows = {{"title", ""},
                           {"study", ""},
                           {"solved by", ""},
                           {"air-gap B_r fundamental (mean over steps)", "T"},
                           {"amplitude ripple", "%"},
                           {"peak-field ripple", "%"},
                           {"rotation uniformity (worst axis-step deviation)", "° mech."},
                           {"backward/forward ratio", ""},
                           {"locus axis ratio (minor/major)", ""},
                           {"harmonic distortion (mean over steps)", "%"},
                           {"winding factor (fundamental)", ""},
                           {"torque, Arkkio, mean", "N·m"},
                           {"torque ripple (Arkkio, peak-to-peak / |mean|)", "%"}};
  for (const ComparedCase& c : cases) {
    const RotationMetrics& m = c.metrics;
    const bool torque = c.torque.has_value();
    const std::vector<std::string> values = {c.title, c.study, c.solved_by, num(m.mean_fundamental),
                                             percent(m.amplitude_ripple), percent(m.peak_ripple),
                                             svg::format_number_against(m.rotation_uniformity_deg, m.expected_step_deg, 6),
                                             ratio(m.backward_forward_ratio), ratio(locus_axis_ratio(m)),
                                             percent(m.mean_distortion),
                                             num(c.winding_factor), torque ? num(c.torque->mean) : "–",
                                             torque && std::isfinite(c.torque->ripple) ? num(100 * c.torque->ripple) : "–"};
    for (std::size_t i = 0; i < rows.size(); ++i) rows[i].values.push_back(values[i]);
  }
  return rows;
}

Table headline_table(const std::vector<ComparedCase>& cases) {
  Table t{"Headline numbers side by side", {"quantity"}, {},
          "As in comparison.csv. Metrics of the fundamental phasor c_p of B_r on the mid-gap circle over the steps; "
          "ripples are (max − min)/mean; angles mechanical. The locus axis ratio is (F − B)/(F + B) of the "
          "fundamental's forward and backward waves: 1 for a circular locus. Torque over the stack length, "
          "counter-clockwise positive, where the rotor turns (–: not this study's). Values below 1e-9 of the largest "
          "value they are shown with (round-off) are shown as 0."};
  for (const ComparedCase& c : cases) t.columns.push_back(c.name);
  t.columns.push_back("unit");
  std::vector<Cell> links = {"report of the case"};  // each case's folder is named after it
  for (const ComparedCase& c : cases) links.emplace_back(c.name + "/report.html", c.name + "/report.html");
  links.emplace_back("");
  t.rows.push_back(std::move(links));
  for (const Row& r : headline_rows(cases)) {
    std::vector<Cell> row = {r.quantity};
    for (const auto& v : r.values) row.emplace_back(v);
    row.emplace_back(r.unit);
    t.rows.push_back(std::move(row));
  }
  return t;
}

Figure gap_field_figure(const std::vector<ComparedCase>& cases) {
  svg::LineChart c{"B_r on the mid-gap circle, every case at ωt = 0", {"angle θ", "° mech."}, {"B_r", "T"}, {}, {}};
  c.x_ticks = {0, 45, 90, 135, 180, 225, 270, 315, 360};
  for (const ComparedCase& k : cases) {
    svg::Series s{fmt::format("{} (ωt = {}°)", k.name, svg::format_number(k.shown_electrical_angle * kDeg, 4)), {}, {}};
    for (std::size_t j = 0; j < k.sample_angles.size() && j < k.br.size(); ++j)
      s.x.push_back(k.sample_angles[j] * kDeg), s.y.push_back(k.br[j]);
    // The circle closes: the first sample again at 360°.
    if (!s.x.empty()) s.x.push_back(s.x.front() + 360.0), s.y.push_back(s.y.front());
    c.series.push_back(std::move(s));
  }
  return {"gap_field", "B_r on the mid-gap circle against the mechanical angle, each case at the step nearest ωt = 0 "
                       "(the legend gives its ωt).",
          svg::line_chart(c)};
}

/// Electrical orders that any case carries at 0.5 % of its fundamental or more, ascending.
std::vector<double> shown_orders(const std::vector<ComparedCase>& cases) {
  std::vector<double> orders;
  for (const ComparedCase& c : cases)
    for (const SpaceHarmonic& h : c.harmonics)
      if (h.relative >= 0.005 &&
          std::none_of(orders.begin(), orders.end(), [&](double o) { return std::abs(o - h.electrical_order) < 1e-9; }))
        orders.push_back(h.electrical_order);
  std::sort(orders.begin(), orders.end());
  return orders;
}

Figure spectrum_figure(const std::vector<ComparedCase>& cases) {
  svg::GroupedBarChart c{"Space harmonics of B_r side by side", {"electrical order ν", ""}, {"|c_n|", "T"}, {}, {}};
  const std::vector<double> orders = shown_orders(cases);
  for (double o : orders) c.categories.push_back(svg::format_number(o, 4));
  for (const ComparedCase& k : cases) {
    svg::BarSeries s{k.name, std::vector<double>(orders.size(), std::nan(""))};
    for (const SpaceHarmonic& h : k.harmonics)
      for (std::size_t i = 0; i < orders.size(); ++i)
        if (std::abs(h.electrical_order - orders[i]) < 1e-9) s.values[i] = h.amplitude;
    c.series.push_back(std::move(s));
  }
  return {"spectra", "Amplitude |c_n| of each space harmonic of B_r (peak, mean over the steps) by electrical order "
                     "ν = n/p, one bar per case on one axis; orders any case carries at 0.5 % of its fundamental or "
                     "more.",
          svg::grouped_bar_chart(c)};
}

Figure locus_figure(const std::vector<ComparedCase>& cases) {
  svg::LocusOverlay c{"Loci of the fundamental phasors c_p over the period", "T", {}};
  for (const ComparedCase& k : cases) c.loci.push_back({k.name, k.locus});
  return {"loci", "The fundamental phasor c_p of B_r of each case at each step, joined in order (a dot at the first "
                  "step): a perfect rotating field traces the dashed circle of its mean radius, an elliptic one an "
                  "ellipse, a pulsating field a line.",
          svg::locus_overlay(c)};
}

}  // namespace

double locus_axis_ratio(const RotationMetrics& m) {
  const double sum = m.forward + m.backward;
  return sum > 0.0 ? (m.forward - m.backward) / sum : 0.0;
}

ComparedCase compared_case(const RunRecord& r) {
  ComparedCase c;
  c.title = r.title;
  c.study = r.study;
  const StudyResult& field = *r.field;
  c.metrics = field.metrics;
  c.pole_pairs = r.winding->spec.pole_pairs();
  c.winding_factor = mesh::layout_winding_factor(*r.winding, 0, c.pole_pairs);
  c.sample_angles = field.sample_angles;
  if (!field.steps.empty()) {
    const StepResult& shown = field.steps[step_nearest_zero(field)];
    c.br.assign(shown.br.data(), shown.br.data() + shown.br.size());
    c.shown_electrical_angle = folded(shown.electrical_angle);
  }
  for (const StepResult& s : field.steps) c.locus.push_back(s.fundamental);
  c.harmonics = space_harmonics(field, *r.winding, r.frequency);
  if (r.motion && r.rotor_turns) c.torque = r.motion->arkkio;
  return c;
}

Page comparison_page(const std::vector<ComparedCase>& cases) {
  Page page;
  page.title = fmt::format("Comparison of {} cases", cases.size());
  for (const ComparedCase& c : cases) page.subtitle += (page.subtitle.empty() ? "" : " · ") + c.name + ": " + c.title;
  page.tables.push_back(headline_table(cases));
  for (const ComparedCase& c : cases)
    page.tables.push_back(space_harmonic_table(c.harmonics, "Space harmonics of B_r, " + c.name + " (electrical orders)"));
  page.figures = {gap_field_figure(cases), spectrum_figure(cases), locus_figure(cases)};
  return page;
}

}  // namespace tf::post
