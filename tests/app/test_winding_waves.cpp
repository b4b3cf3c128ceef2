// `turnfield winding` says, order by order, how the resultant field of the case's winding and
// currents turns, pulsates or cancels, and why: checked on the bundled cases against the rule of
// symmetric windings and against the phasor sums of an unbalanced set worked by hand.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <string>

#include <nlohmann/json.hpp>

#include "support/cli_run.hpp"
#include "support/winding_rule.hpp"

using tf::testing::turnfield;

namespace {

std::string bundled(const std::string& name) { return std::string(TF_SOURCE_DIR) + "/cases/" + name + ".toml"; }

nlohmann::json winding_json(const std::string& name) {
  const auto r = turnfield("winding --json " + bundled(name));
  INFO(r.output);
  REQUIRE(r.status == 0);
  return nlohmann::json::parse(r.output);
}

}  // namespace

TEST_CASE("winding: the resultant wave of each order of the bundled two- and three-phase windings, as the textbook says") {
  for (const auto& [name, m] : {std::pair<const char*, int>{"pump24_three_phase", 3}, {"pump24_two_phase", 2}}) {
    const auto waves = winding_json(name)["resultant_waves"];
    REQUIRE(waves.size() == 13);  // p = 2, integral slot: the whole electrical orders 1 .. 13
    for (const auto& w : waves) {
      const int nu = static_cast<int>(w["electrical_order"].get<double>());
      INFO(name, ", order ", nu, ": ", w["reason"].get<std::string>());
      CHECK(w["field"] == tf::testing::symmetric_winding_wave(nu, m));
      // n_s / nu with n_s = 60 f / p = 1500 rpm at 50 Hz, 4 poles.
      if (w["field"] == "forward") CHECK(w["speed_rpm"].get<double>() == doctest::Approx(1500.0 / nu).epsilon(1e-9).scale(0));
      if (w["field"] == "backward") CHECK(w["speed_rpm"].get<double>() == doctest::Approx(-1500.0 / nu).epsilon(1e-9).scale(0));
      if (w["field"] == "cancels") CHECK(w["speed_rpm"].is_null());
    }
  }
  // As text, with the reason spelt out.
  const auto text = turnfield("winding " + bundled("pump24_three_phase"));
  REQUIRE(text.status == 0);
  CHECK(text.output.find("cancels              –  a multiple of 3 with balanced 3-phase currents") != std::string::npos);
  CHECK(text.output.find("backward          -300  turns at n_s/5") != std::string::npos);
}

TEST_CASE("winding: B lagging A by 60° on a two-phase winding makes an elliptic field, as the phasor sums say") {
  // Phase B's axis leads A's by 90° el. and its current lags by 60°: the forward parts of the
  // fundamental are 1 and e^{j(90° - 60°)}, the backward ones 1 and e^{j(90° + 60°)}, so
  // forward = |1 + e^{j30°}|/2 = cos 15° and backward = |1 + e^{j150°}|/2 = cos 75° (derived).
  const auto waves = winding_json("pump24_two_phase_60deg")["resultant_waves"];
  const double deg = std::numbers::pi / 180;
  CHECK(waves[0]["field"] == "elliptic");
  CHECK(waves[0]["forward"].get<double>() == doctest::Approx(std::cos(15 * deg)).epsilon(1e-9).scale(0));
  CHECK(waves[0]["backward"].get<double>() == doctest::Approx(std::cos(75 * deg)).epsilon(1e-9).scale(0));
  // The 3rd: forward parts 1 and e^{j(270° - 60°)}, backward 1 and e^{j(270° + 60°)}: |cos 105°| = cos 75° and cos 15°.
  CHECK(waves[2]["forward"].get<double>() == doctest::Approx(std::cos(75 * deg)).epsilon(1e-9).scale(0));
  CHECK(waves[2]["backward"].get<double>() == doctest::Approx(std::cos(15 * deg)).epsilon(1e-9).scale(0));
  // A split-phase supply's currents follow from the solved field: no claim is made.
  CHECK(winding_json("split_phase_capacitor")["resultant_waves"].is_null());
}
