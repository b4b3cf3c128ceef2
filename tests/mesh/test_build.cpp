// The Gmsh-built cross-section: regions, replication, the sliding circle and the gap layers.

#include <doctest/doctest.h>

#include "mesh/build.hpp"
#include "support/mesh_checks.hpp"
#include "support/sample_geometry.hpp"

using namespace tf;

namespace {

void check_mesh(const mesh::Geometry& g, int n_layers, const mesh::Mesh& m) {
  const int Q = g.stator.n_positions;
  const auto area = mesh::region_areas(m);
  testing::check_fills_disc(g, m);
  // Every slot has each layer, all with the same area: the copies are identical.
  for (int l = 1; l <= n_layers; ++l) {
    const int first = mesh::find_region(m, mesh::RegionKind::coil, 1, l);
    REQUIRE(first >= 0);
    for (int s = 2; s <= Q; ++s) {
      const int r = mesh::find_region(m, mesh::RegionKind::coil, s, l);
      REQUIRE(r >= 0);
      CHECK(area[r] == doctest::Approx(area[first]).epsilon(1e-9).scale(0));
    }
  }
  CHECK(mesh::find_region(m, mesh::RegionKind::coil, 1, n_layers + 1) < 0);
  // Coil area: the slot body above the tips and wedge (parallel-sided rectangle).
  const auto& sl = g.stator.slot;
  const double coil_height = sl.shape == mesh::SlotShape::open ? sl.depth : sl.depth - sl.tip_height - sl.wedge_height;
  double coil_area = 0.0;
  for (int l = 1; l <= n_layers; ++l) coil_area += area[mesh::find_region(m, mesh::RegionKind::coil, 1, l)];
  CHECK(coil_area == doctest::Approx(sl.width * coil_height).epsilon(sl.shape == mesh::SlotShape::open ? 2e-3 : 1e-9).scale(0));
}

}  // namespace

TEST_CASE("open-slot stator, two layers: regions, identical slots, sliding circle, gap layers") {
  const auto g = testing::open_slot_stator();
  const mesh::Mesh m = mesh::build(g, {2}, {0.5});
  check_mesh(g, 2, m);
  testing::check_sliding_circle(g, m);
  testing::check_gap_layers(g, m);
  testing::check_merged(m);
  CHECK(m.outer_nodes.size() > static_cast<std::size_t>(g.stator.n_positions));
  for (int node : m.outer_nodes) CHECK(m.nodes.row(node).norm() == doctest::Approx(g.stator.outer_radius).epsilon(1e-9).scale(0));
}

TEST_CASE("semi-closed stator, one layer, and a bore with no rotor") {
  auto g = testing::semi_closed_stator();
  const mesh::Mesh m = mesh::build(g, {1}, {0.5});
  check_mesh(g, 1, m);
  testing::check_sliding_circle(g, m);
  testing::check_gap_layers(g, m);
  CHECK(mesh::find_region(m, mesh::RegionKind::slot_air, 7) >= 0);
  CHECK(mesh::find_region(m, mesh::RegionKind::shaft) >= 0);

  g.rotor.kind = mesh::RotorKind::none;
  const mesh::Mesh air = mesh::build(g, {2}, {0.5});
  check_mesh(g, 2, air);
  CHECK(mesh::find_region(air, mesh::RegionKind::bore_air) >= 0);
  CHECK(mesh::find_region(air, mesh::RegionKind::rotor_iron) < 0);
}

TEST_CASE("the fineness knob refines the mesh") {
  const auto g = testing::semi_closed_stator();
  const auto coarse = mesh::build(g, {2}, {0.5});
  const auto fine = mesh::build(g, {2}, {1.5});
  CHECK(fine.n_triangles() > 1.5 * coarse.n_triangles());
  CHECK(fine.sliding.stator_nodes.size() > coarse.sliding.stator_nodes.size());
}
