#include "post/case_report.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <utility>

#include <fmt/format.h>
#include "post/flux_density.hpp"
#include "post/space_harmonic_table.hpp"
#include "post/report_parts.hpp"
#include "post/space_harmonics.hpp"
#include "post/svg_plot.hpp"

namespace tf::post {
namespace {

constexpr double kDeg = 180.0 / std::numbers::pi;

std::string num(double v, int digits = 4) { return svg::format_number(v, digits); }

/// Unwrapped mechanical axis angle [deg] of the fundamental over the steps (continuous, no jumps of 360/p).
std::vector<double> unwrapped_axis(const StudyResult& r, int p) {
  std::vector<double> out;
  const double turn = 360.0 / p;
  for (const auto& s : r.steps) {
    double a = s.axis * kDeg;
    if (!out.empty()) a += turn * std::round((out.back() - a) / turn);
    out.push_back(a);
  }
  return out;
}

Figure cross_section_figure(const CrossSection& s) {
  return {"cross_section", section_caption(s), svg::field_map(section_map(s))};
}

/// B_r against angle at up to four steps spread over the sequence.
Figure waveform_figure(const StudyResult& r, const std::vector<double>& when, const svg::Axis& when_axis) {
  svg::LineChart c{"Air-gap radial flux density B_r on the mid-gap circle", {"angle θ", "°"}, {"B_r", "T"}, {}, {}};
  const std::size_t n = r.steps.size();
  std::vector<std::size_t> picks;
  for (std::size_t i = 0; i < std::min<std::size_t>(4, n); ++i) picks.push_back(i * n / std::min<std::size_t>(4, n));
  for (std::size_t k : picks) {
    svg::Series s{fmt::format("{} = {} {}", when_axis.label, num(when[k], 4), when_axis.unit), {}, {}};
    for (std::size_t j = 0; j < r.sample_angles.size(); ++j) {
      s.x.push_back(r.sample_angles[j] * kDeg);
      s.y.push_back(r.steps[k].br(static_cast<Eigen::Index>(j)));
    }
    c.series.push_back(std::move(s));
  }
  return {"gap_field", "B_r on the mid-gap circle against the mechanical angle, at up to four steps spread over the "
                       "study.",
          svg::line_chart(c)};
}

Figure spectrum_figure(const StudyResult& r, int p) {
  svg::StemChart c{"Space harmonics of B_r, mean amplitude over the steps",
                   {"space order n (mechanical; fundamental n = " + std::to_string(p) + ")", ""}, {"|c_n|", "T"}, {}, {}};
  const Eigen::Index n_orders = r.steps.empty() ? 0 : r.steps.front().harmonics.size();
  for (Eigen::Index n = 1; n < n_orders; ++n) {
    double sum = 0.0;
    for (const auto& s : r.steps) sum += std::abs(s.harmonics(n));
    c.order.push_back(static_cast<double>(n));
    c.amplitude.push_back(sum / static_cast<double>(r.steps.size()));
  }
  return {"spectrum", "Amplitude |c_n| of each space harmonic of B_r (peak, mean over the steps); orders are "
                      "mechanical, so the fundamental sits at the pole-pair number.",
          svg::stem_chart(c)};
}

Figure locus_figure(const StudyResult& r) {
  svg::LocusPlot c{"Locus of the fundamental phasor c_p over the steps", "T", {}};
  for (const auto& s : r.steps) c.points.push_back(s.fundamental);
  return {"locus", "The fundamental phasor c_p of B_r at each step, joined in order: a perfect rotating field traces "
                   "the dashed circle of its mean radius; a pulsating field collapses to a line.",
          svg::locus_plot(c)};
}

/// Amplitude and axis angle of the fundamental against the step variable: two charts.
std::vector<Figure> fundamental_figures(const StudyResult& r, int p, const std::vector<double>& when,
                                        const svg::Axis& when_axis) {
  svg::LineChart amplitude{"Fundamental amplitude |c_p| over the steps", when_axis, {"|c_p|", "T"}, {}, {}};
  svg::LineChart axis{"Field axis angle arg(c_p)/p over the steps", when_axis, {"axis angle", "°"}, {}, {}};
  svg::Series a{"|c_p|", when, {}, false, true}, x{"axis angle (unwrapped)", when, unwrapped_axis(r, p), false, true};
  for (const auto& s : r.steps) a.y.push_back(std::abs(s.fundamental));
  amplitude.series.push_back(std::move(a));
  amplitude.include_zero = true;
  axis.series.push_back(std::move(x));
  return {{"amplitude", "Amplitude of the fundamental at each step; a flat line means no amplitude ripple.",
           svg::line_chart(amplitude)},
          {"axis_angle", "Mechanical angle of the field axis at each step, unwrapped; a straight line means the "
                         "field turns at a uniform rate.",
           svg::line_chart(axis)}};
}

/// The gap-field figures of any study, against the step variable `when`.
void add_gap_figures(Page& page, const ReportContext& x, const StudyResult& r, const std::vector<double>& when,
                     const svg::Axis& when_axis) {
  page.figures.push_back(cross_section_figure(x.section));
  page.figures.push_back(waveform_figure(r, when, when_axis));
  page.figures.push_back(spectrum_figure(r, x.pole_pairs));
  page.figures.push_back(locus_figure(r));
  for (auto& f : fundamental_figures(r, x.pole_pairs, when, when_axis)) page.figures.push_back(std::move(f));
}

/// Ratios and ripples are compared with 1 (their fundamental), the axis deviation with the axis step.
std::vector<KeyValue> field_rows(const RotationMetrics& m, double winding_factor) {
  const auto percent = [](double v) { return svg::format_number_against(100 * v, 100); };
  std::vector<KeyValue> rows = {
      {"air-gap B_r fundamental (mean over steps)", num(m.mean_fundamental), "T"},
      {"amplitude ripple", percent(m.amplitude_ripple), "%"},
      {"peak-field ripple", percent(m.peak_ripple), "%"},
      {"peak |B_r| min – max", num(m.min_peak) + " – " + num(m.max_peak), "T"},
      {"rotation uniformity (worst axis-step deviation)",
       svg::format_number_against(m.rotation_uniformity_deg, m.expected_step_deg), "° mech."},
      {"expected axis step", num(m.expected_step_deg), "° mech."},
      {"backward/forward ratio", svg::format_number_against(m.backward_forward_ratio, 1), ""},
      {"harmonic distortion (mean over steps)", percent(m.mean_distortion), "%"}};
  if (std::isfinite(winding_factor)) rows.push_back({"winding factor (fundamental)", num(winding_factor), ""});
  return rows;
}

Page base_page(const ReportContext& x, const std::string& what) {
  Page page;
  page.title = x.title;
  page.subtitle = what + " · solved on " + x.model;
  return page;
}

std::vector<double> rotor_angles(const MotionResult& r) {
  std::vector<double> out;
  for (const auto& s : r.steps) out.push_back(s.rotor_angle * kDeg);
  return out;
}

std::vector<double> step_angles(const StudyResult& r) {
  std::vector<double> out;
  for (const auto& s : r.steps) out.push_back(s.electrical_angle * kDeg);
  return out;
}

}  // namespace

Eigen::VectorXd flux_density_magnitude(const mesh::Mesh& m, const Eigen::VectorXd& a) {
  return flux_density(m, a).rowwise().norm();
}

namespace {

/// Torque rows and the torque figure of a study whose rotor turns.
void add_torque(Page& page, std::vector<KeyValue>& rows, const MotionResult& r) {
  const auto torque_row = [&](const char* name, const TorqueStats& t) {
    const double largest = std::max(std::abs(t.min), std::abs(t.max));
    const auto text = [&](double v) { return svg::format_number_against(v, largest, 5); };
    rows.push_back({std::string("torque, ") + name + ", mean", text(t.mean), "N·m"});
    rows.push_back({std::string("torque, ") + name + ", min – max", text(t.min) + " – " + text(t.max), "N·m"});
  };
  torque_row("Arkkio", r.arkkio);
  rows.push_back({"torque ripple (Arkkio, peak-to-peak / |mean|)", std::isnan(r.arkkio.ripple) ? "–" : num(100 * r.arkkio.ripple), "%"});
  torque_row("circle", r.circle);
  rows.push_back({"cogging period expected (360°/LCM(Q, 2p))", num(r.cogging_period_expected * kDeg), "° mech."});
  rows.push_back({"cogging period in the Arkkio torque", num(r.cogging_period_measured * kDeg), "° mech."});
  svg::Series arkkio{"Arkkio", rotor_angles(r), {}}, circle{"circle", rotor_angles(r), {}, true},
      work{"virtual work", rotor_angles(r), {}, false, true};
  for (const auto& s : r.steps)
    arkkio.y.push_back(s.torque_arkkio), circle.y.push_back(s.torque_circle), work.y.push_back(s.torque_virtual_work);
  // Arkkio's (the main value) drawn last, on top of the cross-checks that often coincide with it.
  svg::LineChart torque{"Torque against rotor angle", {"rotor angle", "° mech."}, {"torque", "N·m"}, {circle}, {}};
  if (std::any_of(work.y.begin(), work.y.end(), [](double v) { return std::isfinite(v); })) torque.series.push_back(work);
  torque.series.push_back(arkkio);
  page.figures.push_back({"torque", "Torque on the rotor at each position by three methods.", svg::line_chart(torque)});
}

/// The space harmonics of a turning field at 0.5 % of the fundamental or more, in electrical orders.
Table harmonic_table(const StudyResult& field, const RunRecord& r) {
  return space_harmonic_table(space_harmonics(field, *r.winding, r.frequency), "Space harmonics of B_r (electrical orders)");
}

/// What the headline table says about how its numbers were found.
std::string headline_note(const RunRecord& r) {
  std::string note;
  if (r.field && r.field_rotates)
    note += "Metrics of the fundamental phasor c_p of B_r on the mid-gap circle over the steps; ripples are "
            "(max − min)/mean; angles mechanical. ";
  if (r.motion && r.rotor_turns)
    note += "Torque over the stack length, counter-clockwise positive. Arkkio: Maxwell stress averaged over the gap "
            "band (main value); circle: on the mid-gap circle; virtual work: derivative of the co-energy under a "
            "virtual rotation of the rotor (local virtual work, no extra solve). ";
  if (r.eddy) note += "Time averages over a period of the peak phasors; torque over the stack length, counter-clockwise positive. ";
  if (r.motion) note += "Each step solved on its own with Newton's method (nonlinear iron where B-H curves are given). ";
  note += "Values below 1e-9 of the largest value they are shown with (round-off) are shown as 0.";
  return note;
}

}  // namespace

Page study_page(const ReportContext& x, const RunRecord& r) {
  Page page = base_page(x, r.study + " study, solved by " + r.strategy);
  page.warnings = r.warnings;
  std::vector<KeyValue> rows;
  if (r.motion && r.rotor_turns) add_torque(page, rows, *r.motion);
  if (r.motion) {
    rows.push_back({"Newton iterations per solve", num(r.motion->mean_newton_iterations, 3), ""});
    const bool mirrored = r.motion->n_solved < static_cast<int>(r.motion->steps.size());
    rows.push_back({"Steps solved", fmt::format("{} of {}", r.motion->n_solved, r.motion->steps.size()),
                    mirrored ? "the others mirror a solved step by the field's half-period symmetry (odd B-H curves)" : ""});
  }
  if (r.field && r.field_rotates) {
    for (auto& row : field_rows(r.field->metrics, x.winding_factor)) rows.push_back(std::move(row));
  } else if (r.field) {
    rows.push_back({"air-gap B_r fundamental (mean over steps)", num(r.field->metrics.mean_fundamental), "T"});
    rows.push_back({"peak-field ripple", num(100 * r.field->metrics.peak_ripple), "%"});
  }
  if (r.motion) add_motion_parts(page, rows, *r.motion, x.pole_pairs, r.rotor_turns);
  if (r.eddy) add_speed_parts(page, rows, r.eddy->rows);
  page.sections.insert(page.sections.begin(), Section{"Headline numbers", rows, headline_note(r)});
  if (r.field && r.field_rotates) page.tables.push_back(harmonic_table(*r.field, r));
  if (r.field) {
    const bool by_rotor = r.motion && r.rotor_turns;
    add_gap_figures(page, x, *r.field, by_rotor ? rotor_angles(*r.motion) : step_angles(*r.field),
                    by_rotor ? svg::Axis{"rotor angle", "° mech."} : svg::Axis{"ωt", "° el."});
  } else if (!x.section.empty()) {
    page.figures.push_back(cross_section_figure(x.section));
  }
  page.appendix.push_back(inputs_section(x.inputs_json));
  return page;
}

}  // namespace tf::post
