#include "solver/spd_solver.hpp"

#include <dlfcn.h>

#include <cassert>
#include <vector>

#include <cholmod.h>

#include "solver/errors.hpp"

namespace tf::solver {
namespace {

// A view of K's lower triangle as a CHOLMOD matrix, without copying (stype -1: symmetric, lower
// part stored; CHOLMOD ignores the entries above the diagonal).
cholmod_sparse view_lower(const Eigen::SparseMatrix<double>& K) {
  assert(K.isCompressed() && K.rows() == K.cols());
  cholmod_sparse a{};
  a.nrow = a.ncol = static_cast<std::size_t>(K.rows());
  a.nzmax = static_cast<std::size_t>(K.nonZeros());
  a.p = const_cast<int*>(K.outerIndexPtr());
  a.i = const_cast<int*>(K.innerIndexPtr());
  a.x = const_cast<double*>(K.valuePtr());
  a.stype = -1;
  a.itype = CHOLMOD_INT;
  a.xtype = CHOLMOD_REAL;
  a.dtype = CHOLMOD_DOUBLE;
  a.sorted = 1;
  a.packed = 1;
  return a;
}

cholmod_dense view_dense(const Eigen::MatrixXd& f) {
  cholmod_dense b{};
  b.nrow = static_cast<std::size_t>(f.rows());
  b.ncol = static_cast<std::size_t>(f.cols());
  b.nzmax = b.nrow * b.ncol;
  b.d = b.nrow;
  b.x = const_cast<double*>(f.data());
  b.xtype = CHOLMOD_REAL;
  b.dtype = CHOLMOD_DOUBLE;
  return b;
}

// Eigen's sparse matrices may come uncompressed (after insert()); CHOLMOD wants packed columns.
const Eigen::SparseMatrix<double>& compressed(const Eigen::SparseMatrix<double>& K,
                                              Eigen::SparseMatrix<double>& copy) {
  if (K.isCompressed()) return K;
  copy = K;
  copy.makeCompressed();
  return copy;
}

}  // namespace

/// CHOLMOD's supernodal kernels ask OpenMP for a fixed 4 threads and OpenBLAS starts one per core;
/// on these 2-core machines, at the sizes a 2D section has, the threads mostly wait for each other
/// (measured: half of a rotor-position study's time in the kernel, sched_yield and futex wake-ups;
/// the study ran in 26 s with them and 19-20 s without). So: one BLAS thread, and OpenMP allowed to
/// give fewer threads than asked. Looked up at run time, so that any BLAS and OpenMP build links.
void quiet_library_threads() {
  static const bool done = [] {
    if (auto* set_blas = reinterpret_cast<void (*)(int)>(dlsym(RTLD_DEFAULT, "openblas_set_num_threads")))
      set_blas(1);
    if (auto* set_dynamic = reinterpret_cast<void (*)(int)>(dlsym(RTLD_DEFAULT, "omp_set_dynamic"))) set_dynamic(1);
    return true;
  }();
  (void)done;
}

struct SpdSolver::Impl {
  cholmod_common common{};
  cholmod_factor* factor = nullptr;
  std::vector<int> ordering;  ///< fill-reducing permutation of the last full analysis

  Impl() {
    quiet_library_threads();
    cholmod_start(&common);
    common.supernodal = CHOLMOD_SUPERNODAL;
    common.final_asis = 1;
    common.print = 0;  // failures are reported by SolveError with their usual causes, not on stderr
  }
  ~Impl() {
    free_factor();
    cholmod_finish(&common);
  }
  void free_factor() {
    if (factor) cholmod_free_factor(&factor, &common);
    factor = nullptr;
  }
};

SpdSolver::SpdSolver() : impl_(std::make_unique<Impl>()) {}
SpdSolver::~SpdSolver() = default;

void SpdSolver::analyse(const Eigen::SparseMatrix<double>& K) {
  Eigen::SparseMatrix<double> copy;
  cholmod_sparse a = view_lower(compressed(K, copy));
  impl_->free_factor();
  impl_->factor = cholmod_analyze(&a, &impl_->common);
  if (!impl_->factor) throw SolveError("CHOLMOD's symbolic analysis failed (out of memory?)");
  const int* perm = static_cast<const int*>(impl_->factor->Perm);
  impl_->ordering.assign(perm, perm + impl_->factor->n);
}

void SpdSolver::reanalyse_same_ordering(const Eigen::SparseMatrix<double>& K) {
  assert(static_cast<std::size_t>(K.rows()) == impl_->ordering.size());
  Eigen::SparseMatrix<double> copy;
  cholmod_sparse a = view_lower(compressed(K, copy));
  impl_->free_factor();
  cholmod_common& c = impl_->common;
  // Only the given permutation, no ordering search (CHOLMOD user guide: nmethods = 1, CHOLMOD_GIVEN);
  // the elimination tree is still postordered, which does not change the fill.
  const int saved_nmethods = c.nmethods;
  const int saved_ordering = c.method[0].ordering;
  c.nmethods = 1;
  c.method[0].ordering = CHOLMOD_GIVEN;
  impl_->factor = cholmod_analyze_p(&a, impl_->ordering.data(), nullptr, 0, &c);
  c.nmethods = saved_nmethods;
  c.method[0].ordering = saved_ordering;
  if (!impl_->factor) throw SolveError("CHOLMOD's symbolic analysis failed (out of memory?)");
}

void SpdSolver::factorize(const Eigen::SparseMatrix<double>& K) {
  assert(impl_->factor && "analyse() first");
  Eigen::SparseMatrix<double> copy;
  cholmod_sparse a = view_lower(compressed(K, copy));
  cholmod_factorize(&a, impl_->factor, &impl_->common);
  ++n_factorizations_;
  // On failure, minor is the column where the factorization stopped; on success it equals n.
  if (impl_->common.status == CHOLMOD_NOT_POSDEF || impl_->factor->minor != impl_->factor->n)
    throw SolveError(
        "the stiffness matrix could not be factorized (not positive definite); usual causes: a region "
        "that touches no node with A = 0 (a floating part of the model), or a zero or negative permeability");
  if (impl_->common.status < CHOLMOD_OK) throw SolveError("CHOLMOD's factorization failed (out of memory?)");
}

double SpdSolver::factor_nonzeros() const { return impl_->common.lnz; }

Eigen::MatrixXd SpdSolver::solve(const Eigen::MatrixXd& f) const {
  assert(impl_->factor && static_cast<std::size_t>(f.rows()) == impl_->factor->n);
  cholmod_dense b = view_dense(f);
  cholmod_dense* x = cholmod_solve(CHOLMOD_A, impl_->factor, &b, &impl_->common);
  if (!x) throw SolveError("CHOLMOD back-substitution failed");
  Eigen::MatrixXd out = Eigen::Map<const Eigen::MatrixXd>(static_cast<const double*>(x->x), f.rows(), f.cols());
  cholmod_free_dense(&x, &impl_->common);
  return out;
}

}  // namespace tf::solver
