// The report's "Inputs" appendix: the case as read, one row per key, the unit from the key's
// suffix; long arrays (B-H tables) as comma-separated values that wrap in their cell; only the
// inputs that apply to the case (no magnet remanence for an iron rotor, no conductivities in a
// magnetostatic study). summary.json keeps every key.

#include <algorithm>
#include <utility>

#include <nlohmann/json.hpp>

#include "post/case_report.hpp"
#include "post/svg_plot.hpp"

namespace tf::post {
namespace {

using nlohmann::json;

/// Unit of a key by its suffix, as case_json and our tables spell them.
std::pair<std::string, std::string> split_unit(const std::string& key) {
  static const std::pair<const char*, const char*> suffixes[] = {
      {"_S_per_m", "S/m"}, {"_kg_per_m3", "kg/m³"}, {"_A_per_m", "A/m"}, {"_rad_per_s", "rad/s"}, {"_rpm", "rpm"},
      {"_deg", "°"},       {"_Hz", "Hz"},           {"_m2", "m²"},       {"_ohm", "Ω"},       {"_slots", "slots"},
      {"_m", "m"},         {"_T", "T"},             {"_H", "H"},         {"_A", "A"},         {"_V", "V"}};
  for (const auto& [suffix, unit] : suffixes) {
    const std::string s = suffix;
    if (key.size() > s.size() && key.compare(key.size() - s.size(), s.size(), s) == 0)
      return {key.substr(0, key.size() - s.size()), unit};
  }
  return {key, ""};
}

/// Any value as text; arrays as "a, b, c" (nested ones bracketed), so that a browser can wrap them.
std::string value_text(const json& j) {
  if (j.is_number()) return svg::format_number(j.get<double>(), 6);
  if (j.is_string()) return j.get<std::string>();
  if (j.is_array()) {
    std::string text;
    for (const auto& e : j) text += (text.empty() ? "" : ", ") + (e.is_array() ? "[" + value_text(e) + "]" : value_text(e));
    return text;
  }
  return j.dump();
}

void flatten(const json& j, const std::string& prefix, std::vector<KeyValue>& rows) {
  if (j.is_object()) {
    for (const auto& [key, value] : j.items()) flatten(value, prefix.empty() ? key : prefix + "." + key, rows);
    return;
  }
  if (j.is_null()) return;  // not given (an optional table such as a B-H curve)
  const auto [key, unit] = split_unit(prefix);
  rows.push_back({key, value_text(j), unit});
}

bool starts_with(const std::string& s, const std::string& prefix) { return s.rfind(prefix, 0) == 0; }

/// Keys of the flattened case that do not apply to it.
bool applies(const json& c, const std::string& key) {
  const std::string rotor = c.value(json::json_pointer("/rotor/kind"), std::string{});
  const std::string kind = c.value(json::json_pointer("/study/kind"), std::string{});
  const bool eddy = kind == "eddy_currents";
  const bool turns = kind == "synchronous" || kind == "cogging" || kind == "rotor_sweep";
  const double sleeve = c.value(json::json_pointer("/rotor/sleeve_thickness_m"), 0.0);
  if (key.find("_conductivity_S_per_m") != std::string::npos && !eddy) return false;  // magnetostatics ignores sigma
  if (starts_with(key, "materials.magnet_")) return rotor == "magnets";
  if (starts_with(key, "materials.bar_")) return rotor == "slotted";
  if (starts_with(key, "materials.sleeve_") || key == "rotor.sleeve_thickness_m") return sleeve > 0.0;
  if (key == "study.rotor_speeds_rad_per_s" || key == "mesh.elements_per_skin_depth") return eddy;
  if (key == "study.steps" || key == "study.current_angle_deg") return !eddy;
  if (key == "study.load_angle_deg") return kind == "synchronous";
  if (key == "study.virtual_work" || key == "study.speed_rpm") return turns;
  if (key == "study.rotor_span_deg") return kind == "rotor_sweep" || kind == "cogging";
  return true;
}

/// The case without the keys that do not apply (objects emptied of them dropped too).
json applicable(const json& c, const json& j, const std::string& prefix) {
  if (!j.is_object()) return j;
  json out = json::object();
  for (const auto& [key, value] : j.items()) {
    const std::string path = prefix.empty() ? key : prefix + "." + key;
    if (value.is_object()) {
      json inner = applicable(c, value, path);
      if (!inner.empty()) out[key] = std::move(inner);
    } else if (applies(c, path)) {
      out[key] = value;
    }
  }
  return out;
}

}  // namespace

Section inputs_section(const std::string& inputs_json) {
  Section s{"Inputs (the case as read)", {},
            "Units as read from each key's name; SI otherwise. Only the inputs that apply to this case are listed "
            "(summary.json echoes every key)."};
  const json j = json::parse(inputs_json, nullptr, false);
  if (j.is_discarded()) s.rows.push_back({"inputs", "not available", ""});
  else flatten(applicable(j, j, ""), "", s.rows);
  return s;
}

}  // namespace tf::post
