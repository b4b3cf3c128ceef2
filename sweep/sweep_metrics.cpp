#include "sweep/sweep_metrics.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "input/toml_fields.hpp"

namespace tf::sweep {
namespace {

using json = nlohmann::json;

/// Where each column's number stands in summary.json (JSON pointers), in column order.
const std::vector<std::string>& metric_pointers() {
  static const std::vector<std::string> p = {
      "/field/fundamental_T",       "/field/amplitude_ripple",          "/field/peak_field_ripple",
      "/field/rotation_uniformity_deg", "/field/backward_forward_ratio", "/field/harmonic_distortion",
      "/winding/winding_factor",    "/torque/arkkio/mean_N_m",           "/torque/arkkio/ripple"};
  return p;
}

}  // namespace

std::vector<post::MetricColumn> sweep_metric_columns() {
  return {{"fundamental_T", "B_r fundamental", "T", false},
          {"amplitude_ripple", "amplitude ripple", "ratio", true},
          {"peak_field_ripple", "peak-field ripple", "ratio", true},
          {"rotation_uniformity_deg", "rotation uniformity (worst step deviation)", "deg", true},
          {"backward_forward_ratio", "backward/forward ratio", "ratio", true},
          {"harmonic_distortion", "harmonic distortion", "ratio", true},
          {"winding_factor", "winding factor", "", false},
          {"torque_mean_N_m", "torque mean (Arkkio)", "N·m", false},
          {"torque_ripple", "torque ripple (Arkkio)", "ratio", true}};
}

std::vector<double> read_metrics(const std::string& summary_json) {
  const json j = json::parse(summary_json);
  std::vector<double> values;
  for (const auto& pointer : metric_pointers()) {
    const json::json_pointer at(pointer);
    values.push_back(j.contains(at) && j.at(at).is_number() ? j.at(at).get<double>() : post::kNoValue);
  }
  return values;
}

std::optional<RankProblem> rank_problem(const std::string& spec) {
  const auto [name, direction] = split_metric_spec(spec);
  std::vector<std::string> keys;
  for (const auto& m : sweep_metric_columns()) keys.push_back(m.key);
  if (std::find(keys.begin(), keys.end(), name) == keys.end()) {
    const std::string guess = input::nearest(name, keys);
    return RankProblem{guess.empty() ? "no such metric" : fmt::format("no such metric (did you mean '{}'?)", guess),
                       fmt::format("one of: {}", fmt::join(keys, ", "))};
  }
  if (!direction.empty() && direction != "lowest" && direction != "highest")
    return RankProblem{fmt::format("unknown direction '{}'", direction), "name, name:lowest or name:highest"};
  return std::nullopt;
}

std::pair<std::string, std::string> split_metric_spec(const std::string& spec) {
  const auto colon = spec.find(':');
  return {spec.substr(0, colon), colon == std::string::npos ? "" : spec.substr(colon + 1)};
}

}  // namespace tf::sweep
