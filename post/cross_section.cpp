#include "post/cross_section.hpp"

#include "post/field_drawing.hpp"
#include "post/tables.hpp"

namespace tf::post {

CrossSection cross_section(const SectionInput& in) {
  const mesh::Mesh& m = in.model;
  // As the field files draw it (the rotor's image, signed, where a sector model's rotor stood).
  const RotorDrawn drawn = rotor_drawn(m, in.rotor_angle);
  CrossSection s;
  s.machine = unfold(drawn.model);
  s.regions = m.regions;
  s.sliding_radius = m.sliding.radius;
  s.rotor_sign = drawn.rotor_sign;
  s.b_magnitude = unfold_cells(s.machine, in.b_magnitude);
  s.a = unfold_nodal(s.machine, rotor_signed(m, in.a, drawn.rotor_sign));
  s.a_name = in.a_name;
  s.winding = in.winding;
  s.when = in.when;
  return s;
}

std::string coil_label(const mesh::CoilSide& side) { return phase_name(side.phase) + (side.direction > 0 ? "+" : "−"); }

}  // namespace tf::post
