#pragma once
// What every strategy is given and what it hands back to the one output stage (study/run.cpp).

#include <filesystem>
#include <functional>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "input/case.hpp"
#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/case_report.hpp"
#include "post/motion_output.hpp"
#include "post/summary.hpp"
#include "study/progress.hpp"

namespace tf::study {

struct RunOptions {
  std::filesystem::path out_dir;
  bool all_field_files = false;  ///< a VTU file for every step instead of study.field_files
  int report_step = 0;  ///< the step (eddy currents: the speed) whose cross-section the report draws
};

/// A strategy's inputs: the case, its mesh and winding, the options, the terminal's progress line.
struct StudyInput {
  const input::Case& c;
  const mesh::Mesh& m;
  const mesh::Winding& w;
  const RunOptions& options;
  Progress& progress;
};

/// A strategy's results: the bodies it has, what the solver did, the field files to write and
/// the cross-section of the report. Closures in `frames` and `write_extra` may refer to the case,
/// mesh and winding of the StudyInput, which outlive them.
struct Solved {
  std::optional<post::StudyResult> field;
  bool field_rotates = false;
  std::optional<post::MotionResult> motion;
  bool rotor_turns = false;
  double load_angle = 0.0;
  std::optional<post::EddyResult> eddy;
  std::string drive_json;
  std::vector<std::string> notes, warnings;
  post::SolverSummary solver;
  post::StageTimes seconds;  ///< the strategy's own stages
  std::vector<post::FieldFrame> frames;
  post::CrossSection section;
  /// Files only this strategy writes (iron loss); returns their names.
  std::function<std::vector<std::string>(const std::filesystem::path&)> write_extra;
};

/// The field files' steps: n_files evenly spaced over n_steps (every step with all_field_files).
std::vector<int> field_steps(const StudyInput& in, int n_steps);

Solved solve_by_superposition(const StudyInput& in);
Solved solve_step_by_step(const StudyInput& in);
Solved solve_by_motion_term(const StudyInput& in);
Solved solve_by_slip_method(const StudyInput& in);

}  // namespace tf::study
