// Benchmark (not a test): a phase-angle study of the demo stator at about 100k unknowns and 180
// steps, timed stage by stage, against the cost of one CHOLMOD factorization of the same matrix.
//
// Sample run:  build/bench/bench_phase_sweep [CASE] [FINENESS] [STEPS]
// Defaults:    cases/pump24_three_phase.toml 1.6 180

#include <chrono>
#include <cstdio>
#include <filesystem>
#include <string>
#include <vector>

#include <fmt/format.h>

#include "input/case_reader.hpp"
#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "post/study.hpp"
#include "post/tables.hpp"
#include "solver/assemble.hpp"
#include "solver/coefficients.hpp"
#include "solver/dofs.hpp"
#include "solver/phase_fields.hpp"
#include "solver/spd_solver.hpp"

namespace {

using Clock = std::chrono::steady_clock;
double since(Clock::time_point t) { return std::chrono::duration<double>(Clock::now() - t).count(); }

}  // namespace

int main(int argc, char** argv) {
  using namespace tf;
  const std::string path = argc > 1 ? argv[1] : "cases/pump24_three_phase.toml";
  input::Case c = input::read_case(path);
  c.mesh.fineness = argc > 2 ? std::stod(argv[2]) : 1.6;
  c.study.n_steps = argc > 3 ? std::stoi(argv[3]) : 180;

  std::vector<std::pair<std::string, double>> stage;
  auto t = Clock::now();
  const mesh::Mesh m = mesh::build(c.geometry, mesh::slot_layers(c.winding), c.mesh);
  const mesh::Winding w = mesh::lay_out(c.winding, c.geometry.stator);
  stage.push_back({"mesh", since(t)});

  const solver::PhaseFields f = solver::solve_phase_fields(m, w, c.materials);
  stage.push_back({"assemble", f.stats.assemble_seconds});
  stage.push_back({"analyse", f.stats.analyse_seconds});
  stage.push_back({"factorize", f.stats.factorize_seconds});
  stage.push_back({"solve (m phases, one block)", f.stats.solve_seconds});

  t = Clock::now();
  const post::StudyResult r = post::phase_sweep(m, w, f, c.supply, c.study.n_steps, {c.study.n_gap_points, c.study.max_harmonic});
  stage.push_back({fmt::format("post ({} steps)", c.study.n_steps), since(t)});

  t = Clock::now();
  const auto dir = std::filesystem::temp_directory_path() / "turnfield_bench";
  std::filesystem::create_directories(dir);
  post::write_steps_table(dir / "steps.csv", r, c.supply.frequency);
  post::write_gap_table(dir / "gap_field.csv", r);
  post::write_harmonics_table(dir / "harmonics.csv", r, c.winding.pole_pairs());
  stage.push_back({"write CSV", since(t)});

  // One more factorization of the same matrix, alone, as the yardstick.
  const solver::DofMap d = solver::number_dofs(m);
  const auto K = solver::assemble_stiffness(m, d, solver::region_coefficients(m, c.materials).nu);
  solver::SpdSolver s;
  s.analyse(K);
  t = Clock::now();
  s.factorize(K);
  const double one_factorization = since(t);

  double total = 0.0;
  for (const auto& [name, sec] : stage) total += sec;
  fmt::print("case {} at fineness {}: {} nodes, {} triangles, {} unknowns, {} steps\n", path, c.mesh.fineness,
             m.n_nodes(), m.n_triangles(), f.stats.n_dofs, c.study.n_steps);
  for (const auto& [name, sec] : stage)
    fmt::print("  {:<30} {:8.3f} s  {:5.1f} %\n", name, sec, 100 * sec / total);
  fmt::print("  {:<30} {:8.3f} s\n", "whole run (no VTU files)", total);
  fmt::print("  {:<30} {:8.3f} s\n", "one factorization", one_factorization);
  fmt::print("  ratio whole run / one factorization: {:.1f}\n", total / one_factorization);
  fmt::print("  a factorization per step would cost about {:.1f} s\n", c.study.n_steps * one_factorization);
  std::filesystem::remove_all(dir);
  return 0;
}
