#pragma once
// Magnetostatic fields with the rotor turned: the rotor's mesh never moves; a turn by k pitches of
// the sliding circle reconnects rotor-side node i to stator-side node i + k.
// Every position has its own sparsity pattern but the same unknowns, so the fill-reducing ordering
// of the first position serves them all; only the cheap symbolic step is redone per position.

#include <memory>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/magnets.hpp"
#include "solver/materials.hpp"
#include "solver/nonlinear.hpp"

namespace tf::solver {

/// Angle [rad] of one pitch of the sliding circle.
double sliding_pitch(const mesh::Mesh& m);

/// The whole number of sliding pitches nearest to a mechanical angle [rad], counter-clockwise.
int rotor_shift(const mesh::Mesh& m, double angle);

/// One solved rotor position.
struct PositionField {
  int shift = 0;             ///< sliding pitches the rotor is turned by
  Eigen::VectorXd a;         ///< nodal A_z [Wb/m], #nodes; rotor nodes in the rotor's own frame
  NewtonReport newton;       ///< iterations and residual (1 iteration when every material is linear)
  double relative_residual = 0.0;  ///< ||K(a) a - f|| / ||f|| at the solution
  double coenergy = 0.0;     ///< magnetic co-energy per metre [J/m] (stationary form), up to a constant of the magnets
};

/// Timings of a sequence of positions [s].
struct MotionStats {
  int n_dofs = 0;
  int n_solves = 0;
  int n_iterations = 0;   ///< Newton iterations summed over the solves
  int max_iterations = 0; ///< the most Newton iterations one solve took
  int n_factorizations = 0;  ///< numerical factorizations of every kind (the first included)
  int n_analyses = 0;     ///< symbolic analyses (the first included); a position seen lately needs none
  /// Set-up with the first analysis, and at every new rotor position the new numbering, the new
  /// sparsity pattern and its symbolic analysis (all of what a turn costs before factorizing).
  double analyse_seconds = 0.0;
  double solve_seconds = 0.0;    ///< everything else of the solves: assembly, factorizations, back-substitution
};

class MotionSolver {
 public:
  /// The materials (with B-H curves where given) and sources of a case. The winding supplies the
  /// coil sides; magnets (layout.n_poles > 0) add their fixed source in the rotor's frame.
  MotionSolver(const mesh::Mesh& m, const mesh::Winding& w, const Materials& materials, const MagnetLayout& layout,
               NewtonControls controls = {});
  ~MotionSolver();
  MotionSolver(const MotionSolver&) = delete;
  MotionSolver& operator=(const MotionSolver&) = delete;

  /// The field at rotor shift `shift` for the phase currents [A]. Newton starts from the last
  /// solution's nodal potentials in the new numbering (warm_start, after the first solve; the rotor's
  /// part stays in the rotor's frame, so it turns with the rotor) or from A = 0.
  /// Throws SolveError when Newton does not converge.
  /// watch: what the study reports of a field, from its nodal A (#nodes), for Newton's stop
  /// (solver::QuantityWatch); none: the residual criterion alone.
  PositionField solve(int shift, const std::vector<double>& currents, bool warm_start = true,
                      const QuantityWatch& watch = {});

  /// Co-energy per metre [J/m] at rotor shift `shift` for the phase currents: a quick solve from
  /// the last solution (for virtual work at the neighbouring positions).
  double coenergy(int shift, const std::vector<double>& currents);

  /// Flux linkages of 1 A in each phase through the linearised field at the last solution:
  /// nodal A, #nodes by #phases, with the frozen (secant) permeability, or the incremental
  /// (differential) one of the Jacobian. Equal for linear materials. Call them after solve() and
  /// before coenergy() (which turns the rotor without solving); otherwise std::logic_error.
  Eigen::MatrixXd frozen_unit_fields();
  Eigen::MatrixXd incremental_unit_fields();

  MotionStats stats() const;

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace tf::solver
