#pragma once
// The headline numbers a sweep tabulates and ranks by, read from each variant's summary.json.

#include <optional>
#include <string>
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

/// Sets t.rank_by and each ok row's rank from a spec "name", "name:lowest" or "name:highest"
/// (name: a column key; without a direction, the column's own). Rows whose value is NaN are not
/// ranked; ties keep the sweep's order. Throws input::InputError for an unknown name or direction.
void rank_rows(post::SweepTable& t, const std::string& spec);

}  // namespace tf::sweep
