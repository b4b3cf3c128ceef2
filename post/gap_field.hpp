#pragma once
// The air-gap field on the sliding circle (the middle of the gap), as linear operators on the
// nodal potential, so that the m unit phase fields are sampled once and every step is a cheap
// combination of them.
//
// Conventions: angles are mechanical, counter-clockwise from the +x axis; B_r > 0 points outwards
// (rotor to stator). Harmonic c_n of mechanical order n is defined so that
//   B_r(theta) = sum_n |c_n| cos(n theta - arg c_n),  i.e. c_n = (2/M) sum_i B_r(theta_i) e^{+j n theta_i};
// a wave B cos(p theta - omega t) turning counter-clockwise then has c_p = B e^{+j omega t}.

#include <complex>
#include <vector>

#include <Eigen/Core>
#include <Eigen/SparseCore>

#include "mesh/mesh.hpp"

namespace tf::post {

struct GapOperators {
  double radius = 0.0;               ///< [m]
  std::vector<double> angles;        ///< the M sample angles [rad], 2*pi*j/M
  Eigen::SparseMatrix<double> br;    ///< M by #nodes: B_r [T] at the sample angles
  Eigen::SparseMatrix<double> bt;    ///< M by #nodes: B_theta [T] at the sample angles
  Eigen::MatrixXcd harmonics;        ///< (max_order + 1) by #circle_nodes: c_n of B_r [T], n = 0..max_order
  std::vector<int> circle_nodes;     ///< stator-side sliding nodes the harmonics read (a sector
                                     ///< model's own; the harmonics fold its images in)
};

/// B_r: the normal flux density of each chord of the sliding circle, (a_{i+1} - a_i)/chord, which
/// both neighbouring first-order triangles share exactly, interpolated linearly between chord
/// midpoints. B_theta: the mean of the two triangles' tangential components. Harmonics: B_r,n =
/// n A_n / r from the discrete Fourier transform of the nodal A on the circle (A is continuous
/// there; differentiating its series avoids sampling a piecewise-constant B).
/// rotor_shift: the rotor turned by that many node pitches, as in solver::number_dofs; the rotor-side
/// triangle of rotor chord j then faces stator chord j + rotor_shift (only B_theta reads it).
/// Sector models (m.symmetry): the operators cover the whole circle, unfolded from the model's
/// nodes with the sign of each copy, so B_r, B_theta and the harmonics are the whole machine's.
GapOperators gap_operators(const mesh::Mesh& m, int n_points, int max_order, int rotor_shift = 0);

/// The harmonics c_n (rows n = 0..max_order) of nodal potentials a (#nodes by #columns).
Eigen::MatrixXcd gap_harmonics(const GapOperators& g, const Eigen::MatrixXd& a);

}  // namespace tf::post
