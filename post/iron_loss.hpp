#pragma once
// Iron loss from the flux density of each iron triangle over one electrical period, by a
// Steinmetz-type law applied per time harmonic and per Cartesian component.
//
// The hysteresis law p_h = k_h f B^alpha is C. P. Steinmetz's ("On the law of hysteresis", AIEE
// Trans. 9, 1892; from memory); adding the classical eddy-current term k_e f^2 B^2 and summing both over the time
// harmonics n (frequency n f, amplitude B_n) and over the two Cartesian components separately is a
// common engineering approximation, not a law: it ignores minor loops, DC bias, and the fact that
// hysteresis of a rotating field is not the sum of two alternating ones. By this rule a field of
// constant magnitude turning uniformly (B_x = B cos, B_y = B sin) loses twice what one of its
// components alone would. The excess (anomalous) loss is not modelled.
//
// Frames: the mesh never moves, so B in rotor triangles is in the rotor's own frame, which is the
// field the rotor iron sees; sample it at the rotor positions of each time step and it needs no
// conversion.

#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "solver/materials.hpp"

namespace tf::post {

/// Flux density of each triangle at K equal time steps over one electrical period, t_k = k / (K f).
struct FluxHistory {
  Eigen::MatrixXd bx;      ///< #triangles by K: B_x [T]
  Eigen::MatrixXd by;      ///< #triangles by K: B_y [T]
  double frequency = 0.0;  ///< electrical frequency f [Hz]
};

struct IronLoss {
  Eigen::VectorXd density;          ///< #triangles: loss per volume [W/m^3], 0 outside iron (for a field file)
  std::vector<double> region_loss;  ///< per region, indexed like m.regions [W]; whole machine (a sector
                                    ///< model's regions times its copies)
  double total = 0.0;               ///< whole machine [W]
};

/// Specific loss [W/kg] of one component sampled at K equal steps over one period of `frequency`:
/// sum over harmonics n = 1 .. K/2 of k_h (n f) B_n^alpha + k_e (n f)^2 B_n^2, where B_n is the peak
/// amplitude of harmonic n from the discrete Fourier transform (the mean, n = 0, loses nothing).
/// k_h = c.hysteresis, alpha = c.exponent, k_e = c.eddy.
double specific_loss(const solver::IronLossData& c, const Eigen::VectorXd& samples, double frequency);

/// Loss of every triangle whose region has coefficients (k_h or k_e and the density nonzero):
/// density [W/m^3] = rho (p(B_x) + p(B_y)), and per region [W] = sum of density * area * stack_length.
/// per_region: indexed like m.regions (solver::RegionCoefficients::iron_loss). stack_length [m]
/// (1 for per-metre values [W/m]).
IronLoss iron_loss(const mesh::Mesh& m, const FluxHistory& b, const std::vector<solver::IronLossData>& per_region,
                   double stack_length);

}  // namespace tf::post
