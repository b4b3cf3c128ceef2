#include "post/eddy_output.hpp"

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

double rpm(double rad_s) { return rad_s * 30.0 / std::numbers::pi; }

json headline(const std::vector<SpeedResult>& rows) {
  const SpeedResult* peak = &rows.front();
  const SpeedResult* standstill = nullptr;
  for (const auto& r : rows) {
    if (std::abs(r.torque) > std::abs(peak->torque)) peak = &r;
    if (r.rotor_speed == 0.0) standstill = &r;
  }
  json j = {{"peak_torque_N_m", peak->torque}, {"peak_torque_speed_rad_s", peak->rotor_speed}};
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

json slip_method(const EddyRecord& r) {
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

}  // namespace

void write_torque_speed(const std::filesystem::path& path, const std::vector<SpeedResult>& rows, int) {
  write_atomically(path, [&](std::ostream& o) {
    const bool slip = !rows.front().components.empty();
    o << "speed_rad_s,speed_rpm,slip,torque_N_m," << (slip ? "torque_gap_power_N_m" : "torque_lorentz_N_m")
      << ",rotor_loss_W,rotor_loss_balance_W,stator_loss_W,input_power_W,mechanical_power_W";
    const std::size_t m = rows.front().emf_rms.size();
    for (std::size_t k = 0; k < m; ++k) o << ",emf_" << phase_name(static_cast<int>(k)) << "_V_rms";
    if (slip)
      for (const char* c : {"forward", "backward"})
        o << fmt::format(",slip_{0},torque_{0}_N_m,rotor_loss_{0}_W", c);
    o << '\n';
    for (const auto& r : rows) {
      o << fmt::format("{:.10g},{:.10g},{:.10g},{:.10g},{:.10g},{:.10g},{:.10g},{:.10g},{:.10g},{:.10g}", r.rotor_speed,
                       rpm(r.rotor_speed), r.slip, r.torque, r.torque_lorentz, r.rotor_loss, r.rotor_loss_balance,
                       r.stator_loss, r.input_power, r.torque * r.rotor_speed);
      for (double e : r.emf_rms) o << fmt::format(",{:.10g}", e);
      for (const auto& c : r.components) o << fmt::format(",{:.10g},{:.10g},{:.10g}", c.slip, c.torque, c.rotor_loss);
      o << '\n';
    }
  });
}

void write_eddy_summary(const std::filesystem::path& path, const EddyRecord& r) {
  json speeds = json::array();
  for (const auto& s : *r.rows) {
    const double balance = s.input_power - s.rotor_loss - s.stator_loss - s.torque_lorentz * s.rotor_speed;
    speeds.push_back({{"speed_rad_s", s.rotor_speed}, {"slip", s.slip}, {"torque_N_m", s.torque},
                      {s.components.empty() ? "torque_lorentz_N_m" : "torque_gap_power_N_m", s.torque_lorentz},
                      {"rotor_loss_W", s.rotor_loss},
                      {"rotor_loss_balance_W", s.rotor_loss_balance}, {"region_loss_W", s.region_loss},
                      {"stator_loss_W", s.stator_loss}, {"input_power_W", s.input_power},
                      {"power_balance_relative", s.input_power != 0.0 ? balance / s.input_power : 0.0},
                      {"emf_V_rms", s.emf_rms}});
    if (!s.components.empty()) speeds.back()["components"] = components(s.components);
  }
  json j;
  j["mesh"] = {{"nodes", r.mesh->n_nodes()}, {"triangles", r.mesh->n_triangles()}, {"regions", r.mesh->regions.size()}};
  j["eddy_currents"] = {{"speeds", speeds},
                        {"headline", headline(*r.rows)},
                        {"torque_method", r.rows->front().components.empty()
                                              ? "Arkkio: Maxwell stress averaged over the whole gap band; "
                                                "torque_lorentz from the induced currents, a cross-check"
                                              : "Arkkio: Maxwell stress averaged over the whole gap band; "
                                                "torque_gap_power from each wave's input power, a cross-check"}};
  j["eddy_currents"]["rotor_motion"] = r.method;
  if (!r.rows->front().components.empty()) j["eddy_currents"]["slip_method"] = slip_method(r);
  j["skin_depths"] = json::array();
  for (const auto& d : r.skin)
    j["skin_depths"].push_back({{"region", d.region}, {"skin_depth_m", d.depth}, {"at_frequency_Hz", d.frequency},
                                {"largest_element_m", d.element_size}, {"mesh_too_coarse", d.too_coarse}});
  j["solver"] = {{"unknowns", r.stats.n_dofs},
                 {"method", "UMFPACK complex LU; one symbolic analysis, one factorization per speed"},
                 {"analyse_s", r.stats.analyse_seconds},
                 {"factorize_s", r.stats.factorize_seconds},
                 {"solve_s", r.stats.solve_seconds}};
  write_summary_document(path, j.dump(), r.version, r.inputs_json, r.seconds, r.files);
}

}  // namespace tf::post
