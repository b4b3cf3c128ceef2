#include "solver/flux_linkage.hpp"

#include <string>

#include "solver/errors.hpp"

namespace tf::solver {

Eigen::MatrixXd flux_linkage(const mesh::Mesh& m, const mesh::Winding& w, const Eigen::MatrixXd& a,
                             double stack_length) {
  // Integral of A over each region: for first-order triangles, area times the vertex mean.
  Eigen::MatrixXd integral = Eigen::MatrixXd::Zero(static_cast<Eigen::Index>(m.regions.size()), a.cols());
  for (int t = 0; t < m.n_triangles(); ++t) {
    const double share = mesh::triangle_area(m, t) / 3.0;
    for (int i = 0; i < 3; ++i) integral.row(m.triangle_region(t)) += share * a.row(m.triangles(t, i));
  }
  const std::vector<double> area = mesh::region_areas(m);
  Eigen::MatrixXd psi = Eigen::MatrixXd::Zero(w.spec.n_phases, a.cols());
  for (const mesh::CoilSide& s : w.sides) {
    const int r = mesh::find_region(m, mesh::RegionKind::coil, s.slot, s.layer);
    if (r < 0 && m.symmetry.copies > 1) continue;  // outside the sector: counted by its image below
    if (r < 0) throw SolveError("no coil region for slot " + std::to_string(s.slot) + " layer " + std::to_string(s.layer));
    psi.row(s.phase) += (s.direction * s.turns / area[r]) * integral.row(r);
  }
  // Sector model: a side k sectors on from one in the model carries direction s (-1)^k (anti-periodic)
  // and sees the mean potential (-1)^k A-bar, so s N A-bar is the same for every image and the
  // whole winding links `copies` times what the sector's sides do.
  return psi * (m.symmetry.copies * stack_length / w.spec.parallel_paths);
}

Eigen::MatrixXd inductance_matrix(const mesh::Mesh& m, const mesh::Winding& w, const PhaseFields& f,
                                  double stack_length) {
  return flux_linkage(m, w, f.potential, stack_length);
}

}  // namespace tf::solver
