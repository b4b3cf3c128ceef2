#pragma once
// Linear magnetic materials of the cross-section. Coils and air have the permeability of free space.

namespace tf::solver {

struct Materials {
  double stator_iron_mu_r = 1000.0;  ///< relative permeability of the stator laminations
  double rotor_iron_mu_r = 1000.0;
  double shaft_mu_r = 1.0;
};

}  // namespace tf::solver
