// Consistency checks on the plain structs: tooth, tip, yoke and gap limits at their boundaries,
// and which windings this version can lay out.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <string>

#include "input/case_validation.hpp"
#include "support/sample_geometry.hpp"
#include "support/winding_spec.hpp"

namespace {

using tf::input::geometry_problem;
using tf::input::tooth_width;
using tf::input::winding_problem;

using tf::testing::open_slot_stator;    // the 36-slot stator of cases/stator36_three_phase.toml
using tf::testing::semi_closed_stator;  // the 24-slot stator of cases/pump24_three_phase.toml

tf::mesh::WindingSpec winding(int phases, int poles, int layers, int pitch, int paths = 1) {
  tf::mesh::WindingSpec w = tf::testing::winding_spec(phases, poles, layers, pitch, 1);
  w.parallel_paths = paths;
  return w;
}

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

}  // namespace

TEST_CASE("tooth width is the chord between neighbouring slot walls") {
  const double r = 0.06;
  const double pitch_chord = 2 * r * std::sin(std::numbers::pi / 36);
  CHECK(tooth_width(r, 0.0, 36) == doctest::Approx(pitch_chord).epsilon(1e-12).scale(0));
  CHECK(tooth_width(r, pitch_chord, 36) == doctest::Approx(0.0).scale(1e-3).epsilon(1e-12));
  CHECK(tooth_width(r, 1.0, 36) < 0);  // slots wider than the bore overlap instead of giving NaN
  // Parallel walls: the tooth widens outwards, so it is narrowest at the smallest radius.
  CHECK(tooth_width(0.07, 0.005, 36) > tooth_width(0.06, 0.005, 36));
  // For narrow slots the chord minus the slot width is a close approximation (to about 0.05 %).
  CHECK(tooth_width(r, 0.001, 36) == doctest::Approx(pitch_chord - 0.001).epsilon(1e-3).scale(0));
}

TEST_CASE("the demo geometries pass every check") {
  CHECK_FALSE(geometry_problem(open_slot_stator()).has_value());
  CHECK_FALSE(geometry_problem(semi_closed_stator()).has_value());
}

TEST_CASE("teeth of exactly 0.5 mm pass and anything thinner is refused") {
  tf::mesh::Geometry g = open_slot_stator();
  // Slot width for a 0.5 mm tooth at the bore, from tooth_width solved for the slot width.
  const double r = g.stator.bore_radius;
  const double widest = 2 * r * std::sin(std::numbers::pi / 36 - std::asin(0.25e-3 / r));
  g.stator.slot.width = widest * (1 - 1e-9);
  CHECK_FALSE(geometry_problem(g).has_value());
  g.stator.slot.width = widest * (1 + 1e-9);
  const auto p = geometry_problem(g);
  REQUIRE(p.has_value());
  CHECK(p->key == "stator.slot.width");
  CHECK(contains(p->what, "thinner than the minimum 0.50 mm"));
}

TEST_CASE("a semi-closed slot body is measured behind the tips, its opening at the bore") {
  tf::mesh::Geometry g = semi_closed_stator();
  // Wider than the pitch chord at the bore (13.05 mm) but not behind the 0.8 mm tips (13.26 mm):
  // the body is refused for thin teeth behind the tips, not for being wider than the pitch.
  g.stator.slot.width = 0.0131;
  auto p = geometry_problem(g);
  REQUIRE(p.has_value());
  CHECK(contains(p->what, "teeth between neighbouring slots"));
  CHECK(contains(p->what, "behind the tooth tips, at r = 50.80 mm,"));

  g = semi_closed_stator();
  g.stator.slot.opening_width = g.stator.slot.width;
  p = geometry_problem(g);
  REQUIRE(p.has_value());
  CHECK(p->key == "stator.slot.opening");
}

TEST_CASE("the yoke behind the slot corners must be at least 1 mm") {
  tf::mesh::Geometry g = open_slot_stator();
  const double half_width = 0.5 * g.stator.slot.width;
  const double inner = g.stator.outer_radius - 1e-3;
  const double deepest = std::sqrt(inner * inner - half_width * half_width) - g.stator.bore_radius;
  g.stator.slot.depth = deepest - 1e-9;
  CHECK_FALSE(geometry_problem(g).has_value());
  g.stator.slot.depth = deepest + 1e-9;
  const auto p = geometry_problem(g);
  REQUIRE(p.has_value());
  CHECK(p->key == "stator.slot.depth");
}

TEST_CASE("rotor, gap band and shaft must fit inside the bore") {
  tf::mesh::Geometry g = open_slot_stator();
  g.rotor.outer_radius = g.stator.bore_radius - 0.06e-3;
  CHECK_FALSE(geometry_problem(g).has_value());
  g.rotor.outer_radius = g.stator.bore_radius - 0.04e-3;
  REQUIRE(geometry_problem(g).has_value());
  CHECK(contains(geometry_problem(g)->what, "air gap is 0.040 mm"));

  g = open_slot_stator();
  g.rotor.kind = tf::mesh::RotorKind::none;
  g.rotor.shaft_radius = 0.0;
  g.rotor.outer_radius = 0.061;
  REQUIRE(geometry_problem(g).has_value());
  CHECK(contains(geometry_problem(g)->what, "inner edge of the gap band is not inside the stator bore"));

  g = open_slot_stator();
  g.rotor.shaft_radius = g.rotor.outer_radius;
  REQUIRE(geometry_problem(g).has_value());
  CHECK(geometry_problem(g)->key == "rotor.shaft_radius");
}

tf::mesh::StatorGeometry slots(int n) {
  tf::mesh::StatorGeometry s;
  s.n_positions = n;
  return s;
}

TEST_CASE("windings with a balanced layout pass; others fail with q as a reduced fraction") {
  CHECK_FALSE(winding_problem(winding(3, 4, 2, 8), slots(36)).has_value());
  CHECK_FALSE(winding_problem(winding(2, 4, 2, 6), slots(24)).has_value());
  CHECK_FALSE(winding_problem(winding(1, 2, 2, 18), slots(36)).has_value());
  // Fractional slot (q = 9/2) and tooth coils (12 slots, 10 poles): laid out by the star of slots.
  CHECK_FALSE(winding_problem(winding(2, 6, 2, 3), slots(20)).has_value());  // q = 5/3
  CHECK_FALSE(winding_problem(winding(3, 10, 2, 1), slots(12)).has_value());
  // Two phases, 36 slots, 4 poles: the 90° belts hold 4 or 5 of the 18 spokes, never 4.5, so even
  // phase numbers need Q/(2m t) whole (here 36/(2·2·2) = 9/2).
  const auto two = winding_problem(winding(2, 4, 2, 8), slots(36));
  REQUIRE(two.has_value());
  CHECK(contains(two->expected, "Q/(2m·t) a whole number"));
  // 10 slots, 4 poles, 3 phases: Q/(m t) = 10/(3*2) is not whole, so no balanced layout exists
  // (the feasibility rule of the star of slots; e.g. N. Bianchi, M. Dai Pre, IEE Proc. EPA 153(3), 2006; from memory).
  auto p = winding_problem(winding(3, 4, 2, 1), slots(10));
  REQUIRE(p.has_value());
  CHECK(p->key == "winding.phases");
  CHECK(contains(p->what, "= 5/6 slots per pole and phase"));
  CHECK(contains(p->expected, "t = gcd(Q, p) = 2"));
  p = winding_problem(winding(3, 8, 2, 1), slots(10));
  REQUIRE(p.has_value());
  CHECK(contains(p->what, "10/(8·3) = 5/12"));
}

TEST_CASE("coil pitch: at most the pole pitch, and exactly it for a single layer") {
  CHECK_FALSE(winding_problem(winding(3, 4, 2, 9), slots(36)).has_value());
  CHECK(winding_problem(winding(3, 4, 2, 10), slots(36))->key == "winding.coil_pitch");
  CHECK_FALSE(winding_problem(winding(3, 4, 1, 9), slots(36)).has_value());
  const auto p = winding_problem(winding(3, 4, 1, 7), slots(36));
  REQUIRE(p.has_value());
  CHECK(contains(p->expected, "coil_pitch = 9"));
}

TEST_CASE("parallel paths must share the coil groups of a phase equally") {
  // Double layer: one coil group per pole (4); single layer: one per pole pair (2).
  CHECK_FALSE(winding_problem(winding(3, 4, 2, 8, 4), slots(36)).has_value());
  CHECK_FALSE(winding_problem(winding(3, 4, 1, 9, 2), slots(36)).has_value());
  const auto p = winding_problem(winding(3, 4, 1, 9, 4), slots(36));
  REQUIRE(p.has_value());
  CHECK(p->key == "winding.parallel_paths");
  CHECK(p->expected == "a divisor of 2: 1, 2");
}

TEST_CASE("a study writes at most one field file per step") {
  tf::input::StudyPlan s;
  s.n_steps = 12;
  s.n_field_files = 12;
  CHECK_FALSE(tf::input::study_problem(s).has_value());
  s.n_field_files = 13;
  REQUIRE(tf::input::study_problem(s).has_value());
  CHECK(tf::input::study_problem(s)->key == "study.field_files");
}
