#include "app/geometry_report.hpp"

#include <numbers>
#include <string>

#include <fmt/format.h>

#include "input/derived_geometry.hpp"
#include "mesh/winding.hpp"
#include "study/mesh_plan.hpp"

namespace tf::app {
namespace {

std::string mm(double metres) { return fmt::format("{:.2f} mm", 1e3 * metres); }
std::string mm2(double square_metres) { return fmt::format("{:.1f} mm²", 1e6 * square_metres); }

void row(std::ostream& out, const std::string& name, const std::string& value) {
  out << fmt::format("  {:<32}{}\n", name, value);
}

/// "1/4 of the machine, anti-periodic" or "the whole cross-section".
std::string model_text(const input::Case& c) {
  const auto sector = study::model_sector(c, mesh::lay_out(c.winding, c.geometry.stator));
  if (!sector) return c.full_model ? "the whole cross-section (as the case asks)" : "the whole cross-section";
  return fmt::format("1/{} of the machine ({} slot pitches), {}", sector->copies, sector->slots,
                     sector->anti_periodic ? "anti-periodic" : "periodic");
}

std::string position_word(mesh::StatorKind k) {
  return k == mesh::StatorKind::salient ? "stator pole" : k == mesh::StatorKind::slotless ? "belt" : "slot";
}

}  // namespace

void print_derived_geometry(const input::Case& c, std::ostream& out) {
  const input::DerivedGeometry d = input::derive_geometry(c);
  const mesh::StatorGeometry& s = c.geometry.stator;
  const std::string slot = position_word(s.kind);
  row(out, "air gap", d.air_gap ? mm(*d.air_gap) : "no rotor");
  row(out, slot + " pitch at the bore", fmt::format("{} ({:.2f}°)", mm(d.slot_pitch), 360.0 / s.n_positions));
  row(out, "field pole pitch at the bore",
      fmt::format("{} ({:g} {} pitches)", mm(d.pole_pitch), static_cast<double>(s.n_positions) / c.winding.n_poles, slot));
  if (d.tooth_at_bore) {
    const bool open = s.slot.shape == mesh::SlotShape::open;
    row(out, "tooth width at the bore", mm(*d.tooth_at_bore) + (open ? "" : " (between the openings)"));
    row(out, "narrowest tooth", mm(*d.tooth_narrowest) + (open ? " (at the bore)" : " (behind the tooth tips)"));
  }
  if (d.slot_area) row(out, "slot area", mm2(*d.slot_area) + " (opening and wedge included)");
  row(out, "coil area per " + slot,
      fmt::format("{} for {} conductor{}: {:.2f} mm² each", mm2(d.coil_area), d.conductors, d.conductors == 1 ? "" : "s",
                  1e6 * d.coil_area / d.conductors));
  row(out, "fill", "needs the conductors' cross-section, which case files do not give yet");
  if (d.carter_factor)
    row(out, "Carter's factor", fmt::format("{:.3f} (openings of {} over the {} gap)", *d.carter_factor,
                                            mm(s.slot.shape == mesh::SlotShape::open ? s.slot.width : s.slot.opening_width),
                                            mm(*d.air_gap)));
  row(out, "q (slots per pole and phase)",
      d.q_denominator == 1 ? fmt::format("{}", d.q_numerator) : fmt::format("{}/{}", d.q_numerator, d.q_denominator));
  row(out, "model solved", model_text(c));
  row(out, "synchronous speed",
      d.synchronous_rpm ? fmt::format("{:.6g} rpm at {:g} Hz", *d.synchronous_rpm, c.supply.frequency)
                        : "none (stepped DC)");
}

}  // namespace tf::app
