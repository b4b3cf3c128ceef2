#include "post/space_harmonics.hpp"

#include <cmath>
#include <complex>
#include <numbers>

#include <fmt/format.h>

#include "post/atomic_file.hpp"

namespace tf::post {

std::vector<SpaceHarmonic> space_harmonics(const StudyResult& r, const mesh::Winding& w, double frequency) {
  std::vector<SpaceHarmonic> out;
  if (r.steps.empty()) return out;
  const int p = w.spec.pole_pairs(), n_max = static_cast<int>(r.steps.front().harmonics.size()) - 1;
  const double k = static_cast<double>(r.steps.size());
  const double fundamental = r.metrics.mean_fundamental;
  for (int n = 1; n <= n_max; ++n) {
    SpaceHarmonic h{n, static_cast<double>(n) / p};
    std::complex<double> forward = 0.0, backward = 0.0;
    for (const StepResult& s : r.steps) {
      const std::complex<double> c = s.harmonics(n);
      h.amplitude += std::abs(c) / k;
      forward += c * std::polar(1.0, -s.electrical_angle) / k;
      backward += c * std::polar(1.0, s.electrical_angle) / k;
    }
    h.forward = std::abs(forward);
    h.backward = std::abs(backward);
    h.relative = fundamental > 0.0 ? h.amplitude / fundamental : 0.0;
    // omega / n mechanical [rad/s] in rpm: 60 f / n.
    h.speed_rpm = (h.forward >= h.backward ? 1.0 : -1.0) * 60.0 * frequency / n;
    h.winding_factor = mesh::layout_winding_factor(w, 0, n);
    out.push_back(h);
  }
  return out;
}

std::string direction(const SpaceHarmonic& h) {
  if (h.relative < 1e-9) return "none";  // round-off: no wave to speak of
  if (h.forward > 10.0 * h.backward) return "forward";
  if (h.backward > 10.0 * h.forward) return "backward";
  return "pulsating";
}

void write_space_harmonics(const std::filesystem::path& path, const std::vector<SpaceHarmonic>& table) {
  write_atomically(path, [&](std::ostream& out) {
    out << "order,electrical_order,amplitude_T,relative_to_fundamental,forward_T,backward_T,direction,speed_rpm,"
           "winding_factor\n";
    for (const auto& h : table)
      out << fmt::format("{},{:.6g},{:.8g},{:.6g},{:.8g},{:.8g},{},{:.6g},{:.6g}\n", h.order, h.electrical_order,
                         h.amplitude, h.relative, h.forward, h.backward, direction(h), h.speed_rpm, h.winding_factor);
  });
}

}  // namespace tf::post
