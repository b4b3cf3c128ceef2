#include "post/summary.hpp"

#include <cmath>
#include <numbers>

#include <nlohmann/json.hpp>

#include "post/atomic_file.hpp"

namespace tf::post {
namespace {

using nlohmann::json;
constexpr double kDeg = 180.0 / std::numbers::pi;

json pole_counts(const StepResult& step) {
  int north = 0;
  for (const auto& pole : step.poles) north += pole.north ? 1 : 0;
  return {{"north", north}, {"south", static_cast<int>(step.poles.size()) - north}};
}

json field_results(const StudyResult& s, int pole_pairs) {
  const RotationMetrics& r = s.metrics;
  return {
      {"fundamental_T", r.mean_fundamental},
      {"fundamental_order", pole_pairs},
      {"amplitude_ripple", r.amplitude_ripple},
      {"peak_field_T", {{"mean", r.mean_peak}, {"min", r.min_peak}, {"max", r.max_peak}}},
      {"peak_field_ripple", r.peak_ripple},
      {"axis_step_expected_deg", r.expected_step_deg},
      {"rotation_uniformity_deg", r.rotation_uniformity_deg},
      {"forward_wave_T", r.forward},
      {"backward_wave_T", r.backward},
      {"backward_forward_ratio", r.backward_forward_ratio},
      {"rotation", r.forward >= r.backward ? "counter-clockwise" : "clockwise"},
      {"harmonic_distortion", r.mean_distortion},
      {"harmonic_method",
       "B_r harmonics from the Fourier series of nodal A on the mid-gap circle, B_r,n = n A_n / r"},
      {"steps", s.steps.size()},
      {"poles_at_first_step", pole_counts(s.steps.front())},
      {"gap_points", s.sample_angles.size()},
  };
}

json winding_summary(const mesh::Winding& w) {
  const auto f = mesh::winding_factors(w, 1)[0];
  json j = {
      {"slots_per_pole_per_phase", w.slots_per_pole_per_phase()},
      {"periodicity", w.periodicity()},
      {"series_turns_per_phase", w.series_turns()},
      {"winding_factor", f.from_layout},
      {"phase_A_axis_deg", w.phase_a_axis / w.spec.pole_pairs() * kDeg},
  };
  if (!std::isnan(f.total)) {  // closed forms exist for integral-slot windings only
    j["distribution_factor"] = f.distribution;
    j["pitch_factor"] = f.pitch;
  }
  return j;
}

}  // namespace

void write_summary(const std::filesystem::path& path, const RunRecord& r) {
  json j;
  j["mesh"] = {{"nodes", r.mesh->n_nodes()},
               {"triangles", r.mesh->n_triangles()},
               {"regions", r.mesh->regions.size()},
               {"sliding_circle_nodes", r.mesh->sliding.stator_nodes.size() * r.mesh->symmetry.copies},
               {"sector_copies", r.mesh->symmetry.copies},
               {"anti_periodic", r.mesh->symmetry.anti_periodic},
               {"sliding_circle_radius_m", r.mesh->sliding.radius}};
  j["winding"] = winding_summary(*r.winding);
  j["drive"] = json::parse(r.drive_json);
  j["field"] = field_results(*r.study, r.winding->spec.pole_pairs());
  j["solver"] = {{"unknowns", r.stats.n_dofs},
                 {"matrix_nonzeros", r.stats.n_nonzeros},
                 {"factorizations", 1},
                 {"method", "CHOLMOD supernodal Cholesky; the m unit phase fields solved as one block, steps superposed"}};
  write_summary_document(path, j.dump(), r.version, r.inputs_json, r.seconds, r.files);
}

void write_summary_document(const std::filesystem::path& path, const std::string& body_json, const std::string& version,
                            const std::string& inputs_json,
                            const std::vector<std::pair<std::string, double>>& seconds,
                            const std::vector<std::string>& files) {
  json j = {{"program", "turnfield"}, {"version", version}, {"caution", kSafetyCaution},
            {"inputs", json::parse(inputs_json)}};
  j.update(json::parse(body_json));
  json stages = json::object();
  for (const auto& [stage, s] : seconds) stages[stage] = s;
  j["seconds"] = stages;
  j["files"] = files;
  write_atomically(path, [&](std::ostream& out) { out << j.dump(2) << '\n'; });
}

}  // namespace tf::post
