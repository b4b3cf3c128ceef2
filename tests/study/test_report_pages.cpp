// The report and the summary of whole runs: the back-EMF a turning rotor's report tabulates is the
// EMF of torque.csv, and linear iron driven far past 2 T is warned about on the terminal, in
// summary.json and at the top of the report, naming the region.

#include <doctest/doctest.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <regex>
#include <sstream>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "input/case_reader.hpp"
#include "support/bundled_case.hpp"
#include "study/run.hpp"

namespace fs = std::filesystem;
using namespace tf;

namespace {

using testing::bundled;
using testing::text_of;

/// A coarse run in a folder of its own (turnfield_report_pages_<folder>); the terminal's lines into `terminal`.
fs::path run_coarse(const input::Case& c, int steps, const std::string& folder, std::string& terminal) {
  study::RunOutcome outcome;
  return testing::run_coarse(c, steps, "report_pages_" + folder, outcome, &terminal);
}

/// One column of a CSV file by its header name.
std::vector<double> csv_column(const fs::path& path, const std::string& name) {
  std::ifstream in(path);
  std::string line;
  std::getline(in, line);
  std::vector<std::string> header;
  for (std::stringstream s(line); std::getline(s, line, ',');) header.push_back(line);
  const auto at = static_cast<std::size_t>(std::find(header.begin(), header.end(), name) - header.begin());
  REQUIRE(at < header.size());
  std::vector<double> out;
  while (std::getline(in, line)) {
    std::stringstream s(line);
    std::string cell;
    for (std::size_t k = 0; k <= at; ++k) std::getline(s, cell, ',');
    out.push_back(std::stod(cell));
  }
  return out;
}

}  // namespace

TEST_CASE("a synchronous run's report gives the back-EMF rms of torque.csv's EMF and draws every step") {
  std::string terminal;
  const fs::path dir = run_coarse(bundled("pump24_magnets_synchronous"), 12, "synchronous", terminal);
  double sum = 0.0;
  const std::vector<double> emf = csv_column(dir / "torque.csv", "emf_A_V");
  REQUIRE(emf.size() == 12);
  for (double e : emf) sum += e * e;
  const double rms = std::sqrt(sum / static_cast<double>(emf.size()));  // rms over one electrical period
  const std::string html = text_of(dir / "report.html");
  std::smatch m;
  REQUIRE(std::regex_search(html, m, std::regex(R"re(<h2>Back-EMF per phase</h2>[\s\S]*?<td class="text">A</td><td class="num">([0-9.e+-]+)</td>)re")));
  // The table prints 5 significant digits.
  CHECK(std::stod(m[1]) == doctest::Approx(rms).epsilon(1e-4).scale(0));
  CHECK(rms > 1.0);  // a magnet rotor turning at synchronous speed induces volts, not round-off
  // The EMF figure draws 3 phases of 12 points each.
  const std::string svg = text_of(dir / "figures" / "back_emf.svg");
  const std::regex path(R"re(<path class="data"[^>]*\bd="([^"]*)")re");
  int paths = 0;
  for (auto it = std::sregex_iterator(svg.begin(), svg.end(), path); it != std::sregex_iterator(); ++it, ++paths) {
    const std::string d = (*it)[1];
    CHECK(std::count(d.begin(), d.end(), 'L') == 11);
  }
  CHECK(paths == 3);
  CHECK(fs::exists(dir / "figures" / "dq_inductance.svg"));
  CHECK(fs::exists(dir / "figures" / "flux_linkage.svg"));
  // Its stator iron has a B-H curve and its rotor iron stays below 2 T: no saturation warning.
  CHECK(terminal.find("in linear iron") == std::string::npos);
}

TEST_CASE("linear iron at twenty times the rated current is warned about everywhere, naming the region") {
  // cases/pump24_three_phase.toml has linear iron (relative permeability 3000) that stays below
  // 2 T at its 6 A (the bundled run does not warn); at 120 A the field is twenty times as strong
  // (linear equations), far beyond the 2 T near which steel saturates (common practice).
  input::Case c = bundled("pump24_three_phase");
  c.supply.peak_current *= 20;
  std::string terminal;
  const fs::path dir = run_coarse(c, 6, "saturation", terminal);
  const std::regex warning(R"re(stator_iron: [0-9.]+ % of its area above 2 T in linear iron \(up to [0-9.]+ T at the 99th percentile, step [0-9]+; all 6 steps checked\))re");
  CHECK(std::regex_search(terminal, warning));
  const auto summary = nlohmann::json::parse(text_of(dir / "summary.json"));
  REQUIRE(summary.contains("warnings"));
  bool found = false;
  for (const auto& w : summary["warnings"]) found = found || std::regex_search(w.get<std::string>(), warning);
  CHECK(found);
  const std::string html = text_of(dir / "report.html");
  const auto list = html.find("<ul class=\"warnings\"");
  REQUIRE(list != std::string::npos);
  CHECK(list < html.find("<h2"));  // at the top, before the headline numbers
  CHECK(html.find("stator_iron: ", list) != std::string::npos);
}
