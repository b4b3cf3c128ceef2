// Salient-pole stators: the meshed pole pitch against the outline drawn from the case's numbers,
// the coil sides named per pole as the winding finds them, and the same sliding circle, gap layers
// and merged cuts as slotted stators.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <string>

#include "mesh/build.hpp"
#include "support/mesh_checks.hpp"
#include "support/sample_geometry.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

// testing::salient_stator(): bore 30 mm, shoe 3 mm, body 14 mm wide and 18 mm long, coil sides
// 8 mm by 14 mm. The coil sides rest on the shoe where the body meets its back (radius 33 mm):
// x = sqrt(33^2 - 7^2) mm = sqrt(1040) mm from the axis, along the pole centre line.
const double coil_floor = std::sqrt(1040.0) * 1e-3;
const double shoe_back = 0.033, yoke_inner = 0.051;
const double body_half = 0.007, coil_outer = 0.015, coil_height = 0.014, coil_area = 0.008 * 0.014;

/// Node `node` in the coordinates of pole k of P: x along its centre line, y counter-clockwise.
Eigen::Vector2d pole_local(const mesh::Mesh& m, int node, int pole, int n_poles) {
  const double t = -2 * kPi * (pole - 1) / n_poles, c = std::cos(t), s = std::sin(t);
  const Eigen::Vector2d p = m.nodes.row(node);
  return {c * p(0) - s * p(1), s * p(0) + c * p(1)};
}

/// Centroid of a region in pole-local coordinates: exact for a region tiled by triangles.
Eigen::Vector2d centroid(const mesh::Mesh& m, int region, int pole, int n_poles) {
  Eigen::Vector2d sum = Eigen::Vector2d::Zero();
  double area = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    if (m.triangle_region(t) != region) continue;
    const double a = mesh::triangle_area(m, t);
    for (int i = 0; i < 3; ++i) sum += a / 3 * pole_local(m, m.triangles(t, i), pole, n_poles);
    area += a;
  }
  return sum / area;
}

/// Both coil sides of every pole: rectangles of the drawn size, beside the body on the shoe, layer 1
/// counter-clockwise of the body; every vertex inside its rectangle.
void check_coil_sides(const mesh::Mesh& m, int n_poles) {
  const auto area = mesh::region_areas(m);
  for (int k = 1; k <= n_poles; ++k) {
    CHECK(mesh::find_region(m, mesh::RegionKind::coil, k, 3) < 0);
    for (int layer = 1; layer <= 2; ++layer) {
      CAPTURE(k);
      CAPTURE(layer);
      const int r = mesh::find_region(m, mesh::RegionKind::coil, k, layer);
      REQUIRE(r >= 0);
      CHECK(m.regions[r].name == "pole_" + std::to_string(k) + "_coil_" + std::to_string(layer));
      CHECK(area[r] == doctest::Approx(coil_area).epsilon(1e-9).scale(0));
      const double side = layer == 1 ? 1.0 : -1.0;
      const Eigen::Vector2d c = centroid(m, r, k, n_poles);
      CHECK(c(0) == doctest::Approx(coil_floor + 0.5 * coil_height).epsilon(1e-9).scale(0));
      CHECK(c(1) == doctest::Approx(side * 0.5 * (body_half + coil_outer)).epsilon(1e-9).scale(0));
      for (int t = 0; t < m.n_triangles(); ++t) {
        if (m.triangle_region(t) != r) continue;
        for (int i = 0; i < 3; ++i) {
          const Eigen::Vector2d p = pole_local(m, m.triangles(t, i), k, n_poles);
          CHECK(p(0) >= coil_floor - 1e-9);
          CHECK(p(0) <= coil_floor + coil_height + 1e-9);
          CHECK(side * p(1) >= body_half - 1e-9);
          CHECK(side * p(1) <= coil_outer + 1e-9);
        }
      }
    }
  }
  CHECK(mesh::find_region(m, mesh::RegionKind::coil, n_poles + 1, 1) < 0);
}

/// Angle of a point from the centre line of the nearest pole [rad].
double from_pole_centre(const Eigen::Vector2d& p, int n_poles) {
  return std::abs(std::remainder(std::atan2(p(1), p(0)), 2 * kPi / n_poles));
}

}  // namespace

TEST_CASE("four salient poles: two rectangular coil sides on the shoe beside each body") {
  const auto g = testing::salient_stator();
  const mesh::Mesh m = mesh::build(g, {2, true}, {0.5});
  check_coil_sides(m, 4);
  testing::check_fills_disc(g, m);
  testing::check_sliding_circle(g, m);
  testing::check_gap_layers(g, m);
  testing::check_merged(m);
  // The air between the poles belongs to no single pole: one region, no slot regions.
  int n_air = 0;
  for (const mesh::Region& r : m.regions) {
    CHECK(r.name.rfind("slot_", 0) != 0);
    if (r.kind != mesh::RegionKind::slot_air) continue;
    ++n_air;
    CHECK(r.name == "interpolar_air");
    CHECK(r.slot == 0);
  }
  CHECK(n_air == 1);
}

TEST_CASE("the pole face spans the shoe arc, the air between the shoes reaches the bore, the body is parallel") {
  const auto g = testing::salient_stator();
  const mesh::Mesh m = mesh::build(g, {2, true}, {0.5});
  const double half_shoe = kPi / 6;  // shoe_arc = 60°
  int iron_at_bore = 0, air_at_bore = 0, shoe_corners = 0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    const mesh::RegionKind kind = m.regions[m.triangle_region(t)].kind;
    for (int i = 0; i < 3; ++i) {
      const Eigen::Vector2d p = m.nodes.row(m.triangles(t, i));
      const double r = p.norm(), angle = from_pole_centre(p, 4);
      if (std::abs(r - g.stator.bore_radius) < 1e-9) {
        if (kind == mesh::RegionKind::stator_iron) {
          ++iron_at_bore;
          CHECK(angle <= half_shoe + 1e-9);
          if (std::abs(angle - half_shoe) < 1e-9) ++shoe_corners;
        }
        if (kind == mesh::RegionKind::slot_air) {
          ++air_at_bore;
          CHECK(angle >= half_shoe - 1e-9);
        }
      }
      // Between the shoe back and the yoke, iron is the body: within half its width of the centre line.
      if (kind == mesh::RegionKind::stator_iron && r > shoe_back + 1e-9 && r < yoke_inner - 1e-9)
        CHECK(r * std::sin(angle) <= body_half + 1e-9);
    }
  }
  CHECK(iron_at_bore > 0);
  CHECK(air_at_bore > 0);
  CHECK(shoe_corners >= 8);  // both corners of every pole face are mesh nodes
}

TEST_CASE("two salient poles: sectors of half a turn mesh and join") {
  auto g = testing::salient_stator();
  g.stator.n_positions = 2;
  g.stator.poles.shoe_arc = 2 * kPi / 3;
  const mesh::Mesh m = mesh::build(g, {2, true}, {0.5});
  check_coil_sides(m, 2);
  testing::check_fills_disc(g, m);
  testing::check_sliding_circle(g, m);
  testing::check_gap_layers(g, m);
  testing::check_merged(m);
}

TEST_CASE("far from the gap, elements resolve the pole body and coil sides") {
  const auto g = testing::salient_stator();
  const mesh::ElementSizes h = mesh::element_sizes(g, {1.0});
  CHECK(h.largest > 0.0);
  CHECK(h.largest <= 0.5 * 0.008 + 1e-12);  // half the narrower of body (14 mm) and coil side (8 mm)
  CHECK(mesh::element_sizes(g, {2.0}).largest == doctest::Approx(0.5 * h.largest).scale(0));
}
