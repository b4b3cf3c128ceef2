// The report's cross-section checked against references outside the drawing code: flux lines of
// fields whose contours are known in closed form, the weighted percentile by its definition, the
// coil labels against the winding layout and the textbook phase-belt order, the magnet arrows
// against the remanence the solver loads, and the flux lines of an unfolded sector against those
// of the whole model solved as such.

#include <algorithm>
#include <cmath>
#include <numbers>
#include <string>
#include <vector>

#include <doctest/doctest.h>

#include <Eigen/Geometry>

#include "post/cross_section.hpp"
#include "post/flux_density.hpp"
#include "post/flux_lines.hpp"
#include "post/svg_frame.hpp"
#include "solver/magnets.hpp"
#include "support/polar_mesh.hpp"
#include "support/sector_machine.hpp"

using namespace tf;
namespace svg = tf::post::svg;

namespace {

struct Grid {
  Eigen::MatrixX2d nodes;
  Eigen::MatrixX3i triangles;
};

/// The unit square in n by n cells, each cut into two counter-clockwise triangles, its interior
/// nodes moved by up to 0.3 of a cell (a fixed pseudo-random pattern) so that edges do not line up.
Grid square_mesh(int n) {
  Grid g;
  g.nodes.resize((n + 1) * (n + 1), 2);
  for (int j = 0; j <= n; ++j)
    for (int i = 0; i <= n; ++i) {
      const bool inside = i > 0 && i < n && j > 0 && j < n;
      const double dx = inside ? 0.3 * std::sin(12.9898 * i + 78.233 * j) : 0.0;
      const double dy = inside ? 0.3 * std::cos(39.3468 * i + 11.135 * j) : 0.0;
      g.nodes.row(j * (n + 1) + i) << (i + dx) / n, (j + dy) / n;
    }
  g.triangles.resize(2 * n * n, 3);
  for (int j = 0, t = 0; j < n; ++j)
    for (int i = 0; i < n; ++i) {
      const int a = j * (n + 1) + i, b = a + 1, c = a + n + 2, d = a + n + 1;
      g.triangles.row(t++) << a, b, c;
      g.triangles.row(t++) << a, c, d;
    }
  return g;
}

double length(const post::Polyline& p) {
  double sum = 0.0;
  for (std::size_t i = 1; i < p.size(); ++i) sum += (p[i] - p[i - 1]).norm();
  return sum;
}

const svg::MapLines& lines_of(const svg::FieldMap& map, const std::string& css_class) {
  const auto it = std::find_if(map.overlay.lines.begin(), map.overlay.lines.end(),
                               [&](const svg::MapLines& l) { return l.css_class == css_class; });
  REQUIRE(it != map.overlay.lines.end());
  return *it;
}

double total_length(const svg::MapLines& l) {
  double sum = 0.0;
  for (const auto& p : l.lines) sum += length(p);
  return sum;
}

}  // namespace

TEST_CASE("flux lines of A = x are the straight lines x = level, equally spaced, at the exact positions") {
  // Exact: a first-order element interpolates a linear field exactly (the patch-test argument), so
  // its contour A = c is the straight line x = c, crossing the square from bottom to top.
  const Grid g = square_mesh(12);
  const Eigen::VectorXd a = g.nodes.col(0);
  const std::vector<double> levels = post::contour_levels(0.0, 1.0, 10);
  REQUIRE(levels.size() == 10);
  for (std::size_t k = 0; k < levels.size(); ++k) {
    CAPTURE(k);
    CHECK(levels[k] == doctest::Approx(0.05 + 0.1 * k).epsilon(1e-14).scale(0));
    const auto lines = post::contour(g.nodes, g.triangles, a, levels[k]);
    REQUIRE(lines.size() == 1);  // one line, joined across every edge it crosses
    const post::Polyline& line = lines[0];
    for (const auto& p : line) CHECK(std::abs(p.x() - levels[k]) < 1e-12);
    CHECK(std::min(line.front().y(), line.back().y()) == 0.0);
    CHECK(std::max(line.front().y(), line.back().y()) == 1.0);
    CHECK(length(line) == doctest::Approx(1.0).epsilon(1e-12).scale(0));  // straight: no back and forth
  }
}

TEST_CASE("flux lines of A = r^2 through the mesh's rings are closed circles of exactly those radii") {
  // Exact: on a ring of nodes at radius R, A = R^2 at every node, so the contour A = R^2 runs along
  // the ring's chords, whose ends lie on the circle r = R.
  const mesh::Mesh m = testing::polar_mesh(0.002, {{0.01, 8, mesh::RegionKind::rotor_iron, "core"}}, 40);
  std::vector<double> radii;
  for (int i = 0; i < m.n_nodes(); ++i) radii.push_back(m.nodes.row(i).norm());
  std::sort(radii.begin(), radii.end());
  radii.erase(std::unique(radii.begin(), radii.end(), [](double x, double y) { return std::abs(x - y) < 1e-12; }),
              radii.end());
  REQUIRE(radii.size() == 9);
  // A = R^2 with each node's ring radius R, so that rounding in x^2 + y^2 does not scatter a ring's
  // nodes to either side of the level (the field is then flat along the chords).
  Eigen::VectorXd a(m.n_nodes());
  for (int i = 0; i < m.n_nodes(); ++i) {
    const double r = m.nodes.row(i).norm();
    const double ring = *std::min_element(radii.begin(), radii.end(),
                                          [&](double x, double y) { return std::abs(x - r) < std::abs(y - r); });
    a(i) = ring * ring;
  }
  for (std::size_t k = 1; k + 1 < radii.size(); ++k) {  // the rings inside the mesh
    CAPTURE(radii[k]);
    const auto lines = post::contour(m.nodes, m.triangles, a, radii[k] * radii[k]);
    REQUIRE(lines.size() == 1);
    CHECK((lines[0].front() - lines[0].back()).norm() < 1e-15);  // closed
    CHECK(lines[0].size() >= 41);
    for (const auto& p : lines[0]) CHECK(std::abs(p.norm() - radii[k]) < 1e-9 * radii[k]);
  }
}

TEST_CASE("the weighted quantile: the smallest value whose cumulative weight reaches the fraction") {
  // Definition 1 of Hyndman and Fan, "Sample quantiles in statistical packages", The American
  // Statistician 50(4), 1996 (the inverse of the empirical distribution function), with weights.
  Eigen::VectorXd v = Eigen::VectorXd::LinSpaced(1000, 1.0, 1000.0), w = Eigen::VectorXd::Ones(1000);
  CHECK(svg::weighted_quantile(v, w, 0.995) == 995.0);
  CHECK(svg::weighted_quantile(v, w, 1.0) == 1000.0);
  std::reverse(v.begin(), v.end());  // the order of the triangles does not matter
  CHECK(svg::weighted_quantile(v, w, 0.995) == 995.0);
  // By area: a large triangle of 0 T holding 99.6 % of the area sets the 99.5th percentile alone.
  Eigen::VectorXd b(5), area(5);
  b << 3.1, 0.0, 2.0, 2.5, 1.0;
  area << 1.0, 996.0, 1.0, 1.0, 1.0;
  CHECK(svg::weighted_quantile(b, area, 0.995) == 0.0);
  CHECK(svg::weighted_quantile(b, area, 0.998) == 2.0);
}

TEST_CASE("a singular triangle does not set the colour scale: clipped, drawn in magenta, and the bar says so") {
  const mesh::Mesh m = testing::polar_mesh(0.0, {{0.01, 6, mesh::RegionKind::rotor_iron, "core"}}, 24);
  svg::FieldMap map;
  map.title = "field", map.value = {"|B|", "T"}, map.nodes = &m.nodes, map.triangles = &m.triangles;
  map.values = Eigen::VectorXd::LinSpaced(m.n_triangles(), 0.1, 1.5);
  map.clip_fraction = 0.995;
  // A ramp reaches its 99.5th percentile within 5 % of its range of the maximum: no clipping.
  const std::string smooth = svg::field_map(map);
  CHECK(smooth.find(svg::kOverRangeColour) == std::string::npos);
  CHECK(smooth.find("clipped") == std::string::npos);
  // One small triangle at 31 T (a singular corner; it holds under 0.5 % of the area).
  int smallest = 0;
  for (int t = 0; t < m.n_triangles(); ++t)
    if (mesh::triangle_area(m, t) < mesh::triangle_area(m, smallest)) smallest = t;
  double total = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t) total += mesh::triangle_area(m, t);
  REQUIRE(mesh::triangle_area(m, smallest) < 0.005 * total);
  map.values(smallest) = 31.0;
  const std::string s = svg::field_map(map);
  const auto over = s.find("fill=\"" + std::string(svg::kOverRangeColour) + "\" stroke=\"" + svg::kOverRangeColour);
  REQUIRE(over != std::string::npos);
  const auto end = s.find("/>", over);
  CHECK(std::count(s.begin() + static_cast<long>(over), s.begin() + static_cast<long>(end), 'Z') == 1);  // that triangle only
  CHECK(s.find("clipped at the 99.5th percentile") != std::string::npos);
  CHECK(s.find("max 31 T") != std::string::npos);
  CHECK(s.find("&gt; 1.5") != std::string::npos);  // the bar ends at the largest value below the spike
}

TEST_CASE("every coil side of an unfolded sector is labelled with its phase and direction, in its slot") {
  const mesh::Geometry g = testing::magnet_machine();
  const mesh::Winding w = testing::magnet_machine_winding(g);
  const auto [full, sector] = testing::full_and_sector(g, w);
  REQUIRE(sector.symmetry.copies == 4);
  const Eigen::VectorXd a = Eigen::VectorXd::Zero(sector.n_nodes()), b = Eigen::VectorXd::Ones(sector.n_triangles());
  const post::CrossSection s = post::cross_section({sector, w, a, b, 0.0, "test", "A_z"});
  const svg::FieldMap map = post::section_map(s);
  const auto& labels = map.overlay.labels;
  CHECK(labels.size() == w.sides.size());  // 24 slots x 2 layers, not the sector's 6 x 2
  const int q = w.n_positions;
  const double pitch = 2 * std::numbers::pi / q;
  std::vector<std::string> layer_1(q);
  for (const mesh::CoilSide& side : w.sides) {
    CAPTURE(side.slot);
    CAPTURE(side.layer);
    // The label in this slot and layer: at the slot's angle (the layout's), layer 1 nearer the gap.
    int found = 0;
    for (const auto& l : labels) {
      const double off = std::remainder(std::atan2(l.at.y(), l.at.x()) - side.angle, 2 * std::numbers::pi);
      if (std::abs(off) > 0.25 * pitch) continue;
      const bool inner = l.at.norm() < g.stator.bore_radius + 0.5 * g.stator.slot.depth;
      if (inner != (side.layer == 1)) continue;
      ++found;
      CHECK(l.text == post::coil_label(side));
      CHECK(l.colour == svg::series_colour(side.phase));
    }
    CHECK(found == 1);
    if (side.layer == 1) layer_1[side.slot - 1] = post::coil_label(side);
  }
  // The textbook order of 60-degree phase belts, q = 2, counter-clockwise from slot 1: A+ A+ C− C−
  // B+ B+ A− A− C+ C+ B− B− twice round the 4-pole bore (Pyrhönen, Jokinen, Hrabovcová, Design of
  // Rotating Electrical Machines, Wiley 2008, ch. 2; from memory).
  const std::vector<std::string> belts{"A+", "A+", "C−", "C−", "B+", "B+", "A−", "A−", "C+", "C+", "B−", "B−"};
  for (int slot = 0; slot < q; ++slot) CHECK(layer_1[slot] == belts[slot % 12]);
}

TEST_CASE("each magnet gets one arrow along the remanence the solver loads, also with the rotor turned") {
  const mesh::Geometry g = testing::magnet_machine();
  const mesh::Winding w = testing::magnet_machine_winding(g);
  const auto [full, sector] = testing::full_and_sector(g, w);
  const solver::MagnetLayout layout = solver::magnet_layout(g.rotor);
  const double pitch = 2 * std::numbers::pi / static_cast<double>(sector.sliding.stator_nodes.size() * 4);
  const Eigen::VectorXd a = Eigen::VectorXd::Zero(sector.n_nodes()), b = Eigen::VectorXd::Ones(sector.n_triangles());
  // A quarter and a few pitches: the drawn rotor piece is then the model's image, field and magnets signed.
  for (double rotor_angle : {0.0, 3 * pitch, std::numbers::pi / 2 + 3 * pitch, -std::numbers::pi / 2 + pitch}) {
    CAPTURE(rotor_angle);
    const post::CrossSection s = post::cross_section({sector, w, a, b, rotor_angle, "test", "A_z"});
    const auto& arrows = post::section_map(s).overlay.arrows;
    REQUIRE(arrows.size() == 4);  // magnets a cut splits are one magnet
    for (const auto& arrow : arrows) {
      const Eigen::Vector2d mid = 0.5 * (arrow.tail + arrow.head);
      // The pole of the turned rotor standing here, and the remanence in its own frame, turned.
      const double own_angle = std::atan2(mid.y(), mid.x()) - rotor_angle;
      const int pole = static_cast<int>(std::lround(own_angle / (std::numbers::pi / 2)) % 4 + 4) % 4 + 1;
      const Eigen::Vector2d own = Eigen::Rotation2Dd(-rotor_angle) * mid;
      const Eigen::Vector2d b_rem = Eigen::Rotation2Dd(rotor_angle) * solver::remanence(layout, 1.0, pole, own);
      CAPTURE(pole);
      CHECK((arrow.head - arrow.tail).normalized().dot(b_rem.normalized()) > 0.999);
    }
  }
}

TEST_CASE("flux lines of an unfolded anti-periodic sector are the whole model's, continuous across the cuts") {
  // The whole model is the reference (tests/post/test_whole_machine.cpp: its triangles are the
  // sector's copies, its field the sector's times (-1)^k), so the contours must match length for
  // length; lines end only on the outer circle or at the sliding circle's seam, never at a cut.
  const mesh::Geometry g = testing::magnet_machine();
  const mesh::Winding w = testing::magnet_machine_winding(g);
  const auto [full, sector] = testing::full_and_sector(g, w);
  const std::vector<double> currents = testing::three_phase_currents(20.0, std::numbers::pi / 6);
  const Eigen::VectorXd a_full = testing::linear_field(full, g, w, currents, 0);
  const Eigen::VectorXd a_sector = testing::linear_field(sector, g, w, currents, 0);
  const auto section = [&](const mesh::Mesh& m, const Eigen::VectorXd& a) {
    return post::cross_section({m, w, a, post::flux_density(m, a).rowwise().norm(), 0.0, "test", "A_z"});
  };
  const post::CrossSection whole = section(full, a_full), unfolded = section(sector, a_sector);
  const svg::FieldMap whole_map = post::section_map(whole), unfolded_map = post::section_map(unfolded);
  const svg::MapLines& reference = lines_of(whole_map, "data flux-line");
  const svg::MapLines& lines = lines_of(unfolded_map, "data flux-line");
  CHECK(total_length(reference) > 10 * 2 * std::numbers::pi * g.stator.outer_radius);  // real lines, not a few
  CHECK(total_length(lines) == doctest::Approx(total_length(reference)).epsilon(1e-6).scale(0));
  for (const auto& line : lines.lines)
    for (const Eigen::Vector2d& end : {line.front(), line.back()}) {
      if ((line.front() - line.back()).norm() < 1e-12) continue;  // closed
      const double r = end.norm();
      const bool on_boundary = std::abs(r - g.stator.outer_radius) < 1e-6 || std::abs(r - sector.sliding.radius) < 1e-6;
      CHECK(on_boundary);
    }
  // Without the sign of the odd copies the field jumps at every other cut: different lines.
  post::CrossSection unsigned_copies = unfolded;
  for (int i = 0; i < unsigned_copies.machine.n_nodes(); ++i)
    unsigned_copies.a(i) = a_sector(unsigned_copies.machine.node_source[i]);
  const svg::FieldMap wrong_map = post::section_map(unsigned_copies);
  const svg::MapLines& wrong = lines_of(wrong_map, "data flux-line");
  CHECK(std::abs(total_length(wrong) - total_length(reference)) > 0.01 * total_length(reference));
}
