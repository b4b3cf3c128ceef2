#pragma once
// Sparse symmetric positive definite solves with CHOLMOD (supernodal Cholesky).
// Analyse once per sparsity pattern, factorize when values change, then solve many
// right-hand sides at once. When the pattern changes a little but the unknowns stay the
// same (the rotor turned: the sliding-circle nodes reconnect), the fill-reducing ordering of
// the first analysis can be kept and only the symbolic factorization redone.

#include <memory>

#include <Eigen/Core>
#include <Eigen/SparseCore>

namespace tf::solver {

class SpdSolver {
 public:
  SpdSolver();
  ~SpdSolver();
  SpdSolver(const SpdSolver&) = delete;
  SpdSolver& operator=(const SpdSolver&) = delete;

  /// Symbolic analysis: chooses a fill-reducing ordering (CHOLMOD's default choice between AMD
  /// and METIS) and remembers it. Reusable for any matrix of the same pattern. K: n by n,
  /// symmetric; only its lower triangle is read.
  void analyse(const Eigen::SparseMatrix<double>& K);
  /// Symbolic analysis of a new pattern with the ordering remembered by the last analyse()
  /// (no ordering search). Precondition: analyse() was called on a matrix of the same size.
  void reanalyse_same_ordering(const Eigen::SparseMatrix<double>& K);
  /// Numerical factorization. Throws SolveError when K is not positive definite.
  void factorize(const Eigen::SparseMatrix<double>& K);
  /// Nonzeros of the Cholesky factor L that the last analysis predicts (the fill of its ordering).
  double factor_nonzeros() const;
  /// Solves K x = f for every column of f (n by #columns).
  Eigen::MatrixXd solve(const Eigen::MatrixXd& f) const;
  /// Numerical factorizations done so far (what a study's cost is counted in).
  int factorizations() const { return n_factorizations_; }

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
  int n_factorizations_ = 0;
};

}  // namespace tf::solver
