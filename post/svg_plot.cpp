#include "post/svg_plot.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <numbers>

#include <fmt/format.h>

#include "post/svg_frame.hpp"

namespace tf::post::svg {

std::string escape(const std::string& text) {
  std::string out;
  out.reserve(text.size());
  for (char ch : text) switch (ch) {
      case '&': out += "&amp;"; break;
      case '<': out += "&lt;"; break;
      case '>': out += "&gt;"; break;
      case '"': out += "&quot;"; break;
      case '\'': out += "&#39;"; break;
      default: out += ch;
    }
  return out;
}

std::string format_number(double v, int digits) {
  if (!std::isfinite(v)) return "–";
  if (v == 0.0) return "0";  // also turns -0 into 0
  // Whole numbers below ten million keep all their digits: "1250", not "1.25e+03".
  if (std::abs(v) >= 1.0 && std::abs(v) < 1e7) digits = std::max(digits, static_cast<int>(std::log10(std::abs(v))) + 1);
  return fmt::format("{:.{}g}", v, digits);
}

std::string format_number_against(double v, double largest, int digits) {
  if (std::isfinite(v) && std::abs(v) < kRoundOff * std::abs(largest)) return "0";
  return format_number(v, digits);
}

std::vector<double> angle_ticks(double lo, double hi) {
  if (!std::isfinite(lo) || !std::isfinite(hi)) return {0.0, 360.0};
  if (hi < lo) std::swap(lo, hi);
  for (double step : {1.0, 2.0, 5.0, 10.0, 15.0, 30.0, 45.0, 90.0, 180.0}) {
    const double first = step * std::floor(lo / step + 1e-9), last = step * std::ceil(hi / step - 1e-9);
    if ((last - first) / step > 8.0 + 1e-9) continue;
    std::vector<double> ticks;
    for (double t = first; t <= last + 1e-9 * step; t += step) ticks.push_back(t);
    if (ticks.size() < 2) ticks.push_back(first + step);
    return ticks;
  }
  return nice_ticks(lo, hi);  // more than four turns: plain ticks
}

std::vector<double> log_ticks(double lo, double hi) {
  if (!(lo > 0.0) || !std::isfinite(hi)) return {1.0, 10.0};
  if (hi < lo) std::swap(lo, hi);
  const int first = static_cast<int>(std::floor(std::log10(lo) + 1e-9)), last = static_cast<int>(std::ceil(std::log10(hi) - 1e-9));
  const bool sparse = last - first > 4;
  std::vector<double> ticks;
  for (int e = first; e <= last + 1; ++e)
    for (double m : {1.0, 2.0, 5.0}) {
      if (sparse && m != 1.0) continue;
      const double t = m * std::pow(10.0, e);
      if (t <= lo * (1 + 1e-9)) ticks = {t};  // the last tick at or below lo starts the axis
      else ticks.push_back(t);
      if (t >= hi * (1 - 1e-9) && ticks.size() >= 2) return ticks;
    }
  return ticks;
}

std::vector<double> nice_ticks(double lo, double hi, int target) {
  if (!std::isfinite(lo) || !std::isfinite(hi)) return {0.0, 1.0};
  if (hi < lo) std::swap(lo, hi);
  // A flat line (to round-off of its size) still gets an axis around it, not ticks that all read the same.
  if (hi - lo <= 1e-9 * std::max(std::abs(lo), std::abs(hi))) {
    lo = hi = 0.5 * (lo + hi);
    const double pad = lo == 0.0 ? 1.0 : 0.1 * std::abs(lo);
    lo -= pad, hi += pad;
  }
  const double raw = (hi - lo) / std::max(1, target);
  const double magnitude = std::pow(10.0, std::floor(std::log10(raw)));
  const double f = raw / magnitude;
  const double step = magnitude * (f <= 1.0 ? 1.0 : f <= 2.0 ? 2.0 : f <= 2.5 ? 2.5 : f <= 5.0 ? 5.0 : 10.0);
  // A hair of slack so that lo = 0.3 does not start a tick below because 0.3/0.1 = 2.9999999999999996.
  const long first = static_cast<long>(std::floor(lo / step + 1e-9));
  const long last = static_cast<long>(std::ceil(hi / step - 1e-9));
  std::vector<double> ticks;
  for (long i = first; i <= last; ++i) ticks.push_back(i == 0 ? 0.0 : static_cast<double>(i) * step);
  return ticks;
}

namespace {

/// Finite extremes of several sequences; NaN when there is none.
std::pair<double, double> finite_range(const std::vector<const std::vector<double>*>& all) {
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  for (const auto* v : all)
    for (double x : *v)
      if (std::isfinite(x)) lo = std::min(lo, x), hi = std::max(hi, x);
  if (lo > hi) return {std::nan(""), std::nan("")};
  return {lo, hi};
}

/// "M x y L x y …" through the finite points; a NaN starts a new piece.
std::string polyline_path(const Frame& f, const std::vector<double>& x, const std::vector<double>& y) {
  std::string d;
  bool pen_down = false;
  for (std::size_t i = 0; i < x.size() && i < y.size(); ++i) {
    if (!std::isfinite(x[i]) || !std::isfinite(y[i])) {
      pen_down = false;
      continue;
    }
    d += fmt::format("{}{:.1f} {:.1f}", pen_down ? "L" : "M", f.px(x[i]), f.py(y[i]));
    pen_down = true;
  }
  return d;
}

}  // namespace

namespace {

/// The series as drawn: x mapped to log10 x on a logarithmic axis (points with x <= 0 dropped).
std::vector<Series> drawn_series(const LineChart& c) {
  if (!c.log_x) return c.series;
  std::vector<Series> out = c.series;
  for (Series& s : out)
    for (std::size_t i = 0; i < s.x.size(); ++i) s.x[i] = s.x[i] > 0.0 ? std::log10(s.x[i]) : std::nan("");
  return out;
}

/// The x ticks where they are drawn (log10 of the values on a log axis) and their labels.
std::pair<std::vector<double>, std::vector<std::string>> x_axis_ticks(const LineChart& c, double lo, double hi,
                                                                      bool empty) {
  std::vector<std::string> labels;
  if (!c.categories.empty()) {  // categories sit half a step inside the frame
    std::vector<double> at;
    for (std::size_t i = 0; i < c.categories.size(); ++i) at.push_back(static_cast<double>(i));
    return {at, c.categories};
  }
  if (c.log_x) {
    std::vector<double> at;
    for (double t : empty ? log_ticks(1, 10) : log_ticks(std::pow(10.0, lo), std::pow(10.0, hi)))
      at.push_back(std::log10(t)), labels.push_back(format_number(t));
    return {at, labels};
  }
  if (!c.x_ticks.empty()) return {c.x_ticks, {}};
  if (c.x.unit.rfind("°", 0) == 0) return {empty ? angle_ticks(0, 360) : angle_ticks(lo, hi), {}};
  return {empty ? nice_ticks(0, 1) : nice_ticks(lo, hi), {}};
}

}  // namespace

std::string line_chart(const LineChart& c) {
  const std::vector<Series> series = drawn_series(c);
  std::vector<const std::vector<double>*> xs, ys;
  for (const auto& s : series) xs.push_back(&s.x), ys.push_back(&s.y);
  auto [x_lo, x_hi] = finite_range(xs);
  const auto [y_lo, y_hi] = finite_range(ys);
  const bool empty = std::isnan(x_lo) || std::isnan(y_lo);
  const auto [x_ticks, x_labels] = x_axis_ticks(c, x_lo, x_hi, empty);
  const std::vector<double> y_ticks = empty            ? nice_ticks(0, 1)
                                     : c.include_zero ? nice_ticks(std::min(0.0, y_lo), std::max(0.0, y_hi))
                                                      : nice_ticks(y_lo, y_hi);
  Frame f = Frame::around(x_ticks, y_ticks);
  if (!c.categories.empty()) f.x_lo -= 0.5, f.x_hi += 0.5;
  std::string out = open_chart(c.title, kWidth, kHeight);
  out += draw_axes(f, x_ticks, y_ticks, c.x.text(), c.y.text(), x_labels);
  std::vector<LegendEntry> legend;
  for (std::size_t k = 0; k < series.size(); ++k) {
    const Series& s = series[k];
    const std::string colour = series_colour(static_cast<int>(k));
    const std::string d = polyline_path(f, s.x, s.y);
    if (!d.empty())
      out += fmt::format("<path class=\"data\" d=\"{}\" fill=\"none\" stroke=\"{}\" stroke-width=\"1.8\"{}/>\n", d,
                         colour, s.dashed ? " stroke-dasharray=\"6 4\"" : "");
    if (s.markers)
      for (std::size_t i = 0; i < s.x.size() && i < s.y.size(); ++i)
        if (std::isfinite(s.x[i]) && std::isfinite(s.y[i]))
          out += fmt::format("<circle cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"3\" fill=\"{}\"/>\n", f.px(s.x[i]), f.py(s.y[i]),
                             colour);
    legend.push_back({s.name, colour, s.dashed});
  }
  if (empty) out += no_data_note(f);
  out += draw_legend(legend);
  return out + "</svg>\n";
}

std::string stem_chart(const StemChart& c) {
  const auto [x_lo, x_hi] = finite_range({&c.order});
  const auto [y_lo, y_hi] = finite_range({&c.amplitude});
  const bool empty = std::isnan(x_lo) || std::isnan(y_lo);
  const std::vector<double> x_ticks = empty ? nice_ticks(0, 1) : nice_ticks(x_lo - 0.5, x_hi + 0.5, 10);
  const std::vector<double> y_ticks = empty ? nice_ticks(0, 1) : nice_ticks(std::min(0.0, y_lo), std::max(0.0, y_hi));
  const Frame f = Frame::around(x_ticks, y_ticks);
  std::string out = open_chart(c.title, kWidth, kHeight);
  out += draw_axes(f, x_ticks, y_ticks, c.x.text(), c.y.text(), {});
  // Bars 60 % of the narrowest spacing between orders wide, at least a hairline.
  double spacing = x_hi - x_lo;
  for (std::size_t i = 1; i < c.order.size(); ++i) spacing = std::min(spacing, std::abs(c.order[i] - c.order[i - 1]));
  const double width = std::max(1.0, 0.6 * (spacing > 0 ? spacing : 1.0) * (f.right - f.left) / (f.x_hi - f.x_lo));
  for (std::size_t i = 0; i < c.order.size() && i < c.amplitude.size(); ++i) {
    if (!std::isfinite(c.amplitude[i])) continue;
    const double top = std::min(f.py(c.amplitude[i]), f.py(0.0)), bottom = std::max(f.py(c.amplitude[i]), f.py(0.0));
    out += fmt::format(
        "<rect class=\"data\" x=\"{:.1f}\" y=\"{:.1f}\" width=\"{:.1f}\" height=\"{:.1f}\" fill=\"{}\">"
        "<title>{}: {}</title></rect>\n",
        f.px(c.order[i]) - width / 2, top, width, std::max(0.5, bottom - top), series_colour(0),
        format_number(c.order[i]), format_number(c.amplitude[i]));
  }
  if (empty) out += no_data_note(f);
  return out + "</svg>\n";
}

std::string locus_plot(const LocusPlot& c) { return locus_overlay({c.title, c.unit, {{"locus over the period", c.points}}}); }

std::string locus_overlay(const LocusOverlay& c) {
  double radius = 0.0;
  for (const auto& l : c.loci)
    for (const auto& z : l.points) radius = std::max(radius, std::abs(z));
  const bool empty = std::all_of(c.loci.begin(), c.loci.end(), [](const Locus& l) { return l.points.empty(); });
  const double reach = radius > 0.0 ? radius : 1.0;
  const std::vector<double> ticks = nice_ticks(-reach, reach, 4);
  // Equal scales: a square plot area on the same ticks for both axes.
  Frame f = Frame::around(ticks, ticks);
  f.right = f.left + (f.bottom - f.top);
  std::string out = open_chart(c.title, kWidth, kHeight);
  out += draw_axes(f, ticks, ticks, "Re [" + c.unit + "]", "Im [" + c.unit + "]", {});
  std::vector<LegendEntry> legend;
  for (std::size_t k = 0; k < c.loci.size(); ++k) {
    const Locus& l = c.loci[k];
    if (l.points.empty()) continue;
    // One locus keeps a grey circle and an orange first-step dot; several take their own colours.
    const bool alone = c.loci.size() == 1;
    const std::string colour = series_colour(static_cast<int>(k)), circle = alone ? "#888" : colour;
    const std::string dot = alone ? series_colour(1) : colour;
    double mean = 0.0;
    for (const auto& z : l.points) mean += std::abs(z) / static_cast<double>(l.points.size());
    out += fmt::format(
        "<circle class=\"reference\" cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"{:.1f}\" fill=\"none\" stroke=\"{}\" "
        "stroke-opacity=\"0.6\" stroke-dasharray=\"5 4\"/>\n",
        f.px(0), f.py(0), mean * (f.right - f.left) / (f.x_hi - f.x_lo), circle);
    std::vector<double> x, y;
    for (const auto& z : l.points) x.push_back(z.real()), y.push_back(z.imag());
    out += fmt::format("<path class=\"data\" d=\"{}Z\" fill=\"none\" stroke=\"{}\" stroke-width=\"1.8\"/>\n",
                       polyline_path(f, x, y), colour);
    out += fmt::format("<circle cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"4\" fill=\"{}\"><title>{}: first step</title></circle>\n",
                       f.px(x[0]), f.py(y[0]), dot, escape(l.name));
    legend.push_back({l.name, colour, false});
    if (alone) legend.push_back({"first step", dot, false});
    legend.push_back({"mean radius " + format_number(mean) + " " + c.unit, circle, true});
  }
  if (empty) out += no_data_note(f);
  out += draw_legend(legend);
  return out + "</svg>\n";
}

std::string grouped_bar_chart(const GroupedBarChart& c) {
  std::vector<const std::vector<double>*> values;
  for (const auto& s : c.series) values.push_back(&s.values);
  const auto [y_lo, y_hi] = finite_range(values);
  const bool empty = c.categories.empty() || std::isnan(y_lo);
  std::vector<double> x_ticks;
  for (std::size_t i = 0; i < c.categories.size(); ++i) x_ticks.push_back(static_cast<double>(i));
  if (x_ticks.empty()) x_ticks = {0.0};
  const std::vector<double> y_ticks = empty ? nice_ticks(0, 1) : nice_ticks(std::min(0.0, y_lo), std::max(0.0, y_hi));
  Frame f = Frame::around(x_ticks, y_ticks);
  f.x_lo -= 0.5, f.x_hi = f.x_lo + static_cast<double>(std::max<std::size_t>(1, c.categories.size()));
  std::string out = open_chart(c.title, kWidth, kHeight);
  out += draw_axes(f, x_ticks, y_ticks, c.x.text(), c.y.text(),
                   c.categories.empty() ? std::vector<std::string>{""} : c.categories);
  // Each group fills 80 % of its category's width, split equally between the series.
  const double group = 0.8 * (f.right - f.left) / (f.x_hi - f.x_lo);
  const double width = group / static_cast<double>(std::max<std::size_t>(1, c.series.size()));
  std::vector<LegendEntry> legend;
  for (std::size_t k = 0; k < c.series.size(); ++k) {
    const std::string colour = series_colour(static_cast<int>(k));
    for (std::size_t i = 0; i < c.categories.size() && i < c.series[k].values.size(); ++i) {
      const double v = c.series[k].values[i];
      if (!std::isfinite(v)) continue;
      const double top = std::min(f.py(v), f.py(0.0)), bottom = std::max(f.py(v), f.py(0.0));
      out += fmt::format(
          "<rect class=\"data\" x=\"{:.1f}\" y=\"{:.1f}\" width=\"{:.1f}\" height=\"{:.1f}\" fill=\"{}\">"
          "<title>{}, {}: {}</title></rect>\n",
          f.px(static_cast<double>(i)) - group / 2 + width * static_cast<double>(k), top, width,
          std::max(0.5, bottom - top), colour, escape(c.series[k].name), escape(c.categories[i]), format_number(v));
    }
    legend.push_back({c.series[k].name, colour, false});
  }
  if (empty) out += no_data_note(f);
  out += draw_legend(legend);
  return out + "</svg>\n";
}

}  // namespace tf::post::svg
