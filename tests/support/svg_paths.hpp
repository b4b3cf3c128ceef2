#pragma once
// Reading back the paths of our SVG figures: absolute points from "M x y", "L x y" and the
// relative "l dx dy" steps the field map writes, one list per subpath.

#include <algorithm>
#include <regex>
#include <string>
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

/// The smallest box [px] holding every point of the paths.
struct Extent {
  double x_lo = 1e9, x_hi = -1e9, y_lo = 1e9, y_hi = -1e9;
  void add(const Point& p) {
    x_lo = std::min(x_lo, p.x), x_hi = std::max(x_hi, p.x), y_lo = std::min(y_lo, p.y), y_hi = std::max(y_hi, p.y);
  }
};

}  // namespace tf::testing
