// Sweeps end to end through the command line: a failing variant does not stop the others, a killed
// sweep resumes to the same summary, and shards collected equal one unsharded run. The study is
// tests/data/sweep/six_variants.toml (invented values on the demo stator).

#include <doctest/doctest.h>

#include <algorithm>
#include <chrono>
#include <csignal>
#include <fstream>
#include <iterator>
#include <map>
#include <sstream>
#include <thread>

#include <sys/wait.h>
#include <unistd.h>

#include "support/cli_run.hpp"

namespace {

namespace fs = std::filesystem;
using tf::testing::fresh_folder;
using tf::testing::turnfield;

const std::string kStudy = std::string(TF_SOURCE_DIR) + "/tests/data/sweep/six_variants.toml";

std::string text_of(const fs::path& path) {
  std::ifstream in(path);
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> lines;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) lines.push_back(line);
  return lines;
}

int variants_done(const fs::path& out) {
  int n = 0;
  if (!fs::exists(out)) return 0;
  for (const auto& entry : fs::directory_iterator(out)) n += fs::exists(entry.path() / "variant.json");
  return n;
}

struct Run {
  fs::path out;
  tf::testing::Outcome outcome;
};

/// One uninterrupted run with two variants at a time, made once per test program.
const Run& reference_run() {
  // One per test process: ctest runs the test cases as processes at once, and a shared folder
  // would be cleared by one while another reads it.
  static const Run run = [] {
    const fs::path dir = fresh_folder("sweep_reference_" + std::to_string(getpid()));
    return Run{dir, turnfield("sweep " + kStudy + " --out " + dir.string() + " -j 2")};
  }();
  return run;
}

/// A process whose command line holds every one of `words` (0 if none): a sweep's variant.
pid_t process_with(const std::vector<std::string>& words) {
  for (const auto& entry : fs::directory_iterator("/proc")) {
    std::ifstream in(entry.path() / "cmdline");
    const std::string cmdline((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
    bool all = !cmdline.empty();
    for (const auto& w : words) all = all && cmdline.find(w) != std::string::npos;
    if (all) return static_cast<pid_t>(std::stol(entry.path().filename().string()));
  }
  return 0;
}

/// Starts `turnfield sweep` with the study, out folder and -j 1, without waiting; returns its pid.
pid_t start_sweep(const fs::path& out) {
  const pid_t pid = fork();
  REQUIRE(pid >= 0);
  if (pid == 0) {
    const std::string o = out.string();
    execl(TF_BINARY, TF_BINARY, "sweep", kStudy.c_str(), "--out", o.c_str(), "-j", "1", static_cast<char*>(nullptr));
    _exit(127);
  }
  return pid;
}

}  // namespace

TEST_CASE("a sweep of six variants with one invalid: five results, an error row, exit status 1") {
  const auto& [out, r] = reference_run();
  CHECK(r.status == 1);
  CHECK(r.output.find("sweep: 6 variants: 5 ok, 1 failed or invalid or missing") != std::string::npos);
  const auto rows = lines_of(text_of(out / "sweep_summary.csv"));
  REQUIRE(rows.size() == 7);
  CHECK(rows[0].rfind("variant,stator.slot.opening,winding.coil_pitch,status,rank,tied_with_best,pareto_optimal,fundamental_T", 0) == 0);
  int ok = 0;
  for (std::size_t i = 1; i < rows.size(); ++i) ok += rows[i].find(",ok,") != std::string::npos;
  CHECK(ok == 5);
  // The fifth row is the invalid one, with the case reader's own message naming file, line and key.
  CHECK(rows[5].find(",0.03,5,invalid,,") != std::string::npos);
  CHECK(rows[5].find("pump24_three_phase.toml:19: [stator.slot] opening = 0.03") != std::string::npos);
  CHECK(fs::exists(out / "best_variant" / "summary.json"));
}

TEST_CASE("a sweep killed midway and run again ends with the summary of an uninterrupted run") {
  const fs::path out = fresh_folder("sweep_killed");
  const pid_t pid = start_sweep(out);
  const auto deadline = std::chrono::steady_clock::now() + std::chrono::seconds(120);
  while (variants_done(out) < 2 && std::chrono::steady_clock::now() < deadline)  // the invalid one and one run
    std::this_thread::sleep_for(std::chrono::milliseconds(20));
  kill(pid, SIGKILL);
  int status = 0;
  waitpid(pid, &status, 0);
  REQUIRE(WIFSIGNALED(status));
  const int done_before = variants_done(out);
  CHECK(done_before >= 2);
  CHECK(done_before < 6);  // killed midway, not after the end
  std::this_thread::sleep_for(std::chrono::milliseconds(300));
  CHECK(process_with({out.string()}) == 0);  // the variant that was running died with the sweep

  const auto rerun = turnfield("sweep " + kStudy + " --out " + out.string() + " -j 1");
  CHECK(rerun.status == 1);
  CHECK(rerun.output.find(std::to_string(done_before) + " done already") != std::string::npos);
  CHECK(text_of(out / "sweep_summary.csv") == text_of(reference_run().out / "sweep_summary.csv"));
}

TEST_CASE("a variant that crashes is recorded as failed and the others go on") {
  const fs::path out = fresh_folder("sweep_crash");
  const pid_t sweep = start_sweep(out);
  pid_t variant = 0;  // the first variant's run, killed as a crash would end it
  const auto deadline = std::chrono::steady_clock::now() + std::chrono::seconds(60);
  while (variant == 0 && std::chrono::steady_clock::now() < deadline) {
    variant = process_with({std::string("\0run\0", 5), out.string()});  // arguments are NUL-separated
    std::this_thread::sleep_for(std::chrono::milliseconds(5));
  }
  REQUIRE(variant != 0);
  kill(variant, SIGKILL);
  int status = 0;
  waitpid(sweep, &status, 0);
  CHECK(WEXITSTATUS(status) == 1);
  const auto rows = lines_of(text_of(out / "sweep_summary.csv"));
  REQUIRE(rows.size() == 7);
  int ok = 0, failed = 0;
  for (const auto& row : rows) ok += row.find(",ok,") != std::string::npos, failed += row.find(",failed,") != std::string::npos;
  CHECK(ok == 4);
  CHECK(failed == 1);
  CHECK(text_of(out / "sweep_summary.csv").find("killed by signal 9") != std::string::npos);
}

TEST_CASE("two shards collected equal one unsharded run") {
  const fs::path a = fresh_folder("sweep_shard_a"), b = fresh_folder("sweep_shard_b"), merged = fresh_folder("sweep_merged");
  CHECK(turnfield("sweep " + kStudy + " --out " + a.string() + " --shard 1/2 -j 1").status == 1);  // holds the invalid one
  CHECK(turnfield("sweep " + kStudy + " --out " + b.string() + " --shard 2/2 -j 1").status == 0);
  CHECK(variants_done(a) == 3);
  CHECK(variants_done(b) == 3);
  const auto c = turnfield("collect " + a.string() + " " + b.string() + " --out " + merged.string());
  CHECK(c.status == 1);
  CHECK(text_of(merged / "sweep_summary.csv") == text_of(reference_run().out / "sweep_summary.csv"));
  // One shard alone: the other shard's three variants are missing, beside the invalid one.
  const fs::path alone_dir = fresh_folder("sweep_alone");
  const auto alone = turnfield("collect " + a.string() + " --out " + alone_dir.string());
  CHECK(alone.status == 1);
  CHECK(alone.output.find("2 ok, 4 failed or invalid or missing") != std::string::npos);
  CHECK(text_of(alone_dir / "sweep_summary.csv").find(",missing,") != std::string::npos);
}

TEST_CASE("ranking by a metric that no variant reports is bad input: exit 2, the metrics there are, nothing written") {
  // The reference sweep is of phase-angle studies: their rotor does not turn, so no torque.
  for (const char* option : {"--rank-by torque_mean_N_m", "--tie-break torque_ripple", "--pareto torque_ripple,fundamental_T"}) {
    INFO(option);
    const fs::path out = fresh_folder("sweep_rank_torque");
    const auto r = turnfield("collect " + reference_run().out.string() + " --out " + out.string() + " " + option);
    CHECK(r.status == 2);
    CHECK(r.output.find(": none of the 5 variants that ran reports it") != std::string::npos);
    CHECK(r.output.find("expected one of the metrics they report: fundamental_T, amplitude_ripple") != std::string::npos);
    CHECK_FALSE(fs::exists(out / "sweep_summary.csv"));
    CHECK_FALSE(fs::exists(out / "best_variant"));
  }
}

/// The rows of a summary as maps from column name to text.
std::vector<std::map<std::string, std::string>> csv_rows(const fs::path& path) {
  const auto lines = lines_of(text_of(path));
  const auto split = [](const std::string& line) {
    std::vector<std::string> cells;
    std::string cell;
    bool quoted = false;
    for (const char ch : line) {
      if (ch == '"') quoted = !quoted;
      else if (ch == ',' && !quoted) cells.push_back(cell), cell.clear();
      else cell += ch;
    }
    cells.push_back(cell);
    return cells;
  };
  const auto header = split(lines.at(0));
  std::vector<std::map<std::string, std::string>> rows;
  for (std::size_t i = 1; i < lines.size(); ++i) {
    const auto cells = split(lines[i]);
    std::map<std::string, std::string> row;
    for (std::size_t k = 0; k < header.size() && k < cells.size(); ++k) row[header[k]] = cells[k];
    rows.push_back(row);
  }
  return rows;
}

TEST_CASE("end to end: full-pitch variants tie on the winding factor and the harmonic distortion breaks the tie") {
  // 24 slots, 4 poles, 3 phases: q = 2, distribution factor sin(q·15°)/(q·sin 15°) = 0.96593 and
  // pitch factor sin(90°·5/6) = 0.96593 for a pitch of 5 slots (Pyrhönen, Jokinen and Hrabovcová,
  // "Design of Rotating Electrical Machines", 2008, ch. 2, the distribution and pitch factors; from
  // memory). So the three full-pitch (6 slot) variants tie exactly at kw = 0.96593, ahead of 0.93301.
  const fs::path out = fresh_folder("sweep_tie_e2e");
  const auto r = turnfield("collect " + reference_run().out.string() + " --out " + out.string() +
                           " --rank-by winding_factor --tie-break harmonic_distortion --rank-tolerance 0.001");
  CHECK(r.status == 1);  // the invalid variant
  const auto rows = csv_rows(out / "sweep_summary.csv");
  REQUIRE(rows.size() == 6);
  std::vector<std::pair<double, int>> tied;  // (distortion, rank)
  for (const auto& row : rows) {
    if (row.at("status") != "ok") continue;
    const double kw = std::stod(row.at("winding_factor"));
    const bool full = row.at("winding.coil_pitch") == "6";
    CHECK(kw == doctest::Approx(full ? 0.965926 : 0.933013).epsilon(1e-5).scale(0));
    CHECK((row.at("tied_with_best") == "yes") == full);
    if (full) tied.push_back({std::stod(row.at("harmonic_distortion")), std::stoi(row.at("rank"))});
  }
  REQUIRE(tied.size() == 3);
  std::sort(tied.begin(), tied.end());  // the lowest distortion ranks first
  CHECK(tied[0].second == 1);
  CHECK(tied[1].second == 2);
  CHECK(tied[2].second == 3);
  CHECK(r.output.find("count as tied with it (marked \"= tied\": 3 variants) and are ordered among themselves by "
                      "harmonic distortion") != std::string::npos);
  const std::string html = text_of(out / "report.html");
  CHECK(html.find("Variants within 0.1 % of the best winding_factor") != std::string::npos);
  CHECK(html.find("=\u00a0tied") != std::string::npos);
}

TEST_CASE("end to end: the Pareto column flags exactly the variants no other variant dominates") {
  const fs::path out = fresh_folder("sweep_pareto_e2e");
  const auto r = turnfield("collect " + reference_run().out.string() + " --out " + out.string() +
                           " --pareto peak_field_ripple:lowest,fundamental_T:highest");
  CHECK(r.status == 1);
  const auto rows = csv_rows(out / "sweep_summary.csv");
  // Domination checked here from its definition (Deb 2001, ch. 2), pair by pair on the CSV's numbers.
  std::size_t optimal = 0;
  for (const auto& q : rows) {
    if (q.at("status") != "ok") {
      CHECK(q.at("pareto_optimal").empty());
      continue;
    }
    bool dominated = false;
    for (const auto& p : rows) {
      if (p.at("status") != "ok") continue;
      const double pr = std::stod(p.at("peak_field_ripple")), qr = std::stod(q.at("peak_field_ripple"));
      const double pb = std::stod(p.at("fundamental_T")), qb = std::stod(q.at("fundamental_T"));
      dominated = dominated || (pr <= qr && pb >= qb && (pr < qr || pb > qb));
    }
    CHECK(q.at("pareto_optimal") == (dominated ? "no" : "yes"));
    optimal += !dominated;
  }
  CHECK(optimal >= 1);
  CHECK(optimal < 5);  // the study's designs do trade off: not all are optimal
  CHECK(fs::exists(out / "figures" / "pareto_fundamental_T_vs_peak_field_ripple.svg"));
  CHECK(text_of(out / "report.html").find("◆\u00a0optimal") != std::string::npos);
}

TEST_CASE("collect refuses shards cut differently, naming the folders and their cuts") {
  const fs::path a = fresh_folder("sweep_cut_half"), b = fresh_folder("sweep_cut_third");
  // Shard 1/2 takes variants 1, 3, 5 (0-based 0, 2, 4) and shard 2/3 variants 2 and 5: 5 twice, 4 and 6 never.
  turnfield("sweep " + kStudy + " --out " + a.string() + " --shard 1/2 -j 1");
  turnfield("sweep " + kStudy + " --out " + b.string() + " --shard 2/3 -j 1");
  const fs::path merged = fresh_folder("sweep_cut_merged");
  const auto r = turnfield("collect " + a.string() + " " + b.string() + " --out " + merged.string());
  CHECK(r.status == 2);
  CHECK(r.output.find("collect: the folders were cut into shards differently: " + a.string() + " (shard 1/2); " +
                      b.string() + " (shard 2/3)") != std::string::npos);
  CHECK_FALSE(fs::exists(merged / "sweep_summary.csv"));
  // Each alone is one cut, and collects (with the rest missing).
  CHECK(turnfield("collect " + b.string() + " --out " + fresh_folder("sweep_cut_alone").string()).status == 1);
}

TEST_CASE("every sweep file in cases/sweeps lists valid variants") {
  int n = 0;
  for (const auto& entry : fs::directory_iterator(fs::path(TF_SOURCE_DIR) / "cases" / "sweeps")) {
    if (entry.path().extension() != ".toml") continue;
    INFO(entry.path().string());
    const auto r = turnfield("sweep " + entry.path().string() + " --dry-run --out " + fresh_folder("dry").string());
    CHECK(r.status == 0);
    CHECK(r.output.find(" 0 invalid") != std::string::npos);
    ++n;
  }
  CHECK(n >= 1);
}

TEST_CASE("a sweep's command line refuses what it cannot do, with exit status 2") {
  CHECK(turnfield("sweep " + kStudy + " --shard 3/2 --dry-run").status == 2);
  CHECK(turnfield("sweep " + kStudy + " --shard x --dry-run").status == 2);
  CHECK(turnfield("collect " + fs::temp_directory_path().string()).status == 2);  // not a sweep's folder
  // A misspelt ranking on the command line stops the sweep before anything runs, --dry-run too.
  for (const char* dry : {"", " --dry-run"}) {
    const fs::path out = fresh_folder("sweep_bad_rank");
    const auto bad = turnfield("sweep " + kStudy + " --rank-by fundamental_t --out " + out.string() + dry);
    CHECK(bad.status == 2);
    CHECK(bad.output.find("--rank-by fundamental_t: no such metric") != std::string::npos);
    CHECK_FALSE(fs::exists(out));
  }
  const auto r = turnfield("collect " + reference_run().out.string() + " --rank-by torque");
  CHECK(r.status == 2);
  CHECK(r.output.find("no such metric") != std::string::npos);
  // The tie and Pareto options, checked before anything runs.
  const std::vector<std::pair<std::string, std::string>> bad = {
      {"--rank-tolerance 1.5", "--rank-tolerance 1.5: expected a relative tolerance >= 0 and < 1"},
      {"--rank-tolerance -0.1", "--rank-tolerance -0.1: expected a relative tolerance"},
      {"--tie-break harmonic", "--tie-break harmonic: no such metric"},
      {"--pareto fundamental_T", "--pareto fundamental_T: expected two metrics, X,Y"},
      {"--pareto fundamental_T,fundamental_T:lowest", "one metric twice"},
      {"--pareto fundamental_T,ripple", "--pareto ripple: no such metric"}};
  for (const auto& [option, message] : bad) {
    INFO(option);
    const fs::path out = fresh_folder("sweep_bad_ranking_option");
    const auto s = turnfield("sweep " + kStudy + " --out " + out.string() + " " + option);
    CHECK(s.status == 2);
    CHECK(s.output.find(message) != std::string::npos);
    CHECK_FALSE(fs::exists(out));
    const auto c = turnfield("collect " + reference_run().out.string() + " --out " + out.string() + " " + option);
    CHECK(c.status == 2);
    CHECK(c.output.find(message) != std::string::npos);
  }
}
