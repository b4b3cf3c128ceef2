#pragma once
// Time-harmonic fields with eddy currents: complex A (peak phasors) of
//   -div(nu grad A) + sigma (j omega A + omega_r dA/dtheta) = J_source,
// the second term being the induced current density -J_e in conductors.
//
// Two studies use it, as two choices of omega and omega_r on one system (K, M, C):
//  - the stator-frame study with the motion term: omega the supply's, omega_r the rotor's speed.
//    sigma omega_r dA/dtheta is the motion of a rotationally invariant rotor seen from the stator
//    (exact for a smooth cylinder, the setting of TEAM problem 30a): J_e = sigma (E + v x B) with
//    v = omega_r (-y, x) and (v x B)_z = -omega_r dA/dtheta. Coefficients: EddyModel::motion_term.
//  - the slip-frequency method (solver/slip.hpp): each rotating wave in the rotor's frame, omega
//    = s omega_supply and omega_r = 0 (no motion term). Coefficients: EddyModel::slip_frequency.
//
// K (stiffness), M (sigma-weighted mass over conductors) and C (motion, conductors that move with
// the rotor) are assembled once; each problem needs one numerical factorization of
// K + j omega M + omega_r C, the symbolic analysis (UMFPACK) being shared: the pattern is K's.
//
// Full models only: a sector's cut conditions are not a sign for time-harmonic fields of every
// space order (each harmonic of a rotating field turns the phase by its own angle across a cut),
// so assembly and solve refuse a mesh with m.symmetry.copies > 1.

#include <complex>
#include <functional>
#include <vector>

#include <Eigen/Core>
#include <Eigen/SparseCore>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/coefficients.hpp"
#include "solver/dofs.hpp"

namespace tf::solver {

struct TimeHarmonicSystem {
  DofMap dofs;
  Eigen::SparseMatrix<double> stiffness;  ///< K [#dofs by #dofs], from RegionCoefficients::nu
  Eigen::SparseMatrix<double> mass;       ///< M: int sigma phi_i phi_j over conductors [#dofs by #dofs]
  Eigen::SparseMatrix<double> motion;     ///< C: int sigma phi_i dphi_j/dtheta over moving conductors
  Eigen::MatrixXd unit_loads;             ///< #dofs by #phases, for 1 A in each phase
};

/// K, M, C and the unit loads of the full model m. Throws SolveError for a sector mesh, or when
/// the winding names a coil side the mesh does not have.
TimeHarmonicSystem assemble_time_harmonic(const mesh::Mesh& m, const mesh::Winding& w, const RegionCoefficients& c);

/// One system to solve: (K + j omega M + rotor_speed C) a = unit_loads * currents.
struct TimeHarmonicProblem {
  std::vector<std::complex<double>> currents;  ///< per phase (columns of unit_loads), peak phasors [A]
  double omega = 0.0;        ///< angular frequency on M [rad/s]: the supply's, or s omega in the rotor frame (signed)
  double rotor_speed = 0.0;  ///< mechanical speed on C [rad/s], counter-clockwise; 0 for the slip method
};

struct TimeHarmonicStats {
  int n_dofs = 0;
  double assemble_seconds = 0.0, analyse_seconds = 0.0, factorize_seconds = 0.0, solve_seconds = 0.0;
};

/// A (#nodes, peak phasors [Wb/m]; 0 at fixed nodes) of each problem, in order; one symbolic
/// analysis for all. Times are added to stats. Throws SolveError (a sector mesh, a failed factorization).
/// `solved(k, n)`, if given, is told after each of the n problems (for a progress line).
std::vector<Eigen::VectorXcd> solve_time_harmonic(const mesh::Mesh& m, const TimeHarmonicSystem& s,
                                                  const std::vector<TimeHarmonicProblem>& problems,
                                                  TimeHarmonicStats& stats,
                                                  const std::function<void(int, int)>& solved = {});

}  // namespace tf::solver
