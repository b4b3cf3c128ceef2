#include "app/eddy_run.hpp"

#include <chrono>
#include <cmath>
#include <functional>
#include <memory>
#include <numbers>

#include <fmt/format.h>

#include "app/case_json.hpp"
#include "app/progress.hpp"
#include "app/slip_study.hpp"
#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "post/atomic_file.hpp"
#include "post/eddy_output.hpp"
#include "post/summary.hpp"
#include "post/tables.hpp"
#include "post/vtu.hpp"
#include "solver/assemble.hpp"
#include "solver/eddy.hpp"

namespace tf::app {
namespace {

namespace fs = std::filesystem;
using Clock = std::chrono::steady_clock;
double since(Clock::time_point t) { return std::chrono::duration<double>(Clock::now() - t).count(); }

void print_rows(std::ostream& out, const Case& c, const std::vector<post::SpeedResult>& rows, const fs::path& dir) {
  out << fmt::format("{}\n", c.title);
  out << "  speed rad/s    slip     torque N m   rotor loss W (by power balance)   EMF A V rms\n";
  for (const auto& r : rows)
    out << fmt::format("  {:>11.1f}  {:>6.3f}  {:>13.5g}  {:>12.5g} ({:>12.5g})  {:>12.5g}\n", r.rotor_speed, r.slip,
                       r.torque, r.rotor_loss, r.rotor_loss_balance, r.emf_rms.front());
  out << fmt::format("  results in {}\n", dir.string());
  out << "  " << post::kSafetyCaution << "\n";
}

/// field_NNNN.vtu for up to n_files speeds and field.pvd; write(k, path) writes speed k's file.
template <class Write>
std::vector<std::string> write_fields(const fs::path& dir, int n, int n_files, Progress& progress, Write write) {
  std::vector<std::string> files;
  std::vector<post::CollectionEntry> entries;
  for (int k : post::field_file_steps(n, std::min(n, n_files))) {
    progress.count("writing field files", static_cast<int>(files.size()), n_files);
    const std::string name = fmt::format("field_{:04d}.vtu", k);
    write(k, dir / name);
    entries.push_back({static_cast<double>(k), name});  // a series over speeds, indexed by speed number
    files.push_back(name);
  }
  if (!files.empty()) {
    post::write_collection(dir / "field.pvd", entries);
    files.push_back("field.pvd");
  }
  return files;
}

/// The thinnest skin of the rotor's conductors [m]: at the largest slip frequency among the speeds.
double rotor_skin_depth(const Case& c) {
  const double mu0 = 4e-7 * std::numbers::pi, omega = 2 * std::numbers::pi * c.supply.frequency;
  double slip = 0.0;
  for (double w : c.study.rotor_speeds) slip = std::max(slip, std::abs(omega - c.winding.pole_pairs() * w));
  const auto& m = c.materials;
  double depth = 0.0;
  const double bars = c.geometry.rotor.kind == mesh::RotorKind::slotted ? m.bar_sigma : 0.0;
  for (const auto& [mu_r, sigma] : {std::pair{m.rotor_iron_mu_r, m.rotor_iron_sigma}, std::pair{m.shaft_mu_r, m.shaft_sigma},
                                    std::pair{m.sleeve_mu_r, m.sleeve_sigma}, std::pair{1.0, bars}})
    if (sigma > 0.0 && slip > 0.0) {
      const double d = std::sqrt(2.0 / (slip * mu0 * mu_r * sigma));
      depth = depth > 0.0 ? std::min(depth, d) : d;
    }
  return depth;
}

/// What either method hands to the writers.
struct Solved {
  std::vector<post::SpeedResult> rows;
  std::vector<double> sigma;   ///< per region, as solved [S/m]
  std::vector<bool> on_rotor;  ///< per region
  std::function<void(int, const fs::path&)> write_field;  ///< speed k's VTU file
  std::function<Eigen::VectorXcd(int)> field;            ///< speed k's A [Wb/m] as its VTU file draws it
};

/// The motion term sigma omega_r dA/dtheta: exact for rotationally invariant rotors.
Solved solve_by_motion(const Case& c, const mesh::Mesh& m, const mesh::Winding& w, post::EddyRecord& record) {
  auto t = Clock::now();
  const solver::EddySystem system = solver::assemble_eddy(m, w, c.materials);
  record.stats.assemble_seconds = since(t);
  const auto currents = solver::supply_phasors(c.supply, c.winding.n_phases);
  // Shared by the two closures below rather than copied into each.
  const auto solutions = std::make_shared<const std::vector<solver::EddySolution>>(
      solver::solve_eddy(m, system, currents, c.supply.frequency, c.study.rotor_speeds, record.stats));
  const post::SpeedInputs in{&m, &w, solver::region_conductivity(m, c.materials), solver::region_on_rotor(m),
                             currents, c.supply.frequency, c.stack_length};
  Solved out{{}, in.sigma, in.on_rotor, {}, {}};
  for (const auto& x : *solutions) out.rows.push_back(post::evaluate_speed(in, x.rotor_speed, x.potential));
  out.write_field = [&m, in, solutions](int k, const fs::path& path) {
    post::write_eddy_vtu(path, m, (*solutions)[k].potential, in, (*solutions)[k].rotor_speed);
  };
  out.field = [solutions](int k) { return (*solutions)[k].potential; };
  return out;
}

/// The slip-frequency method: rotors with bars. The field files show the forward component in
/// the rotor frame (J = -j s omega sigma A).
Solved solve_by_slip(const Case& c, const mesh::Mesh& m, const mesh::Winding& w, post::EddyRecord& record) {
  auto t = Clock::now();
  auto study = std::make_shared<SlipStudy>(solve_slip_study(c, m, w, record.stats));
  record.stats.assemble_seconds = since(t) - record.stats.analyse_seconds - record.stats.factorize_seconds -
                                  record.stats.solve_seconds;
  record.method = "slip-frequency method, forward and backward components superposed";
  if (c.end_rings) record.end_ring_factor = study->end_ring_factor;
  double rest = 0.0;
  for (const auto& i : study->components.rest) rest = std::max(rest, std::abs(i));
  record.unmodelled_current = rest;
  Solved out{study->rows, solver::slip_conductivity(m, study->materials), solver::slip_on_rotor(m), {}, {}};
  out.field = [study](int k) { return study->forward[k]; };
  out.write_field = [&m, &w, &c, study, sigma = out.sigma, on = out.on_rotor](int k, const fs::path& path) {
    const double s = study->rows[k].slip;
    const post::SpeedInputs in{&m, &w, sigma, on, study->components.forward, s * c.supply.frequency, c.stack_length};
    post::write_eddy_vtu(path, m, study->forward[k], in, 0.0);
  };
  return out;
}

}  // namespace

void run_eddy_case(const Case& given, const RunOptions& options, std::ostream& out) {
  Progress progress;
  post::EddyRecord record;
  Case c = given;
  c.mesh.skin_depth = rotor_skin_depth(c);
  auto t = Clock::now();
  progress.stage("meshing");
  const auto [m, w] = mesh_and_wind(c);
  record.seconds.push_back({"mesh", since(t)});

  progress.stage(fmt::format("solving {} rotor speeds", c.study.rotor_speeds.size()));
  // A rotor with bars is not rotationally invariant: the motion term would be wrong there.
  t = Clock::now();
  const bool cage = c.geometry.rotor.kind == mesh::RotorKind::slotted;
  const Solved solved = cage ? solve_by_slip(c, m, w, record) : solve_by_motion(c, m, w, record);
  const auto& rows = solved.rows;
  record.seconds.push_back({"assemble", record.stats.assemble_seconds});
  record.seconds.push_back({"analyse", record.stats.analyse_seconds});
  record.seconds.push_back({"factorize", record.stats.factorize_seconds});
  record.seconds.push_back({"solve", record.stats.solve_seconds});

  t = Clock::now();
  std::vector<double> mu_r;
  for (double nu : solver::region_reluctivity(m, c.materials)) mu_r.push_back(1.0 / (4e-7 * std::numbers::pi * nu));
  record.skin = post::skin_depths(m, solved.sigma, mu_r, solved.on_rotor, c.supply.frequency, c.study.rotor_speeds,
                                  w.spec.pole_pairs());
  record.seconds.push_back({"post", since(t)});

  t = Clock::now();
  const fs::path& dir = options.out_dir;
  post::prepare_result_folder(dir);
  post::write_torque_speed(dir / "torque_speed.csv", rows, w.spec.pole_pairs());
  record.files = {"torque_speed.csv"};
  const int n_files = options.all_field_files ? static_cast<int>(rows.size()) : c.study.n_field_files;
  const auto vtu = write_fields(dir, static_cast<int>(rows.size()), n_files, progress, solved.write_field);
  record.files.insert(record.files.end(), vtu.begin(), vtu.end());
  post::write_regions_table(dir / "regions.csv", m);
  post::ReportContext report = report_context(c, m, w);
  report.section = {&m, post::peak_flux_density(m, solved.field(options.report_step)),
                    fmt::format("speed {} ({:.4g} rad/s), peak over a period{}", options.report_step,
                                rows[options.report_step].rotor_speed, cage ? ", forward component" : "")};
  post::write_report(dir, post::eddy_study_page(report, rows));
  record.files.insert(record.files.end(), {"regions.csv", "report.html"});
  record.seconds.push_back({"write", since(t)});
  progress.finish();

  record.version = kVersion;
  record.inputs_json = case_to_json(c);
  record.mesh = &m;
  record.winding = &w;
  record.rows = &rows;
  post::write_eddy_summary(dir / "summary.json", record);
  for (const auto& d : record.skin)
    if (d.too_coarse)
      out << fmt::format("warning: {}: skin depth {:.3g} mm at {:.4g} Hz, but elements up to {:.3g} mm; fewer than "
                         "three per skin depth: raise [mesh] fineness or set [mesh] elements_per_skin_depth\n",
                         d.region, 1e3 * d.depth, d.frequency, 1e3 * d.element_size);
  if (cage) out << fmt::format("  {}\n", record.method);
  print_rows(out, c, rows, dir);
}

}  // namespace tf::app
