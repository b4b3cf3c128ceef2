#pragma once
// Files of an eddy-current study: torque_speed.csv and a VTU file per speed.

#include <complex>
#include <filesystem>
#include <string>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/eddy_quantities.hpp"
#include "post/vtu.hpp"

namespace tf::post {

/// torque_speed.csv: one row per rotor speed; with the slip-frequency method also the slip,
/// torque and rotor loss of the forward and backward components.
void write_torque_speed(const std::filesystem::path& path, const std::vector<SpeedResult>& rows, int pole_pairs);

/// One speed's field drawn whole (post/vtu.hpp): A (real and imaginary parts of the peak phasor,
/// #model nodes) at nodes; per triangle the peak |B| over a period and the peak induced current
/// density |J|; the speed's metadata as field data.
void write_eddy_vtu(const std::filesystem::path& path, const FieldDrawing& d, const Eigen::VectorXcd& a,
                    const SpeedInputs& in, double rotor_speed, const FieldMetadata& info);

/// What an eddy-current study's field collection is indexed by, over the speeds it writes (in
/// order): "speed_rpm" when they increase, "slip" when they decrease (the slip then increases),
/// else "speed_number" (0, 1, 2 ...); one value per speed.
struct SpeedAxis {
  std::string name;
  std::vector<double> values;
};
SpeedAxis speed_collection_axis(const std::vector<SpeedResult>& written);

/// The field data of one speed: "speed_number", "speed_rad_per_s", "speed_rpm", "slip",
/// "frequency_Hz" (of the field solved) and the peak phasors of the currents shown,
/// "current_<phase>_peak_A" and "current_<phase>_phase_deg"; "collection_time" names the axis.
FieldMetadata speed_metadata(int speed_number, const SpeedResult& row, double frequency,
                             const std::vector<std::complex<double>>& currents, const std::string& axis);

/// Peak over a period of |B| [T] per triangle of the peak phasor A [Wb/m] (#nodes).
Eigen::VectorXd peak_flux_density(const mesh::Mesh& m, const Eigen::VectorXcd& a);

}  // namespace tf::post
