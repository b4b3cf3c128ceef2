#include "post/motion_output.hpp"

#include <cmath>
#include <numbers>

#include <fmt/format.h>

#include "post/atomic_file.hpp"
#include "post/tables.hpp"
#include "post/vtu.hpp"

namespace tf::post {
namespace {

constexpr double kDeg = 180.0 / std::numbers::pi;

}  // namespace

void write_torque_table(const std::filesystem::path& path, const MotionResult& r) {
  write_atomically(path, [&](std::ostream& out) {
    const int n = static_cast<int>(r.steps.front().flux_linkage.size());
    out << "step,rotor_angle_deg,torque_arkkio_N_m,torque_circle_N_m,torque_virtual_work_N_m";
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

double drawn_rotor_angle(const mesh::Mesh& m, double rotor_angle) {
  const double sector = 2 * std::numbers::pi / m.symmetry.copies;
  return rotor_angle - std::floor(rotor_angle / sector) * sector;
}

FieldMetadata step_metadata(int step, double electrical_angle, double rotor_angle, double time,
                            const std::vector<double>& currents) {
  FieldMetadata info;
  info.numbers = {{"step", step},
                  {"electrical_angle_deg", electrical_angle * kDeg},
                  {"rotor_angle_deg", rotor_angle * kDeg},
                  {"time_s", time}};
  for (std::size_t k = 0; k < currents.size(); ++k)
    info.numbers.emplace_back("current_" + phase_name(static_cast<int>(k)) + "_A", currents[k]);
  info.texts = {{"collection_time", "time_s"}};
  return info;
}

std::vector<std::string> write_field_series(const std::filesystem::path& dir, const std::vector<FieldFrame>& frames) {
  std::vector<std::string> files;
  if (frames.empty()) return files;
  std::vector<CollectionEntry> entries;
  for (const FieldFrame& f : frames) {
    const std::string name = fmt::format("field_{:04d}.vtu", f.step);
    f.write(dir / name);
    entries.push_back({f.time, name});
    files.push_back(name);
  }
  write_collection(dir / "field.pvd", entries);
  files.push_back("field.pvd");
  return files;
}

void write_iron_loss(const std::filesystem::path& dir, const FieldDrawing& d, const IronLoss& loss) {
  const mesh::Mesh& m = d.model;
  write_atomically(dir / "iron_loss.csv", [&](std::ostream& out) {
    out << "region,iron_loss_W\n";
    for (std::size_t i = 0; i < m.regions.size(); ++i)
      if (loss.region_loss[i] > 0.0) out << m.regions[i].name << ',' << fmt::format("{:.8g}", loss.region_loss[i]) << '\n';
    out << "total," << fmt::format("{:.8g}", loss.total) << '\n';
  });
  write_cell_field_vtu(dir / "iron_loss.vtu", d, "iron_loss_W_per_m3", loss.density);
}

}  // namespace tf::post
