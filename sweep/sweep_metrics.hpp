#pragma once
// The headline numbers a sweep tabulates and ranks by, read from each variant's summary.json
// (the ranking itself is in sweep_ranking.hpp).

#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "post/sweep_table.hpp"

namespace tf::sweep {

/// The columns, in the order of sweep_summary.csv: field metrics (README.md, "Field-rotation metrics"), the
/// winding factor, and Arkkio's torque where the study computes torque.
std::vector<post::MetricColumn> sweep_metric_columns();

/// One value per column from the text of a summary.json; NaN where the study has no such number.
/// Throws std::runtime_error if the text is not JSON.
std::vector<double> read_metrics(const std::string& summary_json);

/// Why a ranking spec ("name", "name:lowest" or "name:highest") cannot be used, and what would do
/// (the metrics there are); nothing when it can.
struct RankProblem {
  std::string what, expected;
};
std::optional<RankProblem> rank_problem(const std::string& spec);

/// "name:direction" as its two parts (direction empty when not given).
std::pair<std::string, std::string> split_metric_spec(const std::string& spec);

}  // namespace tf::sweep
