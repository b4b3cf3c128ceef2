#pragma once
// Reading the report's charts back in tests: the pixel points of their data paths (absolute "M x y",
// "L x y" and the relative "l dx dy" steps the field map writes), their extent, and the spread of a
// drawn locus about its centre.

#include <algorithm>
#include <cmath>
#include <regex>
#include <string>
#include <utility>
#include <vector>

namespace tf::testing {

struct Point {
  double x, y;
};

/// The absolute points of an SVG path's d attribute, one list per subpath: "M x y" starts one,
/// "L x y" (or a pair after M) goes to a point, "l dx dy" steps from the last, "Z" closes.
inline std::vector<std::vector<Point>> subpaths(const std::string& d) {
  std::vector<std::vector<Point>> out;
  const std::regex token(R"re([MLlZ]|-?(?:\d+(?:\.\d*)?|\.\d+))re");
  char command = 'M';
  Point at{0, 0};
  std::vector<double> pair;
  for (auto it = std::sregex_iterator(d.begin(), d.end(), token); it != std::sregex_iterator(); ++it) {
    const std::string t = it->str();
    if (t == "M" || t == "L" || t == "l" || t == "Z") {
      command = t[0];
      continue;
    }
    pair.push_back(std::stod(t));
    if (pair.size() < 2) continue;
    if (command == 'l') at = {at.x + pair[0], at.y + pair[1]};
    else at = {pair[0], pair[1]};
    if (command == 'M') out.emplace_back(), command = 'L';
    if (!out.empty()) out.back().push_back(at);
    pair.clear();
  }
  return out;
}

/// The points of every path with class="data", in order, its subpaths one after the other.
inline std::vector<std::vector<Point>> data_paths(const std::string& svg) {
  std::vector<std::vector<Point>> out;
  const std::regex path(R"re(<path class="data"[^>]*\bd="([^"]*)")re");
  for (auto it = std::sregex_iterator(svg.begin(), svg.end(), path); it != std::sregex_iterator(); ++it) {
    std::vector<Point> points;
    for (const auto& sub : subpaths((*it)[1])) points.insert(points.end(), sub.begin(), sub.end());
    out.push_back(points);
  }
  return out;
}

/// Smallest and largest distance [px] of the points from (cx, cy).
inline std::pair<double, double> radius_range(const std::vector<Point>& points, double cx, double cy) {
  double lo = 1e300, hi = 0.0;
  for (const Point& p : points) {
    const double r = std::hypot(p.x - cx, p.y - cy);
    lo = std::min(lo, r), hi = std::max(hi, r);
  }
  return {lo, hi};
}

/// The centre (cx, cy) of the first reference circle of a locus chart; (NaN, NaN) if there is none.
inline std::pair<double, double> locus_centre(const std::string& svg) {
  std::smatch at;
  if (!std::regex_search(svg, at, std::regex(R"re(<circle class="reference" cx="([0-9.]+)" cy="([0-9.]+)")re")))
    return {std::nan(""), std::nan("")};
  return {std::stod(at[1]), std::stod(at[2])};
}

/// The smallest box [px] holding every point of the paths.
struct Extent {
  double x_lo = 1e9, x_hi = -1e9, y_lo = 1e9, y_hi = -1e9;
  void add(const Point& p) {
    x_lo = std::min(x_lo, p.x), x_hi = std::max(x_hi, p.x), y_lo = std::min(y_lo, p.y), y_hi = std::max(y_hi, p.y);
  }
};

}  // namespace tf::testing
