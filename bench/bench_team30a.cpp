// Benchmark (not a test): the seven-speed TEAM 30a eddy-current study at several mesh finenesses:
// unknowns, worst torque error against the published values, time per speed, wall time including
// meshing, and the share of the symbolic analysis.
//
// Sample run:  build/bench/bench_team30a [CASE]      (default cases/team30a_three_phase.toml)

#include <algorithm>
#include <chrono>
#include <cmath>
#include <numbers>
#include <string>
#include <vector>

#include <fmt/format.h>

#include "input/case_reader.hpp"
#include "study/mesh_plan.hpp"
#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "post/eddy_quantities.hpp"
#include "solver/coefficients.hpp"
#include "solver/time_harmonic.hpp"

namespace {

using Clock = std::chrono::steady_clock;
double since(Clock::time_point t) { return std::chrono::duration<double>(Clock::now() - t).count(); }

// TEAM 30a torques [N m/m] at 0, 200, ..., 1200 rad/s (K. R. Davey, "TEAM Problem 30a:
// Induction Motor Analyses", International Compumag Society TEAM problem set).
constexpr double kTorque[] = {3.825857, 6.505013, -3.89264, -5.75939, -3.59076, -2.70051, -2.24996};

}  // namespace

int main(int argc, char** argv) {
  using namespace tf;
  const std::string path = argc > 1 ? argv[1] : "cases/team30a_three_phase.toml";
  fmt::print("{:>8} {:>9} {:>11} {:>12} {:>10} {:>9}\n", "fineness", "unknowns", "worst err %", "s per speed",
             "wall s", "analyse %");
  for (double fineness : {0.5, 1.0, 2.0, 3.0, 4.0}) {
    input::Case c = input::read_case(path);
    c.mesh.fineness = fineness;
    const auto start = Clock::now();
    const auto [m, w] = study::mesh_and_wind(c);
    const solver::TimeHarmonicSystem s =
        solver::assemble_time_harmonic(m, w, solver::region_coefficients(m, c.materials));
    const auto currents = solver::supply_phasors(c.supply, c.winding.n_phases);
    std::vector<solver::TimeHarmonicProblem> problems;
    const double omega = 2 * std::numbers::pi * c.supply.frequency;
    for (double speed : c.study.rotor_speeds) problems.push_back({currents, omega, speed});
    solver::TimeHarmonicStats stats;
    const auto t_solve = Clock::now();
    const auto sol = solver::solve_time_harmonic(m, s, problems, stats);
    const double solve_wall = since(t_solve);
    double worst = 0.0;
    for (std::size_t k = 0; k < sol.size() && k < 7; ++k)
      worst = std::max(worst, std::abs(post::arkkio_torque(m, sol[k], c.stack_length) / kTorque[k] - 1.0));
    const double wall = since(start);
    fmt::print("{:>8.1f} {:>9} {:>11.3f} {:>12.4f} {:>10.3f} {:>9.1f}\n", fineness, stats.n_dofs, 100 * worst,
               solve_wall / sol.size(), wall, 100 * stats.analyse_seconds / wall);
  }
  return 0;
}
