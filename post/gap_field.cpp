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

/// The triangle on each chord (nodes[i], nodes[i+1]) of a closed node ring; -1 if none.
std::vector<int> triangles_on_chords(const mesh::Mesh& m, const std::vector<int>& nodes) {
  std::map<std::pair<int, int>, int> edge_triangle;
  std::vector<char> on_ring(m.n_nodes(), 0);
  for (int n : nodes) on_ring[n] = 1;
  for (int t = 0; t < m.n_triangles(); ++t)
    for (int i = 0; i < 3; ++i) {
      const int a = m.triangles(t, i), b = m.triangles(t, (i + 1) % 3);
      if (on_ring[a] && on_ring[b]) edge_triangle[{std::min(a, b), std::max(a, b)}] = t;
    }
  std::vector<int> tri(nodes.size(), -1);
  for (std::size_t i = 0; i < nodes.size(); ++i) {
    const int a = nodes[i], b = nodes[(i + 1) % nodes.size()];
    const auto it = edge_triangle.find({std::min(a, b), std::max(a, b)});
    if (it != edge_triangle.end()) tri[i] = it->second;
  }
  return tri;
}

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
  const int n = static_cast<int>(s.stator_nodes.size());
  const double pitch = kTwoPi / n;
  const double chord = 2 * s.radius * std::sin(pitch / 2);
  const std::vector<int> outside = triangles_on_chords(m, s.stator_nodes);
  const std::vector<int> inside = triangles_on_chords(m, s.rotor_nodes);
  for (int i = 0; i < n; ++i)
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
    double u = (phi - s.start_angle) / pitch - 0.5;
    u -= n * std::floor(u / n);
    const int i0 = static_cast<int>(std::floor(u)) % n, i1 = (i0 + 1) % n;
    const double w1 = u - std::floor(u), w0 = 1.0 - w1;
    for (const auto& [i, w] : {std::pair{i0, w0}, std::pair{i1, w1}}) {
      br.emplace_back(j, s.stator_nodes[(i + 1) % n], w / chord);
      br.emplace_back(j, s.stator_nodes[i], -w / chord);
      add_tangential(m, outside[i], phi, 0.5 * w, j, bt);
      // The rotor-side triangle holds B in the rotor's frame, where this point sits at phi - shift.
      add_tangential(m, inside[((i - rotor_shift) % n + n) % n], phi - rotor_shift * pitch, 0.5 * w, j, bt);
    }
  }
  g.br.resize(n_points, m.n_nodes());
  g.br.setFromTriplets(br.begin(), br.end());
  g.bt.resize(n_points, m.n_nodes());
  g.bt.setFromTriplets(bt.begin(), bt.end());

  g.harmonics.resize(max_order + 1, n);
  for (int order = 0; order <= max_order; ++order)
    for (int i = 0; i < n; ++i) {
      const double theta = s.start_angle + pitch * i;
      // c_n = -j (n / r) a_n with a_n = (2/N) sum_i A_i e^{j n theta_i}.
      g.harmonics(order, i) = std::complex<double>(0.0, -order / s.radius) * (2.0 / n) * std::polar(1.0, order * theta);
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
