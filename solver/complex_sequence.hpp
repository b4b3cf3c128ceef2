#pragma once
// A sequence of complex, non-symmetric systems of one sparsity pattern (speeds, slips): UMFPACK
// analyses the pattern for the first and factorizes each. Internal to solver/.

#include <cassert>
#include <complex>
#include <string>

#include <Eigen/Core>
#include <Eigen/SparseCore>
#include <Eigen/UmfPackSupport>

#include "solver/dofs.hpp"
#include "solver/time_harmonic.hpp"
#include "solver/errors.hpp"
#include "solver/stopwatch.hpp"

namespace tf::solver {

class ComplexSequence {
 public:
  using Matrix = Eigen::SparseMatrix<std::complex<double>>;

  /// what: the system's name for the error message ("the time-harmonic system").
  explicit ComplexSequence(std::string what) : what_(std::move(what)) {}

  /// Solves system x = load (#dofs); the times of each part go into stats. Throws SolveError.
  Eigen::VectorXcd solve(const Matrix& system, const Eigen::VectorXcd& load, TimeHarmonicStats& stats) {
    Stopwatch clock;
    if (!analysed_) {
      lu_.analyzePattern(system);
      analysed_ = true;
      stats.analyse_seconds += clock.lap();
    }
    lu_.factorize(system);
    stats.factorize_seconds += clock.lap();
    if (lu_.info() != Eigen::Success)
      throw SolveError(what_ + " could not be factorized (UMFPACK); usual causes: a region with no fixed potential, "
                               "or a zero permeability");
    Eigen::VectorXcd x = lu_.solve(load);
    stats.solve_seconds += clock.lap();
    return x;
  }

 private:
  std::string what_;
  Eigen::UmfPackLU<Matrix> lu_;
  bool analysed_ = false;
};

/// Nodal values (#nodes) of a complex solution in unknowns; A = 0 at fixed nodes.
inline Eigen::VectorXcd complex_to_nodes(const DofMap& d, const Eigen::VectorXcd& x, int n_nodes) {
  assert(static_cast<int>(d.dof_of_node.size()) == n_nodes);
  Eigen::VectorXcd a = Eigen::VectorXcd::Zero(n_nodes);
  for (std::size_t node = 0; node < d.dof_of_node.size(); ++node)
    if (d.dof_of_node[node] >= 0) a(static_cast<Eigen::Index>(node)) = x(d.dof_of_node[node]);
  return a;
}

}  // namespace tf::solver
