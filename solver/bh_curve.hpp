#pragma once
// A single-valued B-H curve of soft iron for nonlinear magnetostatics: H as a monotone cubic
// function of B through the table points, extended beyond the last point with the slope of free
// space, and the reluctivity nu(B^2) = H/B that the Newton iteration needs.
//
// Units: H [A/m], B [T], nu [m/H], energy densities [J/m^3]. The curve is odd: H(-B) = -H(B).

#include <array>
#include <optional>
#include <string>
#include <vector>

namespace tf::solver {

class BhCurve {
 public:
  /// Why the table (H_i, B_i), i = 1..n, cannot be used, as a plain sentence naming the 1-based
  /// point; nullopt when it can. Requirements:
  ///  - as many H values as B values, at least 3 points, all finite;
  ///  - H and B strictly increasing, both >= 0; a first point with H = 0 must have B = 0, and a
  ///    table starting above H = 0 gets the point (0, 0) put in front of it;
  ///  - B/H >= mu0 at every point with H > 0 (relative permeability at least 1, within 1e-9),
  ///    so that the extension with the slope of free space stays single-valued and nu <= 1/mu0.
  static std::optional<std::string> table_problem(const std::vector<double>& h, const std::vector<double>& b);

  /// stacking_factor k in (0, 1]: a laminated stack of iron fraction k carries
  /// B(H) = k B_iron(H) + (1 - k) mu0 H, applied to the table points before interpolation.
  /// Throws std::invalid_argument when table_problem() is not nullopt or k is outside (0, 1].
  BhCurve(std::vector<double> h, std::vector<double> b, double stacking_factor = 1.0);

  /// H(B) [A/m]: the monotone piecewise-cubic Hermite interpolant of Fritsch and Carlson
  /// (F. N. Fritsch, R. E. Carlson, "Monotone piecewise cubic interpolation", SIAM J. Numer.
  /// Anal. 17(2), 1980): passes through the points, never overshoots between them, and is
  /// continuously differentiable. Beyond the last point H grows with dH/dB = 1/mu0.
  double h_of_b(double b) const;
  /// B(H) [T], the inverse of h_of_b (safeguarded Newton on the cubic piece).
  double b_of_h(double h) const;

  struct Reluctivity {
    double nu;       ///< H/B [m/H]; at B = 0 the initial slope dH/dB, finite and positive
    double dnu_db2;  ///< d nu / d(B^2) [m/(H T^2)]. Reported as 0 at B = 0 exactly; it may grow
                     ///< like 1/B as B -> 0, but only B^2 dnu_db2 enters the Newton Jacobian.
  };
  /// Reluctivity and its derivative with respect to B^2 [T^2], b_squared >= 0.
  Reluctivity reluctivity(double b_squared) const;

  /// Magnetic energy density w(B) = integral_0^|B| H dB' [J/m^3], exact on the cubic pieces.
  double energy_density(double b) const;
  /// Co-energy density B H - w(B) [J/m^3].
  double coenergy_density(double b) const;

  const std::vector<double>& table_h() const { return h_; }  ///< after (0,0) and stacking
  const std::vector<double>& table_b() const { return b_; }

 private:
  int piece_of_b(double b) const;  ///< index k of [b_k, b_k+1), or -1 beyond the last point
  std::vector<double> h_, b_;
  std::vector<std::array<double, 4>> cubic_;  ///< H = c0 + c1 s + c2 s^2 + c3 s^3, s = B - b_k
  std::vector<double> energy_at_point_;      ///< w(b_k)
};

/// The analytic law B(H) = mu0 H + (2 Js/pi) atan(pi (mu_ri - 1) mu0 H / (2 Js)) (docs/references.md §5)
/// sampled into a table: (0, 0) and n_points - 1 values of H spaced evenly in log H from
/// h_knee/100 to h_max, where h_knee = 2 Js/(pi (mu_ri - 1) mu0) is the H at which the arctan's
/// argument is 1. Js [T], mu_ri > 1, h_max [A/m] > h_knee/100, n_points >= 3. Even spacing in
/// log H puts the points where the curve bends; with 25 points per decade the interpolated
/// B(H) stays within 0.05 % of the law (checked in tests/solver/test_bh_curve.cpp).
BhCurve sampled_arctan_law(double js, double mu_ri, int n_points, double h_max);

}  // namespace tf::solver
