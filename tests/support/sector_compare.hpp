#pragma once
// Quantities of one magnetostatic field that a sector model must reproduce from the full model:
// the mid-gap B_r on the whole circle and its fundamental, Arkkio's torque and the phase flux
// linkages (all whole-machine values by the contracts of gap_field.hpp, torque.hpp, flux_linkage.hpp).

#include <complex>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/gap_field.hpp"
#include "post/torque.hpp"
#include "solver/flux_linkage.hpp"

namespace tf::testing {

struct MachineQuantities {
  Eigen::VectorXd br;               ///< B_r [T] at 720 angles round the whole circle
  std::complex<double> fundamental; ///< c_p of B_r [T], p = pole_pairs
  double torque = 0.0;              ///< Arkkio [N m/m]
  Eigen::VectorXd psi;              ///< flux linkage per phase [Wb/m]
};

inline MachineQuantities machine_quantities(const mesh::Mesh& m, const mesh::Winding& w, const Eigen::VectorXd& a,
                                            int shift) {
  const post::GapOperators g = post::gap_operators(m, 720, 2 * w.spec.pole_pairs(), shift);
  MachineQuantities q;
  q.br = g.br * a;
  q.fundamental = post::gap_harmonics(g, a)(w.spec.pole_pairs(), 0);
  q.torque = post::arkkio_torque_static(m, a, 1.0);
  q.psi = solver::flux_linkage(m, w, a, 1.0).col(0);
  return q;
}

/// Largest relative differences of a sector model's quantities from the full model's.
struct Differences {
  double br = 0.0, fundamental = 0.0, torque = 0.0, psi = 0.0;
};

inline Differences differences(const MachineQuantities& sector, const MachineQuantities& full) {
  Differences d;
  d.br = (sector.br - full.br).cwiseAbs().maxCoeff() / full.br.cwiseAbs().maxCoeff();
  d.fundamental = std::abs(sector.fundamental - full.fundamental) / std::abs(full.fundamental);
  d.torque = std::abs(sector.torque - full.torque) / std::abs(full.torque);
  d.psi = (sector.psi - full.psi).cwiseAbs().maxCoeff() / full.psi.cwiseAbs().maxCoeff();
  return d;
}

}  // namespace tf::testing
