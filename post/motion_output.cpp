#include "post/motion_output.hpp"

#include <cmath>
#include <numbers>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "post/atomic_file.hpp"
#include "post/summary.hpp"
#include "post/tables.hpp"
#include "post/vtu.hpp"

namespace tf::post {
namespace {

using nlohmann::json;
constexpr double kDeg = 180.0 / std::numbers::pi;

void write_torque_table(const std::filesystem::path& path, const MotionResult& r) {
  write_atomically(path, [&](std::ostream& out) {
    const int n = static_cast<int>(r.steps.front().flux_linkage.size());
    out << "step,rotor_angle_deg,torque_arkkio_Nm,torque_circle_Nm,torque_virtual_work_Nm";
    for (int k = 0; k < n; ++k) out << ",flux_linkage_" << phase_name(k) << "_Wb";
    out << ",flux_d_Wb,flux_q_Wb";
    for (int k = 0; k < n; ++k) out << ",emf_" << phase_name(k) << "_V";
    out << ",newton_iterations,newton_residual\n";
    for (std::size_t k = 0; k < r.steps.size(); ++k) {
      const PositionStep& s = r.steps[k];
      out << fmt::format("{},{:.10g},{:.10g},{:.10g},{:.10g}", k, s.rotor_angle * kDeg, s.torque_arkkio,
                         s.torque_circle, s.torque_virtual_work);
      for (double psi : s.flux_linkage) out << fmt::format(",{:.10g}", psi);
      out << fmt::format(",{:.10g},{:.10g}", s.flux_d, s.flux_q);
      for (double e : s.back_emf) out << fmt::format(",{:.10g}", e);
      out << ',' << s.newton_iterations << ',' << fmt::format("{:.3g}", s.newton_residual) << '\n';
    }
  });
}

void write_inductance_table(const std::filesystem::path& path, const MotionResult& r) {
  write_atomically(path, [&](std::ostream& out) {
    const int n = static_cast<int>(r.steps.front().inductance_frozen.rows());
    out << "step,rotor_angle_deg";
    for (const char* kind : {"apparent", "incremental"})
      for (int i = 0; i < n; ++i)
        for (int j = 0; j < n; ++j) out << ",L_" << kind << '_' << phase_name(i) << phase_name(j) << "_H";
    out << '\n';
    for (std::size_t k = 0; k < r.steps.size(); ++k) {
      const PositionStep& s = r.steps[k];
      out << k << ',' << fmt::format("{:.10g}", s.rotor_angle * kDeg);
      for (const Eigen::MatrixXd* l : {&s.inductance_frozen, &s.inductance_incremental})
        for (int i = 0; i < n; ++i)
          for (int j = 0; j < n; ++j) out << fmt::format(",{:.10g}", (*l)(i, j));
      out << '\n';
    }
  });
}

json torque_json(const TorqueStats& t) {
  return {{"mean_Nm", t.mean}, {"min_Nm", t.min}, {"max_Nm", t.max}, {"peak_to_peak_Nm", t.peak_to_peak},
          {"ripple", std::isnan(t.ripple) ? json(nullptr) : json(t.ripple)}};
}

/// Mean of the per-step matrices [H].
json mean_inductances(const MotionResult& r, bool incremental) {
  Eigen::MatrixXd sum = Eigen::MatrixXd::Zero(r.steps.front().inductance_frozen.rows(), r.steps.front().inductance_frozen.cols());
  for (const auto& s : r.steps) sum += incremental ? s.inductance_incremental : s.inductance_frozen;
  sum /= static_cast<double>(r.steps.size());
  json rows = json::array();
  for (Eigen::Index i = 0; i < sum.rows(); ++i) {
    json row = json::array();
    for (Eigen::Index j = 0; j < sum.cols(); ++j) row.push_back(sum(i, j));
    rows.push_back(row);
  }
  return rows;
}

}  // namespace

std::vector<std::string> write_motion_tables(const std::filesystem::path& dir, const MotionResult& r,
                                             const mesh::Winding& w, double frequency) {
  write_steps_table(dir / "steps.csv", r.gap, frequency);
  write_gap_table(dir / "gap_field.csv", r.gap);
  write_harmonics_table(dir / "harmonics.csv", r.gap, w.spec.pole_pairs());
  write_poles_table(dir / "poles.csv", r.gap);
  write_winding_tables(dir, w, 13);
  write_torque_table(dir / "torque.csv", r);
  write_inductance_table(dir / "inductances.csv", r);
  return {"steps.csv", "gap_field.csv", "harmonics.csv", "poles.csv", "winding.csv", "winding_factors.csv",
          "torque.csv", "inductances.csv"};
}

double drawn_rotor_angle(const mesh::Mesh& m, double rotor_angle) {
  const double sector = 2 * std::numbers::pi / m.symmetry.copies;
  return rotor_angle - std::floor(rotor_angle / sector) * sector;
}

std::vector<std::string> write_motion_fields(const std::filesystem::path& dir, const mesh::Mesh& m,
                                             const MotionResult& r, const std::vector<int>& steps,
                                             const std::vector<Eigen::VectorXd>& fields,
                                             const std::vector<double>& step_time) {
  std::vector<std::string> files;
  if (steps.empty()) return files;
  std::vector<CollectionEntry> entries;
  const std::vector<bool> rotor = mesh::rotor_side_nodes(m);
  for (std::size_t i = 0; i < steps.size(); ++i) {
    const int k = steps[i];
    const std::string name = fmt::format("field_{:04d}.vtu", k);
    // A sector model draws its rotor piece turned back by whole sectors into the stator's sector,
    // showing the image of the field there (the sign flips once per sector when anti-periodic).
    const double sector = 2 * std::numbers::pi / m.symmetry.copies;
    const double turns = std::floor(r.steps[k].rotor_angle / sector);
    Eigen::VectorXd a = fields[i];
    if (m.symmetry.sign_of_copy(static_cast<int>(turns) % 2 == 0 ? 0 : 1) < 0)
      for (int node = 0; node < m.n_nodes(); ++node)
        if (rotor[static_cast<std::size_t>(node)]) a(node) = -a(node);
    write_field_vtu(dir / name, mesh::with_rotor_turned(m, drawn_rotor_angle(m, r.steps[k].rotor_angle)), a);
    entries.push_back({step_time[k], name});
    files.push_back(name);
  }
  write_collection(dir / "field.pvd", entries);
  files.push_back("field.pvd");
  return files;
}

void write_iron_loss(const std::filesystem::path& dir, const mesh::Mesh& m, const IronLoss& loss) {
  write_atomically(dir / "iron_loss.csv", [&](std::ostream& out) {
    out << "region,iron_loss_W\n";
    for (std::size_t i = 0; i < m.regions.size(); ++i)
      if (loss.region_loss[i] > 0.0) out << m.regions[i].name << ',' << fmt::format("{:.8g}", loss.region_loss[i]) << '\n';
    out << "total," << fmt::format("{:.8g}", loss.total) << '\n';
  });
  write_cell_field_vtu(dir / "iron_loss.vtu", m, "iron_loss_W_per_m3", loss.density);
}

void write_motion_summary(const std::filesystem::path& path, const MotionRecord& rec) {
  const MotionResult& r = *rec.result;
  json j;
  j["mesh"] = {{"nodes", rec.mesh->n_nodes()},
               {"triangles", rec.mesh->n_triangles()},
               {"sliding_circle_nodes", rec.mesh->sliding.stator_nodes.size() * rec.mesh->symmetry.copies},
               {"sector_copies", rec.mesh->symmetry.copies},
               {"anti_periodic", rec.mesh->symmetry.anti_periodic},
               {"rotor_step_resolution_deg", 360.0 / static_cast<double>(rec.mesh->sliding.stator_nodes.size() *
                                                                  static_cast<std::size_t>(rec.mesh->symmetry.copies))}};
  j["torque"] = {{"arkkio", torque_json(r.arkkio)},
                 {"circle", torque_json(r.circle)},
                 {"virtual_work", torque_json(r.virtual_work)},
                 {"method", "Arkkio: Maxwell stress averaged over the gap band (main value); circle: Maxwell stress "
                            "on the mid-gap circle; virtual work: co-energy difference of the rotor turned one "
                            "sliding-circle pitch either way, currents held"}};
  j["cogging_period_deg"] = {{"expected", r.cogging_period_expected * kDeg},
                             {"from_torque", r.cogging_period_measured * kDeg}};
  j["load_angle_deg"] = rec.load_angle * kDeg;
  if (!rec.sampling_warning.empty()) j["warnings"] = {rec.sampling_warning};
  j["speed_rad_per_s"] = r.speed;
  j["inductance_H"] = {{"apparent_mean", mean_inductances(r, false)},
                       {"incremental_mean", mean_inductances(r, true)},
                       {"method", "apparent: frozen (secant) permeability; incremental: differential permeability "
                                  "of the converged state; flux linkage of 1 A per phase, 2D part only"}};
  j["field"] = {{"fundamental_T", r.gap.metrics.mean_fundamental}, {"peak_field_ripple", r.gap.metrics.peak_ripple}};
  j["solver"] = {{"unknowns", rec.stats.n_dofs},
                 {"solves", rec.stats.n_solves},
                 {"newton_iterations_per_solve", r.mean_newton_iterations},
                 {"analyse_seconds", rec.stats.analyse_seconds},
                 {"solve_seconds", rec.stats.solve_seconds}};
  if (!r.iron_loss.empty()) {
    json loss = json::object();
    double total = 0.0;
    for (const auto& [region, watts] : r.iron_loss) loss[region] = watts, total += watts;
    j["iron_loss_W"] = {{"total", total},
                        {"per_region", loss},
                        {"method", "Steinmetz-type law per time harmonic and Cartesian component of B in each "
                                   "triangle over one electrical period (a common approximation; no excess loss)"}};
  }
  write_summary_document(path, j.dump(), rec.version, rec.inputs_json, rec.seconds, rec.files);
}

}  // namespace tf::post
