#include "sweep/sweep_collect.hpp"

#include <algorithm>
#include <cmath>
#include <fstream>
#include <sstream>

#include <fmt/format.h>

#include "input/input_error.hpp"
#include "sweep/sweep_metrics.hpp"
#include "sweep/sweep_records.hpp"
#include "post/atomic_file.hpp"
#include "post/summary.hpp"
#include "post/sweep_report.hpp"

namespace tf::sweep {
namespace {

namespace fs = std::filesystem;

std::string csv_field(const std::string& text) {
  if (text.find_first_of(",\"\n") == std::string::npos) return text;
  std::string s = "\"";
  for (const char ch : text) s += ch == '"' ? std::string("\"\"") : std::string(1, ch);
  return s + "\"";
}

std::string read_text(const fs::path& path) {
  std::ifstream in(path);
  std::ostringstream text;
  text << in.rdbuf();
  return text.str();
}

/// The row of one variant from the first folder that holds its record.
post::SweepRow collect_row(const ManifestEntry& e, const std::vector<fs::path>& dirs, std::size_t n_metrics) {
  post::SweepRow row{e.id, e.inputs, "missing", "no result in any of the folders", std::vector<double>(n_metrics, post::kNoValue), 0};
  if (!e.problem.empty()) row.status = "invalid", row.message = e.problem;
  for (const auto& dir : dirs) {
    const auto record = read_variant_record(dir / e.id);
    if (!record) continue;
    const fs::path where = dir / e.id;
    row.status = record->status;
    row.message = record->message;
    if (row.status != "ok") return row;
    try {
      row.metrics = read_metrics(read_text(where / "summary.json"));
    } catch (const std::exception& ex) {
      row.status = "failed";
      row.message = fmt::format("{}: unreadable ({})", (where / "summary.json").string(), ex.what());
    }
    return row;
  }
  return row;
}

/// Variant folders of other shards' folders appear in out_dir as links, so the report's links work.
void link_variant(const fs::path& out_dir, const fs::path& where) {
  std::error_code ec;
  const fs::path link = out_dir / where.filename();
  if (fs::exists(link, ec) || fs::is_symlink(link, ec)) return;
  fs::create_directory_symlink(fs::absolute(where), link, ec);
}

/// Copies the best variant's folder to out_dir/best_variant (replacing an older copy whole).
void copy_best(const fs::path& out_dir, const fs::path& from) {
  const fs::path to = out_dir / "best_variant", partial = out_dir / "best_variant.partial";
  std::error_code ec;
  fs::remove_all(partial, ec);
  fs::copy(from, partial, fs::copy_options::recursive, ec);
  if (ec) throw post::OutputError(fmt::format("could not copy {} to {}: {}", from.string(), partial.string(), ec.message()));
  fs::remove_all(to, ec);
  fs::rename(partial, to, ec);
  if (ec) throw post::OutputError(fmt::format("could not rename {}: {}", partial.string(), ec.message()));
}

/// The shard specs ("1/2") the variants of `dir` were run with, from their records.
std::vector<std::string> shard_specs(const fs::path& dir, const Manifest& m) {
  std::vector<std::string> specs;
  for (const auto& e : m.variants)
    if (const auto r = read_variant_record(dir / e.id); r && !r->shard.empty())
      if (std::find(specs.begin(), specs.end(), r->shard) == specs.end()) specs.push_back(r->shard);
  std::sort(specs.begin(), specs.end());
  return specs;
}

/// Folders whose shards were cut into different numbers N overlap and leave gaps (shard 1/2 takes
/// variants 1, 3, 5, ..., shard 2/3 takes 2, 5, 8, ...): refuse them rather than merge by chance.
void check_one_cut(const std::vector<fs::path>& dirs, const Manifest& m) {
  std::vector<std::string> described, counts;
  for (const auto& dir : dirs) {
    const std::vector<std::string> specs = shard_specs(dir, m);
    for (const auto& spec : specs) {
      const std::string n = spec.substr(spec.find('/') + 1);
      if (std::find(counts.begin(), counts.end(), n) == counts.end()) counts.push_back(n);
    }
    described.push_back(fmt::format("{} (shard {})", dir.string(), specs.empty() ? "unknown" : fmt::format("{}", fmt::join(specs, ", "))));
  }
  if (counts.size() > 1)
    throw input::InputError(fmt::format("collect: the folders were cut into shards differently: {}; expected the "
                                        "shards of one cut (the same N in --shard k/N), or run the sweep again into one folder",
                                        fmt::join(described, "; ")));
}

void print_ranking(std::ostream& out, const post::SweepTable& t) {
  out << post::ranking_sentence(t) << '\n';
  std::vector<const post::SweepRow*> order;
  for (const auto& r : t.rows) if (r.rank > 0) order.push_back(&r);
  std::sort(order.begin(), order.end(), [](auto* a, auto* b) { return a->rank < b->rank; });
  for (const auto* r : order) {
    std::vector<std::string> inputs;
    for (std::size_t k = 0; k < t.parameters.size(); ++k) inputs.push_back(t.parameters[k] + " = " + r->inputs[k]);
    out << fmt::format("{:>4}  {}  {:<12.6g}  {}{}\n", r->rank, r->variant, r->metrics[static_cast<std::size_t>(t.rank_by)],
                       fmt::join(inputs, ", "), r->tied_with_best ? "  = tied" : "");
  }
  if (t.pareto.shown()) {
    std::vector<std::string> front;
    for (const auto& r : t.rows) if (r.pareto_optimal) front.push_back(r.variant);
    out << fmt::format("{}: {}\n", post::pareto_sentence(t), fmt::join(front, ", "));
  }
  for (const auto& r : t.rows)
    if (r.status != "ok") out << fmt::format("   -  {}  {}: {}\n", r.variant, r.status, r.message);
}

}  // namespace

post::SweepTable collect_table(const CollectOptions& o) {
  if (o.dirs.empty()) throw input::InputError("collect: no folder given; expected the --out folders of the sweep's shards");
  check_rank_options(o.ranking);
  const Manifest m = read_manifest(o.dirs.front());
  for (std::size_t i = 1; i < o.dirs.size(); ++i) {
    const Manifest other = read_manifest(o.dirs[i]);
    bool same = other.parameters == m.parameters && other.variants.size() == m.variants.size();
    for (std::size_t k = 0; same && k < m.variants.size(); ++k) same = other.variants[k].id == m.variants[k].id;
    if (!same)
      throw input::InputError(fmt::format("{}: holds another sweep ({}) than {} ({}); collect the shards of one sweep",
                                   o.dirs[i].string(), other.sweep_file, o.dirs.front().string(), m.sweep_file));
  }
  if (o.dirs.size() > 1) check_one_cut(o.dirs, m);
  post::SweepTable t{m.title, m.sweep_file, m.base_case, m.parameters, sweep_metric_columns(), {}, -1};
  for (const auto& e : m.variants) t.rows.push_back(collect_row(e, o.dirs, t.metrics.size()));
  RankSpec ranking = overridden(m.ranking, o.ranking);
  if (ranking.rank_by.empty()) ranking.rank_by = "fundamental_T";
  rank_rows(t, ranking);
  return t;
}

void write_sweep_csv(const fs::path& path, const post::SweepTable& t) {
  post::write_atomically(path, [&](std::ostream& o) {
    o << "variant";
    for (const auto& p : t.parameters) o << ',' << csv_field(p);
    o << ",status,rank,tied_with_best,pareto_optimal";
    for (const auto& m : t.metrics) o << ',' << m.key;
    o << ",message\n";
    for (const auto& r : t.rows) {
      o << r.variant;
      for (const auto& v : r.inputs) o << ',' << csv_field(v);
      o << ',' << r.status << ',' << (r.rank > 0 ? std::to_string(r.rank) : "") << ',' << (r.tied_with_best ? "yes" : "")
        << ',' << (!in_pareto_view(t, r) ? "" : r.pareto_optimal ? "yes" : "no");
      for (const double v : r.metrics) o << ',' << (std::isfinite(v) ? fmt::format("{:.6g}", v) : "");
      o << ',' << csv_field(r.message) << '\n';
    }
  });
}

int collect_sweep(const CollectOptions& o, std::ostream& out) {
  const post::SweepTable t = collect_table(o);
  std::error_code ec;
  fs::create_directories(o.out_dir, ec);
  std::size_t ok = 0;
  const post::SweepRow* best = nullptr;
  for (const auto& r : t.rows) {
    ok += r.status == "ok";
    if (r.rank == 1) best = &r;
    for (const auto& dir : o.dirs)
      if (fs::exists(dir / r.variant, ec) && fs::absolute(dir) != fs::absolute(o.out_dir)) link_variant(o.out_dir, dir / r.variant);
  }
  bool out_is_a_shard = false;
  for (const auto& dir : o.dirs) out_is_a_shard |= fs::equivalent(dir, o.out_dir, ec);
  if (!out_is_a_shard) write_manifest(o.out_dir, read_manifest(o.dirs.front()));  // so it can be collected again
  write_sweep_csv(o.out_dir / "sweep_summary.csv", t);
  if (best) copy_best(o.out_dir, o.out_dir / best->variant);
  post::write_sweep_report(o.out_dir, t,
                           best ? fmt::format("The best variant by {}{}, {}, is copied whole to best_variant/: its "
                                              "report.html, and field.pvd to open in any VTK viewer.",
                                              t.metrics[static_cast<std::size_t>(t.rank_by)].key,
                                              best->tied_with_best && t.tie_break >= 0
                                                  ? " and, among the variants tied with it, by " +
                                                        t.metrics[static_cast<std::size_t>(t.tie_break)].key
                                                  : "",
                                              best->variant)
                                : "No variant could be ranked, so none is copied.");
  print_ranking(out, t);
  out << fmt::format("sweep: {} variants: {} ok, {} failed or invalid or missing; summary in {} and {}{}\n",
                     t.rows.size(), ok, t.rows.size() - ok, (o.out_dir / "sweep_summary.csv").string(),
                     (o.out_dir / "report.html").string(),
                     best ? fmt::format(", best variant copied to {}", (o.out_dir / "best_variant").string()) : "");
  out << post::kSafetyCaution << '\n';
  return ok == t.rows.size() ? 0 : 1;
}

}  // namespace tf::sweep
