#include "post/cross_section.hpp"

#include <cmath>
#include <numbers>

#include "post/motion_output.hpp"
#include "post/tables.hpp"

namespace tf::post {

CrossSection cross_section(const SectionInput& in) {
  const mesh::Mesh& m = in.model;
  // As the field files draw it: a sector model's rotor piece turned back by whole sectors into
  // the stator's sector shows the image of the rotor there, whose field and magnets carry the
  // sign of the image that many sectors on.
  const double sector = 2 * std::numbers::pi / m.symmetry.copies;
  const int turns = static_cast<int>(std::floor(in.rotor_angle / sector));
  const int rotor_sign = m.symmetry.sign_of_copy(((turns % 2) + 2) % 2);
  Eigen::VectorXd a = in.a;
  if (rotor_sign < 0) {
    const std::vector<bool> rotor = mesh::rotor_side_nodes(m);
    for (int node = 0; node < m.n_nodes(); ++node)
      if (rotor[static_cast<std::size_t>(node)]) a(node) = -a(node);
  }
  const mesh::Mesh drawn = in.rotor_angle == 0.0 ? m : mesh::with_rotor_turned(m, drawn_rotor_angle(m, in.rotor_angle));
  CrossSection s;
  s.machine = unfold(drawn);
  s.regions = m.regions;
  s.sliding_radius = m.sliding.radius;
  s.rotor_sign = rotor_sign;
  s.b_magnitude = unfold_cells(s.machine, in.b_magnitude);
  s.a = unfold_nodal(s.machine, a);
  s.a_name = in.a_name;
  s.winding = in.winding;
  s.when = in.when;
  return s;
}

std::string coil_label(const mesh::CoilSide& side) { return phase_name(side.phase) + (side.direction > 0 ? "+" : "−"); }

}  // namespace tf::post
