// The cross-section coloured by a value per triangle, drawn with one <path> per colour bin so a
// mesh of tens of thousands of triangles stays a file of a few megabytes.

#include <algorithm>
#include <array>
#include <cmath>

#include <fmt/format.h>

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

namespace {

constexpr double kMapSize = 440;  // [px], the longer side of the drawn cross-section
constexpr double kMapLeft = 30, kMapTop = 40, kBarLeft = kMapLeft + kMapSize + 40;

/// The colour bar: the bins from bottom (min) to top (max) and nice ticks inside [lo, hi].
std::string colour_bar(double lo, double hi, const std::string& label) {
  std::string out;
  const double height = kMapSize, step = height / kColourBins;
  for (int k = 0; k < kColourBins; ++k)
    out += fmt::format("<rect class=\"colourbar\" x=\"{:.1f}\" y=\"{:.2f}\" width=\"18\" height=\"{:.2f}\" fill=\"{}\"/>\n",
                       kBarLeft, kMapTop + height - (k + 1) * step, step + 0.3, bin_colour(k, kColourBins));
  out += fmt::format("<rect class=\"frame\" x=\"{:.1f}\" y=\"{:.1f}\" width=\"18\" height=\"{:.1f}\"/>\n", kBarLeft,
                     kMapTop, height);
  for (double t : nice_ticks(lo, hi, 6)) {
    if (t < lo - 1e-12 * std::abs(hi - lo) || t > hi + 1e-12 * std::abs(hi - lo)) continue;
    const double y = kMapTop + height - (hi > lo ? (t - lo) / (hi - lo) : 0.0) * height;
    out += fmt::format("<line x1=\"{0:.1f}\" y1=\"{1:.1f}\" x2=\"{2:.1f}\" y2=\"{1:.1f}\" stroke=\"#555\"/>"
                       "<text class=\"tick\" x=\"{3:.1f}\" y=\"{4:.1f}\">{5}</text>\n",
                       kBarLeft + 18, y, kBarLeft + 23, kBarLeft + 26, y + 4, format_number(t));
  }
  out += fmt::format("<text class=\"label\" x=\"{:.1f}\" y=\"{:.1f}\">{}</text>\n", kBarLeft - 4, kMapTop - 10,
                     escape(label));
  return out;
}

}  // namespace

std::string field_map(const FieldMap& c) {
  const double width = kBarLeft + 110, height = kMapTop + kMapSize + 30;
  std::string out = open_chart(c.title, width, height);
  const bool empty = c.nodes == nullptr || c.triangles == nullptr || c.values.size() == 0 ||
                     c.values.size() != c.triangles->rows() || !c.values.allFinite();
  if (empty) {
    Frame f;
    f.left = kMapLeft, f.right = kMapLeft + kMapSize, f.top = kMapTop, f.bottom = kMapTop + kMapSize;
    out += fmt::format("<rect class=\"frame\" x=\"{}\" y=\"{}\" width=\"{}\" height=\"{}\"/>\n", kMapLeft, kMapTop,
                       kMapSize, kMapSize);
    return out + no_data_note(f) + colour_bar(0, 1, c.value.text()) + "</svg>\n";
  }
  const Eigen::MatrixX2d& xy = *c.nodes;
  const Eigen::MatrixX3i& tri = *c.triangles;
  const Eigen::Vector2d lo = xy.colwise().minCoeff(), hi = xy.colwise().maxCoeff();
  const double scale = kMapSize / std::max((hi - lo).maxCoeff(), 1e-300);  // px per metre, equal in x and y
  const double x0 = kMapLeft + 0.5 * (kMapSize - scale * (hi(0) - lo(0)));
  const double y0 = kMapTop + 0.5 * (kMapSize - scale * (hi(1) - lo(1)));
  const double v_lo = c.values.minCoeff(), v_hi = c.values.maxCoeff();
  std::vector<std::string> paths(kColourBins);
  for (Eigen::Index t = 0; t < tri.rows(); ++t) {
    std::string& d = paths[colour_bin(c.values(t), v_lo, v_hi, kColourBins)];
    for (int i = 0; i < 3; ++i) {
      const int n = tri(t, i);
      d += fmt::format("{}{:.1f} {:.1f}", i == 0 ? "M" : "L", x0 + scale * (xy(n, 0) - lo(0)),
                       y0 + scale * (hi(1) - xy(n, 1)));
    }
    d += 'Z';
  }
  // A thin outline in the fill colour closes the hairline seams anti-aliasing leaves between triangles.
  for (int k = 0; k < kColourBins; ++k)
    if (!paths[k].empty())
      out += fmt::format("<path class=\"data\" fill=\"{0}\" stroke=\"{0}\" stroke-width=\"0.3\" "
                         "stroke-linejoin=\"round\" d=\"{1}\"/>\n",
                         bin_colour(k, kColourBins), paths[k]);
  out += fmt::format("<text class=\"tick\" x=\"{:.1f}\" y=\"{:.1f}\">{:.4g} mm across</text>\n", kMapLeft,
                     kMapTop + kMapSize + 22, 1e3 * (hi - lo).maxCoeff());
  return out + colour_bar(v_lo, v_hi, c.value.text()) + "</svg>\n";
}

}  // namespace tf::post::svg
