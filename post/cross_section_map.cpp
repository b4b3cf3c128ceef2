// The drawing of a CrossSection: which triangle edges outline which part, where each coil side's
// label and each magnet's arrow go, and the flux lines.

#include <algorithm>
#include <cmath>
#include <map>

#include <fmt/format.h>

#include "post/cross_section.hpp"
#include "post/flux_lines.hpp"
#include "post/region_outlines.hpp"
#include "post/svg_frame.hpp"
#include "post/tables.hpp"

namespace tf::post {
namespace {

constexpr int kKinds = 64;  // above every RegionKind value: parts numbered from here are one region of one copy

bool drawn_one_by_one(mesh::RegionKind k) {
  return k == mesh::RegionKind::coil || k == mesh::RegionKind::magnet || k == mesh::RegionKind::rotor_bar;
}

/// One part per coil side, magnet and bar of each copy; everything else by its kind, so that iron
/// and air show their outlines but not the cuts and region names that split them.
struct Parts {
  std::vector<int> of_triangle;
  int n_regions = 0;
  int region(int part) const { return (part - kKinds) % n_regions; }
  int copy(int part) const { return (part - kKinds) / n_regions; }
};

/// A magnet or bar that a cut splits lies in two copies: its pieces become one part (the lower
/// number), found as the pieces of the same kind that share an edge.
void merge_split_pieces(const CrossSection& s, Parts& p) {
  std::map<int, int> merged_into;
  const auto root = [&](int part) {
    for (auto it = merged_into.find(part); it != merged_into.end(); it = merged_into.find(part)) part = it->second;
    return part;
  };
  for (const PartEdge& e : part_edges(s.machine.triangles, p.of_triangle)) {
    if (e.inside < kKinds || e.outside < kKinds) continue;
    const mesh::RegionKind a = s.regions[static_cast<std::size_t>(p.region(e.inside))].kind,
                           b = s.regions[static_cast<std::size_t>(p.region(e.outside))].kind;
    if (a != b || a == mesh::RegionKind::coil) continue;  // the layers of a slot stay apart
    const int x = root(e.inside), y = root(e.outside);
    if (x != y) merged_into[std::max(x, y)] = std::min(x, y);
  }
  for (int& part : p.of_triangle) part = root(part);
}

Parts parts(const CrossSection& s) {
  Parts p;
  p.n_regions = static_cast<int>(s.regions.size());
  const WholeMachine& w = s.machine;
  p.of_triangle.resize(static_cast<std::size_t>(w.n_triangles()));
  for (int t = 0; t < w.n_triangles(); ++t) {
    const int r = w.triangle_region(t);
    const mesh::RegionKind kind = s.regions[static_cast<std::size_t>(r)].kind;
    p.of_triangle[static_cast<std::size_t>(t)] =
        drawn_one_by_one(kind) ? kKinds + w.triangle_copy[static_cast<std::size_t>(t)] * p.n_regions + r : static_cast<int>(kind);
  }
  merge_split_pieces(s, p);
  return p;
}

/// Area [m^2] and centroid [m] of each part drawn one by one.
struct PartShape {
  double area = 0.0;
  Eigen::Vector2d centroid = Eigen::Vector2d::Zero();
};
std::map<int, PartShape> part_shapes(const CrossSection& s, const Parts& p) {
  std::map<int, PartShape> out;
  const WholeMachine& w = s.machine;
  for (int t = 0; t < w.n_triangles(); ++t) {
    const int part = p.of_triangle[static_cast<std::size_t>(t)];
    if (part < kKinds) continue;
    const Eigen::Vector2d a = w.nodes.row(w.triangles(t, 0)), b = w.nodes.row(w.triangles(t, 1)),
                          c = w.nodes.row(w.triangles(t, 2));
    const double area = 0.5 * std::abs((b - a).x() * (c - a).y() - (b - a).y() * (c - a).x());
    PartShape& shape = out[part];
    shape.centroid = (shape.area * shape.centroid + area * (a + b + c) / 3.0) / (shape.area + area);
    shape.area += area;
  }
  return out;
}

/// The winding's side in the slot and layer that copy `copy` of a model coil region stands for, or null.
const mesh::CoilSide* side_of(const CrossSection& s, const mesh::Region& r, int copy) {
  const int q = s.winding.n_positions, per_copy = q / s.machine.symmetry.copies;
  const int slot = (r.slot - 1 + copy * per_copy) % q + 1;
  for (const mesh::CoilSide& side : s.winding.sides)
    if (side.slot == slot && side.layer == r.layer) return &side;
  return nullptr;
}

bool on_circle(const Eigen::Vector2d& p, double radius) { return radius > 0 && std::abs(p.norm() - radius) < 1e-7 * radius; }

/// Outlines: every edge between parts once, grouped by the colour it is drawn in.
struct OutlineSets {
  std::vector<KeyedSegment> plain, magnets, bars;
  std::map<int, std::vector<KeyedSegment>> by_phase;
};

OutlineSets outline_sets(const CrossSection& s, const Parts& p) {
  OutlineSets out;
  const Eigen::MatrixX2d& xy = s.machine.nodes;
  for (const PartEdge& e : part_edges(s.machine.triangles, p.of_triangle)) {
    const Eigen::Vector2d a = xy.row(e.from), b = xy.row(e.to);
    const KeyedSegment seg{e.from, e.to, a, b};
    if (e.outside < 0 && on_circle(a, s.sliding_radius) && on_circle(b, s.sliding_radius)) continue;  // the seam
    if (e.inside >= kKinds) {  // each side of a coil, magnet or bar outlined on its own
      const mesh::Region& r = s.regions[static_cast<std::size_t>(p.region(e.inside))];
      if (r.kind == mesh::RegionKind::magnet) out.magnets.push_back(seg);
      else if (r.kind == mesh::RegionKind::rotor_bar) out.bars.push_back(seg);
      else if (const mesh::CoilSide* side = side_of(s, r, p.copy(e.inside))) out.by_phase[side->phase].push_back(seg);
      else out.plain.push_back(seg);
    } else if (e.outside < e.inside) {  // between plain parts (or the boundary): once
      out.plain.push_back(seg);
    }
  }
  return out;
}

constexpr const char* kMagnetColour = "#111111";
constexpr const char* kBarColour = "#b35806";
constexpr const char* kFluxLineColour = "#000000";

void add_parts(const CrossSection& s, const Parts& p, svg::FieldMap& map) {
  OutlineSets sets = outline_sets(s, p);
  svg::MapOverlay& o = map.overlay;
  o.lines.push_back({"outline", "#444444", 0.5, join_segments(sets.plain)});
  for (auto& [phase, segments] : sets.by_phase) {  // on a white casing, which every phase colour stands out from
    std::vector<Polyline> lines = join_segments(segments);
    o.lines.push_back({"coil-casing", "#ffffff", 2.6, lines});
    o.lines.push_back({"coil-outline", svg::series_colour(phase), 1.3, std::move(lines)});
  }
  if (!sets.magnets.empty()) o.lines.push_back({"magnet-outline", kMagnetColour, 1.1, join_segments(sets.magnets)});
  if (!sets.bars.empty()) o.lines.push_back({"bar-outline", kBarColour, 1.1, join_segments(sets.bars)});
  for (const auto& [part, shape] : part_shapes(s, p)) {
    const mesh::Region& r = s.regions[static_cast<std::size_t>(p.region(part))];
    const int copy = p.copy(part);
    const double size = std::sqrt(shape.area);
    if (r.kind == mesh::RegionKind::coil) {
      if (const mesh::CoilSide* side = side_of(s, r, copy))
        o.labels.push_back({shape.centroid, coil_label(*side), svg::series_colour(side->phase), 0.45 * size});
    } else if (r.kind == mesh::RegionKind::magnet && shape.centroid.norm() > 0) {
      // Odd poles are north (mesh/ and solver/magnets.hpp): B_rem outwards along the pole's
      // centre line, radial or parallel alike, which the centroid of a whole magnet lies on.
      const int sign = (r.slot % 2 == 1 ? 1 : -1) * s.machine.symmetry.sign_of_copy(copy) * s.rotor_sign;
      const Eigen::Vector2d half = 0.35 * size * sign * shape.centroid.normalized();
      o.arrows.push_back({shape.centroid - half, shape.centroid + half});
    }
  }
}

}  // namespace

svg::FieldMap section_map(const CrossSection& s) {
  svg::FieldMap map;
  map.title = "Cross-section at " + s.when;
  map.value = {"|B|", "T"};
  if (s.empty()) return map;
  map.nodes = &s.machine.nodes;
  map.triangles = &s.machine.triangles;
  map.values = s.b_magnitude;
  map.clip_fraction = kClipFraction;
  svg::MapLines flux{"data flux-line", kFluxLineColour, 0.8, {}};
  const std::vector<double> levels = contour_levels(s.a.minCoeff(), s.a.maxCoeff(), kFluxLevels);
  for (double level : levels)
    for (Polyline& line : contour(s.machine.nodes, s.machine.triangles, s.a, level)) flux.lines.push_back(std::move(line));
  map.overlay.lines.push_back(std::move(flux));
  add_parts(s, parts(s), map);
  auto& key = map.overlay.key;
  using Symbol = svg::MapKey::Symbol;
  for (int k = 0; k < s.winding.spec.n_phases; ++k)
    key.push_back({Symbol::text, svg::series_colour(k), "phase " + phase_name(k) + " coil side", phase_name(k) + "+"});
  key.push_back({Symbol::text, "#444444", "+: positive current out of the page (+z); −: into it", "+ / −"});
  const double step = levels.size() > 1 ? levels[1] - levels[0] : 0.0;
  key.push_back({Symbol::line, kFluxLineColour,
                 fmt::format("flux lines: {} levels of {}, {} mWb/m apart", levels.size(), s.a_name,
                             svg::format_number(1e3 * step, 3)),
                 ""});
  bool magnets = false, bars = false;
  for (const mesh::Region& r : s.regions)
    magnets |= r.kind == mesh::RegionKind::magnet, bars |= r.kind == mesh::RegionKind::rotor_bar;
  if (magnets) key.push_back({Symbol::arrow, kMagnetColour, "magnetization (B_rem) of each magnet", ""});
  if (bars) key.push_back({Symbol::line, kBarColour, "rotor bar", ""});
  return map;
}

std::string section_caption(const CrossSection& s) {
  if (s.empty()) return "The cross-section (no field to draw).";
  const int copies = s.machine.symmetry.copies;
  const std::string model =
      copies == 1 ? "the whole model as solved"
                  : fmt::format("the solved sector unfolded into {} copies{}", copies,
                                s.machine.symmetry.anti_periodic ? ", every other one with the field's sign reversed" : "");
  const bool open = std::any_of(s.regions.begin(), s.regions.end(),
                                [](const mesh::Region& r) { return r.kind == mesh::RegionKind::exterior_image; });
  return fmt::format(
      "Flux density magnitude |B| per triangle at {}, in {} equal bins from its minimum to its maximum (or to its "
      "{}th percentile by area when a few triangles reach far above it: those are then magenta and the bar gives the "
      "maximum, so that one singular corner does not set the scale). Black: {} flux lines, contours of {}, equally "
      "spaced in flux. Drawn: {}{}. Coil sides are outlined in their phase's colour and labelled with phase and "
      "current direction.",
      s.when, svg::kColourBins, svg::format_number(100 * kClipFraction), kFluxLevels, s.a_name, model,
      open ? "; the open boundary's exterior image is left out" : "");
}

}  // namespace tf::post
