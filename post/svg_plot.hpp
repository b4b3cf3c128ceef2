#pragma once
// Small SVG charts for the reports, each returned as a self-contained <svg> element (no scripts,
// no external fonts). Elements that carry data have class="data" so a checker can find them.
// Pixel coordinates: x to the right, y downwards, origin at the top left of the chart.

#include <complex>
#include <string>
#include <vector>

#include <Eigen/Core>

#include "post/svg_map_overlay.hpp"

namespace tf::post::svg {

/// Chart size [px] and the plot area inside it; the legend sits right of the plot area.
inline constexpr double kWidth = 860, kHeight = 400;  // room right of the plot for legends of ~40 characters
inline constexpr double kPlotLeft = 78, kPlotRight = 560, kPlotTop = 40, kPlotBottom = 340;

struct Axis {
  std::string label;  ///< e.g. "B_r"
  std::string unit;   ///< e.g. "T"; empty for pure numbers
  std::string text() const { return unit.empty() ? label : label + " [" + unit + "]"; }
};

struct Series {
  std::string name;
  std::vector<double> x, y;  ///< same length; NaN values break the line
  bool dashed = false;
  bool markers = false;      ///< a dot at each point (for few points)
};

/// Several named series against one x axis. With categories set, x values are category indices
/// 0 .. n-1 and the x ticks show the names.
struct LineChart {
  std::string title;
  Axis x, y;
  std::vector<Series> series;
  std::vector<std::string> categories;
  bool include_zero = false;  ///< y axis reaches down (or up) to 0, so small changes look small
  std::vector<double> x_ticks = {};  ///< fixed x ticks, e.g. 0, 60, …, 360°; empty: nice ticks of the data
  /// x on a logarithmic scale (every x > 0; points with x <= 0 are left out), ticks 1, 2, 5 per decade.
  bool log_x = false;
};
std::string line_chart(const LineChart& c);

/// Amplitude against order, one stem (a thin bar) per order.
struct StemChart {
  std::string title;
  Axis x, y;
  std::vector<double> order, amplitude;
};
std::string stem_chart(const StemChart& c);

/// A closed path in the complex plane with equal scales on both axes, and the dashed circle of
/// the mean radius |z| for reference (a perfect rotating phasor lies on it).
struct LocusPlot {
  std::string title;
  std::string unit;  ///< of Re and Im
  std::vector<std::complex<double>> points;
};
std::string locus_plot(const LocusPlot& c);

/// Several loci on one complex plane (equal scales), each closed, in its own colour, with the
/// dashed circle of its own mean radius in that colour; the first point of each marked.
struct Locus {
  std::string name;
  std::vector<std::complex<double>> points;
};
struct LocusOverlay {
  std::string title;
  std::string unit;  ///< of Re and Im
  std::vector<Locus> loci;
};
std::string locus_overlay(const LocusOverlay& c);

/// Bars grouped by category (e.g. harmonic orders), one bar per series in each group, on one
/// y axis from 0; NaN values draw no bar.
struct BarSeries {
  std::string name;
  std::vector<double> values;  ///< one per category
};
struct GroupedBarChart {
  std::string title;
  Axis x, y;
  std::vector<std::string> categories;
  std::vector<BarSeries> series;
};
std::string grouped_bar_chart(const GroupedBarChart& c);

/// Mesh triangles coloured by one value each, with a colour bar. Triangles are grouped into
/// kColourBins bins of equal width over [min, top] and drawn as one <path> per bin, the
/// triangles of a bin merged into the polygons they cover. top is the maximum, or with
/// clip_fraction < 1 the area-weighted quantile of that fraction when the maximum lies more than
/// 5 % of the range above it (one singular corner does not set the scale); triangles above top
/// are drawn in kOverRangeColour and the bar says so.
struct FieldMap {
  std::string title;
  Axis value;                    ///< e.g. {"|B|", "T"}
  const Eigen::MatrixX2d* nodes = nullptr;      ///< #nodes by 2 [m]
  const Eigen::MatrixX3i* triangles = nullptr;  ///< #triangles by 3, counter-clockwise
  Eigen::VectorXd values;                       ///< #triangles
  double clip_fraction = 1.0;                   ///< e.g. 0.995: the scale ends at the 99.5th percentile
  MapOverlay overlay;                           ///< flux lines, outlines, labels, arrows, key
};
std::string field_map(const FieldMap& c);
inline constexpr int kColourBins = 32;

/// "Nice" tick values (1, 2, 2.5 or 5 times a power of ten) covering [lo, hi] with about `target`
/// intervals; the first tick is <= lo and the last >= hi.
std::vector<double> nice_ticks(double lo, double hi, int target = 5);

/// Ticks of an angle axis [deg]: steps of 1, 2, 5, 10, 15, 30, 45, 90 or 180 degrees, at most
/// eight intervals, from a multiple of the step at or below lo to one at or above hi; a whole turn
/// sampled 0 .. 355 ends at 360. Line charts use them for an x axis whose unit starts with "°".
std::vector<double> angle_ticks(double lo, double hi);

/// Ticks of a logarithmic axis over [lo, hi] (0 < lo <= hi): 1, 2 and 5 times each power of ten
/// (only the powers of ten when that leaves more than four decades), from the largest at or below
/// lo to the smallest at or above hi.
std::vector<double> log_ticks(double lo, double hi);

/// Bin index 0 .. n_bins-1 of value v over [lo, hi] (values outside are clamped; lo == hi: bin 0).
int colour_bin(double v, double lo, double hi, int n_bins);

/// Colour of bin k of n as "#rrggbb": dark blue (low) through teal and green to yellow (high).
std::string bin_colour(int k, int n_bins);

/// Text escaped for XML and HTML element content and attribute values.
std::string escape(const std::string& text);

/// A number with `digits` significant digits, without trailing zeros ("0.25", "1e-05").
std::string format_number(double v, int digits = 4);

/// Below this fraction of the largest value it is shown with, a value is round-off and prints as 0.
inline constexpr double kRoundOff = 1e-9;

/// format_number, but "0" when |v| < kRoundOff |largest| (a ripple of 5.8e-13 beside a fundamental of 1).
std::string format_number_against(double v, double largest, int digits = 4);

}  // namespace tf::post::svg
