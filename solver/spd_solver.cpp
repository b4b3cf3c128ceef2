#include "solver/spd_solver.hpp"

#include <Eigen/CholmodSupport>

#include "solver/errors.hpp"

namespace tf::solver {

struct SpdSolver::Impl {
  Eigen::CholmodSupernodalLLT<Eigen::SparseMatrix<double>> llt;
};

SpdSolver::SpdSolver() : impl_(std::make_unique<Impl>()) {}
SpdSolver::~SpdSolver() = default;

void SpdSolver::analyse(const Eigen::SparseMatrix<double>& K) { impl_->llt.analyzePattern(K); }

void SpdSolver::factorize(const Eigen::SparseMatrix<double>& K) {
  impl_->llt.factorize(K);
  if (impl_->llt.info() != Eigen::Success)
    throw SolveError(
        "the stiffness matrix could not be factorized (not positive definite); usual causes: a region "
        "that touches no node with A = 0 (a floating part of the model), or a zero or negative permeability");
}

Eigen::MatrixXd SpdSolver::solve(const Eigen::MatrixXd& f) const {
  Eigen::MatrixXd x = impl_->llt.solve(f);
  if (impl_->llt.info() != Eigen::Success) throw SolveError("CHOLMOD back-substitution failed");
  return x;
}

}  // namespace tf::solver
