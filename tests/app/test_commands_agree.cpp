// The commands agree with each other: `mesh` writes the mesh `run` solves, and `compare` solves
// each case the way `run` does (with Newton on a B-H curve, not with its initial permeability).
// Cases are the bundled invented ones, on coarse settings.

#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>

#include "support/cli_run.hpp"

namespace fs = std::filesystem;
using tf::testing::fresh_folder;
using tf::testing::read_summary;
using tf::testing::turnfield;

namespace {

std::string bundled(const std::string& name) { return std::string(TF_SOURCE_DIR) + "/cases/" + name + ".toml"; }

/// "N nodes, M triangles, ..." as `mesh` prints it.
std::pair<long, long> printed_mesh_size(const std::string& output) {
  long nodes = -1, triangles = -1;
  std::istringstream in(output);
  std::string word;
  in >> nodes >> word;
  REQUIRE(word == "nodes,");
  in >> triangles >> word;
  REQUIRE(word == "triangles,");
  return {nodes, triangles};
}

/// The row of `case_name` in comparison.csv, as cells.
std::vector<std::string> comparison_row(const fs::path& csv, const std::string& case_name) {
  std::ifstream in(csv);
  REQUIRE(in.good());
  std::string line;
  while (std::getline(in, line)) {
    std::vector<std::string> cells(1);
    bool quoted = false;  // titles are quoted and may hold commas
    for (char ch : line) {
      if (ch == '"') quoted = !quoted;
      else if (ch == ',' && !quoted) cells.emplace_back();
      else cells.back() += ch;
    }
    if (!cells.empty() && cells[0] == case_name) return cells;
  }
  FAIL("no row for " << case_name);
  return {};
}

/// The cage demo with the rotor's skin resolved by three elements per skin depth, as a case file
/// in the temporary folder.
std::string cage_with_skin_refinement() {
  std::ifstream in(bundled("pump24_cage_eddy"));
  std::stringstream text;
  text << in.rdbuf();
  std::string s = text.str();
  const std::string section = "[mesh]\n";
  const auto at = s.find(section);
  REQUIRE(at != std::string::npos);
  s.insert(at + section.size(), "elements_per_skin_depth = 3\n");
  const fs::path path = fs::temp_directory_path() / "turnfield_test_cage_skin.toml";
  std::ofstream(path) << s;
  return path.string();
}

}  // namespace

TEST_CASE("mesh writes the mesh that run solves, for a rotor-motion and an eddy-current study") {
  // A rotor-motion study needs a sliding circle whose nodes make every rotor step whole pitches;
  // an eddy-current study refines the rotor's skin. Both are planned from the study.
  for (const auto& [file, options] : {std::pair{bundled("pump24_magnets_cogging"), " --fineness 0.5 --steps 12"},
                                      std::pair{cage_with_skin_refinement(), " --fineness 0.5"}}) {
    INFO(file);
    const std::string name = fs::path(file).stem().string();
    const fs::path mesh_dir = fresh_folder("mesh_of_" + name);
    const auto meshed = turnfield("mesh " + file + options + " --out " + mesh_dir.string());
    REQUIRE(meshed.status == 0);
    const auto [nodes, triangles] = printed_mesh_size(meshed.output);

    const fs::path run_dir = fresh_folder("run_of_" + name);
    REQUIRE(turnfield("run " + file + options + " --field-files 0 --out " + run_dir.string()).status == 0);
    const auto s = read_summary(run_dir);
    CHECK(s["mesh"]["nodes"].get<long>() == nodes);
    CHECK(s["mesh"]["triangles"].get<long>() == triangles);
  }
}

TEST_CASE("compare solves a saturated case as run does") {
  const std::string options = " --fineness 0.5 --steps 12 --field-files 0";
  const fs::path run_dir = fresh_folder("compare_run_saturated");
  REQUIRE(turnfield("run " + bundled("pump24_three_phase_saturated") + options + " --out " + run_dir.string()).status == 0);
  const double fundamental = read_summary(run_dir)["field"]["fundamental_T"].get<double>();

  const fs::path out = fresh_folder("compare_saturated");
  const auto compared = turnfield("compare " + bundled("pump24_three_phase_saturated") + " " +
                                  bundled("pump24_three_phase") + options + " --out " + out.string());
  REQUIRE(compared.status == 0);
  const auto row = comparison_row(out / "comparison.csv", "pump24_three_phase_saturated");
  REQUIRE(row.size() >= 4);
  CHECK(row[2] == "step_by_step");
  // comparison.csv keeps 6 significant digits.
  CHECK(std::stod(row[3]) == doctest::Approx(fundamental).epsilon(1e-5).scale(0));
  CHECK(comparison_row(out / "comparison.csv", "pump24_three_phase")[2] == "superposition");
  // The per-case folder is the same run.
  CHECK(read_summary(out / "pump24_three_phase_saturated")["field"]["fundamental_T"].get<double>() ==
        doctest::Approx(fundamental).epsilon(1e-12).scale(0));
}
