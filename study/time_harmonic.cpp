// Eddy-current studies: one time-harmonic solution per rotor speed, the rotor's motion entering
// by the motion term (rotationally invariant rotors) or by the slip-frequency method (rotors with
// bars, whose field is time-harmonic only in the rotor's own frame).

#include <functional>
#include <memory>
#include <numbers>
#include <string>

#include <fmt/format.h>

#include "post/eddy_output.hpp"
#include "post/saturation.hpp"
#include "solver/coefficients.hpp"
#include "solver/time_harmonic.hpp"
#include "solver/stopwatch.hpp"
#include "study/slip_study.hpp"
#include "study/solved.hpp"
#include "solver/materials.hpp"

namespace tf::study {
namespace {

using solver::kMu0;

/// How an eddy study's files show speed k: its field, its writer, the currents and the frequency
/// [Hz] of the field shown.
struct SpeedFiles {
  std::function<Eigen::VectorXcd(int)> field;
  std::function<void(int, const post::FieldDrawing&, const post::FieldMetadata&, const std::filesystem::path&)> write;
  std::vector<std::complex<double>> currents;
  std::function<double(int)> frequency;
  const char* what;
};

/// The field files of the speeds (the collection indexed by speed, post::speed_collection_axis)
/// and the report's cross-section.
void add_fields(const StudyInput& in, Solved& out, const std::vector<post::SpeedResult>& rows, const SpeedFiles& f) {
  const std::vector<int> files = field_steps(in, static_cast<int>(rows.size()));
  std::vector<post::SpeedResult> written;
  for (int k : files) written.push_back(rows[k]);
  const post::SpeedAxis axis = post::speed_collection_axis(written);
  const auto drawing = files.empty() ? nullptr
                                     : std::make_shared<const post::FieldDrawing>(post::field_drawing(in.m, in.c.geometry, &in.w));
  for (std::size_t i = 0; i < files.size(); ++i) {
    const int k = files[i];
    out.frames.push_back({k, axis.values[i], [write = f.write, drawing, k,
                                              info = post::speed_metadata(k, rows[k], f.frequency(k), f.currents, axis.name)](
                                                 const std::filesystem::path& path) { write(k, *drawing, info, path); }});
  }
  const int shown = in.options.report_step;
  const Eigen::VectorXcd a = f.field(shown);
  out.section = post::cross_section({in.m, in.w, a.real(), post::peak_flux_density(in.m, a), 0.0,
                                     fmt::format("speed {} ({:.4g} rad/s), |B| peak over a period{}", shown,
                                                 rows[shown].rotor_speed, f.what),
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

/// Tells the terminal's progress line of each solution done.
std::function<void(int, int)> counter(const StudyInput& in, std::string what) {
  return [&progress = in.progress, what = std::move(what)](int done, int total) { progress.count(what, done, total); };
}

/// Linear iron above 2 T at any speed: |B| per triangle of each speed's field (`peak_b`), peak over a period.
void warn_saturation(const StudyInput& in, const solver::RegionCoefficients& k, std::function<Eigen::VectorXd(int)> peak_b,
                     const char* what, std::vector<std::string>& warnings) {
  post::SaturationWatch watch(in.m, post::linear_iron_regions(k));
  if (watch.idle()) return;
  const std::vector<double>& speeds = in.c.study.rotor_speeds;
  for (std::size_t i = 0; i < speeds.size(); ++i)
    watch.add_step(peak_b(static_cast<int>(i)), fmt::format("speed {} ({:.4g} rad/s)", i, speeds[i]));
  // A time-harmonic study cannot take a B-H curve (its permeability must not change over a period).
  for (auto& w : watch.warnings(fmt::format("every one of the {} speeds, {}", speeds.size(), what),
                                "an eddy-current study takes linear iron only: enlarge the part or lower the current"))
    warnings.push_back(std::move(w));
}

post::SolverSummary umfpack_summary(const solver::TimeHarmonicStats& stats) {
  return {"UMFPACK complex LU; one symbolic analysis, one factorization per speed", stats.n_dofs, -1, -1, -1,
          std::numeric_limits<double>::quiet_NaN(), -1, 1,
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
      solver::solve_time_harmonic(in.m, system, problems, stats, counter(in, "solving rotor speeds")));
  const post::SpeedInputs speed_in{&in.m, &in.w, k.sigma, k.moves_with_rotor, currents, c.supply.frequency,
                                   c.stack_length};
  solver::Stopwatch clock;
  post::EddyResult e;
  for (std::size_t i = 0; i < speeds.size(); ++i)
    e.rows.push_back(post::evaluate_speed(speed_in, speeds[i], (*solutions)[i]));
  e.method = "motion term sigma omega_r dA/dtheta (exact for rotationally invariant rotors)";
  e.skin = skin(in, k);
  warn_coarse_skins(e.skin, out.warnings);
  warn_saturation(in, k, [&](int i) { return post::peak_flux_density(in.m, (*solutions)[i]); },
                  "the peak |B| over a period", out.warnings);
  out.seconds.emplace_back("post", clock.lap());
  add_fields(in, out, e.rows,
             {[solutions](int i) { return (*solutions)[i]; },
              [speed_in, solutions, speeds](int i, const post::FieldDrawing& d, const post::FieldMetadata& info,
                                            const std::filesystem::path& path) {
                post::write_eddy_vtu(path, d, (*solutions)[i], speed_in, speeds[i], info);
              },
              currents, [f = c.supply.frequency](int) { return f; }, ""});
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
      solver::timed(out.seconds, "solve", [&] { return solve_slip_study(c, in.m, in.w, stats, counter(in, "solving slip fields")); }));
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
  // The two components turn at different speeds: the sum of their peaks bounds the peak of the whole.
  warn_saturation(in, k,
                  [&](int i) {
                    return Eigen::VectorXd(post::peak_flux_density(in.m, study->forward[i]) +
                                           post::peak_flux_density(in.m, study->backward[i]));
                  },
                  "the peak |B| of the forward plus that of the backward component", out.warnings);
  // The field files show the forward component in the rotor frame (J = -j s omega sigma A).
  add_fields(in, out, study->rows,
             {[study](int k) { return study->forward[k]; },
              [&m = in.m, &w = in.w, &c, study, sigma, on](int k, const post::FieldDrawing& d,
                                                         const post::FieldMetadata& info,
                                                         const std::filesystem::path& path) {
                const double s = study->rows[k].slip;
                const post::SpeedInputs speed_in{&m, &w, sigma, on, study->components.forward,
                                                 s * c.supply.frequency, c.stack_length};
                post::write_eddy_vtu(path, d, study->forward[k], speed_in, 0.0, info);
              },
              study->components.forward,
              [study, f = c.supply.frequency](int k) { return study->rows[k].slip * f; }, ", forward component"});
  out.solver = umfpack_summary(stats);
  out.eddy = std::move(e);
  return out;
}

}  // namespace tf::study
