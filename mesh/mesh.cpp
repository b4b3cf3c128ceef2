#include "mesh/mesh.hpp"

#include <cmath>

namespace tf::mesh {

int find_region(const Mesh& m, RegionKind kind, int slot, int layer) {
  for (std::size_t r = 0; r < m.regions.size(); ++r) {
    const Region& g = m.regions[r];
    if (g.kind == kind && g.slot == slot && g.layer == layer) return static_cast<int>(r);
  }
  return -1;
}

bool on_rotor_side(const Region& r) {
  switch (r.kind) {
    case RegionKind::rotor_iron:
    case RegionKind::shaft:
    case RegionKind::rotor_sleeve:
    case RegionKind::magnet:
    case RegionKind::rotor_air:
    case RegionKind::rotor_bar: return true;
    case RegionKind::gap: return r.name == "gap_rotor_side";
    default: return false;
  }
}

std::vector<bool> rotor_side_nodes(const Mesh& m) {
  std::vector<bool> rotor(m.n_nodes(), false);
  for (int t = 0; t < m.n_triangles(); ++t)
    if (on_rotor_side(m.regions[m.triangle_region(t)]))
      for (int j = 0; j < 3; ++j) rotor[m.triangles(t, j)] = true;
  return rotor;
}

Mesh with_rotor_turned(const Mesh& m, double angle) {
  Mesh out = m;
  const std::vector<bool> turns = rotor_side_nodes(m);
  const double c = std::cos(angle), s = std::sin(angle);
  for (int i = 0; i < m.n_nodes(); ++i)
    if (turns[i]) out.nodes.row(i) = Eigen::RowVector2d(c * m.nodes(i, 0) - s * m.nodes(i, 1), s * m.nodes(i, 0) + c * m.nodes(i, 1));
  return out;
}

double triangle_area(const Mesh& m, int t) {
  const auto p0 = m.nodes.row(m.triangles(t, 0));
  const auto p1 = m.nodes.row(m.triangles(t, 1));
  const auto p2 = m.nodes.row(m.triangles(t, 2));
  return 0.5 * ((p1(0) - p0(0)) * (p2(1) - p0(1)) - (p2(0) - p0(0)) * (p1(1) - p0(1)));
}

std::vector<double> region_areas(const Mesh& m) {
  std::vector<double> area(m.regions.size(), 0.0);
  for (int t = 0; t < m.n_triangles(); ++t) area[m.triangle_region(t)] += triangle_area(m, t);
  return area;
}

}  // namespace tf::mesh
