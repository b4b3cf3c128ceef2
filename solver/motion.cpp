#include "solver/motion.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <sstream>

#include "solver/assemble.hpp"
#include "solver/coefficients.hpp"
#include "solver/dofs.hpp"
#include "solver/errors.hpp"
#include "solver/magnets.hpp"
#include "solver/stopwatch.hpp"

namespace tf::solver {
namespace {


/// Identity numbering: one "unknown" per node, to build loads once in node space.
DofMap node_space(const mesh::Mesh& m) {
  DofMap d;
  d.n_dofs = m.n_nodes();
  d.dof_of_node.resize(m.n_nodes());
  d.sign_of_node.assign(m.n_nodes(), 1);
  for (int i = 0; i < m.n_nodes(); ++i) d.dof_of_node[i] = i;
  return d;
}

}  // namespace

double sliding_pitch(const mesh::Mesh& m) {
  return 2 * std::numbers::pi / static_cast<double>(m.sliding.stator_nodes.size() * m.symmetry.copies);
}

int rotor_shift(const mesh::Mesh& m, double angle) {
  return static_cast<int>(std::lround(angle / sliding_pitch(m)));
}

struct MotionSolver::Impl {
  Impl(const mesh::Mesh& mesh, const mesh::Winding& winding, const Materials& mat, const MagnetLayout& layout,
       NewtonControls c)
      : m(mesh),
        w(winding),
        coefficients(region_coefficients(mesh, mat)),
        dofs(number_dofs(mesh, 0)),
        solver(mesh, dofs, region_laws(coefficients), c) {
    const DofMap all = node_space(m);
    unit_loads = phase_loads(m, all, w);
    magnet_source = layout.n_poles > 0 ? magnet_load(m, all, mat, layout) : Eigen::VectorXd::Zero(m.n_nodes());
    stats.n_dofs = dofs.n_dofs;
    stats.n_analyses = solver.analyses();
  }
  const mesh::Mesh& m;
  const mesh::Winding& w;
  RegionCoefficients coefficients;  ///< nu and B-H curves per region (referenced by the solver's laws)
  DofMap dofs;                  ///< numbering of the rotor position solved last
  NonlinearSolver solver;
  Eigen::MatrixXd unit_loads;    ///< #nodes by #phases
  Eigen::VectorXd magnet_source; ///< #nodes
  int shift = 0;
  MotionStats stats;
  Eigen::VectorXd last_field;  ///< nodal A of the last solve (rotor nodes in the rotor's frame); empty before

  /// The unknowns of the current numbering from nodal potentials: each unknown the mean of its
  /// nodes' values (a rotor-side circle node and the stator node it is now tied to may disagree).
  Eigen::VectorXd unknowns_of(const Eigen::VectorXd& nodal) const {
    Eigen::VectorXd x = Eigen::VectorXd::Zero(dofs.n_dofs), count = Eigen::VectorXd::Zero(dofs.n_dofs);
    for (std::size_t node = 0; node < dofs.dof_of_node.size(); ++node) {
      const int dof = dofs.dof_of_node[node];
      if (dof < 0) continue;
      x(dof) += dofs.sign(static_cast<int>(node)) * nodal(static_cast<Eigen::Index>(node));
      count(dof) += 1.0;
    }
    return x.cwiseQuotient(count.cwiseMax(1.0));
  }

  Eigen::MatrixXd unit_loads_in_dofs() const {
    Eigen::MatrixXd f(dofs.n_dofs, unit_loads.cols());
    for (Eigen::Index k = 0; k < f.cols(); ++k) f.col(k) = gather(dofs, unit_loads.col(k));
    return f;
  }

  void turn_to(int k) {
    if (k == shift) return;
    const Stopwatch clock;
    dofs = number_dofs(m, k);
    solver.set_dofs(dofs);
    stats.analyse_seconds += clock.seconds();
    stats.n_analyses = solver.analyses();
    shift = k;
  }
};

MotionSolver::MotionSolver(const mesh::Mesh& m, const mesh::Winding& w, const Materials& materials,
                           const MagnetLayout& layout, NewtonControls controls) {
  const Stopwatch clock;
  impl_ = std::make_unique<Impl>(m, w, materials, layout, controls);
  impl_->stats.analyse_seconds = clock.seconds();  // the first analysis, with the ordering search
}
MotionSolver::~MotionSolver() = default;


double MotionSolver::coenergy(int shift, const std::vector<double>& currents) {
  // The stationary form of the co-energy errs by the square of the field's error. A neighbouring
  // position (a pitch away) barely changes the saturation, so the prediction with the last
  // solution's permeabilities frozen is already close enough: one factorization, no Newton.
  Impl& s = *impl_;
  s.turn_to(shift);
  const Stopwatch clock;
  const Eigen::Map<const Eigen::VectorXd> i(currents.data(), static_cast<Eigen::Index>(currents.size()));
  const Eigen::VectorXd f = gather(s.dofs, s.unit_loads * i + s.magnet_source);
  const double w = s.solver.coenergy_stationary(f, s.solver.predict(f));
  s.stats.solve_seconds += clock.seconds();
  return w;
}

PositionField MotionSolver::solve(int shift, const std::vector<double>& currents, bool warm_start,
                                  const QuantityWatch& watch) {
  Impl& s = *impl_;
  s.turn_to(shift);
  const Stopwatch clock;
  const Eigen::Map<const Eigen::VectorXd> i(currents.data(), static_cast<Eigen::Index>(currents.size()));
  const Eigen::VectorXd f = gather(s.dofs, s.unit_loads * i + s.magnet_source);
  const bool warm = warm_start && s.last_field.size() > 0;
  // The last field, its rotor part in the rotor's frame and so turned with the rotor: measured on the
  // bundled saturated demos it needs fewer Newton iterations than the linear prediction with the
  // last permeabilities frozen, and spares that prediction's factorization.
  Eigen::VectorXd a = warm ? s.unknowns_of(s.last_field) : Eigen::VectorXd::Zero(s.dofs.n_dofs);
  PositionField out;
  out.shift = shift;
  QuantityWatch in_unknowns;
  if (watch) in_unknowns = [&](const Eigen::VectorXd& x) { return watch(to_nodes(s.dofs, x).col(0)); };
  out.newton = s.solver.solve(f, a, in_unknowns);
  out.relative_residual = f.norm() > 0.0 ? out.newton.residual / f.norm() : 0.0;
  s.stats.solve_seconds += clock.seconds();
  ++s.stats.n_solves;
  s.stats.n_iterations += out.newton.iterations;
  s.stats.max_iterations = std::max(s.stats.max_iterations, out.newton.iterations);
  if (!out.newton.converged) {
    std::ostringstream msg;
    msg << "Newton iterations did not converge in " << out.newton.iterations << " iterations (residual "
        << out.relative_residual << " of the load); usual causes: a B-H table that ends far below the flux densities "
        << "reached, or currents far beyond the machine's rating";
    throw SolveError(msg.str());
  }
  out.a = to_nodes(s.dofs, a);
  s.last_field = out.a;
  out.coenergy = s.solver.coenergy_stationary(f, a);
  return out;
}

Eigen::MatrixXd MotionSolver::frozen_unit_fields() {
  return to_nodes(impl_->dofs, impl_->solver.solve_frozen(impl_->unit_loads_in_dofs()));
}

Eigen::MatrixXd MotionSolver::incremental_unit_fields() {
  return to_nodes(impl_->dofs, impl_->solver.solve_incremental(impl_->unit_loads_in_dofs()));
}

MotionStats MotionSolver::stats() const {
  MotionStats s = impl_->stats;
  s.n_factorizations = impl_->solver.factorizations();
  return s;
}

}  // namespace tf::solver
