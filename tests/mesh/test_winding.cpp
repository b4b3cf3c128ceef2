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
  stator.n_positions = slots;
  return mesh::lay_out(s, stator);
}

double kw(const mesh::Winding& w, int electrical_order) {
  return mesh::layout_winding_factor(w, 0, electrical_order * w.spec.pole_pairs());
}

}  // namespace

TEST_CASE("worked winding factors, 36 slots 4 poles three-phase") {
  // docs/references.md §2 (Pyrhönen, Jokinen, Hrabovcová, Design of Rotating Electrical Machines, 2008, ch. 2).
  const auto full = wind(36, 4, 3, 2, 9);
  CHECK(kw(full, 1) == doctest::Approx(0.9598).epsilon(1e-4).scale(0));
  CHECK(kw(full, 5) == doctest::Approx(0.2176).epsilon(1e-3).scale(0));
  CHECK(kw(full, 7) == doctest::Approx(0.1774).epsilon(1e-3).scale(0));
  CHECK(kw(full, 17) == doctest::Approx(0.9598).epsilon(1e-4).scale(0));  // slot harmonics Q/p -+ 1
  CHECK(kw(full, 19) == doctest::Approx(0.9598).epsilon(1e-4).scale(0));
  CHECK(kw(wind(36, 4, 3, 2, 8), 1) == doctest::Approx(0.9452).epsilon(1e-4).scale(0));
  const auto short79 = wind(36, 4, 3, 2, 7);
  CHECK(kw(short79, 1) == doctest::Approx(0.9019).epsilon(1e-4).scale(0));
  CHECK(kw(short79, 5) == doctest::Approx(0.0378).epsilon(2e-3).scale(0));
  CHECK(kw(short79, 7) == doctest::Approx(0.1359).epsilon(1e-3).scale(0));
}

TEST_CASE("worked winding factors, 24 slots 4 poles three-phase") {
  // docs/references.md §2: full pitch 0.9659, 5/6 pitch 0.9330 with k_w5 = k_w7 = 0.0670.
  CHECK(kw(wind(24, 4, 3, 2, 6), 1) == doctest::Approx(0.9659).epsilon(1e-4).scale(0));
  CHECK(kw(wind(24, 4, 3, 1, 6), 1) == doctest::Approx(0.9659).epsilon(1e-4).scale(0));
  const auto short56 = wind(24, 4, 3, 2, 5);
  CHECK(kw(short56, 1) == doctest::Approx(0.9330).epsilon(1e-4).scale(0));
  CHECK(kw(short56, 5) == doctest::Approx(0.0670).epsilon(2e-3).scale(0));
  CHECK(kw(short56, 7) == doctest::Approx(0.0670).epsilon(2e-3).scale(0));
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
        // Absolute: the factors are at most 1, and many are zero.
        CHECK(std::abs(mesh::layout_winding_factor(w, phase, f.order * w.spec.pole_pairs()) - f.total) < 1e-9);
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
    CHECK(used.size() == static_cast<std::size_t>(2 * w.n_positions));
    for (int k = 0; k < phases; ++k) {
      CHECK(sides[k] == sides[0]);
      CHECK(net[k] == 0);  // as many go as return sides
    }
    // Phase k's fundamental axis leads phase A's by k * shift electrical (DEVELOPERS.md, "Conventions").
    const double shift = phases % 2 ? 2 * std::numbers::pi / phases : std::numbers::pi / phases;
    const int p = w.spec.pole_pairs();
    auto axis = [&](int phase) {
      std::complex<double> sum = 0.0;
      for (const auto& s : w.sides)
        if (s.phase == phase) sum += double(s.direction) * std::polar(1.0, p * 2 * std::numbers::pi * (s.slot - 1) / w.n_positions);
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
  CHECK(w.series_turns() == doctest::Approx(56.0).scale(0));
  w.spec.parallel_paths = 2;
  CHECK(w.series_turns() == doctest::Approx(28.0).scale(0));
}

TEST_CASE("tooth-coil windings laid out by the star of slots have the published winding factors") {
  // A. M. El-Refaie, "Fractional-slot concentrated-windings synchronous permanent magnet machines",
  // IEEE Trans. Ind. Electron. 57(1), 2010, Table I (from memory; docs/references.md §2):
  // 12 slots / 10 poles 0.9330 (double layer) and 0.9659 (single layer); 9 slots / 8 poles 0.9452.
  const auto w12 = wind(12, 10, 3, 2, 1);
  CHECK(w12.rule == mesh::LayoutRule::star_of_slots);
  CHECK(mesh::layout_winding_factor(w12, 0, 5) == doctest::Approx(0.9330).epsilon(1e-4).scale(0));
  CHECK(mesh::layout_winding_factor(wind(12, 10, 3, 1, 1), 0, 5) == doctest::Approx(0.9659).epsilon(1e-4).scale(0));
  CHECK(mesh::layout_winding_factor(wind(9, 8, 3, 2, 1), 0, 4) == doctest::Approx(0.9452).epsilon(1e-4).scale(0));
  // Every phase alike: the same factor in B and C.
  for (int phase = 1; phase < 3; ++phase)
    CHECK(mesh::layout_winding_factor(w12, phase, 5) == doctest::Approx(0.9330).epsilon(1e-4).scale(0));
  // 12/10 repeats once round the bore (t = gcd(12, 5) = 1) and carries the sub-harmonic orders 1 and 3.
  CHECK(w12.periodicity() == 1);
  const auto orders = mesh::space_orders(w12, 5);
  REQUIRE(orders.size() >= 2);
  CHECK(orders[0].first == 1);
  CHECK(orders[1].first == 3);
}

/// Forward and backward amplitudes of mechanical order n of the conductor distribution of all phases
/// fed by balanced currents: with S_k = Σ_sides s N e^{jnθ} over phase k, the order-n wave is
/// e^{jωt} Σ I_k S_k / 2 (counter-clockwise) + e^{-jωt} Σ conj(I_k) S_k / 2 (clockwise).
std::pair<double, double> resultant_waves(const mesh::Winding& w, int n) {
  const int m = w.spec.n_phases;
  const double shift = m % 2 ? 2 * std::numbers::pi / m : std::numbers::pi / m;
  std::complex<double> f = 0.0, b = 0.0;
  for (const auto& s : w.sides) {
    const std::complex<double> current = std::polar(1.0, -s.phase * shift);
    const std::complex<double> place = double(s.direction * s.turns) * std::polar(1.0, n * s.angle);
    f += current * place;
    b += std::conj(current) * place;
  }
  return {0.5 * std::abs(f), 0.5 * std::abs(b)};
}

TEST_CASE("resultant space orders: 6k -+ 1 for three-phase, all odd orders for two-phase, each turning its way") {
  // Standard theory (docs/references.md §3; Fitzgerald, Kingsley, Umans, Electric Machinery, ch. 4;
  // from memory): balanced three-phase windings carry 6k - 1 backward and 6k + 1 forward; two-phase
  // windings 4k - 1 backward and 4k + 1 forward, the 3rd not cancelled. A single phase still carries
  // the triplens; the balanced currents cancel them.
  const auto three = wind(36, 4, 3, 2, 8);
  const int p = 2;
  const double fundamental = resultant_waves(three, p).first;
  CHECK(resultant_waves(three, p).second < 1e-9 * fundamental);
  CHECK(mesh::layout_winding_factor(three, 0, 3 * p) > 0.1);  // present in one phase ...
  for (int nu = 2; nu <= 25; ++nu) {
    INFO("electrical order " << nu);
    const auto [fwd, bwd] = resultant_waves(three, nu * p);
    if (nu % 6 == 1) CHECK((fwd > 1e-3 * fundamental && bwd < 1e-9 * fundamental));
    else if (nu % 6 == 5) CHECK((bwd > 1e-3 * fundamental && fwd < 1e-9 * fundamental));
    else CHECK(fwd + bwd < 1e-9 * fundamental);  // ... but not in the resultant
  }
  const auto two = wind(24, 4, 2, 2, 6);
  const double f2 = resultant_waves(two, p).first;
  for (int nu = 2; nu <= 15; ++nu) {
    INFO("two-phase, electrical order " << nu);
    const auto [fwd, bwd] = resultant_waves(two, nu * p);
    if (nu % 4 == 1) CHECK((fwd > 1e-3 * f2 && bwd < 1e-9 * f2));
    else if (nu % 4 == 3) CHECK((bwd > 1e-3 * f2 && fwd < 1e-9 * f2));
    else CHECK(fwd + bwd < 1e-9 * f2);
  }
}

TEST_CASE("a slot table is taken as given, and an unbalanced one is refused") {
  mesh::StatorGeometry stator;
  stator.n_positions = 4;
  mesh::WindingSpec spec;
  spec.n_phases = 2;
  spec.n_poles = 2;
  spec.n_layers = 1;
  spec.explicit_sides = {{1, 1, 0, 1, 5, 0}, {2, 1, 1, 1, 5, 0}, {3, 1, 0, -1, 5, 0}, {4, 1, 1, -1, 5, 0}};
  const auto w = mesh::lay_out(spec, stator);
  CHECK(w.rule == mesh::LayoutRule::table);
  CHECK(w.sides.size() == 4);
  CHECK(w.sides[2].angle == doctest::Approx(std::numbers::pi).scale(0));
  spec.explicit_sides[3].turns = 6;  // phase B: 5 go, 6 return conductors
  CHECK(mesh::layout_problem(spec, stator).has_value());
}
