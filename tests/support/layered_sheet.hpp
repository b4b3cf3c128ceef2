#pragma once
// Exact field of a sinusoidal current sheet K cos(p theta) at the stator bore R_s in the slotless
// layered model: rotor iron (0..R_r, mu_r), air gap (R_r..R_s), stator iron (R_s..R_o, mu_s), A = 0
// at R_o. In each layer A = (a r^p + b r^-p) cos(p theta); the five coefficients follow from
// continuity of A and of H_theta at R_r, continuity of A and the jump H_theta,out - H_theta,in = K
// at R_s, and A(R_o) = 0. With R_o -> infinity this is the closed form of docs/references.md §4
// (K. J. Binns, P. J. Lawrenson, C. W. Trowbridge, The Analytical and Numerical Solution of
// Electric and Magnetic Fields, Wiley 1992 — from memory); the test checks that limit too.

#include <cmath>
#include <numbers>

#include <Eigen/Dense>

namespace tf::testing {

struct LayeredSheet {
  int p;
  double r_rotor, r_stator, r_outer, mu_rotor, mu_stator, sheet;  // [m], [-], [A/m]

  /// Amplitude of A_z [Wb/m] in the gap at radius r.
  double gap_potential(double r) const {
    const double mu0 = 4e-7 * std::numbers::pi;
    const double nu0 = 1 / mu0, nu_r = nu0 / mu_rotor, nu_s = nu0 / mu_stator;
    auto pw = [this](double r, int sign) { return std::pow(r, sign * p); };
    auto dpw = [this](double r, int sign) { return sign * p * std::pow(r, sign * p - 1); };
    // Unknowns: a1 (rotor), a2, b2 (gap), a3, b3 (stator).
    Eigen::Matrix<double, 5, 5> m = Eigen::Matrix<double, 5, 5>::Zero();
    Eigen::Matrix<double, 5, 1> f = Eigen::Matrix<double, 5, 1>::Zero();
    const double rr = r_rotor, rs = r_stator;
    m.row(0) << pw(rr, 1), -pw(rr, 1), -pw(rr, -1), 0, 0;                                   // A at R_r
    m.row(1) << nu_r * dpw(rr, 1), -nu0 * dpw(rr, 1), -nu0 * dpw(rr, -1), 0, 0;             // H_theta at R_r
    m.row(2) << 0, pw(rs, 1), pw(rs, -1), -pw(rs, 1), -pw(rs, -1);                          // A at R_s
    m.row(3) << 0, nu0 * dpw(rs, 1), nu0 * dpw(rs, -1), -nu_s * dpw(rs, 1), -nu_s * dpw(rs, -1);  // jump
    f(3) = sheet;
    m.row(4) << 0, 0, 0, pw(r_outer, 1), pw(r_outer, -1);                                   // A(R_o) = 0
    // Scale rows so that the solve is well conditioned for large R_o.
    for (int i = 0; i < 5; ++i) {
      const double s = m.row(i).cwiseAbs().maxCoeff();
      m.row(i) /= s;
      f(i) /= s;
    }
    const Eigen::Matrix<double, 5, 1> c = m.fullPivLu().solve(f);
    return c(1) * pw(r, 1) + c(2) * pw(r, -1);
  }

  /// Amplitude of B_r [T] in the gap at radius r: (p / r) |A|.
  double gap_radial_flux_density(double r) const { return p / r * std::abs(gap_potential(r)); }
};

}  // namespace tf::testing
