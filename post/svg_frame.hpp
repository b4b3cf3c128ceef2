#pragma once
// The parts every SVG chart shares: the frame that maps data to pixels, axes with ticks and
// labels, the legend, the "no data" note. Used by svg_plot.cpp and svg_field_map.cpp.

#include <string>
#include <vector>

#include "post/svg_plot.hpp"

namespace tf::post::svg {

/// Data range [x_lo, x_hi] × [y_lo, y_hi] shown in the pixel box left..right × top..bottom.
struct Frame {
  double x_lo = 0, x_hi = 1, y_lo = 0, y_hi = 1;
  double left = kPlotLeft, right = kPlotRight, top = kPlotTop, bottom = kPlotBottom;
  double px(double x) const { return left + (x - x_lo) / (x_hi - x_lo) * (right - left); }
  double py(double y) const { return bottom - (y - y_lo) / (y_hi - y_lo) * (bottom - top); }
  /// The frame spanning the first to the last tick of each axis, in the standard plot area.
  static Frame around(const std::vector<double>& x_ticks, const std::vector<double>& y_ticks);
};

/// "<svg …>" with the title and the embedded style; close it with "</svg>".
std::string open_chart(const std::string& title, double width, double height);

/// Grid, ticks, tick labels and axis labels; categories (if any) label x ticks 0, 1, ….
std::string draw_axes(const Frame& f, const std::vector<double>& x_ticks, const std::vector<double>& y_ticks,
                      const std::string& x_label, const std::string& y_label,
                      const std::vector<std::string>& categories);

struct LegendEntry {
  std::string name, colour;
  bool dashed = false;
};
/// One line per entry, right of the plot area.
std::string draw_legend(const std::vector<LegendEntry>& entries);

/// "no data" in the middle of the frame.
std::string no_data_note(const Frame& f);

/// Colour of series k: a qualitative palette that stays apart in print and for common colour-vision deficiencies.
std::string series_colour(int k);

}  // namespace tf::post::svg
