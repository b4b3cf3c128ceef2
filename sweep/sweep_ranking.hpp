#pragma once
// How a sweep's variants are ordered: by one metric, with the variants within a tolerance of the
// best counted as tied with it and ordered among themselves by a second metric; and, apart from
// the ranking, which variants are Pareto-optimal on two metrics weighed against each other.

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "post/sweep_table.hpp"

namespace tf::sweep {

/// Values within 0.5 % of the best count as tied with it unless the sweep says otherwise: closer
/// than a coarse mesh resolves such metrics (common practice for comparing FE designs).
inline constexpr double kDefaultRankTolerance = 0.005;

/// A ranking as the sweep file or the command line states it. Metric specs are "name",
/// "name:lowest" or "name:highest" (name: a column of sweep_metric_columns()).
struct RankSpec {
  std::string rank_by = {};              ///< empty = not stated
  std::optional<double> tolerance = {};  ///< relative (0.005 = 0.5 %); unset = not stated
  std::string tie_break = {};            ///< metric ordering the variants tied with the best; empty = none
  std::vector<std::string> pareto = {};  ///< two metric specs (x, then y), or empty = no Pareto view
};

/// `over`'s stated fields replace `base`'s (the command line over the sweep file).
RankSpec overridden(const RankSpec& base, const RankSpec& over);

/// "a,b" as its two parts, trimmed. Throws input::InputError unless there are exactly two.
std::vector<std::string> parse_pareto(const std::string& text);

/// Why a tolerance cannot be used ("" when it can): it must be finite, >= 0 and < 1.
std::string tolerance_problem(double tolerance);

/// Checks command-line options (named --rank-by, --rank-tolerance, --tie-break, --pareto in the
/// messages) before any variant runs. Throws input::InputError.
void check_rank_options(const RankSpec& s);

/// Sets t's ranking and each ok row's rank and tied_with_best (s.rank_by must be stated):
/// rows sorted by the metric (NaN rows unranked); those within s.tolerance (relative to |best|)
/// of the best form its tie, ordered by s.tie_break (NaN last) or else kept in the metric's order.
/// Then marks the Pareto-optimal rows when s.pareto names two metrics.
/// Throws input::InputError for an unknown metric, or one that no variant that ran reports.
void rank_rows(post::SweepTable& t, const RankSpec& s);

/// Which points no other point dominates, both coordinates to be minimised: p dominates q when p
/// is no worse in both and better in at least one (Deb 2001, ch. 2). Equal points do not
/// dominate each other. Points with a NaN are never optimal. #points flags.
std::vector<bool> non_dominated(const std::vector<std::array<double, 2>>& points);

}  // namespace tf::sweep
