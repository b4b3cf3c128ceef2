#include "solver/phase_fields.hpp"

#include "solver/assemble.hpp"
#include "solver/coefficients.hpp"
#include "solver/dofs.hpp"
#include "solver/spd_solver.hpp"
#include "solver/stopwatch.hpp"

namespace tf::solver {

PhaseFields solve_phase_fields(const mesh::Mesh& m, const mesh::Winding& w, const Materials& materials) {
  PhaseFields out;
  Stopwatch clock;
  const DofMap dofs = number_dofs(m);
  const Eigen::SparseMatrix<double> K = assemble_stiffness(m, dofs, region_coefficients(m, materials).nu);
  const Eigen::MatrixXd f = phase_loads(m, dofs, w);
  out.stats.assemble_seconds = clock.lap();
  out.stats.n_dofs = dofs.n_dofs;
  out.stats.n_nonzeros = K.nonZeros();

  SpdSolver solver;
  solver.analyse(K);
  out.stats.analyse_seconds = clock.lap();
  solver.factorize(K);
  out.stats.factorize_seconds = clock.lap();
  out.potential = to_nodes(dofs, solver.solve(f));
  out.stats.solve_seconds = clock.lap();
  return out;
}

Eigen::VectorXd superpose(const PhaseFields& f, const std::vector<double>& currents) {
  return f.potential * Eigen::Map<const Eigen::VectorXd>(currents.data(), static_cast<Eigen::Index>(currents.size()));
}

}  // namespace tf::solver
