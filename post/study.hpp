#pragma once
// A phase-angle study by superposition: the supply advances through one electrical period in K equal steps;
// each step's field is the superposition of the unit phase fields, sampled through the gap operators.

#include <complex>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/gap_field.hpp"
#include "post/pole_map.hpp"
#include "post/rotation_metrics.hpp"
#include "solver/phase_fields.hpp"
#include "solver/supply.hpp"

namespace tf::post {

/// How the air gap is sampled and how far its spectrum is reported.
struct GapSampling {
  int n_gap_points = 720;  ///< samples on the mid-gap circle
  int max_harmonic = 25;   ///< highest electrical space order reported
};

struct StepResult {
  double electrical_angle = 0.0;  ///< ωt [rad]; for stepped DC, 360°·k/K for state k
  std::vector<double> currents;   ///< phase currents [A]
  Eigen::VectorXd br, bt;         ///< B_r, B_θ [T] at the gap sample angles
  Eigen::VectorXcd harmonics;     ///< c_n [T], mechanical order n = 0 .. p * max_harmonic
  std::complex<double> fundamental;  ///< c_p
  double axis = 0.0;        ///< mechanical axis angle of the fundamental [rad]
  double peak = 0.0;        ///< max_θ |B_r| [T]
  double distortion = 0.0;  ///< sqrt(Σ_{n≠p} |c_n|²)/|c_p|, n = 1 .. p * max_harmonic
  std::vector<Pole> poles;  ///< the stator field's north and south poles on the mid-gap circle
};

struct StudyResult {
  std::vector<double> sample_angles;  ///< [rad]
  std::vector<StepResult> steps;
  RotationMetrics metrics;
  /// c_p [T/A] of 1 A in each phase alone: the field any set of currents makes is their sum.
  std::vector<std::complex<double>> unit_fundamentals;
};

StudyResult phase_sweep(const mesh::Mesh& m, const mesh::Winding& w, const solver::PhaseFields& fields,
                        const solver::Supply& supply, int n_steps, const GapSampling& sampling);

/// The gap quantities of one field, nodal A (#nodes): B_r, B_θ, harmonics up to max_order
/// (mechanical), fundamental, axis, peak, distortion and poles; angle and currents left empty.
StepResult sample_gap_field(const GapOperators& ops, const Eigen::VectorXd& a, int pole_pairs, int max_order);

/// r.metrics from the fundamentals, peaks and distortions of r.steps.
void finish_rotation_metrics(StudyResult& r, int pole_pairs);

/// Steps [0, K) that get a field file: n evenly spaced, always including step 0.
std::vector<int> field_file_steps(int n_steps, int n_files);

}  // namespace tf::post

namespace tf::post {

/// c_p [T/A] on the mid-gap circle of 1 A in each phase alone (for circuits solved before the study).
std::vector<std::complex<double>> unit_fundamentals(const mesh::Mesh& m, const solver::PhaseFields& fields,
                                                    int pole_pairs);

}  // namespace tf::post
