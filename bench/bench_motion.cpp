// Benchmark (not a test): a nonlinear rotor-position study of the demo stator with a surface-magnet
// rotor and saturating iron: Newton iterations per step, time per step, symbolic analyses per step
// and their share in the solve time (the fill-reducing ordering is computed once; each new rotor
// position redoes only the symbolic factorization), for the field alone and as the study solves it
// (with the co-energies a pitch either side for the virtual-work torque).
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

/// Solves every position of the plan, and with `virtual_work` the co-energy a pitch either side as
/// the study does for the virtual-work torque; prints what it cost.
void run_positions(const tf::input::Case& c, const tf::mesh::Mesh& m, const tf::mesh::Winding& w,
                   const tf::study::MotionSchedule& plan, bool virtual_work) {
  using namespace tf;
  solver::MotionSolver solver(m, w, c.materials, solver::magnet_layout(c.geometry.rotor));
  const auto t = Clock::now();
  for (std::size_t k = 0; k < plan.shift.size(); ++k) {
    solver.solve(plan.shift[k], plan.currents[k]);
    if (!virtual_work) continue;
    solver.coenergy(plan.shift[k] + 1, plan.currents[k]);
    solver.coenergy(plan.shift[k] - 1, plan.currents[k]);
  }
  const double wall = since(t);
  const solver::MotionStats& s = solver.stats();
  fmt::print("{}: {} unknowns\n", virtual_work ? "field and virtual-work co-energies (as the study)" : "field only",
             s.n_dofs);
  fmt::print("  Newton iterations per position {:.2f}\n", static_cast<double>(s.n_iterations) / s.n_solves);
  fmt::print("  time per position {:.4f} s, in all {:.2f} s\n", wall / s.n_solves, wall);
  fmt::print("  symbolic analyses per position {:.2f} ({} in all, the first included)\n",
             static_cast<double>(s.n_analyses) / s.n_solves, s.n_analyses);
  fmt::print("  new numbering, pattern and symbolic analysis: {:.3f} s in all = {:.2f} % of the solve time\n",
             s.analyse_seconds, 100 * s.analyse_seconds / wall);
}

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
  fmt::print("{}: {} positions, mesh {:.2f} s\n", path, plan.shift.size(), mesh_seconds);
  run_positions(c, m, w, plan, false);
  run_positions(c, m, w, plan, true);
  return 0;
}
