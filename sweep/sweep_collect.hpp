#pragma once
// `turnfield collect DIR...`: the summary of a sweep from the folders its shards wrote (or the
// one folder of an unsharded sweep): sweep_summary.csv with a row per variant, the ranking, the
// sweep's report, and the best variant's results copied to best_variant/.

#include <filesystem>
#include <ostream>
#include <string>
#include <vector>

#include "post/sweep_table.hpp"
#include "sweep/sweep_ranking.hpp"

namespace tf::sweep {

struct CollectOptions {
  std::vector<std::filesystem::path> dirs;  ///< folders holding sweep.json and variant folders
  std::filesystem::path out_dir;            ///< where the summary goes
  RankSpec ranking;  ///< what it states overrides the sweep file's; rank_by defaults to fundamental_T
};

/// Builds and ranks the table of every variant of the sweep the folders share. Throws
/// input::InputError when a folder is not a sweep's or holds another sweep, when folders were cut
/// into shards differently (--shard k/N with different N), or for a metric no variant reports.
post::SweepTable collect_table(const CollectOptions& options);

/// Writes the summary files and prints the ranked table and a summary line. Returns 0 when every
/// variant is ok, 1 when any failed, was invalid or is missing.
int collect_sweep(const CollectOptions& options, std::ostream& out);

/// sweep_summary.csv: variant, the varied keys, status, rank, tied_with_best, pareto_optimal, the
/// metrics, message. Numbers to 6
/// significant digits, no times: equal sweeps give byte-equal files however they were sharded.
void write_sweep_csv(const std::filesystem::path& path, const post::SweepTable& t);

}  // namespace tf::sweep
