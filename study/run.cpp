#include "study/run.hpp"

#include <algorithm>

#include <fmt/format.h>

#include "input/case_json.hpp"
#include "input/input_error.hpp"
#include "post/atomic_file.hpp"
#include "post/field_drawing.hpp"
#include "post/tables.hpp"
#include "post/vtu.hpp"
#include "solver/stopwatch.hpp"
#include "study/mesh_plan.hpp"

namespace tf::study {
namespace {

namespace fs = std::filesystem;

Solved solve(Strategy s, const StudyInput& in) {
  switch (s) {
    case Strategy::superposition: return solve_by_superposition(in);
    case Strategy::step_by_step: return solve_step_by_step(in);
    case Strategy::motion_term: return solve_by_motion_term(in);
    case Strategy::slip_method: return solve_by_slip_method(in);
  }
  return {};
}

/// "24 slots, 4 poles, 3 phases, q = 2, winding factor 0.9330".
std::string machine_line(const input::Case& c, const mesh::Winding& w) {
  const auto k = mesh::winding_factors(w, 1)[0];
  const auto kind = c.geometry.stator.kind;
  return fmt::format("{} {}, {} poles, {} phases, q = {:.4g}, winding factor {:.4f}", c.geometry.stator.n_positions,
                     kind == mesh::StatorKind::salient    ? "salient poles"
                     : kind == mesh::StatorKind::slotless ? "winding sectors"
                                                          : "slots",
                     c.winding.n_poles, c.winding.n_phases, w.slots_per_pole_per_phase(), k.from_layout);
}

/// The record's core and the bodies the strategy solved (pointing into `s`).
post::RunRecord make_record(const input::Case& c, const MeshedCase& mc, Strategy strategy, const Solved& s) {
  post::RunRecord r;
  r.title = c.title;
  r.version = kVersion;
  r.study = input::study_kind_name(c.study.kind);
  r.strategy = strategy_description(strategy);
  r.inputs_json = input::case_to_json(c);
  r.model = model_description(mc.mesh);
  r.machine = machine_line(c, mc.winding);
  r.frequency = c.supply.frequency;
  r.mesh = &mc.mesh;
  r.winding = &mc.winding;
  r.solver = s.solver;
  r.warnings = s.warnings;
  r.notes = s.notes;
  r.field = s.field ? &*s.field : nullptr;
  r.field_rotates = s.field_rotates;
  r.drive_json = s.drive_json;
  r.motion = s.motion ? &*s.motion : nullptr;
  r.rotor_turns = s.rotor_turns;
  r.load_angle = s.load_angle;
  r.eddy = s.eddy ? &*s.eddy : nullptr;
  return r;
}

/// Every file of the result folder; summary.json last, so its presence marks a complete folder.
void write_outputs(const fs::path& dir, const input::Case& c, const MeshedCase& mc, const Solved& s,
                   post::RunRecord& r) {
  post::prepare_result_folder(dir);
  r.files = post::write_result_tables(dir, r);
  if (s.write_extra)
    for (auto& name : s.write_extra(dir)) r.files.push_back(std::move(name));
  for (auto& name : post::write_field_series(dir, s.frames)) r.files.push_back(std::move(name));
  // The regions of the whole machine the field files draw, with the ids their "region" arrays use.
  post::write_regions_table(dir / "regions.csv", post::drawing_as_mesh(post::field_drawing(mc.mesh, c.geometry, &mc.winding)));
  post::ReportContext report{c.title, r.study, r.model, r.inputs_json, c.winding.pole_pairs(),
                             mesh::layout_winding_factor(mc.winding, 0, c.winding.pole_pairs()), s.section};
  post::write_report(dir, post::study_page(report, r));
  r.files.insert(r.files.end(), {"regions.csv", "report.html"});
}

}  // namespace

void check_report_step(const input::Case& c, int report_step) {
  const bool eddy = c.study.kind == input::StudyKind::eddy_currents;
  const int n = eddy ? static_cast<int>(c.study.rotor_speeds.size()) : c.study.n_steps;
  if (report_step < 0 || report_step >= n)
    throw input::InputError(fmt::format("--report-step {}: expected a {} from 0 to {} (the study has {} {})",
                                        report_step, eddy ? "speed number" : "step", n - 1, n,
                                        eddy ? "rotor speeds" : "steps"));
}

std::vector<int> field_steps(const StudyInput& in, int n_steps) {
  const int n_files = in.options.all_field_files ? n_steps : std::min(n_steps, in.c.study.n_field_files);
  return n_files > 0 ? post::field_file_steps(n_steps, n_files) : std::vector<int>{};
}

RunOutcome run_study(const input::Case& c, const RunOptions& options, std::ostream& out) {
  Progress progress;
  post::StageTimes seconds;
  const Strategy strategy = choose_strategy(c);
  progress.stage("meshing");
  const MeshedCase mc = solver::timed(seconds, "mesh", [&] { return mesh_and_wind(c); });
  const Solved solved = solve(strategy, {c, mc.mesh, mc.winding, options, progress});
  seconds.insert(seconds.end(), solved.seconds.begin(), solved.seconds.end());

  post::RunRecord record = make_record(c, mc, strategy, solved);
  progress.stage("writing files");
  solver::timed(seconds, "write", [&] { write_outputs(options.out_dir, c, mc, solved, record); });
  progress.finish();
  record.seconds = seconds;
  post::write_summary(options.out_dir / "summary.json", record);
  post::print_summary(out, record, options.out_dir);

  RunOutcome outcome{strategy, std::nullopt, mesh::layout_winding_factor(mc.winding, 0, c.winding.pole_pairs())};
  if (solved.field && solved.field_rotates) {
    outcome.field = solved.field->metrics;
    outcome.compared = post::compared_case(record);
  }
  return outcome;
}

void write_mesh(const input::Case& c, const fs::path& out_dir, std::ostream& out) {
  Progress progress;
  progress.stage("meshing");
  const MeshedCase mc = mesh_and_wind(c);
  const mesh::Mesh& m = mc.mesh;
  const post::FieldDrawing drawing = post::field_drawing(m, c.geometry, &mc.winding);
  progress.finish();
  std::error_code ec;
  fs::create_directories(out_dir, ec);
  if (ec) throw post::OutputError("could not create the output folder " + out_dir.string() + ": " + ec.message());
  post::write_mesh_vtu(out_dir / "mesh.vtu", drawing);
  post::write_regions_table(out_dir / "regions.csv", post::drawing_as_mesh(drawing));
  out << fmt::format("{} nodes, {} triangles, {} regions, {} nodes on the sliding circle; {}\n", m.n_nodes(),
                     m.n_triangles(), m.regions.size(), m.sliding.stator_nodes.size(), model_description(m));
  out << fmt::format("wrote {} (the whole machine: {} nodes, {} triangles, {} regions) and {}\n",
                     (out_dir / "mesh.vtu").string(), drawing.whole.n_nodes(), drawing.whole.n_triangles(),
                     drawing.regions.size(), (out_dir / "regions.csv").string());
}

}  // namespace tf::study
