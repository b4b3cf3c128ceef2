#include "post/resultant_waves.hpp"

#include <cassert>
#include <cmath>
#include <numbers>

#include <fmt/format.h>

namespace tf::post {
namespace {

constexpr double kDeg = 180.0 / std::numbers::pi;

/// W_k(n) of every phase: the star-of-slots phasor of its coil sides for mechanical order n.
std::vector<std::complex<double>> phase_phasors(const mesh::Winding& w, int n) {
  std::vector<std::complex<double>> out(static_cast<std::size_t>(w.spec.n_phases), 0.0);
  for (const mesh::CoilSide& s : w.sides)
    out[static_cast<std::size_t>(s.phase)] += static_cast<double>(s.direction * s.turns) * std::polar(1.0, n * s.angle);
  return out;
}

std::complex<double> sum(const std::vector<std::complex<double>>& parts) {
  std::complex<double> out = 0.0;
  for (const auto& z : parts) out += z;
  return out;
}

double total_magnitude(const std::vector<std::complex<double>>& parts) {
  double sum = 0.0;
  for (const auto& z : parts) sum += std::abs(z);
  return sum;
}

/// "0°, 120°, 240°": each phase's contribution relative to the first one that is not zero.
std::string angles(const std::vector<std::complex<double>>& parts) {
  const double tiny = 1e-9 * total_magnitude(parts);
  std::string out;
  double reference = std::nan("");
  for (const auto& z : parts) {
    std::string text = "–";
    if (std::abs(z) > tiny) {
      if (std::isnan(reference)) reference = std::arg(z);
      // To 0.1°: the round-off of a sum of sines is no angle to print.
      double a = std::round(10.0 * std::fmod((std::arg(z) - reference) * kDeg, 360.0)) / 10.0;
      if (a < 0) a += 360.0;
      if (a >= 360.0 || a == 0.0) a = 0.0;  // shown as 0°, not 360° or -0°
      text = fmt::format("{:g}°", a);
    }
    out += (out.empty() ? "" : ", ") + text;
  }
  return out;
}

/// How the phases' contributions to one wave add up: in step, cancelling or in part.
std::string how_they_add(const std::vector<std::complex<double>>& parts, double ratio) {
  const std::string list = "(" + angles(parts) + ")";
  if (ratio < 1e-6) return "cancel " + list;
  if (ratio > 1.0 - 1e-6) return "add in step " + list;
  return fmt::format("add to {:.3g} % of their sum ", 100 * ratio) + list;
}

/// Equal peaks, phase k lagging phase A by k times the phase shift (DEVELOPERS.md, "Conventions").
bool balanced(const std::vector<std::complex<double>>& currents) {
  const int m = static_cast<int>(currents.size());
  if (m < 2 || std::abs(currents[0]) == 0.0) return false;
  for (int k = 0; k < m; ++k) {
    const auto expected = currents[0] * std::polar(1.0, -k * solver::phase_shift(m));
    if (std::abs(currents[static_cast<std::size_t>(k)] - expected) > 1e-9 * std::abs(currents[0])) return false;
  }
  return true;
}

std::string verdict(const ResultantWave& r) {
  if (r.carried < 1e-9) return "absent";
  if (r.forward < 1e-6 && r.backward < 1e-6) return "cancels";
  if (r.forward > 10.0 * r.backward) return "forward";
  if (r.backward > 10.0 * r.forward) return "backward";
  return std::abs(r.forward - r.backward) < 1e-6 ? "pulsating" : "elliptic";
}

}  // namespace

std::vector<ResultantWave> resultant_waves(const mesh::Winding& w, const std::vector<std::complex<double>>& currents,
                                           double frequency, const std::vector<int>& orders) {
  assert(currents.size() == static_cast<std::size_t>(w.spec.n_phases));
  const int p = w.spec.pole_pairs(), m = w.spec.n_phases;
  std::vector<double> conductors(static_cast<std::size_t>(m), 0.0);
  for (const mesh::CoilSide& s : w.sides) conductors[static_cast<std::size_t>(s.phase)] += s.turns;
  double content = 0.0;
  for (std::size_t k = 0; k < conductors.size(); ++k) content += std::abs(currents[k]) * conductors[k];
  std::vector<ResultantWave> out;
  for (int n : orders) {
    ResultantWave r{n, static_cast<double>(n) / p};
    const auto phasors = phase_phasors(w, n);
    std::vector<std::complex<double>> forward, backward;
    for (int k = 0; k < m; ++k) {
      const auto i = currents[static_cast<std::size_t>(k)], wk = phasors[static_cast<std::size_t>(k)];
      forward.push_back(i * wk), backward.push_back(std::conj(i) * wk);
    }
    const double own = total_magnitude(forward);  // = Σ |I_k||W_k|, the same for the backward parts
    r.carried = content > 0.0 ? own / content : 0.0;
    if (r.carried >= 1e-9) r.forward = std::abs(sum(forward)) / own, r.backward = std::abs(sum(backward)) / own;
    r.field = verdict(r);
    r.speed_rpm = (r.forward >= r.backward ? 1.0 : -1.0) * 60.0 * frequency / n;
    if (r.field == "absent") {
      r.reason = "no phase's coil sides carry this order (winding factor 0 in every phase)";
    } else {
      r.reason = "forward waves of the phases " + how_they_add(forward, r.forward) + "; backward waves " +
                 how_they_add(backward, r.backward);
      const bool whole = n % p == 0;
      if (r.field == "cancels" && whole && (n / p) % m == 0 && balanced(currents))
        r.reason = fmt::format("a multiple of {} with balanced {}-phase currents: {}", m, m, r.reason);
    }
    out.push_back(r);
  }
  return out;
}

std::optional<std::vector<std::complex<double>>> fundamental_currents(const solver::Supply& s, int n_phases) {
  if (s.kind == solver::SupplyKind::split_phase) return std::nullopt;
  if (s.kind != solver::SupplyKind::stepped_dc) return solver::supply_phasors(s, n_phases);
  std::vector<std::complex<double>> out(static_cast<std::size_t>(n_phases), 0.0);
  const double n_states = static_cast<double>(s.states.size());
  for (std::size_t state = 0; state < s.states.size(); ++state)
    for (std::size_t k = 0; k < out.size(); ++k)
      out[k] += (2.0 / n_states) * s.states[state][k] * std::polar(1.0, -2 * std::numbers::pi * state / n_states);
  return out;
}

}  // namespace tf::post
