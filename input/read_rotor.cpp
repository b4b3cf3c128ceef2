#include "input/read_rotor.hpp"

#include <numbers>
#include <optional>

#include <fmt/format.h>

namespace tf::input {
namespace {

constexpr RealRange radius{.min = 0, .max = 5, .min_excluded = true, .unit = "m", .smallest = kSmallestPart};
constexpr RealRange part_size{.min = 0, .max = 1, .min_excluded = true, .unit = "m", .smallest = kSmallestPart};
constexpr RealRange optional_part{.min = 0, .max = 5, .unit = "m", .smallest = kSmallestPart};  ///< 0: none
constexpr double kDeg = std::numbers::pi / 180.0;

/// [rotor.magnets]: arc magnets on the iron surface; pole 1 is centred on the +x axis.
mesh::SurfaceMagnets read_magnets(const Fields& rotor) {
  const Fields f = rotor.table("magnets", {"poles", "thickness", "arc_deg", "magnetization"});
  mesh::SurfaceMagnets m;
  m.n_poles = f.integer("poles", {.min = 2, .max = 200});
  if (m.n_poles % 2 != 0) f.fail("poles", "an odd number of poles", "an even number: north and south alternate");
  m.thickness = f.real("thickness", part_size);
  const double pitch_deg = 360.0 / m.n_poles;
  m.arc = f.real_or("arc_deg", pitch_deg,
                    {.min = 0, .max = pitch_deg, .min_excluded = true, .unit = "degrees", .smallest = kSmallestArc}) *
          kDeg;
  // Between magnets narrower than the pitch there must be room for a part, too.
  if (m.arc < pitch_deg * kDeg && (pitch_deg - m.arc / kDeg) < kSmallestArc)
    f.fail("arc_deg", fmt::format("leaves {:.3g} degrees between neighbouring magnets", pitch_deg - m.arc / kDeg),
           fmt::format("the pole pitch {:g} (magnets touching) or at most {:g} degrees", pitch_deg, pitch_deg - kSmallestArc));
  m.direction = f.choice_or("magnetization", {"radial", "parallel"}, 0) == 0 ? mesh::Magnetization::radial
                                                                            : mesh::Magnetization::parallel;
  return m;
}

/// [rotor.bars]: squirrel-cage bar slots; bar 1 is centred on the +x axis.
mesh::RotorBars read_bars(const Fields& rotor) {
  const Fields f = rotor.table("bars", {"count", "width", "depth", "bridge", "opening"});
  mesh::RotorBars s;
  s.count = f.integer("count", {.min = 3, .max = 500});
  s.width = f.real("width", part_size);
  s.depth = f.real("depth", part_size);
  s.bridge = f.real("bridge", part_size);
  // "Narrower than the bar" is a consistency check.
  s.opening_width = f.real_or("opening", 0.0, optional_part);
  return s;
}

}  // namespace

mesh::RotorGeometry read_rotor(const Fields& root) {
  const Fields f = root.table("rotor", {"kind", "outer_radius", "shaft_radius", "sleeve_thickness", "magnets", "bars", "end_rings"});
  mesh::RotorGeometry r;
  constexpr mesh::RotorKind kinds[] = {mesh::RotorKind::iron, mesh::RotorKind::surface_magnet,
                                       mesh::RotorKind::slotted, mesh::RotorKind::none};
  r.kind = kinds[f.choice("kind", {"iron", "magnets", "slotted", "none"})];
  r.outer_radius = f.real("outer_radius", radius);
  if (r.kind == mesh::RotorKind::none)
    for (const char* key : {"shaft_radius", "sleeve_thickness"})
      f.reject(key, "not used without a rotor", "no such key, or kind = \"iron\"");
  else
    r.shaft_radius = f.real_or("shaft_radius", 0.0, optional_part);
  if (r.kind == mesh::RotorKind::iron)
    // "Thinner than the rotor outside the shaft" is a consistency check.
    r.sleeve_thickness = f.real_or("sleeve_thickness", 0.0, radius);
  else if (r.kind != mesh::RotorKind::none)
    f.reject("sleeve_thickness", "a sleeve is drawn on smooth iron rotors only", "no such key, or kind = \"iron\"");
  if (r.kind == mesh::RotorKind::surface_magnet)
    r.magnets = read_magnets(f);
  else
    f.reject("magnets", "magnets belong to a rotor of kind \"magnets\"", "no such table, or kind = \"magnets\"");
  if (r.kind == mesh::RotorKind::slotted)
    r.bars = read_bars(f);
  else
    f.reject("bars", "bars belong to a rotor of kind \"slotted\"", "no such table, or kind = \"slotted\"");
  if (r.kind != mesh::RotorKind::slotted)
    f.reject("end_rings", "end rings belong to a rotor of kind \"slotted\"", "no such table, or kind = \"slotted\"");
  return r;
}

std::optional<solver::EndRings> read_end_rings(const Fields& root) {
  const Fields rotor = root.table("rotor", {"kind", "outer_radius", "shaft_radius", "sleeve_thickness", "magnets",
                                            "bars", "end_rings"});
  const auto f = rotor.optional_table("end_rings", {"area", "mean_diameter", "conductivity"});
  if (!f) return std::nullopt;
  solver::EndRings e;
  e.area = f->real("area", {.min = 0, .max = 1, .min_excluded = true, .unit = "m^2"});
  e.mean_diameter = f->real("mean_diameter", {.min = 0, .max = 10, .min_excluded = true, .unit = "m"});
  e.conductivity = f->real("conductivity", {.min = 0, .max = 1e9, .min_excluded = true, .unit = "S/m"});
  return e;
}

}  // namespace tf::input
