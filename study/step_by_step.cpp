// Magnetostatic studies solved one step at a time: the rotor turned to each step's position
// (synchronous, cogging, rotor sweep) or at rest (a phase-angle study with saturating iron), the
// currents of the step impressed, Newton's method where B-H curves are given.

#include <algorithm>
#include <cmath>
#include <limits>
#include <memory>
#include <numbers>
#include <optional>

#include <fmt/format.h>

#include "post/flux_density.hpp"
#include "post/field_drawing.hpp"
#include "post/iron_loss.hpp"
#include "post/saturation.hpp"
#include "post/study.hpp"
#include "post/torque.hpp"
#include "solver/coefficients.hpp"
#include "solver/errors.hpp"
#include "solver/flux_linkage.hpp"
#include "solver/motion.hpp"
#include "solver/stopwatch.hpp"
#include "study/motion_plan.hpp"
#include "study/solved.hpp"

namespace tf::study {
namespace {

struct Context {
  const input::Case& c;
  const mesh::Mesh& m;
  const mesh::Winding& w;
  const MotionSchedule& plan;
  const std::vector<StepOrigin>& origin;  ///< per step: solved, or mirrored from an earlier step
  const std::vector<bool>& rotor_side;    ///< mesh::rotor_side_nodes
  /// Newton may stop on the flux linkages and torque converged; not when the iron loss is estimated
  /// (measured on the synchronous demo: the loss moved by 0.4 %, its eddy part weighting each
  /// triangle's B error by its harmonic's order squared; watching every B as well took as many
  /// iterations as the residual criterion).
  bool stop_on_reported = false;
};

/// A step's field and what needs the solver's state at it (the linearised fields' inductances).
struct StepField {
  Eigen::VectorXd a;  ///< nodal A_z [Wb/m], rotor nodes in the rotor's frame
  int iterations = 0;  ///< Newton iterations; 0 for a field derived from another step's
  double relative_residual = 0.0;
  Eigen::MatrixXd inductance_frozen, inductance_incremental;  ///< [H]
};

/// The study's speed [rad/s]: as given, or synchronous with the supply.
double study_speed(const input::Case& c) {
  if (c.study.speed != 0.0) return c.study.speed;
  return 2 * std::numbers::pi * c.supply.frequency / c.winding.pole_pairs();
}

/// Flux linkage per phase [Wb] of one nodal field.
std::vector<double> phase_flux(const Context& x, const Eigen::VectorXd& a) {
  const Eigen::VectorXd psi = solver::flux_linkage(x.m, x.w, a, x.c.stack_length).col(0);
  return {psi.data(), psi.data() + psi.size()};
}

/// The largest flux linkage [Wb] and torque [N m] of the steps solved so far: what Newton's stop on
/// the reported quantities measures their changes against.
struct ReportedScales {
  double flux = 0.0, torque = 0.0;
};

/// What the study reports of a field, for Newton's stop: the flux linkages and Arkkio's torque, each
/// over its scale (the larger of the steps' so far and the iterate's own).
solver::QuantityWatch reported_quantities(const Context& x, const ReportedScales& scales) {
  return [&x, scales](const Eigen::VectorXd& a_nodes) {
    const Eigen::VectorXd psi = solver::flux_linkage(x.m, x.w, a_nodes, x.c.stack_length).col(0);
    // At rest the torque of a symmetric rotor is round-off, no scale to measure a change against.
    const double torque = input::rotor_turns(x.c.study.kind) ? post::arkkio_torque_static(x.m, a_nodes, x.c.stack_length) : 0.0;
    const double flux_scale = std::max(scales.flux, psi.cwiseAbs().maxCoeff());
    const double torque_scale = std::max(scales.torque, std::abs(torque));
    Eigen::VectorXd q(psi.size() + 1);
    q.head(psi.size()) = flux_scale > 0.0 ? Eigen::VectorXd(psi / flux_scale) : Eigen::VectorXd::Zero(psi.size());
    q(psi.size()) = torque_scale > 0.0 ? torque / torque_scale : 0.0;
    return q;
  };
}

/// The field of step k; a failure names the step, the rotor angle and the instant.
solver::PositionField solve_named(const Context& x, solver::MotionSolver& s, int k, const ReportedScales& scales) {
  try {
    return s.solve(x.plan.shift[k], x.plan.currents[k], true,
                   x.stop_on_reported ? reported_quantities(x, scales) : solver::QuantityWatch{});
  } catch (const solver::SolveError& e) {
    constexpr double deg = 180.0 / std::numbers::pi;
    throw solver::SolveError(fmt::format("step {} (rotor at {:.3f} deg, electrical angle {:.2f} deg): {}", k,
                                         x.plan.rotor_angle[k] * deg, x.plan.electrical_angle[k] * deg, e.what()));
  }
}

/// Solves step k (warm-started from the previous field), with the inductances of its linearised fields.
StepField solve_field(const Context& x, solver::MotionSolver& s, int k, const ReportedScales& scales) {
  const solver::PositionField f = solve_named(x, s, k, scales);
  StepField out{f.a, f.newton.iterations, f.relative_residual, {}, {}};
  // Incremental first: it reuses the factor of the last Newton step; the frozen one factorizes anew.
  out.inductance_incremental = solver::flux_linkage(x.m, x.w, s.incremental_unit_fields(), x.c.stack_length);
  out.inductance_frozen = solver::flux_linkage(x.m, x.w, s.frozen_unit_fields(), x.c.stack_length);
  return out;
}

/// The field of a step that mirrors `from`: each side's potentials times its sign. The linearised
/// fields' inductances are those of `from`: the permeabilities depend on |B| only, and the stator
/// sign enters the unit field and its flux linkage alike.
StepField mirrored_field(const Context& x, const StepField& from, solver::SideSigns signs) {
  StepField out = from;
  out.a = solver::with_side_signs(x.rotor_side, from.a, signs);
  out.iterations = 0;
  return out;
}

/// The quantities of step k from its field.
post::PositionStep step_quantities(const Context& x, int k, const StepField& f, post::StepResult& gap) {
  const int p = x.c.winding.pole_pairs();
  const bool turns = input::rotor_turns(x.c.study.kind);
  // B_θ on the circle reads the rotor-side triangles, which face other chords once the rotor turned.
  const post::GapOperators ops =
      post::gap_operators(x.m, x.c.study.n_gap_points, p * x.c.study.max_harmonic, x.plan.shift[k]);
  gap = post::sample_gap_field(ops, f.a, p, p * x.c.study.max_harmonic);
  gap.electrical_angle = x.plan.electrical_angle[k];
  gap.currents = x.plan.currents[k];
  post::PositionStep step;
  step.rotor_angle = x.plan.rotor_angle[k];
  step.newton_iterations = f.iterations;
  step.newton_residual = f.relative_residual;
  step.torque_arkkio = post::arkkio_torque_static(x.m, f.a, x.c.stack_length);
  step.torque_circle = post::circle_torque(ops, f.a, x.c.stack_length);
  step.flux_linkage = phase_flux(x, f.a);
  step.inductance_incremental = f.inductance_incremental;
  step.inductance_frozen = f.inductance_frozen;
  step.torque_virtual_work = turns && x.c.study.virtual_work
                                 ? post::local_virtual_work_torque(x.m, f.a, x.c.stack_length)
                                 : std::numeric_limits<double>::quiet_NaN();
  return step;
}

/// Iron loss needs B over exactly one electrical period in equal time steps, and coefficients.
std::optional<post::FluxHistory> flux_history(const input::Case& c, const mesh::Mesh& m, const MotionSchedule& plan) {
  if (!c.materials.stator_iron_loss && !c.materials.rotor_iron_loss) return std::nullopt;
  const int p = c.winding.pole_pairs();
  if (c.study.kind == input::StudyKind::rotor_sweep) return std::nullopt;  // the currents stand still
  if (std::abs(plan.span * p - 2 * std::numbers::pi) > 1e-9) return std::nullopt;
  post::FluxHistory h;
  const int n = static_cast<int>(plan.shift.size());
  h.bx.resize(m.n_triangles(), n);
  h.by.resize(m.n_triangles(), n);
  h.frequency = c.study.kind == input::StudyKind::cogging ? p * study_speed(c) / (2 * std::numbers::pi)
                                                           : c.supply.frequency;
  return h;
}

/// What is gathered from every step's field besides the step's own results: each triangle's B
/// (iron loss) and |B| in linear iron (the saturation check); either may be absent.
struct StepObservers {
  post::FluxHistory* history = nullptr;
  post::SaturationWatch* saturation = nullptr;
};

/// Whether a later step's field is derived from step k's.
bool is_source(const std::vector<StepOrigin>& origin, int k) {
  return std::any_of(origin.begin(), origin.end(), [k](const StepOrigin& o) { return o.source == k; });
}

/// The step's name in a warning: its number and where the rotor or the currents stood.
std::string step_name(const Context& x, int k) {
  constexpr double deg = 180.0 / std::numbers::pi;
  return input::rotor_turns(x.c.study.kind) ? fmt::format("step {}, rotor at {:.4g}° mech.", k, x.plan.rotor_angle[k] * deg)
                                            : fmt::format("step {}, ωt = {:.4g}° el.", k, x.plan.electrical_angle[k] * deg);
}

/// Every step solved in order; the nodal fields of the steps in `kept` are returned in `kept_fields`
/// and every step's B handed to the observers.
post::MotionResult solve_steps(const Context& x, solver::MotionSolver& s, const std::vector<int>& kept,
                               std::vector<Eigen::VectorXd>& kept_fields, StepObservers observe, Progress& progress) {
  post::MotionResult r;
  for (int j = 0; j < x.c.study.n_gap_points; ++j)
    r.gap.sample_angles.push_back(2 * std::numbers::pi * j / x.c.study.n_gap_points);
  const int n = static_cast<int>(x.plan.shift.size());
  // The fields of solved steps that later steps mirror, by step.
  std::vector<StepField> sources(static_cast<std::size_t>(n));
  ReportedScales scales;
  for (int k = 0; k < n; ++k) {
    progress.count(input::rotor_turns(x.c.study.kind) ? "solving rotor positions" : "solving steps", k, n);
    const StepOrigin& origin = x.origin[static_cast<std::size_t>(k)];
    StepField f = origin.source < 0 ? solve_field(x, s, k, scales)
                                    : mirrored_field(x, sources[static_cast<std::size_t>(origin.source)], origin.signs);
    post::StepResult gap;
    r.steps.push_back(step_quantities(x, k, f, gap));
    for (double psi : r.steps.back().flux_linkage) scales.flux = std::max(scales.flux, std::abs(psi));
    scales.torque = std::max(scales.torque, std::abs(r.steps.back().torque_arkkio));
    r.gap.steps.push_back(std::move(gap));
    const Eigen::VectorXd& field = f.a;
    if (std::find(kept.begin(), kept.end(), k) != kept.end()) kept_fields.push_back(field);
    if (origin.source < 0 && is_source(x.origin, k)) sources[static_cast<std::size_t>(k)] = f;
    if (!observe.history && !observe.saturation) continue;
    const Eigen::MatrixX2d b = post::flux_density(x.m, field);
    if (observe.history) {
      observe.history->bx.col(k) = b.col(0);
      observe.history->by.col(k) = b.col(1);
    }
    if (observe.saturation) observe.saturation->add_step(b.rowwise().norm(), step_name(x, k));
  }
  post::finish_rotation_metrics(r.gap, x.c.winding.pole_pairs());
  return r;
}

/// Time [s] of step k for the field collection: the supply's time when the currents advance, the
/// time at the study's speed otherwise.
double step_time(const input::Case& c, const MotionSchedule& plan, int k) {
  const bool supply_time = c.study.kind == input::StudyKind::synchronous || c.study.kind == input::StudyKind::phase_angles;
  return supply_time ? plan.electrical_angle[k] / (2 * std::numbers::pi * c.supply.frequency)
                     : plan.rotor_angle[k] / study_speed(c);
}

/// Why the steps may not resolve the torque's slot ripple; empty when they do. With fewer than four
/// steps per cogging period the ripple is aliased and can bias even the mean (measured on the magnet
/// demo: 36 steps per period gave a mean 3.6 % high, 72 agreed with the dq torque within 0.05 %).
std::string sampling_warning(const post::MotionResult& r, const MotionSchedule& plan) {
  const double per = r.cogging_period_expected / (plan.span / static_cast<double>(plan.shift.size()));
  if (per >= 4.0) return {};
  return fmt::format("{:.3g} steps per cogging period ({:.4g} deg): the torque's slot ripple is undersampled and its "
                     "mean and ripple may be aliased; use at least {} steps",
                     per, r.cogging_period_expected * 180 / std::numbers::pi,
                     static_cast<int>(std::ceil(4.0 * plan.shift.size() / per)));
}

/// The steps whose nodal fields are kept: the field files' and the report's, in step order.
std::vector<int> kept_steps(std::vector<int> file_steps, int report_step) {
  if (std::find(file_steps.begin(), file_steps.end(), report_step) == file_steps.end()) file_steps.push_back(report_step);
  std::sort(file_steps.begin(), file_steps.end());
  return file_steps;
}

/// The nodal fields kept while solving, by step.
struct KeptFields {
  const std::vector<int>& steps;
  const std::vector<Eigen::VectorXd>& fields;
  const Eigen::VectorXd& of(int k) const {
    return fields[static_cast<std::size_t>(std::find(steps.begin(), steps.end(), k) - steps.begin())];
  }
};

/// The iron loss per region into r and its files into out (a Steinmetz-type law over the period).
void add_iron_loss(const StudyInput& in, const post::FluxHistory& history, post::MotionResult& r, Solved& out) {
  const post::IronLoss loss =
      post::iron_loss(in.m, history, solver::region_coefficients(in.m, in.c.materials).iron_loss, in.c.stack_length);
  for (std::size_t i = 0; i < in.m.regions.size(); ++i)
    if (loss.region_loss[i] > 0.0) r.iron_loss.push_back({in.m.regions[i].name, loss.region_loss[i]});
  out.write_extra = [&m = in.m, &g = in.c.geometry, &w = in.w, loss](const std::filesystem::path& dir) {
    post::write_iron_loss(dir, post::field_drawing(m, g, &w), loss);
    return std::vector<std::string>{"iron_loss.csv", "iron_loss.vtu"};
  };
}

/// The field files of `files` and the report's cross-section, each drawn with its rotor where it stood.
void add_fields(const StudyInput& in, const MotionSchedule& plan, const post::MotionResult& r, const KeptFields& kept,
                const std::vector<int>& files, Solved& out) {
  for (int k : files) {
    const double angle = r.steps[k].rotor_angle, time = step_time(in.c, plan, k);
    out.frames.push_back({k, time, [&m = in.m, &g = in.c.geometry, &w = in.w, a = kept.of(k), angle,
                                    info = post::step_metadata(k, plan.electrical_angle[k], angle, time, plan.currents[k])](
                                       const std::filesystem::path& path) {
                            post::write_field_vtu(path, post::field_drawing(m, g, &w, angle), a, info);
                          }});
  }
  const int shown = in.options.report_step;
  const double angle = r.steps[shown].rotor_angle;
  constexpr double deg = 180.0 / std::numbers::pi;
  out.section = post::cross_section({in.m, in.w, kept.of(shown), post::flux_density_magnitude(in.m, kept.of(shown)), angle,
                                     input::rotor_turns(in.c.study.kind)
                                         ? fmt::format("step {} (rotor at {:.4g}° mech.)", shown, angle * deg)
                                         : fmt::format("step {} (ωt = {:.4g}° el.)", shown, plan.electrical_angle[shown] * deg)});
}

}  // namespace

Solved solve_step_by_step(const StudyInput& in) {
  const input::Case& c = in.c;
  Solved out;
  solver::Stopwatch clock;
  const MotionSchedule plan = plan_motion(c, in.m, in.w);
  const std::vector<StepOrigin> origin = step_origins(plan, in.m, solver::magnet_layout(c.geometry.rotor).n_poles > 0);
  const std::vector<bool> rotor_side = mesh::rotor_side_nodes(in.m);
  std::optional<post::FluxHistory> history = flux_history(c, in.m, plan);
  const Context x{c, in.m, in.w, plan, origin, rotor_side, !history.has_value()};
  solver::MotionSolver solver(in.m, in.w, c.materials, solver::magnet_layout(c.geometry.rotor));
  const std::vector<int> files = field_steps(in, c.study.n_steps);
  const std::vector<int> kept = kept_steps(files, in.options.report_step);
  std::vector<Eigen::VectorXd> fields;
  // Linear iron (no B-H curve) is checked for saturation at every step solved.
  post::SaturationWatch saturation(in.m, post::linear_iron_regions(solver::region_coefficients(in.m, c.materials)));
  post::MotionResult r = solve_steps(x, solver, kept, fields,
                                     {history ? &*history : nullptr, saturation.idle() ? nullptr : &saturation},
                                     in.progress);
  r.speed = study_speed(c);
  const solver::MotionStats stats = solver.stats();
  post::derive_flux_quantities(r, {c.winding.pole_pairs(), plan.span, in.w.phase_a_axis, plan.rotor_d_axis});
  post::summarise_torque(r, c.geometry.stator.n_positions, c.winding.n_poles, plan.span,
                         input::rotor_turns(c.study.kind) && c.study.virtual_work, stats.n_solves, stats.n_iterations);
  out.seconds.emplace_back("solve", clock.lap());

  if (history) add_iron_loss(in, *history, r, out);
  out.seconds.emplace_back("post", clock.lap());
  add_fields(in, plan, r, {kept, fields}, files, out);

  out.rotor_turns = input::rotor_turns(c.study.kind);
  // The stator field turns when the currents advance over the steps: phase angles and synchronous.
  out.field_rotates = input::stator_field_turns(c.study.kind);
  out.load_angle = plan.load_angle;
  if (out.rotor_turns)
    if (std::string w = sampling_warning(r, plan); !w.empty()) out.warnings.push_back(std::move(w));
  for (auto& w : saturation.warnings(fmt::format("all {} steps", r.steps.size()))) out.warnings.push_back(std::move(w));
  out.solver = {"CHOLMOD supernodal Cholesky per step; Newton-Raphson with the consistent Jacobian where B-H curves "
                "are given; a step whose currents are another's reversed, with the rotor at rest or a pole pitch "
                "on in an anti-periodic sector, takes that step's field with the signs the odd B-H curves give",
                stats.n_dofs, -1, stats.n_factorizations, stats.n_solves, r.mean_newton_iterations,
                stats.max_iterations, stats.n_analyses,
                {{"analyse", stats.analyse_seconds}, {"solve", stats.solve_seconds}}};
  out.field = r.gap;
  out.motion = std::move(r);
  return out;
}

}  // namespace tf::study
