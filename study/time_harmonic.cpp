// Eddy-current studies: one time-harmonic solution per rotor speed, the rotor's motion entering
// by the motion term (rotationally invariant rotors) or by the slip-frequency method (rotors with
// bars, whose field is time-harmonic only in the rotor's own frame).

#include <memory>
#include <numbers>

#include <fmt/format.h>

#include "post/eddy_output.hpp"
#include "solver/coefficients.hpp"
#include "solver/time_harmonic.hpp"
#include "solver/stopwatch.hpp"
#include "study/slip_study.hpp"
#include "study/solved.hpp"
#include "solver/materials.hpp"

namespace tf::study {
namespace {

using solver::kMu0;

/// Speed k's field files (indexed by speed number) and the report's cross-section.
void add_fields(const StudyInput& in, Solved& out, const std::vector<double>& speeds,
                std::function<Eigen::VectorXcd(int)> field, std::function<void(int, const std::filesystem::path&)> write,
                const char* what) {
  for (int k : field_steps(in, static_cast<int>(speeds.size())))
    out.frames.push_back({k, static_cast<double>(k), [write, k](const std::filesystem::path& path) { write(k, path); }});
  const int shown = in.options.report_step;
  const Eigen::VectorXcd a = field(shown);
  out.section = post::cross_section({in.m, in.w, a.real(), post::peak_flux_density(in.m, a), 0.0,
                                     fmt::format("speed {} ({:.4g} rad/s), |B| peak over a period{}", shown,
                                                 speeds[shown], what),
                                     "Re(A_z), the field at ωt = 0"});
}

/// Skin depths per conducting region, with the permeability and conductivity each region was solved with.
std::vector<post::SkinDepth> skin(const StudyInput& in, const solver::RegionCoefficients& k) {
  std::vector<double> mu_r;
  for (double nu : k.nu) mu_r.push_back(1.0 / (kMu0 * nu));
  return post::skin_depths(in.m, k.sigma, mu_r, k.moves_with_rotor, in.c.supply.frequency, in.c.study.rotor_speeds,
                           in.w.spec.pole_pairs());
}

/// A warning for each conductor whose skin the mesh resolves with fewer than three elements.
void warn_coarse_skins(const std::vector<post::SkinDepth>& skin, std::vector<std::string>& warnings) {
  for (const auto& d : skin)
    if (d.too_coarse)
      warnings.push_back(fmt::format("{}: skin depth {:.3g} mm at {:.4g} Hz, but elements up to {:.3g} mm; fewer than "
                                     "three per skin depth: raise [mesh] fineness or set [mesh] elements_per_skin_depth",
                                     d.region, 1e3 * d.depth, d.frequency, 1e3 * d.element_size));
}

post::SolverSummary umfpack_summary(const solver::TimeHarmonicStats& stats) {
  return {"UMFPACK complex LU; one symbolic analysis, one factorization per speed", stats.n_dofs, -1, -1, -1,
          std::numeric_limits<double>::quiet_NaN(),
          {{"analyse", stats.analyse_seconds}, {"factorize", stats.factorize_seconds}, {"solve", stats.solve_seconds}}};
}

}  // namespace

Solved solve_by_motion_term(const StudyInput& in) {
  const input::Case& c = in.c;
  Solved out;
  in.progress.stage(fmt::format("solving {} rotor speeds", c.study.rotor_speeds.size()));
  solver::TimeHarmonicStats stats;
  const solver::RegionCoefficients k = solver::region_coefficients(in.m, c.materials, solver::EddyModel::motion_term);
  const solver::TimeHarmonicSystem system =
      solver::timed(out.seconds, "assemble", [&] { return solver::assemble_time_harmonic(in.m, in.w, k); });
  const auto currents = solver::supply_phasors(c.supply, c.winding.n_phases);
  const std::vector<double>& speeds = c.study.rotor_speeds;
  std::vector<solver::TimeHarmonicProblem> problems;
  for (double speed : speeds) problems.push_back({currents, 2 * std::numbers::pi * c.supply.frequency, speed});
  const auto solutions = std::make_shared<const std::vector<Eigen::VectorXcd>>(
      solver::solve_time_harmonic(in.m, system, problems, stats));
  const post::SpeedInputs speed_in{&in.m, &in.w, k.sigma, k.moves_with_rotor, currents, c.supply.frequency,
                                   c.stack_length};
  solver::Stopwatch clock;
  post::EddyResult e;
  for (std::size_t i = 0; i < speeds.size(); ++i)
    e.rows.push_back(post::evaluate_speed(speed_in, speeds[i], (*solutions)[i]));
  e.method = "motion term sigma omega_r dA/dtheta (exact for rotationally invariant rotors)";
  e.skin = skin(in, k);
  warn_coarse_skins(e.skin, out.warnings);
  out.seconds.emplace_back("post", clock.lap());
  add_fields(in, out, speeds, [solutions](int i) { return (*solutions)[i]; },
             [&m = in.m, speed_in, solutions, speeds](int i, const std::filesystem::path& path) {
               post::write_eddy_vtu(path, m, (*solutions)[i], speed_in, speeds[i]);
             },
             "");
  out.solver = umfpack_summary(stats);
  out.eddy = std::move(e);
  return out;
}

Solved solve_by_slip_method(const StudyInput& in) {
  const input::Case& c = in.c;
  Solved out;
  in.progress.stage(fmt::format("solving {} rotor speeds", c.study.rotor_speeds.size()));
  solver::TimeHarmonicStats stats;
  auto study = std::make_shared<SlipStudy>(
      solver::timed(out.seconds, "solve", [&] { return solve_slip_study(c, in.m, in.w, stats); }));
  post::EddyResult e;
  e.rows = study->rows;
  e.slip_method = true;
  e.method = "slip-frequency method, forward and backward components superposed";
  if (c.end_rings) e.end_ring_factor = study->end_ring_factor;
  for (const auto& i : study->components.rest) e.unmodelled_current = std::max(e.unmodelled_current, std::abs(i));
  const solver::RegionCoefficients k =
      solver::region_coefficients(in.m, study->materials, solver::EddyModel::slip_frequency);
  const std::vector<double>& sigma = k.sigma;
  const std::vector<bool>& on = k.moves_with_rotor;
  e.skin = skin(in, k);
  warn_coarse_skins(e.skin, out.warnings);
  // The field files show the forward component in the rotor frame (J = -j s omega sigma A).
  add_fields(in, out, c.study.rotor_speeds, [study](int k) { return study->forward[k]; },
             [&m = in.m, &w = in.w, &c, study, sigma, on](int k, const std::filesystem::path& path) {
               const double s = study->rows[k].slip;
               const post::SpeedInputs speed_in{&m, &w, sigma, on, study->components.forward, s * c.supply.frequency,
                                                c.stack_length};
               post::write_eddy_vtu(path, m, study->forward[k], speed_in, 0.0);
             },
             ", forward component");
  out.solver = umfpack_summary(stats);
  out.eddy = std::move(e);
  return out;
}

}  // namespace tf::study
