// Sweep files and their variants: values put in the base case's own text, grid and zip order,
// ranges, stable ids, and messages that name the sweep file's line and key.

#include <doctest/doctest.h>

#include <fstream>

#include "input/case_reader.hpp"
#include "input/input_error.hpp"
#include "sweep/sweep_file.hpp"
#include "sweep/sweep_metrics.hpp"
#include "sweep/sweep_records.hpp"
#include "sweep/sweep_ranking.hpp"
#include "sweep/variants.hpp"
#include "support/cli_run.hpp"

namespace {

namespace fs = std::filesystem;
using namespace tf::sweep;
using tf::input::Case;
using tf::input::InputError;
using tf::input::read_case_text;

const std::string kBase = std::string(TF_SOURCE_DIR) + "/cases/pump24_three_phase.toml";

/// Writes a sweep file whose base case is the demo case; returns its path.
std::string study(const std::string& name, const std::string& body) {
  const fs::path dir = tf::testing::fresh_folder("study_" + name);
  fs::create_directories(dir);
  std::ofstream(dir / "study.toml") << "base_case = \"" << kBase << "\"\n" << body;
  return (dir / "study.toml").string();
}

std::string message_of(const std::string& path) {
  try {
    read_sweep_file(path);
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

}  // namespace

TEST_CASE("a grid varies the last key fastest and keeps every other line of the base case") {
  const SweepFile s = read_sweep_file(study("grid", R"(
[[vary]]
key = "winding.coil_pitch"
values = [4, 5]
[[vary]]
key = "stator.slot.opening"
range = { start = 0.001, stop = 0.003, count = 3 }
)"));
  const auto v = expand_variants(s);
  REQUIRE(v.size() == 6);
  CHECK(v[0].inputs == std::vector<std::string>{"4", "0.001"});
  CHECK(v[1].inputs == std::vector<std::string>{"4", "0.002"});
  CHECK(v[5].inputs == std::vector<std::string>{"5", "0.003"});
  // Only the two value lines differ from the base case, so messages keep the base case's lines.
  std::istringstream base(s.base_text), variant(v[1].case_text);
  int differing = 0, lines = 0;
  for (std::string a, b; std::getline(base, a) && std::getline(variant, b); ++lines) differing += a != b;
  CHECK(differing == 2);
  const Case c = read_case_text("variant", v[1].case_text);
  CHECK(c.winding.coil_pitch == 4);
  CHECK(c.geometry.stator.slot.opening_width == doctest::Approx(0.002).scale(0));
  // All ids differ, and the same text always gives the same id.
  for (std::size_t i = 0; i < v.size(); ++i)
    for (std::size_t j = 0; j < i; ++j) CHECK(v[i].id != v[j].id);
  CHECK(expand_variants(s)[3].id == v[3].id);
}

TEST_CASE("variant ids are FNV-1a 64-bit hashes") {
  // Test vectors of the FNV-1a 64-bit hash (Fowler, Noll and Vo, "The FNV Non-Cryptographic Hash
  // Algorithm", IETF draft; the empty string gives the offset basis). Values quoted from memory.
  CHECK(variant_id("") == "vcbf29ce484222325");
  CHECK(variant_id("a") == "vaf63dc4c8601ec8c");
}

TEST_CASE("zip pairs the i-th values; a step range includes its stop") {
  const SweepFile s = read_sweep_file(study("zip", R"(combine = "zip"
[[vary]]
key = "winding.coil_pitch"
range = { start = 4, stop = 6, step = 1 }
[[vary]]
key = "supply.peak_current"
values = [2.0, 4.0, 6.5]
)"));
  const auto v = expand_variants(s);
  REQUIRE(v.size() == 3);
  CHECK(v[2].inputs == std::vector<std::string>{"6", "6.5"});
}

TEST_CASE("shards partition the variants") {
  for (int n = 1; n <= 4; ++n)
    for (std::size_t i = 0; i < 11; ++i) {
      int owners = 0;
      for (int k = 1; k <= n; ++k) owners += in_shard(i, {k, n});
      CHECK(owners == 1);
    }
}

TEST_CASE("a bad sweep file is refused with its line and key") {
  CHECK(message_of(study("unknown", "[[vary]]\nkey = \"winding.coil_pitch\"\nvalue = [4]\n")).find("study.toml:4: [[vary]] #1 value: unknown key (did you mean 'values'?); expected one of: key, values, range") != std::string::npos);
  CHECK(message_of(study("absent", "[[vary]]\nkey = \"winding.skew\"\nvalues = [1]\n")).find("study.toml:3: winding.skew: not set in the base case") != std::string::npos);
  CHECK(message_of(study("table", "[[vary]]\nkey = \"stator.slot\"\nvalues = [1]\n")).find("is a table or a list in the base case") != std::string::npos);
  CHECK(message_of(study("zip", "combine = \"zip\"\n[[vary]]\nkey = \"winding.coil_pitch\"\nvalues = [4, 5]\n"
                                "[[vary]]\nkey = \"supply.peak_current\"\nvalues = [1.0]\n")).find("study.toml:7: supply.peak_current: has 1 values") != std::string::npos);
  CHECK(message_of(study("step", "[[vary]]\nkey = \"winding.coil_pitch\"\nrange = { start = 4, stop = 6, step = -1 }\n")).find("does not lead from start to stop") != std::string::npos);
  CHECK(message_of(study("both", "[[vary]]\nkey = \"winding.coil_pitch\"\nrange = { start = 4, stop = 6, step = 1, count = 3 }\n")).find("either count or step") != std::string::npos);
  CHECK(message_of(study("none", "title = \"no keys\"\n")).find("vary") != std::string::npos);
  // A misspelt ranking is found when the file is read, before any variant runs.
  CHECK(message_of(study("rank", "rank_by = \"fundamental_t\"\n[[vary]]\nkey = \"winding.coil_pitch\"\nvalues = [4, 5]\n"))
            .find("study.toml:2: rank_by = \"fundamental_t\": no such metric (did you mean 'fundamental_T'?); expected one of: fundamental_T") !=
        std::string::npos);
  CHECK(message_of(study("same", "[[vary]]\nkey = \"winding.coil_pitch\"\nvalues = [4, 4]\n")).empty());  // read fine ...
  CHECK_THROWS_AS(expand_variants(read_sweep_file(study("same2", "[[vary]]\nkey = \"winding.coil_pitch\"\nvalues = [4, 4]\n"))), InputError);  // ... but two equal variants are refused
}

TEST_CASE("ranking puts the best value first in the metric's own direction, or the one asked for") {
  tf::post::SweepTable t{"t", "s", "b", {"k"}, sweep_metric_columns(), {}, -1};
  const double nan = tf::post::kNoValue;
  const std::vector<double> ripple = {0.30, 0.05, nan, 0.10};
  for (std::size_t i = 0; i < ripple.size(); ++i) {
    std::vector<double> m(t.metrics.size(), nan);
    m[2] = ripple[i];  // peak_field_ripple
    t.rows.push_back({"v" + std::to_string(i), {"1"}, i == 2 ? "failed" : "ok", "", m, 0});
  }
  rank_rows(t, {"peak_field_ripple"});
  CHECK(t.rows[1].rank == 1);
  CHECK(t.rows[3].rank == 2);
  CHECK(t.rows[0].rank == 3);
  CHECK(t.rows[2].rank == 0);  // failed: not ranked
  rank_rows(t, {"peak_field_ripple:highest"});
  CHECK(t.rows[0].rank == 1);
  CHECK_THROWS_AS(rank_rows(t, {"ripple"}), InputError);
  CHECK_THROWS_AS(rank_rows(t, {"peak_field_ripple:best"}), InputError);
}

TEST_CASE("a misspelt key of a sweep file gets the nearest one suggested, with its line") {
  // Top level, as the case reader words it.
  CHECK(message_of(study("top", "rank_bye = \"fundamental_T\"\n[[vary]]\nkey = \"winding.coil_pitch\"\nvalues = [4, 5]\n"))
            .find("study.toml:2: unknown key 'rank_bye'; did you mean 'rank_by'?") != std::string::npos);
  CHECK(message_of(study("tie", "tie_brake = \"fundamental_T\"\n[[vary]]\nkey = \"winding.coil_pitch\"\nvalues = [4, 5]\n"))
            .find("study.toml:2: unknown key 'tie_brake'; did you mean 'tie_break'?") != std::string::npos);
  // A [[vary]] field.
  CHECK(message_of(study("rnge", "[[vary]]\nkey = \"winding.coil_pitch\"\nrnge = { start = 4, stop = 6, count = 3 }\n"))
            .find("study.toml:4: [[vary]] #1 rnge: unknown key (did you mean 'range'?)") != std::string::npos);
  // A varied or fixed key the base case does not set, against the keys it does set.
  CHECK(message_of(study("opening", "[[vary]]\nkey = \"stator.slot.openning\"\nvalues = [0.002]\n"))
            .find("study.toml:3: stator.slot.openning: not set in the base case " + kBase +
                  " (did you mean 'stator.slot.opening'?)") != std::string::npos);
  CHECK(message_of(study("table", "[[vary]]\nkey = \"stater.slot.opening\"\nvalues = [0.002]\n"))
            .find("(did you mean 'stator.slot.opening'?)") != std::string::npos);
  CHECK(message_of(study("fixed", "[fixed]\n\"study.feild_files\" = 2\n[[vary]]\nkey = \"winding.coil_pitch\"\nvalues = [4, 5]\n"))
            .find("study.toml:3: study.feild_files: not set in the base case " + kBase + " (did you mean 'study.field_files'?)") !=
        std::string::npos);
  // Nothing near: no guess.
  CHECK(message_of(study("far", "[[vary]]\nkey = \"rotor.magnet.grade\"\nvalues = [1]\n")).find("did you mean") == std::string::npos);
}

TEST_CASE("a sweep file states its tie tolerance, tie-break and Pareto view, each checked where it is written") {
  const std::string vary = "[[vary]]\nkey = \"winding.coil_pitch\"\nvalues = [4, 5]\n";
  const SweepFile s = read_sweep_file(study("ranking", "rank_by = \"peak_field_ripple\"\nrank_tolerance = 0.01\n"
                                                       "tie_break = \"fundamental_T:highest\"\n"
                                                       "pareto = [\"torque_ripple:lowest\", \"torque_mean_N_m\"]\n" + vary));
  CHECK(s.ranking.rank_by == "peak_field_ripple");
  REQUIRE(s.ranking.tolerance.has_value());
  CHECK(*s.ranking.tolerance == 0.01);
  CHECK(s.ranking.tie_break == "fundamental_T:highest");
  CHECK(s.ranking.pareto == std::vector<std::string>{"torque_ripple:lowest", "torque_mean_N_m"});
  CHECK_FALSE(read_sweep_file(study("plain", vary)).ranking.tolerance.has_value());
  CHECK(message_of(study("tol", "rank_tolerance = 1.5\n" + vary)).find("study.toml:2: rank_tolerance = 1.5: out of range") != std::string::npos);
  CHECK(message_of(study("tb", "tie_break = \"fundamental\"\n" + vary)).find("study.toml:2: tie_break = \"fundamental\": no such metric") != std::string::npos);
  CHECK(message_of(study("p1", "pareto = [\"fundamental_T\"]\n" + vary)).find("study.toml:2: pareto") != std::string::npos);
  CHECK(message_of(study("p2", "pareto = [\"fundamental_T\", \"fundamental_T:lowest\"]\n" + vary)).find("names one metric twice") != std::string::npos);
  CHECK(message_of(study("p3", "pareto = [\"fundamental_T\",\n  \"torque\"]\n" + vary)).find("study.toml:3: pareto[1] = \"torque\": no such metric") != std::string::npos);
  // The command line's statements win over the file's, one by one.
  const RankSpec merged = overridden(s.ranking, {"", 0.02, "", {}});
  CHECK(merged.rank_by == "peak_field_ripple");
  CHECK(*merged.tolerance == 0.02);
  CHECK(merged.tie_break == "fundamental_T:highest");
  CHECK(parse_pareto("a:lowest, b") == std::vector<std::string>{"a:lowest", "b"});
  CHECK_THROWS_AS(parse_pareto("a"), InputError);
  CHECK_THROWS_AS(parse_pareto("a,b,c"), InputError);
}

TEST_CASE("sweep.json keeps the sweep file's ranking for collect, and one written without it reads as unstated") {
  const fs::path dir = tf::testing::fresh_folder("manifest_ranking");
  fs::create_directories(dir);
  Manifest m{"s.toml", "t", "b.toml", {"peak_field_ripple", 0.02, "fundamental_T", {"torque_ripple", "torque_mean_N_m"}}, {"k"},
             {{"v1", {"1"}, ""}}};
  write_manifest(dir, m);
  const Manifest back = read_manifest(dir);
  CHECK(back.ranking.rank_by == "peak_field_ripple");
  REQUIRE(back.ranking.tolerance.has_value());
  CHECK(*back.ranking.tolerance == 0.02);
  CHECK(back.ranking.tie_break == "fundamental_T");
  CHECK(back.ranking.pareto == m.ranking.pareto);
  // The sweep.json of a turnfield before ties and Pareto views.
  std::ofstream(dir / "sweep.json") << R"({"sweep_of": "turnfield", "sweep_file": "s", "title": "t", "base_case": "b",
    "rank_by": "", "parameters": ["k"], "variants": [{"id": "v1", "inputs": ["1"], "problem": ""}]})";
  const Manifest old = read_manifest(dir);
  CHECK_FALSE(old.ranking.tolerance.has_value());
  CHECK(old.ranking.tie_break.empty());
  CHECK(old.ranking.pareto.empty());
}
