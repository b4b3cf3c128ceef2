#include "post/study.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

namespace tf::post {

namespace {

/// Axis, peak, distortion and poles of a step whose B_r, B_θ and harmonics are filled in.
void derive_gap_quantities(StepResult& s, double radius, int pole_pairs, int max_order) {
  s.fundamental = s.harmonics(pole_pairs);
  s.axis = axis_angle(s.fundamental, pole_pairs);
  s.peak = s.br.cwiseAbs().maxCoeff();
  s.poles = pole_map(s.br, radius);
  const double others = s.harmonics.segment(1, max_order).squaredNorm() - std::norm(s.fundamental);
  s.distortion = std::abs(s.fundamental) > 0.0 ? std::sqrt(std::max(0.0, others)) / std::abs(s.fundamental) : 0.0;
}

}  // namespace

StudyResult phase_sweep(const mesh::Mesh& m, const mesh::Winding& w, const solver::PhaseFields& fields,
                        const solver::Supply& supply, int n_steps_asked, const GapSampling& plan) {
  const int p = w.spec.pole_pairs();
  const int max_order = p * plan.max_harmonic;
  const GapOperators ops = gap_operators(m, plan.n_gap_points, max_order);
  // Sample the m unit phase fields once; each step is then a small combination of them.
  const Eigen::MatrixXd unit_br = ops.br * fields.potential;
  const Eigen::MatrixXd unit_bt = ops.bt * fields.potential;
  const Eigen::MatrixXcd unit_harmonics = gap_harmonics(ops, fields.potential);

  StudyResult out;
  out.sample_angles = ops.angles;
  out.unit_fundamentals.resize(w.spec.n_phases);
  for (int k = 0; k < w.spec.n_phases; ++k) out.unit_fundamentals[k] = unit_harmonics(p, k);
  const auto currents = solver::step_currents(supply, w.spec.n_phases, n_steps_asked);
  const int n_steps = static_cast<int>(currents.size());
  for (int k = 0; k < n_steps; ++k) {
    StepResult s;
    s.electrical_angle = 2 * std::numbers::pi * k / n_steps;
    s.currents = currents[k];
    const Eigen::Map<const Eigen::VectorXd> i(s.currents.data(), static_cast<Eigen::Index>(s.currents.size()));
    s.br = unit_br * i;
    s.bt = unit_bt * i;
    s.harmonics = unit_harmonics * i.cast<std::complex<double>>();
    derive_gap_quantities(s, ops.radius, p, max_order);
    out.steps.push_back(std::move(s));
  }
  finish_rotation_metrics(out, p);
  return out;
}

StepResult sample_gap_field(const GapOperators& ops, const Eigen::VectorXd& a, int pole_pairs, int max_order) {
  StepResult s;
  s.br = ops.br * a;
  s.bt = ops.bt * a;
  s.harmonics = gap_harmonics(ops, a).col(0);
  derive_gap_quantities(s, ops.radius, pole_pairs, max_order);
  return s;
}

void finish_rotation_metrics(StudyResult& r, int pole_pairs) {
  std::vector<std::complex<double>> fundamental;
  std::vector<double> peak, distortion;
  for (const StepResult& s : r.steps) {
    fundamental.push_back(s.fundamental);
    peak.push_back(s.peak);
    distortion.push_back(s.distortion);
  }
  r.metrics = rotation_metrics(fundamental, peak, distortion, pole_pairs);
}

std::vector<int> field_file_steps(int n_steps, int n_files) {
  std::vector<int> steps;
  for (int f = 0; f < n_files; ++f) {
    const int k = static_cast<int>(std::llround(static_cast<double>(f) * n_steps / n_files));
    if (steps.empty() || steps.back() != k) steps.push_back(k);
  }
  return steps;
}

}  // namespace tf::post

namespace tf::post {

std::vector<std::complex<double>> unit_fundamentals(const mesh::Mesh& m, const solver::PhaseFields& fields,
                                                    int pole_pairs) {
  const GapOperators ops = gap_operators(m, 720, pole_pairs);
  const Eigen::MatrixXcd c = gap_harmonics(ops, fields.potential);
  std::vector<std::complex<double>> out;
  for (Eigen::Index k = 0; k < c.cols(); ++k) out.push_back(c(pole_pairs, k));
  return out;
}

}  // namespace tf::post
