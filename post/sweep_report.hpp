#pragma once
// The report of a sweep (dir/report.html and dir/figures/*.svg): the study, the ranked table of
// variants with links to each variant's own report, and each metric plotted against each varied
// parameter.

#include <filesystem>
#include <string>

#include "post/html_report.hpp"
#include "post/sweep_table.hpp"

namespace tf::post {

/// The page: ranked rows first (rank 1 at the top), then unranked rows in the study's order;
/// failed rows keep their message. Metrics that are NaN in every row get no figure. Numeric
/// parameters go on a numeric axis, others become categories; with two parameters each figure
/// has one series per value of the other one.
Page sweep_page(const SweepTable& t, const std::string& best_variant_note);

/// Writes dir/report.html and dir/figures/*.svg. Throws OutputError.
void write_sweep_report(const std::filesystem::path& dir, const SweepTable& t, const std::string& best_variant_note);

}  // namespace tf::post
