#pragma once
// Where the parts of a mesh meet: the edges between triangles of different parts, for outlining
// regions and for drawing the triangles of one colour as a few polygons instead of one each.

#include <vector>

#include <Eigen/Core>

#include "post/polylines.hpp"

namespace tf::post {

/// An edge from node `from` to node `to`, counter-clockwise round the triangle of part `inside`;
/// `outside` is the part of the triangle across it, or -1 on the mesh boundary.
struct PartEdge {
  int from, to;
  int inside, outside;
};

/// Every edge whose two triangles lie in different parts, and every boundary edge, once per side
/// that has a triangle. part: #triangles, a non-negative number per triangle.
std::vector<PartEdge> part_edges(const Eigen::MatrixX3i& triangles, const std::vector<int>& part);

/// Directed edges (from, to node) joined into closed loops, each starting and ending at the same
/// node; where edges of several loops meet at a node any continuation is taken, which leaves the
/// enclosed area unchanged under the even-odd rule. Every node must have as many edges in as out
/// (true of the boundary of any set of counter-clockwise triangles).
std::vector<std::vector<int>> closed_loops(const std::vector<std::pair<int, int>>& edges);

/// Nodes of each loop as points [m], the first repeated last.
std::vector<Polyline> loop_points(const Eigen::MatrixX2d& nodes, const std::vector<std::vector<int>>& loops);

}  // namespace tf::post
