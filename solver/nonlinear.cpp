#include "solver/nonlinear.hpp"

#include <stdexcept>

#include <algorithm>
#include <cassert>
#include <cmath>

#include "solver/assemble.hpp"
#include "solver/p1.hpp"

namespace tf::solver {

struct NonlinearSolver::Element {
  Eigen::Matrix3d unit_stiffness;  ///< int grad(phi_i) . grad(phi_j) [1]
  double area = 0.0;               ///< [m^2]
  int region = 0;
  ElementDofs unknowns;            ///< A at vertex i = signs(i) * a(dofs(i)); dofs -1 at fixed nodes
  std::array<int, 9> value_index;  ///< where K(i, j) sits in matrix_.valuePtr(); -1 if fixed
};

namespace {

struct Material {
  double nu;
  double dnu_db2;
};

Material material_of(const RegionLaw& law, double b_squared) {
  if (!law.curve) return {law.nu, 0.0};
  const BhCurve::Reluctivity r = law.curve->reluctivity(b_squared);
  return {r.nu, r.dnu_db2};
}

}  // namespace

std::vector<RegionLaw> region_laws(const RegionCoefficients& c) {
  std::vector<RegionLaw> laws;
  for (std::size_t r = 0; r < c.nu.size(); ++r) laws.push_back({c.nu[r], c.curve[r] ? &*c.curve[r] : nullptr});
  return laws;
}

NonlinearSolver::NonlinearSolver(const mesh::Mesh& m, const DofMap& d, std::vector<RegionLaw> laws,
                                 NewtonControls controls)
    : mesh_(m), laws_(std::move(laws)), controls_(controls) {
  assert(laws_.size() == m.regions.size());
  for (const RegionLaw& law : laws_) {
    assert(law.curve || law.nu > 0);
    if (law.curve) linear_ = false;
  }
  elements_.resize(static_cast<std::size_t>(m.n_triangles()));
  for (int t = 0; t < m.n_triangles(); ++t) {
    Element& e = elements_[static_cast<std::size_t>(t)];
    e.unit_stiffness = p1_stiffness(triangle_xy(m, t), 1.0);
    e.area = mesh::triangle_area(m, t);
    e.region = m.triangle_region(t);
  }
  set_dofs(d);
}

NonlinearSolver::~NonlinearSolver() = default;

void NonlinearSolver::set_dofs(const DofMap& d) {
  // The pattern is made once by setFromTriplets; later assemblies write values in place, so every
  // Newton iteration sees the same pattern and reuses the symbolic factorization.
  std::vector<Eigen::Triplet<double>> triplets;
  triplets.reserve(9 * elements_.size());
  for (int t = 0; t < mesh_.n_triangles(); ++t) {
    Element& e = elements_[static_cast<std::size_t>(t)];
    e.unknowns = element_dofs(mesh_, d, t);
    const Eigen::Vector3i& dofs = e.unknowns.dofs;
    for (int i = 0; i < 3; ++i)
      for (int j = 0; j < 3; ++j)
        if (dofs(i) >= 0 && dofs(j) >= 0) triplets.emplace_back(dofs(i), dofs(j), 1.0);
  }
  const bool same_size = n_dofs_ == d.n_dofs && matrix_.rows() == d.n_dofs;
  n_dofs_ = d.n_dofs;
  matrix_ = Eigen::SparseMatrix<double>(n_dofs_, n_dofs_);
  matrix_.setFromTriplets(triplets.begin(), triplets.end());
  matrix_.makeCompressed();
  for (Element& e : elements_)
    for (int i = 0; i < 3; ++i)
      for (int j = 0; j < 3; ++j) {
        const Eigen::Vector3i& dofs = e.unknowns.dofs;
        int& index = e.value_index[static_cast<std::size_t>(3 * i + j)];
        index = -1;
        if (dofs(i) < 0 || dofs(j) < 0) continue;
        const int* begin = matrix_.innerIndexPtr() + matrix_.outerIndexPtr()[dofs(j)];
        const int* end = matrix_.innerIndexPtr() + matrix_.outerIndexPtr()[dofs(j) + 1];
        index = static_cast<int>(std::lower_bound(begin, end, dofs(i)) - matrix_.innerIndexPtr());
      }
  // Same unknowns: try the ordering of the last full analysis (no ordering search). Measured on a
  // 100k-unknown polar mesh, a turned rotor can nearly double the fill of that ordering, which costs
  // more in every Newton factorization than a new search saves; then analyse afresh.
  // Measured on the bundled magnet demos, the old ordering never passed for a turned rotor, and each
  // failed try cost a symbolic analysis: after a failure, try again only every 16th numbering.
  bool fresh = !same_size || turns_since_failed_reuse_ < 16;
  if (!fresh) {
    cholesky_.reanalyse_same_ordering(matrix_);
    fresh = cholesky_.factor_nonzeros() > 1.1 * analysed_fill_;
    turns_since_failed_reuse_ = fresh ? 0 : 16;
  } else if (same_size) {
    ++turns_since_failed_reuse_;
  }
  if (fresh) {
    cholesky_.analyse(matrix_);
    analysed_fill_ = cholesky_.factor_nonzeros();
  }
  ++n_analyses_;
  factorized_.reset();
  last_solution_.resize(0);
}

std::vector<double> NonlinearSolver::triangle_b_squared(const Eigen::VectorXd& a) const {
  assert(a.size() == n_dofs_);
  std::vector<double> b2;
  b2.reserve(elements_.size());
  // |B|^2 = |grad a|^2 = a_e^T S_e a_e / area on a first-order triangle.
  for (const Element& e : elements_) {
    const Eigen::Vector3d ae = element_values(e.unknowns, a);
    b2.push_back(std::max(0.0, ae.dot(e.unit_stiffness * ae) / e.area));
  }
  return b2;
}

Eigen::VectorXd NonlinearSolver::residual(const Eigen::VectorXd& a, const Eigen::VectorXd& f) const {
  Eigen::VectorXd r = -f;
  for (const Element& e : elements_) {
    const Eigen::Vector3d ae = element_values(e.unknowns, a);
    const Eigen::Vector3d sa = e.unit_stiffness * ae;
    const double nu = material_of(laws_[static_cast<std::size_t>(e.region)], std::max(0.0, ae.dot(sa) / e.area)).nu;
    for (int i = 0; i < 3; ++i)
      if (e.unknowns.dofs(i) >= 0) r(e.unknowns.dofs(i)) += e.unknowns.signs(i) * nu * sa(i);
  }
  return r;
}

void NonlinearSolver::assemble(const Eigen::VectorXd& a, Matrix kind) {
  double* values = matrix_.valuePtr();
  std::fill(values, values + matrix_.nonZeros(), 0.0);
  for (const Element& e : elements_) {
    const Eigen::Vector3d ae = element_values(e.unknowns, a);
    const Eigen::Vector3d sa = e.unit_stiffness * ae;
    const Material mat = material_of(laws_[static_cast<std::size_t>(e.region)], std::max(0.0, ae.dot(sa) / e.area));
    Eigen::Matrix3d k = mat.nu * e.unit_stiffness;
    // Consistent Jacobian of r_e = nu(B^2) S_e a_e with B^2 = a_e^T S_e a_e / area:
    // J_e = nu S_e + 2 (dnu/dB^2) (S_e a_e)(S_e a_e)^T / area, symmetric.
    if (kind == Matrix::jacobian) k += (2 * mat.dnu_db2 / e.area) * (sa * sa.transpose());
    for (int ij = 0; ij < 9; ++ij)
      if (e.value_index[static_cast<std::size_t>(ij)] >= 0)
        values[e.value_index[static_cast<std::size_t>(ij)]] += e.unknowns.signs(ij / 3) * e.unknowns.signs(ij % 3) * k(ij / 3, ij % 3);
  }
}

double NonlinearSolver::line_search(const Eigen::VectorXd& a, const Eigen::VectorXd& f, const Eigen::VectorXd& step,
                                    const Eigen::VectorXd& r0, Eigen::VectorXd& r) const {
  // The energy functional Pi(a) = sum_e area w(B_e) - f.a is convex for a monotone B-H curve and
  // its gradient is the residual, so its slope along the step, g(alpha) = r(a + alpha step) . step,
  // increases with alpha. Take the full Newton step unless g(1) shows we went well past the minimum
  // of Pi along the line; then find that minimum by regula falsi with the Illinois modification.
  constexpr double eta = 0.25;  // accept |g| <= eta |g(0)| (a curvature condition, common practice)
  const double g0 = r0.dot(step);
  auto slope = [&](double alpha) {
    r = residual(a + alpha * step, f);
    return r.dot(step);
  };
  const double g1 = slope(1.0);
  if (!(g0 < 0) || g1 <= eta * std::abs(g0)) return 1.0;
  double lo = 0.0, g_lo = g0, hi = 1.0, g_hi = g1, alpha = 1.0;
  int last_side = 0;
  for (int it = 0; it < 30; ++it) {
    alpha = (lo * g_hi - hi * g_lo) / (g_hi - g_lo);
    const double g = slope(alpha);
    if (std::abs(g) <= eta * std::abs(g0)) break;
    if (g < 0) {
      if (last_side < 0) g_hi /= 2;
      lo = alpha, g_lo = g, last_side = -1;
    } else {
      if (last_side > 0) g_lo /= 2;
      hi = alpha, g_hi = g, last_side = 1;
    }
  }
  return alpha;
}

NewtonReport NonlinearSolver::solve(const Eigen::VectorXd& f, Eigen::VectorXd& a, const QuantityWatch& watch) {
  assert(f.size() == n_dofs_);
  NewtonReport report;
  factorized_.reset();
  if (a.size() != n_dofs_) a = Eigen::VectorXd::Zero(n_dofs_);
  const double f_norm = f.norm();
  if (f_norm == 0.0) {
    a.setZero();
    report.converged = true;
  } else if (linear_) {
    assemble(a, Matrix::secant);
    cholesky_.factorize(matrix_);
    factorized_ = Matrix::jacobian;
    const Eigen::VectorXd start = a;
    a = cholesky_.solve(f);
    report.iterations = 1;
    report.update = (a - start).norm();
    report.converged = true;
  } else {
    Eigen::VectorXd r = residual(a, f);
    report.residuals.push_back(r.norm());
    Eigen::VectorXd watched = watch ? watch(a) : Eigen::VectorXd();
    for (int it = 1; it <= controls_.max_iterations && !report.converged; ++it) {
      assemble(a, Matrix::jacobian);
      cholesky_.factorize(matrix_);
      const Eigen::VectorXd step = -cholesky_.solve(r);
      const double alpha = line_search(a, f, step, Eigen::VectorXd(r), r);
      a += alpha * step;
      report.iterations = it;
      report.update = alpha * step.norm();
      report.residuals.push_back(r.norm());
      report.step_lengths.push_back(alpha);
      report.converged = r.norm() <= controls_.tolerance * f_norm && report.update <= controls_.tolerance * a.norm();
      if (watch && !report.converged) {
        const Eigen::VectorXd now = watch(a);
        const double moved = (now - watched).lpNorm<Eigen::Infinity>();
        report.converged = moved <= controls_.quantity_tolerance && r.norm() <= controls_.residual_guard * f_norm;
        watched = now;
      }
    }
    // The factor holds the Jacobian of the last step's start, which the tolerance puts within a
    // relative 1e-5 or so of the solution's: good for small-signal (incremental) solves.
    if (report.converged) factorized_ = Matrix::jacobian;
  }
  report.residual = residual(a, f).norm();
  last_solution_ = a;
  last_b_squared_ = triangle_b_squared(a);
  return report;
}

Eigen::VectorXd NonlinearSolver::predict(const Eigen::VectorXd& f) {
  assert(f.size() == n_dofs_);
  if (!linear_ && last_b_squared_.empty()) return Eigen::VectorXd::Zero(n_dofs_);
  // The secant reluctivity of each triangle as the last solution left it: the iron saturates
  // where it did, and only the change since then is left to Newton.
  double* values = matrix_.valuePtr();
  std::fill(values, values + matrix_.nonZeros(), 0.0);
  for (std::size_t t = 0; t < elements_.size(); ++t) {
    const Element& e = elements_[t];
    const double nu = material_of(laws_[static_cast<std::size_t>(e.region)], linear_ ? 0.0 : last_b_squared_[t]).nu;
    for (int ij = 0; ij < 9; ++ij)
      if (e.value_index[static_cast<std::size_t>(ij)] >= 0)
        values[e.value_index[static_cast<std::size_t>(ij)]] +=
            e.unknowns.signs(ij / 3) * e.unknowns.signs(ij % 3) * nu * e.unit_stiffness(ij / 3, ij % 3);
  }
  cholesky_.factorize(matrix_);
  factorized_.reset();
  return cholesky_.solve(f);
}

Eigen::MatrixXd NonlinearSolver::solve_with(Matrix kind, const Eigen::MatrixXd& rhs) {
  if (last_solution_.size() != n_dofs_)
    throw std::logic_error("NonlinearSolver: a linearised solve needs a solution in the current numbering; solve() first");
  assert(last_solution_.size() == n_dofs_ && "solve() first");
  assert(rhs.rows() == n_dofs_);
  // For a linear problem the Jacobian and the secant matrix are the same matrix.
  const bool ready = factorized_ == kind || (linear_ && factorized_);
  if (!ready) {
    assemble(last_solution_, kind);
    cholesky_.factorize(matrix_);
    factorized_ = kind;
  }
  return cholesky_.solve(rhs);
}

Eigen::MatrixXd NonlinearSolver::solve_incremental(const Eigen::MatrixXd& rhs) { return solve_with(Matrix::jacobian, rhs); }

Eigen::MatrixXd NonlinearSolver::solve_frozen(const Eigen::MatrixXd& rhs) { return solve_with(Matrix::secant, rhs); }

double NonlinearSolver::coenergy(const Eigen::VectorXd& a) const { return integrate(a, Density::coenergy); }

double NonlinearSolver::energy(const Eigen::VectorXd& a) const { return integrate(a, Density::energy); }

double NonlinearSolver::integrate(const Eigen::VectorXd& a, Density kind) const {
  const std::vector<double> b2 = triangle_b_squared(a);
  double sum = 0.0;
  for (std::size_t t = 0; t < elements_.size(); ++t) {
    const RegionLaw& law = laws_[static_cast<std::size_t>(elements_[t].region)];
    const double b = std::sqrt(b2[t]);
    // A linear region's energy and co-energy are equal: nu B^2 / 2.
    const double density = !law.curve                   ? 0.5 * law.nu * b2[t]
                           : kind == Density::coenergy ? law.curve->coenergy_density(b)
                                                       : law.curve->energy_density(b);
    sum += elements_[t].area * density;
  }
  return mesh_.symmetry.copies * sum;  // a sector model: the whole machine is `copies` images
}

double NonlinearSolver::coenergy_stationary(const Eigen::VectorXd& f, const Eigen::VectorXd& a) const {
  return mesh_.symmetry.copies * f.dot(a) - energy(a);
}

}  // namespace tf::solver
