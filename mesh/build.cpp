#include "mesh/build.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <numeric>
#include <sstream>
#include <string>

#include "mesh/replicate.hpp"
#include "mesh/rotor_shapes.hpp"
#include "mesh/sector.hpp"

namespace tf::mesh {
namespace {

constexpr double kPi = std::numbers::pi;

/// The smallest number of sliding-circle nodes per slot, at least `least`, that makes the node
/// count a multiple of every rotor sector's share (the rotor arcs carry equal segments) and of the
/// requested multiple. Arcs of half a turn are drawn in two halves, so their sectors need an even
/// number of segments: two stator sectors an even count per slot, two rotor sectors a count
/// divisible by four.
int nodes_per_slot(int least, int n_positions, int n_rotor, int sliding_multiple) {
  int multiple = std::lcm(n_rotor, std::max(1, sliding_multiple));
  if (n_rotor == 2) multiple = std::lcm(multiple, 4);
  for (int per_slot = least;; ++per_slot) {
    if (n_positions == 2 && per_slot % 2 != 0) continue;
    if ((static_cast<long>(n_positions) * per_slot) % multiple == 0) return per_slot;
  }
}

/// The narrowest part of a slotted rotor [m]: its bars (the openings and bridges lie at the
/// surface, where the gap's fine elements reach). Smooth and magnet rotors: no limit.
double rotor_narrowest(const RotorGeometry& r) {
  return r.kind == RotorKind::slotted ? r.bars.width : 1e30;
}

}  // namespace

// The slotless stator's iron ring counts no finer than the air gap, so that a very thin ring does
// not make the whole mesh as fine as itself.
double narrowest_part(const Geometry& g) {
  const StatorGeometry& s = g.stator;
  if (s.kind == StatorKind::salient)
    return std::min({s.poles.body_width, s.poles.coil_width, rotor_narrowest(g.rotor)});
  if (s.kind == StatorKind::slotted) return std::min(s.slot.width, rotor_narrowest(g.rotor));
  const double pitch_angle = 2 * kPi / s.n_positions;
  const double conductor = 2 * s.bore_radius * std::sin(0.5 * s.belts.span);
  const double air = 2 * s.bore_radius * std::sin(0.5 * (pitch_angle - s.belts.span));
  const double ring = std::max(s.outer_radius - s.belts.outer_radius, g.gap_length());
  return std::min({s.belts.outer_radius - s.bore_radius, conductor, air, ring, rotor_narrowest(g.rotor)});
}

namespace {

/// How many copies of the sector c asks for make the machine (1: the full model); throws MeshError
/// when they do not close up round it.
int sector_copies(const Geometry& g, const MeshControls& c) {
  const int n_positions = g.stator.n_positions;
  const int sector_slots = c.sector_slots > 0 ? c.sector_slots : n_positions;
  const int copies = n_positions / sector_slots;
  if (sector_slots > n_positions || n_positions % sector_slots != 0 || (c.anti_periodic && copies % 2 != 0))
    throw MeshError("a sector of " + std::to_string(c.sector_slots) + " slot pitches does not repeat round " +
                    std::to_string(n_positions) + " slots" + (c.anti_periodic ? " an even number of times" : ""));
  if (copies > 1 && g.stator.open_boundary)
    throw MeshError("a sector model cannot have an open boundary; use the full model");
  return copies;
}

}  // namespace

ElementSizes element_sizes(const Geometry& g, const MeshControls& c) {
  const StatorGeometry& s = g.stator;
  const double across_gap = 4.0 * std::max(1.0, c.fineness);
  // Far from the gap, elements still resolve the narrowest part. The pitch is the slot pitch (the
  // pole pitch of a salient-pole stator, the belt pitch of a slotless one) at the bore.
  const double pitch = 2 * kPi * s.bore_radius / s.n_positions;
  const double largest =
      std::min({pitch / 3.0, narrowest_part(g) / 2.0, (s.outer_radius - s.bore_radius) / 6.0}) / c.fineness;
  return {g.gap_length() / across_gap, largest, 0.25};
}

double least_triangles(const Geometry& g, const MeshControls& c) {
  const double h = element_sizes(g, c).largest;
  const double r = g.stator.outer_radius;
  return kPi * r * r / (std::sqrt(3.0) / 4.0 * h * h);
}

Mesh build(const Geometry& g, const SlotLayers& layers, const MeshControls& c) {
  const ElementSizes h = element_sizes(g, c);
  // A part so narrow that the whole mesh must be as fine as it would exhaust memory or time (the
  // case checks refuse it first, naming the key; this guards every other caller).
  if (const double n = least_triangles(g, c); n > kMostTriangles) {
    std::ostringstream message;
    message << "elements far from the gap must resolve the narrowest part, " << narrowest_part(g) * 1e3
            << " mm wide: at least " << static_cast<long>(n / 1e6) << " million triangles at fineness " << c.fineness
            << "; widen that part or lower [mesh] fineness (at most " << static_cast<long>(kMostTriangles / 1e6)
            << " million)";
    throw MeshError(message.str());
  }
  const double r_slide = g.mid_gap_radius();
  const double half_gap = 0.5 * g.gap_length();
  const double r_stator = g.stator.outer_radius;
  const double half_pitch_angle = kPi / g.stator.n_positions;
  // Elements are smallest in the gap and grow with the distance from it, up to the largest size.
  // In the air outside the stator the field is smooth and fades, so there they keep growing
  // (about as fast as the radius once far out: a boundary at 1 m costs a few rings of elements),
  // but stay below half the width of the sector, which keeps its narrow wedges well shaped.
  // Induced currents crowd into the rotor's skin, and into the skin of the iron under a sleeve:
  // resolve both when asked to. Gmsh's sizes are about the mean edge, and the longest edges run
  // about 1.5 times longer, so the size aimed at is a third smaller than the count asks.
  const double r_rotor = g.rotor.outer_radius;
  const double skin_top = r_rotor, skin_bottom = r_rotor - g.rotor.sleeve_thickness - c.skin_depth;
  const double skin_size = c.elements_per_skin_depth > 0.0 ? c.skin_depth / (1.5 * c.elements_per_skin_depth) : 0.0;
  const detail::SizeRule size = [=](double x, double y) {
    const double r = std::hypot(x, y);
    const double away = std::max(0.0, std::abs(r - r_slide) - half_gap);
    double cap = r <= r_stator ? h.largest
                               : std::max(h.largest, std::min(h.largest + h.grading * (r - r_stator),
                                                              half_pitch_angle * r));
    if (skin_size > 0.0 && r <= skin_top && r >= skin_bottom) cap = std::min(cap, skin_size);
    return std::min(cap, h.gap + h.grading * away);
  };
  const int n_positions = g.stator.n_positions;
  const int sector_slots = c.sector_slots > 0 ? c.sector_slots : n_positions;
  const int copies = sector_copies(g, c);
  const int n_rotor = detail::rotor_sector_count(g, copies);
  if (n_rotor == 0)
    throw MeshError("the rotor does not repeat every " + std::to_string(sector_slots) +
                    " slot pitches; use the full model");
  const int per_slot = nodes_per_slot(std::max(2, static_cast<int>(std::ceil(2 * kPi * r_slide / n_positions / h.gap))),
                                      n_positions, n_rotor, c.sliding_multiple);
  const int n_sliding = n_positions * per_slot;
  // A runaway fineness would exhaust memory or time; refuse before Gmsh starts.
  const double gap_triangles = 2.0 * n_sliding * g.gap_length() / h.gap;
  if (gap_triangles > 4e6) {
    std::ostringstream message;
    message << "the air gap alone would take about " << static_cast<long>(gap_triangles / 1e6)
            << " million triangles at fineness " << c.fineness
            << "; lower [mesh] fineness (or --fineness) to stay under 4 million";
    throw MeshError(message.str());
  }

  // Each sector is meshed in a Gmsh session of its own, in a child process (mesh/sector.cpp).
  if (!g.stator.open_boundary) {
    const detail::SectorMesh stator = detail::mesh_stator_sector(g, layers, per_slot, size);
    const double rotor_start = detail::rotor_start_angle(g, stator.start_angle, n_sliding, n_rotor);
    const detail::SectorMesh rotor = detail::mesh_rotor_sector(g, n_rotor, rotor_start, n_sliding / n_rotor, size);
    return detail::replicate(g, stator, sector_slots, rotor, n_rotor / copies, nullptr, c.anti_periodic);
  }
  // Open boundary: the boundary arc and its exterior image's arc are divided alike, so that their
  // nodes face each other; in the image, elements grow towards the centre (infinity).
  const double r_b = g.stator.boundary_radius;
  const double rim = size(r_b, 0.0);
  int per_arc = std::max(2, static_cast<int>(std::ceil(2 * kPi * r_b / n_positions / rim)));
  if (n_positions == 2) per_arc += per_arc % 2;
  const detail::SizeRule image_size = [=](double x, double y) {
    return std::min(0.25 * r_b, rim + 0.3 * (r_b - std::hypot(x, y)));
  };
  const detail::SectorMesh stator = detail::mesh_stator_sector(g, layers, per_slot, size, per_arc);
  const double rotor_start = detail::rotor_start_angle(g, stator.start_angle, n_sliding, n_rotor);
  const detail::SectorMesh rotor = detail::mesh_rotor_sector(g, n_rotor, rotor_start, n_sliding / n_rotor, size);
  const detail::SectorMesh image = detail::mesh_exterior_image(g, per_arc, image_size);
  return detail::replicate(g, stator, n_positions, rotor, n_rotor, &image);
}

}  // namespace tf::mesh
