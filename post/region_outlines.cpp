#include "post/region_outlines.hpp"

#include <unordered_map>

namespace tf::post {

std::vector<PartEdge> part_edges(const Eigen::MatrixX3i& triangles, const std::vector<int>& part) {
  // Each interior edge is met twice, once in each direction; key it by its node pair.
  std::unordered_map<std::int64_t, std::pair<int, int>> first_side;  // edge -> (triangle, local edge)
  first_side.reserve(2 * static_cast<std::size_t>(triangles.rows()));
  std::vector<PartEdge> out;
  const auto edge = [&](int t, int e) { return std::pair{triangles(t, e), triangles(t, (e + 1) % 3)}; };
  for (int t = 0; t < triangles.rows(); ++t)
    for (int e = 0; e < 3; ++e) {
      const auto [i, j] = edge(t, e);
      const auto [it, added] = first_side.try_emplace(edge_key(i, j), t, e);
      if (added) continue;
      const auto [s, s_edge] = it->second;
      first_side.erase(it);
      if (part[static_cast<std::size_t>(s)] == part[static_cast<std::size_t>(t)]) continue;
      const auto [si, sj] = edge(s, s_edge);
      out.push_back({si, sj, part[static_cast<std::size_t>(s)], part[static_cast<std::size_t>(t)]});
      out.push_back({i, j, part[static_cast<std::size_t>(t)], part[static_cast<std::size_t>(s)]});
    }
  for (const auto& [key, side] : first_side) {
    const auto [i, j] = edge(side.first, side.second);
    out.push_back({i, j, part[static_cast<std::size_t>(side.first)], -1});
  }
  return out;
}

std::vector<std::vector<int>> closed_loops(const std::vector<std::pair<int, int>>& edges) {
  std::unordered_multimap<int, int> leaving;  // node -> edge index
  leaving.reserve(edges.size());
  for (int k = 0; k < static_cast<int>(edges.size()); ++k) leaving.emplace(edges[k].first, k);
  std::vector<std::vector<int>> loops;
  for (int k = 0; k < static_cast<int>(edges.size()); ++k) {
    const int start = edges[k].first;
    if (leaving.find(start) == leaving.end()) continue;  // already used
    std::vector<int> loop{start};
    for (int node = start;;) {
      const auto it = leaving.find(node);
      if (it == leaving.end()) break;  // only when in and out degrees differ (a broken precondition)
      node = edges[it->second].second;
      leaving.erase(it);
      loop.push_back(node);
      if (node == start) break;
    }
    loops.push_back(std::move(loop));
  }
  return loops;
}

std::vector<Polyline> loop_points(const Eigen::MatrixX2d& nodes, const std::vector<std::vector<int>>& loops) {
  std::vector<Polyline> out;
  out.reserve(loops.size());
  for (const auto& loop : loops) {
    Polyline p;
    p.reserve(loop.size());
    for (int n : loop) p.push_back(nodes.row(n).transpose());
    out.push_back(std::move(p));
  }
  return out;
}

}  // namespace tf::post
