#pragma once
// Reading the report's charts back in tests: the pixel points of their data paths, and the
// spread of a drawn locus about its centre.

#include <algorithm>
#include <cmath>
#include <regex>
#include <sstream>
#include <string>
#include <utility>
#include <vector>

namespace tf::testing {

struct Point {
  double x, y;
};

/// The points of every "M x y L x y … [Z]" path with class="data", in order.
inline std::vector<std::vector<Point>> data_paths(const std::string& svg) {
  std::vector<std::vector<Point>> out;
  const std::regex path(R"re(<path class="data"[^>]*\bd="([^"]*)")re");
  for (auto it = std::sregex_iterator(svg.begin(), svg.end(), path); it != std::sregex_iterator(); ++it) {
    std::string d = (*it)[1];
    std::replace_if(d.begin(), d.end(), [](char ch) { return ch == 'M' || ch == 'L' || ch == 'Z'; }, ' ');
    std::istringstream in(d);
    std::vector<Point> points;
    for (Point p{}; in >> p.x >> p.y;) points.push_back(p);
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

}  // namespace tf::testing
