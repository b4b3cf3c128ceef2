#pragma once
// `turnfield sweep`: every variant of a sweep file in its own folder <out>/<id>/, several at a time,
// each as a child process running `turnfield run`. A rerun skips variants already done (their
// variant.json exists) and redoes the rest, so a killed sweep loses only what was running.

#include <filesystem>
#include <ostream>
#include <string>

#include "sweep/sweep_ranking.hpp"
#include "sweep/variants.hpp"

namespace tf::sweep {

struct SweepOptions {
  std::filesystem::path out_dir;
  int jobs = 0;               ///< variants at once; 0 = the number of cores
  Shard shard;                ///< this process's share; {1, 1} = all
  bool dry_run = false;       ///< list the variants and their problems; run nothing
  bool retry_failed = false;  ///< redo variants recorded as failed
  RankSpec ranking;           ///< what it states overrides the sweep file's ranking keys
};

/// Runs (or lists) the sweep's variants; unsharded, then collects the summary and report.
/// Returns the exit status: 0 when every variant succeeded (or, in a dry run, is valid), 1 when
/// any failed or was invalid. Throws input::InputError for a bad sweep file (the caller's exit 2).
int run_sweep(const std::string& sweep_path, const SweepOptions& options, std::ostream& out, std::ostream& progress);

}  // namespace tf::sweep
