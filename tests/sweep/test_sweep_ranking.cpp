// Ranking with ties, the Pareto-optimal set, and how the sweep's report draws both, on tables
// built here with exact numbers: every expected rank and flag below is worked out by hand from the
// definitions in sweep/sweep_ranking.hpp.

#include <doctest/doctest.h>

#include <regex>

#include "input/input_error.hpp"
#include "post/sweep_report.hpp"
#include "sweep/sweep_metrics.hpp"
#include "sweep/sweep_ranking.hpp"

namespace {

using namespace tf::sweep;
using tf::input::InputError;
using tf::post::SweepTable;

const double kNaN = tf::post::kNoValue;

/// Index of a metric column by key.
std::size_t column(const SweepTable& t, const std::string& key) {
  for (std::size_t k = 0; k < t.metrics.size(); ++k)
    if (t.metrics[k].key == key) return k;
  FAIL("no column " << key);
  return 0;
}

/// A table of the sweep's columns, one row per entry of `values` (metric key -> value), all ok
/// unless `failed` says otherwise.
SweepTable table(const std::vector<std::vector<std::pair<std::string, double>>>& values, std::size_t failed = 99) {
  SweepTable t{"t", "s", "b", {"k"}, sweep_metric_columns(), {}, -1};
  for (std::size_t i = 0; i < values.size(); ++i) {
    std::vector<double> m(t.metrics.size(), kNaN);
    for (const auto& [key, v] : values[i]) m[column(t, key)] = v;
    t.rows.push_back({"v" + std::to_string(i), {std::to_string(i)}, i == failed ? "failed" : "ok", "", m, 0});
  }
  return t;
}

std::vector<int> ranks(const SweepTable& t) {
  std::vector<int> r;
  for (const auto& row : t.rows) r.push_back(row.rank);
  return r;
}

std::vector<bool> tied(const SweepTable& t) {
  std::vector<bool> r;
  for (const auto& row : t.rows) r.push_back(row.tied_with_best);
  return r;
}

std::string message_of(SweepTable t, const RankSpec& s) {
  try {
    rank_rows(t, s);
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

/// Ripple 0.1000, 0.1004 (0.4 % off), 0.1005 (0.5 %, at the edge), 0.1006 (0.6 %), 0.2, and a
/// failed row; the harmonic distortion to break ties: 0.30, 0.20, 0.25, 0.10, 0.05.
SweepTable ripple_table() {
  const std::vector<double> ripple = {0.1000, 0.1004, 0.1005, 0.1006, 0.2000, 0.05};
  const std::vector<double> distortion = {0.30, 0.20, 0.25, 0.10, 0.05, 0.01};
  std::vector<std::vector<std::pair<std::string, double>>> v;
  for (std::size_t i = 0; i < ripple.size(); ++i)
    v.push_back({{"peak_field_ripple", ripple[i]}, {"harmonic_distortion", distortion[i]}});
  return table(v, 5);
}

}  // namespace

TEST_CASE("variants within the tolerance of the best are tied with it and ordered by the tie-break") {
  SweepTable t = ripple_table();
  // Default 0.5 %: 0.1004 and 0.1005 tie with 0.1000, 0.1006 does not; by distortion 0.20 < 0.25 < 0.30.
  rank_rows(t, {"peak_field_ripple", std::nullopt, "harmonic_distortion", {}});
  CHECK(t.rank_tolerance == kDefaultRankTolerance);
  CHECK(ranks(t) == std::vector<int>{3, 1, 2, 4, 5, 0});
  CHECK(tied(t) == std::vector<bool>{true, true, true, false, false, false});
  CHECK(t.tie_break == static_cast<int>(column(t, "harmonic_distortion")));
  // 1 %: 0.1006 joins the tie, and its distortion (0.10) is the lowest of the four.
  rank_rows(t, {"peak_field_ripple", 0.01, "harmonic_distortion", {}});
  CHECK(ranks(t) == std::vector<int>{4, 2, 3, 1, 5, 0});
  CHECK(tied(t) == std::vector<bool>{true, true, true, true, false, false});
  // No tie-break named: the tie is marked and keeps the ripple's order.
  rank_rows(t, {"peak_field_ripple", std::nullopt, "", {}});
  CHECK(ranks(t) == std::vector<int>{1, 2, 3, 4, 5, 0});
  CHECK(tied(t) == std::vector<bool>{true, true, true, false, false, false});
  // Tolerance 0: no tie at all, and nothing is marked.
  rank_rows(t, {"peak_field_ripple", 0.0, "harmonic_distortion", {}});
  CHECK(ranks(t) == std::vector<int>{1, 2, 3, 4, 5, 0});
  CHECK(tied(t) == std::vector<bool>(6, false));
  // A tie-break in the other direction: the highest distortion of the tie first.
  rank_rows(t, {"peak_field_ripple", std::nullopt, "harmonic_distortion:highest", {}});
  CHECK(ranks(t) == std::vector<int>{1, 3, 2, 4, 5, 0});
}

TEST_CASE("a tie of a metric best when highest, and a tie-break some variants lack") {
  // Fundamental 0.700 best; 0.697 is 0.43 % below (tied), 0.696 0.57 % (not); the winding factor
  // breaks the tie, highest first, and a tied row without one goes last within the tie.
  SweepTable t = table({{{"fundamental_T", 0.700}, {"winding_factor", 0.933}},
                        {{"fundamental_T", 0.697}, {"winding_factor", 0.966}},
                        {{"fundamental_T", 0.698}},
                        {{"fundamental_T", 0.696}, {"winding_factor", 0.999}}});
  rank_rows(t, {"fundamental_T", std::nullopt, "winding_factor", {}});
  CHECK(ranks(t) == std::vector<int>{2, 1, 3, 4});
  CHECK(tied(t) == std::vector<bool>{true, true, true, false});
  CHECK_FALSE(t.tie_break_lower_is_better);
}

TEST_CASE("a ranking, tie-break or Pareto metric that no variant reports is refused, naming those there are") {
  const SweepTable t = ripple_table();  // no torque: a phase-angle study computes none
  const std::string m = message_of(t, {"torque_mean_N_m", std::nullopt, "", {}});
  CHECK(m.find("ranking metric torque_mean_N_m: none of the 5 variants that ran reports it") != std::string::npos);
  CHECK(m.find("expected one of the metrics they report: peak_field_ripple, harmonic_distortion") != std::string::npos);
  CHECK(message_of(t, {"peak_field_ripple", std::nullopt, "torque_ripple", {}}).find("tie-break metric torque_ripple") !=
        std::string::npos);
  CHECK(message_of(t, {"peak_field_ripple", std::nullopt, "", {"torque_ripple", "peak_field_ripple"}})
            .find("Pareto metric torque_ripple") != std::string::npos);
  CHECK(message_of(t, {"ripple", std::nullopt, "", {}}).find("no such metric") != std::string::npos);
  CHECK(message_of(t, {"peak_field_ripple", std::nullopt, "", {"fundamental_T"}}).find("expected two metrics") != std::string::npos);
  // Nothing ran: nothing to rank, which is not the ranking's fault.
  SweepTable none = t;
  for (auto& r : none.rows) r.status = "failed";
  CHECK(message_of(none, {"torque_mean_N_m", std::nullopt, "", {}}).empty());
}

TEST_CASE("the non-dominated set of a hand-worked example, with ties on one metric and duplicates") {
  // Deb, "Multi-Objective Optimization Using Evolutionary Algorithms", 2001, ch. 2 (definition of
  // domination, from memory): p dominates q if p is no worse in every objective and strictly
  // better in at least one; the non-dominated set is the points no other point dominates.
  // Both coordinates minimised.
  const std::vector<std::array<double, 2>> p = {
      {1, 5},    // A: optimal (the least first coordinate, with E)
      {2, 3},    // B: optimal
      {3, 1},    // C: optimal (the least second coordinate, with G)
      {2, 4},    // D: dominated by B (equal first, worse second)
      {1, 6},    // E: dominated by A (equal first, worse second)
      {2, 3},    // F: a duplicate of B; equal points do not dominate each other, so optimal
      {4, 1},    // G: dominated by C (worse first, equal second)
      {kNaN, 0},  // H: a missing value: neither optimal nor dominating G or C
      {3, 2}};   // I: dominated by C
  CHECK(non_dominated(p) == std::vector<bool>{true, true, true, false, false, true, false, false, false});
  CHECK(non_dominated({{5, 5}, {5, 5}, {5, 5}}) == std::vector<bool>{true, true, true});  // all equal: all optimal
  CHECK(non_dominated({{0, 0}, {0, 1}, {1, 0}}) == std::vector<bool>{true, false, false});  // one point better in both
  CHECK(non_dominated({}).empty());
}

TEST_CASE("the Pareto view honours each metric's direction and flags only variants with both values") {
  // Fundamental highest and ripple lowest: v2 (0.69, 0.12) is dominated by v0 (0.70, 0.10); v1 and
  // v3 are equal (both optimal); v4 lacks the ripple; v5 failed.
  SweepTable t = table({{{"fundamental_T", 0.70}, {"peak_field_ripple", 0.10}},
                        {{"fundamental_T", 0.72}, {"peak_field_ripple", 0.15}},
                        {{"fundamental_T", 0.69}, {"peak_field_ripple", 0.12}},
                        {{"fundamental_T", 0.72}, {"peak_field_ripple", 0.15}},
                        {{"fundamental_T", 0.75}},
                        {{"fundamental_T", 0.90}, {"peak_field_ripple", 0.01}}},
                       5);
  rank_rows(t, {"fundamental_T", std::nullopt, "", {"peak_field_ripple:lowest", "fundamental_T"}});
  std::vector<bool> optimal, shown;
  for (const auto& r : t.rows) optimal.push_back(r.pareto_optimal), shown.push_back(in_pareto_view(t, r));
  CHECK(optimal == std::vector<bool>{true, true, false, true, false, false});
  CHECK(shown == std::vector<bool>{true, true, true, true, false, false});
  CHECK(t.pareto.x == static_cast<int>(column(t, "peak_field_ripple")));
  CHECK_FALSE(t.pareto.y_lower_is_better);
  // Asked the other way round (the fundamental lowest), v2 is optimal and v1, v3 are not.
  rank_rows(t, {"fundamental_T", std::nullopt, "", {"peak_field_ripple", "fundamental_T:lowest"}});
  optimal.clear();
  for (const auto& r : t.rows) optimal.push_back(r.pareto_optimal);
  CHECK(optimal == std::vector<bool>{true, false, true, false, false, false});
}

TEST_CASE("the report marks the tie, says the tolerance and tie-break, and plots the Pareto view first") {
  SweepTable t = ripple_table();
  for (std::size_t i = 0; i < 5; ++i) t.rows[i].metrics[column(t, "fundamental_T")] = 0.60 + 0.01 * static_cast<double>(i);
  rank_rows(t, {"peak_field_ripple", std::nullopt, "harmonic_distortion", {"peak_field_ripple", "fundamental_T"}});
  const auto page = tf::post::sweep_page(t, "");
  const std::string html = tf::post::render_html(page);
  const auto count = [&](const std::string& what) {
    std::size_t n = 0;
    for (auto at = html.find(what); at != std::string::npos; at = html.find(what, at + 1)) ++n;
    return n;
  };
  CHECK(count("=\u00a0tied") == 3);  // the rows' mark, with a no-break space
  CHECK(count("(marked &quot;= tied&quot;: 3 variants)") == 1);
  CHECK(html.find("Variants within 0.5 % of the best peak_field_ripple (0.1) count as tied with it") != std::string::npos);
  CHECK(html.find("ordered among themselves by harmonic distortion (harmonic_distortion), lowest first") != std::string::npos);
  // Ripple rises with the index and so does the fundamental: every variant that ran is a trade-off.
  REQUIRE_FALSE(page.figures.empty());
  CHECK(page.figures.front().name == "pareto_fundamental_T_vs_peak_field_ripple");
  CHECK(page.figures.front().svg.find("non-dominated (5)") != std::string::npos);
  CHECK(page.figures.front().svg.find("dominated (0)") != std::string::npos);
  CHECK(count("◆\u00a0optimal") == 5);
}
