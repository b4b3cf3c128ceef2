#pragma once
// Segments joined into polylines: the flux lines and region outlines of the cross-section are
// found triangle by triangle and drawn as few long paths, which keeps the figure's file small.

#include <cstdint>
#include <utility>
#include <vector>

#include <Eigen/Core>

namespace tf::post {

/// Points [m] joined in order; closed when the first and the last point are the same.
using Polyline = std::vector<Eigen::Vector2d>;

/// A segment between two points, each named by a key: segments that share a key meet there.
struct KeyedSegment {
  std::int64_t from_key, to_key;
  Eigen::Vector2d from, to;
};

/// The segments joined where they share a key; a key met by more than two segments ends a
/// polyline there. Each segment is used once.
std::vector<Polyline> join_segments(const std::vector<KeyedSegment>& segments);

/// The key of the mesh edge between nodes i and j (either order).
inline std::int64_t edge_key(int i, int j) {
  const auto [lo, hi] = std::minmax(i, j);
  return (static_cast<std::int64_t>(lo) << 32) | static_cast<std::int64_t>(hi);
}

}  // namespace tf::post
