#include "post/sweep_report.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdlib>
#include <map>

#include <fmt/format.h>
#include <fmt/ranges.h>

#include "post/svg_plot.hpp"

namespace tf::post {
namespace {

std::string num(double v) { return svg::format_number(v, 5); }

/// The value as a number, or NaN when the text is not one (a choice such as "semi_closed").
double as_number(const std::string& text) {
  if (text.empty()) return std::nan("");
  char* end = nullptr;
  const double v = std::strtod(text.c_str(), &end);
  return end != nullptr && *end == '\0' ? v : std::nan("");
}

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

std::string metric_heading(const MetricColumn& m) { return m.unit.empty() ? m.label : m.label + " [" + m.unit + "]"; }

/// Rows in report order: by rank, then the unranked in the sweep's order.
std::vector<const SweepRow*> report_order(const SweepTable& t) {
  std::vector<const SweepRow*> rows;
  for (const auto& r : t.rows) rows.push_back(&r);
  std::stable_sort(rows.begin(), rows.end(), [](const SweepRow* a, const SweepRow* b) {
    const int ra = a->rank > 0 ? a->rank : 1 << 30, rb = b->rank > 0 ? b->rank : 1 << 30;
    return ra < rb;
  });
  return rows;
}

Table ranked_table(const SweepTable& t) {
  Table table{"Variants", {"rank", "variant"}, {}, "Each variant links to its own report. Failed variants show why."};
  for (const auto& p : t.parameters) table.columns.push_back(p);
  table.columns.push_back("status");
  for (const auto& m : t.metrics) table.columns.push_back(metric_heading(m));
  table.columns.push_back("message");
  for (const SweepRow* r : report_order(t)) {
    std::vector<Cell> row{r->rank > 0 ? std::to_string(r->rank) : "–", Cell(r->variant, r->variant + "/report.html")};
    for (std::size_t i = 0; i < t.parameters.size(); ++i) row.emplace_back(input_of(*r, i));
    row.emplace_back(r->status);
    for (std::size_t k = 0; k < t.metrics.size(); ++k) row.emplace_back(k < r->metrics.size() ? num(r->metrics[k]) : "–");
    row.emplace_back(r->message);
    table.rows.push_back(std::move(row));
  }
  return table;
}

/// Whether metric k is zero to round-off in every variant (a balanced supply's amplitude ripple,
/// backward wave and rotation deviation): a plot of it would only show numerical noise.
bool at_round_off(const SweepTable& t, std::size_t k) {
  return std::all_of(t.rows.begin(), t.rows.end(), [k](const SweepRow& r) {
    return k >= r.metrics.size() || !std::isfinite(r.metrics[k]) || std::abs(r.metrics[k]) < 1e-9;
  });
}

/// Metric k against parameter i: one series per combination of the other parameters' values.
Figure metric_figure(const SweepTable& t, std::size_t k, std::size_t i) {
  const MetricColumn& m = t.metrics[k];
  const std::string param = t.parameters[i];
  bool numeric = true;
  std::vector<std::string> categories;
  for (const auto& r : t.rows) {
    const std::string& v = input_of(r, i);
    numeric = numeric && std::isfinite(as_number(v));
    if (std::find(categories.begin(), categories.end(), v) == categories.end()) categories.push_back(v);
  }
  std::map<std::string, std::vector<std::pair<double, double>>> groups;  // other values -> (x, metric)
  for (const auto& r : t.rows) {
    std::string others;
    for (std::size_t j = 0; j < t.parameters.size(); ++j)
      if (j != i) others += (others.empty() ? "" : ", ") + short_key(t.parameters[j]) + "=" + input_of(r, j);
    const double x = numeric ? as_number(input_of(r, i))
                             : static_cast<double>(std::find(categories.begin(), categories.end(), input_of(r, i)) -
                                                   categories.begin());
    groups[others].push_back({x, k < r.metrics.size() ? r.metrics[k] : kNoValue});
  }
  // Zipped keys vary together, so no two variants share the other keys' values: one series then.
  const bool lone = std::all_of(groups.begin(), groups.end(), [](const auto& g) { return g.second.size() == 1; });
  if (lone && groups.size() > 1) {
    std::vector<std::pair<double, double>> all;
    for (const auto& g : groups) all.push_back(g.second.front());
    groups = {{"", all}};
  }
  svg::LineChart c{m.label + " against " + param, {param, ""}, {m.label, m.unit}, {}, numeric ? std::vector<std::string>{} : categories};
  for (auto& [name, points] : groups) {
    std::stable_sort(points.begin(), points.end());
    // The palette has eight colours; further series are dashed so that none looks like another.
    svg::Series s{name.empty() ? m.label : name, {}, {}, c.series.size() >= 8, true};
    for (const auto& [x, y] : points) s.x.push_back(x), s.y.push_back(y);
    c.series.push_back(std::move(s));
  }
  return {file_stem(m.key + "_vs_" + param),
          metric_heading(m) + " of each variant that ran against " + param +
              (t.parameters.size() > 1 && !lone ? ", one series per value of the other varied inputs" : "") +
              (m.lower_is_better ? " (lower is better)." : " (higher is better)."),
          svg::line_chart(c)};
}

}  // namespace

Page sweep_page(const SweepTable& t, const std::string& best_variant_note) {
  Page page;
  page.title = t.title.empty() ? "Sweep" : t.title;
  int ok = 0;
  for (const auto& r : t.rows) ok += r.status == "ok" ? 1 : 0;
  page.subtitle = "Sweep of " + std::to_string(t.rows.size()) + " variants, " + std::to_string(ok) + " ran";
  std::string varied;
  for (const auto& p : t.parameters) varied += (varied.empty() ? "" : ", ") + p;
  Section sweep{"Sweep", {{"sweep file", t.sweep_file, ""}, {"base case", t.base_case, ""}, {"varied inputs", varied, ""},
                          {"variants", std::to_string(t.rows.size()), ""}, {"variants that ran", std::to_string(ok), ""}},
                best_variant_note};
  if (t.rank_by >= 0 && t.rank_by < static_cast<int>(t.metrics.size())) {
    const MetricColumn& m = t.metrics[static_cast<std::size_t>(t.rank_by)];
    sweep.rows.push_back({"ranked by", m.label + (m.lower_is_better ? ", lower is better" : ", higher is better"), m.unit});
  }
  page.sections.push_back(std::move(sweep));
  page.tables.push_back(ranked_table(t));
  std::vector<std::string> round_off;
  for (std::size_t k = 0; k < t.metrics.size(); ++k) {
    const bool any = std::any_of(t.rows.begin(), t.rows.end(),
                                 [k](const SweepRow& r) { return k < r.metrics.size() && std::isfinite(r.metrics[k]); });
    if (!any) continue;
    if (at_round_off(t, k)) {
      round_off.push_back(t.metrics[k].label);
      continue;
    }
    for (std::size_t i = 0; i < t.parameters.size(); ++i) page.figures.push_back(metric_figure(t, k, i));
  }
  if (!round_off.empty())
    page.tables.front().note += " Not plotted, as every variant has them at round-off level (below 1e-9): " +
                                fmt::format("{}", fmt::join(round_off, ", ")) + ".";
  return page;
}

void write_sweep_report(const std::filesystem::path& dir, const SweepTable& t, const std::string& best_variant_note) {
  write_report(dir, sweep_page(t, best_variant_note));
}

}  // namespace tf::post
