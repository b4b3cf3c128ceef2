#pragma once
// Linear materials of the cross-section. Coils and air have the permeability of free space and,
// as source regions of given current, no eddy currents.

namespace tf::solver {

struct Materials {
  double stator_iron_mu_r = 1000.0;  ///< relative permeability of the stator laminations
  double rotor_iron_mu_r = 1000.0;
  double shaft_mu_r = 1.0;
  double sleeve_mu_r = 1.0;          ///< a conducting sleeve on the rotor surface
  // Conductivities [S/m] for eddy currents (time-harmonic studies); 0 is an insulator or laminations.
  double stator_iron_sigma = 0.0;
  double rotor_iron_sigma = 0.0;
  double shaft_sigma = 0.0;
  double sleeve_sigma = 0.0;
};

}  // namespace tf::solver
