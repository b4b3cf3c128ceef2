#include "post/flux_lines.hpp"

namespace tf::post {

std::vector<double> contour_levels(double lo, double hi, int n) {
  std::vector<double> out;
  if (!(hi > lo) || n < 1) return out;
  for (int i = 0; i < n; ++i) out.push_back(lo + (i + 0.5) * (hi - lo) / n);
  return out;
}

std::vector<Polyline> contour(const Eigen::MatrixX2d& nodes, const Eigen::MatrixX3i& triangles,
                              const Eigen::VectorXd& a, double level) {
  // The crossing point of edge (i, j), computed from its lower-numbered node so that the two
  // triangles sharing the edge find the very same point.
  const auto crossing = [&](int i, int j) -> Eigen::Vector2d {
    if (i > j) std::swap(i, j);
    const double t = (level - a(i)) / (a(j) - a(i));
    return nodes.row(i).transpose() + t * (nodes.row(j) - nodes.row(i)).transpose();
  };
  std::vector<KeyedSegment> segments;
  for (Eigen::Index t = 0; t < triangles.rows(); ++t) {
    std::int64_t keys[2];
    Eigen::Vector2d points[2];
    int n_cut = 0;
    for (int e = 0; e < 3; ++e) {
      const int i = triangles(t, e), j = triangles(t, (e + 1) % 3);
      if ((a(i) >= level) == (a(j) >= level)) continue;
      keys[n_cut] = edge_key(i, j);
      points[n_cut] = crossing(i, j);
      ++n_cut;
    }
    // A plane meets a triangle's boundary in no edge or in exactly two.
    if (n_cut == 2) segments.push_back({keys[0], keys[1], points[0], points[1]});
  }
  return join_segments(segments);
}

}  // namespace tf::post
