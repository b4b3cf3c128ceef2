#include "solver/time_harmonic.hpp"

#include <string>

#include "solver/assemble.hpp"
#include "solver/complex_sequence.hpp"
#include "solver/errors.hpp"
#include "solver/p1.hpp"

namespace tf::solver {
namespace {

void require_full_model(const mesh::Mesh& m) {
  if (m.symmetry.copies > 1)
    throw SolveError("time-harmonic (eddy-current and slip-frequency) studies need the full model, not a sector of " +
                     std::to_string(m.symmetry.copies) +
                     " copies: a sector's cut conditions are not a sign for time-harmonic fields of every space order");
}

}  // namespace

TimeHarmonicSystem assemble_time_harmonic(const mesh::Mesh& m, const mesh::Winding& w, const RegionCoefficients& c) {
  require_full_model(m);
  std::vector<double> moving_sigma(c.sigma.size(), 0.0);
  for (std::size_t r = 0; r < c.sigma.size(); ++r)
    if (c.moves_with_rotor[r]) moving_sigma[r] = c.sigma[r];
  TimeHarmonicSystem s;
  s.dofs = number_dofs(m);
  s.stiffness = assemble_matrix(m, s.dofs, c.nu, p1_stiffness);
  s.mass = assemble_matrix(m, s.dofs, c.sigma, p1_mass);
  s.motion = assemble_matrix(m, s.dofs, moving_sigma, p1_motion);
  s.unit_loads = phase_loads(m, s.dofs, w);
  return s;
}

std::vector<Eigen::VectorXcd> solve_time_harmonic(const mesh::Mesh& m, const TimeHarmonicSystem& s,
                                                  const std::vector<TimeHarmonicProblem>& problems,
                                                  TimeHarmonicStats& stats, const std::function<void(int, int)>& solved) {
  require_full_model(m);
  using Complex = std::complex<double>;
  using Matrix = Eigen::SparseMatrix<Complex>;
  const Matrix stiffness = s.stiffness.cast<Complex>(), mass = s.mass.cast<Complex>(), motion = s.motion.cast<Complex>();
  ComplexSequence lu("the time-harmonic system");
  std::vector<Eigen::VectorXcd> out;
  stats.n_dofs = s.dofs.n_dofs;
  for (const TimeHarmonicProblem& p : problems) {
    // M and C always added (also at omega = 0 or omega_r = 0), so every problem has K's pattern.
    const Matrix system = stiffness + Complex(0.0, p.omega) * mass + Complex(p.rotor_speed, 0.0) * motion;
    const Eigen::VectorXcd load =
        s.unit_loads.cast<Complex>() *
        Eigen::Map<const Eigen::VectorXcd>(p.currents.data(), Eigen::Index(p.currents.size()));
    out.push_back(complex_to_nodes(s.dofs, lu.solve(system, load, stats), m.n_nodes()));
    if (solved) solved(static_cast<int>(out.size()), static_cast<int>(problems.size()));
  }
  return out;
}

}  // namespace tf::solver
