#include "app/eddy_run.hpp"

#include <chrono>
#include <cmath>
#include <numbers>

#include <fmt/format.h>

#include "app/case_json.hpp"
#include "app/progress.hpp"
#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "post/atomic_file.hpp"
#include "post/eddy_output.hpp"
#include "post/summary.hpp"
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

std::vector<std::string> write_fields(const fs::path& dir, const mesh::Mesh& m,
                                      const std::vector<solver::EddySolution>& solutions, const post::SpeedInputs& in,
                                      int n_files, Progress& progress) {
  std::vector<std::string> files;
  std::vector<post::CollectionEntry> entries;
  const int n = static_cast<int>(solutions.size());
  for (int k : post::field_file_steps(n, std::min(n, n_files))) {
    progress.count("writing field files", static_cast<int>(files.size()), n_files);
    const std::string name = fmt::format("field_{:04d}.vtu", k);
    post::write_eddy_vtu(dir / name, m, solutions[k].potential, in, solutions[k].rotor_speed);
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
  for (const auto& [mu_r, sigma] : {std::pair{m.rotor_iron_mu_r, m.rotor_iron_sigma}, std::pair{m.shaft_mu_r, m.shaft_sigma},
                                    std::pair{m.sleeve_mu_r, m.sleeve_sigma}})
    if (sigma > 0.0 && slip > 0.0) {
      const double d = std::sqrt(2.0 / (slip * mu0 * mu_r * sigma));
      depth = depth > 0.0 ? std::min(depth, d) : d;
    }
  return depth;
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

  t = Clock::now();
  const solver::EddySystem system = solver::assemble_eddy(m, w, c.materials);
  record.stats.assemble_seconds = since(t);
  const auto currents = solver::supply_phasors(c.supply, c.winding.n_phases);
  progress.stage(fmt::format("solving {} rotor speeds", c.study.rotor_speeds.size()));
  const auto solutions = solver::solve_eddy(m, system, currents, c.supply.frequency, c.study.rotor_speeds, record.stats);
  record.seconds.push_back({"assemble", record.stats.assemble_seconds});
  record.seconds.push_back({"analyse", record.stats.analyse_seconds});
  record.seconds.push_back({"factorize", record.stats.factorize_seconds});
  record.seconds.push_back({"solve", record.stats.solve_seconds});

  t = Clock::now();
  const post::SpeedInputs in{&m, &w, solver::region_conductivity(m, c.materials), solver::region_on_rotor(m),
                             currents, c.supply.frequency, c.stack_length};
  std::vector<post::SpeedResult> rows;
  for (const auto& s : solutions) rows.push_back(post::evaluate_speed(in, s.rotor_speed, s.potential));
  std::vector<double> mu_r;
  for (double nu : solver::region_reluctivity(m, c.materials)) mu_r.push_back(1.0 / (4e-7 * std::numbers::pi * nu));
  record.skin = post::skin_depths(m, in.sigma, mu_r, in.on_rotor, c.supply.frequency, c.study.rotor_speeds,
                                  w.spec.pole_pairs());
  record.seconds.push_back({"post", since(t)});

  t = Clock::now();
  const fs::path& dir = options.out_dir;
  post::prepare_result_folder(dir);
  post::write_torque_speed(dir / "torque_speed.csv", rows, w.spec.pole_pairs());
  record.files = {"torque_speed.csv"};
  const int n_files = options.all_field_files ? static_cast<int>(rows.size()) : c.study.n_field_files;
  const auto vtu = write_fields(dir, m, solutions, in, n_files, progress);
  record.files.insert(record.files.end(), vtu.begin(), vtu.end());
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
  print_rows(out, c, rows, dir);
}

}  // namespace tf::app
