// Sector models: which sector a winding and rotor allow (mesh::choose_sector), and the mesh of a
// sector: its sliding arc, its paired cuts and its regions.
//
// Reference for the choices: the star of slots. Slot s sits at p * 2*pi*(s - 1)/Q electrical, so S
// slots on is p*2*pi*S/Q further; the winding repeats with the same sign when that is a whole
// number of periods and with the opposite sign at an odd number of half periods (J. Pyrhönen,
// T. Jokinen, V. Hrabovcová, Design of Rotating Electrical Machines, Wiley 2008, ch. 2, from
// memory); each case below works that out by hand.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "mesh/build.hpp"
#include "mesh/symmetry.hpp"
#include "support/sample_geometry.hpp"
#include "support/sector_machine.hpp"
#include "support/winding_spec.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

mesh::SectorChoice chosen(const mesh::Geometry& g, const mesh::WindingSpec& spec) {
  const auto s = mesh::choose_sector(g, mesh::lay_out(spec, g.stator));
  REQUIRE(s.has_value());
  return *s;
}

}  // namespace

TEST_CASE("choose_sector: integral-slot and tooth-coil windings on a smooth rotor") {
  mesh::Geometry g24 = testing::semi_closed_stator();
  // 24 slots, 2p = 4, q = 2, pitch 5/6: 30° electrical per slot; 6 slots = 180° (one pole pitch):
  // anti-periodic. 2 or 3 slots move the belt to another phase, 4 slots = 120° does too.
  mesh::SectorChoice s = chosen(g24, testing::winding_spec(3, 4, 2, 5, 1));
  CHECK(s.slots == 6);
  CHECK(s.copies == 4);
  CHECK(s.anti_periodic);
  // 36 slots, 2p = 4: 20° per slot, 9 slots = 180°.
  mesh::Geometry g36 = testing::open_slot_stator();
  s = chosen(g36, testing::winding_spec(3, 4, 2, 8, 1));
  CHECK(s.slots == 9);
  CHECK(s.anti_periodic);
  // 12 slots, 2p = 10 tooth coils, double layer: 150° per slot, 6 slots = 900° = 2.5 periods, so
  // the sign flips; t = gcd(12, 5) = 1, so nothing shorter repeats.
  mesh::Geometry g12 = testing::semi_closed_stator();
  g12.stator.n_positions = 12;
  s = chosen(g12, testing::winding_spec(3, 10, 2, 1, 1));
  CHECK(s.slots == 6);
  CHECK(s.anti_periodic);
  // 2p = 2 on 24 slots: half the machine (12 slots = 180°) anti-periodic is the only sector.
  s = chosen(g24, testing::winding_spec(3, 2, 2, 10, 1));
  CHECK(s.slots == 12);
  CHECK(s.anti_periodic);
}

TEST_CASE("choose_sector: the rotor must repeat, and magnets with the winding's sign") {
  mesh::Geometry g = testing::magnet_machine();
  const mesh::WindingSpec spec = testing::winding_spec(3, 4, 2, 5, 1);
  // 4 magnet poles on 24 slots: 6 slots = one pole pitch (j = 1, odd): anti-periodic like the winding.
  mesh::SectorChoice s = chosen(g, spec);
  CHECK(s.slots == 6);
  CHECK(s.anti_periodic);
  // 8 magnet poles under the 4-pole winding: 6 slots = 2 magnet pole pitches (periodic) while the
  // winding flips; 12 slots: 4 magnet pitches and one winding period, both periodic.
  g.rotor.magnets.n_poles = 8;
  s = chosen(g, spec);
  CHECK(s.slots == 12);
  CHECK_FALSE(s.anti_periodic);
  // Bars carry no current here, so geometry alone counts: 28 bars repeat every 7 bars = 6 slots.
  g.rotor.kind = mesh::RotorKind::slotted;
  g.rotor.bars = {.count = 28, .width = 0.003, .depth = 0.008, .bridge = 0.0005, .opening_width = 0.0};
  s = chosen(g, spec);
  CHECK(s.slots == 6);
  // 26 bars: 26 S / 24 is whole first at S = 12.
  g.rotor.bars.count = 26;
  s = chosen(g, spec);
  CHECK(s.slots == 12);
  CHECK_FALSE(s.anti_periodic);
  // 25 bars (coprime to 24): only the full model.
  g.rotor.bars.count = 25;
  CHECK_FALSE(mesh::choose_sector(g, mesh::lay_out(spec, g.stator)).has_value());
}

TEST_CASE("a sector mesh: a quarter of the 24-slot magnet machine") {
  const mesh::Geometry g = testing::magnet_machine();
  const mesh::Winding w = testing::magnet_machine_winding(g);
  const auto [full, sector] = testing::full_and_sector(g, w);
  CHECK(sector.symmetry.copies == 4);
  CHECK(sector.symmetry.anti_periodic);
  CHECK(full.symmetry.copies == 1);
  // The same node pitch on the sliding circle: a quarter of the nodes per side.
  CHECK(sector.sliding.stator_nodes.size() * 4 == full.sliding.stator_nodes.size());
  CHECK(sector.sliding.rotor_nodes.size() == sector.sliding.stator_nodes.size());
  REQUIRE(sector.sliding.stator_end >= 0);
  REQUIRE(sector.sliding.rotor_end >= 0);
  // The full mesh is four copies of the sector's triangles: a quarter of its area, to rounding
  // (both fall short of the disc by the polygonal outer arc).
  double area = 0.0, full_area = 0.0;
  for (double a : mesh::region_areas(sector)) area += a;
  for (double a : mesh::region_areas(full)) full_area += a;
  const double r = g.stator.outer_radius;
  CHECK(area == doctest::Approx(full_area / 4).epsilon(1e-12).scale(0));
  CHECK(area == doctest::Approx(kPi * r * r / 4).epsilon(1e-3).scale(0));
  // Slots 1..6 only; magnet poles 1 and 2 only (pole 1 on the +x axis, the sector from -7.5° to 82.5°,
  // pole 2 at 90° cut by its end: both appear).
  CHECK(mesh::find_region(sector, mesh::RegionKind::coil, 6, 2) >= 0);
  CHECK(mesh::find_region(sector, mesh::RegionKind::coil, 7, 1) < 0);
  CHECK(mesh::find_region(sector, mesh::RegionKind::magnet, 3) < 0);
  // Each end-cut node is its start-cut image turned by the sector angle.
  const double span = 2 * kPi / 4;
  REQUIRE(sector.symmetry.cut_pairs.size() > 10);
  double worst = 0.0;
  for (const auto& [end, start] : sector.symmetry.cut_pairs) {
    const Eigen::Vector2d p = sector.nodes.row(end), q = sector.nodes.row(start);
    const Eigen::Vector2d turned(std::cos(span) * q(0) - std::sin(span) * q(1),
                                 std::sin(span) * q(0) + std::cos(span) * q(1));
    worst = std::max(worst, (p - turned).norm());
  }
  CHECK(worst < 1e-9 * r);
  // A sector that does not repeat round the machine is refused.
  CHECK_THROWS_AS(mesh::build(g, {2, false}, {.sector_slots = 5}), mesh::MeshError);
  CHECK_THROWS_AS(mesh::build(g, {2, false}, {.sector_slots = 8, .anti_periodic = true}), mesh::MeshError);
}
