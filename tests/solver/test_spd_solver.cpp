// CHOLMOD wrapper: a new sparsity pattern analysed with the ordering of an earlier analysis.

#include <doctest/doctest.h>

#include <algorithm>

#include "solver/assemble.hpp"
#include "solver/dofs.hpp"
#include "solver/errors.hpp"
#include "solver/spd_solver.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;

TEST_CASE("SpdSolver: reanalyse_same_ordering on a reconnected sliding circle solves like a full analysis") {
  const mesh::Mesh m = testing::polar_mesh(0.0, {{0.01, 5, mesh::RegionKind::rotor_iron, "rotor"},
                                                 {0.012, 2, mesh::RegionKind::gap, "gap rotor side"},
                                                 {0.014, 2, mesh::RegionKind::gap, "gap stator side"},
                                                 {0.03, 6, mesh::RegionKind::stator_iron, "stator"}}, 64, 1);
  const std::vector<double> nu{1.0 / 300, 1.0, 1.0, 1.0 / 1000};  // scaled reluctivities; SPD all the same
  const auto K0 = solver::assemble_stiffness(m, solver::number_dofs(m, 0), nu);
  const auto K7 = solver::assemble_stiffness(m, solver::number_dofs(m, 7), nu);
  REQUIRE(K0.rows() == K7.rows());
  // The patterns differ (otherwise the check below proves nothing).
  auto pattern = [](Eigen::SparseMatrix<double> k) {
    std::fill(k.valuePtr(), k.valuePtr() + k.nonZeros(), 1.0);
    return k;
  };
  CHECK((pattern(K0) - pattern(K7)).norm() > 0);

  const Eigen::MatrixXd f = Eigen::MatrixXd::Random(K0.rows(), 3);
  solver::SpdSolver reused;
  reused.analyse(K0);
  reused.factorize(K0);
  CHECK((K0 * reused.solve(f) - f).norm() <= 1e-10 * f.norm());
  reused.reanalyse_same_ordering(K7);
  reused.factorize(K7);
  const Eigen::MatrixXd x = reused.solve(f);
  solver::SpdSolver full;
  full.analyse(K7);
  full.factorize(K7);
  CHECK((x - full.solve(f)).norm() <= 1e-10 * x.norm());
  CHECK((K7 * x - f).norm() <= 1e-10 * f.norm());
}

TEST_CASE("SpdSolver: a floating part (no A = 0 anywhere) is reported, not solved") {
  Eigen::SparseMatrix<double> K(2, 2);  // the stiffness of a free bar: singular
  K.insert(0, 0) = 1, K.insert(0, 1) = -1, K.insert(1, 0) = -1, K.insert(1, 1) = 1;
  K.makeCompressed();
  solver::SpdSolver s;
  s.analyse(K);
  CHECK_THROWS_AS(s.factorize(K), solver::SolveError);
}
