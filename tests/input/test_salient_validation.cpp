// Consistency checks of salient-pole stators at their boundaries: each limit is computed here from
// the outline drawn in mesh/salient_outline.hpp (a pole of testing::salient_stator(), the stator of
// cases/salient4_two_phase.toml), and a value just inside passes while one just outside is refused
// with the key to blame. The 0.5 mm and 1 mm minimums are our own choices (app/case_validation.cpp).

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <string>

#include "input/case_validation.hpp"
#include "support/sample_geometry.hpp"

namespace {

using tf::input::geometry_problem;
constexpr double kPi = std::numbers::pi;

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

/// Sets one dimension just inside and just outside its limit; the first passes, the second is
/// refused with `key` and a message containing `what`.
template <class Set>
void check_limit(tf::mesh::Geometry g, double limit, bool limit_is_max, Set set, const std::string& key,
                 const std::string& what) {
  const double inside = limit_is_max ? 1 - 1e-9 : 1 + 1e-9, outside = limit_is_max ? 1 + 1e-9 : 1 - 1e-9;
  set(g, limit * inside);
  CHECK_FALSE(geometry_problem(g).has_value());
  set(g, limit * outside);
  const auto p = geometry_problem(g);
  REQUIRE(p.has_value());
  CHECK(p->key == key);
  CHECK(contains(p->what, what));
}

}  // namespace

TEST_CASE("the salient-pole demo stator passes every check") {
  CHECK_FALSE(geometry_problem(tf::testing::salient_stator()).has_value());
}

TEST_CASE("neighbouring shoes stay 0.5 mm apart at the bore") {
  // Shoe tips are radial, 2*pi/P - shoe_arc apart: the chord 2 R_b sin((2*pi/P - arc)/2) = 0.5 mm.
  const double widest = kPi / 2 - 2 * std::asin(0.25e-3 / 0.030);
  check_limit(tf::testing::salient_stator(), widest, true,
              [](auto& geo, double v) { geo.stator.poles.shoe_arc = v; }, "stator.poles.shoe_arc_deg",
              "closer than the minimum 0.50 mm");
}

TEST_CASE("the shoe reaches 0.5 mm past the body on each side at its back") {
  // Half the chord of the shoe back (r = 33 mm, ±30°) is 16.5 mm; less 0.5 mm, twice: 32 mm.
  check_limit(tf::testing::salient_stator(), 0.032, true,
              [](auto& geo, double v) { geo.stator.poles.body_width = v; }, "stator.poles.body_width",
              "past the body on each side");
}

TEST_CASE("the yoke behind the pole bodies is at least 1 mm") {
  // 60 mm outer radius - 1 mm - 30 mm bore - 3 mm shoe = 26 mm of body at most.
  check_limit(tf::testing::salient_stator(), 0.026, true,
              [](auto& geo, double v) { geo.stator.poles.body_height = v; }, "stator.poles.body_height",
              "thinner than the minimum 1.00 mm");
}

TEST_CASE("coil sides: no longer than the body, clear of the next pole's coil sides and of the yoke") {
  auto g = tf::testing::salient_stator();
  g.stator.poles.coil_height = 0.0181;
  auto p = geometry_problem(g);
  REQUIRE(p.has_value());
  CHECK(p->key == "stator.poles.coil_height");
  CHECK(contains(p->what, "longer than the pole body"));

  // The coil sides start at x = sqrt(33^2 - 7^2) mm; their outer edges y = 7 mm + coil width come
  // within 0.25 mm of the line at 45° between two poles when x sin 45° - y cos 45° = 0.25 mm.
  // Shorter coil sides here, so that wide ones stay clear of the yoke.
  const double floor = std::sqrt(1040.0) * 1e-3;
  const double widest = floor - 0.25e-3 / std::sin(kPi / 4) - 0.007;
  g = tf::testing::salient_stator();
  g.stator.poles.coil_height = 0.005;
  check_limit(g, widest, true, [](auto& geo, double v) { geo.stator.poles.coil_width = v; }, "stator.poles.coil_width",
              "coil sides of neighbouring poles are 0.50 mm apart");

  // The outer corner (x = floor + height, y = 15 mm) stays 0.5 mm inside the yoke circle of 51 mm.
  const double highest = std::sqrt(0.0505 * 0.0505 - 0.015 * 0.015) - floor;
  check_limit(tf::testing::salient_stator(), highest, true,
              [](auto& geo, double v) { geo.stator.poles.coil_height = v; }, "stator.poles.coil_height",
              "short of the yoke");
}

TEST_CASE("the rotor must clear the pole faces") {
  auto g = tf::testing::salient_stator();
  g.rotor.outer_radius = 0.030;
  const auto p = geometry_problem(g);
  REQUIRE(p.has_value());
  CHECK(p->key == "rotor.outer_radius");
  CHECK(contains(p->what, "touches or overlaps the pole faces"));
}
