#include "sweep/sweep_run.hpp"

#include <fstream>
#include <map>
#include <thread>

#include <fmt/format.h>

#include "input/case_reader.hpp"
#include "sweep/child_process.hpp"
#include "input/input_error.hpp"
#include "sweep/sweep_collect.hpp"
#include "sweep/sweep_records.hpp"
#include "post/atomic_file.hpp"
#include "solver/stopwatch.hpp"

namespace tf::sweep {
namespace {

namespace fs = std::filesystem;

std::string clock_text(double seconds) {
  const auto s = static_cast<long long>(seconds + 0.5);
  return s >= 3600 ? fmt::format("{}h{:02d}m", s / 3600, s / 60 % 60) : fmt::format("{}m{:02d}s", s / 60, s % 60);
}

/// The same checks as `turnfield check`, on each variant's text; "" when valid.
std::vector<std::string> validate(const SweepFile& s, const std::vector<Variant>& variants) {
  std::vector<std::string> problems;
  for (const auto& v : variants) {
    try {
      input::read_case_text(s.base_case, v.case_text);
      problems.emplace_back();
    } catch (const input::InputError& e) {
      problems.push_back(fmt::format("variant {} ({}): {}", v.index + 1, describe_inputs(s, v), e.what()));
    }
  }
  return problems;
}

/// The child's own error line from its log, or how it ended.
std::string failure_message(const fs::path& log, const ChildEnd& end) {
  std::ifstream in(log);
  std::string last;
  for (std::string line; std::getline(in, line);)
    for (const char* head : {"error: ", "mesh error: ", "solver error: ", "output error: "})
      if (line.rfind(head, 0) == 0) last = line;
  if (!last.empty()) return last;
  if (end.signal != 0) return fmt::format("killed by signal {} (see {})", end.signal, log.string());
  return fmt::format("ended with exit status {} (see {})", end.exit_status, log.string());
}

struct Tally {
  std::size_t done = 0, failed = 0, skipped = 0, left = 0;
  std::size_t timed = 0;      ///< variants run to their end in this run
  double busy_seconds = 0.0;  ///< summed over those
};

/// One line per finished variant: counts and an estimate of the time left.
void report_progress(std::ostream& progress, const Tally& t, std::size_t running, int jobs, const std::string& what) {
  const std::string eta = t.timed == 0 ? "?" : clock_text(t.busy_seconds / static_cast<double>(t.timed) *
                                                           static_cast<double>(t.left + running) / jobs);
  progress << fmt::format("[done {}, failed {}, running {}, left {}, ETA {}] {}\n", t.done, t.failed, running, t.left,
                          eta, what)
           << std::flush;
}

struct Job {
  const Variant* variant;
  solver::Stopwatch clock;  ///< started with the child
};

/// Runs the queued variants, `jobs` at a time, and records each as it ends.
void run_queue(const SweepFile& s, const std::vector<const Variant*>& queue, const SweepOptions& o, int jobs,
               Tally& tally, std::ostream& progress) {
  std::map<pid_t, Job> running;
  std::size_t next = 0;
  tally.left = queue.size();
  while (next < queue.size() || !running.empty()) {
    while (next < queue.size() && static_cast<int>(running.size()) < jobs) {
      const Variant* v = queue[next++];
      const fs::path dir = o.out_dir / v->id;
      const pid_t pid = start_child({{"run", (dir / "case.toml").string(), "--out", dir.string()}, dir / "log.txt", jobs > 1});
      running[pid] = {v, solver::Stopwatch{}};
      --tally.left;
    }
    const ChildEnd end = wait_for_child();
    const auto it = running.find(end.pid);
    if (it == running.end()) continue;
    const Variant& v = *it->second.variant;
    const fs::path dir = o.out_dir / v.id;
    VariantRecord r{v.id, "ok", "", it->second.clock.seconds(), shard_text(o.shard)};
    running.erase(it);
    std::error_code ec;
    if (end.exit_status != 0 || !fs::exists(dir / "summary.json", ec)) {
      r.status = end.exit_status == 2 ? "invalid" : "failed";
      r.message = failure_message(dir / "log.txt", end);
    }
    write_variant_record(dir, r);
    (r.status == "ok" ? tally.done : tally.failed) += 1;
    tally.busy_seconds += r.seconds;
    ++tally.timed;
    report_progress(progress, tally, running.size(), jobs,
                    fmt::format("variant {} {} {} in {:.1f} s ({}){}", v.index + 1, v.id, r.status, r.seconds,
                                describe_inputs(s, v), r.message.empty() ? "" : ": " + r.message));
  }
}

/// Clears a variant's folder and writes its case file; a clean start for a variant not done.
void prepare_variant(const fs::path& dir, const Variant& v) {
  std::error_code ec;
  fs::remove_all(dir, ec);
  fs::create_directories(dir, ec);
  if (ec) throw post::OutputError(fmt::format("could not create {}: {}", dir.string(), ec.message()));
  post::write_atomically(dir / "case.toml", [&](std::ostream& o) { o << v.case_text; });
}

int dry_run(const SweepFile& s, const std::vector<Variant>& variants, const std::vector<std::string>& problems,
            const SweepOptions& o, std::ostream& out) {
  std::size_t invalid = 0, mine = 0;
  for (const auto& v : variants) {
    if (!in_shard(v.index, o.shard)) continue;
    ++mine;
    const bool done = read_variant_record(o.out_dir / v.id).has_value();
    out << fmt::format("{:>4}  {}  {}  {}\n", v.index + 1, v.id, describe_inputs(s, v),
                       !problems[v.index].empty() ? "INVALID" : done ? "done already" : "to run");
    if (!problems[v.index].empty()) out << "      " << problems[v.index] << '\n', ++invalid;
  }
  out << fmt::format("{} variants{}, {} invalid; results would go to {}\n", mine,
                     o.shard.n > 1 ? fmt::format(" in shard {}/{} (of {})", o.shard.k, o.shard.n, variants.size()) : "",
                     invalid, o.out_dir.string());
  return invalid > 0 ? 1 : 0;
}

}  // namespace

int run_sweep(const std::string& sweep_path, const SweepOptions& o, std::ostream& out, std::ostream& progress) {
  // A misspelt ranking is found before the first variant runs, not after the last.
  check_rank_options(o.ranking);
  const SweepFile s = read_sweep_file(sweep_path);
  const std::vector<Variant> variants = expand_variants(s);
  const std::vector<std::string> problems = validate(s, variants);
  if (o.dry_run) return dry_run(s, variants, problems, o, out);

  const solver::Stopwatch clock;
  std::error_code ec;
  fs::create_directories(o.out_dir, ec);
  if (ec) throw post::OutputError(fmt::format("could not create {}: {}", o.out_dir.string(), ec.message()));
  write_manifest(o.out_dir, make_manifest(s, variants, problems));

  Tally tally;
  std::vector<const Variant*> queue;
  for (const auto& v : variants) {
    if (!in_shard(v.index, o.shard)) continue;
    const fs::path dir = o.out_dir / v.id;
    const auto record = read_variant_record(dir);
    if (record && !(o.retry_failed && record->status == "failed")) {
      ++tally.skipped;
      continue;
    }
    prepare_variant(dir, v);
    if (problems[v.index].empty()) {
      queue.push_back(&v);
    } else {
      write_variant_record(dir, {v.id, "invalid", problems[v.index], 0.0, shard_text(o.shard)});
      ++tally.failed;
      out << "invalid: " << problems[v.index] << '\n';
    }
  }
  const int jobs = o.jobs > 0 ? o.jobs : static_cast<int>(std::max(1u, std::thread::hardware_concurrency()));
  out << fmt::format("{}: {} variants{}; {} done already, {} invalid, {} to run, {} at a time\n", s.path, variants.size(),
                     o.shard.n > 1 ? fmt::format(", shard {}/{}", o.shard.k, o.shard.n) : "", tally.skipped,
                     tally.failed, queue.size(), jobs)
      << std::flush;
  run_queue(s, queue, o, jobs, tally, progress);
  out << fmt::format("ran {} variants in {:.1f} s wall time ({} ok, {} failed or invalid, {} done before)\n",
                     tally.done + tally.failed, clock.seconds(), tally.done, tally.failed, tally.skipped);
  if (o.shard.n > 1) {
    out << fmt::format("shard {}/{} finished; when every shard has, run: turnfield collect {}\n", o.shard.k, o.shard.n,
                       o.out_dir.string());
    return tally.failed > 0 ? 1 : 0;
  }
  return collect_sweep({{o.out_dir}, o.out_dir, o.ranking}, out);
}

}  // namespace tf::sweep
