#pragma once
// What a field map draws over its colours: lines (flux lines, region outlines), text labels
// (coil sides), arrows (magnetization) and the key that explains them. All positions in the
// map's own coordinates [m]; the map turns them into pixels.

#include <string>
#include <vector>

#include <Eigen/Core>

#include "post/polylines.hpp"

namespace tf::post::svg {

struct MapLines {
  std::string css_class;  ///< e.g. "data flux-line" (a checker finds data by class "data")
  std::string colour;     ///< "#rrggbb"
  double width = 1.0;     ///< [px]
  std::vector<Polyline> lines;
};

struct MapLabel {
  Eigen::Vector2d at;      ///< centre of the text [m]
  std::string text;        ///< e.g. "A+"
  std::string colour;
  double height = 0.0;     ///< wanted text height [m]; the map keeps it readable (6 to 12 px)
};

struct MapArrow {
  Eigen::Vector2d tail, head;  ///< [m]
};

/// One line of the key under the map: a short line, a filled box, an arrow or a text sample.
struct MapKey {
  enum class Symbol { line, box, arrow, text };
  Symbol symbol = Symbol::line;
  std::string colour, name;
  std::string sample;  ///< the text drawn for Symbol::text, e.g. "A+"
};

struct MapOverlay {
  std::vector<MapLines> lines;  ///< drawn in order over the colours
  std::vector<MapLabel> labels;
  std::vector<MapArrow> arrows;
  std::vector<MapKey> key;
};

/// The weighted quantile of the lower kind: the smallest value v such that the values <= v
/// carry at least `fraction` of the total weight (fraction in (0, 1]). weights >= 0, same size.
double weighted_quantile(const Eigen::VectorXd& values, const Eigen::VectorXd& weights, double fraction);

/// Colour of the triangles above a clipped colour scale: magenta, far from every bin colour.
inline constexpr const char* kOverRangeColour = "#e7298a";

}  // namespace tf::post::svg
