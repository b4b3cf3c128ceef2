#pragma once
// The one pipeline of every study: case -> mesh (planned for the study) -> the study's strategy
// -> quantities -> files (tables, field files, regions, report, summary) and a terminal summary.

#include <filesystem>
#include <optional>
#include <ostream>

#include "input/case.hpp"
#include "post/compare_report.hpp"
#include "post/rotation_metrics.hpp"
#include "study/solved.hpp"
#include "study/strategy.hpp"

namespace tf::study {

inline constexpr const char* kVersion = "0.1.0";

/// Checks RunOptions::report_step against the case's steps (eddy currents: its speeds); throws InputError.
void check_report_step(const input::Case& c, int report_step);

/// The headline numbers of one run, for comparisons.
struct RunOutcome {
  Strategy strategy = Strategy::superposition;
  std::optional<post::RotationMetrics> field;  ///< when the stator field turns over the steps
  double winding_factor = 0.0;                 ///< fundamental, phase A, star of slots
  std::optional<post::ComparedCase> compared = {};  ///< with `field`: what `compare` draws (name, solved_by unset)
};

/// Runs the case's study and writes its result folder; prints a short summary to `out`.
/// Throws mesh::MeshError, solver::SolveError or post::OutputError.
RunOutcome run_study(const input::Case& c, const RunOptions& options, std::ostream& out);

/// Meshes the case as run_study would and writes mesh.vtu (the whole machine, by region, as the field
/// files draw it) and regions.csv to out_dir.
void write_mesh(const input::Case& c, const std::filesystem::path& out_dir, std::ostream& out);

}  // namespace tf::study
