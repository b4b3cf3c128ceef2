#include "app/winding_report.hpp"

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "mesh/winding.hpp"
#include "post/tables.hpp"

namespace tf::app {
namespace {

constexpr int kMaxOrder = 13;

std::string side_label(const mesh::CoilSide& s) { return (s.direction > 0 ? "+" : "-") + post::phase_name(s.phase); }

void print_text(const Case& c, const mesh::Winding& w, std::ostream& out) {
  const auto& spec = c.winding;
  out << fmt::format("{} slots, {} poles, {} phases, {} layer{}, coil pitch {} slots (pole pitch {:g})\n",
                     w.n_slots, spec.n_poles, spec.n_phases, spec.n_layers, spec.n_layers > 1 ? "s" : "",
                     spec.coil_pitch, static_cast<double>(w.n_slots) / spec.n_poles);
  out << fmt::format("q = {} slots per pole per phase; {:g} series turns per phase; {} parallel path{}\n\n",
                     w.slots_per_pole_per_phase(), w.series_turns(), spec.parallel_paths,
                     spec.parallel_paths > 1 ? "s" : "");
  out << "slot";
  for (int l = 1; l <= spec.n_layers; ++l) out << fmt::format("  layer {}", l);
  out << "   (+: positive phase current flows along +z, out of the page)\n";
  for (int s = 1; s <= w.n_slots; ++s) {
    out << fmt::format("{:>4}", s);
    for (const auto& side : w.sides)
      if (side.slot == s) out << fmt::format("  {:>7}", side_label(side));
    out << '\n';
  }
  out << "\norder  distribution   pitch     winding   (star of slots)\n";
  for (const auto& f : mesh::winding_factors(w, kMaxOrder))
    out << fmt::format("{:>5}  {:>12.5f}  {:>7.5f}  {:>8.5f}   {:>8.5f}\n", f.order, f.distribution, f.pitch, f.total,
                       f.from_layout);
}

void print_json(const mesh::Winding& w, std::ostream& out) {
  nlohmann::json sides = nlohmann::json::array(), factors = nlohmann::json::array();
  for (const auto& s : w.sides)
    sides.push_back({{"slot", s.slot}, {"layer", s.layer}, {"phase", post::phase_name(s.phase)},
                     {"direction", s.direction > 0 ? "+" : "-"}, {"turns", s.turns}});
  for (const auto& f : mesh::winding_factors(w, kMaxOrder))
    factors.push_back({{"electrical_order", f.order}, {"distribution", f.distribution}, {"pitch", f.pitch},
                       {"total", f.total}, {"from_layout", f.from_layout}});
  const nlohmann::json j = {{"slots", w.n_slots},
                            {"poles", w.spec.n_poles},
                            {"phases", w.spec.n_phases},
                            {"layers", w.spec.n_layers},
                            {"coil_pitch_slots", w.spec.coil_pitch},
                            {"slots_per_pole_per_phase", w.slots_per_pole_per_phase()},
                            {"series_turns_per_phase", w.series_turns()},
                            {"coil_sides", sides},
                            {"winding_factors", factors}};
  out << j.dump(2) << '\n';
}

}  // namespace

void print_winding(const Case& c, bool as_json, std::ostream& out) {
  const mesh::Winding w = mesh::lay_out(c.winding, c.geometry.stator.n_slots);
  if (as_json)
    print_json(w, out);
  else
    print_text(c, w, out);
}

}  // namespace tf::app
