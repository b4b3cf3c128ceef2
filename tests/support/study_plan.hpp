#pragma once
#include "post/study.hpp"

namespace tf::testing {

/// A phase-angle study of `steps` steps, no field files, 720 gap points, harmonics to `harmonics`.
inline post::StudyPlan study_plan(int steps, int harmonics) {
  post::StudyPlan plan;
  plan.n_steps = steps;
  plan.n_field_files = 0;
  plan.n_gap_points = 720;
  plan.max_harmonic = harmonics;
  return plan;
}

}  // namespace tf::testing
