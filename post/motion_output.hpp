#pragma once
// Files of a study solved step by step (torque.csv, inductances.csv, iron loss, field files with the
// rotor drawn where it stands) and the field-series writer every study uses.

#include <filesystem>
#include <functional>
#include <string>
#include <utility>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/iron_loss.hpp"
#include "post/motion_result.hpp"
#include "post/vtu.hpp"
#include "solver/motion.hpp"

namespace tf::post {

/// torque.csv: per step the rotor angle, torque by three methods, flux linkage per phase, dq flux
/// linkages, back-EMF and Newton's iterations and residual.
void write_torque_table(const std::filesystem::path& path, const MotionResult& r);

/// inductances.csv: per step the apparent and incremental inductance matrices [H].
void write_inductance_table(const std::filesystem::path& path, const MotionResult& r);

/// One file of a field series: its step (the file is field_NNNN.vtu), its time in the collection
/// and how to write it.
struct FieldFrame {
  int step = 0;
  double time = 0.0;  ///< [s], or another monotone index (an eddy study's speed: post::speed_collection_axis)
  std::function<void(const std::filesystem::path&)> write;
};

/// Writes every frame and field.pvd, the collection that lists them; returns the names written
/// (none for no frames). The one field-file writer of every study.
std::vector<std::string> write_field_series(const std::filesystem::path& dir, const std::vector<FieldFrame>& frames);

/// The field data of a magnetostatic step: "step", "electrical_angle_deg", "rotor_angle_deg",
/// "time_s" and "current_<phase>_A" (the names of steps.csv and torque.csv).
FieldMetadata step_metadata(int step, double electrical_angle, double rotor_angle, double time,
                            const std::vector<double>& currents);

/// The rotor angle [rad] at which a (sector) mesh draws a rotor that stood at rotor_angle: turned
/// back by whole sectors into the stator's sector (the field there is the image of the field).
double drawn_rotor_angle(const mesh::Mesh& m, double rotor_angle);

/// iron_loss.csv (per region of the model d draws [W]) and iron_loss.vtu (loss density per
/// triangle [W/m^3], the whole machine).
void write_iron_loss(const std::filesystem::path& dir, const FieldDrawing& d, const IronLoss& loss);

}  // namespace tf::post
