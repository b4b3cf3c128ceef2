#pragma once
// Sparse symmetric positive definite solves with CHOLMOD (supernodal Cholesky).
// Analyse once per sparsity pattern, factorize when values change, then solve many
// right-hand sides at once.

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

  /// Symbolic analysis (fill-reducing ordering); reusable for any matrix of the same pattern.
  void analyse(const Eigen::SparseMatrix<double>& K);
  /// Numerical factorization. Throws SolveError when K is not positive definite.
  void factorize(const Eigen::SparseMatrix<double>& K);
  /// Solves K x = f for every column of f.
  Eigen::MatrixXd solve(const Eigen::MatrixXd& f) const;

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace tf::solver
