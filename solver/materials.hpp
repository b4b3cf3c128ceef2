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
  // Permanent magnets (surface-magnet rotors), linear: B = mu0 mu_rec H + B_rem, |B_rem| = remanence.
  // Invented defaults of the order of sintered rare-earth magnets.
  double magnet_remanence = 1.2;  ///< B_r [T]
  double magnet_mu_rec = 1.05;    ///< recoil relative permeability [-]
  // Rotor bars (squirrel cage): non-magnetic. The conductivity is kept for eddy-current studies of a
  // cage, which need the slip-frequency method (not built yet); until then bars carry no current.
  // Invented default, of the order of cast aluminium.
  double bar_sigma = 3.0e7;  ///< [S/m]
};

}  // namespace tf::solver
