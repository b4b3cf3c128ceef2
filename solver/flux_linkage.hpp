#pragma once
// Flux linkage of the phase windings from the coil-side integrals of A, and the inductance matrix
// of the 2D field (the slot and gap parts; end windings are not in a 2D model).

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/phase_fields.hpp"

namespace tf::solver {

/// Flux linkage [Wb] of each phase for nodal potentials a (#nodes by #columns):
/// psi_k = (L_stack / a) Σ_sides s N Ā_side, with Ā the mean of A over the coil side; a is the
/// number of parallel paths. Returns #phases by #columns, for the whole machine: a sector model
/// (m.symmetry) sums the sides in its slots and multiplies by its copies.
Eigen::MatrixXd flux_linkage(const mesh::Mesh& m, const mesh::Winding& w, const Eigen::MatrixXd& a,
                             double stack_length);

/// Inductance matrix [H], #phases by #phases: L_ij = psi_i for 1 A in phase j alone (symmetric
/// by reciprocity; the tests check it).
Eigen::MatrixXd inductance_matrix(const mesh::Mesh& m, const mesh::Winding& w, const PhaseFields& f,
                                  double stack_length);

}  // namespace tf::solver
