#include "app/case_reader.hpp"

#include <algorithm>
#include <cerrno>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <sstream>

#include <fmt/format.h>

#include "app/case_validation.hpp"
#include "app/input_error.hpp"
#include "app/toml_fields.hpp"

namespace tf::app {
namespace {

// Generous sanity limits: they catch unit slips (mm typed as m), not unusual machines.
constexpr RealRange radius{.min = 0, .max = 5, .min_excluded = true, .unit = "m"};
constexpr RealRange slot_size{.min = 0, .max = 1, .min_excluded = true, .unit = "m"};
constexpr RealRange permeability{.min = 0, .max = 1e6, .min_excluded = true};

Document load(const std::string& path) {
  namespace fs = std::filesystem;
  if (path.empty()) throw InputError("no case file given");
  std::error_code ec;
  if (fs::is_directory(path, ec)) throw InputError(fmt::format("{}: is a folder, not a case file", path));
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(fmt::format("{}: cannot read the case file: {}", path, std::strerror(errno)));
  std::ostringstream text;
  text << in.rdbuf();
  try {
    return Document{path, toml::parse(text.str(), std::string_view(path))};
  } catch (const toml::parse_error& e) {
    const auto& at = e.source().begin;
    throw InputError(fmt::format("{}:{}: not valid TOML (column {}): {}", path, std::max<int>(1, at.line),
                                 at.column, e.description()));
  }
}

mesh::Slot read_slot(const Fields& stator) {
  const Fields f = stator.table("slot", {"shape", "width", "depth", "opening", "tip_height", "wedge_height"});
  mesh::Slot slot;
  slot.shape =
      f.choice("shape", {"open", "semi_closed"}) == 0 ? mesh::SlotShape::open : mesh::SlotShape::semi_closed;
  if (slot.shape == mesh::SlotShape::open) {
    // Only a semi-closed slot has tips; silently ignoring them would hide a wrong shape.
    for (const char* key : {"opening", "tip_height", "wedge_height"})
      f.reject(key, "not used by open slots", "no such key, or shape = \"semi_closed\"");
  }
  slot.width = f.real("width", slot_size);
  slot.depth = f.real("depth", slot_size);
  if (slot.shape == mesh::SlotShape::semi_closed) {
    slot.opening_width = f.real("opening", slot_size);
    slot.tip_height = f.real("tip_height", slot_size);
    slot.wedge_height = f.real_or("wedge_height", 0.0, {.min = 0, .max = 1, .unit = "m"});
  }
  return slot;
}

mesh::StatorGeometry read_stator(const Fields& root) {
  const Fields f = root.table("stator", {"bore_radius", "outer_radius", "slots", "slot"});
  mesh::StatorGeometry s;
  s.bore_radius = f.real("bore_radius", radius);
  // Only the plain range here; "larger than the bore" is a consistency check, after all keys.
  s.outer_radius = f.real("outer_radius", radius);
  s.n_slots = f.integer("slots", {.min = 3, .max = 2000});
  s.slot = read_slot(f);
  return s;
}

mesh::RotorGeometry read_rotor(const Fields& root) {
  const Fields f = root.table("rotor", {"kind", "outer_radius", "shaft_radius"});
  mesh::RotorGeometry r;
  r.kind = f.choice("kind", {"iron", "none"}) == 0 ? mesh::RotorKind::iron : mesh::RotorKind::none;
  if (r.kind == mesh::RotorKind::none)
    f.reject("shaft_radius", "not used without a rotor", "no such key, or kind = \"iron\"");
  r.outer_radius = f.real("outer_radius", radius);
  if (r.kind == mesh::RotorKind::iron)
    r.shaft_radius = f.real_or("shaft_radius", 0.0, {.min = 0, .max = 5, .unit = "m"});
  return r;
}

double read_permeability(const Fields& f) { return f.real("relative_permeability", permeability); }

solver::Materials read_materials(const Fields& root, mesh::RotorKind rotor) {
  const Fields f = root.table("materials", {"stator_iron", "rotor_iron", "shaft"});
  solver::Materials m;
  m.stator_iron_mu_r = read_permeability(f.table("stator_iron", {"relative_permeability"}));
  if (rotor == mesh::RotorKind::none) {
    // A material for a part that is not there is most likely a leftover of another case.
    for (const char* key : {"rotor_iron", "shaft"})
      f.reject(key, "not used, since [rotor] kind = \"none\"", "no such table, or [rotor] kind = \"iron\"");
    return m;
  }
  if (auto t = f.optional_table("rotor_iron", {"relative_permeability"}))
    m.rotor_iron_mu_r = read_permeability(*t);
  if (auto t = f.optional_table("shaft", {"relative_permeability"})) m.shaft_mu_r = read_permeability(*t);
  return m;
}

mesh::WindingSpec read_winding(const Fields& root) {
  const Fields f =
      root.table("winding", {"phases", "poles", "layers", "coil_pitch", "turns_per_coil", "parallel_paths"});
  mesh::WindingSpec w;
  w.n_phases = f.integer("phases", {.min = 1, .max = 12});
  w.n_poles = f.integer("poles", {.min = 2, .max = 2000});
  if (w.n_poles % 2 != 0)
    f.fail("poles", "an odd number", "an even number: poles come in north-south pairs (2p)");
  w.n_layers = f.integer("layers", {.min = 1, .max = 2});
  // The upper limit, the pole pitch, depends on the slots: checked with the winding layout.
  w.coil_pitch = f.integer("coil_pitch", {.min = 1});
  w.turns_per_coil = f.integer("turns_per_coil", {.min = 1});
  w.parallel_paths = f.integer_or("parallel_paths", 1, {.min = 1});
  return w;
}

solver::Supply read_supply(const Fields& root) {
  const Fields f = root.table("supply", {"peak_current", "frequency"});
  solver::Supply s;
  s.peak_current = f.real("peak_current", {.min = 0, .unit = "A"});
  s.frequency = f.real("frequency", {.min = 0, .min_excluded = true, .unit = "Hz"});
  return s;
}

Study read_study(const Fields& root) {
  Study s;
  const auto f = root.optional_table("study", {"steps", "field_files", "gap_points", "harmonics"});
  if (!f) return s;
  s.n_steps = f->integer_or("steps", s.n_steps, {.min = 3, .max = 100000});
  // "No more than the steps" is a consistency check, so its message can name the steps.
  s.n_field_files = f->integer_or("field_files", std::min(36, s.n_steps), {.min = 0, .max = 100000});
  // At least 720 points on the mid-gap circle, half a degree apart (../shared/DESIGN.md §3).
  s.n_gap_points = f->integer_or("gap_points", s.n_gap_points, {.min = 720, .max = 1000000});
  s.max_harmonic = f->integer_or("harmonics", s.max_harmonic, {.min = 1, .max = 500});
  return s;
}

mesh::MeshControls read_mesh(const Fields& root) {
  mesh::MeshControls m;
  if (const auto f = root.optional_table("mesh", {"fineness"}))
    m.fineness = f->real_or("fineness", m.fineness, {.min = 0.1, .max = 20});
  return m;
}

Case read_fields(const Document& doc) {
  const Fields root(
      doc, {"title", "machine", "stator", "rotor", "materials", "winding", "supply", "study", "mesh"});
  Case c;
  c.path = doc.path;
  c.title = root.text_or("title", std::filesystem::path(doc.path).stem().string());
  c.stack_length = root.table("machine", {"stack_length"})
                       .real("stack_length", {.min = 0, .max = 10, .min_excluded = true, .unit = "m"});
  c.geometry.stator = read_stator(root);
  c.geometry.rotor = read_rotor(root);
  c.materials = read_materials(root, c.geometry.rotor.kind);
  c.winding = read_winding(root);
  c.supply = read_supply(root);
  c.study = read_study(root);
  c.mesh = read_mesh(root);
  return c;
}

}  // namespace

Case read_case(const std::string& path) {
  const Document doc = load(path);
  Case c = read_fields(doc);
  // Consistency across keys only once every key has been read in range.
  if (const auto p = case_problem(c)) fail_at_key(doc, p->key, p->what, p->expected);
  return c;
}

}  // namespace tf::app
