// Winding layout and winding factors against closed forms and worked values.

#include <doctest/doctest.h>

#include <cmath>
#include <complex>
#include <map>
#include <numbers>
#include <set>

#include "mesh/winding.hpp"

using namespace tf;

namespace {

mesh::Winding wind(int slots, int poles, int phases, int layers, int pitch) {
  mesh::WindingSpec s;
  s.n_phases = phases;
  s.n_poles = poles;
  s.n_layers = layers;
  s.coil_pitch = pitch;
  s.turns_per_coil = 7;
  mesh::StatorGeometry stator;
  stator.n_slots = slots;
  return mesh::lay_out(s, stator);
}

double kw(const mesh::Winding& w, int electrical_order) {
  return mesh::layout_winding_factor(w, 0, electrical_order * w.spec.pole_pairs());
}

}  // namespace

TEST_CASE("worked winding factors, 36 slots 4 poles three-phase") {
  // ../shared/CHECKS.md §2 (Pyrhönen, Jokinen, Hrabovcová, Design of Rotating Electrical Machines, 2008, ch. 2).
  const auto full = wind(36, 4, 3, 2, 9);
  CHECK(kw(full, 1) == doctest::Approx(0.9598).epsilon(1e-4));
  CHECK(kw(full, 5) == doctest::Approx(0.2176).epsilon(1e-3));
  CHECK(kw(full, 7) == doctest::Approx(0.1774).epsilon(1e-3));
  CHECK(kw(full, 17) == doctest::Approx(0.9598).epsilon(1e-4));  // slot harmonics Q/p -+ 1
  CHECK(kw(full, 19) == doctest::Approx(0.9598).epsilon(1e-4));
  CHECK(kw(wind(36, 4, 3, 2, 8), 1) == doctest::Approx(0.9452).epsilon(1e-4));
  const auto short79 = wind(36, 4, 3, 2, 7);
  CHECK(kw(short79, 1) == doctest::Approx(0.9019).epsilon(1e-4));
  CHECK(kw(short79, 5) == doctest::Approx(0.0378).epsilon(2e-3));
  CHECK(kw(short79, 7) == doctest::Approx(0.1359).epsilon(1e-3));
}

TEST_CASE("worked winding factors, 24 slots 4 poles three-phase") {
  // ../shared/CHECKS.md §2: full pitch 0.9659, 5/6 pitch 0.9330 with k_w5 = k_w7 = 0.0670.
  CHECK(kw(wind(24, 4, 3, 2, 6), 1) == doctest::Approx(0.9659).epsilon(1e-4));
  CHECK(kw(wind(24, 4, 3, 1, 6), 1) == doctest::Approx(0.9659).epsilon(1e-4));
  const auto short56 = wind(24, 4, 3, 2, 5);
  CHECK(kw(short56, 1) == doctest::Approx(0.9330).epsilon(1e-4));
  CHECK(kw(short56, 5) == doctest::Approx(0.0670).epsilon(2e-3));
  CHECK(kw(short56, 7) == doctest::Approx(0.0670).epsilon(2e-3));
}

TEST_CASE("the laid-out winding matches the closed-form distribution and pitch factors") {
  // k_w = k_d k_p (Pyrhönen et al. 2008, ch. 2) for every integral-slot layout we make,
  // every phase, every order up to 25; two-phase and five-phase included.
  struct Layout { int slots, poles, phases, layers, pitch; };
  const Layout layouts[] = {{36, 4, 3, 2, 9}, {36, 4, 3, 2, 7}, {24, 4, 3, 1, 6}, {24, 4, 2, 2, 6},
                            {24, 4, 2, 2, 5}, {48, 8, 2, 1, 6}, {40, 4, 5, 2, 8},  {54, 6, 3, 2, 8},
                            {12, 2, 3, 2, 5}, {6, 2, 3, 1, 3}};
  for (const auto& l : layouts) {
    const auto w = wind(l.slots, l.poles, l.phases, l.layers, l.pitch);
    for (const auto& f : mesh::winding_factors(w, 25))
      for (int phase = 0; phase < l.phases; ++phase) {
        INFO(l.slots << " slots " << l.poles << " poles " << l.phases << " phases pitch " << l.pitch << " order " << f.order);
        CHECK(mesh::layout_winding_factor(w, phase, f.order * w.spec.pole_pairs()) ==
              doctest::Approx(f.total).epsilon(1e-9));
      }
  }
}

TEST_CASE("every slot-layer is used once and the phases are balanced, with axes a phase shift apart") {
  for (int phases : {2, 3, 5}) {
    const auto w = wind(phases * 12, 4, phases, 2, phases * 3 - 1);
    std::set<std::pair<int, int>> used;
    std::map<int, int> sides, net;
    for (const auto& s : w.sides) {
      CHECK(used.insert({s.slot, s.layer}).second);
      sides[s.phase] += 1;
      net[s.phase] += s.direction;
    }
    CHECK(used.size() == static_cast<std::size_t>(2 * w.n_slots));
    for (int k = 0; k < phases; ++k) {
      CHECK(sides[k] == sides[0]);
      CHECK(net[k] == 0);  // as many go as return sides
    }
    // Phase k's fundamental axis leads phase A's by k * shift electrical (../shared/DESIGN.md §5).
    const double shift = phases % 2 ? 2 * std::numbers::pi / phases : std::numbers::pi / phases;
    const int p = w.spec.pole_pairs();
    auto axis = [&](int phase) {
      std::complex<double> sum = 0.0;
      for (const auto& s : w.sides)
        if (s.phase == phase) sum += double(s.direction) * std::polar(1.0, p * 2 * std::numbers::pi * (s.slot - 1) / w.n_slots);
      return std::arg(sum) - std::numbers::pi / 2;  // current density peak leads the B_r axis by 90°
    };
    for (int k = 1; k < phases; ++k)
      CHECK(std::remainder(axis(k) - axis(0) - k * shift, 2 * std::numbers::pi) == doctest::Approx(0.0).epsilon(1e-9));
    CHECK(std::remainder(axis(0) - w.phase_a_axis, 2 * std::numbers::pi) == doctest::Approx(0.0).epsilon(1e-9));
  }
}

TEST_CASE("series turns count the conductors of one phase over two and the parallel paths") {
  auto w = wind(24, 4, 3, 2, 5);
  // 24 slots x 2 layers / 3 phases = 16 coil sides of 7 conductors = 112 conductors -> 56 turns.
  CHECK(w.series_turns() == doctest::Approx(56.0));
  w.spec.parallel_paths = 2;
  CHECK(w.series_turns() == doctest::Approx(28.0));
}
