#pragma once
// What one run hands to the writers: a common core (the case echoed, the mesh and winding, what
// the solver did, stage times, warnings, files) and the bodies its study has: the air-gap field
// over the steps, rotor motion (torque, flux linkage), eddy currents per rotor speed. Every study
// kind fills the core and the bodies it has; the summary, the result tables, the report page and
// the terminal summary are each written by one function from this record.

#include <cmath>
#include <filesystem>
#include <limits>
#include <optional>
#include <ostream>
#include <string>
#include <utility>
#include <vector>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/eddy_quantities.hpp"
#include "post/motion_result.hpp"
#include "post/study.hpp"

namespace tf::post {

/// Printed in every report and summary.
inline constexpr const char* kSafetyCaution =
    "Results are design estimates from a 2D model. Electric machines carry dangerous voltages, currents and "
    "forces: confirm every design by tests and by licensed engineers under local codes before building or "
    "energising it.";

/// Wall time per stage [s], in the order the stages ran.
using StageTimes = std::vector<std::pair<std::string, double>>;

/// What the solver did, for summary.json's "solver" object.
struct SolverSummary {
  std::string method;
  int n_unknowns = 0;
  long n_nonzeros = -1;   ///< of the factorized matrix; -1 when not reported
  int n_factorizations = -1;  ///< -1 when not counted
  int n_solves = -1;          ///< -1 when not counted
  double newton_iterations_per_solve = std::numeric_limits<double>::quiet_NaN();  ///< NaN: linear
  int newton_iterations_max = -1;  ///< the most one solve took; -1 when not counted
  int n_analyses = -1;             ///< symbolic analyses (one per sparsity pattern); -1 when not counted
  StageTimes seconds;     ///< the solver's own parts (analyse, factorize, solve)
};

/// An eddy-current study: one row per rotor speed, and how the rotor's motion entered.
struct EddyResult {
  std::vector<SpeedResult> rows;
  std::vector<SkinDepth> skin;
  std::string method;                      ///< motion term or slip-frequency method
  std::optional<double> end_ring_factor;   ///< slip method with end rings given
  double unmodelled_current = 0.0;         ///< slip method: largest phase current [A] left out
  bool slip_method = false;
};

struct RunRecord {
  // The core every run has.
  std::string title;
  std::string version;
  std::string study;        ///< the study kind as case files spell it
  std::string strategy;     ///< how it was solved, one line
  std::string inputs_json;  ///< the case as read, a JSON object
  std::string model;        ///< which model was solved (whole cross-section or a sector)
  std::string machine;      ///< one line: slots (poles, sectors), poles, phases, q, winding factor
  double frequency = 0.0;   ///< supply frequency [Hz]
  const mesh::Mesh* mesh = nullptr;
  const mesh::Winding* winding = nullptr;
  SolverSummary solver;
  StageTimes seconds;
  std::vector<std::string> warnings;
  std::vector<std::string> notes;  ///< extra lines for the terminal (e.g. the currents of a circuit)
  std::vector<std::string> files;  ///< written before the summary
  // The bodies a study has (null: not this study's).
  const StudyResult* field = nullptr;  ///< the air-gap field per step
  bool field_rotates = false;          ///< the stator currents advance over the steps: rotation metrics apply
  std::string drive_json;              ///< the currents as used and the inductances; empty: none
  const MotionResult* motion = nullptr;  ///< solved step by step: flux linkage, inductances, Newton per step
  bool rotor_turns = false;            ///< with `motion`: the rotor turns, so torque and cogging apply
  double load_angle = 0.0;             ///< synchronous studies: electrical [rad], as placed
  const EddyResult* eddy = nullptr;
};

/// The tables of the bodies the record has (steps.csv, gap_field.csv, harmonics.csv, poles.csv,
/// winding tables, torque.csv, inductances.csv, torque_speed.csv); returns the names written.
std::vector<std::string> write_result_tables(const std::filesystem::path& dir, const RunRecord& r);

/// summary.json: program, version, caution, inputs, then mesh, winding, solver and each body's
/// headline numbers with units. Written last, so its presence marks a complete result folder.
void write_summary(const std::filesystem::path& path, const RunRecord& r);

/// The few lines a user reads on the terminal after a run, ending with the caution.
void print_summary(std::ostream& out, const RunRecord& r, const std::filesystem::path& dir);

}  // namespace tf::post
