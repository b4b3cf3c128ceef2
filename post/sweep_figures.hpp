#pragma once
// The figures of a sweep's report (sweep_report.hpp draws the page around them).

#include <string>

#include "post/html_report.hpp"
#include "post/sweep_table.hpp"

namespace tf::post {

/// Metric k of every variant that ran against parameter i, one series per combination of the
/// other parameters (one series when the keys were zipped). Discrete parameters are categories.
Figure metric_figure(const SweepTable& t, std::size_t k, std::size_t i);

/// t.pareto's two metrics of every variant that ran, the non-dominated ones marked and joined.
Figure pareto_figure(const SweepTable& t);

/// "B_r fundamental [T]".
std::string metric_heading(const MetricColumn& m);

/// "key = value, key = value" of a row's varied inputs.
std::string inputs_text(const SweepTable& t, const SweepRow& r);

/// A metric's value as the report writes it (5 significant digits).
std::string metric_text(double v);

}  // namespace tf::post
