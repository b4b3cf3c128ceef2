// The command line as a user meets it: exit status, messages, and what is (not) written.

#include <doctest/doctest.h>

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <nlohmann/json.hpp>
#include <random>
#include <string>

#include "support/case_mutations.hpp"
#include "support/cli_run.hpp"

namespace fs = std::filesystem;
using tf::testing::fresh_folder;
using tf::testing::Outcome;
using tf::testing::read_summary;
using tf::testing::turnfield;

TEST_CASE("every bad case file: exit status 2, a message naming the file and line, and nothing written") {
  const fs::path bad = fs::path(TF_SOURCE_DIR) / "tests" / "data" / "bad";
  int n_files = 0;
  for (const auto& entry : fs::directory_iterator(bad)) {
    if (entry.path().extension() != ".toml") continue;
    ++n_files;
    const std::string file = entry.path().string();
    INFO(file);
    const Outcome check = turnfield("check " + file);
    CHECK(check.status == 2);
    CHECK(check.output.find(file + ":") != std::string::npos);
    // What was expected: spelt out, or the valid key suggested, or the TOML syntax rule broken.
    const bool says_what = check.output.find("expected") != std::string::npos ||
                           check.output.find("did you mean") != std::string::npos ||
                           check.output.find("not valid TOML") != std::string::npos;
    CHECK(says_what);
    // Each start of the program costs about 0.25 s (Gmsh, OpenCASCADE and VTK load): `run` is
    // tried on every third file, enough to see that validation stops it before anything is written.
    if (n_files % 3 != 1) continue;
    const fs::path out = fresh_folder("bad");
    const Outcome run = turnfield("run " + file + " --out " + out.string());
    CHECK(run.status == 2);
    CHECK_FALSE(fs::exists(out));
  }
  CHECK(n_files >= 25);
}

TEST_CASE("a missing case file and a bad command line are bad input too") {
  const Outcome missing = turnfield("check /nonexistent/case.toml");
  CHECK(missing.status == 2);
  CHECK(missing.output.find("/nonexistent/case.toml") != std::string::npos);
  CHECK(turnfield("frobnicate").status == 2);
  CHECK(turnfield("run").status == 2);
  const std::string demo = std::string(TF_SOURCE_DIR) + "/cases/pump24_three_phase.toml";
  CHECK(turnfield("run " + demo + " --fineness 0").status == 2);
}

TEST_CASE("fuzz through the program: 60 mutated case files end with exit status 0 or 2, in bounded time") {
  // The in-process run (tests/input/test_fuzz_case_reader.cpp) sees exceptions; this one sees what a
  // user sees: the exit status (0 valid, 2 refused; a crash, an abort or a hang is none of them).
  const auto bases = tf::testing::bundled_cases(fs::path(TF_SOURCE_DIR) / "cases");
  std::mt19937 rng(4122026);
  const fs::path dir = fresh_folder("fuzz_cli");
  fs::create_directories(dir);
  for (int n = 0; n < 60; ++n) {
    const auto& [name, text] = bases[static_cast<std::size_t>(n) % bases.size()];
    const fs::path file = dir / ("input_" + std::to_string(n) + "_" + name);
    std::ofstream(file) << tf::testing::mutate(text, n % 5, rng);
    INFO(file.string());
    // timeout(1) exits 124 for a hang, the shell 128 + n for a death by signal n.
    const Outcome r = tf::testing::run_command("timeout 30 " + std::string(TF_BINARY) + " check " + file.string());
    CHECK((r.status == 0 || r.status == 2));
  }
}

TEST_CASE("an output folder that cannot be written is refused before any work: exit 2 and the reason") {
  const std::string demo = (fs::path(TF_SOURCE_DIR) / "cases" / "pump24_three_phase.toml").string();
  const fs::path file = fresh_folder("out_is_a_file");
  std::ofstream(file) << "not a folder\n";
  for (const fs::path& out : {file, file / "below"}) {
    for (const char* command : {"run", "mesh"}) {
      INFO(command << " --out " << out.string());
      const Outcome r = turnfield(std::string(command) + " " + demo + " --out " + out.string());
      CHECK(r.status == 2);  // before this check: exit 1, after the whole solve
      CHECK(r.output.find("is a file; expected a folder") != std::string::npos);
    }
  }
  CHECK(fs::is_regular_file(file));
}

TEST_CASE("numeric options refuse NaN and infinity: exit 2, a message, nothing written") {
  const std::string demo = (fs::path(TF_SOURCE_DIR) / "cases" / "pump24_three_phase.toml").string();
  for (const char* value : {"nan", "inf", "-inf", "NaN"}) {
    for (const char* command : {"run", "mesh"}) {
      INFO(command << " --fineness " << value);
      const fs::path out = fresh_folder("nan_option");
      const Outcome r = turnfield(std::string(command) + " " + demo + " --fineness " + value + " --out " + out.string());
      CHECK(r.status == 2);
      CHECK(r.output.find("expected a finite number") != std::string::npos);
      CHECK_FALSE(fs::exists(out));
    }
  }
}

TEST_CASE("a report step beyond the study's steps is bad input: exit 2, a message, nothing written") {
  const std::string demo = std::string(TF_SOURCE_DIR) + "/cases/pump24_three_phase.toml";  // 36 steps
  const fs::path out = fresh_folder("report_step");
  const Outcome run = turnfield("run " + demo + " --report-step 36 --out " + out.string());
  CHECK(run.status == 2);
  CHECK(run.output.find("--report-step 36") != std::string::npos);
  CHECK(run.output.find("0 to 35") != std::string::npos);
  CHECK_FALSE(fs::exists(out));
}

TEST_CASE("a runaway fineness is refused before meshing: exit 1, a message, nothing written") {
  const std::string demo = std::string(TF_SOURCE_DIR) + "/cases/pump24_three_phase.toml";
  const fs::path out = fresh_folder("runaway");
  const Outcome run = turnfield("run " + demo + " --fineness 20 --out " + out.string());
  CHECK(run.status == 1);
  CHECK(run.output.find("lower [mesh] fineness") != std::string::npos);
  CHECK_FALSE(fs::exists(out));
}

TEST_CASE("parts too small to mesh: exit 1 (or 2 once the case checks refuse them), never a signal") {
  // Gmsh 4.8 crashed on these magnets and took the program with it (exit status 139); meshing now
  // runs in a child process. A minimum-size check in the case validation may refuse the file first.
  const std::string file = std::string(TF_SOURCE_DIR) + "/tests/data/mesher/magnets_too_thin.toml";
  for (const char* command : {"mesh", "run"}) {
    const fs::path out = fresh_folder("too_thin");
    const Outcome run = turnfield(std::string(command) + " " + file + " --out " + out.string());
    INFO(command, ": ", run.output);
    REQUIRE((run.status == 1 || run.status == 2));
    if (run.status == 1) CHECK(run.output.find("meshing the rotor sector (magnets) failed inside Gmsh") != std::string::npos);
    if (run.status == 2) CHECK(run.output.find(file + ":") != std::string::npos);
    CHECK_FALSE(fs::exists(out / "summary.json"));
  }
}

TEST_CASE("winding prints the slot table and factors, as text and as JSON") {
  const std::string demo = std::string(TF_SOURCE_DIR) + "/cases/pump24_three_phase.toml";
  const Outcome text = turnfield("winding " + demo);
  CHECK(text.status == 0);
  CHECK(text.output.find("q = 2") != std::string::npos);
  const Outcome json = turnfield("winding --json " + demo);
  REQUIRE(json.status == 0);
  const auto j = nlohmann::json::parse(json.output);
  CHECK(j["coil_sides"].size() == 48);
  CHECK(j["winding_factors"].size() == 13);
  // 24 slots, 4 poles, pitch 5/6: k_w1 = 0.9330 (docs/references.md §2).
  CHECK(j["winding_factors"][0]["total"].get<double>() == doctest::Approx(0.9330).epsilon(1e-4).scale(0));
}

/// True for the cases whose study turns the rotor (or solves saturated iron step by step).
std::string file_text(const fs::path& path) {
  std::ifstream in(path);
  return {(std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>()};
}

/// A study whose rotor turns between steps.
bool is_motion_case(const fs::path& path) {
  const std::string text = file_text(path);
  for (const char* kind : {"\"synchronous\"", "\"cogging\"", "\"rotor_sweep\""})
    if (text.find(std::string("kind = ") + kind) != std::string::npos) return true;
  return false;
}

/// Iron with a B-H curve: solved step by step with Newton's method.
bool saturates(const fs::path& path) { return file_text(path).find("bh_curve") != std::string::npos; }

TEST_CASE("every case in cases/ runs headless on a coarse mesh and gives a sound rotating field") {
  // Demo data are invented. Balanced windings with balanced currents or a symmetric DC sequence:
  // constant amplitude, no backward wave, the axis turning 360°/(pK) per step (standard theory,
  // docs/references.md §3). Any sinusoidal supply on a balanced winding: the backward/forward ratio
  // of the field equals |negative|/|positive| sequence current (symmetrical components, C. L.
  // Fortescue, Trans. AIEE 37, 1918), since each phase's fundamental is the same wave turned.
  int n_cases = 0;
  for (const auto& entry : fs::directory_iterator(fs::path(TF_SOURCE_DIR) / "cases")) {
    if (entry.path().extension() != ".toml") continue;
    ++n_cases;
    INFO(entry.path().string());
    const fs::path out = fresh_folder("every_case_" + entry.path().stem().string());
    // Rotor-motion and saturated studies solve every step anew: 12 steps keep this test quick (they
    // are checked in depth in test_motion_cases.cpp and tests/study/test_saturated_phase_angles.cpp).
    const bool turns = is_motion_case(entry.path()), nonlinear = saturates(entry.path());
    const Outcome run = turnfield("run " + entry.path().string() + " --fineness 0.5 --field-files 2" +
                                  (turns || nonlinear ? " --steps 12" : "") + " --out " + out.string());
    REQUIRE(run.status == 0);
    CHECK(run.output.find("design estimates") != std::string::npos);
    const auto s = read_summary(out);
    // Every study writes its report and the region names, and lists them (scripts/check_report renders one).
    for (const char* file : {"report.html", "regions.csv"}) {
      CHECK(fs::exists(out / file));
      CHECK(std::find(s["files"].begin(), s["files"].end(), file) != s["files"].end());
    }
    CHECK(fs::exists(out / "figures"));
    CHECK_FALSE(fs::is_empty(out / "figures"));
    if (turns) {
      CHECK(fs::exists(out / "torque.csv"));
      CHECK(s["field"]["fundamental_T"].get<double>() > 0.2);
      continue;
    }
    if (s.contains("eddy_currents")) {  // a time-harmonic study: checked against TEAM 30a in test_team30a.cpp
      CHECK(fs::exists(out / "torque_speed.csv"));
      CHECK(s["eddy_currents"]["speeds"].size() == s["inputs"]["study"]["rotor_speeds_rad_per_s"].size());
      continue;
    }
    // A rotor at rest turns nothing: no torque table, whatever the iron.
    CHECK_FALSE(fs::exists(out / "torque.csv"));
    CHECK_FALSE(s.contains("torque"));
    const auto& field = s["field"];
    const std::string kind = s["inputs"]["supply"]["kind"];
    const double ratio = field["backward_forward_ratio"].get<double>();
    if (nonlinear) {
      // Saturation changes the field's shape over the period, so amplitude ripple and uneven steps
      // are physics, not error. A balanced three-phase set still makes no backward fundamental:
      // the field at t + T/3 is the field at t turned by a third of a pole pair, so the temporal
      // orders h of c_p(t) satisfy h = 1 (mod 3) and h = -1 cannot occur (symmetry argument).
      CHECK(ratio < 1e-6);
      CHECK(field["harmonic_distortion"].get<double>() > 0.0);
      continue;
    }
    if (kind == "balanced" || kind == "stepped_dc") {
      CHECK(field["amplitude_ripple"].get<double>() < 0.01);
      CHECK(ratio < 0.01);
      CHECK(field["rotation_uniformity_deg"].get<double>() < 0.05);
    }
    // Pole map: as many north as south poles; an integral-slot winding makes exactly p of each.
    const auto& poles = field["poles_at_first_step"];
    CHECK(poles["north"].get<int>() == poles["south"].get<int>());
    const double q = s["winding"]["slots_per_pole_per_phase"].get<double>();
    if (q == std::floor(q) && s["inputs"]["stator"]["kind"] == "slotted")
      CHECK(2 * poles["north"].get<int>() == s["inputs"]["winding"]["poles"].get<int>());
    if (kind != "stepped_dc") {
      const auto& seq = s["drive"]["sequence_components_peak_A"];
      const double expected = seq["negative"].get<double>() / seq["positive"].get<double>();
      CHECK(std::abs(ratio - expected) < 1e-3 * std::max(1.0, expected));
    }
    // Air-gap fundamental in the range of real machines (0.2 .. 1.2 T; common practice); the
    // published benchmarks (team*) are not real machines and keep their own field levels.
    if (entry.path().stem().string().rfind("team", 0) != 0) {
      CHECK(field["fundamental_T"].get<double>() > 0.2);
      CHECK(field["fundamental_T"].get<double>() < 1.2);
    }
    for (const char* f : {"steps.csv", "gap_field.csv", "harmonics.csv", "poles.csv", "winding.csv", "field.pvd",
                          "field_0000.vtu"})
      CHECK(fs::exists(out / f));
    // No temporary file is left behind.
    for (const auto& written : fs::directory_iterator(out)) CHECK(written.path().filename().string()[0] != '.');
  }
  CHECK(n_cases >= 10);
}
