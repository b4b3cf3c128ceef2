#pragma once
// The slip-frequency method for rotors with bars (and any rotor): each rotating component of the
// stator currents is solved in the rotor's frame, where its field is time-harmonic at the slip
// frequency s omega, with no motion term:
//   -div(nu grad A) + j s omega sigma A = J_source   (sigma only in rotor conductors).
// The standard method for induction machines with impressed stator currents (e.g. A. Arkkio,
// Analysis of induction motors based on the numerical solution of the magnetic field and circuit
// equations, Helsinki University of Technology, 1987; J. Pyrhönen, T. Jokinen, V. Hrabovcová,
// Design of Rotating Electrical Machines, Wiley 2008, ch. 7, from memory). Stator conductors are
// not in this model: laminated iron and stranded coils carry no eddy currents. Exact for the
// fundamental wave: the stator's space harmonics are solved at the fundamental's slip too.
//
// Cage end rings. In 2D every bar runs the whole stack and is joined at both ends; with ideal
// (zero-resistance) rings all bars are connected in parallel at each end, so each bar's net
// current is free. The rings' Kirchhoff law (the bar currents sum to zero) then holds by symmetry:
// a field of p >= 1 pole pairs induces bar currents I_k ~ cos(p theta_k - phi) on N equally spaced
// bars, whose sum vanishes for N not dividing p. Real rings add resistance between neighbouring
// bars; the classical correction scales the bar conductivity (exact for the fundamental only):
//   sigma_bar' = k sigma_bar, k = R_bar / (R_bar + R_ring / (2 sin^2(pi p / N))),
//   R_bar = L / (sigma_bar A_bar), R_ring = pi D / (N sigma_ring A_ring) (one ring segment)
// (Pyrhönen, Jokinen, Hrabovcová 2008, ch. 7, from memory).

#include <complex>
#include <vector>

#include <Eigen/Core>
#include <Eigen/SparseCore>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/dofs.hpp"
#include "solver/eddy.hpp"
#include "solver/materials.hpp"

namespace tf::solver {

/// One end ring of a cage (both rings alike).
struct EndRings {
  double area = 0.0;           ///< ring cross-section [m^2]
  double mean_diameter = 0.0;  ///< [m]
  double conductivity = 0.0;   ///< [S/m]
};

/// What the end-ring correction needs of the cage.
struct Cage {
  int n_bars = 0;
  int pole_pairs = 1;
  double bar_area = 0.0;      ///< one bar's cross-section [m^2]
  double bar_sigma = 0.0;     ///< [S/m]
  double stack_length = 0.0;  ///< bar length [m]
};

/// The factor k (0 < k <= 1) on the bar conductivity for rings of finite resistance (see above).
double end_ring_factor(const Cage& cage, const EndRings& rings);

/// Conductivity [S/m] per region in the slip-frequency model: rotor conductors (iron, shaft,
/// sleeve, bars at materials.bar_sigma); 0 in the stator, air, coils and magnets.
std::vector<double> slip_conductivity(const mesh::Mesh& m, const Materials& materials);

/// Whether each region is on the rotor, bars included.
std::vector<bool> slip_on_rotor(const mesh::Mesh& m);

struct SlipSystem {
  DofMap dofs;
  Eigen::SparseMatrix<double> stiffness;   ///< K [#dofs by #dofs]
  Eigen::SparseMatrix<double> rotor_mass;  ///< M_rotor: int sigma phi_i phi_j over rotor conductors
  Eigen::MatrixXd unit_loads;              ///< #dofs by #phases, for 1 A in each phase
};

SlipSystem assemble_slip(const mesh::Mesh& m, const mesh::Winding& w, const Materials& materials);

/// One time-harmonic problem in the rotor's frame.
struct SlipProblem {
  std::vector<std::complex<double>> currents;  ///< per phase, peak phasors [A]
  double rotor_omega = 0.0;  ///< angular frequency the rotor sees [rad/s], signed: s omega or (2 - s) omega
};

/// A (#nodes, peak phasors [Wb/m]) of K + j rotor_omega M_rotor for each problem; one symbolic
/// analysis for all. Throws SolveError.
std::vector<Eigen::VectorXcd> solve_slip(const mesh::Mesh& m, const SlipSystem& s,
                                         const std::vector<SlipProblem>& problems, EddyStats& stats);

}  // namespace tf::solver
