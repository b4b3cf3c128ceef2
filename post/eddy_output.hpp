#pragma once
// Files of an eddy-current study: torque_speed.csv and a VTU file per speed.

#include <filesystem>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/eddy_quantities.hpp"

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

}  // namespace tf::post
