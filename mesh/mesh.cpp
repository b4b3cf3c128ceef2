#include "mesh/mesh.hpp"

namespace tf::mesh {

int find_region(const Mesh& m, RegionKind kind, int slot, int layer) {
  for (std::size_t r = 0; r < m.regions.size(); ++r) {
    const Region& g = m.regions[r];
    if (g.kind == kind && g.slot == slot && g.layer == layer) return static_cast<int>(r);
  }
  return -1;
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
