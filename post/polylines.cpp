#include "post/polylines.hpp"

#include <unordered_map>

namespace tf::post {
namespace {

/// Segments meeting at each key, at most two remembered (a third ends the chain there).
using Incidence = std::unordered_map<std::int64_t, std::vector<int>>;

Incidence incidence(const std::vector<KeyedSegment>& s) {
  Incidence at;
  at.reserve(2 * s.size());
  for (int i = 0; i < static_cast<int>(s.size()); ++i) {
    at[s[i].from_key].push_back(i);
    at[s[i].to_key].push_back(i);
  }
  return at;
}

/// The other segment at `key` than `came_from` that is still free, or -1 (none, or a junction).
int next_segment(const Incidence& at, std::int64_t key, int came_from, const std::vector<bool>& used) {
  const std::vector<int>& here = at.at(key);
  if (here.size() != 2) return -1;
  const int other = here[0] == came_from ? here[1] : here[0];
  return used[static_cast<std::size_t>(other)] ? -1 : other;
}

/// Walks from segment `first`, entered at `key`, appending the far point of each segment.
void walk(const std::vector<KeyedSegment>& s, const Incidence& at, int first, std::int64_t key,
          std::vector<bool>& used, Polyline& line) {
  for (int i = first; i >= 0;) {
    used[static_cast<std::size_t>(i)] = true;
    const bool forward = s[i].from_key == key;
    line.push_back(forward ? s[i].to : s[i].from);
    key = forward ? s[i].to_key : s[i].from_key;
    i = next_segment(at, key, i, used);
  }
}

}  // namespace

std::vector<Polyline> join_segments(const std::vector<KeyedSegment>& s) {
  const Incidence at = incidence(s);
  std::vector<bool> used(s.size(), false);
  std::vector<Polyline> out;
  // Open chains first, from their ends (keys met once or at a junction), then the closed loops.
  for (int pass = 0; pass < 2; ++pass)
    for (int i = 0; i < static_cast<int>(s.size()); ++i) {
      if (used[static_cast<std::size_t>(i)]) continue;
      const bool from_end = at.at(s[i].from_key).size() != 2, to_end = at.at(s[i].to_key).size() != 2;
      if (pass == 0 && !from_end && !to_end) continue;
      const bool start_at_from = pass == 1 || from_end;
      Polyline line{start_at_from ? s[i].from : s[i].to};
      walk(s, at, i, start_at_from ? s[i].from_key : s[i].to_key, used, line);
      out.push_back(std::move(line));
    }
  return out;
}

}  // namespace tf::post
