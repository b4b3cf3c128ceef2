// The cross-section coloured by a value per triangle, drawn with one <path> per colour bin whose
// triangles are merged into the polygons they cover, so a whole machine of tens of thousands of
// triangles stays a file of a few hundred kilobytes; then the overlay (lines, labels, arrows, key).

#include <algorithm>
#include <cassert>
#include <array>
#include <cmath>
#include <numeric>

#include <fmt/format.h>

#include "post/region_outlines.hpp"
#include "post/svg_frame.hpp"
#include "post/svg_plot.hpp"

namespace tf::post::svg {

int colour_bin(double v, double lo, double hi, int n_bins) {
  if (!(hi > lo) || !std::isfinite(v)) return 0;
  const int k = static_cast<int>(std::floor((v - lo) / (hi - lo) * n_bins));
  return std::clamp(k, 0, n_bins - 1);
}

std::string bin_colour(int k, int n_bins) {
  // Dark blue through teal and green to yellow: lightness grows with the value, so the map reads
  // in grey-scale print too.
  static const std::array<std::array<double, 3>, 5> anchors{{
      {28, 30, 92}, {33, 102, 172}, {26, 158, 143}, {110, 190, 90}, {250, 220, 60}}};
  const double t = n_bins > 1 ? static_cast<double>(k) / (n_bins - 1) : 0.0;
  const double s = t * (anchors.size() - 1);
  const std::size_t i = std::min(static_cast<std::size_t>(s), anchors.size() - 2);
  const double w = s - static_cast<double>(i);
  std::array<int, 3> rgb{};
  for (int c = 0; c < 3; ++c) rgb[c] = static_cast<int>(std::lround((1 - w) * anchors[i][c] + w * anchors[i + 1][c]));
  return fmt::format("#{:02x}{:02x}{:02x}", rgb[0], rgb[1], rgb[2]);
}

double weighted_quantile(const Eigen::VectorXd& values, const Eigen::VectorXd& weights, double fraction) {
  assert(values.size() == weights.size() && values.size() > 0);
  std::vector<Eigen::Index> order(static_cast<std::size_t>(values.size()));
  std::iota(order.begin(), order.end(), Eigen::Index{0});
  std::sort(order.begin(), order.end(), [&](Eigen::Index a, Eigen::Index b) { return values(a) < values(b); });
  const double wanted = fraction * weights.sum();
  double sum = 0.0;
  for (Eigen::Index i : order)
    if ((sum += weights(i)) >= wanted) return values(i);
  return values(order.back());  // rounding left the sum a hair short of the total
}

namespace {

constexpr double kMapSize = 600;  // [px], the longer side of the drawn cross-section
constexpr double kMapLeft = 30, kMapTop = 58, kBarLeft = kMapLeft + kMapSize + 40;
constexpr double kBarTop = kMapTop + 26;  // room above the bar for the over-range box
constexpr double kKeyRow = 18, kKeyTop = kMapTop + kMapSize + 52;

/// Model coordinates [m] to pixels: equal scales, the drawing centred in the square.
struct MapFrame {
  Eigen::Vector2d lo, hi;
  double scale = 1, x0 = 0, y0 = 0;
  explicit MapFrame(const Eigen::MatrixX2d& xy)
      : lo(xy.colwise().minCoeff().transpose()), hi(xy.colwise().maxCoeff().transpose()) {
    scale = kMapSize / std::max((hi - lo).maxCoeff(), 1e-300);
    x0 = kMapLeft + 0.5 * (kMapSize - scale * (hi(0) - lo(0)));
    y0 = kMapTop + 0.5 * (kMapSize - scale * (hi(1) - lo(1)));
  }
  double px(double x) const { return x0 + scale * (x - lo(0)); }
  double py(double y) const { return y0 + scale * (hi(1) - y); }
};

/// A length in tenths of a pixel as SVG path text: "12" -> "1.2", "-3" -> "-.3", "20" -> "2".
std::string tenths(long v) {
  const long a = std::abs(v);
  std::string out = v < 0 ? "-" : "";
  if (a >= 10 || a == 0) out += std::to_string(a / 10);
  if (a % 10 != 0) out += "." + std::to_string(a % 10);
  return out;
}

/// "M x y l dx dy …" of a polyline (Z appended when closed): the first point absolute, the rest
/// relative steps on a 0.1 px grid (short numbers: half the text of absolute coordinates), a
/// point that rounds onto the last one skipped.
void append_path(std::string& d, const Polyline& line, const MapFrame& f, bool close) {
  long x0 = 0, y0 = 0;
  for (std::size_t i = 0; i < line.size(); ++i) {
    const long x = std::lround(10 * f.px(line[i].x())), y = std::lround(10 * f.py(line[i].y()));
    if (i == 0) {
      d += "M" + tenths(x) + " " + tenths(y) + "l";
    } else {
      if (x == x0 && y == y0) continue;
      const std::string dx = tenths(x - x0), dy = tenths(y - y0);
      if (d.back() != 'l' && dx[0] != '-') d += ' ';
      d += dx + (dy[0] == '-' ? "" : " ") + dy;
    }
    x0 = x, y0 = y;
  }
  if (d.back() == 'l') d.pop_back();  // a single point
  if (close) d += 'Z';
}

/// The bar: bins from bottom (lo) to top (hi), nice ticks, and the over-range box above it when clipped.
std::string colour_bar(double lo, double hi, const std::string& label, bool clipped) {
  std::string out;
  const double height = kMapTop + kMapSize - kBarTop, step = height / kColourBins;
  for (int k = 0; k < kColourBins; ++k)
    out += fmt::format("<rect class=\"colourbar\" x=\"{:.1f}\" y=\"{:.2f}\" width=\"18\" height=\"{:.2f}\" fill=\"{}\"/>\n",
                       kBarLeft, kBarTop + height - (k + 1) * step, step + 0.3, bin_colour(k, kColourBins));
  out += fmt::format("<rect class=\"frame\" x=\"{:.1f}\" y=\"{:.1f}\" width=\"18\" height=\"{:.1f}\"/>\n", kBarLeft,
                     kBarTop, height);
  if (clipped)
    out += fmt::format("<rect class=\"over-range\" x=\"{0:.1f}\" y=\"{1:.1f}\" width=\"18\" height=\"18\" fill=\"{2}\" "
                       "stroke=\"#555\"/><text class=\"tick\" x=\"{3:.1f}\" y=\"{4:.1f}\">&gt; {5}</text>\n",
                       kBarLeft, kMapTop, kOverRangeColour, kBarLeft + 26, kMapTop + 13, format_number(hi, 3));
  for (double t : nice_ticks(lo, hi, 6)) {
    if (t < lo - 1e-12 * std::abs(hi - lo) || t > hi + 1e-12 * std::abs(hi - lo)) continue;
    const double y = kBarTop + height - (hi > lo ? (t - lo) / (hi - lo) : 0.0) * height;
    out += fmt::format("<line x1=\"{0:.1f}\" y1=\"{1:.1f}\" x2=\"{2:.1f}\" y2=\"{1:.1f}\" stroke=\"#555\"/>"
                       "<text class=\"tick\" x=\"{3:.1f}\" y=\"{4:.1f}\">{5}</text>\n",
                       kBarLeft + 18, y, kBarLeft + 23, kBarLeft + 26, y + 4, format_number(t));
  }
  out += fmt::format("<text class=\"label\" x=\"{:.1f}\" y=\"{:.1f}\">{}</text>\n", kBarLeft - 4, kMapTop - 10,
                     escape(label));
  return out;
}

/// One <path> per colour bin (the last index: over the range), each bin's triangles merged.
std::string coloured_triangles(const FieldMap& c, const MapFrame& f, double lo, double top) {
  const Eigen::MatrixX3i& tri = *c.triangles;
  std::vector<int> bin(static_cast<std::size_t>(tri.rows()));
  for (Eigen::Index t = 0; t < tri.rows(); ++t)
    bin[static_cast<std::size_t>(t)] = c.values(t) > top ? kColourBins : colour_bin(c.values(t), lo, top, kColourBins);
  std::vector<std::vector<std::pair<int, int>>> edges(kColourBins + 1);
  for (const PartEdge& e : part_edges(tri, bin)) edges[static_cast<std::size_t>(e.inside)].emplace_back(e.from, e.to);
  std::string out;
  for (int k = 0; k <= kColourBins; ++k) {
    if (edges[k].empty()) continue;
    std::string d;
    for (const Polyline& loop : loop_points(*c.nodes, closed_loops(edges[k]))) append_path(d, loop, f, true);
    const std::string colour = k == kColourBins ? kOverRangeColour : bin_colour(k, kColourBins);
    // A thin outline in the fill colour closes the hairline seams anti-aliasing leaves between bins.
    out += fmt::format("<path class=\"data\" fill=\"{0}\" stroke=\"{0}\" stroke-width=\"0.3\" fill-rule=\"evenodd\" "
                       "stroke-linejoin=\"round\" d=\"{1}\"/>\n",
                       colour, d);
  }
  return out;
}

/// An arrow from tail to head [px]: a line and a filled head.
std::string arrow_px(const Eigen::Vector2d& tail, const Eigen::Vector2d& head) {
  const Eigen::Vector2d along = (head - tail).normalized(), across{-along.y(), along.x()};
  const Eigen::Vector2d shaft_end = head - 4 * along, b1 = head - 5 * along + 2.5 * across,
                        b2 = head - 5 * along - 2.5 * across;
  return fmt::format("<line class=\"magnetization\" x1=\"{:.1f}\" y1=\"{:.1f}\" x2=\"{:.1f}\" y2=\"{:.1f}\" "
                     "stroke=\"#111\" stroke-width=\"1.4\"/><polygon fill=\"#111\" "
                     "points=\"{:.1f},{:.1f} {:.1f},{:.1f} {:.1f},{:.1f}\"/>\n",
                     tail.x(), tail.y(), shaft_end.x(), shaft_end.y(), head.x(), head.y(), b1.x(), b1.y(), b2.x(), b2.y());
}

std::string arrow(const MapArrow& a, const MapFrame& f) {
  return arrow_px({f.px(a.tail.x()), f.py(a.tail.y())}, {f.px(a.head.x()), f.py(a.head.y())});
}

std::string overlay(const MapOverlay& o, const MapFrame& f) {
  std::string out;
  for (const MapLines& l : o.lines) {
    std::string d;
    for (const Polyline& line : l.lines) append_path(d, line, f, false);
    if (!d.empty())
      out += fmt::format("<path class=\"{}\" fill=\"none\" stroke=\"{}\" stroke-width=\"{}\" stroke-linejoin=\"round\" "
                         "d=\"{}\"/>\n",
                         l.css_class, l.colour, l.width, d);
  }
  for (const MapArrow& a : o.arrows) out += arrow(a, f);
  for (const MapLabel& l : o.labels)
    out += fmt::format("<text class=\"coil-label\" x=\"{:.1f}\" y=\"{:.1f}\" font-size=\"{:.1f}\" fill=\"{}\">{}</text>\n",
                       f.px(l.at.x()), f.py(l.at.y()), std::clamp(f.scale * l.height, 6.0, 12.0), l.colour, escape(l.text));
  return out;
}

/// The key under the map, one entry a row (entries run to 80 characters).
std::string key(const std::vector<MapKey>& entries) {
  std::string out;
  for (std::size_t i = 0; i < entries.size(); ++i) {
    const MapKey& e = entries[i];
    const double x = kMapLeft, y = kKeyTop + kKeyRow * static_cast<double>(i);
    switch (e.symbol) {
      case MapKey::Symbol::line:
        out += fmt::format("<line x1=\"{:.1f}\" y1=\"{:.1f}\" x2=\"{:.1f}\" y2=\"{:.1f}\" stroke=\"{}\" stroke-width=\"2\"/>",
                           x, y - 4, x + 22, y - 4, e.colour);
        break;
      case MapKey::Symbol::box:
        out += fmt::format("<rect x=\"{:.1f}\" y=\"{:.1f}\" width=\"22\" height=\"11\" fill=\"{}\" stroke=\"#555\"/>", x,
                           y - 10, e.colour);
        break;
      case MapKey::Symbol::arrow: out += arrow_px({x, y - 4}, {x + 22, y - 4}); break;
      case MapKey::Symbol::text:
        out += fmt::format("<text class=\"coil-label key-sample\" x=\"{:.1f}\" y=\"{:.1f}\" font-size=\"11\" fill=\"{}\">{}</text>",
                           x + 11, y, e.colour, escape(e.sample));
        break;
    }
    out += fmt::format("<text class=\"legend\" x=\"{:.1f}\" y=\"{:.1f}\">{}</text>\n", x + 28, y, escape(e.name));
  }
  return out;
}

}  // namespace

std::string field_map(const FieldMap& c) {
  const double width = kBarLeft + 110;
  const double height = kKeyTop + kKeyRow * static_cast<double>(c.overlay.key.size()) + 4;
  std::string out = open_chart(c.title, width, height);
  out += "<style>.coil-label{font-weight:bold;text-anchor:middle;dominant-baseline:central;paint-order:stroke;"
         "stroke:#fff;stroke-width:2px}</style>\n";
  const bool empty = c.nodes == nullptr || c.triangles == nullptr || c.values.size() == 0 ||
                     c.values.size() != c.triangles->rows() || !c.values.allFinite();
  if (empty) {
    Frame f;
    f.left = kMapLeft, f.right = kMapLeft + kMapSize, f.top = kMapTop, f.bottom = kMapTop + kMapSize;
    out += fmt::format("<rect class=\"frame\" x=\"{}\" y=\"{}\" width=\"{}\" height=\"{}\"/>\n", kMapLeft, kMapTop,
                       kMapSize, kMapSize);
    return out + no_data_note(f) + colour_bar(0, 1, c.value.text(), false) + "</svg>\n";
  }
  const Eigen::MatrixX2d& xy = *c.nodes;
  const Eigen::MatrixX3i& tri = *c.triangles;
  const MapFrame f(xy);
  Eigen::VectorXd area(tri.rows());
  for (Eigen::Index t = 0; t < tri.rows(); ++t) {
    const Eigen::Vector2d p = xy.row(tri(t, 0)), q = xy.row(tri(t, 1)), r = xy.row(tri(t, 2));
    area(t) = 0.5 * std::abs((q - p).x() * (r - p).y() - (q - p).y() * (r - p).x());
  }
  const double v_lo = c.values.minCoeff(), v_max = c.values.maxCoeff();
  const double top = c.clip_fraction < 1.0 ? weighted_quantile(c.values, area, c.clip_fraction) : v_max;
  // Clipping pays only when the few largest values would squeeze the rest into the low bins
  // (common practice: here, when they reach more than 5 % of the range above the quantile).
  const bool clipped = top > v_lo && v_max - top > 0.05 * (top - v_lo);
  out += coloured_triangles(c, f, v_lo, clipped ? top : v_max);
  out += overlay(c.overlay, f);
  out += fmt::format("<text class=\"tick\" x=\"{:.1f}\" y=\"{:.1f}\">{:.4g} mm across</text>\n", kMapLeft,
                     kMapTop + kMapSize + 18, 1e3 * (f.hi - f.lo).maxCoeff());
  if (clipped)
    out += fmt::format("<text class=\"tick clip-note\" x=\"{:.1f}\" y=\"{:.1f}\">colours clipped at the {}th percentile "
                       "(by area) of {}, {} {}; max {} {}; above it in magenta</text>\n",
                       kMapLeft, kMapTop + kMapSize + 34, format_number(100 * c.clip_fraction), escape(c.value.label),
                       format_number(top, 3), escape(c.value.unit), format_number(v_max, 3), escape(c.value.unit));
  return out + colour_bar(v_lo, clipped ? top : v_max, c.value.text(), clipped) + key(c.overlay.key) + "</svg>\n";
}

}  // namespace tf::post::svg
