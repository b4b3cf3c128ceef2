// A chart's title fits its box: a title longer than the chart is wide is squeezed into it
// (SVG 1.1, sec. 10.5, the textLength and lengthAdjust attributes), a short one is left alone.

#include <doctest/doctest.h>

#include <string>

#include "post/svg_frame.hpp"

TEST_CASE("a chart title longer than its chart is squeezed into the chart's width") {
  const std::string long_title(120, 'x');
  const std::string squeezed = tf::post::svg::open_chart(long_title, 400, 300);
  CHECK(squeezed.find("textLength=\"") != std::string::npos);
  CHECK(squeezed.find("lengthAdjust=\"spacingAndGlyphs\"") != std::string::npos);
  const std::string plain = tf::post::svg::open_chart("Torque against rotor angle", 400, 300);
  CHECK(plain.find("textLength") == std::string::npos);
  // Characters, not bytes: 40 two-byte characters fit where 80 bytes' worth would not.
  std::string greek;
  for (int i = 0; i < 36; ++i) greek += "ω";
  CHECK(tf::post::svg::open_chart(greek, 400, 300).find("textLength") == std::string::npos);
}
