#include "post/sweep_report.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>
#include <fmt/ranges.h>

#include "post/sweep_figures.hpp"
#include "post/svg_plot.hpp"

namespace tf::post {
namespace {

// The marks of the table's tie and Pareto columns, with no-break spaces so each stays on one line.
constexpr const char* kTiedMark = "=\u00a0tied";
constexpr const char* kOptimalMark = "◆\u00a0optimal";

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

const char* direction(bool lower_is_better) { return lower_is_better ? "lowest first" : "highest first"; }

Table ranked_table(const SweepTable& t) {
  Table table{"Variants", {"rank", "variant"}, {}, "Each variant links to its own report. Failed variants show why."};
  if (t.rank_by >= 0) table.note = ranking_sentence(t) + " " + table.note;
  for (const auto& p : t.parameters) table.columns.push_back(p);
  table.columns.push_back("status");
  table.columns.push_back("tied with best");
  if (t.pareto.shown()) table.columns.push_back("Pareto");
  for (const auto& m : t.metrics) table.columns.push_back(metric_heading(m));
  table.columns.push_back("message");
  for (const SweepRow* r : report_order(t)) {
    std::vector<Cell> row{r->rank > 0 ? std::to_string(r->rank) : "–", Cell(r->variant, r->variant + "/report.html")};
    for (const auto& v : r->inputs) row.emplace_back(v);
    row.resize(2 + t.parameters.size());
    row.emplace_back(r->status);
    row.emplace_back(r->tied_with_best ? kTiedMark : "");
    if (t.pareto.shown()) row.emplace_back(!in_pareto_view(t, *r) ? "" : r->pareto_optimal ? kOptimalMark : "dominated");
    for (std::size_t k = 0; k < t.metrics.size(); ++k) row.emplace_back(k < r->metrics.size() ? metric_text(r->metrics[k]) : "–");
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

Section sweep_section(const SweepTable& t, const std::string& best_variant_note) {
  int ok = 0;
  for (const auto& r : t.rows) ok += r.status == "ok" ? 1 : 0;
  std::string varied;
  for (const auto& p : t.parameters) varied += (varied.empty() ? "" : ", ") + p;
  Section sweep{"Sweep", {{"sweep file", t.sweep_file, ""}, {"base case", t.base_case, ""}, {"varied inputs", varied, ""},
                          {"variants", std::to_string(t.rows.size()), ""}, {"variants that ran", std::to_string(ok), ""}},
                best_variant_note};
  if (t.rank_by >= 0 && t.rank_by < static_cast<int>(t.metrics.size())) {
    const MetricColumn& m = t.metrics[static_cast<std::size_t>(t.rank_by)];
    sweep.rows.push_back({"ranked by", m.label + (m.lower_is_better ? ", lower is better" : ", higher is better"), m.unit});
    sweep.rows.push_back({"tied with the best", "within " + svg::format_number(100 * t.rank_tolerance) + " % of it", ""});
    const std::string tie = t.tie_break < 0 ? "none (ties keep the ranking metric's order)"
                                            : t.metrics[static_cast<std::size_t>(t.tie_break)].label + ", " +
                                                  direction(t.tie_break_lower_is_better);
    sweep.rows.push_back({"tie broken by", tie, ""});
  }
  if (t.pareto.shown()) sweep.rows.push_back({"Pareto view", pareto_sentence(t), ""});
  return sweep;
}

}  // namespace

std::string ranking_sentence(const SweepTable& t) {
  if (t.rank_by < 0) return "Not ranked.";
  const MetricColumn& m = t.metrics[static_cast<std::size_t>(t.rank_by)];
  const auto col = static_cast<std::size_t>(t.rank_by);
  double best = std::nan("");  // of the metric itself: after a tie-break rank 1 need not hold it
  int tied = 0;
  for (const auto& r : t.rows) {
    if (r.rank > 0 && (std::isnan(best) || (m.lower_is_better ? r.metrics[col] < best : r.metrics[col] > best)))
      best = r.metrics[col];
    tied += r.tied_with_best;
  }
  std::string s = fmt::format("Ranked by {} ({}), {}.", m.label, m.key, direction(m.lower_is_better));
  if (std::isnan(best)) return s + " No variant could be ranked.";
  s += fmt::format(" Variants within {} % of the best {} ({}) count as tied with it", svg::format_number(100 * t.rank_tolerance),
                   m.key, metric_text(best));
  if (tied == 0) return s + "; no other variant is that close.";
  s += fmt::format(" (marked \"= tied\": {} variants)", tied);
  if (t.tie_break < 0) return s + "; no tie-break metric is named (tie_break), so they keep the order of " + m.key + ".";
  const MetricColumn& b = t.metrics[static_cast<std::size_t>(t.tie_break)];
  return s + fmt::format(" and are ordered among themselves by {} ({}), {}.", b.label, b.key, direction(t.tie_break_lower_is_better));
}

std::string pareto_sentence(const SweepTable& t) {
  if (!t.pareto.shown()) return "";
  const auto& x = t.metrics[static_cast<std::size_t>(t.pareto.x)];
  const auto& y = t.metrics[static_cast<std::size_t>(t.pareto.y)];
  return fmt::format("Pareto-optimal on {} ({} best) and {} ({} best)", x.key, t.pareto.x_lower_is_better ? "lowest" : "highest",
                     y.key, t.pareto.y_lower_is_better ? "lowest" : "highest");
}

Page sweep_page(const SweepTable& t, const std::string& best_variant_note) {
  Page page;
  page.title = t.title.empty() ? "Sweep" : t.title;
  int ok = 0;
  for (const auto& r : t.rows) ok += r.status == "ok" ? 1 : 0;
  page.subtitle = "Sweep of " + std::to_string(t.rows.size()) + " variants, " + std::to_string(ok) + " ran";
  page.sections.push_back(sweep_section(t, best_variant_note));
  page.tables.push_back(ranked_table(t));
  if (t.pareto.shown()) page.figures.push_back(pareto_figure(t));
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
