#include "post/field_drawing.hpp"

#include <cctype>
#include <cmath>
#include <map>
#include <numbers>
#include <utility>

#include "post/motion_output.hpp"
#include "post/tables.hpp"

namespace tf::post {
namespace {

bool numbered_on_rotor(const mesh::Region& r) {
  return r.kind == mesh::RegionKind::magnet || r.kind == mesh::RegionKind::rotor_bar;
}

/// The name with its first number replaced by `number`, padded to the same width ("slot_01_layer_2"
/// with 7 is "slot_07_layer_2"): the mesh pads numbers to the width of the largest already.
std::string renumbered(const std::string& name, int number) {
  const std::size_t first = name.find_first_of("0123456789");
  if (first == std::string::npos) return name;
  std::size_t last = first;
  while (last < name.size() && std::isdigit(static_cast<unsigned char>(name[last]))) ++last;
  std::string text = std::to_string(number);
  if (text.size() < last - first) text.insert(0, last - first - text.size(), '0');
  return name.substr(0, first) + text + name.substr(last);
}

int rotor_features(const mesh::RotorGeometry& r) {
  if (r.kind == mesh::RotorKind::surface_magnet) return r.magnets.n_poles;
  if (r.kind == mesh::RotorKind::slotted) return r.bars.count;
  return 0;
}

/// Region r of the model as it appears in copy k: stator slots (poles, conductor sectors) advance
/// by the positions per copy, rotor poles and bars by the features per copy.
mesh::Region region_in_copy(const mesh::Region& r, int k, const mesh::Geometry& g, int copies) {
  mesh::Region out = r;
  if (r.slot <= 0 || k == 0) return out;
  const bool rotor = numbered_on_rotor(r);
  const int n = rotor ? rotor_features(g.rotor) : g.stator.n_positions;
  if (n <= 0 || n % copies != 0) return out;  // not a whole number per copy: keep the model's numbering
  out.slot = (r.slot - 1 + k * (n / copies)) % n + 1;
  out.name = renumbered(r.name, out.slot);
  return out;
}

/// The coil side's phase (1-based) and direction from the winding; 0, 0 for anything else.
void set_coil(DrawnRegion& d, const mesh::Region& r, const mesh::Winding* w) {
  if (!w || r.kind != mesh::RegionKind::coil) return;
  for (const mesh::CoilSide& s : w->sides)
    if (s.slot == r.slot && s.layer == r.layer) {
      d.phase = s.phase + 1;
      d.direction = s.direction > 0 ? 1 : -1;
      return;
    }
}

}  // namespace

RotorDrawn rotor_drawn(const mesh::Mesh& model, double rotor_angle) {
  const double sector = 2 * std::numbers::pi / model.symmetry.copies;
  const double drawn_angle = drawn_rotor_angle(model, rotor_angle);
  RotorDrawn r;
  r.turns = static_cast<int>(std::lround((rotor_angle - drawn_angle) / sector));
  r.rotor_sign = model.symmetry.sign_of_copy(((r.turns % 2) + 2) % 2);
  r.model = drawn_angle == 0.0 ? model : mesh::with_rotor_turned(model, drawn_angle);
  return r;
}

Eigen::VectorXd rotor_signed(const mesh::Mesh& model, const Eigen::VectorXd& values, int rotor_sign) {
  Eigen::VectorXd a = values;
  if (rotor_sign < 0) {
    const std::vector<bool> rotor = mesh::rotor_side_nodes(model);
    for (int node = 0; node < model.n_nodes(); ++node)
      if (rotor[static_cast<std::size_t>(node)]) a(node) = -a(node);
  }
  return a;
}

Eigen::VectorXd FieldDrawing::drawn_field(const Eigen::VectorXd& model_values) const {
  return rotor_signed(model, model_values, rotor_sign);
}

Eigen::VectorXd FieldDrawing::nodal(const Eigen::VectorXd& model_values) const {
  return unfold_nodal(whole, drawn_field(model_values));
}

FieldDrawing field_drawing(const mesh::Mesh& model, const mesh::Geometry& g, const mesh::Winding* w,
                           double rotor_angle) {
  FieldDrawing d;
  const int copies = model.symmetry.copies;
  // The drawn rotor's poles and bars are those `turns` copies further on.
  RotorDrawn drawn = rotor_drawn(model, rotor_angle);
  const int turns = drawn.turns;
  d.rotor_sign = drawn.rotor_sign;
  d.model = std::move(drawn.model);
  d.whole = unfold(d.model);

  // The whole machine's regions in the order copy 0's, then each further copy's new ones.
  std::vector<std::vector<int>> id(model.regions.size(), std::vector<int>(copies, -1));
  std::map<std::string, int> by_name;
  for (int k = 0; k < copies; ++k)
    for (std::size_t r = 0; r < model.regions.size(); ++r) {
      if (model.regions[r].kind == mesh::RegionKind::exterior_image) continue;  // not drawn
      const mesh::Region whole = region_in_copy(model.regions[r], k, g, copies);
      const auto [it, added] = by_name.emplace(whole.name, static_cast<int>(d.regions.size()));
      if (added) {
        DrawnRegion region{whole.name, whole.kind, 0, 0};
        set_coil(region, whole, w);
        d.regions.push_back(region);
      }
      id[r][k] = it->second;
    }
  d.triangle_region.resize(d.whole.n_triangles());
  for (int t = 0; t < d.whole.n_triangles(); ++t) {
    const int r = d.whole.triangle_region(t);
    int k = d.whole.triangle_copy[t];
    if (numbered_on_rotor(model.regions[r])) k = ((k - turns) % copies + copies) % copies;
    d.triangle_region(t) = id[r][k];
  }
  if (w)
    for (int k = 0; k < w->spec.n_phases; ++k) d.phase_names.push_back(phase_name(k));
  return d;
}

mesh::Mesh drawing_as_mesh(const FieldDrawing& d) {
  mesh::Mesh m = drawing_mesh(d.model, d.whole);
  m.triangle_region = d.triangle_region;
  m.regions.clear();
  for (const DrawnRegion& r : d.regions) m.regions.push_back({r.name, r.kind, 0, 0});
  return m;
}

}  // namespace tf::post
