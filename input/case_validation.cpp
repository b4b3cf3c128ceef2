#include "input/case_validation.hpp"

#include <algorithm>
#include <cmath>
#include <complex>
#include <numbers>
#include <numeric>
#include <vector>

#include <fmt/format.h>

#include "mesh/build.hpp"
#include "mesh/salient_outline.hpp"
#include "mesh/winding.hpp"

namespace tf::input {
namespace {

// Smallest features we accept [m]: below these the mesh needs needlessly tiny elements, and no
// real lamination is built so thin.
constexpr double min_tooth = 0.5e-3;
constexpr double min_yoke = 1.0e-3;
constexpr double min_gap = 0.05e-3;
// Share of the slot depth that must remain for the coil behind the tooth tips and the wedge.
constexpr double min_coil_share = 0.2;
// Salient poles: as much as the thinnest tooth between parts that must not touch (neighbouring
// shoes, neighbouring coil sides, coil and yoke) and for the shoe reaching past the body, since
// thinner slivers of air or iron need needlessly tiny elements too.
constexpr double min_clearance = min_tooth;
// Air between the stator and an outer boundary: thinner would be a sliver, not a boundary region.
constexpr double min_outer_air = 1.0e-3;

std::string mm(double metres) { return fmt::format("{:.2f} mm", metres * 1e3); }

/// The widest slot (or opening) [m] that leaves a tooth `tooth` [m] wide at radius r:
/// tooth_width solved for the slot width, which enters it symmetrically.
double widest_slot(double r, int n_slots, double tooth) {
  return 2.0 * r * std::sin(std::numbers::pi / n_slots - std::asin(tooth / (2.0 * r)));
}

/// What a tooth check is about: the slot body and the teeth behind it, or the opening and the tips.
struct ToothCheck {
  const char* key;       ///< dotted key to blame
  const char* slot;      ///< "slot" or "opening"
  const char* teeth;     ///< "teeth" or "tooth tips"
  const char* quantity;  ///< "a width" or "an opening", for the expected value
};

/// A slot body or opening `width` [m] wide at radius r [m] must leave a tooth of min_tooth.
std::optional<Problem> tooth_problem(const ToothCheck& c, double r, double width, int n_slots,
                                     const std::string& where) {
  const double pitch_chord = 2.0 * r * std::sin(std::numbers::pi / n_slots);
  if (width >= pitch_chord)
    return Problem{c.key,
                   fmt::format("the {} is wider than the slot pitch {} ({})", c.slot, where, mm(pitch_chord)),
                   fmt::format("{} below {}", c.quantity, mm(pitch_chord))};
  const double tooth = tooth_width(r, width, n_slots);
  if (tooth < min_tooth)
    return Problem{c.key,
                   fmt::format("the {} between neighbouring {}s are {} wide {}, thinner than the minimum {}",
                               c.teeth, c.slot, mm(tooth), where, mm(min_tooth)),
                   fmt::format("{} at most {}", c.quantity, mm(widest_slot(r, n_slots, min_tooth)))};
  return std::nullopt;
}

std::optional<Problem> slot_problem(const mesh::StatorGeometry& s) {
  const mesh::Slot& slot = s.slot;
  const bool semi_closed = slot.shape == mesh::SlotShape::semi_closed;
  // The walls are parallel, so the tooth is narrowest where the slot body starts: at the bore
  // for an open slot, at the back of the tooth tips for a semi-closed one.
  const double r_body = s.bore_radius + (semi_closed ? slot.tip_height : 0.0);
  const std::string where =
      semi_closed ? fmt::format("behind the tooth tips, at r = {}", mm(r_body)) : "at the bore";
  const ToothCheck body{"stator.slot.width", "slot", "teeth", "a width"};
  if (auto p = tooth_problem(body, r_body, slot.width, s.n_positions, where)) return p;
  if (!semi_closed) return std::nullopt;

  if (slot.opening_width >= slot.width)
    return Problem{"stator.slot.opening",
                   fmt::format("the opening is not narrower than the slot width ({})", mm(slot.width)),
                   fmt::format("an opening below {}", mm(slot.width))};
  const ToothCheck tips{"stator.slot.opening", "opening", "tooth tips", "an opening"};
  if (auto p = tooth_problem(tips, s.bore_radius, slot.opening_width, s.n_positions, "at the bore")) return p;

  const double closed = slot.tip_height + slot.wedge_height;
  if (slot.depth - closed < min_coil_share * slot.depth)
    return Problem{
        "stator.slot.tip_height",
        fmt::format("tip_height + wedge_height = {} leave {} of the {} slot depth for the coil, "
                    "less than {:.0f} %",
                    mm(closed), mm(slot.depth - closed), mm(slot.depth), 100 * min_coil_share),
        fmt::format("tip_height + wedge_height at most {}", mm((1 - min_coil_share) * slot.depth))};
  return std::nullopt;
}

std::string degrees(double radians) { return fmt::format("{:.2f} degrees", radians * 180.0 / std::numbers::pi); }

/// The iron of a salient pole: room between neighbouring shoes, a shoe reaching past the body on
/// both sides, and a yoke behind the bodies.
std::optional<Problem> pole_iron_problem(const mesh::StatorGeometry& s, const mesh::PoleOutline& o) {
  const double pitch = 2.0 * std::numbers::pi / s.n_positions;
  // Neighbouring shoes face each other with radial edges, so they are closest at the bore.
  const double shoe_gap = 2.0 * s.bore_radius * std::sin(0.5 * pitch - o.half_shoe_arc);
  if (shoe_gap < min_clearance)
    return Problem{"stator.poles.shoe_arc_deg",
                   fmt::format("the shoes of neighbouring poles are {} apart at the bore, closer than the minimum {}",
                               mm(shoe_gap), mm(min_clearance)),
                   fmt::format("a shoe arc at most {}",
                               degrees(pitch - 2.0 * std::asin(min_clearance / (2.0 * s.bore_radius))))};
  // The body joins the shoe at the shoe back, where the shoe is narrowest.
  const double half_chord = o.shoe_back_radius * std::sin(o.half_shoe_arc);
  const double overhang = half_chord - o.body_half_width;
  if (overhang < min_clearance) {
    const std::string where =
        fmt::format("the shoe back ({} across at r = {})", mm(2 * half_chord), mm(o.shoe_back_radius));
    const double widest = 2.0 * (half_chord - min_clearance);
    return Problem{"stator.poles.body_width",
                   overhang <= 0 ? fmt::format("the body is not narrower than {}", where)
                                 : fmt::format("the shoe reaches only {} past the body on each side at {}, "
                                               "less than the minimum {}",
                                               mm(overhang), where, mm(min_clearance)),
                   widest > 0 ? fmt::format("a body width at most {}", mm(widest)) : "a wider shoe (shoe_arc_deg)"};
  }
  const double yoke = s.outer_radius - o.yoke_radius;
  if (yoke >= min_yoke) return std::nullopt;
  const std::string reach =
      fmt::format("the pole bodies reach r = {} (bore + shoe_height + body_height)", mm(o.yoke_radius));
  return Problem{"stator.poles.body_height",
                 yoke <= 0 ? fmt::format("{}, through the outer radius {}", reach, mm(s.outer_radius))
                           : fmt::format("{}, leaving a yoke of {}, thinner than the minimum {}", reach, mm(yoke),
                                         mm(min_yoke)),
                 fmt::format("shoe_height + body_height at most {}", mm(s.outer_radius - min_yoke - s.bore_radius))};
}

/// The coil sides beside a salient pole's body: within the body's length, clear of the neighbouring
/// pole's coil side and of the yoke.
std::optional<Problem> pole_coil_problem(const mesh::StatorGeometry& s, const mesh::PoleOutline& o) {
  const mesh::SalientPoles& p = s.poles;
  if (p.coil_height > p.body_height)
    return Problem{"stator.poles.coil_height",
                   fmt::format("the coil sides are longer than the pole body (body_height = {})", mm(p.body_height)),
                   fmt::format("a coil height at most {}", mm(p.body_height))};
  // A coil side's outer edge is parallel to the pole centre line, so it comes closest to the line
  // halfway to the next pole at its inner corner; the next pole's coil side mirrors it there.
  const double half_pitch = std::numbers::pi / s.n_positions;
  const double to_middle = o.coil_floor * std::sin(half_pitch) - o.coil_outer_y * std::cos(half_pitch);
  if (2.0 * to_middle < min_clearance) {
    const std::string where =
        fmt::format("at their gap-side corners (r = {})", mm(std::hypot(o.coil_floor, o.coil_outer_y)));
    const double widest = (o.coil_floor * std::sin(half_pitch) - 0.5 * min_clearance) / std::cos(half_pitch) -
                          o.body_half_width;
    return Problem{"stator.poles.coil_width",
                   to_middle <= 0 ? fmt::format("the coil sides of neighbouring poles overlap {}", where)
                                  : fmt::format("the coil sides of neighbouring poles are {} apart {}, "
                                                "closer than the minimum {}",
                                                mm(2.0 * to_middle), where, mm(min_clearance)),
                   widest > 0 ? fmt::format("a coil width at most {}", mm(widest))
                              : "a narrower body (body_width), to leave room for the coil sides"};
  }
  // The yoke's inner circle curves towards the coil sides; their outer corners come closest to it.
  const double corner = std::hypot(o.coil_top, o.coil_outer_y);
  const double limit = o.yoke_radius - min_clearance;
  if (corner <= limit) return std::nullopt;
  const double highest = std::sqrt(std::max(0.0, limit * limit - o.coil_outer_y * o.coil_outer_y)) - o.coil_floor;
  const std::string reach = fmt::format("the outer corners of the coil sides reach r = {}", mm(corner));
  return Problem{"stator.poles.coil_height",
                 corner >= o.yoke_radius
                     ? fmt::format("{}, into the yoke (from r = {})", reach, mm(o.yoke_radius))
                     : fmt::format("{}, {} short of the yoke (r = {}), closer than the minimum {}", reach,
                                   mm(o.yoke_radius - corner), mm(o.yoke_radius), mm(min_clearance)),
                 highest > 0 ? fmt::format("a coil height at most {}", mm(highest))
                             : "narrower coil sides (coil_width), to leave room beside the yoke"};
}

/// The winding annulus of a slotless stator: between the bore and the outer radius, leaving an iron
/// ring (however thin) behind it, and room between neighbouring conductor sectors.
std::optional<Problem> belts_problem(const mesh::StatorGeometry& s) {
  const double r_w = s.belts.outer_radius;
  const std::string expected =
      fmt::format("an outer radius above {} and below {}", mm(s.bore_radius), mm(s.outer_radius));
  if (r_w <= s.bore_radius)
    return Problem{"stator.belts.outer_radius",
                   fmt::format("the conductor sectors end inside the bore (bore radius {})", mm(s.bore_radius)),
                   expected};
  if (r_w >= s.outer_radius)
    return Problem{"stator.belts.outer_radius",
                   fmt::format("the conductor sectors leave no iron ring inside the stator's outer radius {}",
                               mm(s.outer_radius)),
                   expected};
  // Neighbouring sectors face each other with radial edges, so they are closest at the bore.
  const double pitch = 2.0 * std::numbers::pi / s.n_positions;
  const double apart = 2.0 * s.bore_radius * std::sin(0.5 * (pitch - s.belts.span));
  if (apart >= min_clearance) return std::nullopt;
  const double widest = pitch - 2.0 * std::asin(min_clearance / (2.0 * s.bore_radius));
  return Problem{"stator.belts.span_deg",
                 fmt::format("neighbouring conductor sectors are {} apart at the bore, closer than the minimum {}",
                             mm(apart), mm(min_clearance)),
                 fmt::format("a span at most {}", degrees(widest))};
}

std::optional<Problem> stator_problem(const mesh::StatorGeometry& s) {
  if (s.outer_radius <= s.bore_radius)
    return Problem{"stator.outer_radius",
                   fmt::format("the outer radius is not larger than the bore radius ({})", mm(s.bore_radius)),
                   fmt::format("an outer radius above {}", mm(s.bore_radius))};
  if (s.kind == mesh::StatorKind::slotless) return belts_problem(s);
  if (s.kind == mesh::StatorKind::salient) {
    const mesh::PoleOutline o = mesh::pole_outline(s);
    if (auto p = pole_iron_problem(s, o)) return p;
    return pole_coil_problem(s, o);
  }
  if (auto p = slot_problem(s)) return p;

  // The slot bottom is flat, so its corners, half a slot width off the centre line, come
  // closest to the outer surface: that is where the yoke is thinnest.
  const double half_width = 0.5 * s.slot.width;
  const double corner = std::hypot(s.bore_radius + s.slot.depth, half_width);
  const double yoke = s.outer_radius - corner;
  if (yoke >= min_yoke) return std::nullopt;
  const double inner = s.outer_radius - min_yoke;
  const double deepest = std::sqrt(std::max(0.0, inner * inner - half_width * half_width)) - s.bore_radius;
  const std::string what =
      yoke <= 0
          ? fmt::format("the slot corners reach r = {}, through the outer radius {}", mm(corner),
                        mm(s.outer_radius))
          : fmt::format("the slot corners reach r = {}, leaving a yoke of {}, thinner than the minimum {}",
                        mm(corner), mm(yoke), mm(min_yoke));
  return Problem{"stator.slot.depth", what, fmt::format("a depth at most {}", mm(deepest))};
}

std::optional<Problem> rotor_problem(const mesh::Geometry& g) {
  const mesh::RotorGeometry& r = g.rotor;
  const bool iron = r.kind == mesh::RotorKind::iron;
  const char* bore = g.stator.kind == mesh::StatorKind::salient ? "the pole faces" : "the stator bore";
  const std::string expected = fmt::format("an outer radius at most {} (an air gap of at least {})",
                                           mm(g.stator.bore_radius - min_gap), mm(min_gap));
  if (g.gap_length() <= 0)
    return Problem{
        "rotor.outer_radius",
        fmt::format("{} {} (R_b = {})",
                    iron ? "the rotor touches or overlaps" : "the inner edge of the gap band is not inside", bore,
                    mm(g.stator.bore_radius)),
        expected};
  if (g.gap_length() < min_gap)
    return Problem{
        "rotor.outer_radius",
        fmt::format("the air gap is {:.3f} mm, below the minimum {}", g.gap_length() * 1e3, mm(min_gap)),
        expected};
  if (iron && r.shaft_radius >= r.outer_radius)
    return Problem{"rotor.shaft_radius",
                   fmt::format("the shaft is as large as the rotor (outer radius {})", mm(r.outer_radius)),
                   fmt::format("a shaft radius below {}", mm(r.outer_radius))};
  // The sleeve lies on the iron: some iron must remain between it and the shaft (or the axis).
  if (iron && r.sleeve_thickness > 0.0 && r.sleeve_thickness >= r.outer_radius - r.shaft_radius)
    return Problem{"rotor.sleeve_thickness",
                   r.shaft_radius > 0.0
                       ? fmt::format("the sleeve reaches the shaft (rotor radius {}, shaft radius {})",
                                     mm(r.outer_radius), mm(r.shaft_radius))
                       : fmt::format("the sleeve fills the whole rotor (radius {})", mm(r.outer_radius)),
                   fmt::format("a sleeve thickness below {}", mm(r.outer_radius - r.shaft_radius))};
  return std::nullopt;
}

/// Air round the stator must reach beyond it: A = 0 on a circle that cuts the iron would be wrong.
std::optional<Problem> boundary_problem(const mesh::StatorGeometry& s) {
  if (s.boundary_radius <= 0.0 || s.boundary_radius >= s.outer_radius + min_outer_air) return std::nullopt;
  return Problem{"stator.boundary_radius",
                 fmt::format("less than {} beyond the stator's outer radius ({})", mm(min_outer_air),
                             mm(s.outer_radius)),
                 fmt::format("a boundary radius of at least {}, or no such key for A = 0 on the stator's outer "
                             "surface",
                             mm(s.outer_radius + min_outer_air))};
}

std::string divisors(int n) {
  std::vector<std::string> d;
  for (int k = 1; k <= n; ++k)
    if (n % k == 0) d.push_back(std::to_string(k));
  return fmt::format("{}", fmt::join(d, ", "));
}

}  // namespace

double tooth_width(double r, double slot_width, int n_slots) {
  // Clamp so a slot wider than the whole circle still gives a (negative) width rather than NaN.
  const double wall_angle = std::asin(std::min(1.0, slot_width / (2.0 * r)));
  return 2.0 * r * std::sin(std::numbers::pi / n_slots - wall_angle);
}

/// Magnets and bars must fit in the rotor, leaving iron between them and the shaft.
std::optional<Problem> rotor_parts_problem(const mesh::RotorGeometry& r) {
  const double iron = r.outer_radius - r.shaft_radius;
  if (r.kind == mesh::RotorKind::surface_magnet && r.magnets.thickness >= iron)
    return Problem{"rotor.magnets.thickness",
                   fmt::format("the magnets reach the shaft (rotor radius {}, shaft radius {})", mm(r.outer_radius),
                               mm(r.shaft_radius)),
                   fmt::format("a thickness below {}", mm(iron))};
  if (r.kind != mesh::RotorKind::slotted) return std::nullopt;
  const mesh::RotorBars& b = r.bars;
  if (b.bridge + b.depth >= iron)
    return Problem{"rotor.bars.depth",
                   fmt::format("bridge and bar reach r = {}, at or inside the shaft (radius {})",
                               mm(r.outer_radius - b.bridge - b.depth), mm(r.shaft_radius)),
                   fmt::format("bridge + depth below {}", mm(iron))};
  const double bottom = r.outer_radius - b.bridge - b.depth;
  const double pitch = 2 * bottom * std::sin(std::numbers::pi / b.count);
  if (b.width >= pitch)
    return Problem{"rotor.bars.width",
                   fmt::format("the bars touch at their bottom, where the bar pitch is {}", mm(pitch)),
                   fmt::format("a width below {}", mm(pitch))};
  if (b.opening_width >= b.width)
    return Problem{"rotor.bars.opening", fmt::format("the opening is as wide as the bar ({})", mm(b.width)),
                   fmt::format("an opening below {}, or 0 for closed slots", mm(b.width))};
  return std::nullopt;
}

std::optional<Problem> geometry_problem(const mesh::Geometry& geometry) {
  if (auto p = stator_problem(geometry.stator)) return p;
  if (auto p = boundary_problem(geometry.stator)) return p;
  if (auto p = rotor_problem(geometry)) return p;
  return rotor_parts_problem(geometry.rotor);
}

namespace {

/// Pitch rules of layouts by rule on slotted stators.
std::optional<Problem> pitch_problem(const mesh::WindingSpec& w, int n_slots, bool integral) {
  const int pole_pitch = n_slots / w.n_poles;
  if (integral && w.coil_pitch > pole_pitch)
    return Problem{
        "winding.coil_pitch",
        fmt::format("longer than the pole pitch of {} slots (Q/2p = {}/{})", pole_pitch, n_slots, w.n_poles),
        fmt::format("a coil pitch from 1 to {}", pole_pitch)};
  if (integral && w.n_layers == 1 && w.coil_pitch != pole_pitch)
    return Problem{
        "winding.coil_pitch",
        fmt::format("single-layer windings are laid out full pitch here, and the pole pitch is {} slots",
                    pole_pitch),
        fmt::format("coil_pitch = {}, or layers = 2 for a short-pitched winding", pole_pitch)};
  if (!integral && w.coil_pitch > n_slots / 2)
    return Problem{"winding.coil_pitch", fmt::format("longer than half the {} slots", n_slots),
                   fmt::format("a coil pitch from 1 to {}", n_slots / 2)};
  if (!integral && w.n_layers == 1 && (n_slots % 2 != 0 || w.coil_pitch % 2 == 0))
    return Problem{"winding.coil_pitch",
                   "a single-layer fractional-slot winding puts coils in every other slot pair",
                   "an even number of slots and an odd coil pitch, or layers = 2"};
  return std::nullopt;
}

std::optional<Problem> paths_problem(const mesh::WindingSpec& w, int n_slots, bool integral) {
  // Integral slot: one coil group per pole and phase (double layer) or pole pair (single layer).
  // Otherwise the layout repeats t = gcd(Q, p) times round the bore, and paths must repeat with it.
  const int groups = integral ? (w.n_layers == 2 ? w.n_poles : w.n_poles / 2) : std::gcd(n_slots, w.pole_pairs());
  if (groups % w.parallel_paths == 0) return std::nullopt;
  return Problem{"winding.parallel_paths",
                 integral ? fmt::format("{} parallel paths cannot share the {} coil groups of a phase equally",
                                        w.parallel_paths, groups)
                          : fmt::format("{} parallel paths cannot share a layout that repeats {} times round the bore",
                                        w.parallel_paths, groups),
                 fmt::format("a divisor of {}: {}", groups, divisors(groups))};
}

}  // namespace

std::optional<Problem> winding_problem(const mesh::WindingSpec& w, const mesh::StatorGeometry& stator) {
  const int n_slots = stator.n_positions;
  const bool table = !w.explicit_sides.empty();
  // The conductor sectors of a slotless stator are slots to the winding, pitch rules and all.
  const bool slotted = stator.kind != mesh::StatorKind::salient;
  const bool integral = slotted && n_slots % (w.n_poles * w.n_phases) == 0;
  if (!table && slotted)
    if (auto p = pitch_problem(w, n_slots, integral)) return p;
  if (const auto why = mesh::layout_problem(w, stator)) {
    const int belts = w.n_poles * w.n_phases, common = std::gcd(n_slots, belts);
    const int t = std::gcd(n_slots, w.pole_pairs());
    return Problem{table ? "winding.sides" : "winding.phases",
                   table ? *why
                         : fmt::format("q = Q/(2p·m) = {}/({}·{}) = {}/{} slots per pole and phase: {}", n_slots,
                                       w.n_poles, w.n_phases, n_slots / common, belts / common, *why),
                   table ? "a balanced slot table"
                   : w.n_phases % 2 ? fmt::format("Q/(m·t) a whole number, with t = gcd(Q, p) = {} (here {}/({}·{}))",
                                                  t, n_slots, w.n_phases, t)
                                    : fmt::format("Q/(2m·t) a whole number for an even phase number, with t = gcd(Q, "
                                                  "p) = {} (here {}/(2·{}·{}))",
                                                  t, n_slots, w.n_phases, t)};
  }
  if (table) return std::nullopt;
  return paths_problem(w, n_slots, integral);
}

std::optional<Problem> study_problem(const StudyPlan& study) {
  if (study.n_field_files > study.n_steps)
    return Problem{"study.field_files", fmt::format("more field files than steps ({})", study.n_steps),
                   fmt::format("at most {}, one file per step", study.n_steps)};
  return std::nullopt;
}

std::optional<Problem> motion_problem(const Case& c) {
  const StudyPlan& s = c.study;
  if (s.kind == input::StudyKind::eddy_currents)
    for (const auto& [part, bh] : {std::pair{"stator_iron", &c.materials.stator_iron_bh},
                                   std::pair{"rotor_iron", &c.materials.rotor_iron_bh}})
      if (*bh)
        return Problem{fmt::format("materials.{}.bh_curve", part),
                       "a B-H curve in an eddy-current study, which is linear (time-harmonic)",
                       "relative_permeability for eddy-current studies"};
  // A cage is solved by the slip-frequency method (solver/slip.hpp): bars must conduct, and the
  // currents must split into forward and backward sets, which one phase alone cannot.
  if (s.kind == input::StudyKind::eddy_currents && c.geometry.rotor.kind == mesh::RotorKind::slotted) {
    if (c.materials.bar_sigma <= 0.0)
      return Problem{"materials.rotor_bars.conductivity", "bars that do not conduct in an eddy-current study of a cage",
                     "a conductivity above 0 S/m"};
    if (c.winding.n_phases < 2)
      return Problem{"winding.phases",
                     "one phase under a cage: its pulsating field cannot be split into forward and backward "
                     "current sets",
                     "two or more phases (feed one of them alone for single-phase operation)"};
  }
  if (c.supply.kind == solver::SupplyKind::split_phase && (c.materials.stator_iron_bh || c.materials.rotor_iron_bh))
    return Problem{"supply.kind", "a split-phase circuit is solved with linear iron, but the case gives a B-H curve",
                   "relative_permeability for the iron, or another supply"};
  if (c.geometry.rotor.kind == mesh::RotorKind::surface_magnet && s.kind == input::StudyKind::synchronous &&
      c.geometry.rotor.magnets.n_poles != c.winding.n_poles)
    return Problem{"rotor.magnets.poles",
                   fmt::format("{} magnet poles under a {}-pole winding: no steady torque to turn with",
                               c.geometry.rotor.magnets.n_poles, c.winding.n_poles),
                   fmt::format("{} poles, as the winding", c.winding.n_poles)};
  if (!input::rotor_turns(s.kind)) return std::nullopt;
  if (c.geometry.rotor.kind == mesh::RotorKind::none)
    return Problem{"study.kind", "the study turns the rotor, but [rotor] kind = \"none\"",
                   "a rotor, or kind = \"phase_angles\""};
  if (s.kind == input::StudyKind::synchronous) return std::nullopt;
  // Each step must turn the rotor by a whole number of sliding-circle pitches, so the steps must
  // divide a whole turn: 360° * steps / span must be a whole number.
  const double per_turn = 360.0 * s.n_steps / (s.rotor_span * 180.0 / std::numbers::pi);
  if (std::abs(per_turn - std::round(per_turn)) > 1e-6 * per_turn)
    return Problem{"study.rotor_span_deg",
                   fmt::format("{} steps over {:.6g} degrees do not divide a whole turn evenly", s.n_steps,
                               s.rotor_span * 180.0 / std::numbers::pi),
                   "a span for which 360 * steps / span is a whole number (e.g. 360/p or 360/LCM(Q, 2p))"};
  if (per_turn > 200000)
    return Problem{"study.rotor_span_deg", fmt::format("steps {:.6g} thousandths of a degree apart", 360e3 / per_turn),
                   "a rotor step of at least 0.0018 degrees (fewer steps or a wider span)"};
  return std::nullopt;
}

/// The largest |value| of a list of currents [A] (0 for none).
template <class Values>
double largest(const Values& values) {
  double m = 0.0;
  for (const auto& v : values) m = std::max(m, static_cast<double>(std::abs(v)));
  return m;
}

std::optional<Problem> supply_problem(const Case& c) {
  // A cogging study runs without current; every other study needs some, or it would report a
  // "perfect" rotating field of 0 T and a torque of zero.
  if (c.study.kind == input::StudyKind::cogging) return std::nullopt;
  const solver::Supply& s = c.supply;
  const char* expected = "a current above 0 A in some phase (a study without current is kind = \"cogging\")";
  double states = 0.0;
  for (const auto& state : s.states) states = std::max(states, largest(state));
  switch (s.kind) {
    case solver::SupplyKind::balanced:
      if (s.peak_current == 0.0) return Problem{"supply.peak_current", "no current", expected};
      break;
    case solver::SupplyKind::phasors:
      if (largest(s.phasors) == 0.0) return Problem{"supply.peak_currents", "no current in any phase", expected};
      break;
    case solver::SupplyKind::stepped_dc:
      if (states == 0.0) return Problem{"supply.states", "no current in any state", expected};
      break;
    case solver::SupplyKind::split_phase:
      if (s.split.voltage_rms == 0.0) return Problem{"supply.voltage_rms", "no voltage", "a voltage above 0 V"};
      break;
  }
  return std::nullopt;
}

std::optional<Problem> conductor_problem(const Case& c) {
  // An eddy-current study in which nothing conducts has no eddy currents: its "torque" and "rotor
  // loss" would be round-off. The motion term sees conducting iron, shaft and sleeve (the stator's
  // too); the slip method the rotor's conductors with the bars (checked in motion_problem).
  if (c.study.kind != input::StudyKind::eddy_currents || c.geometry.rotor.kind == mesh::RotorKind::slotted)
    return std::nullopt;
  const auto& r = c.geometry.rotor;
  const auto& m = c.materials;
  const bool iron = r.kind != mesh::RotorKind::none;
  const bool conducts = m.stator_iron_sigma > 0.0 || (iron && m.rotor_iron_sigma > 0.0) ||
                        (r.shaft_radius > 0.0 && m.shaft_sigma > 0.0) || (r.sleeve_thickness > 0.0 && m.sleeve_sigma > 0.0);
  if (conducts) return std::nullopt;
  return Problem{"study.kind", "an eddy-current study in which nothing conducts (every part present has 0 S/m)",
                 "a conductivity above 0 S/m for the rotor iron, shaft, sleeve or stator iron"};
}

/// The key of the part that sets mesh::narrowest_part, for the message.
std::string narrowest_key(const mesh::Geometry& g) {
  const double w = mesh::narrowest_part(g);
  if (g.rotor.kind == mesh::RotorKind::slotted && g.rotor.bars.width == w) return "rotor.bars.width";
  if (g.stator.kind == mesh::StatorKind::slotted && g.stator.slot.width == w) return "stator.slot.width";
  if (g.stator.kind == mesh::StatorKind::salient)
    return g.stator.poles.body_width == w ? "stator.poles.body_width" : "stator.poles.coil_width";
  return g.stator.kind == mesh::StatorKind::slotless ? "stator.belts.span_deg" : "mesh.fineness";
}

std::optional<Problem> mesh_size_problem(const Case& c) {
  // Elements far from the gap resolve the narrowest part, so a part narrow next to the machine
  // makes the whole mesh as fine as itself: refuse it before meshing rather than run for hours.
  const double n = mesh::least_triangles(c.geometry, c.mesh);
  if (n <= mesh::kMostTriangles) return std::nullopt;
  const double w = mesh::narrowest_part(c.geometry), scale = std::sqrt(n / mesh::kMostTriangles);
  return Problem{narrowest_key(c.geometry),
                 fmt::format("the whole mesh must resolve this {:.3g} mm part: at least {:.0f} million triangles at "
                             "fineness {:g}",
                             1e3 * w, n / 1e6, c.mesh.fineness),
                 fmt::format("a part at least {:.3g} mm wide at this fineness (at most {:.0f} million triangles)",
                             1e3 * w * scale, mesh::kMostTriangles / 1e6)};
}

std::vector<Problem> case_problems(const Case& c) {
  std::vector<Problem> found;
  const auto add = [&](std::optional<Problem> p) {
    if (p) found.push_back(std::move(*p));
  };
  const std::optional<Problem> geometry = geometry_problem(c.geometry);
  add(geometry);
  add(winding_problem(c.winding, c.geometry.stator));
  add(motion_problem(c));
  add(supply_problem(c));
  add(conductor_problem(c));
  // The mesh's size follows from a geometry that holds together; a broken one would only add noise.
  if (!geometry) add(mesh_size_problem(c));
  add(study_problem(c.study));
  return found;
}

std::optional<Problem> case_problem(const Case& c) {
  std::vector<Problem> found = case_problems(c);
  if (found.empty()) return std::nullopt;
  return found.front();
}

}  // namespace tf::input
