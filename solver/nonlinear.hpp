#pragma once
// Nonlinear magnetostatics K(a) a = f on first-order triangles: reluctivity nu(B^2) per triangle
// from a B-H curve in iron, constant elsewhere, solved by Newton-Raphson with the consistent
// (symmetric) Jacobian and a line search on the energy functional.
//
// Shapes and units: a and f are #dofs vectors (A_z [Wb/m], loads [A]) in the numbering of the
// DofMap given last; A = 0 at fixed nodes. B^2 [T^2], co-energy per metre of length [J/m].
// Sector models (mesh::Symmetry): elements honour DofMap::sign_of_node, and energy, coenergy and
// coenergy_stationary return the whole machine's value (copies times the sector's).

#include <functional>
#include <optional>
#include <vector>

#include <Eigen/Core>
#include <Eigen/SparseCore>

#include "mesh/mesh.hpp"
#include "solver/bh_curve.hpp"
#include "solver/coefficients.hpp"
#include "solver/dofs.hpp"
#include "solver/spd_solver.hpp"

namespace tf::solver {

/// The material of one region: a constant reluctivity nu [m/H], or a B-H curve (wins when set;
/// not owned: it must outlive the solver).
struct RegionLaw {
  double nu = 0.0;
  const BhCurve* curve = nullptr;
};

/// The law of each region (indexed like m.regions): c.nu, and c.curve where one is set. The laws
/// point into c, which must outlive them.
std::vector<RegionLaw> region_laws(const RegionCoefficients& c);

struct NewtonControls {
  /// Relative, on both the residual (to ||f||) and the update (to ||a||). Measured on the bundled
  /// saturated demos: 1e-5 instead of 1e-6 spares 6 to 15 % of the Newton iterations and moves the
  /// mean torques, flux linkages and iron losses by less than 6e-7 of their values.
  double tolerance = 1e-5;
  int max_iterations = 40;
  /// With a QuantityWatch: stop once every watched value moved by at most this over the last step
  /// (its error then is about a third of that or less, Newton converging at least linearly) and the
  /// relative residual is within residual_guard.
  double quantity_tolerance = 1e-4;
  double residual_guard = 1e-3;
};

/// What an iterate reports, each value divided by its scale (e.g. flux linkages by the largest,
/// a torque by the torques seen so far); a, the iterate's unknowns. Newton may stop once no value
/// moved by more than NewtonControls::quantity_tolerance over a step (see NonlinearSolver::solve).
using QuantityWatch = std::function<Eigen::VectorXd(const Eigen::VectorXd& a)>;

struct NewtonReport {
  int iterations = 0;      ///< Newton steps taken (1 for a linear problem: one factorization, one solve)
  double residual = 0.0;   ///< ||K(a) a - f|| at the returned a
  double update = 0.0;     ///< ||a_k - a_k-1|| of the last step
  bool converged = false;
  std::vector<double> residuals;  ///< ||K(a) a - f||: [0] at the start, [k] after step k
  std::vector<double> step_lengths;  ///< line-search factor of each step (1 = full Newton step)
};

class NonlinearSolver {
 public:
  /// laws: indexed like m.regions, every nu > 0. The mesh must outlive the solver.
  NonlinearSolver(const mesh::Mesh& m, const DofMap& d, std::vector<RegionLaw> laws, NewtonControls controls = {});
  ~NonlinearSolver();
  NonlinearSolver(const NonlinearSolver&) = delete;
  NonlinearSolver& operator=(const NonlinearSolver&) = delete;

  /// A new numbering (e.g. the rotor turned). Same number of unknowns: the symbolic factorization
  /// is redone with the fill-reducing ordering of the last full analysis, unless that ordering
  /// fills the new pattern's factor by more than 10 % more, in which case (and when the number of
  /// unknowns changed) a full analysis searches a new ordering; after such a failure the next 15
  /// numberings go straight to a full analysis. Forgets the last solution.
  void set_dofs(const DofMap& d);

  /// Symbolic analyses done so far (one per numbering set).
  int analyses() const { return n_analyses_; }
  /// Numerical factorizations done so far (Newton steps, predictions, linearised solves).
  int factorizations() const { return cholesky_.factorizations(); }

  /// Solves K(a) a = f. a: in, the start (warm start from a previous step); out, the last iterate.
  /// f = 0 gives a = 0 at once. A run that does not converge returns converged = false and
  /// leaves the last iterate in a; the caller turns that into an error naming the step.
  /// Throws SolveError when a matrix cannot be factorized.
  /// With `watch`, Newton also stops on the quantities it reports (NewtonControls::quantity_tolerance).
  NewtonReport solve(const Eigen::VectorXd& f, Eigen::VectorXd& a, const QuantityWatch& watch = {});

  /// A starting point for solve() after the sources or the numbering changed (the rotor turned):
  /// the linear solution with every triangle's secant reluctivity frozen at the last solution
  /// (one factorization); for a linear problem the solution itself. Zero before the first solve of a
  /// nonlinear problem.
  Eigen::VectorXd predict(const Eigen::VectorXd& f);

  /// B^2 [T^2] of every triangle for the potentials a (#dofs), indexed like m.triangles.
  std::vector<double> triangle_b_squared(const Eigen::VectorXd& a) const;

  /// Solves J x = rhs (#dofs by #columns) with the consistent Jacobian J = dK(a)a/da at the last
  /// solution: the small-signal (incremental) response, e.g. incremental inductances. After a
  /// converged Newton run it reuses the factor of the last Newton step (the Jacobian at the start of
  /// that step, within the Newton tolerance of the solution) instead of factorizing again.
  Eigen::MatrixXd solve_incremental(const Eigen::MatrixXd& rhs);
  /// Solves K(nu) x = rhs with the secant reluctivity nu = H/B of every triangle frozen at the
  /// last solution (frozen permeability), e.g. to split flux linkage between sources.
  Eigen::MatrixXd solve_frozen(const Eigen::MatrixXd& rhs);

  /// Energy per metre of the whole machine, sum over triangles of area * w(B) [J/m] (times the
  /// copies of a sector model); a linear region contributes nu B^2 / 2.
  double energy(const Eigen::VectorXd& a) const;

  /// Co-energy per metre of the whole machine [J/m] as minus the energy functional, copies * f . a -
  /// energy(a) (f, a of the model, copies = 1 for the full model): equal to
  /// coenergy(a) at the solution, and stationary there (the solution minimises the functional), so
  /// an iterate near it gives the co-energy with an error of the order of the squared field error.
  double coenergy_stationary(const Eigen::VectorXd& f, const Eigen::VectorXd& a) const;

  /// Co-energy per metre of the whole machine, sum over triangles of area * (B H - w(B)) [J/m]
  /// (times the copies of a sector model); a linear region contributes nu B^2 / 2 (equal to its energy).
  double coenergy(const Eigen::VectorXd& a) const;

 private:
  enum class Matrix { jacobian, secant };
  enum class Density { energy, coenergy };
  /// Sum over triangles of area times the energy or co-energy density, for the whole machine.
  double integrate(const Eigen::VectorXd& a, Density kind) const;
  Eigen::VectorXd residual(const Eigen::VectorXd& a, const Eigen::VectorXd& f) const;
  void assemble(const Eigen::VectorXd& a, Matrix kind);
  double line_search(const Eigen::VectorXd& a, const Eigen::VectorXd& f, const Eigen::VectorXd& step,
                     const Eigen::VectorXd& r0, Eigen::VectorXd& r) const;
  Eigen::MatrixXd solve_with(Matrix kind, const Eigen::MatrixXd& rhs);

  struct Element;
  const mesh::Mesh& mesh_;
  std::vector<RegionLaw> laws_;
  NewtonControls controls_;
  std::vector<Element> elements_;
  int n_dofs_ = 0;
  Eigen::SparseMatrix<double> matrix_;  ///< fixed pattern; values overwritten by assemble()
  SpdSolver cholesky_;
  double analysed_fill_ = 0.0;  ///< nonzeros of L with the ordering of the last full analysis
  int n_analyses_ = 0;
  int turns_since_failed_reuse_ = 16;  ///< numberings since the old ordering last failed (16: try it)
  bool linear_ = true;
  Eigen::VectorXd last_solution_;
  std::vector<double> last_b_squared_;  ///< per triangle at the last solution; kept across set_dofs
  std::optional<Matrix> factorized_;  ///< what the Cholesky factor holds, at last_solution_
};

}  // namespace tf::solver
