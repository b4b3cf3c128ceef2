// The drawing every field file shows, checked against the whole model meshed and solved as such:
// a quarter model of the magnet machine, its rotor turned beyond its own sector, must draw every
// triangle where the whole model has it, under the whole model's region name, with the winding's
// phase and direction, and with the whole model's A_z. The sign reference is the anti-periodic
// boundary condition A(r, theta + tau) = -A(r, theta) of a sector of odd pole pitches (Salon,
// "Finite Element Analysis of Electrical Machines", 1995, sec. 6.2; from memory).

#include <cmath>
#include <map>
#include <numbers>
#include <utility>

#include <doctest/doctest.h>

#include "post/eddy_output.hpp"
#include "post/field_drawing.hpp"
#include "support/sector_machine.hpp"

using namespace tf;

namespace {

std::pair<long, long> key(const Eigen::Vector2d& p) { return {std::lround(p.x() * 1e7), std::lround(p.y() * 1e7)}; }

Eigen::Vector2d centroid(const Eigen::MatrixX2d& xy, const Eigen::MatrixX3i& tri, int t) {
  return (xy.row(tri(t, 0)) + xy.row(tri(t, 1)) + xy.row(tri(t, 2))).transpose() / 3.0;
}

/// The winding's phase (1-based) and direction of a region, by its own slot and layer; 0, 0 for no coil.
std::pair<int, int> coil_of(const mesh::Winding& w, const mesh::Region& r) {
  if (r.kind != mesh::RegionKind::coil) return {0, 0};
  for (const auto& s : w.sides)
    if (s.slot == r.slot && s.layer == r.layer) return {s.phase + 1, s.direction};
  return {-1, -1};
}

}  // namespace

TEST_CASE("a quarter model drawn whole: the whole model's region names, coil phases and A_z, rotor beyond its sector") {
  const mesh::Geometry g = testing::magnet_machine();
  const mesh::Winding w = testing::magnet_machine_winding(g);
  const auto [full, sector] = testing::full_and_sector(g, w);
  REQUIRE(sector.symmetry.copies == 4);
  REQUIRE(sector.symmetry.anti_periodic);
  const std::vector<double> currents = testing::three_phase_currents(20.0, std::numbers::pi / 5);
  const int n_sliding = static_cast<int>(full.sliding.stator_nodes.size());
  const double pitch = 2 * std::numbers::pi / n_sliding;
  // One sector and five pitches on (an odd number of sectors: the image's sign flips), and back.
  for (int shift : {0, n_sliding / 4 + 5, -n_sliding / 4 - 3}) {
    CAPTURE(shift);
    const double angle = shift * pitch;
    const post::FieldDrawing d = post::field_drawing(sector, g, &w, angle);
    const mesh::Mesh full_drawn = mesh::with_rotor_turned(full, angle);
    REQUIRE(d.whole.n_triangles() == full.n_triangles());
    REQUIRE(d.regions.size() == full.regions.size());

    std::map<std::pair<long, long>, int> full_triangle;
    for (int t = 0; t < full.n_triangles(); ++t)
      full_triangle.emplace(key(centroid(full_drawn.nodes, full.triangles, t)), t);
    int unmatched = 0, misnamed = 0, wrong_coil = 0;
    for (int t = 0; t < d.whole.n_triangles(); ++t) {
      const auto it = full_triangle.find(key(centroid(d.whole.nodes, d.whole.triangles, t)));
      if (it == full_triangle.end()) { ++unmatched; continue; }
      const mesh::Region& whole = full.regions[full.triangle_region(it->second)];
      const post::DrawnRegion& drawn = d.regions[d.triangle_region(t)];
      if (drawn.name != whole.name) ++misnamed;
      if (std::make_pair(drawn.phase, drawn.direction) != coil_of(w, whole)) ++wrong_coil;
    }
    CHECK(unmatched == 0);
    CHECK(misnamed == 0);
    CHECK(wrong_coil == 0);

    std::map<std::pair<long, long>, int> full_node;
    for (int i = 0; i < full.n_nodes(); ++i) full_node.emplace(key(full_drawn.nodes.row(i)), i);
    const Eigen::VectorXd a_full = testing::linear_field(full, g, w, currents, shift);
    const Eigen::VectorXd a = d.nodal(testing::linear_field(sector, g, w, currents, shift));
    const double scale = a_full.cwiseAbs().maxCoeff();
    REQUIRE(scale > 1e-4);
    double worst = 0.0;
    for (int i = 0; i < d.whole.n_nodes(); ++i) {
      const auto it = full_node.find(key(d.whole.nodes.row(i)));
      REQUIRE(it != full_node.end());
      worst = std::max(worst, std::abs(a(i) - a_full(it->second)) / scale);
    }
    CHECK(worst < 1e-6);
  }
}

TEST_CASE("a coil region of the drawing carries its phase and direction, slot_07_layer_2 among them") {
  const mesh::Geometry g = testing::magnet_machine();
  const mesh::Winding w = testing::magnet_machine_winding(g);
  const auto [full, sector] = testing::full_and_sector(g, w);
  const post::FieldDrawing d = post::field_drawing(sector, g, &w);
  int coils = 0;
  bool seven = false;
  for (const post::DrawnRegion& r : d.regions) {
    if (r.kind != mesh::RegionKind::coil) {
      CHECK(r.phase == 0);
      CHECK(r.direction == 0);
      continue;
    }
    ++coils;
    CHECK(r.phase >= 1);
    CHECK(r.phase <= 3);
    CHECK(std::abs(r.direction) == 1);
    seven = seven || r.name == "slot_07_layer_2";
  }
  CHECK(coils == 48);  // 24 slots, two layers
  CHECK(seven);
  CHECK(d.phase_names == std::vector<std::string>{"A", "B", "C"});
}

TEST_CASE("an eddy study's collection is indexed by speed: rpm when rising, slip when falling, else the number") {
  // rpm = omega * 60 / (2 pi): the definition of the unit.
  std::vector<post::SpeedResult> rows(3);
  for (int k = 0; k < 3; ++k) {
    rows[k].rotor_speed = 50.0 * k;
    rows[k].slip = 1.0 - rows[k].rotor_speed / 157.0;
  }
  post::SpeedAxis axis = post::speed_collection_axis(rows);
  CHECK(axis.name == "speed_rpm");
  CHECK(axis.values[2] == doctest::Approx(100.0 * 60 / (2 * std::numbers::pi)).epsilon(1e-14).scale(0));
  std::swap(rows[0], rows[2]);
  axis = post::speed_collection_axis(rows);
  CHECK(axis.name == "slip");
  CHECK(axis.values == std::vector<double>{rows[0].slip, rows[1].slip, rows[2].slip});
  std::swap(rows[0], rows[1]);
  axis = post::speed_collection_axis(rows);
  CHECK(axis.name == "speed_number");
  CHECK(axis.values == std::vector<double>{0.0, 1.0, 2.0});
}
