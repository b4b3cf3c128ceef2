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
/// failed rows keep their message; rows tied with the best and Pareto-optimal rows are marked, and
/// a sentence states the tolerance and the tie-break. With t.pareto shown, a scatter of its two
/// metrics marks the non-dominated variants. Metrics that are NaN in every row get no figure.
/// Numeric parameters go on a numeric axis; names, and keys of at most kMaxIntegerCategories
/// whole-number values (phases, coil pitch), become categories. With two parameters each figure
/// has one series per value of the other one; series that coincide are drawn once, and the legend
/// says they coincide.
Page sweep_page(const SweepTable& t, const std::string& best_variant_note);

/// A key with this many distinct whole-number values or fewer is drawn as categories.
inline constexpr std::size_t kMaxIntegerCategories = 12;

/// "Ranked by ..., lowest first; variants within 0.5 % of the best ... are tied ...": how t was
/// ranked, for the report and the terminal.
std::string ranking_sentence(const SweepTable& t);

/// "Pareto-optimal on <x> (lowest best) and <y> (highest best)"; empty without a Pareto view.
std::string pareto_sentence(const SweepTable& t);

/// Writes dir/report.html and dir/figures/*.svg. Throws OutputError.
void write_sweep_report(const std::filesystem::path& dir, const SweepTable& t, const std::string& best_variant_note);

}  // namespace tf::post
