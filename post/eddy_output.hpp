#pragma once
// Files of an eddy-current study: torque_speed.csv, a VTU file per speed, summary.json.

#include <filesystem>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/eddy_quantities.hpp"
#include "solver/time_harmonic.hpp"

namespace tf::post {

/// torque_speed.csv: one row per rotor speed; with the slip-frequency method also the slip,
/// torque and rotor loss of the forward and backward components.
void write_torque_speed(const std::filesystem::path& path, const std::vector<SpeedResult>& rows, int pole_pairs);

/// One speed's field: A (real and imaginary parts of the peak phasor) at nodes; per triangle the
/// peak |B| over a period, the peak induced current density |J| and region.
void write_eddy_vtu(const std::filesystem::path& path, const mesh::Mesh& m, const Eigen::VectorXcd& a,
                    const SpeedInputs& in, double rotor_speed);

/// Peak over a period of |B| [T] per triangle of the peak phasor A [Wb/m] (#nodes).
Eigen::VectorXd peak_flux_density(const mesh::Mesh& m, const Eigen::VectorXcd& a);

struct EddyRecord {
  std::string version, inputs_json;
  const mesh::Mesh* mesh = nullptr;
  const mesh::Winding* winding = nullptr;
  const std::vector<SpeedResult>* rows = nullptr;
  std::vector<SkinDepth> skin;
  solver::TimeHarmonicStats stats;
  std::vector<std::pair<std::string, double>> seconds;
  std::vector<std::string> files;
  /// How rotor motion entered the model.
  std::string method = "motion term sigma omega_r dA/dtheta (exact for rotationally invariant rotors)";
  std::optional<double> end_ring_factor;  ///< slip method with end rings given: the bar-conductivity factor
  double unmodelled_current = 0.0;  ///< slip method: largest phase current [A] left out (no rotating fundamental)
};
void write_eddy_summary(const std::filesystem::path& path, const EddyRecord& r);

}  // namespace tf::post
