// Sweeps end to end through the command line: a failing variant does not stop the others, a killed
// sweep resumes to the same summary, and shards collected equal one unsharded run. The study is
// tests/data/sweep/six_variants.toml (invented values on the demo stator).

#include <doctest/doctest.h>

#include <chrono>
#include <csignal>
#include <fstream>
#include <iterator>
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
  CHECK(rows[0].rfind("variant,stator.slot.opening,winding.coil_pitch,status,rank,fundamental_T", 0) == 0);
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

TEST_CASE("ranking by a metric that no variant reports fails and says so") {
  // The reference sweep is of phase-angle studies: their rotor does not turn, so no torque.
  const fs::path out = fresh_folder("sweep_rank_torque");
  const auto r = turnfield("collect " + reference_run().out.string() + " --out " + out.string() +
                           " --rank-by torque_mean_N_m");
  CHECK(r.status == 1);
  CHECK(r.output.find("rank by torque_mean_N_m: none of the 5 variants that ran reports it") != std::string::npos);
  CHECK_FALSE(fs::exists(out / "best_variant"));
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
}
