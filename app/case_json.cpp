#include "app/case_json.hpp"

#include <nlohmann/json.hpp>

namespace tf::app {

std::string case_to_json(const Case& c) {
  using nlohmann::json;
  const auto& s = c.geometry.stator;
  const auto& r = c.geometry.rotor;
  json slot = {{"shape", s.slot.shape == mesh::SlotShape::open ? "open" : "semi_closed"},
               {"width_m", s.slot.width},
               {"depth_m", s.slot.depth}};
  if (s.slot.shape == mesh::SlotShape::semi_closed) {
    slot["opening_m"] = s.slot.opening_width;
    slot["tip_height_m"] = s.slot.tip_height;
    slot["wedge_height_m"] = s.slot.wedge_height;
  }
  json j = {
      {"case_file", c.path},
      {"title", c.title},
      {"stack_length_m", c.stack_length},
      {"stator", {{"bore_radius_m", s.bore_radius}, {"outer_radius_m", s.outer_radius}, {"slots", s.n_slots}, {"slot", slot}}},
      {"rotor",
       {{"kind", r.kind == mesh::RotorKind::iron ? "iron" : "none"},
        {"outer_radius_m", r.outer_radius},
        {"shaft_radius_m", r.shaft_radius},
        {"air_gap_m", c.geometry.gap_length()}}},
      {"materials",
       {{"stator_iron_relative_permeability", c.materials.stator_iron_mu_r},
        {"rotor_iron_relative_permeability", c.materials.rotor_iron_mu_r},
        {"shaft_relative_permeability", c.materials.shaft_mu_r}}},
      {"winding",
       {{"phases", c.winding.n_phases},
        {"poles", c.winding.n_poles},
        {"layers", c.winding.n_layers},
        {"coil_pitch_slots", c.winding.coil_pitch},
        {"turns_per_coil", c.winding.turns_per_coil},
        {"parallel_paths", c.winding.parallel_paths}}},
      {"supply", {{"peak_current_A", c.supply.peak_current}, {"frequency_Hz", c.supply.frequency}}},
      {"study",
       {{"steps", c.study.n_steps},
        {"field_files", c.study.n_field_files},
        {"gap_points", c.study.n_gap_points},
        {"harmonics", c.study.max_harmonic}}},
      {"mesh", {{"fineness", c.mesh.fineness}}},
  };
  return j.dump();
}

}  // namespace tf::app
