#include "solver/phase_fields.hpp"

#include <chrono>

#include "solver/assemble.hpp"
#include "solver/coefficients.hpp"
#include "solver/dofs.hpp"
#include "solver/spd_solver.hpp"

namespace tf::solver {
namespace {

double seconds_since(std::chrono::steady_clock::time_point start) {
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
}

}  // namespace

PhaseFields solve_phase_fields(const mesh::Mesh& m, const mesh::Winding& w, const Materials& materials) {
  PhaseFields out;
  auto t0 = std::chrono::steady_clock::now();
  const DofMap dofs = number_dofs(m);
  const Eigen::SparseMatrix<double> K = assemble_stiffness(m, dofs, region_coefficients(m, materials).nu);
  const Eigen::MatrixXd f = phase_loads(m, dofs, w);
  out.stats.assemble_seconds = seconds_since(t0);
  out.stats.n_dofs = dofs.n_dofs;
  out.stats.n_nonzeros = K.nonZeros();

  SpdSolver solver;
  t0 = std::chrono::steady_clock::now();
  solver.analyse(K);
  out.stats.analyse_seconds = seconds_since(t0);
  t0 = std::chrono::steady_clock::now();
  solver.factorize(K);
  out.stats.factorize_seconds = seconds_since(t0);
  t0 = std::chrono::steady_clock::now();
  out.potential = to_nodes(dofs, solver.solve(f));
  out.stats.solve_seconds = seconds_since(t0);
  return out;
}

Eigen::VectorXd superpose(const PhaseFields& f, const std::vector<double>& currents) {
  return f.potential * Eigen::Map<const Eigen::VectorXd>(currents.data(), static_cast<Eigen::Index>(currents.size()));
}

}  // namespace tf::solver
