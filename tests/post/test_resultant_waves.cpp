// The resultant waves of a winding, order by order, from its layout and currents: symmetric two-
// and three-phase windings with balanced currents follow the textbook rule, a single phase
// pulsates, a reversed phase and a DC sequence come out as the phasor sums worked by hand say.

#include <doctest/doctest.h>

#include <complex>
#include <numbers>
#include <string>
#include <vector>

#include "mesh/winding.hpp"
#include "post/resultant_waves.hpp"
#include "support/sample_geometry.hpp"
#include "support/winding_rule.hpp"
#include "support/winding_spec.hpp"

using namespace tf;

namespace {

/// A 24-slot, 4-pole (p = 2) double-layer winding of the sample stator.
mesh::Winding pump_winding(int phases, int pitch) {
  return mesh::lay_out(testing::winding_spec(phases, 4, 2, pitch, 10), testing::semi_closed_stator().stator);
}

std::vector<std::complex<double>> balanced(int phases) {
  solver::Supply s;
  s.peak_current = 6.0;
  return solver::supply_phasors(s, phases);
}

}  // namespace

TEST_CASE("resultant waves of symmetric 2- and 3-phase windings with balanced currents follow the textbook rule") {
  for (const auto& [m, pitch] : std::vector<std::pair<int, int>>{{3, 5}, {3, 6}, {2, 6}, {2, 5}}) {
    const mesh::Winding w = pump_winding(m, pitch);
    std::vector<int> orders;
    for (int nu = 1; nu <= 25; ++nu) orders.push_back(2 * nu);  // p = 2: mechanical n = 2 nu
    const auto waves = post::resultant_waves(w, balanced(m), 50.0, orders);
    REQUIRE(waves.size() == orders.size());
    for (const auto& r : waves) {
      const int nu = r.order / 2;
      INFO(m, " phases, pitch ", pitch, ", order ", nu, ": ", r.field, " (", r.reason, ")");
      // The 5/6 pitch of a three-phase winding leaves its 5th and 7th at k_w = 0.067, not zero;
      // a two-phase winding of pitch 5 still carries every odd order (k_p = sin(nu 75°) != 0).
      CHECK(r.field == testing::symmetric_winding_wave(nu, m));
      CHECK(r.electrical_order == nu);
      if (r.field == "forward" || r.field == "backward") {
        // The surviving wave: every phase adds in step (exact for a symmetric winding).
        CHECK(std::max(r.forward, r.backward) == doctest::Approx(1.0).epsilon(1e-9).scale(0));
        CHECK(std::min(r.forward, r.backward) < 1e-9);
        // n_s / nu with n_s = 60 f / p = 1500 rpm (definitional), signed by the direction.
        CHECK(r.speed_rpm == doctest::Approx((r.field == "forward" ? 1 : -1) * 1500.0 / nu).epsilon(1e-12).scale(0));
      }
      if (r.field == "cancels") CHECK(r.reason.find("a multiple of 3 with balanced 3-phase currents") == 0);
    }
  }
}

TEST_CASE("one phase alone pulsates: equal forward and backward waves of every order it carries") {
  // A pulsating wave is a forward and a backward wave of half its amplitude each (docs/references.md §3).
  const mesh::Winding w = pump_winding(2, 6);
  const auto waves = post::resultant_waves(w, {6.0, 0.0}, 50.0, {2, 4, 6, 10, 14});
  for (const auto& r : waves) {
    INFO("mechanical order ", r.order);
    if (r.order == 4) {
      CHECK(r.field == "absent");  // the 2nd electrical order: no even orders
      continue;
    }
    CHECK(r.field == "pulsating");
    CHECK(r.forward == doctest::Approx(1.0).epsilon(1e-12).scale(0));
    CHECK(r.backward == doctest::Approx(1.0).epsilon(1e-12).scale(0));
  }
}

TEST_CASE("a three-phase winding with phase C reversed: the phasor sums worked by hand") {
  // Phase k's parts of order nu (balanced currents, symmetric layout, phase C's sign s_2 = -1):
  // forward s_k e^{j(nu-1)k 120°}, backward s_k e^{j(nu+1)k 120°}. Fundamental: forward
  // |1 + 1 - 1| / 3 = 1/3, backward |1 + e^{j240°} - e^{j120°}| / 3 = |1 - j√3| / 3 = 2/3. Third:
  // forward |1 + e^{j240°} - e^{j120°}| / 3 = 2/3 and backward |1 + e^{j120°} - e^{j240°}| / 3 = 2/3,
  // so the 3rd no longer cancels but pulsates.
  mesh::Winding w = pump_winding(3, 5);
  for (auto& s : w.sides)
    if (s.phase == 2) s.direction = -s.direction;
  const auto waves = post::resultant_waves(w, balanced(3), 50.0, {2, 6});
  REQUIRE(waves.size() == 2);
  CHECK(waves[0].forward == doctest::Approx(1.0 / 3).epsilon(1e-9).scale(0));
  CHECK(waves[0].backward == doctest::Approx(2.0 / 3).epsilon(1e-9).scale(0));
  CHECK(waves[0].field == "elliptic");  // neither wave 10 times the other, nor equal
  CHECK(waves[0].speed_rpm == doctest::Approx(-1500.0).epsilon(1e-12).scale(0));  // the backward one leads
  CHECK(waves[1].field == "pulsating");
  CHECK(waves[1].forward == doctest::Approx(2.0 / 3).epsilon(1e-9).scale(0));
  CHECK(waves[1].backward == doctest::Approx(2.0 / 3).epsilon(1e-9).scale(0));
  CHECK(waves[1].reason.find("multiple of 3") == std::string::npos);  // not balanced-symmetric any more
}

TEST_CASE("a DC sequence A+, B+, A-, B- has the fundamental of a balanced two-phase set") {
  // DFT of the states by hand: I_A = (2/4)(1 + (-1)(-1)) = 1, I_B = (2/4)(e^{-j90°} + (-1) e^{-j270°}) = -j:
  // equal peaks, B lagging A by 90° (the project's balanced two-phase set).
  solver::Supply s;
  s.kind = solver::SupplyKind::stepped_dc;
  s.states = {{1, 0}, {0, 1}, {-1, 0}, {0, -1}};
  const auto i = post::fundamental_currents(s, 2);
  REQUIRE(i.has_value());
  CHECK(std::abs((*i)[0] - std::complex<double>(1.0, 0.0)) < 1e-12);
  CHECK(std::abs((*i)[1] - std::complex<double>(0.0, -1.0)) < 1e-12);
  s.kind = solver::SupplyKind::split_phase;
  CHECK_FALSE(post::fundamental_currents(s, 2).has_value());  // known only once the field is solved
}
