// TEAM Workshop Problem 30a, three-phase: the eddy-current study of cases/team30a_three_phase.toml
// (an open boundary by the Kelvin transformation) against the published torque, EMF and rotor
// losses at seven rotor speeds.

#include <doctest/doctest.h>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <sstream>

#include <nlohmann/json.hpp>
#include <cmath>
#include <string>

#include "input/case_reader.hpp"
#include "study/mesh_plan.hpp"
#include "study/run.hpp"
#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "post/eddy_quantities.hpp"
#include "solver/eddy.hpp"
#include "support/team30a.hpp"

using namespace tf;

namespace {

std::vector<post::SpeedResult> solve_team30a(double fineness) {
  input::Case c = input::read_case(std::string(TF_SOURCE_DIR) + "/cases/team30a_three_phase.toml");
  c.mesh.fineness = fineness;
  const auto [m, w] = study::mesh_and_wind(c);
  const solver::EddySystem s = solver::assemble_eddy(m, w, c.materials);
  const auto currents = solver::supply_phasors(c.supply, c.winding.n_phases);
  solver::EddyStats stats;
  const auto solutions = solver::solve_eddy(m, s, currents, c.supply.frequency, c.study.rotor_speeds, stats);
  const post::SpeedInputs in{&m, &w, solver::region_conductivity(m, c.materials), solver::region_on_rotor(m),
                             currents, c.supply.frequency, c.stack_length};
  std::vector<post::SpeedResult> rows;
  for (const auto& x : solutions) rows.push_back(post::evaluate_speed(in, x.rotor_speed, x.potential));
  return rows;
}

double error(double value, double reference) { return std::abs(value / reference - 1.0); }

}  // namespace

TEST_CASE("TEAM 30a: torque, EMF and rotor loss at seven speeds, converging under refinement") {
  const auto coarse = solve_team30a(1.0);
  const auto fine = solve_team30a(2.0);
  REQUIRE(coarse.size() == testing::kTeam30a.size());
  for (std::size_t k = 0; k < coarse.size(); ++k) {
    const auto& ref = testing::kTeam30a[k];
    const auto& r = coarse[k];
    INFO("speed " << ref.speed << " rad/s: torque " << r.torque << ", EMF " << r.emf_rms[0] << ", rotor loss "
                  << r.rotor_loss << " (by power balance " << r.rotor_loss_balance << ")");
    CHECK(r.rotor_speed == ref.speed);
    // The issue asks for 2 %, aiming at 1 %. Measured with the case's open boundary: 0.17 % at
    // worst on this mesh (400 rad/s), 0.064 % on the finer one.
    CHECK(error(r.torque, ref.torque) < 0.005);
    CHECK(error(fine[k].torque, ref.torque) < 0.001);
    CHECK(error(r.emf_rms[0], ref.emf) < 0.005);  // CHECKS.md: EMF +- 0.5 %
    // Losses by power balance (input less Arkkio's mechanical power) within 1 % at every speed;
    // integrated from the current density within 1 % where the rotor is slow.
    CHECK(error(r.rotor_loss_balance, ref.rotor_loss) < 0.01);
    if (ref.speed <= 200) CHECK(error(r.rotor_loss, ref.rotor_loss) < 0.01);
    // Power balance, exact for the discrete equations: input = Joule losses + Lorentz mechanical power.
    const double balance = r.input_power - r.rotor_loss - r.stator_loss - r.torque_lorentz * r.rotor_speed;
    CHECK(std::abs(balance) < 1e-6 * std::max(std::abs(r.input_power), r.rotor_loss));
    // Arkkio and the Lorentz force on the induced currents agree to discretization error.
    CHECK(error(r.torque_lorentz, r.torque) < 0.02);
    // Halving the elements brings every value closer (first proof of a solver: convergence).
    CHECK(error(fine[k].torque, ref.torque) < error(r.torque, ref.torque));
    CHECK(error(fine[k].emf_rms[0], ref.emf) < error(r.emf_rms[0], ref.emf));
    // The integrated loss of a moving conductor converges about linearly here (measured: the error
    // falls by 1.9-2.8 times per halving), so we ask for at least a 40 % fall.
    if (ref.speed >= 400) CHECK(error(fine[k].rotor_loss, ref.rotor_loss) < 0.6 * error(r.rotor_loss, ref.rotor_loss));
  }
}

TEST_CASE("[mesh] elements_per_skin_depth resolves the rotor's skin that the coarse mesh leaves too coarse") {
  // Skin depth delta = sqrt(2 / (omega mu sigma)) (Stoll 1974); the check counts the longest
  // elements within one delta of each conductor's face toward the gap.
  input::Case c = input::read_case(std::string(TF_SOURCE_DIR) + "/cases/team30a_three_phase.toml");
  c.mesh.fineness = 1.0;
  c.study.n_field_files = 0;
  auto run = [&](double per_depth) {
    c.mesh.elements_per_skin_depth = per_depth;
    const auto dir = std::filesystem::temp_directory_path() / "turnfield_test_skin";
    std::filesystem::remove_all(dir);
    std::ostringstream quiet;
    study::run_study(c, {dir, false, 0}, quiet);
    std::ifstream in(dir / "summary.json");
    return nlohmann::json::parse(in)["skin_depths"];
  };
  bool coarse_somewhere = false;
  for (const auto& d : run(0.0)) coarse_somewhere |= d["mesh_too_coarse"].get<bool>();
  CHECK(coarse_somewhere);
  for (const auto& d : run(3.0)) {
    INFO(d.dump());
    CHECK_FALSE(d["mesh_too_coarse"].get<bool>());
    CHECK(d["skin_depth_m"].get<double>() / d["largest_element_m"].get<double>() >= 3.0);
  }
}
