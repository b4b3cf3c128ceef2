#include "app/motion_run.hpp"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <limits>
#include <numbers>
#include <numeric>
#include <optional>

#include <fmt/format.h>

#include "app/case_json.hpp"
#include "app/motion_plan.hpp"
#include "app/progress.hpp"
#include "post/atomic_file.hpp"
#include "post/flux_density.hpp"
#include "post/flux_quantities.hpp"
#include "post/iron_loss.hpp"
#include "post/motion_output.hpp"
#include "post/study.hpp"
#include "post/summary.hpp"
#include "post/tables.hpp"
#include "post/torque.hpp"
#include "solver/errors.hpp"
#include "solver/flux_linkage.hpp"
#include "solver/motion.hpp"

namespace tf::app {
namespace {

namespace fs = std::filesystem;
using Clock = std::chrono::steady_clock;
double since(Clock::time_point t) { return std::chrono::duration<double>(Clock::now() - t).count(); }

/// The study's speed [rad/s]: as given, or synchronous with the supply.
double study_speed(const Case& c) {
  if (c.study.speed != 0.0) return c.study.speed;
  return 2 * std::numbers::pi * c.supply.frequency / c.winding.pole_pairs();
}

/// Smallest and largest flux linkage [Wb] of one phase over the steps.
std::pair<double, double> flux_range(const post::MotionResult& r, int phase) {
  const auto [lo, hi] = std::minmax_element(r.steps.begin(), r.steps.end(), [phase](const auto& a, const auto& b) {
    return a.flux_linkage[phase] < b.flux_linkage[phase];
  });
  return {lo->flux_linkage[phase], hi->flux_linkage[phase]};
}

struct Context {
  const Case& c;
  const mesh::Mesh& m;
  const mesh::Winding& w;
  const MotionSchedule& plan;
};

/// Flux linkage per phase [Wb] of one nodal field.
std::vector<double> phase_flux(const Context& x, const Eigen::VectorXd& a) {
  const Eigen::VectorXd psi = solver::flux_linkage(x.m, x.w, a, x.c.stack_length).col(0);
  return {psi.data(), psi.data() + psi.size()};
}

/// Torque by co-energy [N m]: the rotor turned one pitch either way with the currents held.
double virtual_work(const Context& x, solver::MotionSolver& s, int k, const solver::PositionField& f) {
  const auto& i = x.plan.currents[k];
  const double plus = s.coenergy(f.shift + 1, i);
  const double minus = s.coenergy(f.shift - 1, i);
  return x.c.stack_length * post::virtual_work_torque(minus, plus, solver::sliding_pitch(x.m));
}

/// The field of step k; a failure names the step, the rotor angle and the instant.
solver::PositionField solve_named(const Context& x, solver::MotionSolver& s, int k) {
  try {
    return s.solve(x.plan.shift[k], x.plan.currents[k]);
  } catch (const solver::SolveError& e) {
    constexpr double deg = 180.0 / std::numbers::pi;
    throw solver::SolveError(fmt::format("step {} (rotor at {:.3f} deg, electrical angle {:.2f} deg): {}", k,
                                         x.plan.rotor_angle[k] * deg, x.plan.electrical_angle[k] * deg, e.what()));
  }
}

/// Solves step k (warm-started from the previous field) and everything that needs its solver state.
post::PositionStep solve_step(const Context& x, solver::MotionSolver& s, int k, Eigen::VectorXd& field,
                              post::StepResult& gap) {
  const int p = x.c.winding.pole_pairs();
  const solver::PositionField f = solve_named(x, s, k);
  field = f.a;
  // B_θ on the circle reads the rotor-side triangles, which face other chords once the rotor turned.
  const post::GapOperators ops = post::gap_operators(x.m, x.c.study.n_gap_points, p * x.c.study.max_harmonic, f.shift);
  gap = post::sample_gap_field(ops, f.a, p, p * x.c.study.max_harmonic);
  gap.electrical_angle = x.plan.electrical_angle[k];
  gap.currents = x.plan.currents[k];
  post::PositionStep step;
  step.rotor_angle = x.plan.rotor_angle[k];
  step.newton_iterations = f.newton.iterations;
  step.newton_residual = f.relative_residual;
  step.torque_arkkio = post::arkkio_torque_static(x.m, f.a, x.c.stack_length);
  step.torque_circle = post::circle_torque(ops, f.a, x.c.stack_length);
  step.flux_linkage = phase_flux(x, f.a);
  step.inductance_frozen = solver::flux_linkage(x.m, x.w, s.frozen_unit_fields(), x.c.stack_length);
  step.inductance_incremental = solver::flux_linkage(x.m, x.w, s.incremental_unit_fields(), x.c.stack_length);
  step.torque_virtual_work =
      x.c.study.virtual_work ? virtual_work(x, s, k, f) : std::numeric_limits<double>::quiet_NaN();
  return step;
}

/// dq flux linkages and the EMF -dψ/dt, once every step is solved.
void derive_flux_quantities(const Context& x, post::MotionResult& r) {
  const int p = x.c.winding.pole_pairs(), n_phases = x.c.winding.n_phases;
  for (post::PositionStep& step : r.steps) {
    const double d_axis = p * (step.rotor_angle + x.plan.rotor_d_axis) - x.w.phase_a_axis;
    const Eigen::Map<const Eigen::VectorXd> psi(step.flux_linkage.data(), n_phases);
    const post::DqPair dq = post::park_transform(psi, d_axis);
    step.flux_d = dq.d;
    step.flux_q = dq.q;
  }
  // Spectral differentiation when the steps cover whole electrical periods (then ψ is periodic
  // over the span), central differences otherwise.
  const double periods = x.plan.span * p / (2 * std::numbers::pi);
  const bool periodic = std::abs(periods - std::round(periods)) < 1e-9 && periods >= 1.0;
  const int n = static_cast<int>(r.steps.size());
  for (int ph = 0; ph < n_phases; ++ph) {
    Eigen::VectorXd psi(n);
    for (int k = 0; k < n; ++k) psi(k) = r.steps[k].flux_linkage[ph];
    const Eigen::VectorXd e = periodic ? post::back_emf_periodic(psi, x.plan.span, r.speed)
                                       : post::back_emf_sampled(psi, x.plan.span / n, r.speed);
    for (int k = 0; k < n; ++k) r.steps[k].back_emf.push_back(e(k));
  }
}

/// Iron loss needs B over exactly one electrical period in equal time steps, and coefficients.
std::optional<post::FluxHistory> flux_history(const Case& c, const mesh::Mesh& m, const MotionSchedule& plan) {
  if (!c.materials.stator_iron_loss && !c.materials.rotor_iron_loss) return std::nullopt;
  const int p = c.winding.pole_pairs();
  if (c.study.kind == post::StudyKind::rotor_sweep) return std::nullopt;  // the currents stand still
  if (std::abs(plan.span * p - 2 * std::numbers::pi) > 1e-9) return std::nullopt;
  post::FluxHistory h;
  const int n = static_cast<int>(plan.shift.size());
  h.bx.resize(m.n_triangles(), n);
  h.by.resize(m.n_triangles(), n);
  h.frequency = c.study.kind == post::StudyKind::cogging ? p * study_speed(c) / (2 * std::numbers::pi)
                                                         : c.supply.frequency;
  return h;
}

/// Steinmetz coefficients per region: the stator's in stator iron, the rotor's in rotor iron.
std::vector<post::SteinmetzCoefficients> loss_coefficients(const Case& c, const mesh::Mesh& m) {
  const auto convert = [](const std::optional<solver::IronLossData>& d) {
    return d ? post::SteinmetzCoefficients{d->hysteresis, d->exponent, d->eddy, d->density}
             : post::SteinmetzCoefficients{};
  };
  std::vector<post::SteinmetzCoefficients> out;
  for (const auto& region : m.regions)
    out.push_back(region.kind == mesh::RegionKind::stator_iron ? convert(c.materials.stator_iron_loss)
                  : region.kind == mesh::RegionKind::rotor_iron ? convert(c.materials.rotor_iron_loss)
                                                                : post::SteinmetzCoefficients{});
  return out;
}

/// The regions with loss, by name, into the result.
void record_iron_loss(const mesh::Mesh& m, const post::IronLoss& loss, post::MotionResult& r) {
  for (std::size_t i = 0; i < m.regions.size(); ++i)
    if (loss.region_loss[i] > 0.0) r.iron_loss.push_back({m.regions[i].name, loss.region_loss[i]});
}

/// Solves every step; keeps the nodal fields of the steps listed in `kept` (for field files) and,
/// when `history` is given, every triangle's B at every step (for the iron loss).
post::MotionResult solve_motion(const Context& x, solver::MotionSolver& s, const std::vector<int>& kept,
                                std::vector<Eigen::VectorXd>& kept_fields, post::FluxHistory* history,
                                Progress& progress) {
  post::MotionResult r;
  for (int j = 0; j < x.c.study.n_gap_points; ++j)
    r.gap.sample_angles.push_back(2 * std::numbers::pi * j / x.c.study.n_gap_points);
  const int n = static_cast<int>(x.plan.shift.size());
  Eigen::VectorXd field;
  for (int k = 0; k < n; ++k) {
    progress.count("solving rotor positions", k, n);
    post::StepResult gap;
    r.steps.push_back(solve_step(x, s, k, field, gap));
    r.gap.steps.push_back(std::move(gap));
    if (std::find(kept.begin(), kept.end(), k) != kept.end()) kept_fields.push_back(field);
    if (history) {
      const Eigen::MatrixX2d b = post::flux_density(x.m, field);
      history->bx.col(k) = b.col(0);
      history->by.col(k) = b.col(1);
    }
  }
  post::finish_rotation_metrics(r.gap, x.c.winding.pole_pairs());
  return r;
}


void summarise(const Context& x, post::MotionResult& r, const solver::MotionStats& stats) {
  std::vector<double> arkkio, circle, work;
  for (const auto& s : r.steps) {
    arkkio.push_back(s.torque_arkkio);
    circle.push_back(s.torque_circle);
    work.push_back(s.torque_virtual_work);
  }
  r.arkkio = post::torque_stats(arkkio);
  r.circle = post::torque_stats(circle);
  if (x.c.study.virtual_work) r.virtual_work = post::torque_stats(work);
  const int q = x.c.geometry.stator.n_slots, two_p = x.c.winding.n_poles;
  r.cogging_period_expected = 2 * std::numbers::pi / std::lcm(q, two_p);
  r.cogging_period_measured = post::dominant_period(arkkio, x.plan.span);
  r.mean_newton_iterations = static_cast<double>(stats.n_iterations) / std::max(1, stats.n_solves);
}

/// Time [s] of each step for the field collection: the supply's time in a synchronous study, the
/// time at the study's speed otherwise.
std::vector<double> step_times(const Case& c, const MotionSchedule& plan) {
  std::vector<double> t;
  for (std::size_t k = 0; k < plan.shift.size(); ++k)
    t.push_back(c.study.kind == post::StudyKind::synchronous
                    ? plan.electrical_angle[k] / (2 * std::numbers::pi * c.supply.frequency)
                    : plan.rotor_angle[k] / study_speed(c));
  return t;
}

void print_torque(std::ostream& out, const char* method, const post::TorqueStats& t) {
  out << fmt::format("  torque, {:<13} mean {:>10.5g} N m   {:>10.5g} .. {:<10.5g}  ripple {}\n", method, t.mean, t.min,
                     t.max, std::isnan(t.ripple) ? std::string("-") : fmt::format("{:.2f} %", 100 * t.ripple));
}

/// Steps per cogging period [-]: with fewer than four, the slot ripple of the torque is aliased and
/// can bias even its mean (measured on the magnet demo: 36 steps per period gave a mean 3.6 % high,
/// 72 steps agreed with the dq torque within 0.05 %).
double steps_per_cogging_period(const post::MotionResult& r, const MotionSchedule& plan) {
  return r.cogging_period_expected / (plan.span / static_cast<double>(plan.shift.size()));
}

void print_motion(std::ostream& out, const Case& c, const post::MotionResult& r, const post::MotionRecord& rec,
                  const fs::path& dir) {
  constexpr double deg = 180.0 / std::numbers::pi;
  out << fmt::format("{}\n", c.title);
  if (!rec.sampling_warning.empty()) out << "warning: " << rec.sampling_warning << "\n";
  if (c.study.kind == post::StudyKind::synchronous)
    out << fmt::format("  rotor turning with the field, load angle {:.2f} electrical degrees\n", rec.load_angle * deg);
  print_torque(out, "Arkkio", r.arkkio);
  print_torque(out, "circle", r.circle);
  if (c.study.virtual_work) print_torque(out, "virtual work", r.virtual_work);
  out << fmt::format("  cogging period {:.3f} deg expected (360/LCM(Q, 2p)), {:.3f} deg in the Arkkio torque\n",
                     r.cogging_period_expected * deg, r.cogging_period_measured * deg);
  const auto [psi_min, psi_max] = flux_range(r, 0);
  out << fmt::format("  flux linkage A {:.5g} .. {:.5g} Wb, Newton iterations per solve {:.2f}\n", psi_min, psi_max,
                     r.mean_newton_iterations);
  if (!r.iron_loss.empty()) {
    double total = 0.0;
    for (const auto& [region, watts] : r.iron_loss) total += watts;
    out << fmt::format("  iron loss {:.4g} W (Steinmetz-type estimate, iron_loss.csv)\n", total);
  }
  out << fmt::format("  solved on {}\n", model_description(*rec.mesh));
  out << fmt::format("  results in {}\n", dir.string());
  out << "  " << post::kSafetyCaution << "\n";
}

/// The steps whose nodal fields solve_motion keeps: the field files' and the report's, in step order.
std::vector<int> kept_steps(std::vector<int> file_steps, int report_step) {
  if (std::find(file_steps.begin(), file_steps.end(), report_step) == file_steps.end()) file_steps.push_back(report_step);
  std::sort(file_steps.begin(), file_steps.end());
  return file_steps;
}

/// The fields of `steps`, picked from those kept for the steps `kept` (in that order).
std::vector<Eigen::VectorXd> fields_of(const std::vector<int>& kept, const std::vector<Eigen::VectorXd>& fields,
                                       const std::vector<int>& steps) {
  std::vector<Eigen::VectorXd> out;
  for (int k : steps) out.push_back(fields[static_cast<std::size_t>(std::find(kept.begin(), kept.end(), k) - kept.begin())]);
  return out;
}

/// regions.csv and report.html, with the cross-section of step k drawn with its rotor where it stood.
void write_motion_report(const fs::path& dir, const Context& x, const post::MotionResult& r, int k,
                         const Eigen::VectorXd& field) {
  post::write_regions_table(dir / "regions.csv", x.m);
  post::ReportContext report = report_context(x.c, x.m, x.w);
  const double angle = r.steps[static_cast<std::size_t>(k)].rotor_angle;
  const mesh::Mesh drawn = mesh::with_rotor_turned(x.m, post::drawn_rotor_angle(x.m, angle));
  // |B| does not depend on the sign the image of an anti-periodic sector carries.
  report.section = {&drawn, post::flux_density_magnitude(x.m, field),
                    fmt::format("step {} (rotor at {:.4g}° mech.)", k, angle * 180 / std::numbers::pi)};
  post::write_report(dir, post::motion_study_page(report, r));
}

}  // namespace

bool solved_step_by_step(const Case& c) {
  if (post::rotor_turns(c.study.kind)) return true;
  return c.study.kind == post::StudyKind::phase_angles && (c.materials.stator_iron_bh || c.materials.rotor_iron_bh);
}

void run_motion_case(const Case& given, const RunOptions& options, std::ostream& out) {
  Progress progress;
  post::MotionRecord record;
  Case c = given;
  c.mesh.sliding_multiple = sliding_multiple(c);
  auto t = Clock::now();
  progress.stage("meshing");
  const auto [m, w] = mesh_and_wind(c);
  record.seconds.push_back({"mesh", since(t)});

  t = Clock::now();
  const MotionSchedule plan = plan_motion(c, m, w);
  const Context x{c, m, w, plan};
  solver::MotionSolver solver(m, w, c.materials, solver::magnet_layout(c.geometry.rotor));
  const int n_files = options.all_field_files ? c.study.n_steps : c.study.n_field_files;
  const std::vector<int> file_steps = n_files > 0 ? post::field_file_steps(c.study.n_steps, n_files) : std::vector<int>{};
  const std::vector<int> kept = kept_steps(file_steps, options.report_step);
  std::vector<Eigen::VectorXd> fields;
  std::optional<post::FluxHistory> history = flux_history(c, m, plan);
  post::MotionResult r = solve_motion(x, solver, kept, fields, history ? &*history : nullptr, progress);
  r.speed = study_speed(c);
  derive_flux_quantities(x, r);
  summarise(x, r, solver.stats());
  record.stats = solver.stats();
  record.seconds.push_back({"solve", since(t)});

  t = Clock::now();
  const fs::path& dir = options.out_dir;
  post::prepare_result_folder(dir);
  record.files = post::write_motion_tables(dir, r, w, c.supply.frequency);
  if (history) {
    const post::IronLoss loss = post::iron_loss(m, *history, loss_coefficients(c, m), c.stack_length);
    record_iron_loss(m, loss, r);
    post::write_iron_loss(dir, m, loss);
    record.files.insert(record.files.end(), {"iron_loss.csv", "iron_loss.vtu"});
  }
  const auto vtu = post::write_motion_fields(dir, m, r, file_steps, fields_of(kept, fields, file_steps), step_times(c, plan));
  record.files.insert(record.files.end(), vtu.begin(), vtu.end());
  write_motion_report(dir, x, r, options.report_step, fields_of(kept, fields, {options.report_step}).front());
  record.files.insert(record.files.end(), {"regions.csv", "report.html"});
  record.seconds.push_back({"write", since(t)});
  progress.finish();

  record.version = kVersion;
  record.inputs_json = case_to_json(c);
  record.load_angle = plan.load_angle;
  if (const double per = steps_per_cogging_period(r, plan); per < 4.0 && c.study.kind != post::StudyKind::phase_angles)
    record.sampling_warning = fmt::format(
        "{:.3g} steps per cogging period ({:.4g} deg): the torque's slot ripple is undersampled and its mean and "
        "ripple may be aliased; use at least {} steps",
        per, r.cogging_period_expected * 180 / std::numbers::pi,
        static_cast<int>(std::ceil(4.0 * plan.shift.size() / per)));
  record.mesh = &m;
  record.winding = &w;
  record.result = &r;
  post::write_motion_summary(dir / "summary.json", record);
  print_motion(out, c, r, record, dir);
}

}  // namespace tf::app
