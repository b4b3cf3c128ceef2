#include "post/gap_field.hpp"

#include <cmath>
#include <map>
#include <numbers>
#include <string>

#include "solver/p1.hpp"

namespace tf::post {
namespace {

constexpr double kTwoPi = 2 * std::numbers::pi;
using Triplets = std::vector<Eigen::Triplet<double>>;

/// The triangle on each chord (nodes[i], nodes[i+1]) of a node ring; -1 if none. The ring is
/// closed by nodes[0], or by `closing` (a sector model's node on the end cut) when that is >= 0.
std::vector<int> triangles_on_chords(const mesh::Mesh& m, const std::vector<int>& nodes, int closing) {
  std::map<std::pair<int, int>, int> edge_triangle;
  std::vector<char> on_ring(m.n_nodes(), 0);
  for (int n : nodes) on_ring[n] = 1;
  if (closing >= 0) on_ring[closing] = 1;
  for (int t = 0; t < m.n_triangles(); ++t)
    for (int i = 0; i < 3; ++i) {
      const int a = m.triangles(t, i), b = m.triangles(t, (i + 1) % 3);
      if (on_ring[a] && on_ring[b]) edge_triangle[{std::min(a, b), std::max(a, b)}] = t;
    }
  std::vector<int> tri(nodes.size(), -1);
  for (std::size_t i = 0; i < nodes.size(); ++i) {
    const int a = nodes[i], b = i + 1 < nodes.size() ? nodes[i + 1] : (closing >= 0 ? closing : nodes[0]);
    const auto it = edge_triangle.find({std::min(a, b), std::max(a, b)});
    if (it != edge_triangle.end()) tri[i] = it->second;
  }
  return tri;
}

/// The whole circle unfolded from a sector model: position p of n_model * copies is model position
/// p mod n_model in the copy floor(p / n_model), whose field is the model's times its sign.
struct Unfolded {
  int n_model = 0;
  mesh::Symmetry symmetry;
  double span = 0.0;  ///< angle of one copy [rad]
  int index(int p) const { return p - copy(p) * n_model; }
  int copy(int p) const { return p >= 0 ? p / n_model : -((-p + n_model - 1) / n_model); }
  double sign(int p) const { return symmetry.sign_of_copy(copy(p)); }
  /// Angle by which copy(p) is turned from the model; exactly 0 for the full model.
  double turn(int p) const { return symmetry.copies > 1 ? copy(p) * span : 0.0; }
};

/// Adds weight * (B_theta of triangle t at angle phi) as a row of nodal coefficients.
void add_tangential(const mesh::Mesh& m, int t, double phi, double weight, int row, Triplets& out) {
  solver::TriangleXY xy;
  for (int i = 0; i < 3; ++i) xy.row(i) = m.nodes.row(m.triangles(t, i));
  double twice_area = 0.0;
  const auto g = solver::p1_gradients(xy, twice_area);
  // B = (da/dy, -da/dx); B_theta = -sin(phi) B_x + cos(phi) B_y.
  for (int i = 0; i < 3; ++i)
    out.emplace_back(row, m.triangles(t, i), weight * (-std::sin(phi) * g(i, 1) - std::cos(phi) * g(i, 0)));
}

}  // namespace

GapOperators gap_operators(const mesh::Mesh& m, int n_points, int max_order, int rotor_shift) {
  const mesh::SlidingCircle& s = m.sliding;
  const int n_model = static_cast<int>(s.stator_nodes.size());
  const int n = n_model * m.symmetry.copies;  // node pitches round the whole circle
  const Unfolded u{n_model, m.symmetry, kTwoPi / m.symmetry.copies};
  const double pitch = kTwoPi / n;
  const double chord = 2 * s.radius * std::sin(pitch / 2);
  const std::vector<int> outside = triangles_on_chords(m, s.stator_nodes, s.stator_end);
  const std::vector<int> inside = triangles_on_chords(m, s.rotor_nodes, s.rotor_end);
  for (int i = 0; i < n_model; ++i)
    if (outside[i] < 0 || inside[i] < 0)
      throw mesh::MeshError("chord " + std::to_string(i) + " of the sliding circle has no triangle on one side");

  GapOperators g;
  g.radius = s.radius;
  g.circle_nodes = s.stator_nodes;
  Triplets br, bt;
  for (int j = 0; j < n_points; ++j) {
    const double phi = kTwoPi * j / n_points;
    g.angles.push_back(phi);
    // Chord i has its midpoint at start + (i + 1/2) pitch; interpolate between the two nearest.
    double x = (phi - s.start_angle) / pitch - 0.5;
    x -= n * std::floor(x / n);
    const int i0 = static_cast<int>(std::floor(x)) % n, i1 = (i0 + 1) % n;
    const double w1 = x - std::floor(x), w0 = 1.0 - w1;
    for (const auto& [i, w] : {std::pair{i0, w0}, std::pair{i1, w1}}) {
      const int next = (i + 1) % n;
      br.emplace_back(j, s.stator_nodes[u.index(next)], u.sign(next) * w / chord);
      br.emplace_back(j, s.stator_nodes[u.index(i)], -u.sign(i) * w / chord);
      add_tangential(m, outside[u.index(i)], phi - u.turn(i), u.sign(i) * 0.5 * w, j, bt);
      // The rotor-side triangle holds B in the rotor's frame, where this point sits at phi - shift;
      // B_theta is a polar component, the same at the model's triangle as at its image.
      const int q = i - rotor_shift - s.rotor_first;
      add_tangential(m, inside[u.index(q)], phi - rotor_shift * pitch - u.turn(q), u.sign(q) * 0.5 * w, j, bt);
    }
  }
  g.br.resize(n_points, m.n_nodes());
  g.br.setFromTriplets(br.begin(), br.end());
  g.bt.resize(n_points, m.n_nodes());
  g.bt.setFromTriplets(bt.begin(), bt.end());

  g.harmonics = Eigen::MatrixXcd::Zero(max_order + 1, n_model);
  for (int order = 0; order <= max_order; ++order)
    for (int p = 0; p < n; ++p) {
      const double theta = s.start_angle + pitch * p;
      // c_n = -j (n / r) a_n with a_n = (2/N) sum_p A_p e^{j n theta_p}, over the unfolded circle.
      g.harmonics(order, u.index(p)) +=
          u.sign(p) * (std::complex<double>(0.0, -order / s.radius) * (2.0 / n) * std::polar(1.0, order * theta));
    }
  return g;
}

Eigen::MatrixXcd gap_harmonics(const GapOperators& g, const Eigen::MatrixXd& a) {
  Eigen::MatrixXd on_circle(static_cast<Eigen::Index>(g.circle_nodes.size()), a.cols());
  for (std::size_t i = 0; i < g.circle_nodes.size(); ++i)
    on_circle.row(static_cast<Eigen::Index>(i)) = a.row(g.circle_nodes[i]);
  return g.harmonics * on_circle.cast<std::complex<double>>();
}

}  // namespace tf::post
