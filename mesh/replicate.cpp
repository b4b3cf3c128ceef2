#include "mesh/replicate.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <numbers>
#include <numeric>
#include <string>

#include "mesh/rotor_shapes.hpp"

namespace tf::mesh::detail {
namespace {

constexpr double kTwoPi = 2 * std::numbers::pi;

/// Disjoint sets over node ids, to merge the nodes that copies share on their cuts.
struct NodeSets {
  std::vector<int> parent;
  explicit NodeSets(int n) : parent(n) { std::iota(parent.begin(), parent.end(), 0); }
  int find(int i) {
    while (parent[i] != i) i = parent[i] = parent[parent[i]];
    return i;
  }
  void join(int i, int j) { parent[find(i)] = find(j); }
};

/// One family of copies of a sector: where its ids start in the combined numbering.
struct Copies {
  const SectorMesh* sector;
  int n_copies;
  int first_id;
  Eigen::Vector2d offset = Eigen::Vector2d::Zero();  ///< where the copies' centre is drawn
  int id(int copy, int node) const { return first_id + copy * static_cast<int>(sector->nodes.rows()) + node; }
  Eigen::Vector2d position(int copy, int node) const {
    const double t = copy * sector->span, c = std::cos(t), s = std::sin(t);
    const Eigen::Vector2d p = sector->nodes.row(node);
    return Eigen::Vector2d(c * p(0) - s * p(1), s * p(0) + c * p(1)) + offset;
  }
  double angle(int copy, int node) const {
    const Eigen::Vector2d p = position(copy, node) - offset;
    return std::atan2(p(1), p(0));
  }
};

/// The nodes of a family's outer arcs, by angle, without repeats: (angle, new node id).
std::vector<std::pair<double, int>> ring(const Copies& c, NodeSets& sets, const std::vector<int>& new_id) {
  std::vector<std::pair<double, int>> nodes;
  for (int k = 0; k < c.n_copies; ++k)
    for (int node : c.sector->outer) nodes.push_back({c.angle(k, node), new_id[sets.find(c.id(k, node))]});
  std::sort(nodes.begin(), nodes.end());
  std::vector<std::pair<double, int>> unique;
  for (const auto& n : nodes)
    if (unique.empty() || unique.back().second != n.second) unique.push_back(n);
  if (unique.size() > 1 && unique.front().second == unique.back().second) unique.pop_back();
  return unique;
}

/// Ties every node of the exterior image's arc to the boundary node at the same angle, and puts
/// A = 0 at the image's centre (infinity).
void tie_exterior(Mesh& m, const Copies& stator, const Copies& image, NodeSets& sets, const std::vector<int>& new_id) {
  const auto outside = ring(stator, sets, new_id), inside = ring(image, sets, new_id);
  if (outside.size() != inside.size())
    throw MeshError("the boundary circle and its exterior image carry different node counts");
  for (std::size_t i = 0; i < outside.size(); ++i) {
    if (std::abs(std::remainder(outside[i].first - inside[i].first, 2 * std::numbers::pi)) > 1e-6)
      throw MeshError("the nodes of the boundary circle and of its exterior image do not face each other");
    m.ties.push_back({inside[i].second, outside[i].second});
  }
  m.outer_nodes = {new_id[sets.find(image.id(0, image.sector->start_cut.front()))]};  // the centre
}

/// Merges each copy's end cut with the next copy's start cut; round the whole circle when `closed`,
/// else (a sector model) the last copy's end cut stays open.
void join_cuts(const Copies& c, NodeSets& sets, double tolerance, bool closed = true) {
  const SectorMesh& s = *c.sector;
  if (s.start_cut.size() != s.end_cut.size())
    throw MeshError("the two cuts of a sector carry " + std::to_string(s.start_cut.size()) + " and " +
                    std::to_string(s.end_cut.size()) + " nodes; periodic meshing failed");
  for (int k = 0; k < (closed ? c.n_copies : c.n_copies - 1); ++k) {
    const int next = (k + 1) % c.n_copies;
    for (std::size_t i = 0; i < s.end_cut.size(); ++i) {
      const Eigen::Vector2d p = c.position(k, s.end_cut[i]), q = c.position(next, s.start_cut[i]);
      if ((p - q).norm() > tolerance) throw MeshError("nodes on neighbouring sector cuts do not coincide");
      sets.join(c.id(k, s.end_cut[i]), c.id(next, s.start_cut[i]));
    }
  }
}

/// Names of per-slot regions: "slot_07_layer_2", "slot_07_opening", "pole_03_coil_1" on a
/// salient-pole stator, "sector_3_layer_1" for a conductor sector of a slotless one. Numbers are
/// padded to the width of the largest, so names sort in order.
std::string padded(int number, int largest) {
  const int digits = static_cast<int>(std::to_string(largest).size());
  std::string text = std::to_string(number);
  text.insert(0, std::max(0, digits - static_cast<int>(text.size())), '0');
  return text;
}

std::string slot_region_name(StatorKind stator, int slot, int n_positions, const PieceKind& kind) {
  const std::string number = padded(slot, n_positions);
  if (stator == StatorKind::salient) return "pole_" + number + "_coil_" + std::to_string(kind.layer);
  if (stator == StatorKind::slotless) return "sector_" + number + "_layer_" + std::to_string(kind.layer);
  if (kind.kind == RegionKind::coil) return "slot_" + number + "_layer_" + std::to_string(kind.layer);
  return "slot_" + number + "_opening";
}

std::string region_name(StatorKind stator, const PieceKind& kind, bool rotor_side) {
  switch (kind.kind) {
    case RegionKind::stator_iron: return "stator_iron";
    case RegionKind::rotor_iron: return "rotor_iron";
    case RegionKind::shaft: return "shaft";
    case RegionKind::rotor_sleeve: return "rotor_sleeve";
    case RegionKind::bore_air: return "bore_air";
    case RegionKind::outer_air: return "outer_air";
    case RegionKind::exterior_image: return "exterior_image";
    case RegionKind::gap: return rotor_side ? "gap_rotor_side" : "gap_stator_side";
    // Shared slot air belongs to two neighbours: the air between two salient poles, or between two
    // conductor sectors of a slotless stator.
    case RegionKind::slot_air: return stator == StatorKind::slotless ? "winding_air" : "interpolar_air";
    case RegionKind::rotor_air: return "rotor_air";
    // Per pole or per bar: named by rotor_region_name.
    case RegionKind::magnet: return "magnet";
    case RegionKind::rotor_bar: return "bar";
    case RegionKind::coil: return "coil";
  }
  return "?";
}

/// Rotor pieces numbered by pole or bar ("magnet_3", "bar_07"): the number of the feature whose
/// centre is nearest to the triangle, since a sector cut may split a magnet or a bar.
bool numbered_on_rotor(RegionKind kind) { return kind == RegionKind::magnet || kind == RegionKind::rotor_bar; }

/// Builds the region table as triangles are added. Coil sides are numbered per copy (slot, pole
/// or conductor sector k, as the winding finds them); so are slot openings, while the air between
/// salient poles or conductor sectors, which no single copy owns, is one region.
struct RegionTable {
  std::vector<Region>& regions;
  StatorKind stator;
  std::map<std::string, int> by_name;
  /// A magnet or bar: `number` is its pole or bar number, of n in all.
  int rotor_index(const PieceKind& kind, int number, int n) {
    const std::string name = region_name(stator, kind, true) + "_" + padded(number, n);
    const auto [it, added] = by_name.emplace(name, static_cast<int>(regions.size()));
    if (added) regions.push_back({name, kind.kind, number, 0});
    return it->second;
  }
  int index(const PieceKind& kind, int slot, int n_positions, bool rotor_side) {
    const bool per_slot = kind.kind == RegionKind::coil ||
                          (kind.kind == RegionKind::slot_air && stator == StatorKind::slotted);
    const std::string name =
        per_slot ? slot_region_name(stator, slot, n_positions, kind) : region_name(stator, kind, rotor_side);
    const auto [it, added] = by_name.emplace(name, static_cast<int>(regions.size()));
    if (added) regions.push_back({name, kind.kind, per_slot ? slot : 0, kind.kind == RegionKind::coil ? kind.layer : 0});
    return it->second;
  }
};

/// The sliding-circle nodes of all copies, in angle order; checks they are equally spaced.
std::vector<int> sliding_nodes(const Copies& c, NodeSets& sets, const std::vector<int>& new_id, double start,
                               double tolerance_angle) {
  std::vector<std::pair<double, int>> by_angle;
  for (int k = 0; k < c.n_copies; ++k)
    for (int node : c.sector->sliding) {
      const Eigen::Vector2d p = c.position(k, node);
      double a = std::atan2(p(1), p(0)) - start;
      a -= kTwoPi * std::floor(a / kTwoPi + 1e-9);
      by_angle.push_back({a, new_id[sets.find(c.id(k, node))]});
    }
  std::sort(by_angle.begin(), by_angle.end());
  std::vector<int> nodes;
  for (const auto& [a, id] : by_angle)
    if (nodes.empty() || nodes.back() != id) nodes.push_back(id);
  if (nodes.size() > 1 && nodes.front() == nodes.back()) nodes.pop_back();
  const double pitch = kTwoPi / static_cast<double>(nodes.size());
  for (std::size_t i = 0; i < by_angle.size(); ++i)
    if (std::abs(std::remainder(by_angle[i].first, pitch)) > tolerance_angle)
      throw MeshError("nodes on the sliding circle are not equally spaced");
  return nodes;
}

/// Sector model: pairs (node on the last copy's end cut, node on copy 0's start cut), by radius.
void pair_open_cuts(const Copies& c, NodeSets& sets, const std::vector<int>& new_id, std::vector<std::pair<int, int>>& out) {
  const SectorMesh& s = *c.sector;
  for (std::size_t i = 0; i < s.end_cut.size(); ++i)
    out.push_back({new_id[sets.find(c.id(c.n_copies - 1, s.end_cut[i]))], new_id[sets.find(c.id(0, s.start_cut[i]))]});
}

/// Sector model: the sliding-arc nodes of one side by position p (angle start + p * pitch), checked
/// to sit on whole pitches; returns the nodes in order, the last one (on the end cut) included.
std::vector<int> sector_sliding_nodes(const Copies& c, NodeSets& sets, const std::vector<int>& new_id, double start,
                                      double pitch, double tolerance_angle, int& first_position) {
  std::vector<std::pair<long, int>> by_position;
  for (int k = 0; k < c.n_copies; ++k)
    for (int node : c.sector->sliding) {
      const Eigen::Vector2d p = c.position(k, node);
      double a = std::atan2(p(1), p(0)) - start;
      a -= kTwoPi * std::floor(a / kTwoPi + 1e-9);
      const long position = std::lround(a / pitch);
      if (std::abs(a - static_cast<double>(position) * pitch) > tolerance_angle)
        throw MeshError("nodes on the sliding arc of the sector are not equally spaced");
      by_position.push_back({position, new_id[sets.find(c.id(k, node))]});
    }
  std::sort(by_position.begin(), by_position.end());
  by_position.erase(std::unique(by_position.begin(), by_position.end()), by_position.end());
  std::vector<int> nodes;
  for (std::size_t i = 0; i < by_position.size(); ++i) {
    if (i > 0 && by_position[i].first != by_position[i - 1].first + 1)
      throw MeshError("the sliding arc of the sector misses or repeats a node");
    nodes.push_back(by_position[i].second);
  }
  first_position = by_position.empty() ? 0 : static_cast<int>(by_position.front().first);
  return nodes;
}

/// Sector model: the sliding circle of one sector of n_sliding_full / copies pitches per side.
void set_sector_sliding(Mesh& m, const Copies& sc, const Copies& rc, NodeSets& sets, const std::vector<int>& new_id,
                        double start, int n_sliding_full) {
  const double pitch = kTwoPi / n_sliding_full;
  int stator_first = 0;
  std::vector<int> stator = sector_sliding_nodes(sc, sets, new_id, start, pitch, 1e-6, stator_first);
  std::vector<int> rotor = sector_sliding_nodes(rc, sets, new_id, start, pitch, 1e-6, m.sliding.rotor_first);
  if (stator_first != 0 || stator.size() != rotor.size() ||
      static_cast<int>(stator.size() - 1) * m.symmetry.copies != n_sliding_full)
    throw MeshError("the stator and rotor arcs of the sector's sliding circle do not match");
  m.sliding.stator_end = stator.back();
  m.sliding.rotor_end = rotor.back();
  stator.pop_back();
  rotor.pop_back();
  m.sliding.stator_nodes = std::move(stator);
  m.sliding.rotor_nodes = std::move(rotor);
}

}  // namespace

Mesh replicate(const Geometry& g, const SectorMesh& stator, int n_stator_copies, const SectorMesh& rotor,
               int n_rotor_copies, const SectorMesh* image, bool anti_periodic) {
  const int n_positions = g.stator.n_positions;
  const bool sector = n_stator_copies < n_positions;  // build.cpp has checked that the sectors close up
  const Copies sc{&stator, n_stator_copies, 0};
  const Copies rc{&rotor, n_rotor_copies, n_stator_copies * static_cast<int>(stator.nodes.rows())};
  const int image_first = rc.first_id + n_rotor_copies * static_cast<int>(rotor.nodes.rows());
  // The exterior image is drawn beside the machine, three boundary radii to the right.
  const Copies ic{image ? image : &stator, image ? n_stator_copies : 0, image_first,
                  Eigen::Vector2d(3.0 * g.stator.boundary_radius, 0.0)};
  const int n_ids = image_first + ic.n_copies * static_cast<int>(ic.sector->nodes.rows());
  const double tolerance = 1e-7 * g.stator.outer_radius;
  NodeSets sets(n_ids);
  join_cuts(sc, sets, tolerance, !sector);
  join_cuts(rc, sets, tolerance, !sector);
  if (image) join_cuts(ic, sets, tolerance);

  Mesh m;
  std::vector<int> new_id(n_ids, -1);
  std::vector<Eigen::Vector2d> xy;
  for (const Copies* c : {&sc, &rc, &ic})
    for (int k = 0; k < c->n_copies; ++k)
      for (int i = 0; i < c->sector->nodes.rows(); ++i) {
        const int root = sets.find(c->id(k, i));
        if (new_id[root] < 0) {
          new_id[root] = static_cast<int>(xy.size());
          xy.push_back(c->position(k, i));
        }
      }
  m.nodes.resize(static_cast<Eigen::Index>(xy.size()), 2);
  for (std::size_t i = 0; i < xy.size(); ++i) m.nodes.row(static_cast<Eigen::Index>(i)) = xy[i].transpose();

  const int n_tri = n_stator_copies * static_cast<int>(stator.triangles.rows()) +
                    n_rotor_copies * static_cast<int>(rotor.triangles.rows()) +
                    ic.n_copies * static_cast<int>(ic.sector->triangles.rows());
  m.triangles.resize(n_tri, 3);
  m.triangle_region.resize(n_tri);
  RegionTable table{m.regions, g.stator.kind, {}};
  const int n_rotor_features =
      g.rotor.kind == RotorKind::surface_magnet ? g.rotor.magnets.n_poles : g.rotor.bars.count;
  int t = 0;
  for (const Copies* c : {&sc, &rc, &ic})
    for (int k = 0; k < c->n_copies; ++k)
      for (int e = 0; e < c->sector->triangles.rows(); ++e, ++t) {
        for (int j = 0; j < 3; ++j) m.triangles(t, j) = new_id[sets.find(c->id(k, c->sector->triangles(e, j)))];
        const PieceKind& kind = c->sector->pieces[c->sector->triangle_piece[e]];
        if (c == &rc && numbered_on_rotor(kind.kind)) {
          Eigen::Vector2d centre = Eigen::Vector2d::Zero();
          for (int j = 0; j < 3; ++j) centre += m.nodes.row(m.triangles(t, j)).transpose() / 3.0;
          m.triangle_region(t) = table.rotor_index(kind, rotor_feature_number(g.rotor, centre), n_rotor_features);
        } else {
          m.triangle_region(t) = table.index(kind, k + 1, n_positions, c == &rc);
        }
      }

  const double angle_tolerance = 1e-6;
  m.sliding.radius = g.mid_gap_radius();
  m.sliding.start_angle = stator.start_angle;
  if (sector) {
    m.symmetry = {n_positions / n_stator_copies, anti_periodic, {}};
    pair_open_cuts(sc, sets, new_id, m.symmetry.cut_pairs);
    pair_open_cuts(rc, sets, new_id, m.symmetry.cut_pairs);
    set_sector_sliding(m, sc, rc, sets, new_id, stator.start_angle, n_positions * (static_cast<int>(stator.sliding.size()) - 1));
  } else {
    m.sliding.stator_nodes = sliding_nodes(sc, sets, new_id, stator.start_angle, angle_tolerance);
    m.sliding.rotor_nodes = sliding_nodes(rc, sets, new_id, stator.start_angle, angle_tolerance);
  }
  if (m.sliding.stator_nodes.size() != m.sliding.rotor_nodes.size())
    throw MeshError("the stator and rotor sides of the sliding circle carry different node counts");
  for (int k = 0; k < n_stator_copies; ++k)
    for (int node : stator.outer) m.outer_nodes.push_back(new_id[sets.find(sc.id(k, node))]);
  std::sort(m.outer_nodes.begin(), m.outer_nodes.end());
  m.outer_nodes.erase(std::unique(m.outer_nodes.begin(), m.outer_nodes.end()), m.outer_nodes.end());
  if (image) tie_exterior(m, sc, ic, sets, new_id);
  m.gap_inner_radius = g.rotor.outer_radius;
  m.gap_outer_radius = g.stator.bore_radius;
  return m;
}

}  // namespace tf::mesh::detail
