#include "post/svg_frame.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

namespace tf::post::svg {

Frame Frame::around(const std::vector<double>& x_ticks, const std::vector<double>& y_ticks) {
  Frame f;
  f.x_lo = x_ticks.front(), f.x_hi = x_ticks.back();
  f.y_lo = y_ticks.front(), f.y_hi = y_ticks.back();
  if (f.x_hi == f.x_lo) f.x_hi = f.x_lo + 1;
  if (f.y_hi == f.y_lo) f.y_hi = f.y_lo + 1;
  return f;
}

namespace {

/// Significant digits that tell neighbouring ticks apart: more when the ticks are close relative to their size.
int tick_digits(const std::vector<double>& ticks) {
  if (ticks.size() < 2) return 4;
  const double step = std::abs(ticks[1] - ticks[0]);
  const double size = std::max(std::abs(ticks.front()), std::abs(ticks.back()));
  if (!(step > 0.0) || !(size > 0.0)) return 4;
  return std::clamp(static_cast<int>(std::floor(std::log10(size / step))) + 2, 3, 12);
}

/// Characters (not bytes) of UTF-8 text: "ω" and "°" count once.
std::size_t utf8_length(const std::string& s) {
  std::size_t n = 0;
  for (unsigned char c : s) n += (c & 0xC0) != 0x80;
  return n;
}

}  // namespace

std::string open_chart(const std::string& title, double width, double height) {
  // A title longer than the chart is wide is squeezed into it rather than cut off by the frame:
  // bold 14 px DejaVu Sans averages about 8.6 px a character (measured on our titles in Chromium).
  const double room = width - kPlotLeft - 10.0;
  const double estimate = 8.6 * static_cast<double>(utf8_length(title));
  const std::string fit =
      estimate > room ? fmt::format(" textLength=\"{:.0f}\" lengthAdjust=\"spacingAndGlyphs\"", room) : "";
  // The style travels with each chart so that figures/*.svg look the same opened on their own.
  return fmt::format(
      "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{0}\" height=\"{1}\" viewBox=\"0 0 {0} {1}\" "
      "role=\"img\">\n<title>{2}</title>\n"
      "<style>text{{font-family:'DejaVu Sans',Verdana,Arial,sans-serif;fill:#222}} .tick{{font-size:11px}} "
      ".label{{font-size:13px}} .heading{{font-size:14px;font-weight:bold}} .legend{{font-size:12px}} "
      ".note{{font-size:16px;fill:#999}} .grid{{stroke:#e4e4e4;stroke-width:1}} "
      ".frame{{fill:none;stroke:#555;stroke-width:1}}</style>\n"
      "<rect width=\"{0}\" height=\"{1}\" fill=\"#fff\"/>\n"
      "<text class=\"heading\" x=\"{3}\" y=\"22\"{4}>{2}</text>\n",
      width, height, escape(title), kPlotLeft, fit);
}

std::string draw_axes(const Frame& f, const std::vector<double>& x_ticks, const std::vector<double>& y_ticks,
                      const std::string& x_label, const std::string& y_label,
                      const std::vector<std::string>& categories) {
  std::string out;
  const int x_digits = tick_digits(x_ticks), y_digits = tick_digits(y_ticks);
  for (std::size_t i = 0; i < x_ticks.size(); ++i) {
    const double x = f.px(x_ticks[i]);
    const std::string text = categories.empty() ? format_number(x_ticks[i], x_digits) : categories[i];
    out += fmt::format("<line class=\"grid\" x1=\"{0:.1f}\" y1=\"{1:.1f}\" x2=\"{0:.1f}\" y2=\"{2:.1f}\"/>"
                       "<text class=\"tick\" x=\"{0:.1f}\" y=\"{3:.1f}\" text-anchor=\"middle\">{4}</text>\n",
                       x, f.top, f.bottom, f.bottom + 16, escape(text));
  }
  for (double t : y_ticks) {
    const double y = f.py(t);
    out += fmt::format("<line class=\"grid\" x1=\"{0:.1f}\" y1=\"{1:.1f}\" x2=\"{2:.1f}\" y2=\"{1:.1f}\"/>"
                       "<text class=\"tick\" x=\"{3:.1f}\" y=\"{4:.1f}\" text-anchor=\"end\">{5}</text>\n",
                       f.left, y, f.right, f.left - 6, y + 4, format_number(t, y_digits));
  }
  out += fmt::format("<rect class=\"frame\" x=\"{:.1f}\" y=\"{:.1f}\" width=\"{:.1f}\" height=\"{:.1f}\"/>\n", f.left,
                     f.top, f.right - f.left, f.bottom - f.top);
  out += fmt::format("<text class=\"label\" x=\"{:.1f}\" y=\"{:.1f}\" text-anchor=\"middle\">{}</text>\n",
                     (f.left + f.right) / 2, f.bottom + 40, escape(x_label));
  out += fmt::format(
      "<text class=\"label\" transform=\"translate({:.1f} {:.1f}) rotate(-90)\" text-anchor=\"middle\">{}</text>\n",
      f.left - 58, (f.top + f.bottom) / 2, escape(y_label));
  return out;
}

std::string draw_legend(const std::vector<LegendEntry>& entries) {
  std::string out;
  const double x = kPlotRight + 18;
  for (std::size_t i = 0; i < entries.size(); ++i) {
    const double y = kPlotTop + 12 + 20 * static_cast<double>(i);
    out += fmt::format(
        "<line x1=\"{:.1f}\" y1=\"{:.1f}\" x2=\"{:.1f}\" y2=\"{:.1f}\" stroke=\"{}\" stroke-width=\"2.5\"{}/>"
        "<text class=\"legend\" x=\"{:.1f}\" y=\"{:.1f}\">{}</text>\n",
        x, y, x + 22, y, entries[i].colour, entries[i].dashed ? " stroke-dasharray=\"5 3\"" : "", x + 28, y + 4,
        escape(entries[i].name));
  }
  return out;
}

std::string no_data_note(const Frame& f) {
  return fmt::format("<text class=\"note\" x=\"{:.1f}\" y=\"{:.1f}\" text-anchor=\"middle\">no data</text>\n",
                     (f.left + f.right) / 2, (f.top + f.bottom) / 2);
}

std::string series_colour(int k) {
  // Okabe and Ito's palette for colour-blind readers (common practice), black moved last.
  static const char* palette[] = {"#0072B2", "#D55E00", "#009E73", "#CC79A7", "#E69F00", "#56B4E9", "#F0E442", "#000000"};
  return palette[k % 8];
}

}  // namespace tf::post::svg
