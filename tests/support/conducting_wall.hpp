#pragma once
// Eddy-current systems for test meshes whose stationary conductors are labelled stator_iron.

#include "mesh/winding.hpp"
#include "solver/eddy.hpp"

namespace tf::testing {

struct ConductorSystem {
  solver::Materials materials;  ///< stator_iron: non-magnetic, of the given conductivity
  solver::EddySystem system;    ///< no winding: the test sets unit_loads itself
};

inline ConductorSystem conductor_system(const mesh::Mesh& m, double sigma) {
  ConductorSystem c;
  c.materials.stator_iron_mu_r = 1.0;
  c.materials.stator_iron_sigma = sigma;
  mesh::Winding none;
  none.spec.n_phases = 1;
  c.system = solver::assemble_eddy(m, none, c.materials);
  return c;
}

}  // namespace tf::testing
