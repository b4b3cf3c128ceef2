#pragma once
// The sweep report's charts: values per category (a key with a few whole-number or named values,
// such as the number of phases), and points on numeric axes, joined into curves (a metric against
// a continuous key) or not (two metrics in the Pareto view). Each series is one <path
// class="data"> of dots, so a checker finds it; legends wrap, so that long names stay readable.

#include <string>
#include <vector>

#include "post/svg_plot.hpp"

namespace tf::post::svg {

/// Points drawn as dots, each with a tooltip.
struct PointSeries {
  std::string name;
  std::vector<double> x, y;       ///< same length; points with a NaN are left out
  std::vector<std::string> tips = {};  ///< one per point (shown on hover), or empty
  double size = 8;                ///< dot diameter [px]
  std::string colour = {};        ///< "#rrggbb"; empty = the palette's colour of the series' index
  bool joined = false;            ///< a line through the points in order; a NaN breaks it
  bool dashed = false;            ///< the joining line dashed (a Pareto front, not a curve)
};

/// Values per category: x is the category index 0 .. n-1. Series are set side by side within
/// each category so that none hides another; no line joins categories, since nothing lies between
/// two phase counts or coil pitches.
struct CategoryChart {
  std::string title;
  Axis x, y;
  std::vector<std::string> categories;
  std::vector<PointSeries> series;
};
std::string category_chart(const CategoryChart& c);

/// Points on two numeric axes, joined or not. Long legend names wrap onto further lines.
struct ScatterChart {
  std::string title;
  Axis x, y;
  std::vector<PointSeries> series;
};
std::string scatter_chart(const ScatterChart& c);

}  // namespace tf::post::svg
