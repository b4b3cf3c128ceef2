// Reading case files: the cases in cases/ come back with their numbers, and every file in
// tests/data/bad/ is refused with a message naming the file, the line, the key and what was expected.

#include <doctest/doctest.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <numbers>
#include <set>
#include <string>
#include <vector>

#include "input/case_reader.hpp"
#include "input/input_error.hpp"

namespace {

namespace fs = std::filesystem;
using tf::input::InputError;
using tf::input::read_case;
using tf::input::read_case_text;

const std::string source_dir = TF_SOURCE_DIR;
const std::string bad_dir = source_dir + "/tests/data/bad/";

/// The message of the InputError that reading `path` throws; "" if the file reads without error.
std::string error_of(const std::string& path) {
  try {
    read_case(path);
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

/// The same for case text held in memory, named `path`.
std::string error_of_text(const std::string& path, const std::string& text) {
  try {
    read_case_text(path, text);
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

std::string read_text(const std::string& path) {
  std::ifstream in(path);
  return {std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>()};
}

struct BadFile {
  std::string name;
  int line;                        ///< where the message must point
  std::vector<std::string> parts;  ///< key, value, problem and expectation the message must contain
};

// Line numbers counted by hand in each file.
const std::vector<BadFile> bad_files = {
    {"bad_bh_not_monotone.toml",
     47,
     {"[materials.stator_iron.bh_curve] b", "point 5: B = 0.44 T is not above B = 0.45135 T",
      "expected a monotone B-H curve"}},
    {"bad_bh_without_source.toml", 42, {"[materials.stator_iron.bh_curve] source: missing", "where the curve comes from"}},
    {"bad_permeability_and_curve.toml",
     43,
     {"[materials.stator_iron] relative_permeability = 3000.0", "given beside a B-H curve", "expected one of the two"}},
    {"bad_rotor_span_uneven.toml",
     79,
     {"[study] rotor_span_deg = 7.0", "10 steps over 7 degrees do not divide a whole turn evenly",
      "360 * steps / span is a whole number"}},
    {"bad_magnets_too_thick.toml",
     34,
     {"[rotor.magnets] thickness = 0.034", "the magnets reach the shaft", "expected a thickness below 33.40 mm"}},
    {"bad_magnet_poles_mismatch.toml",
     33,
     {"[rotor.magnets] poles = 6", "6 magnet poles under a 4-pole winding", "expected 4 poles, as the winding"}},
    {"bad_load_angle_in_cogging.toml",
     79,
     {"[study] load_angle_deg = 30.0", "used by synchronous studies only", "kind = \"synchronous\""}},
    {"bad_bh_in_eddy_study.toml",
     36,
     {"[materials.stator_iron] bh_curve", "a B-H curve in an eddy-current study",
      "expected relative_permeability for eddy-current studies"}},
    {"bad_cage_dead_bars.toml",
     55,
     {"[materials.rotor_bars] conductivity = 0.0", "bars that do not conduct in an eddy-current study of a cage",
      "expected a conductivity above 0 S/m"}},
    {"bad_bars_touch.toml",
     34,
     {"[rotor.bars] width = 0.008", "the bars touch at their bottom, where the bar pitch is 7.71 mm",
      "expected a width below 7.71 mm"}},
    {"bad_unknown_key.toml", 17, {"[stator.slot] unknown key 'slot_widht'", "did you mean 'width'?"}},
    {"bad_several_problems.toml", 10, {"[machine] stack_length = -0.06", "6 problems in"}},
    {"bad_unknown_key_no_guess.toml", 23, {"[rotor] unknown key 'colour'", "one of: kind, outer_radius, shaft_radius"}},
    {"bad_unknown_table.toml", 41, {"unknown table [suply]", "did you mean [supply]?"}},
    {"bad_missing_key.toml", 14, {"[stator.slot] missing key 'depth'", "expected a number in m, > 0"}},
    {"bad_missing_table.toml", 1, {"missing table [winding]", "the keys phases, poles, layers, coil_pitch"}},
    {"bad_string_for_number.toml", 10, {"[stator] bore_radius = \"60 mm\"", "found a string", "expected a number in m"}},
    {"bad_float_for_integer.toml",
     12,
     {"[stator] slots = 36.0", "found a floating-point number", "expected an integer from 3 to 2000"}},
    {"bad_negative_bore.toml", 10, {"[stator] bore_radius = -0.06", "out of range", "expected a number in m, > 0 and <= 5"}},
    {"bad_nan_frequency.toml", 43, {"[supply] frequency = nan", "not a finite number", "expected a number in Hz, > 0"}},
    {"bad_outer_below_bore.toml",
     11,
     {"[stator] outer_radius = 0.05", "not larger than the bore radius (60.00 mm)", "outer radius above 60.00 mm"}},
    {"bad_slot_too_wide.toml",
     16,
     {"[stator.slot] width = 0.012", "wider than the slot pitch at the bore (10.46 mm)", "expected a width below 10.46 mm"}},
    {"bad_thin_teeth.toml",
     16,
     {"[stator.slot] width = 0.01", "teeth between neighbouring slots are 0.46 mm wide at the bore",
      "thinner than the minimum 0.50 mm", "expected a width at most 9.96 mm"}},
    {"bad_opening_too_wide.toml",
     18,
     {"[stator.slot] opening = 0.0075", "not narrower than the slot width (7.00 mm)", "expected an opening below 7.00 mm"}},
    {"bad_thin_tooth_tips.toml",
     19,
     {"[stator.slot] opening = 0.0126", "tooth tips between neighbouring openings are 0.46 mm wide at the bore",
      "expected an opening at most 12.56 mm"}},
    {"bad_slot_too_deep.toml",
     17,
     {"[stator.slot] depth = 0.0395", "leaving a yoke of 0.47 mm", "minimum 1.00 mm", "depth at most 38.97 mm"}},
    {"bad_tips_fill_slot.toml",
     20,
     {"[stator.slot] tip_height = 0.004", "leave 2.00 mm of the 16.00 mm slot depth for the coil", "less than 20 %",
      "expected tip_height + wedge_height at most 12.80 mm"}},
    {"bad_rotor_touches.toml",
     21,
     {"[rotor] outer_radius = 0.06", "the rotor touches or overlaps the stator bore (R_b = 60.00 mm)",
      "expected an outer radius at most 59.95 mm"}},
    {"bad_gap_too_small.toml", 21, {"[rotor] outer_radius = 0.05998", "air gap is 0.020 mm, below the minimum 0.05 mm"}},
    {"bad_shaft_too_large.toml",
     22,
     {"[rotor] shaft_radius = 0.0595", "shaft is as large as the rotor", "expected a shaft radius below 59.50 mm"}},
    {"bad_shaft_without_rotor.toml", 22, {"[rotor] shaft_radius = 0.02", "not used without a rotor"}},
    {"bad_rotor_iron_without_rotor.toml", 26, {"[materials.rotor_iron]", "not used, since [rotor] kind = \"none\""}},
    {"bad_opening_in_open_slot.toml",
     18,
     {"[stator.slot] opening = 0.002", "not used by open slots", "shape = \"semi_closed\""}},
    {"bad_shape_value.toml",
     15,
     {"[stator.slot] shape = \"semi-closed\"", "did you mean \"semi_closed\"?", "expected \"open\" or \"semi_closed\""}},
    {"bad_odd_poles.toml", 35, {"[winding] poles = 5", "expected an even number"}},
    {"bad_zero_current.toml", 49, {"[supply] peak_current = 0.0", "no current", "expected a current above 0 A"}},
    {"bad_bh_off_origin.toml",
     36,
     {"[materials.stator_iron.bh_curve] h", "the curve starts at (H, B) = (25 A/m, 0.15629 T)",
      "expected a first point (0, 0)"}},
    {"bad_eddy_nothing_conducts.toml",
     63,
     {"[study] kind = \"eddy_currents\"", "nothing conducts", "expected a conductivity above 0 S/m"}},
    {"bad_magnet_nanometre.toml",
     34,
     {"[rotor.magnets] thickness = 5e-09", "below the smallest part turnfield meshes (0.05 mm)", "expected 0.05 mm or more"}},
    {"bad_magnet_gap_sliver.toml",
     35,
     {"[rotor.magnets] arc_deg = 89.999999", "leaves 1e-06 degrees between neighbouring magnets",
      "expected the pole pitch 90 (magnets touching) or at most 89.9 degrees"}},
    {"bad_opening_nanometre.toml", 22, {"[stator.slot] opening = 1e-09", "below the smallest part turnfield meshes"}},
    {"bad_shaft_nanometre.toml",
     29,
     {"[rotor] shaft_radius = 1e-08", "below the smallest part", "expected 0 (none), or 0.05 mm or more"}},
    {"bad_bar_bridge_nanometre.toml", 37, {"[rotor.bars] bridge = 1e-09", "below the smallest part turnfield meshes"}},
    {"bad_bars_too_narrow.toml",
     35,
     {"[rotor.bars] width = 6e-05", "the whole mesh must resolve this 0.06 mm part",
      "expected a part at least 0.229 mm wide at this fineness"}},
    {"bad_turns_overflow.toml",
     45,
     {"[winding] turns_per_coil = 2147483647", "out of range", "expected an integer from 1 to 100000"}},
    {"bad_fractional_q.toml",
     34,
     {"[winding] phases = 5", "36/(4·5) = 9/5 slots per pole and phase", "no balanced layout",
      "t = gcd(Q, p) = 2 (here 36/(5·2))"}},
    {"bad_pitch_too_long.toml",
     37,
     {"[winding] coil_pitch = 10", "longer than the pole pitch of 9 slots", "expected a coil pitch from 1 to 9"}},
    {"bad_single_layer_short_pitch.toml",
     37,
     {"[winding] coil_pitch = 8", "single-layer windings are laid out full pitch", "expected coil_pitch = 9"}},
    {"bad_parallel_paths.toml",
     39,
     {"[winding] parallel_paths = 3", "cannot share the 4 coil groups", "expected a divisor of 4: 1, 2, 4"}},
    {"bad_field_files.toml", 47, {"[study] field_files = 80", "more field files than steps (72)", "expected at most 72"}},
    {"bad_stator_kind_value.toml",
     10,
     {"[stator] kind = \"salliant\"", "did you mean \"salient\"?",
      "expected \"slotted\", \"salient\" or \"slotless\""}},
    {"bad_salient_with_slots.toml",
     13,
     {"[stator] slots = 4", "not used by salient-pole stators", "counted by [stator.poles] count"}},
    {"bad_salient_with_slot_table.toml", 14, {"[stator.slot]: not used by salient-pole stators", "kind = \"slotted\""}},
    {"bad_poles_on_slotted.toml", 14, {"[stator.poles]: not used by slotted stators", "kind = \"salient\""}},
    {"bad_salient_missing_poles.toml", 9, {"missing table [stator.poles]", "count, shoe_arc_deg, shoe_height"}},
    {"bad_salient_odd_count.toml", 15, {"[stator.poles] count = 5", "an odd number", "expected an even number"}},
    {"bad_salient_shoe_arc_range.toml",
     16,
     {"[stator.poles] shoe_arc_deg = 90.0", "out of range", "expected a number in degrees, > 0 and < 90"}},
    {"bad_salient_shoes_touch.toml",
     16,
     {"[stator.poles] shoe_arc_deg = 89.5", "shoes of neighbouring poles are 0.26 mm apart at the bore",
      "minimum 0.50 mm", "expected a shoe arc at most 89.05 degrees"}},
    {"bad_salient_body_too_wide.toml",
     18,
     {"[stator.poles] body_width = 0.0325", "shoe reaches only 0.25 mm past the body on each side",
      "33.00 mm across at r = 33.00 mm", "expected a body width at most 32.00 mm"}},
    {"bad_salient_thin_yoke.toml",
     19,
     {"[stator.poles] body_height = 0.0265", "reach r = 59.50 mm", "yoke of 0.50 mm", "minimum 1.00 mm",
      "expected shoe_height + body_height at most 29.00 mm"}},
    {"bad_salient_coil_too_long.toml",
     21,
     {"[stator.poles] coil_height = 0.02", "longer than the pole body (body_height = 18.00 mm)",
      "expected a coil height at most 18.00 mm"}},
    {"bad_salient_coils_touch.toml",
     20,
     {"[stator.poles] coil_width = 0.025", "coil sides of neighbouring poles are 0.35 mm apart",
      "minimum 0.50 mm", "expected a coil width at most 24.90 mm"}},
    {"bad_salient_coil_reaches_yoke.toml",
     21,
     {"[stator.poles] coil_height = 0.017", "reach r = 51.48 mm, into the yoke (from r = 51.00 mm)",
      "expected a coil height at most 15.97 mm"}},
    {"bad_salient_rotor_touches.toml",
     25,
     {"[rotor] outer_radius = 0.03", "the rotor touches or overlaps the pole faces (R_b = 30.00 mm)"}},
    {"bad_syntax.toml", 15, {"not valid TOML"}},
    {"bad_open_boundary_no_radius.toml", 12, {"[stator] boundary = \"open\"", "needs the circle where the exterior begins", "boundary_radius"}},
    {"bad_table_slot_twice.toml", 46, {"[winding] sides[5]", "slot 5 layer 1 is used twice", "each slot-layer in at most one row"}},
    {"bad_table_unbalanced.toml", 40, {"[winding] sides", "as many go (+) as return (-)", "expected a balanced slot table"}},
    {"bad_table_phase_letter.toml", 44, {"[winding] sides[3][2] = \"C\"", "not one of the choices", "\"A\", \"B\""}},
    {"bad_table_with_pitch.toml", 39, {"[winding] coil_pitch = 6", "not used with a slot table"}},
    {"bad_supply_kind.toml", 43, {"[supply] kind = \"phasor\"", "did you mean \"phasors\"?", "\"split_phase\""}},
    {"bad_supply_foreign_key.toml", 45, {"[supply] peak_current = 6.0", "not used by this kind of supply", "kind = \"phasors\""}},
    {"bad_supply_phasor_count.toml", 45, {"[supply] peak_currents", "3 values", "an array of 2 numbers"}},
    {"bad_split_phase_three_phases.toml", 43, {"[supply] kind = \"split_phase\"", "[winding] phases = 3", "expected phases = 2"}},
    {"bad_states_row.toml", 45, {"[supply] states[1]", "a row of 3 values", "rows of 2 numbers"}},
    {"bad_states_with_steps.toml", 51, {"[study] steps = 8", "not used with a stepped DC supply"}},
    {"bad_slotless_with_slots.toml",
     11,
     {"[stator] slots = 6", "not used by slotless stators", "counted by [stator.belts] count"}},
    {"bad_slotless_missing_belts.toml", 9, {"missing table [stator.belts]", "count, span_deg, outer_radius"}},
    {"bad_belts_on_slotted.toml", 19, {"[stator.belts]: not used by slotted stators", "kind = \"slotless\""}},
    {"bad_slotless_span_range.toml",
     17,
     {"[stator.belts] span_deg = 60.0", "out of range", "expected a number in degrees, > 0 and < 60"}},
    {"bad_slotless_sectors_touch.toml",
     17,
     {"[stator.belts] span_deg = 59.5", "neighbouring conductor sectors are 0.28 mm apart at the bore",
      "minimum 0.50 mm", "expected a span at most 59.10 degrees"}},
    {"bad_slotless_no_iron_ring.toml",
     18,
     {"[stator.belts] outer_radius = 0.057", "leave no iron ring inside the stator's outer radius 57.00 mm",
      "expected an outer radius above 32.00 mm and below 57.00 mm"}},
    {"bad_slotless_belts_in_bore.toml",
     18,
     {"[stator.belts] outer_radius = 0.03", "end inside the bore (bore radius 32.00 mm)"}},
    {"bad_boundary_inside.toml",
     13,
     {"[stator] boundary_radius = 0.0575", "less than 1.00 mm beyond the stator's outer radius (57.00 mm)",
      "expected a boundary radius of at least 58.00 mm"}},
    {"bad_sleeve_too_thick.toml",
     24,
     {"[rotor] sleeve_thickness = 0.026", "the sleeve reaches the shaft", "expected a sleeve thickness below 25.00 mm"}},
    {"bad_sleeve_without_rotor.toml", 23, {"[rotor] sleeve_thickness = 0.01", "not used without a rotor"}},
    {"bad_sleeve_material_without_sleeve.toml",
     32,
     {"[materials.rotor_sleeve]", "not used, since the rotor has no sleeve", "[rotor] sleeve_thickness"}},
    {"bad_negative_conductivity.toml",
     31,
     {"[materials.rotor_iron] conductivity", "out of range", "expected a number in S/m, >= 0"}},
};

}  // namespace

TEST_CASE("the three-phase pump case reads back with every number in SI units") {
  const auto c = read_case(source_dir + "/cases/pump24_three_phase.toml");
  CHECK(c.title == "Pump motor, 24 slots, 4 poles, three-phase");
  CHECK(c.stack_length == 0.06);
  const auto& s = c.geometry.stator;
  CHECK(s.bore_radius == 0.050);
  CHECK(s.outer_radius == 0.085);
  CHECK(s.n_positions == 24);
  CHECK(s.slot.shape == tf::mesh::SlotShape::semi_closed);
  CHECK(s.slot.width == 0.007);
  CHECK(s.slot.depth == 0.016);
  CHECK(s.slot.opening_width == 0.0025);
  CHECK(s.slot.tip_height == 0.0008);
  CHECK(s.slot.wedge_height == 0.0007);
  CHECK(c.geometry.rotor.kind == tf::mesh::RotorKind::iron);
  CHECK(c.geometry.rotor.outer_radius == 0.0496);
  CHECK(c.geometry.rotor.shaft_radius == 0.016);
  CHECK(c.geometry.gap_length() == doctest::Approx(0.0004).scale(0));
  CHECK(c.materials.stator_iron_mu_r == 3000.0);
  CHECK(c.materials.rotor_iron_mu_r == 3000.0);
  CHECK(c.materials.shaft_mu_r == 3000.0);
  CHECK(c.winding.n_phases == 3);
  CHECK(c.winding.n_poles == 4);
  CHECK(c.winding.n_layers == 2);
  CHECK(c.winding.coil_pitch == 5);
  CHECK(c.winding.turns_per_coil == 12);
  CHECK(c.winding.parallel_paths == 1);
  CHECK(c.supply.peak_current == 6.0);
  CHECK(c.supply.frequency == 50.0);
  CHECK(c.study.n_steps == 36);
  CHECK(c.mesh.fineness == 1.0);
}

TEST_CASE("the two-phase pump case winds the same stator with q = 3 and takes the default study") {
  const auto c = read_case(source_dir + "/cases/pump24_two_phase.toml");
  CHECK(c.geometry.stator.n_positions == 24);
  CHECK(c.geometry.stator.slot.width == 0.007);
  CHECK(c.winding.n_phases == 2);
  CHECK(c.winding.coil_pitch == 6);
  CHECK(c.winding.parallel_paths == 1);  // absent from the file
  CHECK(c.study.n_steps == 36);
  CHECK(c.study.n_field_files == 36);
  CHECK(c.study.n_gap_points == 720);
  CHECK(c.study.max_harmonic == 25);
  CHECK(c.mesh.fineness == 1.0);
}

TEST_CASE("the 36-slot open-slot case reads its own study and mesh settings") {
  const auto c = read_case(source_dir + "/cases/stator36_three_phase.toml");
  const auto& slot = c.geometry.stator.slot;
  CHECK(slot.shape == tf::mesh::SlotShape::open);
  CHECK(slot.width == 0.005);
  CHECK(slot.depth == 0.018);
  CHECK(slot.opening_width == 0.0);
  CHECK(slot.tip_height == 0.0);
  CHECK(c.geometry.stator.bore_radius == 0.060);
  CHECK(c.geometry.stator.outer_radius == 0.100);
  CHECK(c.geometry.rotor.outer_radius == 0.0595);
  CHECK(c.geometry.rotor.shaft_radius == 0.020);
  CHECK(c.materials.shaft_mu_r == 100.0);
  CHECK(c.winding.coil_pitch == 8);
  CHECK(c.winding.turns_per_coil == 10);
  CHECK(c.winding.parallel_paths == 2);
  CHECK(c.study.n_steps == 72);
  CHECK(c.study.n_field_files == 12);
  CHECK(c.study.n_gap_points == 1440);
  CHECK(c.study.max_harmonic == 31);
  CHECK(c.mesh.fineness == 1.5);
}

TEST_CASE("the salient-pole case reads its poles in SI units, the pole count standing for the slots") {
  const auto c = read_case(source_dir + "/cases/salient4_two_phase.toml");
  const auto& s = c.geometry.stator;
  CHECK(s.kind == tf::mesh::StatorKind::salient);
  CHECK(s.bore_radius == 0.030);
  CHECK(s.outer_radius == 0.060);
  CHECK(s.n_positions == 4);
  CHECK(s.poles.shoe_arc == doctest::Approx(std::numbers::pi / 3).epsilon(1e-15).scale(0));  // 60°
  CHECK(s.poles.shoe_height == 0.003);
  CHECK(s.poles.body_width == 0.014);
  CHECK(s.poles.body_height == 0.018);
  CHECK(s.poles.coil_width == 0.008);
  CHECK(s.poles.coil_height == 0.014);
  CHECK(s.slot.width == 0.0);  // no slot is read for a salient-pole stator
  CHECK(c.winding.n_poles == 2);
  CHECK(c.winding.coil_pitch == 1);
  // A stator without `kind` is slotted.
  CHECK(read_case(source_dir + "/cases/stator36_three_phase.toml").geometry.stator.kind ==
        tf::mesh::StatorKind::slotted);
}

TEST_CASE("the TEAM 30a case reads its slotless stator, boundary, sleeve and conductivities in SI units") {
  // Data: K. R. Davey, TEAM Problem 30a (docs/references.md §1).
  const auto c = read_case(source_dir + "/cases/team30a_three_phase.toml");
  const auto& s = c.geometry.stator;
  CHECK(s.kind == tf::mesh::StatorKind::slotless);
  CHECK(s.bore_radius == 0.032);
  CHECK(s.outer_radius == 0.057);
  CHECK(s.boundary_radius == 0.1);
  CHECK(s.open_boundary);
  CHECK(s.n_positions == 6);  // the conductor sectors are the winding's slots
  CHECK(s.belts.span == doctest::Approx(std::numbers::pi / 4).epsilon(1e-15).scale(0));  // 45°
  CHECK(s.belts.outer_radius == 0.052);
  CHECK(s.slot.width == 0.0);  // no slot is read for a slotless stator
  const auto& r = c.geometry.rotor;
  CHECK(r.outer_radius == 0.030);
  CHECK(r.sleeve_thickness == 0.010);
  CHECK(r.shaft_radius == 0.0);
  const auto& m = c.materials;
  CHECK(m.stator_iron_mu_r == 30.0);
  CHECK(m.stator_iron_sigma == 0.0);
  CHECK(m.rotor_iron_mu_r == 30.0);
  CHECK(m.rotor_iron_sigma == 1.6e6);
  CHECK(m.sleeve_mu_r == 1.0);
  CHECK(m.sleeve_sigma == 3.72e7);
  CHECK(m.shaft_sigma == 0.0);  // absent from the file
  CHECK(c.winding.coil_pitch == 3);
  CHECK(c.winding.n_layers == 1);
  // 3.1e6 A/m² rms, peak, over a 45° sector of the 32-52 mm annulus, one turn.
  const double area = std::numbers::pi * (0.052 * 0.052 - 0.032 * 0.032) / 8;
  CHECK(c.supply.peak_current == doctest::Approx(3.1e6 * std::sqrt(2.0) * area).epsilon(1e-6).scale(0));
  CHECK(c.supply.frequency == 60.0);
  // Where a slotted case leaves them out: no boundary beyond the stator, no sleeve, no conductivity.
  const auto plain = read_case(source_dir + "/cases/stator36_three_phase.toml");
  CHECK(plain.geometry.stator.boundary_radius == 0.0);
  CHECK(plain.geometry.rotor.sleeve_thickness == 0.0);
  CHECK(plain.materials.rotor_iron_sigma == 0.0);
  CHECK(plain.materials.stator_iron_sigma == 0.0);
}

TEST_CASE("every bad case file is refused at the right line, naming key, problem and expectation") {
  for (const BadFile& bad : bad_files) {
    CAPTURE(bad.name);
    const std::string path = bad_dir + bad.name;
    const std::string message = error_of(path);
    CAPTURE(message);
    // The message opens with the path exactly as given and the line of the first problem; a file
    // that is wrong in more places than the one it shows lists those too, a line each.
    const std::string at = path + ":" + std::to_string(bad.line) + ": ";
    CHECK((message.rfind(at, 0) == 0 || contains(message, "\n" + at)));
    for (const std::string& part : bad.parts) CHECK(contains(message, part));
  }
}

TEST_CASE("every problem of a case file in one pass, in line order, and nothing that follows from them") {
  const std::string path = bad_dir + "bad_several_problems.toml";
  const std::string message = error_of(path);
  CAPTURE(message);
  std::vector<std::string> lines;
  for (std::size_t start = 0; start < message.size();) {
    const std::size_t end = std::min(message.find('\n', start), message.size());
    lines.push_back(message.substr(start, end - start));
    start = end + 1;
  }
  REQUIRE(lines.size() == 7);
  const std::vector<std::pair<int, std::string>> expected{
      {10, "[machine] stack_length = -0.06: out of range"},
      {19, "[stator.slot] unknown key 'slot_widht'; did you mean 'width'?"},
      {20, "[stator.slot] depth = \"16 mm\": found a string"},
      {26, "[rotor] kind = \"irn\": not one of the choices (did you mean \"iron\"?)"},
      {51, "unknown table [studdy]; did you mean [study]?"},
      {58, "[mesh] fineness = 99.0: out of range"}};
  for (std::size_t i = 0; i < expected.size(); ++i) {
    CAPTURE(i);
    CHECK(lines[i].rfind(path + ":" + std::to_string(expected[i].first) + ": " + expected[i].second, 0) == 0);
  }
  CHECK(lines.back() == "6 problems in " + path);
  CHECK_FALSE(contains(message, "missing"));
}

TEST_CASE("a misspelt key hides only the key it stands for: another missing key is still reported") {
  std::string text = read_text(source_dir + "/cases/pump24_three_phase.toml");
  const auto replace = [&](const std::string& from, const std::string& to) {
    const std::size_t at = text.find(from);
    REQUIRE(at != std::string::npos);
    text.replace(at, from.size(), to);
  };
  replace("\nwidth = ", "\nwidht = ");                           // [stator.slot] width misspelt
  replace("\ndepth = 0.016", "\n# depth removed: 0.016");         // and depth missing
  const std::string message = error_of_text("two.toml", text);
  CAPTURE(message);
  CHECK(contains(message, "[stator.slot] unknown key 'widht'; did you mean 'width'?"));
  CHECK(contains(message, "[stator.slot] missing key 'depth'"));
  CHECK_FALSE(contains(message, "missing key 'width'"));
  CHECK(contains(message, "2 problems in two.toml"));
}

TEST_CASE("a file with more than 20 problems lists the first 20 and says how many there are") {
  std::string text = read_text(source_dir + "/cases/pump24_three_phase.toml");
  std::string extra;
  for (int k = 1; k <= 25; ++k) extra += "extra_key_" + std::to_string(k) + " = 1\n";
  const std::size_t at = text.find("[machine]\n");
  REQUIRE(at != std::string::npos);
  text.insert(at + std::string("[machine]\n").size(), extra);
  const std::string message = error_of_text("many.toml", text);
  CAPTURE(message);
  int listed = 0;
  for (std::size_t p = message.find("[machine] unknown key"); p != std::string::npos;
       p = message.find("[machine] unknown key", p + 1))
    ++listed;
  CHECK(listed == 20);
  CHECK(contains(message, "extra_key_20"));
  CHECK_FALSE(contains(message, "extra_key_21"));
  CHECK(contains(message, "25 problems in many.toml (the first 20 listed)"));
}

TEST_CASE("a misspelt key is reported as unknown before the key it replaced is missed") {
  const std::string message = error_of(bad_dir + "bad_unknown_key.toml");
  CHECK(contains(message, "unknown key 'slot_widht'"));
  CHECK_FALSE(contains(message, "missing"));
  // Only a close key is suggested; a far-fetched one gets the list of keys instead.
  CHECK_FALSE(contains(error_of(bad_dir + "bad_unknown_key_no_guess.toml"), "did you mean"));
}

TEST_CASE("every file in tests/data/bad is tested and opens with a comment saying what is wrong") {
  std::set<std::string> listed;
  for (const BadFile& bad : bad_files) listed.insert(bad.name);
  std::set<std::string> present;
  for (const auto& entry : fs::directory_iterator(bad_dir)) {
    const std::string name = entry.path().filename().string();
    present.insert(name);
    std::ifstream in(entry.path());
    std::string first_line;
    std::getline(in, first_line);
    CAPTURE(name);
    CHECK(first_line.rfind("# Wrong: ", 0) == 0);
  }
  CHECK(present == listed);
}

TEST_CASE("the path is kept exactly as the user gave it") {
  const std::string relative = fs::relative(source_dir + "/cases/stator36_three_phase.toml").string();
  REQUIRE(fs::path(relative).is_relative());
  CHECK(read_case(relative).path == relative);
  const std::string bad = fs::relative(bad_dir + "bad_odd_poles.toml").string();
  CHECK(error_of(bad).rfind(bad + ":35: [winding] poles = 5: ", 0) == 0);
}

TEST_CASE("a case file that is missing or is a folder is an input error, not a crash") {
  const std::string missing = source_dir + "/cases/no_such_case.toml";
  const std::string message = error_of(missing);
  CHECK(message.rfind(missing + ": cannot read the case file", 0) == 0);
  CHECK(contains(message, "No such file"));
  CHECK(contains(error_of(source_dir + "/cases"), "is a folder, not a case file"));
}

TEST_CASE("without a title the case is named after its file") {
  const fs::path dir = fs::temp_directory_path() / "turnfield_test_case_reader";
  fs::create_directories(dir);
  const fs::path path = dir / "untitled_pump.toml";
  std::ifstream in(source_dir + "/cases/pump24_two_phase.toml");
  std::ofstream out(path);
  for (std::string line; std::getline(in, line);)
    if (line.rfind("title", 0) != 0) out << line << '\n';
  out.close();
  CHECK(read_case(path.string()).title == "untitled_pump");
  fs::remove_all(dir);
}
