#include "app/run_case.hpp"

#include <chrono>
#include <cmath>
#include <numbers>
#include <sstream>

#include <fmt/format.h>

#include "app/case_json.hpp"
#include "app/drive.hpp"
#include "app/input_error.hpp"
#include "app/progress.hpp"
#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "post/atomic_file.hpp"
#include "post/case_report.hpp"
#include "post/sequence.hpp"
#include "post/study.hpp"
#include "post/summary.hpp"
#include "post/tables.hpp"
#include "post/vtu.hpp"
#include "solver/phase_fields.hpp"

namespace tf::app {
namespace {

namespace fs = std::filesystem;
using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point t) { return std::chrono::duration<double>(Clock::now() - t).count(); }

/// VTU files for the chosen steps and the .pvd collection that lists them; returns file names.
std::vector<std::string> write_field_files(const fs::path& dir, const mesh::Mesh& m, const solver::PhaseFields& f,
                                           const post::StudyResult& r, const std::vector<int>& steps,
                                           double frequency, Progress& progress) {
  std::vector<post::CollectionEntry> entries;
  std::vector<std::string> files;
  for (std::size_t i = 0; i < steps.size(); ++i) {
    progress.count("writing field files", static_cast<int>(i), static_cast<int>(steps.size()));
    const post::StepResult& s = r.steps[steps[i]];
    const std::string name = fmt::format("field_{:04d}.vtu", steps[i]);
    post::write_field_vtu(dir / name, m, solver::superpose(f, s.currents));
    entries.push_back({s.electrical_angle / (2 * std::numbers::pi * frequency), name});
    files.push_back(name);
  }
  post::write_collection(dir / "field.pvd", entries);
  files.push_back("field.pvd");
  return files;
}

/// One line on the currents when they are not a plain balanced set.
void print_drive(std::ostream& out, const solver::Supply& s, int n_phases, const DriveReport& d) {
  if (s.kind == solver::SupplyKind::balanced) return;
  if (s.kind == solver::SupplyKind::stepped_dc) {
    out << fmt::format("  stepped DC, {} states\n", s.states.size());
    return;
  }
  const auto ph = solver::supply_phasors(s, n_phases);
  if (s.kind == solver::SupplyKind::split_phase) {
    const char* unit[] = {"ohm", "H", "F"};
    const int aux = s.split.element_phase, main = 1 - aux;
    out << fmt::format("  split phase: {} {:.4g} {} in phase {}{}; its current leads phase {}'s by {:.2f} deg\n",
                       s.split.element == solver::SeriesElement::capacitor ? "capacitor"
                       : s.split.element == solver::SeriesElement::inductor ? "inductor" : "resistor",
                       d.element_value, unit[static_cast<int>(s.split.element)], post::phase_name(aux), d.element_sized ? " (sized for the best field)" : "",
                       post::phase_name(main), std::arg(ph[aux] / ph[main]) * 180 / std::numbers::pi);
  }
  const auto seq = post::sequence_components(ph);
  out << fmt::format("  current sequence components: positive {:.4g} A, negative {:.4g} A{}\n", std::abs(seq.positive),
                     std::abs(seq.negative), n_phases == 3 ? fmt::format(", zero {:.4g} A", std::abs(seq.zero)) : "");
}

void print_summary(std::ostream& out, const Case& c, const mesh::Winding& w, const post::StudyResult& r,
                   const solver::Supply& supply, const DriveReport& drive, const fs::path& dir,
                   const std::string& model) {
  const post::RotationMetrics& x = r.metrics;
  const auto k = mesh::winding_factors(w, 1)[0];
  out << fmt::format("{}\n", c.title);
  out << fmt::format("  {} {}, {} poles, {} phases, q = {:.4g}, winding factor {:.4f}\n", c.geometry.stator.n_slots,
                     c.geometry.stator.kind == mesh::StatorKind::salient    ? "salient poles"
                     : c.geometry.stator.kind == mesh::StatorKind::slotless ? "winding sectors"
                                                                             : "slots",
                     c.winding.n_poles, c.winding.n_phases, w.slots_per_pole_per_phase(), k.from_layout);
  out << fmt::format("  air-gap B_r fundamental   {:.4f} T   amplitude ripple {:.4f} %\n", x.mean_fundamental,
                     100 * x.amplitude_ripple);
  out << fmt::format("  peak |B_r|                {:.4f} .. {:.4f} T   peak-field ripple {:.2f} %\n", x.min_peak,
                     x.max_peak, 100 * x.peak_ripple);
  out << fmt::format("  rotation                  {:.3f} deg per step expected, worst deviation {:.4f} deg\n",
                     x.expected_step_deg, x.rotation_uniformity_deg);
  out << fmt::format("  backward/forward ratio    {:.4f} ({})   harmonic distortion {:.2f} %\n",
                     x.backward_forward_ratio, x.forward >= x.backward ? "turning counter-clockwise" : "turning clockwise",
                     100 * x.mean_distortion);
  print_drive(out, supply, c.winding.n_phases, drive);
  out << fmt::format("  solved on {}\n", model);
  out << fmt::format("  results in {}\n", dir.string());
  out << "  " << post::kSafetyCaution << "\n";
}

}  // namespace

std::optional<mesh::SectorChoice> model_sector(const Case& c, const mesh::Winding& w) {
  const auto& g = c.geometry;
  // Sector meshes are checked (tests/post/test_sector_field.cpp, tests/solver/test_sector.cpp) on
  // slotted stators with smooth or magnet rotors; the rest stays on the full model for now.
  const bool checked = g.stator.kind == mesh::StatorKind::slotted && !g.stator.open_boundary &&
                       (g.rotor.kind == mesh::RotorKind::iron || g.rotor.kind == mesh::RotorKind::surface_magnet) &&
                       g.rotor.sleeve_thickness == 0.0;
  if (c.full_model || !checked || c.study.kind == post::StudyKind::eddy_currents) return std::nullopt;
  return mesh::choose_sector(g, w);
}

std::string model_description(const mesh::Mesh& m) {
  if (m.symmetry.copies == 1) return "the whole cross-section";
  return fmt::format("one sector, 1/{} of the machine, with {} boundaries", m.symmetry.copies,
                     m.symmetry.anti_periodic ? "anti-periodic" : "periodic");
}

post::ReportContext report_context(const Case& c, const mesh::Mesh& m, const mesh::Winding& w) {
  post::ReportContext x;
  x.title = c.title;
  x.study = post::study_kind_name(c.study.kind);
  x.model = model_description(m);
  x.inputs_json = case_to_json(c);
  x.pole_pairs = c.winding.pole_pairs();
  x.winding_factor = mesh::layout_winding_factor(w, 0, w.spec.pole_pairs());
  return x;
}

void check_report_step(const Case& c, int report_step) {
  const bool eddy = c.study.kind == post::StudyKind::eddy_currents;
  const int n = eddy ? static_cast<int>(c.study.rotor_speeds.size()) : c.study.n_steps;
  if (report_step < 0 || report_step >= n)
    throw InputError(fmt::format("--report-step {}: expected a {} from 0 to {} (the study has {} {})", report_step,
                                 eddy ? "speed number" : "step", n - 1, n, eddy ? "rotor speeds" : "steps"));
}

MeshedCase mesh_and_wind(const Case& c) {
  mesh::Winding w = mesh::lay_out(c.winding, c.geometry.stator);
  mesh::MeshControls controls = c.mesh;
  if (const auto sector = model_sector(c, w)) controls = mesh::with_sector(controls, *sector);
  return {mesh::build(c.geometry, mesh::slot_layers(c.winding), controls), std::move(w)};
}

Headline run_case(const Case& c, const RunOptions& options, std::ostream& out) {
  Progress progress;
  post::RunRecord record;
  auto t = Clock::now();
  progress.stage("meshing");
  const auto [m, w] = mesh_and_wind(c);
  record.seconds.push_back({"mesh", seconds_since(t)});

  progress.stage(fmt::format("solving {} phase fields", c.winding.n_phases));
  const solver::PhaseFields fields = solve_phase_fields(m, w, c.materials);
  record.stats = fields.stats;
  record.seconds.push_back({"assemble", fields.stats.assemble_seconds});
  record.seconds.push_back({"analyse", fields.stats.analyse_seconds});
  record.seconds.push_back({"factorize", fields.stats.factorize_seconds});
  record.seconds.push_back({"solve", fields.stats.solve_seconds});

  DriveReport drive;
  const solver::Supply supply = resolve_supply(c, m, w, fields, drive);
  t = Clock::now();
  progress.stage("post-processing");
  const post::StudyResult r = post::phase_sweep(m, w, fields, supply, c.study);
  record.seconds.push_back({"post", seconds_since(t)});

  t = Clock::now();
  const fs::path& dir = options.out_dir;
  post::prepare_result_folder(dir);
  post::write_steps_table(dir / "steps.csv", r, c.supply.frequency);
  post::write_gap_table(dir / "gap_field.csv", r);
  post::write_harmonics_table(dir / "harmonics.csv", r, c.winding.pole_pairs());
  post::write_poles_table(dir / "poles.csv", r);
  post::write_winding_tables(dir, w, 13);
  record.files = {"steps.csv", "gap_field.csv", "harmonics.csv", "poles.csv", "winding.csv", "winding_factors.csv"};
  const int n_files = options.all_field_files ? c.study.n_steps : c.study.n_field_files;
  if (n_files > 0) {
    const auto vtu = write_field_files(dir, m, fields, r, post::field_file_steps(c.study.n_steps, n_files),
                                       c.supply.frequency, progress);
    record.files.insert(record.files.end(), vtu.begin(), vtu.end());
  }
  post::write_regions_table(dir / "regions.csv", m);
  post::ReportContext report = report_context(c, m, w);
  const post::StepResult& shown = r.steps[options.report_step];
  report.section = {&m, post::flux_density_magnitude(m, solver::superpose(fields, shown.currents)),
                    fmt::format("step {} (ωt = {:.4g}° el.)", options.report_step,
                                shown.electrical_angle * 180 / std::numbers::pi)};
  post::write_report(dir, post::phase_study_page(report, r));
  record.files.insert(record.files.end(), {"regions.csv", "report.html"});
  record.seconds.push_back({"write", seconds_since(t)});
  progress.finish();

  record.version = kVersion;
  record.inputs_json = report.inputs_json;
  record.drive_json = drive_to_json(supply, c.winding.n_phases, drive);
  record.mesh = &m;
  record.winding = &w;
  record.study = &r;
  post::write_summary(dir / "summary.json", record);
  print_summary(out, c, w, r, supply, drive, dir, model_description(m));
  return {r.metrics, mesh::layout_winding_factor(w, 0, w.spec.pole_pairs())};
}

void mesh_case(const Case& c, const fs::path& out_dir, std::ostream& out) {
  Progress progress;
  progress.stage("meshing");
  const mesh::Mesh m = mesh_and_wind(c).mesh;
  progress.finish();
  std::error_code ec;
  fs::create_directories(out_dir, ec);
  if (ec) throw post::OutputError("could not create the output folder " + out_dir.string() + ": " + ec.message());
  post::write_mesh_vtu(out_dir / "mesh.vtu", m);
  post::write_regions_table(out_dir / "regions.csv", m);
  out << fmt::format("{} nodes, {} triangles, {} regions, {} nodes on the sliding circle; {}\n", m.n_nodes(),
                     m.n_triangles(), m.regions.size(), m.sliding.stator_nodes.size(), model_description(m));
  out << fmt::format("wrote {} and {}\n", (out_dir / "mesh.vtu").string(), (out_dir / "regions.csv").string());
}

}  // namespace tf::app
