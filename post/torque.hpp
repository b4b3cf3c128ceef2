#pragma once
// Magnetostatic torque on the rotor [N m] (per metre when stack_length = 1), counter-clockwise
// positive seen from +z, by three routes: Arkkio's band average (the main value), the Maxwell
// stress on the sliding circle (a cross-check) and virtual work, either local (the derivative of
// the energy of the gap layer under a virtual rotation, no extra solve) or as a difference of the
// co-energies of two solved positions.
//
// Frames: the rotor is never moved in the mesh; a turned rotor only reconnects the sliding circle.
// B in rotor-side triangles is then in the rotor's own frame, but the polar components (B_r, B_theta)
// that the stress formulas use are the same in either frame, so they apply per element unchanged.

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "post/gap_field.hpp"

namespace tf::post {

/// Arkkio's method for a real field: the Maxwell stress averaged over the whole gap band,
///   T = L / (mu0 (r_o - r_i)) * integral over the band of r B_r B_theta dS,
/// r_i = m.gap_inner_radius, r_o = m.gap_outer_radius, over all RegionKind::gap triangles (both sides
/// of the sliding circle), B per triangle split into polar components at its centroid (A. Arkkio,
/// Analysis of induction motors based on the numerical solution of the magnetic field and circuit
/// equations, Helsinki University of Technology, 1987). The gap band must be free of current.
/// Returns the whole machine's torque: a sector model (m.symmetry) multiplies its band by its copies.
/// a_nodes: #nodes nodal A_z [Wb/m].
double arkkio_torque_static(const mesh::Mesh& m, const Eigen::VectorXd& a_nodes, double stack_length);

/// Maxwell stress on the sliding circle of radius r: T = L r^2 / mu0 * integral_0^{2 pi} B_r B_theta dtheta,
/// by the rectangle rule on the M equally spaced samples of g (exact for trigonometric products
/// of order below M).
/// Accuracy: g.br is the normal component of each chord, (a_{i+1} - a_i)/chord, exact for the
/// discrete field; g.bt is the mean of the tangential components of the two first-order triangles
/// that share the chord, i.e. -dA/dr by a difference across the circle, one element thick on each
/// side. That difference is centred only when both elements are equally thick, and it carries the
/// local O(h) error of the element gradients which the band average of Arkkio's method smooths out.
/// Use it as a cross-check; tests/post/test_torque.cpp measures the difference.
/// a_nodes: #nodes nodal A_z [Wb/m]; g from gap_operators(m, M, ...).
double circle_torque(const GapOperators& g, const Eigen::VectorXd& a_nodes, double stack_length);

/// Local virtual work (J. L. Coulomb, "A methodology for the determination of global
/// electromechanical quantities from a finite element analysis and its application to the
/// evaluation of magnetic forces, torques and stiffness", IEEE Trans. Magn. 19(6), 1983, from
/// memory): T = dW'/dtheta at constant currents = -dPi/dtheta at the solution's nodal A held, Pi the
/// energy functional (the solution makes Pi stationary, so the change of A does not enter). The
/// virtual rotation turns every rotor-side node off the sliding circle by dtheta and holds the
/// circle's nodes, so only the rotor-side gap triangles touching the circle deform; they are air
/// without current, and T = -L sum over them of d/dtheta (nu0/2 |B|^2 area) (solver::p1_energy_rate).
/// Exact for the discrete field, like the co-energy difference, but with no extra solve, and the
/// same for saturated iron (which does not deform). Whole machine (a sector's layer times its copies).
/// a_nodes: #nodes nodal A_z [Wb/m], rotor nodes in the rotor's frame. Throws std::logic_error when a
/// triangle touching the circle from the rotor side is not gap air (the mesh builder always puts one).
double local_virtual_work_torque(const mesh::Mesh& m, const Eigen::VectorXd& a_nodes, double stack_length);

/// Virtual work: T = dW'/dtheta at constant currents, by the central difference
///   (W'(theta + angle_step) - W'(theta - angle_step)) / (2 angle_step),
/// with W' the magnetic co-energy [J] at rotor angles theta -/+ angle_step [rad, counter-clockwise].
/// The currents (their amplitudes and their positions relative to what carries them: a rotor
/// current turns with the rotor, a stator current stays) must be the same in both solves; at
/// constant flux linkage the sign would flip (T = -dW/dtheta). Error O(angle_step^2).
double virtual_work_torque(double coenergy_minus, double coenergy_plus, double angle_step);

/// Co-energy [J] of a linear magnetostatic field driven by given currents: W' = W = 1/2 a^T K a
/// = 1/2 f . a (K a = f), times the stack length. f, a: #dofs load [A] and solution [Wb/m].
/// copies: mesh::Symmetry::copies of the model the unknowns belong to, so that the result is the
/// whole machine's (1 for the full model).
double linear_coenergy(const Eigen::VectorXd& load, const Eigen::VectorXd& solution, double stack_length,
                       int copies = 1);

}  // namespace tf::post
