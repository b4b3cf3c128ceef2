#include "study/slip_study.hpp"


#include <numbers>

#include "solver/coefficients.hpp"

namespace tf::study {
namespace {

bool all_zero(const std::vector<std::complex<double>>& currents) {
  for (const auto& i : currents)
    if (i != 0.0) return false;
  return true;
}

}  // namespace

solver::Cage cage_of(const input::Case& c) {
  const mesh::RotorBars& bars = c.geometry.rotor.bars;
  return {bars.count, c.winding.pole_pairs(), bars.width * bars.depth, c.materials.bar_sigma, c.stack_length};
}

SlipStudy solve_slip_study(const input::Case& c, const mesh::Mesh& m, const mesh::Winding& w,
                           solver::TimeHarmonicStats& stats, const std::function<void(int, int)>& solved) {
  SlipStudy out;
  out.materials = c.materials;
  if (c.end_rings && c.geometry.rotor.kind == mesh::RotorKind::slotted) {
    out.end_ring_factor = solver::end_ring_factor(cage_of(c), *c.end_rings);
    out.materials.bar_sigma *= out.end_ring_factor;
  }
  const solver::RegionCoefficients coefficients =
      solver::region_coefficients(m, out.materials, solver::EddyModel::slip_frequency);
  const solver::TimeHarmonicSystem system = solver::assemble_time_harmonic(m, w, coefficients);
  out.components = post::rotating_components(solver::supply_phasors(c.supply, c.winding.n_phases));
  const double omega = 2 * std::numbers::pi * c.supply.frequency;
  const int p = w.spec.pole_pairs();
  // Both components of every speed in one list, so one symbolic analysis serves them all. A
  // component without current (the backward one of a balanced supply) is not solved.
  std::vector<solver::TimeHarmonicProblem> problems;
  for (double speed : c.study.rotor_speeds) {
    const double s = post::forward_slip(p, c.supply.frequency, speed);
    if (!all_zero(out.components.forward)) problems.push_back({out.components.forward, s * omega, 0.0});
    if (!all_zero(out.components.backward)) problems.push_back({out.components.backward, (2.0 - s) * omega, 0.0});
  }
  const auto fields = solver::solve_time_harmonic(m, system, problems, stats, solved);
  const post::SlipInputs in{&m, &w, coefficients.sigma, coefficients.moves_with_rotor, c.supply.frequency,
                            c.stack_length};
  const Eigen::VectorXcd none = Eigen::VectorXcd::Zero(m.n_nodes());
  std::size_t next = 0;
  for (double speed : c.study.rotor_speeds) {
    out.forward.push_back(all_zero(out.components.forward) ? none : fields[next++]);
    out.backward.push_back(all_zero(out.components.backward) ? none : fields[next++]);
    out.rows.push_back(post::evaluate_slip_speed(in, speed, out.components, out.forward.back(), out.backward.back()));
  }
  return out;
}

}  // namespace tf::study
