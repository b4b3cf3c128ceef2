#pragma once
// The whole path of one case: case -> mesh -> solve -> post -> files.

#include <filesystem>
#include <optional>
#include <ostream>
#include <string>

#include "app/case.hpp"
#include "mesh/mesh.hpp"
#include "mesh/symmetry.hpp"
#include "mesh/winding.hpp"
#include "post/case_report.hpp"
#include "post/rotation_metrics.hpp"

namespace tf::app {

inline constexpr const char* kVersion = "0.1.0";

struct RunOptions {
  std::filesystem::path out_dir;
  bool all_field_files = false;  ///< a VTU file for every step instead of study.field_files
  int report_step = 0;  ///< the step (eddy currents: the speed) whose cross-section the report draws
};

/// The mesh of a case and its winding laid out on it: the first step of every study. The mesh is
/// one sector of the machine when the winding and the rotor repeat (mesh::choose_sector), unless
/// the case asks for the full model or its study or parts are not yet checked on sectors
/// (eddy currents, salient-pole and slotless stators, bar rotors, open boundaries).
struct MeshedCase {
  mesh::Mesh mesh;
  mesh::Winding winding;
};
MeshedCase mesh_and_wind(const Case& c);

/// The sector a case is solved on, if any (see mesh_and_wind).
std::optional<mesh::SectorChoice> model_sector(const Case& c, const mesh::Winding& w);

/// One line saying which model was solved, e.g. "one sector of 6 slots (1/4 of the machine,
/// anti-periodic)".
std::string model_description(const mesh::Mesh& m);

/// The parts of the report page every study shares (title, inputs, model, winding factor);
/// the cross-section is left for the study to fill.
post::ReportContext report_context(const Case& c, const mesh::Mesh& m, const mesh::Winding& w);

/// Checks RunOptions::report_step against the case's steps (eddy currents: its speeds); throws InputError.
void check_report_step(const Case& c, int report_step);

/// The headline numbers of one run, for comparisons.
struct Headline {
  post::RotationMetrics metrics;
  double winding_factor = 0.0;  ///< fundamental, phase A, star of slots
};

/// Runs the case and writes its result folder; prints a short human summary to `out`.
/// Throws mesh::MeshError, solver::SolveError or post::OutputError.
Headline run_case(const Case& c, const RunOptions& options, std::ostream& out);

/// Meshes the case and writes mesh.vtu (region ids) and regions.csv to out_dir.
void mesh_case(const Case& c, const std::filesystem::path& out_dir, std::ostream& out);

}  // namespace tf::app
