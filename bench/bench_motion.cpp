// Benchmark (not a test): a nonlinear rotor-position study of the demo stator with a surface-magnet
// rotor and saturating iron: Newton iterations per step, time per step, and the share of the
// symbolic analysis in the solve time (the fill-reducing ordering is computed once; each new
// rotor position redoes only the symbolic factorization).
//
// Sample run:  build/bench/bench_motion [CASE] [POSITIONS]
//              (default cases/pump24_magnets_synchronous.toml, 90 positions)

#include <chrono>
#include <string>

#include <fmt/format.h>

#include "input/case_reader.hpp"
#include "study/motion_plan.hpp"
#include "study/mesh_plan.hpp"
#include "solver/assemble.hpp"
#include "solver/coefficients.hpp"
#include "solver/dofs.hpp"
#include "solver/motion.hpp"
#include "solver/spd_solver.hpp"

namespace {

using Clock = std::chrono::steady_clock;
double since(Clock::time_point t) { return std::chrono::duration<double>(Clock::now() - t).count(); }

}  // namespace

int main(int argc, char** argv) {
  using namespace tf;
  const std::string path = argc > 1 ? argv[1] : "cases/pump24_magnets_synchronous.toml";
  input::Case c = input::read_case(path);
  c.study.n_steps = argc > 2 ? std::stoi(argv[2]) : 90;
  auto t = Clock::now();
  const auto [m, w] = study::mesh_and_wind(c);
  const double mesh_seconds = since(t);
  const study::MotionSchedule plan = study::plan_motion(c, m, w);
  {  // One linear system of this mesh: the size of its factor and the cost of one factorization.
    const solver::DofMap d = solver::number_dofs(m, 0);
    const auto K = solver::assemble_stiffness(m, d, solver::region_coefficients(m, c.materials).nu);
    solver::SpdSolver s;
    auto t0 = Clock::now();
    s.analyse(K);
    const double analyse = since(t0);
    t0 = Clock::now();
    s.factorize(K);
    fmt::print("one system: {} unknowns, {} nonzeros, factor {:.3g} nonzeros; analyse {:.3f} s, factorize {:.3f} s\n",
               d.n_dofs, K.nonZeros(), s.factor_nonzeros(), analyse, since(t0));
  }
  solver::MotionSolver solver(m, w, c.materials, solver::magnet_layout(c.geometry.rotor));
  t = Clock::now();
  for (std::size_t k = 0; k < plan.shift.size(); ++k) solver.solve(plan.shift[k], plan.currents[k]);
  const double wall = since(t);
  const solver::MotionStats& s = solver.stats();
  fmt::print("{}: {} positions, {} unknowns, mesh {:.2f} s\n", path, plan.shift.size(), s.n_dofs, mesh_seconds);
  fmt::print("Newton iterations per position {:.2f}\n", static_cast<double>(s.n_iterations) / s.n_solves);
  fmt::print("time per position {:.4f} s, in all {:.2f} s\n", wall / s.n_solves, wall);
  fmt::print("new numbering, pattern and symbolic analysis per position: {:.3f} s in all = {:.2f} % of the solve time\n",
             s.analyse_seconds, 100 * s.analyse_seconds / wall);
  return 0;
}
