#include "post/space_harmonic_table.hpp"

#include "post/svg_plot.hpp"

namespace tf::post {

Table space_harmonic_table(const std::vector<SpaceHarmonic>& harmonics, const std::string& heading) {
  const auto num = [](double v, int digits = 4) { return svg::format_number(v, digits); };
  Table t{heading,
          {"order ν", "mechanical n", "amplitude [T]", "% of fundamental", "turns", "speed [rpm]", "winding factor"},
          {},
          "Mean over the steps of |c_n|; each order split by the temporal DFT into the waves turning forward "
          "(counter-clockwise) and backward, 'pulsating' where neither is ten times the other; speed n_s/ν. "
          "Orders under 0.5 % of the fundamental are in space_harmonics.csv only."};
  for (const SpaceHarmonic& h : harmonics)
    if (h.relative >= 0.005)
      t.rows.push_back({num(h.electrical_order), std::to_string(h.order), num(h.amplitude), svg::format_number_against(100 * h.relative, 100, 3),
                        direction(h), num(h.speed_rpm, 5), num(h.winding_factor)});
  return t;
}

}  // namespace tf::post
