#include "sweep/sweep_records.hpp"

#include <fstream>
#include <sstream>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "input/input_error.hpp"
#include "post/atomic_file.hpp"

namespace tf::sweep {
namespace {

namespace fs = std::filesystem;
using json = nlohmann::json;

std::optional<json> read_json(const fs::path& path) {
  std::ifstream in(path);
  if (!in) return std::nullopt;
  std::ostringstream text;
  text << in.rdbuf();
  json j = json::parse(text.str(), nullptr, false);
  if (j.is_discarded()) return std::nullopt;
  return j;
}

/// The ranking keys of sweep.json; those a sweep.json of an older turnfield lacks are unstated.
RankSpec read_ranking(const json& j) {
  RankSpec r{j.at("rank_by"), std::nullopt, j.value("tie_break", ""), j.value("pareto", std::vector<std::string>{})};
  if (j.contains("rank_tolerance") && j.at("rank_tolerance").is_number()) r.tolerance = j.at("rank_tolerance").get<double>();
  return r;
}

}  // namespace

Manifest make_manifest(const SweepFile& s, const std::vector<Variant>& variants, const std::vector<std::string>& problems) {
  Manifest m{s.path, s.title, s.base_case, s.ranking, {}, {}};
  for (const auto& v : s.varied) m.parameters.push_back(v.key);
  for (const auto& v : variants) m.variants.push_back({v.id, v.inputs, problems[v.index]});
  return m;
}

void write_manifest(const fs::path& out, const Manifest& m) {
  json variants = json::array();
  for (const auto& v : m.variants) variants.push_back({{"id", v.id}, {"inputs", v.inputs}, {"problem", v.problem}});
  const RankSpec& r = m.ranking;
  const json j = {{"sweep_of", "turnfield"}, {"sweep_file", m.sweep_file}, {"title", m.title},
                  {"base_case", m.base_case}, {"rank_by", r.rank_by},
                  {"rank_tolerance", r.tolerance ? json(*r.tolerance) : json(nullptr)}, {"tie_break", r.tie_break},
                  {"pareto", r.pareto}, {"parameters", m.parameters}, {"variants", variants}};
  post::write_atomically(out / "sweep.json", [&](std::ostream& o) { o << j.dump(1) << '\n'; });
}

Manifest read_manifest(const fs::path& dir) {
  const auto j = read_json(dir / "sweep.json");
  if (!j || !j->is_object() || j->value("sweep_of", "") != "turnfield")
    throw input::InputError(fmt::format("{}: not a sweep's folder (no readable sweep.json); expected the --out folder of "
                                 "`turnfield sweep`", dir.string()));
  try {
    Manifest m{j->at("sweep_file"), j->at("title"), j->at("base_case"), read_ranking(*j), j->at("parameters"), {}};
    for (const auto& v : j->at("variants"))
      m.variants.push_back({v.at("id"), v.at("inputs").get<std::vector<std::string>>(), v.at("problem")});
    return m;
  } catch (const json::exception& e) {
    throw input::InputError(fmt::format("{}: sweep.json is damaged ({}); rerun the sweep", (dir / "sweep.json").string(), e.what()));
  }
}

void write_variant_record(const fs::path& dir, const VariantRecord& r) {
  const json j = {{"id", r.id}, {"status", r.status}, {"message", r.message}, {"seconds", r.seconds}, {"shard", r.shard}};
  post::write_atomically(dir / "variant.json", [&](std::ostream& o) { o << j.dump(1) << '\n'; });
}

std::optional<VariantRecord> read_variant_record(const fs::path& dir) {
  const auto j = read_json(dir / "variant.json");
  if (!j || !j->is_object()) return std::nullopt;
  VariantRecord r{j->value("id", ""), j->value("status", ""), j->value("message", ""), j->value("seconds", 0.0),
                  j->value("shard", "")};
  if (r.id != dir.filename().string() || r.status.empty()) return std::nullopt;
  std::error_code ec;
  if (r.status == "ok" && !fs::exists(dir / "summary.json", ec)) return std::nullopt;
  return r;
}

}  // namespace tf::sweep
