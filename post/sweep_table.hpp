#pragma once
// The results of a sweep as one table: a row per variant with its varied inputs, its status and
// its headline numbers. Filled by app/ from the variants' summary.json files; written as
// sweep_summary.csv and drawn in the sweep's report.

#include <cmath>
#include <limits>
#include <string>
#include <vector>

namespace tf::post {

/// One headline number of a variant, as a column of the table.
struct MetricColumn {
  std::string key;            ///< column name in the CSV, e.g. "fundamental_T"
  std::string label;          ///< for people, e.g. "B_r fundamental"
  std::string unit;           ///< e.g. "T", "%", "N·m"; empty for ratios
  bool lower_is_better = false;
};

/// A variant whose status is not "ok" has its message set and every metric NaN.
struct SweepRow {
  std::string variant;              ///< folder name (a stable hash of its inputs)
  std::vector<std::string> inputs;  ///< one per SweepTable::parameters, as written in the case file
  std::string status;               ///< "ok", "failed", "invalid" or "missing"
  std::string message;              ///< why it failed; empty when ok
  std::vector<double> metrics;      ///< one per SweepTable::metrics; NaN where not computed
  int rank = 0;                     ///< 1 = best by SweepTable::rank_by; 0 = not ranked
  bool tied_with_best = false;      ///< within SweepTable::rank_tolerance of the best (a tie of two or more)
  bool pareto_optimal = false;      ///< not dominated on SweepTable::pareto's two metrics
};

/// Two metrics to weigh against each other: each variant a point, the non-dominated ones marked.
struct ParetoAxes {
  int x = -1, y = -1;  ///< indices into SweepTable::metrics; -1 = no Pareto view
  bool x_lower_is_better = true, y_lower_is_better = true;
  bool shown() const { return x >= 0 && y >= 0; }
};

struct SweepTable {
  std::string title;                    ///< of the sweep file
  std::string sweep_file;               ///< as given on the command line
  std::string base_case;                ///< path of the base case
  std::vector<std::string> parameters;  ///< varied case keys, dotted ("stator.slot_opening")
  std::vector<MetricColumn> metrics;
  std::vector<SweepRow> rows;           ///< in the sweep file's order of variants
  int rank_by = -1;                     ///< index into metrics; -1 = no ranking
  double rank_tolerance = 0.0;          ///< relative: rows this close to the best are tied with it
  int tie_break = -1;                   ///< index into metrics ordering the tied rows; -1 = none
  bool tie_break_lower_is_better = true;
  ParetoAxes pareto = {};
};

inline constexpr double kNoValue = std::numeric_limits<double>::quiet_NaN();

/// Whether row r is a point of t's Pareto view: it ran and has both metrics.
inline bool in_pareto_view(const SweepTable& t, const SweepRow& r) {
  return t.pareto.shown() && r.status == "ok" && std::isfinite(r.metrics[static_cast<std::size_t>(t.pareto.x)]) &&
         std::isfinite(r.metrics[static_cast<std::size_t>(t.pareto.y)]);
}

}  // namespace tf::post
