// Meshing one sector: periodic cuts, an equally divided sliding arc, sizes from a rule,
// then the triangles and boundary node lists read back from Gmsh.

#include "mesh/sector.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>
#include <string>
#include <unordered_map>

#include <gmsh.h>

#include "mesh/gmsh_session.hpp"
#include "mesh/isolated.hpp"
#include "mesh/sector_bytes.hpp"
#include "mesh/sector_shapes.hpp"

namespace tf::mesh::detail {
namespace {

struct Boundaries {
  std::vector<int> start_cut, end_cut, sliding, outer;  // Gmsh curve tags
};

struct SectorFrame {
  double start_angle, span, sliding_radius, outer_radius, tolerance;
};

/// Distance of (x, y) from the ray at angle a; points behind the origin count as far.
double distance_to_ray(double x, double y, double a) {
  const double along = x * std::cos(a) + y * std::sin(a);
  const double across = -x * std::sin(a) + y * std::cos(a);
  return along < -1e-12 ? 1e30 : std::abs(across);
}

/// Sorts each curve by where three points on it lie (OCC bounding boxes are padded, so we evaluate).
Boundaries classify_curves(const SectorFrame& f) {
  gmsh::vectorpair curves;
  gmsh::model::getEntities(curves, 1);
  Boundaries b;
  const double end_angle = f.start_angle + f.span;
  for (const auto& [dim, tag] : curves) {
    std::vector<double> lo, hi, xyz;
    gmsh::model::getParametrizationBounds(1, tag, lo, hi);
    gmsh::model::getValue(1, tag, {lo[0], 0.5 * (lo[0] + hi[0]), hi[0]}, xyz);
    bool on_start = true, on_end = true, on_sliding = true, on_outer = f.outer_radius > 0.0;
    for (int k = 0; k < 3; ++k) {
      const double x = xyz[3 * k], y = xyz[3 * k + 1], r = std::hypot(x, y);
      on_start &= distance_to_ray(x, y, f.start_angle) < f.tolerance;
      on_end &= distance_to_ray(x, y, end_angle) < f.tolerance;
      on_sliding &= std::abs(r - f.sliding_radius) < f.tolerance;
      on_outer &= std::abs(r - f.outer_radius) < f.tolerance;
    }
    if (on_start) b.start_cut.push_back(tag);
    if (on_end) b.end_cut.push_back(tag);
    if (on_sliding) b.sliding.push_back(tag);
    if (on_outer) b.outer.push_back(tag);
  }
  return b;
}

double mid_radius(int curve) {
  std::vector<double> lo, hi, xyz;
  gmsh::model::getParametrizationBounds(1, curve, lo, hi);
  gmsh::model::getValue(1, curve, {0.5 * (lo[0] + hi[0])}, xyz);
  return std::hypot(xyz[0], xyz[1]);
}

/// The end cut is the start cut turned by the span: Gmsh then gives both the same nodes.
void make_cuts_periodic(Boundaries& b, double span) {
  if (b.start_cut.size() != b.end_cut.size() || b.start_cut.empty())
    throw MeshError("sector cuts do not match: " + std::to_string(b.start_cut.size()) + " curves on one side, " +
                    std::to_string(b.end_cut.size()) + " on the other");
  auto by_radius = [](int p, int q) { return mid_radius(p) < mid_radius(q); };
  std::sort(b.start_cut.begin(), b.start_cut.end(), by_radius);
  std::sort(b.end_cut.begin(), b.end_cut.end(), by_radius);
  const double c = std::cos(span), s = std::sin(span);
  gmsh::model::mesh::setPeriodic(1, b.end_cut, b.start_cut, {c, -s, 0, 0, s, c, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1});
}

std::vector<int> curve_nodes(const std::vector<int>& curves, const std::unordered_map<std::size_t, int>& index) {
  std::vector<int> nodes;
  for (int c : curves) {
    std::vector<std::size_t> tags;
    std::vector<double> xyz, uv;
    gmsh::model::mesh::getNodes(tags, xyz, uv, 1, c, true, false);
    for (std::size_t t : tags) nodes.push_back(index.at(t));
  }
  std::sort(nodes.begin(), nodes.end());
  nodes.erase(std::unique(nodes.begin(), nodes.end()), nodes.end());
  return nodes;
}

void read_triangles(const std::vector<Piece>& pieces, const std::unordered_map<std::size_t, int>& index,
                    SectorMesh& out) {
  std::vector<Eigen::Vector3i> tris;
  for (const Piece& p : pieces) {
    const auto it = std::find(out.pieces.begin(), out.pieces.end(), p.kind);
    const int label = static_cast<int>(it - out.pieces.begin());
    if (it == out.pieces.end()) out.pieces.push_back(p.kind);
    std::vector<std::size_t> tags, nodes;
    gmsh::model::mesh::getElementsByType(2, tags, nodes, p.tag);
    for (std::size_t e = 0; e < tags.size(); ++e) {
      Eigen::Vector3i t(index.at(nodes[3 * e]), index.at(nodes[3 * e + 1]), index.at(nodes[3 * e + 2]));
      const Eigen::Vector2d a = out.nodes.row(t(1)) - out.nodes.row(t(0));
      const Eigen::Vector2d b = out.nodes.row(t(2)) - out.nodes.row(t(0));
      if (a(0) * b(1) - a(1) * b(0) < 0.0) std::swap(t(1), t(2));
      tris.push_back(t);
      out.triangle_piece.push_back(label);
    }
  }
  out.triangles.resize(static_cast<Eigen::Index>(tris.size()), 3);
  for (std::size_t e = 0; e < tris.size(); ++e) out.triangles.row(static_cast<Eigen::Index>(e)) = tris[e].transpose();
}

/// Divides an arc (one curve, or two equal halves when the sector spans half a turn) into equal segments.
void divide_arc(const std::vector<int>& arc, int n_segments, const char* what) {
  const int n_arcs = static_cast<int>(arc.size());
  if (n_arcs < 1 || n_arcs > 2 || n_segments % n_arcs != 0)
    throw MeshError(std::string("the ") + what + " of a sector is " + std::to_string(n_arcs) + " curves for " +
                    std::to_string(n_segments) + " segments");
  for (int c : arc) gmsh::model::mesh::setTransfiniteCurve(c, n_segments / n_arcs + 1);
}

/// n_sliding_segments 0: the sector has no sliding arc (the exterior image); n_outer_segments > 0:
/// the outer arc is divided equally too, so that another sector can be tied to it node by node.
SectorMesh mesh_pieces(const std::vector<Piece>& pieces, const SectorFrame& f, int n_sliding_segments,
                       const SizeRule& size, int n_outer_segments = 0) {
  gmsh::model::occ::synchronize();
  Boundaries b = classify_curves(f);
  make_cuts_periodic(b, f.span);
  if (n_sliding_segments > 0) divide_arc(b.sliding, n_sliding_segments, "sliding arc");
  if (n_outer_segments > 0) divide_arc(b.outer, n_outer_segments, "outer arc");
  gmsh::model::mesh::setSizeCallback([&size](int, int, double x, double y, double) { return size(x, y); });
  gmsh::model::mesh::generate(2);
  gmsh::model::mesh::removeSizeCallback();

  SectorMesh out;
  out.start_angle = f.start_angle;
  out.span = f.span;
  std::vector<std::size_t> tags;
  std::vector<double> xyz, uv;
  gmsh::model::mesh::getNodes(tags, xyz, uv, -1, -1, false, false);
  std::unordered_map<std::size_t, int> index;
  out.nodes.resize(static_cast<Eigen::Index>(tags.size()), 2);
  for (std::size_t i = 0; i < tags.size(); ++i) {
    index[tags[i]] = static_cast<int>(i);
    out.nodes.row(static_cast<Eigen::Index>(i)) << xyz[3 * i], xyz[3 * i + 1];
  }
  read_triangles(pieces, index, out);
  auto by_radius = [&](int p, int q) { return out.nodes.row(p).norm() < out.nodes.row(q).norm(); };
  auto angle = [&](int p) { return std::remainder(std::atan2(out.nodes(p, 1), out.nodes(p, 0)) - f.start_angle, 2 * std::numbers::pi); };
  out.start_cut = curve_nodes(b.start_cut, index);
  out.end_cut = curve_nodes(b.end_cut, index);
  std::sort(out.start_cut.begin(), out.start_cut.end(), by_radius);
  std::sort(out.end_cut.begin(), out.end_cut.end(), by_radius);
  out.sliding = curve_nodes(b.sliding, index);
  std::sort(out.sliding.begin(), out.sliding.end(), [&](int p, int q) { return angle(p) < angle(q); });
  out.outer = curve_nodes(b.outer, index);
  std::sort(out.outer.begin(), out.outer.end(), [&](int p, int q) { return angle(p) < angle(q); });
  return out;
}

/// What is meshed, for messages: the piece, and which dimensions to look at when Gmsh fails on it.
struct Meshed {
  std::string piece;  ///< "rotor sector (magnets)"
  std::string check;  ///< "the rotor's dimensions (shaft, magnets)"
};

/// The mesh the child sent, or a MeshError naming the piece and how the mesher failed. Our own
/// MeshErrors say what went wrong already and pass through as they are.
SectorMesh sector_or_throw(const Meshed& m, const ChildOutcome& o) {
  if (o.end == ChildEnd::result) return decode_sector(o.text);
  if (o.end == ChildEnd::mesh_error) throw MeshError(o.text);
  std::string why = o.end == ChildEnd::exception ? o.text : "the mesher " + o.how + (o.text.empty() ? "" : ": " + o.text);
  if (why.empty()) why = "an unknown error";
  throw MeshError("meshing the " + m.piece + " failed inside Gmsh: " + why +
                  "; the smallest parts of that sector are the usual cause: check " + m.check);
}

/// Meshes in a child process with a Gmsh session of its own (mesh/isolated.hpp says why), so that
/// not even an abort inside Gmsh can end this process.
template <class Build>
SectorMesh in_child(const Meshed& m, Build build) {
  return sector_or_throw(m, run_in_child([&] {
    const GmshSession session;
    try {
      return encode_sector(build());
    } catch (const std::exception&) {
      throw;
    } catch (...) {  // Gmsh 4.8 throws bare values; its log keeps the words
      std::string last;
      gmsh::logger::getLastError(last);
      throw std::runtime_error(last);
    }
  }));
}

/// The parts of the rotor whose sizes matter to the mesher, as a list for messages.
std::string rotor_parts(const RotorGeometry& r) {
  std::string parts = r.shaft_radius > 0.0 ? "shaft" : "";
  auto add = [&](const char* part) { parts += (parts.empty() ? "" : ", ") + std::string(part); };
  if (r.sleeve_thickness > 0.0) add("sleeve");
  if (r.kind == RotorKind::surface_magnet) add("magnets and the air between them");
  if (r.kind == RotorKind::slotted) add("bars and their openings");
  return parts.empty() ? "radius" : parts;
}

Meshed rotor_meshed(const RotorGeometry& r) {
  const char* kind = r.kind == RotorKind::surface_magnet ? "magnets"
                     : r.kind == RotorKind::slotted      ? "bars"
                     : r.kind == RotorKind::iron         ? "smooth iron"
                                                         : "no rotor: air";
  return {std::string("rotor sector (") + kind + ")", "the rotor's dimensions (" + rotor_parts(r) + ")"};
}

Meshed stator_meshed(StatorKind kind) {
  if (kind == StatorKind::salient)
    return {"stator pole pitch", "the stator's dimensions (pole shoes, bodies and coil sides)"};
  if (kind == StatorKind::slotless)
    return {"stator belt pitch", "the stator's dimensions (conductor sectors, the air between them, the iron ring)"};
  return {"stator slot pitch", "the stator's dimensions (slots, their openings and tooth tips)"};
}

}  // namespace

SectorMesh mesh_stator_sector(const Geometry& g, const SlotLayers& layers, int n_sliding_segments, const SizeRule& size,
                              int n_outer_segments) {
  return in_child(stator_meshed(g.stator.kind), [&] {
    const double a = std::numbers::pi / g.stator.n_positions;
    // A = 0 on the outermost circle: the stator's outer surface, or the boundary beyond it.
    const double outer = std::max(g.stator.outer_radius, g.stator.boundary_radius);
    const SectorFrame f{-a, 2 * a, g.mid_gap_radius(), outer, 1e-6 * outer};
    return mesh_pieces(build_stator_pieces(g, layers), f, n_sliding_segments, size, n_outer_segments);
  });
}

SectorMesh mesh_exterior_image(const Geometry& g, int n_outer_segments, const SizeRule& size) {
  return in_child({"exterior image", "the boundary radius"}, [&] {
    const double a = std::numbers::pi / g.stator.n_positions, r = g.stator.boundary_radius;
    const SectorFrame f{-a, 2 * a, -1.0, r, 1e-6 * r};
    return mesh_pieces(build_image_pieces(g), f, 0, size, n_outer_segments);
  });
}

SectorMesh mesh_rotor_sector(const Geometry& g, int n_sectors, double start_angle, int n_sliding_segments,
                             const SizeRule& size) {
  return in_child(rotor_meshed(g.rotor), [&] {
    const double span = 2 * std::numbers::pi / n_sectors;
    const SectorFrame f{start_angle, span, g.mid_gap_radius(), 0.0, 1e-6 * g.stator.outer_radius};
    return mesh_pieces(build_rotor_pieces(g, start_angle, start_angle + span), f, n_sliding_segments, size);
  });
}

}  // namespace tf::mesh::detail
