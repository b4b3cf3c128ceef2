// turnfield command line: check, winding, mesh, run, compare, sweep, collect.
// Exit status: 0 success, 2 bad input (case file or command line), 1 failure while meshing,
// solving or writing.

#include <algorithm>
#include <cerrno>
#include <cmath>
#include <cstdlib>
#include <cstring>
#include <filesystem>
#include <iostream>
#include <sstream>
#include <type_traits>
#include <string>
#include <vector>

#include <CLI/CLI.hpp>
#include <unistd.h>

#include "app/command_help.hpp"
#include "app/geometry_report.hpp"
#include "app/winding_report.hpp"
#include "input/case_reader.hpp"
#include "input/input_error.hpp"
#include "study/compare.hpp"
#include "study/run.hpp"
#include "sweep/sweep_collect.hpp"
#include "sweep/sweep_run.hpp"
#include "mesh/mesh.hpp"
#include "post/atomic_file.hpp"
#include "solver/errors.hpp"

namespace {

namespace fs = std::filesystem;

fs::path default_out_dir(const std::string& case_path) { return fs::path("results") / fs::path(case_path).stem(); }

/// Refuses an output folder that cannot be written, before any work (a solve may take minutes):
/// a path that is a file, or whose nearest existing folder is not writable. Creates nothing, so a
/// command refused for another reason afterwards leaves no trace. Throws InputError (exit 2).
void check_out_folder(const fs::path& dir) {
  std::error_code ec;
  fs::path existing = fs::absolute(dir, ec);
  while (!existing.empty() && !fs::exists(existing, ec)) existing = existing.parent_path();
  if (fs::exists(existing, ec) && !fs::is_directory(existing, ec))
    throw tf::input::InputError("--out " + dir.string() + ": " + existing.string() +
                                " is a file; expected a folder to write the results in");
  if (access(existing.c_str(), W_OK | X_OK) != 0)
    throw tf::input::InputError("--out " + dir.string() + ": cannot write in " + existing.string() + ": " +
                                std::strerror(errno));
}

/// "k/N" with 1 <= k <= N; throws input::InputError otherwise.
tf::sweep::Shard parse_shard(const std::string& text) {
  tf::sweep::Shard s;
  char slash = 0, rest = 0;
  std::istringstream in(text);
  if (!(in >> s.k >> slash >> s.n) || slash != '/' || in >> rest || s.n < 1 || s.k < 1 || s.k > s.n)
    throw tf::input::InputError("--shard " + text + ": expected k/N with 1 <= k <= N, e.g. --shard 2/8");
  return s;
}

/// Refuses NaN and infinity, which CLI11's range checks let through (every comparison with NaN is false).
const CLI::Validator kFinite(
    [](std::string& text) {
      char* end = nullptr;
      const double v = std::strtod(text.c_str(), &end);
      return end != text.c_str() && *end == '\0' && std::isfinite(v) ? std::string()
                                                                       : "expected a finite number, found " + text;
    },
    "FINITE");

/// --rank-by, --rank-tolerance, --tie-break and --pareto, which sweep and collect share.
struct RankingOptions {
  tf::sweep::RankSpec spec;
  double tolerance = 0.0;
  std::string pareto;

  void add_to(CLI::App* command) {
    command->add_option("--rank-by", spec.rank_by, "metric to rank by: name, name:lowest or name:highest");
    command->add_option("--rank-tolerance", tolerance,
                        "relative: variants this close to the best are tied with it (default 0.005 = 0.5 %)")
        ->check(kFinite);
    command->add_option("--tie-break", spec.tie_break, "metric ordering the variants tied with the best");
    command->add_option("--pareto", pareto, "two metrics X,Y to weigh, e.g. torque_ripple:lowest,torque_mean_N_m");
  }
  /// What the command line states; throws InputError for a --pareto that is not two metrics.
  tf::sweep::RankSpec stated(const CLI::App* command) const {
    tf::sweep::RankSpec s = spec;
    if (command->count("--rank-tolerance") > 0) s.tolerance = tolerance;
    if (!pareto.empty()) s.pareto = tf::sweep::parse_pareto(pareto);
    return s;
  }
};

/// Runs `action`, whose int result is the exit status; exceptions become messages and 2 or 1.
template <class Action>
int guarded(Action action) {
  try {
    if constexpr (std::is_same_v<decltype(action()), int>) return action();
    else action();
    return 0;
  } catch (const tf::input::InputError& e) {
    std::cerr << "error: " << e.what() << '\n';
    return 2;
  } catch (const tf::mesh::MeshError& e) {
    std::cerr << "mesh error: " << e.what() << '\n';
  } catch (const tf::solver::SolveError& e) {
    std::cerr << "solver error: " << e.what() << '\n';
  } catch (const tf::post::OutputError& e) {
    std::cerr << "output error: " << e.what() << '\n';
  } catch (const std::exception& e) {
    std::cerr << "error: " << e.what() << '\n';
  }
  return 1;
}

}  // namespace

int main(int argc, char** argv) {
  CLI::App cli{"turnfield: rotating-field analysis of AC machine stators by 2D finite elements"};
  cli.set_version_flag("--version", tf::study::kVersion);
  cli.require_subcommand(1);
  std::string case_path, out_dir;
  std::vector<std::string> case_paths;
  bool as_json = false, all_steps = false;
  double fineness = 0.0;  // 0: as the case file says
  int field_files = -1;   // -1: as the case file says
  int steps = 0;          // 0: as the case file says
  int report_step = 0;

  auto* check = cli.add_subcommand("check", "validate a case file without solving and print its derived geometry");
  check->add_option("CASE", case_path, "case file (TOML)")->required();
  auto* winding = cli.add_subcommand(
      "winding", "print the slot table, the winding factors and how each order of the resultant field turns");
  winding->add_option("CASE", case_path, "case file (TOML)")->required();
  winding->add_flag("--json", as_json, "print JSON instead of text");
  auto* mesh = cli.add_subcommand("mesh", "mesh the cross-section and write mesh.vtu with region ids");
  mesh->add_option("CASE", case_path, "case file (TOML)")->required();
  mesh->add_option("--out", out_dir, "output folder (default results/<case name>/mesh)");
  mesh->add_option("--fineness", fineness, "override the case's mesh fineness")->check(kFinite & CLI::Range(0.1, 20.0));
  mesh->add_option("--steps", steps, "override the number of steps, as for run (a rotor-motion study's steps set "
                                     "the sliding circle's nodes)")
      ->check(CLI::Range(2, 100000));
  auto* run = cli.add_subcommand("run", "solve the case's study and write the results");
  run->add_option("CASE", case_path, "case file (TOML)")->required();
  run->add_option("--out", out_dir, "output folder (default results/<case name>)");
  run->add_flag("--all-steps", all_steps, "write a field file for every step");
  run->add_option("--field-files", field_files, "override the number of steps written as VTU files (0: none)")
      ->check(CLI::Range(0, 1000000));
  run->add_option("--fineness", fineness, "override the case's mesh fineness")->check(kFinite & CLI::Range(0.1, 20.0));
  run->add_option("--steps", steps, "override the number of steps of a phase-angle or rotor-motion study")
      ->check(CLI::Range(2, 100000));
  run->footer(tf::app::study_kinds_help());
  run->add_option("--report-step", report_step,
                  "step (eddy currents: speed number) whose cross-section report.html draws, from 0 (default 0)");

  auto* compare = cli.add_subcommand(
      "compare", "run several cases; their field metrics side by side in comparison.csv and report.html");
  compare->add_option("CASES", case_paths, "case files (TOML)")->required()->expected(2, 1000);
  compare->add_option("--out", out_dir, "output folder (default results/comparison)");
  compare->add_option("--fineness", fineness, "override every case's mesh fineness")->check(kFinite & CLI::Range(0.1, 20.0));
  compare->add_option("--field-files", field_files, "override the number of VTU files per case (0: none)")
      ->check(CLI::Range(0, 1000000));
  compare->add_option("--steps", steps, "override every case's number of steps")->check(CLI::Range(2, 100000));

  tf::sweep::SweepOptions sweep_options;
  std::string shard = "1/1";
  RankingOptions ranking;
  std::vector<std::string> collect_dirs;
  auto* sweep = cli.add_subcommand("sweep", "run every variant of a sweep file, several at a time, and rank them");
  sweep->add_option("SWEEP_FILE", case_path, "sweep file (TOML): a base case and the keys to vary")->required();
  sweep->add_option("--out", out_dir, "output folder (default results/<sweep file name>)");
  sweep->add_option("-j,--jobs", sweep_options.jobs, "variants at once (default: the number of cores)")
      ->check(CLI::Range(1, 1024));
  sweep->add_flag("--dry-run", sweep_options.dry_run, "list the variants and any invalid ones; run nothing");
  sweep->add_option("--shard", shard, "run only share k of N (k/N), for several machines; then collect");
  sweep->add_flag("--retry-failed", sweep_options.retry_failed, "run again the variants recorded as failed");
  ranking.add_to(sweep);
  auto* collect = cli.add_subcommand("collect", "merge the folders of a sweep's shards into one summary and report");
  collect->add_option("DIRS", collect_dirs, "the shards' output folders")->required()->expected(1, 100000);
  collect->add_option("--out", out_dir, "where the summary goes (default: the first folder)");
  ranking.add_to(collect);

  try {
    cli.parse(argc, argv);
  } catch (const CLI::ParseError& e) {
    const int code = cli.exit(e);
    if (code != 0) std::cerr << tf::app::did_you_mean(cli, std::vector<std::string>(argv + 1, argv + argc));
    return code == 0 ? 0 : 2;
  }

  if (sweep->parsed())
    return guarded([&] {
      sweep_options.shard = parse_shard(shard);
      sweep_options.ranking = ranking.stated(sweep);
      sweep_options.out_dir = out_dir.empty() ? default_out_dir(case_path) : fs::path(out_dir);
      check_out_folder(sweep_options.out_dir);
      return tf::sweep::run_sweep(case_path, sweep_options, std::cout, std::cerr);
    });
  if (collect->parsed())
    return guarded([&] {
      std::vector<fs::path> dirs(collect_dirs.begin(), collect_dirs.end());
      const fs::path out = out_dir.empty() ? dirs.front() : fs::path(out_dir);
      check_out_folder(out);
      return tf::sweep::collect_sweep({dirs, out, ranking.stated(collect)}, std::cout);
    });

  if (compare->parsed())
    return guarded([&] {
      std::vector<tf::input::Case> cases;  // all read and checked before anything runs
      for (const auto& path : case_paths) {
        cases.push_back(tf::input::read_case(path));
        if (fineness > 0.0) cases.back().mesh.fineness = fineness;
        if (steps > 0) tf::input::override_steps(cases.back(), steps);
      }
      const fs::path out = out_dir.empty() ? fs::path("results") / "comparison" : fs::path(out_dir);
      check_out_folder(out);
      tf::study::compare_cases(cases, out, field_files, std::cout);
    });

  return guarded([&] {
    tf::input::Case c = tf::input::read_case(case_path);
    if (fineness > 0.0) c.mesh.fineness = fineness;
    if (steps > 0) tf::input::override_steps(c, steps);
    if (field_files >= 0) c.study.n_field_files = std::min(field_files, c.study.n_steps);
    if (check->parsed()) {
      std::cout << case_path << ": valid (" << c.title << ")\n";
      tf::app::print_derived_geometry(c, std::cout);
    } else if (winding->parsed()) {
      tf::app::print_winding(c, as_json, std::cout);
    } else if (mesh->parsed()) {
      const fs::path out = out_dir.empty() ? default_out_dir(case_path) / "mesh" : fs::path(out_dir);
      check_out_folder(out);
      tf::study::write_mesh(c, out, std::cout);
    } else {
      tf::study::check_report_step(c, report_step);
      tf::study::RunOptions options{out_dir.empty() ? default_out_dir(case_path) : fs::path(out_dir), all_steps,
                                   report_step};
      check_out_folder(options.out_dir);
      tf::study::run_study(c, options, std::cout);
    }
  });
}
