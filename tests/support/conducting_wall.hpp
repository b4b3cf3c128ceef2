#pragma once
// Time-harmonic systems for test meshes whose stationary conductors are labelled stator_iron.

#include "mesh/winding.hpp"
#include "solver/coefficients.hpp"
#include "solver/time_harmonic.hpp"

namespace tf::testing {

struct ConductorSystem {
  solver::Materials materials;             ///< stator_iron: non-magnetic, of the given conductivity
  solver::RegionCoefficients coefficients;  ///< of materials, EddyModel::motion_term
  solver::TimeHarmonicSystem system;        ///< no winding: the test sets unit_loads itself
};

inline ConductorSystem conductor_system(const mesh::Mesh& m, double sigma) {
  ConductorSystem c;
  c.materials.stator_iron_mu_r = 1.0;
  c.materials.stator_iron_sigma = sigma;
  c.coefficients = solver::region_coefficients(m, c.materials);
  mesh::Winding none;
  none.spec.n_phases = 1;
  c.system = solver::assemble_time_harmonic(m, none, c.coefficients);
  return c;
}

}  // namespace tf::testing
