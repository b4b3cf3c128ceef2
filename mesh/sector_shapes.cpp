// Stator and rotor sectors as OpenCASCADE surfaces, each piece labelled with what it is.
// Boolean fragments make all interfaces conformal; the fragment map (not point probing)
// tells which piece came from which input shape, so labelling cannot be fooled by
// non-convex pieces.

#include <cmath>
#include <numbers>

#include <gmsh.h>

#include "mesh/rotor_shapes.hpp"
#include "mesh/salient_shapes.hpp"
#include "mesh/sector_shapes.hpp"
#include "mesh/slotless_shapes.hpp"

namespace tf::mesh::detail {
namespace {

namespace occ = gmsh::model::occ;

int add_polar_point(double r, double angle) {
  return occ::addPoint(r * std::cos(angle), r * std::sin(angle), 0.0);
}

/// A rectangle in slot-local coordinates: x along the slot centre line from the machine axis,
/// symmetric about it with the given width; the slot centre line is the +x axis.
int add_slot_rectangle(double x0, double x1, double width) {
  return occ::addRectangle(x0, -0.5 * width, 0.0, x1 - x0, width);
}

/// The same, between y0 < y1 across the centre line.
int add_slot_rectangle(double x0, double x1, double y0, double y1) {
  return occ::addRectangle(x0, y0, 0.0, x1 - x0, y1 - y0);
}

bool contains(const gmsh::vectorpair& list, int tag) {
  for (const auto& [dim, t] : list)
    if (dim == 2 && t == tag) return true;
  return false;
}

/// Circle arc of radius r about `centre` between two points at the given angles. OpenCASCADE
/// draws an arc through start, centre and end, which is ambiguous for half a turn (a two-pole
/// stator's sector), so arcs that long are drawn in two equal halves.
std::vector<int> add_arc(int centre, double r, int from, double a_from, int to, double a_to) {
  if (std::abs(a_to - a_from) < 0.9 * std::numbers::pi) return {occ::addCircleArc(from, centre, to)};
  const int middle = add_polar_point(r, 0.5 * (a_from + a_to));
  return {occ::addCircleArc(from, centre, middle), occ::addCircleArc(middle, centre, to)};
}

/// The slot's pieces, from the gap upwards. The lowest piece reaches below the bore so that it
/// cuts the bore arc cleanly; what lies below the bore is discarded after the fragment.
std::vector<Piece> slot_shapes(const StatorGeometry& s, const SlotLayers& layers) {
  const double r_b = s.bore_radius;
  const double x_low = 0.5 * r_b;
  const double x_bottom = r_b + s.slot.depth;
  std::vector<Piece> shapes;
  double coil_start = x_low;
  if (s.slot.shape == SlotShape::semi_closed) {
    const double tip_top = r_b + s.slot.tip_height;
    shapes.push_back({add_slot_rectangle(x_low, tip_top, s.slot.opening_width), {RegionKind::slot_air, 0}});
    coil_start = tip_top;
    if (s.slot.wedge_height > 0.0) {
      const double wedge_top = tip_top + s.slot.wedge_height;
      shapes.push_back({add_slot_rectangle(tip_top, wedge_top, s.slot.width), {RegionKind::slot_air, 0}});
      coil_start = wedge_top;
    }
  }
  if (layers.side_by_side) {
    // Tooth coils: layer 1 on the counter-clockwise side of the centre line (y > 0), layer 2 clockwise.
    const double w = 0.5 * s.slot.width;
    shapes.push_back({add_slot_rectangle(coil_start, x_bottom, 0.0, w), {RegionKind::coil, 1}});
    shapes.push_back({add_slot_rectangle(coil_start, x_bottom, -w, 0.0), {RegionKind::coil, 2}});
    return shapes;
  }
  // Layer 1 is the one nearest the gap. Layers share the coil height equally.
  const int n_layers = layers.count;
  const double coil_floor = (s.slot.shape == SlotShape::open) ? r_b : coil_start;
  const double layer_height = (x_bottom - coil_floor) / n_layers;
  for (int layer = 1; layer <= n_layers; ++layer) {
    const double x0 = (layer == 1) ? coil_start : coil_floor + (layer - 1) * layer_height;
    const double x1 = coil_floor + layer * layer_height;
    shapes.push_back({add_slot_rectangle(x0, x1, s.slot.width), {RegionKind::coil, layer}});
  }
  return shapes;
}

}  // namespace

int add_annular_sector(double r_in, double r_out, double a0, double a1) {
  const int centre = occ::addPoint(0.0, 0.0, 0.0);
  const int out0 = add_polar_point(r_out, a0);
  const int out1 = add_polar_point(r_out, a1);
  std::vector<int> loop;
  const auto append = [&loop](const std::vector<int>& arcs) { loop.insert(loop.end(), arcs.begin(), arcs.end()); };
  if (r_in > 0.0) {
    const int in0 = add_polar_point(r_in, a0);
    const int in1 = add_polar_point(r_in, a1);
    loop.push_back(occ::addLine(in0, out0));
    append(add_arc(centre, r_out, out0, a0, out1, a1));
    loop.push_back(occ::addLine(out1, in1));
    append(add_arc(centre, r_in, in1, a1, in0, a0));
    occ::remove({{0, centre}});  // only the arcs needed it
  } else {
    loop.push_back(occ::addLine(centre, out0));
    append(add_arc(centre, r_out, out0, a0, out1, a1));
    loop.push_back(occ::addLine(out1, centre));
  }
  return occ::addPlaneSurface({occ::addCurveLoop(loop)});
}

std::vector<Piece> fragment_domain(int domain, const std::vector<Piece>& shapes, PieceKind rest) {
  gmsh::vectorpair tools, out;
  for (const auto& shape : shapes) tools.push_back({2, shape.tag});
  std::vector<gmsh::vectorpair> children;
  occ::fragment({{2, domain}}, tools, out, children);

  std::vector<Piece> pieces;
  gmsh::vectorpair outside;
  for (const auto& [dim, tag] : out) {
    if (dim != 2) continue;
    if (!contains(children[0], tag)) {  // part of a shape outside the domain
      outside.push_back({2, tag});
      continue;
    }
    PieceKind kind = rest;
    for (std::size_t i = 0; i < shapes.size(); ++i)
      if (contains(children[i + 1], tag)) kind = shapes[i].kind;
    pieces.push_back({tag, kind});
  }
  occ::remove(outside, true);
  return pieces;
}

namespace {

/// The slot pitch centred on slot 1: iron with the slot's pieces cut out, and the gap band.
std::vector<Piece> build_slotted_pieces(const Geometry& g, const SlotLayers& layers) {
  const StatorGeometry& s = g.stator;
  const double a = std::numbers::pi / s.n_positions;
  const int stator = add_annular_sector(s.bore_radius, s.outer_radius, -a, a);
  // What is not slot is iron; the slot shapes' parts below the bore are dropped.
  const std::vector<Piece> pieces = fragment_domain(stator, slot_shapes(s, layers), {RegionKind::stator_iron, 0});
  const int gap = add_annular_sector(g.mid_gap_radius(), s.bore_radius, -a, a);
  return fragment_pieces(pieces, {gap, {RegionKind::gap, 0}});
}

}  // namespace

std::vector<Piece> build_stator_pieces(const Geometry& g, const SlotLayers& layers) {
  const StatorGeometry& s = g.stator;
  std::vector<Piece> pieces = s.kind == StatorKind::salient    ? build_salient_pieces(g)
                              : s.kind == StatorKind::slotless ? build_slotless_pieces(g, layers)
                                                               : build_slotted_pieces(g, layers);
  if (s.boundary_radius <= s.outer_radius) return pieces;
  // A yoke that does not keep the field in (an air-cored or thin one) needs air round the stator
  // out to where A = 0 is a fair boundary.
  const double a = std::numbers::pi / s.n_positions;
  const int ring = add_annular_sector(s.outer_radius, s.boundary_radius, -a, a);
  return fragment_pieces(pieces, {ring, {RegionKind::outer_air, 0}});
}

std::vector<Piece> build_image_pieces(const Geometry& g) {
  const double a = std::numbers::pi / g.stator.n_positions;
  return {{add_annular_sector(0.0, g.stator.boundary_radius, -a, a), {RegionKind::exterior_image, 0}}};
}

std::vector<Piece> build_rotor_pieces(const Geometry& g, double a0, double a1) {
  const RotorGeometry& r = g.rotor;
  if (r.kind == RotorKind::surface_magnet) return build_magnet_rotor_pieces(g, a0, a1);
  if (r.kind == RotorKind::slotted) return build_slotted_rotor_pieces(g, a0, a1);
  std::vector<Piece> rings;
  // An iron rotor's iron ends where its sleeve (if any) begins; a shaft may sit inside the iron.
  const double iron_outer = r.outer_radius - r.sleeve_thickness;
  if (r.kind == RotorKind::none) {
    rings.push_back({add_annular_sector(0.0, r.outer_radius, a0, a1), {RegionKind::bore_air, 0}});
  } else if (r.shaft_radius > 0.0) {
    rings.push_back({add_annular_sector(0.0, r.shaft_radius, a0, a1), {RegionKind::shaft, 0}});
    rings.push_back({add_annular_sector(r.shaft_radius, iron_outer, a0, a1), {RegionKind::rotor_iron, 0}});
  } else {
    rings.push_back({add_annular_sector(0.0, iron_outer, a0, a1), {RegionKind::rotor_iron, 0}});
  }
  if (r.kind == RotorKind::iron && r.sleeve_thickness > 0.0)
    rings.push_back({add_annular_sector(iron_outer, r.outer_radius, a0, a1), {RegionKind::rotor_sleeve, 0}});
  const Piece gap{add_annular_sector(r.outer_radius, g.mid_gap_radius(), a0, a1), {RegionKind::gap, 0}};
  return fragment_pieces(rings, gap);
}

std::vector<Piece> fragment_pieces(const std::vector<Piece>& pieces, const Piece& added) {
  gmsh::vectorpair objects, out;
  for (const auto& p : pieces) objects.push_back({2, p.tag});
  std::vector<gmsh::vectorpair> children;
  occ::fragment(objects, {{2, added.tag}}, out, children);
  std::vector<Piece> result;
  for (std::size_t i = 0; i <= pieces.size(); ++i) {
    const PieceKind kind = (i < pieces.size()) ? pieces[i].kind : added.kind;
    for (const auto& [dim, tag] : children[i])
      if (dim == 2) result.push_back({tag, kind});
  }
  return result;
}

}  // namespace tf::mesh::detail
