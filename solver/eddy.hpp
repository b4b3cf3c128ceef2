#pragma once
// Time-harmonic fields with eddy currents: complex A (peak phasors) of
//   -div(nu grad A) + sigma (j omega A + omega_r dA/dtheta) = J_source,
// the second term being the induced current density -J_e in conductors. The rotor term
// sigma omega_r dA/dtheta is the motion of a rotationally invariant rotor seen from the stator
// (exact for a smooth cylinder, the setting of TEAM problem 30a): J_e = sigma (E + v x B) with
// v = omega_r (-y, x) and (v x B)_z = -omega_r dA/dtheta.
//
// K (stiffness), M (conductor mass, sigma-weighted) and C (motion, rotor conductors) are assembled
// once; each rotor speed needs one numerical factorization of K + j omega M + omega_r C with the
// symbolic analysis shared, the pattern being the same.

#include <complex>
#include <vector>

#include <Eigen/Core>
#include <Eigen/SparseCore>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/dofs.hpp"
#include "solver/materials.hpp"

namespace tf::solver {

/// Conductivity [S/m] of each region, indexed like m.regions.
std::vector<double> region_conductivity(const mesh::Mesh& m, const Materials& materials);

/// Whether each region moves with the rotor.
std::vector<bool> region_on_rotor(const mesh::Mesh& m);

struct EddySystem {
  DofMap dofs;
  Eigen::SparseMatrix<double> stiffness;  ///< K [#dofs by #dofs]
  Eigen::SparseMatrix<double> mass;       ///< M: int sigma phi_i phi_j over conductors
  Eigen::SparseMatrix<double> motion;     ///< C: int sigma phi_i dphi_j/dtheta over rotor conductors
  Eigen::MatrixXd unit_loads;             ///< #dofs by #phases, for 1 A in each phase
};

EddySystem assemble_eddy(const mesh::Mesh& m, const mesh::Winding& w, const Materials& materials);

struct EddySolution {
  double rotor_speed = 0.0;   ///< [rad/s], mechanical, counter-clockwise
  Eigen::VectorXcd potential; ///< #nodes: peak phasor of A_z [Wb/m]
};

struct EddyStats {
  int n_dofs = 0;
  double assemble_seconds = 0.0, analyse_seconds = 0.0, factorize_seconds = 0.0, solve_seconds = 0.0;
};

/// One solution per rotor speed for the phase currents `currents` (peak phasors [A]) at
/// `frequency` [Hz]. Throws SolveError.
std::vector<EddySolution> solve_eddy(const mesh::Mesh& m, const EddySystem& s,
                                     const std::vector<std::complex<double>>& currents, double frequency,
                                     const std::vector<double>& rotor_speeds, EddyStats& stats);

}  // namespace tf::solver
