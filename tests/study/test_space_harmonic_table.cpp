// space_harmonics.csv of the bundled demo stator (invented data) against the standard theory of
// the resultant field (docs/references.md §3): balanced three-phase windings carry orders 6k +- 1
// only, 5, 11, ... backward and 7, 13, ... forward; two-phase windings all odd orders, 4k + 1 forward
// and 4k - 1 backward, the 3rd uncancelled. Amplitudes near the MMF ratio k_w,nu / (nu k_w1) of the
// smooth-gap theory (Pyrhönen, Jokinen, Hrabovcová, Design of Rotating Electrical Machines, 2008,
// ch. 2; from memory); slotting is not in it, so we accept +-25 %.

#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include "input/case_reader.hpp"
#include "study/run.hpp"

namespace fs = std::filesystem;

namespace {

struct Row {
  double relative = 0.0, speed_rpm = 0.0, winding_factor = 0.0;
  std::string direction;
};

/// space_harmonics.csv of a bundled case run on a coarse mesh, by electrical order (whole orders).
std::map<int, Row> table_of(const std::string& name) {
  tf::input::Case c = tf::input::read_case(std::string(TF_SOURCE_DIR) + "/cases/" + name + ".toml");
  c.mesh.fineness = 0.5;
  c.study.n_field_files = 0;
  const fs::path dir = fs::temp_directory_path() / ("turnfield_harmonic_table_" + name);
  fs::remove_all(dir);
  std::ostringstream quiet;
  tf::study::run_study(c, {dir, false, 0}, quiet);
  std::ifstream in(dir / "space_harmonics.csv");
  REQUIRE(in.good());
  std::string line;
  std::getline(in, line);
  REQUIRE(line == "order,electrical_order,amplitude_T,relative_to_fundamental,forward_T,backward_T,direction,speed_rpm,"
                  "winding_factor");
  std::map<int, Row> rows;
  while (std::getline(in, line)) {
    std::vector<std::string> cell;
    std::stringstream s(line);
    for (std::string x; std::getline(s, x, ',');) cell.push_back(x);
    const double nu = std::stod(cell[1]);
    if (nu == static_cast<int>(nu))
      rows[static_cast<int>(nu)] = {std::stod(cell[3]), std::stod(cell[7]), std::stod(cell[8]), cell[6]};
  }
  return rows;
}

}  // namespace

TEST_CASE("three-phase demo: 5th and 11th turn backward, 7th and 13th forward, triplens cancel") {
  const auto t = table_of("pump24_three_phase");
  CHECK(t.at(1).direction == "forward");
  CHECK(t.at(1).speed_rpm == doctest::Approx(1500.0).epsilon(1e-9).scale(0));  // 50 Hz, 4 poles
  for (int nu : {5, 11}) CHECK(t.at(nu).direction == "backward");
  for (int nu : {7, 13}) CHECK(t.at(nu).direction == "forward");
  for (int nu : {2, 3, 4, 6, 9}) CHECK(t.at(nu).relative < 0.005);
  CHECK(t.at(5).speed_rpm == doctest::Approx(-300.0).epsilon(1e-9).scale(0));  // n_s / 5, backward
}

TEST_CASE("two-phase demo: the 3rd turns backward at a third of synchronous speed, the 5th forward") {
  const auto t = table_of("pump24_two_phase");
  CHECK(t.at(3).direction == "backward");
  CHECK(t.at(3).speed_rpm == doctest::Approx(-500.0).epsilon(1e-9).scale(0));
  CHECK(t.at(5).direction == "forward");
  const double mmf_ratio = t.at(3).winding_factor / (3 * t.at(1).winding_factor);
  CHECK(t.at(3).relative / mmf_ratio == doctest::Approx(1.0).epsilon(0.25).scale(0));
  for (int nu : {2, 4}) CHECK(t.at(nu).relative < 0.005);
}
