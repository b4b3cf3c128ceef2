#include "sweep/sweep_ranking.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "input/input_error.hpp"
#include "sweep/sweep_metrics.hpp"

namespace tf::sweep {
namespace {

/// A metric spec resolved against the table's columns.
struct MetricChoice {
  int column = -1;
  bool lower_is_better = true;
};

/// The column a spec names and its direction (the column's own unless the spec states one). The
/// spec must pass rank_problem. Throws input::InputError, naming `role`, when no variant that ran
/// reports the metric: a ranking of nothing would look like a result.
MetricChoice choose(const post::SweepTable& t, const std::string& spec, const char* role) {
  if (const auto p = rank_problem(spec))
    throw input::InputError(fmt::format("{} '{}': {}; expected {}", role, spec, p->what, p->expected));
  const auto [name, direction] = split_metric_spec(spec);
  MetricChoice c;
  std::vector<std::string> reported;
  std::size_t ran = 0;
  for (std::size_t k = 0; k < t.metrics.size(); ++k) {
    if (t.metrics[k].key == name) c = {static_cast<int>(k), t.metrics[k].lower_is_better};
    const bool any = std::any_of(t.rows.begin(), t.rows.end(), [k](const post::SweepRow& r) {
      return r.status == "ok" && k < r.metrics.size() && std::isfinite(r.metrics[k]);
    });
    if (any) reported.push_back(t.metrics[k].key);
  }
  for (const auto& r : t.rows) ran += r.status == "ok";
  if (!direction.empty()) c.lower_is_better = direction == "lowest";
  if (ran > 0 && std::find(reported.begin(), reported.end(), name) == reported.end())
    throw input::InputError(fmt::format(
        "{} {}: none of the {} variants that ran reports it (their study does not compute it); expected one of "
        "the metrics they report: {}",
        role, name, ran, fmt::join(reported, ", ")));
  return c;
}

/// Whether a is better than b in the direction given; NaN is worse than any number.
bool better(double a, double b, bool lower_is_better) {
  if (std::isnan(b)) return !std::isnan(a);
  if (std::isnan(a)) return false;
  return lower_is_better ? a < b : a > b;
}

/// The rows tied with the best: the leading run of `order` whose values lie within the relative
/// tolerance of the first. A hair of slack lets a value written exactly at the tolerance count.
std::size_t tied_count(const post::SweepTable& t, const std::vector<std::size_t>& order, std::size_t col) {
  if (order.empty()) return 0;
  const double best = t.rows[order.front()].metrics[col];
  const double reach = t.rank_tolerance * std::abs(best) * (1.0 + 1e-9);
  std::size_t n = 1;
  while (n < order.size() && std::abs(t.rows[order[n]].metrics[col] - best) <= reach) ++n;
  return n;
}

void mark_pareto(post::SweepTable& t, const std::vector<std::string>& specs) {
  t.pareto = {};
  for (auto& r : t.rows) r.pareto_optimal = false;
  if (specs.empty()) return;
  if (specs.size() != 2)
    throw input::InputError(fmt::format("Pareto view of {}: expected two metrics, X and Y", fmt::join(specs, ", ")));
  const MetricChoice x = choose(t, specs[0], "Pareto metric"), y = choose(t, specs[1], "Pareto metric");
  t.pareto = {x.column, y.column, x.lower_is_better, y.lower_is_better};
  // Deb's definitions are for minimisation; a metric to be maximised is minimised with its sign turned.
  std::vector<std::array<double, 2>> points;
  for (const auto& r : t.rows) {
    const double nan = post::kNoValue;
    const double px = r.metrics[static_cast<std::size_t>(x.column)], py = r.metrics[static_cast<std::size_t>(y.column)];
    points.push_back(r.status != "ok" ? std::array<double, 2>{nan, nan}
                                      : std::array<double, 2>{x.lower_is_better ? px : -px, y.lower_is_better ? py : -py});
  }
  const std::vector<bool> optimal = non_dominated(points);
  for (std::size_t i = 0; i < t.rows.size(); ++i) t.rows[i].pareto_optimal = optimal[i];
}

}  // namespace

RankSpec overridden(const RankSpec& base, const RankSpec& over) {
  RankSpec s = base;
  if (!over.rank_by.empty()) s.rank_by = over.rank_by;
  if (over.tolerance) s.tolerance = over.tolerance;
  if (!over.tie_break.empty()) s.tie_break = over.tie_break;
  if (!over.pareto.empty()) s.pareto = over.pareto;
  return s;
}

std::vector<std::string> parse_pareto(const std::string& text) {
  std::vector<std::string> parts;
  for (std::size_t from = 0;;) {
    const std::size_t comma = text.find(',', from);
    std::string part = text.substr(from, comma == std::string::npos ? std::string::npos : comma - from);
    part.erase(0, part.find_first_not_of(' '));
    part.erase(part.find_last_not_of(' ') + 1);
    parts.push_back(part);
    if (comma == std::string::npos) break;
    from = comma + 1;
  }
  if (parts.size() != 2 || parts[0].empty() || parts[1].empty())
    throw input::InputError(fmt::format("--pareto {}: expected two metrics, X,Y (e.g. "
                                        "peak_field_ripple:lowest,fundamental_T:highest)", text));
  return parts;
}

std::string tolerance_problem(double tolerance) {
  return std::isfinite(tolerance) && tolerance >= 0.0 && tolerance < 1.0
             ? ""
             : "expected a relative tolerance >= 0 and < 1 (0.005 = 0.5 %)";
}

void check_rank_options(const RankSpec& s) {
  const auto check = [](const std::string& spec, const char* option) {
    if (const auto p = rank_problem(spec); p && !spec.empty())
      throw input::InputError(fmt::format("{} {}: {}; expected {}", option, spec, p->what, p->expected));
  };
  check(s.rank_by, "--rank-by");
  check(s.tie_break, "--tie-break");
  for (const auto& p : s.pareto) check(p, "--pareto");
  if (s.pareto.size() == 2 && split_metric_spec(s.pareto[0]).first == split_metric_spec(s.pareto[1]).first)
    throw input::InputError(fmt::format("--pareto {},{}: one metric twice; expected two different metrics",
                                        s.pareto[0], s.pareto[1]));
  if (s.tolerance && !tolerance_problem(*s.tolerance).empty())
    throw input::InputError(fmt::format("--rank-tolerance {}: {}", *s.tolerance, tolerance_problem(*s.tolerance)));
}

void rank_rows(post::SweepTable& t, const RankSpec& s) {
  const MetricChoice by = choose(t, s.rank_by, "ranking metric");
  t.rank_by = by.column;
  const auto col = static_cast<std::size_t>(by.column);
  t.metrics[col].lower_is_better = by.lower_is_better;
  t.rank_tolerance = s.tolerance.value_or(kDefaultRankTolerance);
  const MetricChoice tie = s.tie_break.empty() ? MetricChoice{} : choose(t, s.tie_break, "tie-break metric");
  t.tie_break = tie.column;
  t.tie_break_lower_is_better = tie.lower_is_better;

  std::vector<std::size_t> order;
  for (std::size_t i = 0; i < t.rows.size(); ++i) {
    t.rows[i].rank = 0;
    t.rows[i].tied_with_best = false;
    if (t.rows[i].status == "ok" && std::isfinite(t.rows[i].metrics[col])) order.push_back(i);
  }
  std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
    return better(t.rows[a].metrics[col], t.rows[b].metrics[col], by.lower_is_better);
  });
  const std::size_t n_tied = tied_count(t, order, col);
  if (tie.column >= 0) {
    const auto tc = static_cast<std::size_t>(tie.column);
    std::stable_sort(order.begin(), order.begin() + static_cast<std::ptrdiff_t>(n_tied), [&](std::size_t a, std::size_t b) {
      return better(t.rows[a].metrics[tc], t.rows[b].metrics[tc], tie.lower_is_better);
    });
  }
  for (std::size_t r = 0; r < order.size(); ++r) {
    t.rows[order[r]].rank = static_cast<int>(r + 1);
    t.rows[order[r]].tied_with_best = n_tied > 1 && r < n_tied;
  }
  mark_pareto(t, s.pareto);
}

std::vector<bool> non_dominated(const std::vector<std::array<double, 2>>& points) {
  const auto dominates = [](const std::array<double, 2>& p, const std::array<double, 2>& q) {
    return p[0] <= q[0] && p[1] <= q[1] && (p[0] < q[0] || p[1] < q[1]);
  };
  std::vector<bool> optimal(points.size(), false);
  for (std::size_t i = 0; i < points.size(); ++i) {
    const auto& q = points[i];
    if (!std::isfinite(q[0]) || !std::isfinite(q[1])) continue;
    optimal[i] = std::none_of(points.begin(), points.end(), [&](const std::array<double, 2>& p) {
      return std::isfinite(p[0]) && std::isfinite(p[1]) && dominates(p, q);
    });
  }
  return optimal;
}

}  // namespace tf::sweep
