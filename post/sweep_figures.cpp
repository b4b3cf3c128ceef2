#include "post/sweep_figures.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdlib>
#include <map>
#include <regex>

#include <fmt/format.h>
#include <fmt/ranges.h>

#include "post/svg_frame.hpp"
#include "post/sweep_charts.hpp"
#include "post/sweep_report.hpp"

namespace tf::post {
namespace {

using Points = std::vector<std::pair<double, double>>;  // (x, metric), sorted by x

/// One series of a figure before it is drawn.
struct Curve {
  std::string name;
  Points points;
};

/// The value as a number, or NaN when the text is not one (a choice such as "semi_closed").
double as_number(const std::string& text) {
  if (text.empty()) return std::nan("");
  char* end = nullptr;
  const double v = std::strtod(text.c_str(), &end);
  return end != nullptr && *end == '\0' ? v : std::nan("");
}

bool whole_number(const std::string& text) { return std::regex_match(text, std::regex("[+-]?[0-9]+")); }

std::string file_stem(const std::string& text) {
  std::string out;
  for (char ch : text) out += std::isalnum(static_cast<unsigned char>(ch)) || ch == '-' ? ch : '_';
  return out;
}

/// Input i of a row; empty when the row lacks it.
const std::string& input_of(const SweepRow& r, std::size_t i) {
  static const std::string none;
  return i < r.inputs.size() ? r.inputs[i] : none;
}

/// "stator.slot.opening" -> "opening": series names must fit the legend beside the chart.
std::string short_key(const std::string& key) { return key.substr(key.rfind('.') + 1); }

/// How parameter i is laid along the x axis: numbers on a numeric axis, or categories (names,
/// and a few whole numbers: a line through "2.5 phases" would show designs that cannot exist).
struct XAxis {
  std::vector<std::string> categories;  ///< empty: numeric
  double position(const std::string& value) const {
    if (categories.empty()) return as_number(value);
    return static_cast<double>(std::find(categories.begin(), categories.end(), value) - categories.begin());
  }
};

XAxis x_axis(const SweepTable& t, std::size_t i) {
  std::vector<std::string> values;
  bool numeric = true, whole = true;
  for (const auto& r : t.rows) {
    const std::string& v = input_of(r, i);
    numeric = numeric && std::isfinite(as_number(v));
    whole = whole && whole_number(v);
    if (std::find(values.begin(), values.end(), v) == values.end()) values.push_back(v);
  }
  if (numeric && !(whole && values.size() <= kMaxIntegerCategories)) return {};
  if (whole) std::stable_sort(values.begin(), values.end(), [](const auto& a, const auto& b) { return as_number(a) < as_number(b); });
  return {values};
}

/// Metric k against parameter i, one curve per combination of the other parameters' values.
std::vector<Curve> curves(const SweepTable& t, std::size_t k, std::size_t i, const XAxis& axis) {
  std::map<std::string, Points> groups;  // the other parameters' values -> points
  for (const auto& r : t.rows) {
    std::string others;
    for (std::size_t j = 0; j < t.parameters.size(); ++j)
      if (j != i) others += (others.empty() ? "" : ", ") + short_key(t.parameters[j]) + "=" + input_of(r, j);
    groups[others].push_back({axis.position(input_of(r, i)), k < r.metrics.size() ? r.metrics[k] : kNoValue});
  }
  // Zipped keys vary together, so no two variants share the other keys' values: one curve then.
  const bool lone = std::all_of(groups.begin(), groups.end(), [](const auto& g) { return g.second.size() == 1; });
  if (lone && groups.size() > 1) {
    Points all;
    for (const auto& g : groups) all.push_back(g.second.front());
    groups = {{"", all}};
  }
  std::vector<Curve> out;
  for (auto& [name, points] : groups) {
    std::stable_sort(points.begin(), points.end());
    out.push_back({name, points});
  }
  return out;
}

/// Same x everywhere and equal metric values (to 1e-9 relative, or both missing), with data.
bool coincide(const Points& a, const Points& b) {
  if (a.size() != b.size()) return false;
  bool any = false;
  for (std::size_t i = 0; i < a.size(); ++i) {
    const double ya = a[i].second, yb = b[i].second;
    if (a[i].first != b[i].first || std::isnan(ya) != std::isnan(yb)) return false;
    if (std::isnan(ya)) continue;
    if (std::abs(ya - yb) > 1e-9 * std::max(std::abs(ya), std::abs(yb))) return false;
    any = true;
  }
  return any;
}

std::vector<std::string> split(const std::string& text, const std::string& by) {
  std::vector<std::string> parts;
  for (std::size_t from = 0;;) {
    const std::size_t at = text.find(by, from);
    parts.push_back(text.substr(from, at == std::string::npos ? std::string::npos : at - from));
    if (at == std::string::npos) return parts;
    from = at + by.size();
  }
}

/// "a, b and c"; "a, b; c, d and e, f" when the items hold commas themselves.
std::string listed(const std::vector<std::string>& items) {
  if (items.size() < 2) return items.empty() ? "" : items.front();
  const bool commas = std::any_of(items.begin(), items.end(), [](const auto& s) { return s.find(", ") != std::string::npos; });
  return fmt::format("{} and {}", fmt::join(items.begin(), items.end() - 1, commas ? "; " : ", "), items.back());
}

/// The legend of curves drawn as one: "coil_pitch=5: opening=0.002 and 0.003 coincide" (the
/// parts all names share first, then what differs; one key's name only once).
std::string coincide_name(const std::vector<std::string>& names) {
  std::vector<std::vector<std::string>> parts;
  for (const auto& n : names) parts.push_back(split(n, ", "));
  const auto shared = [&](const std::string& part) {
    return std::all_of(parts.begin(), parts.end(), [&](const auto& q) { return std::find(q.begin(), q.end(), part) != q.end(); });
  };
  std::vector<std::string> common, differing;
  for (const auto& part : parts.front())
    if (shared(part)) common.push_back(part);
  for (const auto& q : parts) {
    std::vector<std::string> rest;
    for (const auto& part : q)
      if (!shared(part)) rest.push_back(part);
    differing.push_back(fmt::format("{}", fmt::join(rest, ", ")));
  }
  // They differ in one key only ("opening=0.002", "opening=0.003"): name it once.
  const std::string key = differing.front().substr(0, differing.front().find('=') + 1);
  const bool one_key = !key.empty() && std::all_of(differing.begin(), differing.end(), [&](const std::string& d) {
    return d.rfind(key, 0) == 0 && d.find(", ") == std::string::npos;
  });
  if (one_key)
    for (std::size_t d = 1; d < differing.size(); ++d) differing[d] = differing[d].substr(key.size());
  const std::string head = common.empty() ? "" : fmt::format("{}: ", fmt::join(common, ", "));
  return head + listed(differing) + " coincide";
}

/// Curves that coincide are drawn once, named so the legend says so.
std::vector<Curve> merge_coincident(const std::vector<Curve>& in) {
  std::vector<Curve> out;
  std::vector<bool> used(in.size(), false);
  for (std::size_t a = 0; a < in.size(); ++a) {
    if (used[a]) continue;
    std::vector<std::string> names{in[a].name};
    for (std::size_t b = a + 1; b < in.size(); ++b)
      if (!used[b] && coincide(in[a].points, in[b].points)) used[b] = true, names.push_back(in[b].name);
    Curve c = in[a];
    if (names.size() > 1) c.name = coincide_name(names);
    out.push_back(std::move(c));
  }
  return out;
}

std::vector<svg::PointSeries> point_series(const MetricColumn& m, const std::vector<Curve>& curves, bool joined) {
  std::vector<svg::PointSeries> out;
  for (const auto& curve : curves) {
    svg::PointSeries s{curve.name.empty() ? m.label : curve.name, {}, {}};
    s.joined = joined;
    for (const auto& [x, y] : curve.points) s.x.push_back(x), s.y.push_back(y);
    out.push_back(std::move(s));
  }
  return out;
}

}  // namespace

std::string metric_heading(const MetricColumn& m) { return m.unit.empty() ? m.label : m.label + " [" + m.unit + "]"; }

std::string metric_text(double v) { return svg::format_number(v, 5); }

std::string inputs_text(const SweepTable& t, const SweepRow& r) {
  std::vector<std::string> parts;
  for (std::size_t k = 0; k < t.parameters.size(); ++k) parts.push_back(t.parameters[k] + " = " + input_of(r, k));
  return fmt::format("{}", fmt::join(parts, ", "));
}

Figure metric_figure(const SweepTable& t, std::size_t k, std::size_t i) {
  const MetricColumn& m = t.metrics[k];
  const std::string& param = t.parameters[i];
  const XAxis axis = x_axis(t, i);
  const std::vector<Curve> all = curves(t, k, i, axis);
  const std::vector<Curve> drawn = merge_coincident(all);
  const std::string title = m.label + " against " + param;
  std::string caption = metric_heading(m) + " of each variant that ran against " + param;
  if (all.size() > 1) caption += ", one series per value of the other varied inputs";
  if (!axis.categories.empty()) caption += "; " + short_key(param) + " takes a few separate values, so each is a category and series stand side by side";
  caption += m.lower_is_better ? " (lower is better)." : " (higher is better).";
  const svg::Axis x{param, ""}, y{m.label, m.unit};
  const std::string chart =
      axis.categories.empty()
          ? svg::scatter_chart({title, x, y, point_series(m, drawn, true)})
          : svg::category_chart({title, x, y, axis.categories, point_series(m, drawn, false)});
  return {file_stem(m.key + "_vs_" + param), caption, chart};
}

Figure pareto_figure(const SweepTable& t) {
  const MetricColumn& mx = t.metrics[static_cast<std::size_t>(t.pareto.x)];
  const MetricColumn& my = t.metrics[static_cast<std::size_t>(t.pareto.y)];
  svg::PointSeries front{"", {}, {}, {}, 11, svg::series_colour(1), true, true};
  svg::PointSeries rest{"", {}, {}, {}, 7, "#8a8a8a", false};
  std::vector<const SweepRow*> optimal;
  for (const auto& r : t.rows) {
    const double x = r.metrics[static_cast<std::size_t>(t.pareto.x)], y = r.metrics[static_cast<std::size_t>(t.pareto.y)];
    if (r.status != "ok" || !std::isfinite(x) || !std::isfinite(y)) continue;
    if (r.pareto_optimal) optimal.push_back(&r);
    auto& s = r.pareto_optimal ? front : rest;
    s.x.push_back(x), s.y.push_back(y);
    s.tips.push_back(fmt::format("{}: {}; {} = {}, {} = {}", r.variant, inputs_text(t, r), mx.key, metric_text(x), my.key, metric_text(y)));
  }
  // The front is joined in the order of its x values, so it reads as the trade-off it is.
  std::vector<std::size_t> by_x(front.x.size());
  for (std::size_t i = 0; i < by_x.size(); ++i) by_x[i] = i;
  std::sort(by_x.begin(), by_x.end(), [&](std::size_t a, std::size_t b) { return front.x[a] < front.x[b]; });
  svg::PointSeries sorted = front;
  for (std::size_t i = 0; i < by_x.size(); ++i) sorted.x[i] = front.x[by_x[i]], sorted.y[i] = front.y[by_x[i]], sorted.tips[i] = front.tips[by_x[i]];
  sorted.name = fmt::format("non-dominated ({})", sorted.x.size());
  rest.name = fmt::format("dominated ({})", rest.x.size());
  const auto better = [](bool lower) { return lower ? "lower" : "higher"; };
  svg::ScatterChart c{"Pareto view: " + my.label + " against " + mx.label, {mx.label, mx.unit}, {my.label, my.unit}, {rest, sorted}};
  std::vector<std::string> listed_rows;
  for (const SweepRow* r : optimal) listed_rows.push_back(r->variant + " (" + inputs_text(t, *r) + ")");
  const std::string caption = fmt::format(
      "{} against {} of every variant that ran; {} {} and {} {} are better. The non-dominated variants (no other "
      "variant is at least as good in both and better in one: Pareto dominance as defined by Deb, Multi-Objective "
      "Optimization Using Evolutionary Algorithms, 2001, ch. 2) are marked and joined; each is a best trade-off. "
      "Non-dominated: {}.",
      metric_heading(my), metric_heading(mx), better(t.pareto.x_lower_is_better), mx.label,
      better(t.pareto.y_lower_is_better), my.label, listed_rows.empty() ? "none" : fmt::format("{}", fmt::join(listed_rows, "; ")));
  return {file_stem("pareto_" + my.key + "_vs_" + mx.key), caption, svg::scatter_chart(c)};
}

}  // namespace tf::post
