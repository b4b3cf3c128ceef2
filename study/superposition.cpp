// Linear phase-angle studies: the m unit phase fields from one factorization, every step their
// superposition (the currents of a circuit found from the same fields first).

#include <memory>
#include <numbers>

#include <fmt/format.h>

#include "post/saturation.hpp"
#include "post/study.hpp"
#include "post/vtu.hpp"
#include "solver/coefficients.hpp"
#include "solver/phase_fields.hpp"
#include "solver/stopwatch.hpp"
#include "study/drive.hpp"
#include "study/solved.hpp"

namespace tf::study {
namespace {

/// Linear iron above 2 T at any step (every step: superposing the phase fields costs little).
std::vector<std::string> saturation_warnings(const StudyInput& in, const solver::PhaseFields& fields,
                                             const post::StudyResult& r) {
  post::SaturationWatch watch(in.m, post::linear_iron_regions(solver::region_coefficients(in.m, in.c.materials)));
  if (watch.idle()) return {};
  for (std::size_t k = 0; k < r.steps.size(); ++k)
    watch.add_step(post::flux_density_magnitude(in.m, solver::superpose(fields, r.steps[k].currents)),
                   fmt::format("step {}", k));
  return watch.warnings(fmt::format("all {} steps", r.steps.size()));
}

}  // namespace

Solved solve_by_superposition(const StudyInput& in) {
  const input::Case& c = in.c;
  Solved out;
  in.progress.stage(fmt::format("solving {} phase fields", c.winding.n_phases));
  auto fields = std::make_shared<const solver::PhaseFields>(solve_phase_fields(in.m, in.w, c.materials));
  const solver::SolveStats& stats = fields->stats;
  out.solver = {"CHOLMOD supernodal Cholesky; the m unit phase fields solved as one block, steps superposed",
                stats.n_dofs, static_cast<long>(stats.n_nonzeros), 1, -1,
                std::numeric_limits<double>::quiet_NaN(), -1, 1,
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
  out.warnings = saturation_warnings(in, *fields, *out.field);

  const std::vector<int> files = field_steps(in, c.study.n_steps);
  // One drawing of the whole machine serves every file: the rotor stands still.
  const auto drawing = files.empty() ? nullptr
                                     : std::make_shared<const post::FieldDrawing>(post::field_drawing(in.m, c.geometry, &in.w));
  for (int k : files) {
    const post::StepResult& s = out.field->steps[k];
    const double time = s.electrical_angle / (2 * std::numbers::pi * c.supply.frequency);
    out.frames.push_back({k, time, [drawing, fields, currents = s.currents,
                                    info = post::step_metadata(k, s.electrical_angle, 0.0, time, s.currents)](
                                       const std::filesystem::path& path) {
                            post::write_field_vtu(path, *drawing, solver::superpose(*fields, currents), info);
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
