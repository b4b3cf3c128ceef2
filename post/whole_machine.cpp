#include "post/whole_machine.hpp"

#include <cmath>
#include <numbers>

#include <Eigen/Geometry>

namespace tf::post {
namespace {

constexpr int kOnAxis = -2;

/// Per model node on a start cut, its image on the end cut (else -1): a cut pair (end, start) puts
/// node `start` of copy k where node `end` of copy k - 1 lies. The rotor's centre, on both cuts and
/// paired with itself, is kOnAxis: every copy shares copy 0's.
std::vector<int> end_of_start_nodes(const mesh::Mesh& m) {
  std::vector<int> end_of_start(m.n_nodes(), -1);
  for (const auto& [end, start] : m.symmetry.cut_pairs) end_of_start[start] = end == start ? kOnAxis : end;
  return end_of_start;
}

bool drawn(const mesh::Mesh& m, int t) {
  return m.regions[m.triangle_region(t)].kind != mesh::RegionKind::exterior_image;
}

}  // namespace

double WholeMachine::copy_angle(int copy) const { return 2.0 * std::numbers::pi * copy / symmetry.copies; }

WholeMachine unfold(const mesh::Mesh& m) {
  WholeMachine w;
  w.symmetry = m.symmetry;
  const int copies = m.symmetry.copies;
  const std::vector<int> end_of_start = end_of_start_nodes(m);
  std::vector<bool> used(m.n_nodes(), false);
  int n_kept = 0;
  for (int t = 0; t < m.n_triangles(); ++t)
    if (drawn(m, t)) {
      ++n_kept;
      for (int j = 0; j < 3; ++j) used[m.triangles(t, j)] = true;
    }
  // id[k][i]: node i of copy k in the whole machine; start-cut nodes of copy k reuse the end-cut
  // node of copy k - 1, and copy 0's those of the last copy (added after it).
  std::vector<std::vector<int>> id(copies, std::vector<int>(m.n_nodes(), -1));
  std::vector<Eigen::Vector2d> xy;
  for (int k = 0; k < copies; ++k) {
    const Eigen::Rotation2Dd turn(w.copy_angle(k));
    for (int i = 0; i < m.n_nodes(); ++i) {
      if (!used[i]) continue;
      if (k > 0 && end_of_start[i] != -1) {
        id[k][i] = end_of_start[i] == kOnAxis ? id[0][i] : id[k - 1][end_of_start[i]];
        continue;
      }
      id[k][i] = static_cast<int>(xy.size());
      xy.push_back(turn * m.nodes.row(i).transpose());
      w.node_source.push_back(i);
      w.node_copy.push_back(k);
    }
  }
  if (copies > 1)  // close the ring: copy 0's start cut is the last copy's end cut
    for (int i = 0; i < m.n_nodes(); ++i)
      if (used[i] && end_of_start[i] >= 0) id[0][i] = id[copies - 1][end_of_start[i]];
  // Copy 0's own start-cut nodes were added but are now unused: drop them.
  std::vector<int> compact(xy.size(), -1);
  w.triangles.resize(static_cast<Eigen::Index>(copies) * n_kept, 3);
  w.triangle_region.resize(w.triangles.rows());
  int t_out = 0;
  for (int k = 0; k < copies; ++k)
    for (int t = 0; t < m.n_triangles(); ++t) {
      if (!drawn(m, t)) continue;
      for (int j = 0; j < 3; ++j) w.triangles(t_out, j) = id[k][m.triangles(t, j)];
      w.triangle_region(t_out) = m.triangle_region(t);
      w.triangle_source.push_back(t);
      w.triangle_copy.push_back(k);
      ++t_out;
    }
  int n_out = 0;
  for (int t = 0; t < w.n_triangles(); ++t)
    for (int j = 0; j < 3; ++j) {
      int& v = compact[w.triangles(t, j)];
      if (v < 0) v = n_out++;
    }
  w.nodes.resize(n_out, 2);
  std::vector<int> source(n_out), copy(n_out);
  for (std::size_t i = 0; i < xy.size(); ++i) {
    if (compact[i] < 0) continue;
    w.nodes.row(compact[i]) = xy[i].transpose();
    source[compact[i]] = w.node_source[i];
    copy[compact[i]] = w.node_copy[i];
  }
  w.node_source = std::move(source);
  w.node_copy = std::move(copy);
  for (int t = 0; t < w.n_triangles(); ++t)
    for (int j = 0; j < 3; ++j) w.triangles(t, j) = compact[w.triangles(t, j)];
  return w;
}

Eigen::VectorXd unfold_nodal(const WholeMachine& w, const Eigen::VectorXd& model_values) {
  Eigen::VectorXd out(w.n_nodes());
  for (int i = 0; i < w.n_nodes(); ++i)
    out(i) = w.symmetry.sign_of_copy(w.node_copy[i]) * model_values(w.node_source[i]);
  return out;
}

Eigen::VectorXd unfold_cells(const WholeMachine& w, const Eigen::VectorXd& model_values) {
  Eigen::VectorXd out(w.n_triangles());
  for (int t = 0; t < w.n_triangles(); ++t) out(t) = model_values(w.triangle_source[t]);
  return out;
}

Eigen::MatrixX2d unfold_cell_vectors(const WholeMachine& w, const Eigen::MatrixX2d& model_vectors) {
  Eigen::MatrixX2d out(w.n_triangles(), 2);
  for (int t = 0; t < w.n_triangles(); ++t) {
    const int k = w.triangle_copy[t];
    const Eigen::Vector2d v = Eigen::Rotation2Dd(w.copy_angle(k)) * model_vectors.row(w.triangle_source[t]).transpose();
    out.row(t) = w.symmetry.sign_of_copy(k) * v.transpose();
  }
  return out;
}

mesh::Mesh drawing_mesh(const mesh::Mesh& model, const WholeMachine& w) {
  mesh::Mesh d;
  d.nodes = w.nodes;
  d.triangles = w.triangles;
  d.triangle_region = w.triangle_region;
  d.regions = model.regions;
  d.gap_inner_radius = model.gap_inner_radius;
  d.gap_outer_radius = model.gap_outer_radius;
  d.sliding.radius = model.sliding.radius;
  return d;
}

}  // namespace tf::post
