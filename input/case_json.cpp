#include "input/case_json.hpp"

#include <algorithm>
#include <numbers>

#include <cmath>

#include <nlohmann/json.hpp>

namespace tf::input {
namespace {

constexpr double kDeg = 180.0 / 3.14159265358979323846;
const char* kSupplyKinds[] = {"balanced", "phasors", "stepped_dc", "split_phase"};
const char* kRotorKinds[] = {"none", "iron", "magnets", "slotted"};  // mesh::RotorKind order, case-file spelling
const char* kElements[] = {"resistor", "inductor", "capacitor"};

nlohmann::json supply_json(const solver::Supply& s) {
  nlohmann::json j = {{"kind", kSupplyKinds[static_cast<int>(s.kind)]}, {"frequency_Hz", s.frequency}};
  switch (s.kind) {
    case solver::SupplyKind::balanced: j["peak_current_A"] = s.peak_current; break;
    case solver::SupplyKind::stepped_dc: j["states_A"] = s.states; break;
    case solver::SupplyKind::phasors:
      for (const auto& p : s.phasors) {
        j["peak_currents_A"].push_back(std::abs(p));
        j["phase_angles_deg"].push_back(std::arg(p) * kDeg);
      }
      break;
    case solver::SupplyKind::split_phase:
      j["voltage_rms_V"] = s.split.voltage_rms;
      j["resistances_ohm"] = s.split.resistance;
      j["series_element"] = kElements[static_cast<int>(s.split.element)];
      j["series_phase"] = s.split.element_phase == 0 ? "A" : "B";
      if (s.split.element_value > 0.0) j["series_value"] = s.split.element_value;
      break;
  }
  return j;
}

nlohmann::json bh_json(const std::optional<solver::BhTable>& t) {
  if (!t) return nullptr;
  return {{"h_A_per_m", t->h}, {"b_T", t->b}, {"stacking_factor", t->stacking_factor}, {"source", t->source}};
}

nlohmann::json loss_json(const std::optional<solver::IronLossData>& d) {
  if (!d) return nullptr;
  return {{"hysteresis", d->hysteresis}, {"exponent", d->exponent}, {"eddy", d->eddy},
          {"density_kg_per_m3", d->density}, {"source", d->source}};
}

nlohmann::json materials_json(const solver::Materials& m) {
  return {{"stator_iron_relative_permeability", m.stator_iron_mu_r},
          {"rotor_iron_relative_permeability", m.rotor_iron_mu_r},
          {"shaft_relative_permeability", m.shaft_mu_r},
          {"sleeve_relative_permeability", m.sleeve_mu_r},
          {"stator_iron_conductivity_S_per_m", m.stator_iron_sigma},
          {"rotor_iron_conductivity_S_per_m", m.rotor_iron_sigma},
          {"shaft_conductivity_S_per_m", m.shaft_sigma},
          {"sleeve_conductivity_S_per_m", m.sleeve_sigma},
          {"magnet_remanence_T", m.magnet_remanence},
          {"magnet_recoil_permeability", m.magnet_mu_rec},
          {"bar_conductivity_S_per_m", m.bar_sigma},
          {"stator_iron_bh_curve", bh_json(m.stator_iron_bh)},
          {"rotor_iron_bh_curve", bh_json(m.rotor_iron_bh)},
          {"stator_iron_loss", loss_json(m.stator_iron_loss)},
          {"rotor_iron_loss", loss_json(m.rotor_iron_loss)}};
}

/// The rotor's magnets or bars as given.
nlohmann::json rotor_parts_json(const mesh::RotorGeometry& r) {
  if (r.kind == mesh::RotorKind::surface_magnet)
    return {{"magnets",
             {{"poles", r.magnets.n_poles},
              {"thickness_m", r.magnets.thickness},
              {"arc_deg", r.magnets.arc * 180.0 / std::numbers::pi},
              {"magnetization", r.magnets.direction == mesh::Magnetization::radial ? "radial" : "parallel"}}}};
  if (r.kind == mesh::RotorKind::slotted)
    return {{"bars",
             {{"count", r.bars.count},
              {"width_m", r.bars.width},
              {"depth_m", r.bars.depth},
              {"bridge_m", r.bars.bridge},
              {"opening_m", r.bars.opening_width}}}};
  return nlohmann::json::object();
}

/// The stator as given, with the dimensions of its kind: slots, poles or conductor sectors.
nlohmann::json stator_json(const mesh::StatorGeometry& s) {
  using nlohmann::json;
  const char* stator_kinds[] = {"slotted", "salient", "slotless"};
  json stator = {{"kind", stator_kinds[static_cast<int>(s.kind)]},
                 {"bore_radius_m", s.bore_radius},
                 {"outer_radius_m", s.outer_radius},
                 // Where A = 0 is imposed: the outer surface unless air surrounds the stator.
                 {"boundary_radius_m", std::max(s.outer_radius, s.boundary_radius)}};
  if (s.kind == mesh::StatorKind::slotless) {
    stator["belts"] = {{"count", s.n_positions},
                       {"span_deg", s.belts.span * 180.0 / std::numbers::pi},
                       {"outer_radius_m", s.belts.outer_radius}};
  } else if (s.kind == mesh::StatorKind::salient) {
    stator["poles"] = {{"count", s.n_positions},
                       {"shoe_arc_deg", s.poles.shoe_arc * 180.0 / std::numbers::pi},
                       {"shoe_height_m", s.poles.shoe_height},
                       {"body_width_m", s.poles.body_width},
                       {"body_height_m", s.poles.body_height},
                       {"coil_width_m", s.poles.coil_width},
                       {"coil_height_m", s.poles.coil_height}};
  } else {
    json slot = {{"shape", s.slot.shape == mesh::SlotShape::open ? "open" : "semi_closed"},
                 {"width_m", s.slot.width},
                 {"depth_m", s.slot.depth}};
    if (s.slot.shape == mesh::SlotShape::semi_closed) {
      slot["opening_m"] = s.slot.opening_width;
      slot["tip_height_m"] = s.slot.tip_height;
      slot["wedge_height_m"] = s.slot.wedge_height;
    }
    stator["slots"] = s.n_positions;
    stator["slot"] = slot;
  }
  return stator;
}

}  // namespace

std::string case_to_json(const Case& c) {
  using nlohmann::json;
  const auto& r = c.geometry.rotor;
  json j = {
      {"case_file", c.path},
      {"title", c.title},
      {"stack_length_m", c.stack_length},
      {"stator", stator_json(c.geometry.stator)},
      {"rotor",
       {{"kind", kRotorKinds[static_cast<int>(r.kind)]},
        {"outer_radius_m", r.outer_radius},
        {"shaft_radius_m", r.shaft_radius},
        {"sleeve_thickness_m", r.sleeve_thickness},
        {"air_gap_m", c.geometry.gap_length()}}},
      {"materials", materials_json(c.materials)},
      {"winding",
       {{"phases", c.winding.n_phases},
        {"poles", c.winding.n_poles},
        {"layers", c.winding.n_layers},
        {"coil_pitch_slots", c.winding.coil_pitch},
        {"turns_per_coil", c.winding.turns_per_coil},
        {"parallel_paths", c.winding.parallel_paths}}},
      {"supply", supply_json(c.supply)},
      {"study",
       {{"kind", study_kind_name(c.study.kind)},
        {"rotor_speeds_rad_per_s", c.study.rotor_speeds},
        {"load_angle_deg", c.study.load_angle * 180.0 / std::numbers::pi},
        {"rotor_span_deg", c.study.rotor_span * 180.0 / std::numbers::pi},
        {"current_angle_deg", c.study.current_angle * 180.0 / std::numbers::pi},
        {"speed_rpm", c.study.speed * 60.0 / (2 * std::numbers::pi)},
        {"virtual_work", c.study.virtual_work},
        {"steps", c.study.n_steps},
        {"field_files", c.study.n_field_files},
        {"gap_points", c.study.n_gap_points},
        {"harmonics", c.study.max_harmonic}}},
      {"mesh", {{"fineness", c.mesh.fineness}, {"elements_per_skin_depth", c.mesh.elements_per_skin_depth}}},
  };
  j["rotor"].update(rotor_parts_json(r));
  if (c.end_rings)
    j["rotor"]["end_rings"] = {{"area_m2", c.end_rings->area},
                               {"mean_diameter_m", c.end_rings->mean_diameter},
                               {"conductivity_S_per_m", c.end_rings->conductivity}};
  return j.dump();
}

}  // namespace tf::input
