#pragma once
// Files of a rotor-motion study: the air-gap tables of any study, torque.csv, inductances.csv,
// field files with the rotor drawn where it stands, and summary.json.

#include <filesystem>
#include <string>
#include <utility>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/iron_loss.hpp"
#include "post/motion_result.hpp"
#include "solver/motion.hpp"

namespace tf::post {

/// steps.csv, gap_field.csv, harmonics.csv, poles.csv, winding tables, torque.csv and
/// inductances.csv; returns the names written.
std::vector<std::string> write_motion_tables(const std::filesystem::path& dir, const MotionResult& r,
                                             const mesh::Winding& w, double frequency);

/// field_NNNN.vtu for the given steps (fields: nodal A of each, in the same order) and field.pvd,
/// whose time of step k is step_time[k]; each drawn with its rotor turned to where it stood.
/// Returns the names written.
std::vector<std::string> write_motion_fields(const std::filesystem::path& dir, const mesh::Mesh& m,
                                             const MotionResult& r, const std::vector<int>& steps,
                                             const std::vector<Eigen::VectorXd>& fields,
                                             const std::vector<double>& step_time);

/// The rotor angle [rad] at which a (sector) mesh draws a rotor that stood at rotor_angle: turned
/// back by whole sectors into the stator's sector (the field there is the image of the field).
double drawn_rotor_angle(const mesh::Mesh& m, double rotor_angle);

/// iron_loss.csv (per region [W]) and iron_loss.vtu (loss density per triangle [W/m^3]).
void write_iron_loss(const std::filesystem::path& dir, const mesh::Mesh& m, const IronLoss& loss);

struct MotionRecord {
  std::string version, inputs_json;
  double load_angle = 0.0;  ///< synchronous studies: as placed [rad, electrical]
  std::string sampling_warning;  ///< why the steps may not resolve the torque ripple; empty if they do
  const mesh::Mesh* mesh = nullptr;
  const mesh::Winding* winding = nullptr;
  const MotionResult* result = nullptr;
  solver::MotionStats stats;
  std::vector<std::pair<std::string, double>> seconds;
  std::vector<std::string> files;
};
void write_motion_summary(const std::filesystem::path& path, const MotionRecord& r);

}  // namespace tf::post
