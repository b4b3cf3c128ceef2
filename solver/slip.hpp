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
// The system is solver/time_harmonic.hpp's with the coefficients of EddyModel::slip_frequency,
// one TimeHarmonicProblem per wave with omega = s omega_supply (or (2 - s) omega_supply, signed)
// and rotor_speed = 0.
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

}  // namespace tf::solver
