#pragma once
// A linear magnetostatic study of many current phase angles costs one factorization: the field
// of any set of phase currents is the superposition of the m fields of 1 A in each phase alone.

#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/materials.hpp"

namespace tf::solver {

struct SolveStats {
  int n_dofs = 0;
  long long n_nonzeros = 0;  ///< of the stiffness matrix
  double assemble_seconds = 0.0;
  double analyse_seconds = 0.0;
  double factorize_seconds = 0.0;
  double solve_seconds = 0.0;
};

struct PhaseFields {
  Eigen::MatrixXd potential;  ///< #nodes by #phases: A_z [Wb/m] for 1 A terminal current in one phase
  SolveStats stats;
};

/// Assembles, factorizes once and back-substitutes all phases as one block. Throws SolveError.
PhaseFields solve_phase_fields(const mesh::Mesh& m, const mesh::Winding& w, const Materials& materials);

/// Nodal A_z [Wb/m] for the given phase currents [A]: the superposition potential * currents.
Eigen::VectorXd superpose(const PhaseFields& f, const std::vector<double>& currents);

}  // namespace tf::solver
