#include "post/sweep_charts.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include <fmt/format.h>

#include "post/svg_frame.hpp"

namespace tf::post::svg {
namespace {

/// Finite extremes of one coordinate over every series; {0, 1} when there is none.
std::pair<double, double> extent(const std::vector<PointSeries>& series, bool of_x) {
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  for (const auto& s : series)
    for (std::size_t i = 0; i < s.x.size() && i < s.y.size(); ++i)
      if (std::isfinite(s.x[i]) && std::isfinite(s.y[i])) {
        const double v = of_x ? s.x[i] : s.y[i];
        lo = std::min(lo, v), hi = std::max(hi, v);
      }
  return lo <= hi ? std::pair{lo, hi} : std::pair{0.0, 1.0};
}

bool has_points(const std::vector<PointSeries>& series) {
  return std::any_of(series.begin(), series.end(), [](const PointSeries& s) {
    for (std::size_t i = 0; i < s.x.size() && i < s.y.size(); ++i)
      if (std::isfinite(s.x[i]) && std::isfinite(s.y[i])) return true;
    return false;
  });
}

/// The series as dots shifted `dx` (data units) sideways: one path of zero-length closed
/// subpaths, which a round line cap draws as dots (SVG 1.1, implementation notes on zero-length
/// subpaths), a transparent circle per point that carries its tooltip, and the joining line.
std::string draw_series(const Frame& f, const PointSeries& s, const std::string& colour, double dx, bool hollow) {
  std::string d, tips, line;
  bool pen_down = false;
  for (std::size_t i = 0; i < s.x.size() && i < s.y.size(); ++i) {
    if (!std::isfinite(s.x[i]) || !std::isfinite(s.y[i])) {
      pen_down = false;
      continue;
    }
    const double px = f.px(s.x[i] + dx), py = f.py(s.y[i]);
    d += fmt::format("M{:.1f} {:.1f}Z", px, py);
    line += fmt::format("{}{:.1f} {:.1f}", pen_down ? "L" : "M", px, py);
    pen_down = true;
    if (i < s.tips.size())
      tips += fmt::format("<circle cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"{:.1f}\" fill=\"transparent\"><title>{}</title></circle>\n",
                          px, py, s.size / 2 + 1, escape(s.tips[i]));
  }
  if (d.empty()) return "";
  std::string out;
  if (s.joined)
    out += fmt::format("<path class=\"line\" d=\"{}\" fill=\"none\" stroke=\"{}\" stroke-width=\"{}\"{}/>\n", line, colour,
                       s.dashed ? "1.2" : "1.8", s.dashed ? " stroke-dasharray=\"4 3\"" : "");
  out += fmt::format("<path class=\"data\" d=\"{}\" fill=\"none\" stroke=\"{}\" stroke-width=\"{:.1f}\" "
                     "stroke-linecap=\"round\"/>\n", d, colour, s.size);
  // The palette has eight colours: later series are rings, so that none looks like another.
  if (hollow)
    out += fmt::format("<path d=\"{}\" fill=\"none\" stroke=\"#fff\" stroke-width=\"{:.1f}\" stroke-linecap=\"round\"/>\n",
                       d, s.size * 0.45);
  return out + tips;
}

/// A legend name cut into lines of about 36 characters at ", ", "; " or spaces: the room right of the plot.
std::vector<std::string> wrapped(const std::string& name) {
  constexpr std::size_t kLine = 36;
  std::vector<std::string> lines;
  std::string rest = name;
  while (rest.size() > kLine) {
    std::size_t cut = rest.rfind(' ', kLine);
    if (cut == std::string::npos || cut == 0) cut = kLine;
    lines.push_back(rest.substr(0, cut));
    rest = rest.substr(cut + (rest[cut] == ' ' ? 1 : 0));
  }
  lines.push_back(rest);
  return lines;
}

/// One entry per series, right of the plot area: a dot in its colour (a ring past the eighth)
/// and its name, wrapped.
std::string dot_legend(const std::vector<PointSeries>& series, const std::vector<std::string>& colours) {
  std::string out;
  const double x = kPlotRight + 18;
  double y = kPlotTop + 12;
  for (std::size_t i = 0; i < series.size(); ++i) {
    out += fmt::format("<circle cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"{:.1f}\" fill=\"{}\"/>", x + 8, y, series[i].size / 2, colours[i]);
    if (i >= 8) out += fmt::format("<circle cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"{:.1f}\" fill=\"#fff\"/>", x + 8, y, series[i].size * 0.225);
    for (const auto& line : wrapped(series[i].name)) {
      out += fmt::format("<text class=\"legend\" x=\"{:.1f}\" y=\"{:.1f}\">{}</text>\n", x + 22, y + 4, escape(line));
      y += 15;
    }
    y += 5;
  }
  return out;
}

std::vector<std::string> colours_of(const std::vector<PointSeries>& series) {
  std::vector<std::string> colours;
  for (std::size_t k = 0; k < series.size(); ++k)
    colours.push_back(series[k].colour.empty() ? series_colour(static_cast<int>(k)) : series[k].colour);
  return colours;
}

}  // namespace

std::string category_chart(const CategoryChart& c) {
  std::vector<double> x_ticks;
  for (std::size_t i = 0; i < std::max<std::size_t>(1, c.categories.size()); ++i) x_ticks.push_back(static_cast<double>(i));
  const auto [y_lo, y_hi] = extent(c.series, false);
  const std::vector<double> y_ticks = nice_ticks(y_lo, y_hi);
  Frame f = Frame::around(x_ticks, y_ticks);
  f.x_lo -= 0.5, f.x_hi = x_ticks.back() + 0.5;
  std::string out = open_chart(c.title, kWidth, kHeight);
  out += draw_axes(f, x_ticks, y_ticks, c.x.text(), c.y.text(), c.categories.empty() ? std::vector<std::string>{""} : c.categories);
  const std::vector<std::string> colours = colours_of(c.series);
  // Side by side within a category: at most 0.7 of its width in all, at most 0.12 apart.
  const double n = static_cast<double>(c.series.size());
  const double step = n > 1 ? std::min(0.7 / (n - 1), 0.12) : 0.0;
  for (std::size_t k = 0; k < c.series.size(); ++k)
    out += draw_series(f, c.series[k], colours[k], (static_cast<double>(k) - (n - 1) / 2) * step, k >= 8);
  if (!has_points(c.series)) out += no_data_note(f);
  out += dot_legend(c.series, colours);
  return out + "</svg>\n";
}

std::string scatter_chart(const ScatterChart& c) {
  const auto [x_lo, x_hi] = extent(c.series, true);
  const auto [y_lo, y_hi] = extent(c.series, false);
  const std::vector<double> x_ticks = nice_ticks(x_lo, x_hi), y_ticks = nice_ticks(y_lo, y_hi);
  const Frame f = Frame::around(x_ticks, y_ticks);
  std::string out = open_chart(c.title, kWidth, kHeight);
  out += draw_axes(f, x_ticks, y_ticks, c.x.text(), c.y.text(), {});
  const std::vector<std::string> colours = colours_of(c.series);
  for (std::size_t k = 0; k < c.series.size(); ++k) out += draw_series(f, c.series[k], colours[k], 0.0, k >= 8);
  if (!has_points(c.series)) out += no_data_note(f);
  out += dot_legend(c.series, colours);
  return out + "</svg>\n";
}

}  // namespace tf::post::svg
