// Benchmark (not a test): saturated studies solved one step at a time, as `turnfield run` solves
// them (the field, the torques, the linearised fields, the post-processing of each step), against
// the cost of one CHOLMOD factorization of the same mesh. Per study it prints the unknowns, the
// steps, the Newton iterations (mean and most), the factorizations and symbolic analyses per step,
// the time per step and that time in factorizations' worth.
//
// Sample run:  build/bench/bench_motion [CASE [STEPS]] ...
//              (default: the synchronous magnet demo, 90 steps; the saturated phase-angle demo, 36
//              steps; the cogging demo, 240 steps; the synchronous demo again without its iron-loss
//              estimate, where Newton stops on the flux linkages and torque; all from cases/)

#include <cctype>
#include <chrono>
#include <optional>
#include <sstream>
#include <string>
#include <vector>

#include <fmt/format.h>

#include "input/case_reader.hpp"
#include "solver/assemble.hpp"
#include "solver/coefficients.hpp"
#include "solver/dofs.hpp"
#include "solver/spd_solver.hpp"
#include "study/mesh_plan.hpp"
#include "study/solved.hpp"

namespace {

using Clock = std::chrono::steady_clock;
double since(Clock::time_point t) { return std::chrono::duration<double>(Clock::now() - t).count(); }

struct Study {
  std::string path;
  int steps;
  bool without_iron_loss = false;  ///< drop the iron-loss estimate: Newton may then stop on flux and torque
};

/// The fastest of three factorizations of the mesh's linear stiffness matrix [s].
double one_factorization(const tf::input::Case& c, const tf::mesh::Mesh& m) {
  using namespace tf;
  const solver::DofMap d = solver::number_dofs(m, 0);
  const auto K = solver::assemble_stiffness(m, d, solver::region_coefficients(m, c.materials).nu);
  solver::SpdSolver s;
  s.analyse(K);
  double best = 1e30;
  for (int i = 0; i < 3; ++i) {
    const auto t = Clock::now();
    s.factorize(K);
    best = std::min(best, since(t));
  }
  return best;
}

void run(const Study& study) {
  using namespace tf;
  input::Case c = input::read_case(study.path);
  c.study.n_steps = study.steps;
  c.study.n_field_files = 0;
  if (study.without_iron_loss) {
    c.materials.stator_iron_loss.reset();
    c.materials.rotor_iron_loss.reset();
  }
  const study::MeshedCase mc = study::mesh_and_wind(c);
  const double factorization = one_factorization(c, mc.mesh);
  study::RunOptions options;
  study::Progress progress;
  const auto t = Clock::now();
  const study::Solved s = study::solve_step_by_step({c, mc.mesh, mc.winding, options, progress});
  const double wall = since(t);
  const post::SolverSummary& x = s.solver;
  const double n = study.steps;
  fmt::print("{} ({} steps{})\n", study.path, study.steps, study.without_iron_loss ? ", no iron-loss estimate" : "");
  fmt::print("  unknowns {}, one factorization {:.4f} s\n", x.n_unknowns, factorization);
  fmt::print("  Newton iterations per solve {:.2f} (most {}), solves {}\n", x.newton_iterations_per_solve,
             x.newton_iterations_max, x.n_solves);
  fmt::print("  factorizations per step {:.2f}, symbolic analyses per step {:.2f}\n", x.n_factorizations / n,
             x.n_analyses / n);
  fmt::print("  time per step {:.4f} s = {:.2f} factorizations' worth; the study's solve {:.2f} s\n", wall / n,
             wall / n / factorization, wall);
}

}  // namespace

int main(int argc, char** argv) {
  std::vector<Study> studies;
  for (int i = 1; i < argc; ++i) {
    const bool has_steps = i + 1 < argc && std::isdigit(static_cast<unsigned char>(argv[i + 1][0]));
    studies.push_back({argv[i], has_steps ? std::stoi(argv[i + 1]) : 0});
    if (has_steps) ++i;
  }
  if (studies.empty())
    studies = {{"cases/pump24_magnets_synchronous.toml", 90},
               {"cases/pump24_three_phase_saturated.toml", 36},
               {"cases/pump24_magnets_cogging.toml", 240},
               {"cases/pump24_magnets_synchronous.toml", 90, true}};
  for (Study& s : studies) {
    if (s.steps == 0) s.steps = tf::input::read_case(s.path).study.n_steps;
    run(s);
  }
  return 0;
}
