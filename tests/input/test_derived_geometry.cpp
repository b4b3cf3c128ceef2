// The derived geometry `turnfield check` prints, against hand-worked values, limits of Carter's
// formula and the areas of the mesh the case is solved on.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <string>

#include "input/case_reader.hpp"
#include "input/derived_geometry.hpp"
#include "mesh/build.hpp"
#include "mesh/winding_spec.hpp"

using namespace tf;

namespace {

const std::string source_dir = TF_SOURCE_DIR;

/// Area [m^2] of the regions of slot 1 (coil sides and opening) of a mesh.
double slot_one_area(const mesh::Mesh& m, bool coils_only) {
  const std::vector<double> areas = mesh::region_areas(m);
  double sum = 0.0;
  for (std::size_t r = 0; r < m.regions.size(); ++r) {
    const mesh::Region& g = m.regions[r];
    if (g.slot != 1) continue;
    if (g.kind == mesh::RegionKind::coil || (!coils_only && g.kind == mesh::RegionKind::slot_air)) sum += areas[r];
  }
  return sum;
}

}  // namespace

TEST_CASE("Carter's factor: a hand-worked value and its limits") {
  // Carter (1901), in the form of Pyrhonen et al., "Design of Rotating Electrical Machines" (2008),
  // ch. 3 (from memory): k_C = tau / (tau - gamma g), gamma = (4/pi)[x atan x - ln sqrt(1 + x^2)],
  // x = b / 2g. Worked by hand for cases/pump24_three_phase.toml: tau = 2 pi 50 mm / 24 = 13.090 mm,
  // b = 2.5 mm, g = 0.4 mm: x = 3.125, atan x = 1.26103, ln sqrt(1 + x^2) = 1.18820,
  // gamma = 1.27324 (3.94072 - 1.18820) = 3.50461, gamma g = 1.40184 mm, k_C = 13.090 / 11.688 = 1.1199.
  const double tau = 2 * std::numbers::pi * 0.050 / 24;
  CHECK(input::carter_factor(tau, 0.0025, 0.0004) == doctest::Approx(1.1199).epsilon(2e-4));
  // No opening: no slotting effect. A wide opening over a vanishing gap: the whole opening is lost,
  // k_C -> tau / (tau - b).
  CHECK(input::carter_factor(tau, 1e-9, 0.0004) == doctest::Approx(1.0).epsilon(1e-9));
  CHECK(input::carter_factor(tau, 0.0025, 1e-8) == doctest::Approx(tau / (tau - 0.0025)).epsilon(1e-4));
}

TEST_CASE("the sliver of a slot below the bore's tangent: the integral of r - sqrt(r^2 - y^2), by Simpson's rule") {
  const double r = 0.05, w = 0.007;
  const int n = 2000;  // Simpson's rule on [-w/2, w/2], exact to far below the checked digits
  double sum = 0.0;
  for (int i = 0; i <= n; ++i) {
    const double y = -w / 2 + w * i / n;
    const double f = r - std::sqrt(r * r - y * y);
    sum += f * (i == 0 || i == n ? 1 : i % 2 == 1 ? 4 : 2);
  }
  CHECK(input::bore_sliver(r, w) == doctest::Approx(sum * w / n / 3).epsilon(1e-9));
  CHECK(input::bore_sliver(r, w) == doctest::Approx(w * w * w / (24 * r)).epsilon(2e-3));  // small-slot limit
}

TEST_CASE("the derived geometry of bundled cases: hand-worked values and the mesh's own areas") {
  const input::Case c = input::read_case(source_dir + "/cases/pump24_three_phase.toml");
  const input::DerivedGeometry d = input::derive_geometry(c);
  // Bore 50 mm, rotor 49.6 mm, 24 semi-closed slots 7 mm wide, 16 mm deep, tips 0.8 mm, wedge
  // 0.7 mm, opening 2.5 mm; double layer, 12 turns per coil; 4 poles, 3 phases, 50 Hz.
  REQUIRE(d.air_gap);
  CHECK(*d.air_gap == doctest::Approx(0.0004).epsilon(1e-9));
  CHECK(d.slot_pitch == doctest::Approx(2 * std::numbers::pi * 0.05 / 24).epsilon(1e-12));
  CHECK(d.coil_area == doctest::Approx(0.007 * (0.016 - 0.0008 - 0.0007)).epsilon(1e-12));  // 101.5 mm^2
  CHECK(d.conductors == 24);
  CHECK(d.q_numerator == 2);
  CHECK(d.q_denominator == 1);
  REQUIRE(d.synchronous_rpm);
  CHECK(*d.synchronous_rpm == doctest::Approx(1500.0));  // 60 f / p
  // The tooth behind the tips: the chord 2 r sin(pi/Q - asin(w / 2r)) at r = 50.8 mm (6.29 mm).
  REQUIRE(d.tooth_narrowest);
  CHECK(*d.tooth_narrowest == doctest::Approx(2 * 0.0508 * std::sin(std::numbers::pi / 24 - std::asin(0.0035 / 0.0508))));
  // The mesh the case is solved on holds the same areas (its bore arc is a polygon: 0.1 %).
  const mesh::Mesh m = mesh::build(c.geometry, mesh::slot_layers(c.winding), {1.0});
  CHECK(slot_one_area(m, true) == doctest::Approx(d.coil_area).epsilon(1e-6));
  REQUIRE(d.slot_area);
  CHECK(slot_one_area(m, false) == doctest::Approx(*d.slot_area).epsilon(1e-3));

  // Tooth coils, 12 slots and 10 poles: q = 12 / (10 * 3) = 2/5 (a fractional-slot winding).
  const input::DerivedGeometry t = input::derive_geometry(input::read_case(source_dir + "/cases/tooth12_10_three_phase.toml"));
  CHECK(t.q_numerator == 2);
  CHECK(t.q_denominator == 5);
}
