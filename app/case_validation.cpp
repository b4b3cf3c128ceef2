#include "app/case_validation.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <numeric>
#include <vector>

#include <fmt/format.h>

namespace tf::app {
namespace {

// Smallest features we accept [m]: below these the mesh needs needlessly tiny elements, and no
// real lamination is built so thin.
constexpr double min_tooth = 0.5e-3;
constexpr double min_yoke = 1.0e-3;
constexpr double min_gap = 0.05e-3;
// Share of the slot depth that must remain for the coil behind the tooth tips and the wedge.
constexpr double min_coil_share = 0.2;

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
  if (auto p = tooth_problem(body, r_body, slot.width, s.n_slots, where)) return p;
  if (!semi_closed) return std::nullopt;

  if (slot.opening_width >= slot.width)
    return Problem{"stator.slot.opening",
                   fmt::format("the opening is not narrower than the slot width ({})", mm(slot.width)),
                   fmt::format("an opening below {}", mm(slot.width))};
  const ToothCheck tips{"stator.slot.opening", "opening", "tooth tips", "an opening"};
  if (auto p = tooth_problem(tips, s.bore_radius, slot.opening_width, s.n_slots, "at the bore")) return p;

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

std::optional<Problem> stator_problem(const mesh::StatorGeometry& s) {
  if (s.outer_radius <= s.bore_radius)
    return Problem{"stator.outer_radius",
                   fmt::format("the outer radius is not larger than the bore radius ({})", mm(s.bore_radius)),
                   fmt::format("an outer radius above {}", mm(s.bore_radius))};
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
  const std::string expected = fmt::format("an outer radius at most {} (an air gap of at least {})",
                                           mm(g.stator.bore_radius - min_gap), mm(min_gap));
  if (g.gap_length() <= 0)
    return Problem{
        "rotor.outer_radius",
        fmt::format("{} the stator bore (R_b = {})",
                    iron ? "the rotor touches or overlaps" : "the inner edge of the gap band is not inside",
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
  return std::nullopt;
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

std::optional<Problem> geometry_problem(const mesh::Geometry& geometry) {
  if (auto p = stator_problem(geometry.stator)) return p;
  return rotor_problem(geometry);
}

std::optional<Problem> winding_problem(const mesh::WindingSpec& w, int n_slots) {
  const int belts = w.n_poles * w.n_phases;  // 2p·m phase belts around the bore
  if (n_slots % belts != 0) {
    const int common = std::gcd(n_slots, belts);
    return Problem{
        "winding.phases",
        fmt::format("q = Q/(2p·m) = {}/({}·{}) = {}/{} slots per pole and phase, not a whole number", n_slots,
                    w.n_poles, w.n_phases, n_slots / common, belts / common),
        fmt::format("2p·m = {} to divide [stator] slots = {}, since this version lays out "
                    "integral-slot windings only",
                    belts, n_slots)};
  }
  const int pole_pitch = n_slots / w.n_poles;
  if (w.coil_pitch > pole_pitch)
    return Problem{
        "winding.coil_pitch",
        fmt::format("longer than the pole pitch of {} slots (Q/2p = {}/{})", pole_pitch, n_slots, w.n_poles),
        fmt::format("a coil pitch from 1 to {}", pole_pitch)};
  if (w.n_layers == 1 && w.coil_pitch != pole_pitch)
    return Problem{
        "winding.coil_pitch",
        fmt::format("single-layer windings are laid out full pitch here, and the pole pitch is {} slots",
                    pole_pitch),
        fmt::format("coil_pitch = {}, or layers = 2 for a short-pitched winding", pole_pitch)};
  // A double-layer winding has one coil group per pole and phase, a single-layer one per pole pair.
  const int groups = w.n_layers == 2 ? w.n_poles : w.n_poles / 2;
  if (groups % w.parallel_paths != 0)
    return Problem{"winding.parallel_paths",
                   fmt::format("{} parallel paths cannot share the {} coil groups of a phase equally",
                               w.parallel_paths, groups),
                   fmt::format("a divisor of {}: {}", groups, divisors(groups))};
  return std::nullopt;
}

std::optional<Problem> study_problem(const Study& study) {
  if (study.n_field_files > study.n_steps)
    return Problem{"study.field_files", fmt::format("more field files than steps ({})", study.n_steps),
                   fmt::format("at most {}, one file per step", study.n_steps)};
  return std::nullopt;
}

std::optional<Problem> case_problem(const Case& c) {
  if (auto p = geometry_problem(c.geometry)) return p;
  if (auto p = winding_problem(c.winding, c.geometry.stator.n_slots)) return p;
  return study_problem(c.study);
}

}  // namespace tf::app
