// Rotor-motion studies of the demo stator with a surface-magnet rotor (cases/pump24_magnets_*.toml,
// invented data), run through the command line on coarse settings, checked against what must hold
// whatever the machine: the three torque methods agree, balanced windings link balanced fluxes,
// the cogging torque repeats every 360°/LCM(Q, 2p) and averages to zero.

#include <doctest/doctest.h>

#include <cmath>
#include <complex>
#include <filesystem>
#include <fstream>
#include <map>
#include <numbers>
#include <sstream>
#include <string>
#include <vector>

#include "study/csv_rows.hpp"
#include "support/cli_run.hpp"

namespace fs = std::filesystem;
using tf::testing::fresh_folder;
using tf::testing::read_columns;
using tf::testing::read_summary;
using tf::testing::turnfield;

namespace {

constexpr double kPi = std::numbers::pi;

/// The fundamental of a sequence sampled at equal steps over one period: (2/N) Σ x_k e^{-j 2π k/N}.
std::complex<double> fundamental(const std::vector<double>& x) {
  std::complex<double> c = 0.0;
  const double n = static_cast<double>(x.size());
  for (std::size_t k = 0; k < x.size(); ++k) c += x[k] * std::polar(1.0, -2 * kPi * static_cast<double>(k) / n);
  return 2.0 * c / n;
}

double mean(const std::vector<double>& x) {
  double s = 0.0;
  for (double v : x) s += v;
  return s / static_cast<double>(x.size());
}

fs::path run_case(const std::string& name, const std::string& options) {
  const fs::path out = fresh_folder(name);
  const auto run = turnfield("run " + std::string(TF_SOURCE_DIR) + "/cases/" + name + ".toml " + options +
                             " --field-files 0 --out " + out.string());
  INFO(run.output);
  REQUIRE(run.status == 0);
  return out;
}

}  // namespace

TEST_CASE("synchronous magnet motor: three torque methods agree, fluxes balanced, torque matches the dq formula") {
  // 72 steps: six per slot-ripple period, so that the mean torque is not aliased (12 steps gave
  // a mean 5 % high).
  const fs::path out = run_case("pump24_magnets_synchronous", "--fineness 0.5 --steps 72");
  const auto t = read_columns(out / "torque.csv");
  const auto steps = read_columns(out / "steps.csv");
  // Arkkio's band average, the Maxwell stress on one circle and the co-energy difference are exact
  // for the exact field and differ only by discretisation (A. Arkkio 1987); the issue asks for 2 %.
  const double arkkio = mean(t.at("torque_arkkio_N_m"));
  CHECK(arkkio > 1.0);
  CHECK(std::abs(mean(t.at("torque_circle_N_m")) / arkkio - 1.0) < 0.02);
  CHECK(std::abs(mean(t.at("torque_virtual_work_N_m")) / arkkio - 1.0) < 0.02);
  // A balanced winding under balanced currents links balanced fluxes: equal amplitudes, phases
  // 120° apart in the order of the currents (docs/references.md §3; DEVELOPERS.md conventions).
  const auto a = fundamental(t.at("flux_linkage_A_Wb"));
  const auto b = fundamental(t.at("flux_linkage_B_Wb"));
  const auto c = fundamental(t.at("flux_linkage_C_Wb"));
  CHECK(std::abs(std::abs(b) / std::abs(a) - 1.0) < 0.01);
  CHECK(std::abs(std::abs(c) / std::abs(a) - 1.0) < 0.01);
  const auto i_a = fundamental(steps.at("current_A_A")), i_b = fundamental(steps.at("current_B_A"));
  CHECK(std::abs(std::arg(b / a) - std::arg(i_b / i_a)) < 1.0 * kPi / 180);
  CHECK(std::abs(std::arg(i_b / i_a) + 2 * kPi / 3) < 1e-9);
  // Mean torque from the dq flux linkages, T = (3/2) p (ψ_d i_q - ψ_q i_d) (amplitude-invariant
  // Park transform; A. E. Fitzgerald, C. Kingsley, S. Umans, Electric Machinery, ch. on
  // synchronous machines, from memory). At a load angle of 90° the current is all on q: i_q = I.
  double dq = 0.0;
  for (std::size_t k = 0; k < t.at("flux_d_Wb").size(); ++k) dq += 1.5 * 2 * t.at("flux_d_Wb")[k] * 6.0;
  dq /= static_cast<double>(t.at("flux_d_Wb").size());
  CHECK(std::abs(dq / arkkio - 1.0) < 0.01);
  // Reciprocity: the inductance matrices are symmetric; self inductances positive, mutual negative.
  const auto s = read_summary(out);
  const auto& l = s["inductance_H"]["apparent_mean"];
  CHECK(l[0][1].get<double>() == doctest::Approx(l[1][0].get<double>()).scale(0).epsilon(1e-6));
  CHECK(l[0][0].get<double>() > 0.0);
  CHECK(l[0][1].get<double>() < 0.0);
  CHECK(s["iron_loss_W"]["total"].get<double>() > 0.0);
  CHECK(s["solver"]["newton_iterations_per_solve"].get<double>() < 12.0);
}

TEST_CASE("cogging: the torque repeats every 360/LCM(Q, 2p) degrees and averages to zero") {
  // 48 steps over one electrical period (180° for 4 poles), 3.75° apart: four per cogging period.
  const fs::path out = run_case("pump24_magnets_cogging", "--fineness 0.5 --steps 48");
  const auto s = read_summary(out);
  // Cogging period 360°/LCM(24, 4) = 15° (common practice; Z. Q. Zhu, D. Howe, IEEE Trans. Energy
  // Conv. 15(4), 2000, from memory).
  CHECK(s["cogging_period_deg"]["expected"].get<double>() == doctest::Approx(15.0).scale(0).epsilon(1e-12));
  CHECK(s["cogging_period_deg"]["from_torque"].get<double>() == doctest::Approx(15.0).scale(0).epsilon(1e-9));
  // With no current the co-energy returns to its value after a period, so the torque, its
  // derivative, averages to zero (energy conservation): a mean far below the swing.
  const auto t = read_columns(out / "torque.csv");
  const double swing = s["torque"]["arkkio"]["peak_to_peak_N_m"].get<double>();
  CHECK(swing > 0.0);
  CHECK(std::abs(mean(t.at("torque_arkkio_N_m"))) < 0.02 * swing);
  CHECK(std::abs(mean(t.at("torque_virtual_work_N_m"))) < 0.02 * swing);
  // The open-circuit back-EMF of a balanced winding is balanced too.
  const auto a = fundamental(t.at("emf_A_V")), b = fundamental(t.at("emf_B_V"));
  CHECK(std::abs(std::abs(b) / std::abs(a) - 1.0) < 0.01);
  CHECK(std::abs(std::abs(std::arg(b / a)) - 2 * kPi / 3) < 1.0 * kPi / 180);
}
