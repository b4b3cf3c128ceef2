// Linear phase-angle studies: the m unit phase fields from one factorization, every step their
// superposition (the currents of a circuit found from the same fields first).

#include <memory>
#include <numbers>

#include <fmt/format.h>

#include "post/study.hpp"
#include "post/vtu.hpp"
#include "solver/phase_fields.hpp"
#include "solver/stopwatch.hpp"
#include "study/drive.hpp"
#include "study/solved.hpp"

namespace tf::study {

Solved solve_by_superposition(const StudyInput& in) {
  const input::Case& c = in.c;
  Solved out;
  in.progress.stage(fmt::format("solving {} phase fields", c.winding.n_phases));
  auto fields = std::make_shared<const solver::PhaseFields>(solve_phase_fields(in.m, in.w, c.materials));
  const solver::SolveStats& stats = fields->stats;
  out.solver = {"CHOLMOD supernodal Cholesky; the m unit phase fields solved as one block, steps superposed",
                stats.n_dofs, static_cast<long>(stats.n_nonzeros), 1, -1,
                std::numeric_limits<double>::quiet_NaN(),
                {{"assemble", stats.assemble_seconds}, {"analyse", stats.analyse_seconds},
                 {"factorize", stats.factorize_seconds}, {"solve", stats.solve_seconds}}};

  DriveReport drive;
  const solver::Supply supply = resolve_supply(c, in.m, in.w, *fields, drive);
  in.progress.stage("post-processing");
  out.field = solver::timed(out.seconds, "post", [&] {
    return post::phase_sweep(in.m, in.w, *fields, supply, c.study.n_steps,
                             {c.study.n_gap_points, c.study.max_harmonic});
  });
  out.field_rotates = true;
  out.drive_json = drive_to_json(supply, c.winding.n_phases, drive);
  out.notes = drive_notes(supply, c.winding.n_phases, drive);

  for (int k : field_steps(in, c.study.n_steps)) {
    const post::StepResult& s = out.field->steps[k];
    const double time = s.electrical_angle / (2 * std::numbers::pi * c.supply.frequency);
    out.frames.push_back({k, time, [&m = in.m, fields, currents = s.currents](const std::filesystem::path& path) {
                            post::write_field_vtu(path, m, solver::superpose(*fields, currents));
                          }});
  }
  const post::StepResult& shown = out.field->steps[in.options.report_step];
  const Eigen::VectorXd a = solver::superpose(*fields, shown.currents);
  out.section = post::cross_section({in.m, in.w, a, post::flux_density_magnitude(in.m, a), 0.0,
                                     fmt::format("step {} (ωt = {:.4g}° el.)", in.options.report_step,
                                                 shown.electrical_angle * 180 / std::numbers::pi)});
  return out;
}

}  // namespace tf::study
