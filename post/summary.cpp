#include "post/summary.hpp"

#include <cmath>
#include <numbers>

#include <nlohmann/json.hpp>

#include "post/atomic_file.hpp"

namespace tf::post {
namespace {

using nlohmann::json;
constexpr double kDeg = 180.0 / std::numbers::pi;

// ---- the air-gap field ----

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

/// Only the level of the field, for steps over which the stator field does not turn.
json field_level(const StudyResult& s) {
  return {{"fundamental_T", s.metrics.mean_fundamental}, {"peak_field_ripple", s.metrics.peak_ripple}};
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

json mesh_summary(const RunRecord& r) {
  const mesh::Mesh& m = *r.mesh;
  const auto sliding = m.sliding.stator_nodes.size() * static_cast<std::size_t>(m.symmetry.copies);
  json j = {{"nodes", m.n_nodes()},
            {"triangles", m.n_triangles()},
            {"regions", m.regions.size()},
            {"sliding_circle_nodes", sliding},
            {"sector_copies", m.symmetry.copies},
            {"anti_periodic", m.symmetry.anti_periodic},
            {"sliding_circle_radius_m", m.sliding.radius}};
  if (r.motion && r.rotor_turns) j["rotor_step_resolution_deg"] = 360.0 / static_cast<double>(sliding);
  return j;
}

json solver_summary(const SolverSummary& s) {
  json j = {{"unknowns", s.n_unknowns}, {"method", s.method}};
  if (s.n_nonzeros >= 0) j["matrix_nonzeros"] = s.n_nonzeros;
  if (s.n_factorizations >= 0) j["factorizations"] = s.n_factorizations;
  if (s.n_solves >= 0) j["solves"] = s.n_solves;
  if (std::isfinite(s.newton_iterations_per_solve)) j["newton_iterations_per_solve"] = s.newton_iterations_per_solve;
  if (s.newton_iterations_max >= 0) j["newton_iterations_max"] = s.newton_iterations_max;
  if (s.n_analyses >= 0) j["symbolic_analyses"] = s.n_analyses;
  for (const auto& [part, seconds] : s.seconds) j[part + "_s"] = seconds;
  return j;
}

// ---- rotor motion and step-by-step solutions ----

json torque_json(const TorqueStats& t) {
  return {{"mean_N_m", t.mean}, {"min_N_m", t.min}, {"max_N_m", t.max}, {"peak_to_peak_N_m", t.peak_to_peak},
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

json inductance_summary(const MotionResult& r) {
  return {{"apparent_mean", mean_inductances(r, false)},
          {"incremental_mean", mean_inductances(r, true)},
          {"method", "apparent: frozen (secant) permeability; incremental: differential permeability "
                     "of the converged state; flux linkage of 1 A per phase, 2D part only"}};
}

void add_motion(json& j, const RunRecord& rec) {
  const MotionResult& r = *rec.motion;
  if (rec.rotor_turns) {
    j["torque"] = {{"arkkio", torque_json(r.arkkio)},
                   {"circle", torque_json(r.circle)},
                   {"virtual_work", torque_json(r.virtual_work)},
                   {"method", "Arkkio: Maxwell stress averaged over the gap band (main value); circle: Maxwell "
                              "stress on the mid-gap circle; virtual work: the derivative of the "
                              "co-energy under a virtual rotation of the rotor, currents held, from the deformed gap layer "
                              "(local virtual work)"}};
    j["cogging_period_deg"] = {{"expected", r.cogging_period_expected * kDeg},
                               {"from_torque", r.cogging_period_measured * kDeg}};
    j["load_angle_deg"] = rec.load_angle * kDeg;
    j["speed_rad_per_s"] = r.speed;
  }
  j["inductance_H"] = inductance_summary(r);
  if (!r.iron_loss.empty()) {
    json loss = json::object();
    double total = 0.0;
    for (const auto& [region, watts] : r.iron_loss) loss[region] = watts, total += watts;
    j["iron_loss_W"] = {{"total", total},
                        {"per_region", loss},
                        {"method", "Steinmetz-type law per time harmonic and Cartesian component of B in each "
                                   "triangle over one electrical period (a common approximation; no excess loss)"}};
  }
}

// ---- eddy currents ----

json headline(const std::vector<SpeedResult>& rows) {
  const SpeedResult* peak = &rows.front();
  const SpeedResult* standstill = nullptr;
  for (const auto& r : rows) {
    if (std::abs(r.torque) > std::abs(peak->torque)) peak = &r;
    if (r.rotor_speed == 0.0) standstill = &r;
  }
  json j = {{"peak_torque_N_m", peak->torque}, {"peak_torque_speed_rad_per_s", peak->rotor_speed}};
  if (standstill) j["locked_rotor_torque_N_m"] = standstill->torque;
  return j;
}

json components(const std::vector<SlipComponentResult>& parts) {
  json out = json::array();
  const char* names[] = {"forward", "backward"};
  for (std::size_t k = 0; k < parts.size(); ++k) {
    const auto& c = parts[k];
    out.push_back({{"wave", names[k % 2]}, {"slip", c.slip}, {"torque_N_m", c.torque},
                   {"torque_gap_power_N_m", c.torque_energy}, {"rotor_loss_W", c.rotor_loss},
                   {"gap_power_W", c.gap_power}, {"input_power_W", c.input_power},
                   {"slip_times_gap_power_W", c.slip * c.gap_power}});
  }
  return out;
}

json slip_method(const EddyResult& r) {
  json j = {{"note", "torques and rotor losses of the two components add; their cross terms pulsate at twice the "
                     "supply frequency and average to zero. Flux linkages add as phasors at the supply frequency. "
                     "Every space harmonic of the stator is solved at the fundamental's slip: exact for the "
                     "fundamental only."},
            {"unmodelled_current_A", r.unmodelled_current},
            {"unmodelled_current_note", "phase currents without a rotating fundamental (zero sequence), left out"}};
  if (r.end_ring_factor)
    j["end_ring_factor"] = {{"value", *r.end_ring_factor},
                            {"note", "bar conductivity scaled by R_bar / (R_bar + R_ring / (2 sin^2(pi p / N))); "
                                     "exact for the fundamental only"}};
  else
    j["end_rings"] = "ideal (no resistance)";
  return j;
}

json speed_row(const SpeedResult& s) {
  const double balance = s.input_power - s.rotor_loss - s.stator_loss - s.torque_lorentz * s.rotor_speed;
  json row = {{"speed_rad_per_s", s.rotor_speed}, {"slip", s.slip}, {"torque_N_m", s.torque},
              {s.components.empty() ? "torque_lorentz_N_m" : "torque_gap_power_N_m", s.torque_lorentz},
              {"rotor_loss_W", s.rotor_loss},
              {"rotor_loss_balance_W", s.rotor_loss_balance}, {"region_loss_W", s.region_loss},
              {"stator_loss_W", s.stator_loss}, {"input_power_W", s.input_power},
              {"power_balance_relative", s.input_power != 0.0 ? balance / s.input_power : 0.0},
              {"emf_V_rms", s.emf_rms}};
  if (!s.components.empty()) row["components"] = components(s.components);
  return row;
}

void add_eddy(json& j, const EddyResult& r) {
  json speeds = json::array();
  for (const auto& s : r.rows) speeds.push_back(speed_row(s));
  j["eddy_currents"] = {{"speeds", speeds},
                        {"headline", headline(r.rows)},
                        {"torque_method", r.slip_method
                                              ? "Arkkio: Maxwell stress averaged over the whole gap band; "
                                                "torque_gap_power from each wave's input power, a cross-check"
                                              : "Arkkio: Maxwell stress averaged over the whole gap band; "
                                                "torque_lorentz from the induced currents, a cross-check"},
                        {"rotor_motion", r.method}};
  if (r.slip_method) j["eddy_currents"]["slip_method"] = slip_method(r);
  j["skin_depths"] = json::array();
  for (const auto& d : r.skin)
    j["skin_depths"].push_back({{"region", d.region}, {"skin_depth_m", d.depth}, {"at_frequency_Hz", d.frequency},
                                {"largest_element_m", d.element_size}, {"mesh_too_coarse", d.too_coarse}});
}

}  // namespace

void write_summary(const std::filesystem::path& path, const RunRecord& r) {
  json j = {{"program", "turnfield"}, {"version", r.version}, {"caution", kSafetyCaution},
            {"inputs", json::parse(r.inputs_json)}};
  j["study"] = {{"kind", r.study}, {"solved_by", r.strategy}, {"model", r.model}};
  j["mesh"] = mesh_summary(r);
  j["winding"] = winding_summary(*r.winding);
  if (!r.drive_json.empty()) j["drive"] = json::parse(r.drive_json);
  if (r.field)
    j["field"] = r.field_rotates ? field_results(*r.field, r.winding->spec.pole_pairs()) : field_level(*r.field);
  if (r.motion) add_motion(j, r);
  if (r.eddy) add_eddy(j, *r.eddy);
  if (!r.warnings.empty()) j["warnings"] = r.warnings;
  j["solver"] = solver_summary(r.solver);
  json stages = json::object();
  for (const auto& [stage, s] : r.seconds) stages[stage] = s;
  j["seconds"] = stages;
  j["files"] = r.files;
  write_atomically(path, [&](std::ostream& out) { out << j.dump(2) << '\n'; });
}

}  // namespace tf::post
