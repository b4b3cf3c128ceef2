#include "input/case_reader.hpp"

#include <algorithm>
#include <filesystem>
#include <memory>
#include <numbers>

#include <fmt/format.h>

#include "input/case_validation.hpp"
#include "input/input_error.hpp"
#include "input/read_drive.hpp"
#include "input/read_materials.hpp"
#include "input/read_rotor.hpp"
#include "input/toml_arrays.hpp"
#include "input/toml_fields.hpp"

namespace tf::input {
namespace {

// Generous sanity limits: they catch unit slips (mm typed as m), not unusual machines.
constexpr RealRange radius{.min = 0, .max = 5, .min_excluded = true, .unit = "m", .smallest = kSmallestPart};
constexpr RealRange slot_size{.min = 0, .max = 1, .min_excluded = true, .unit = "m", .smallest = kSmallestPart};

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
    slot.wedge_height = f.real_or("wedge_height", 0.0, {.min = 0, .max = 1, .unit = "m", .smallest = kSmallestPart});
  }
  return slot;
}

/// [stator.poles] of a salient-pole stator. The count goes to n_positions: to the winding, each pole
/// (with its two coil sides) is a slot.
void read_poles(const Fields& stator, mesh::StatorGeometry& s) {
  const Fields f = stator.table(
      "poles", {"count", "shoe_arc_deg", "shoe_height", "body_width", "body_height", "coil_width", "coil_height"});
  s.n_positions = f.integer("count", {.min = 2, .max = 200});
  if (s.n_positions % 2 != 0) f.fail("count", "an odd number", "an even number of poles");
  // Up to, not including, the pole pitch; that the shoes leave room between them is a consistency check.
  const RealRange arc{.min = 0, .max = 360.0 / s.n_positions, .min_excluded = true, .max_excluded = true,
                      .unit = "degrees", .smallest = kSmallestArc};
  s.poles.shoe_arc = f.real("shoe_arc_deg", arc) * std::numbers::pi / 180.0;
  s.poles.shoe_height = f.real("shoe_height", slot_size);
  s.poles.body_width = f.real("body_width", slot_size);
  s.poles.body_height = f.real("body_height", slot_size);
  s.poles.coil_width = f.real("coil_width", slot_size);
  s.poles.coil_height = f.real("coil_height", slot_size);
}

/// [stator.belts] of a slotless stator. The count goes to n_positions: to the winding, each conductor
/// sector is a slot.
void read_belts(const Fields& stator, mesh::StatorGeometry& s) {
  const Fields f = stator.table("belts", {"count", "span_deg", "outer_radius"});
  s.n_positions = f.integer("count", {.min = 2, .max = 2000});
  // Up to, not including, the belt pitch; that the sectors leave room between them is a consistency check.
  const RealRange arc{.min = 0, .max = 360.0 / s.n_positions, .min_excluded = true, .max_excluded = true,
                      .unit = "degrees", .smallest = kSmallestArc};
  s.belts.span = f.real("span_deg", arc) * std::numbers::pi / 180.0;
  // Only the plain range here; "between the bore and the outer radius" is a consistency check.
  s.belts.outer_radius = f.real("outer_radius", radius);
}

/// Keys of another stator kind are most likely left over from another case; ignoring them would hide it.
void reject_other_kinds(const Fields& f, mesh::StatorKind kind) {
  const bool salient = kind == mesh::StatorKind::salient;
  const std::string not_used = fmt::format(
      "not used by {} stators", salient ? "salient-pole" : kind == mesh::StatorKind::slotless ? "slotless" : "slotted");
  if (kind != mesh::StatorKind::slotted) {
    f.reject("slots", not_used,
             fmt::format("no such key (the {} counted by [stator.{}] count), or kind = \"slotted\"",
                         salient ? "poles are" : "conductor sectors are", salient ? "poles" : "belts"));
    f.reject("slot", not_used, "no such table, or kind = \"slotted\"");
  }
  if (!salient) f.reject("poles", not_used, "no such table, or kind = \"salient\"");
  if (kind != mesh::StatorKind::slotless) f.reject("belts", not_used, "no such table, or kind = \"slotless\"");
}

mesh::StatorGeometry read_stator(const Fields& root) {
  const Fields f = root.table(
      "stator", {"kind", "bore_radius", "outer_radius", "boundary_radius", "boundary", "slots", "slot", "poles", "belts"});
  mesh::StatorGeometry s;
  s.kind = static_cast<mesh::StatorKind>(f.choice_or("kind", {"slotted", "salient", "slotless"}, 0));
  s.bore_radius = f.real("bore_radius", radius);
  // Only the plain ranges here; "larger than the bore" and "beyond the stator" are consistency checks.
  s.outer_radius = f.real("outer_radius", radius);
  s.boundary_radius = f.real_or("boundary_radius", 0.0, {.min = 0, .max = 50, .min_excluded = true, .unit = "m"});
  // "open": the air beyond the boundary circle reaches to infinity (Kelvin transformation).
  s.open_boundary = f.choice_or("boundary", {"zero_potential", "open"}, 0) == 1;
  if (s.open_boundary && !f.has("boundary_radius"))
    f.fail("boundary", "an open boundary needs the circle where the exterior begins",
           "boundary_radius, beyond the stator's outer radius");
  reject_other_kinds(f, s.kind);
  if (s.kind == mesh::StatorKind::salient) {
    read_poles(f, s);
  } else if (s.kind == mesh::StatorKind::slotless) {
    read_belts(f, s);
  } else {
    s.n_positions = f.integer("slots", {.min = 3, .max = 2000});
    s.slot = read_slot(f);
  }
  return s;
}

/// Eddy currents: sinusoidal supplies of given currents, and the rotor speeds to solve at.
StudyPlan read_eddy_study(const Fields& f, const solver::Supply& supply, StudyPlan s) {
  if (supply.kind == solver::SupplyKind::stepped_dc || supply.kind == solver::SupplyKind::split_phase)
    f.fail("kind", "an eddy-current study needs sinusoidal currents given in [supply]",
           "[supply] kind = \"balanced\" or \"phasors\", or kind = \"phase_angles\" here");
  for (const char* key : {"steps", "gap_points", "harmonics"})
    f.reject(key, "used by phase-angle studies only", "no such key, or kind = \"phase_angles\"");
  s.rotor_speeds = read_reals(f, "rotor_speeds", {.min = -1e5, .max = 1e5, .unit = "rad/s"});
  s.n_field_files = f.integer_or("field_files", static_cast<int>(s.rotor_speeds.size()), {.min = 0, .max = 100000});
  s.n_steps = static_cast<int>(s.rotor_speeds.size());
  return s;
}

/// Rotor-motion studies: the steps, and what turns over them.
StudyPlan read_motion_study(const Fields& f, const solver::Supply& supply, StudyPlan s) {
  constexpr double deg = std::numbers::pi / 180.0;
  f.reject("rotor_speeds", "used by eddy-current studies only", "no such key, or kind = \"eddy_currents\"");
  const bool sinusoidal = supply.kind == solver::SupplyKind::balanced || supply.kind == solver::SupplyKind::phasors;
  if (s.kind != input::StudyKind::cogging && !sinusoidal)
    f.fail("kind", "a rotor turning under current needs sinusoidal currents given in [supply]",
           "[supply] kind = \"balanced\" or \"phasors\", or kind = \"cogging\" here");
  s.n_steps = f.integer_or("steps", s.n_steps, {.min = 2, .max = 100000});
  s.n_field_files = f.integer_or("field_files", std::min(36, s.n_steps), {.min = 0, .max = 100000});
  s.n_gap_points = f.integer_or("gap_points", s.n_gap_points, {.min = 720, .max = 1000000});
  s.max_harmonic = f.integer_or("harmonics", s.max_harmonic, {.min = 1, .max = 500});
  s.virtual_work = f.boolean_or("virtual_work", true);
  s.speed = f.real_or("speed_rpm", 0.0, {.min = -1e6, .max = 1e6, .unit = "rpm"}) * 2 * std::numbers::pi / 60.0;
  if (s.kind == input::StudyKind::synchronous) {
    for (const char* key : {"rotor_span_deg", "current_angle_deg"})
      f.reject(key, "not used: the rotor turns with the field over one electrical period",
               "no such key, or kind = \"rotor_sweep\"");
    s.load_angle = f.real_or("load_angle_deg", 0.0, {.min = -180, .max = 180, .unit = "electrical degrees"}) * deg;
    return s;
  }
  f.reject("load_angle_deg", "used by synchronous studies only", "no such key, or kind = \"synchronous\"");
  if (s.kind == input::StudyKind::cogging)
    f.reject("current_angle_deg", "not used: no current flows in a cogging study", "no such key");
  else
    s.current_angle = f.real_or("current_angle_deg", 0.0, {.min = -360, .max = 360, .unit = "electrical degrees"}) * deg;
  s.rotor_span = f.real("rotor_span_deg", {.min = 0, .max = 360, .min_excluded = true, .unit = "degrees"}) * deg;
  return s;
}

StudyPlan read_study(const Fields& root, const solver::Supply& supply) {
  StudyPlan s;
  // Stepped DC: one step per state.
  const bool states = supply.kind == solver::SupplyKind::stepped_dc;
  if (states) s.n_steps = static_cast<int>(supply.states.size());
  s.n_field_files = std::min(s.n_field_files, s.n_steps);
  const auto f = root.optional_table(
      "study", {"kind", "rotor_speeds", "steps", "field_files", "gap_points", "harmonics", "load_angle_deg",
                "rotor_span_deg", "current_angle_deg", "speed_rpm", "virtual_work"});
  if (!f) return s;
  s.kind = static_cast<input::StudyKind>(
      f->choice_or("kind", {"phase_angles", "eddy_currents", "synchronous", "cogging", "rotor_sweep"}, 0));
  if (s.kind == input::StudyKind::eddy_currents) return read_eddy_study(*f, supply, s);
  if (input::rotor_turns(s.kind)) return read_motion_study(*f, supply, s);
  for (const char* key : {"load_angle_deg", "rotor_span_deg", "current_angle_deg", "speed_rpm", "virtual_work"})
    f->reject(key, "used by studies whose rotor turns only",
              "no such key, or kind = \"synchronous\", \"cogging\" or \"rotor_sweep\"");
  f->reject("rotor_speeds", "used by eddy-current studies only", "no such key, or kind = \"eddy_currents\"");
  if (states) f->reject("steps", "not used with a stepped DC supply", "no such key: each state is one step");
  s.n_steps = f->integer_or("steps", s.n_steps, {.min = states ? 2 : 3, .max = 100000});
  // "No more than the steps" is a consistency check, so its message can name the steps.
  s.n_field_files = f->integer_or("field_files", std::min(36, s.n_steps), {.min = 0, .max = 100000});
  // At least 720 points on the mid-gap circle, half a degree apart (README.md, "Field-rotation metrics").
  s.n_gap_points = f->integer_or("gap_points", s.n_gap_points, {.min = 720, .max = 1000000});
  s.max_harmonic = f->integer_or("harmonics", s.max_harmonic, {.min = 1, .max = 500});
  return s;
}

mesh::MeshControls read_mesh(const Fields& root, bool& full_model) {
  mesh::MeshControls m;
  if (const auto f = root.optional_table("mesh", {"fineness", "elements_per_skin_depth", "model"})) {
    m.fineness = f->real_or("fineness", m.fineness, {.min = 0.1, .max = 20});
    full_model = f->choice_or("model", {"auto", "full"}, 0) == 1;
    // Turned into sizes by the eddy-current study, which knows the frequencies.
    m.elements_per_skin_depth = f->real_or("elements_per_skin_depth", 0.0, {.min = 0, .max = 50});
  }
  return m;
}

/// Runs the reader of one part of the case. When the document collects its errors, a problem that
/// stops the part is noted and the part keeps what it had; returns whether the part was read
/// without a problem. Parts that build on a part with problems are skipped: its stand-in values
/// would only make up problems of their own.
template <class Read>
bool read_part(const Document& doc, Read read) {
  if (!doc.errors) {
    read();
    return true;
  }
  const std::size_t before = doc.errors->size();
  try {
    read();
  } catch (const InputError& e) {
    doc.errors->note(e);
  } catch (const Unreported&) {
    return false;
  }
  return doc.errors->size() == before;
}

Case read_fields(const Document& doc) {
  const Fields root(
      doc, {"title", "machine", "stator", "rotor", "materials", "winding", "supply", "study", "mesh"});
  Case c;
  c.path = doc.path;
  read_part(doc, [&] {
    c.title = root.text_or("title", std::filesystem::path(doc.path).stem().string());
    c.stack_length = root.table("machine", {"stack_length"})
                         .real("stack_length", {.min = 0, .max = 10, .min_excluded = true, .unit = "m"});
  });
  const bool stator = read_part(doc, [&] { c.geometry.stator = read_stator(root); });
  const bool rotor = read_part(doc, [&] { c.geometry.rotor = read_rotor(root); });
  read_part(doc, [&] { c.end_rings = read_end_rings(root); });
  if (rotor) read_part(doc, [&] { c.materials = read_materials(root, c.geometry.rotor); });
  const bool winding = stator && read_part(doc, [&] { c.winding = read_winding(root, c.geometry.stator); });
  const bool supply = winding && read_part(doc, [&] { c.supply = read_supply(root, c.winding.n_phases); });
  if (supply) read_part(doc, [&] { c.study = read_study(root, c.supply); });
  read_part(doc, [&] { c.mesh = read_mesh(root, c.full_model); });
  return c;
}

}  // namespace

Case read_case(const std::string& path) { return read_case_text(path, read_input_file(path, "case file")); }

Case read_case_text(const std::string& path, const std::string& text) {
  Document doc = parse_document(path, text);  // a TOML syntax error stops here, as the parser does
  doc.errors = std::make_shared<ErrorLog>();
  Case c = read_fields(doc);
  // Consistency across keys only once every key has been read in range.
  if (doc.errors->empty())
    for (const Problem& p : case_problems(c)) {
      try {
        fail_at_key(doc, p.key, p.what, p.expected);
      } catch (const InputError& e) {
        doc.errors->note(e);
      }
    }
  if (!doc.errors->empty()) doc.errors->raise(path);
  return c;
}

}  // namespace tf::input

namespace tf::input {

void override_steps(Case& c, int steps) {
  if (c.study.kind == input::StudyKind::eddy_currents || c.supply.kind == solver::SupplyKind::stepped_dc)
    throw InputError(fmt::format("{}: --steps {}: this study has no steps to change ({})", c.path, steps,
                                 c.study.kind == input::StudyKind::eddy_currents ? "one solution per rotor speed"
                                                                               : "one step per DC state"));
  c.study.n_steps = steps;
  c.study.n_field_files = std::min(c.study.n_field_files, steps);
  if (const auto p = case_problem(c))
    throw InputError(fmt::format("{}: --steps {}: [{}] {}; expected {}", c.path, steps, p->key, p->what, p->expected));
}

}  // namespace tf::input
