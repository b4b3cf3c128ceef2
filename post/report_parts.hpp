#pragma once
// The parts of a case report that belong to one body of the run record (post/case_report.cpp
// assembles them): rotor motion (back-EMF, flux linkages, dq inductances, iron loss) and eddy
// currents (torque, EMF and rotor loss against slip and speed).

#include <string>
#include <vector>

#include "post/html_report.hpp"
#include "post/motion_result.hpp"
#include "post/summary.hpp"

namespace tf::post {

/// The back-EMF per phase over the steps of a study whose rotor turns: rms [V], peak [V] and THD
/// (NaN unless the steps cover whole electrical periods).
struct EmfSummary {
  std::vector<double> rms, peak, thd;  ///< per phase
  int periods = 0;                     ///< whole electrical periods the steps cover; 0 if not whole
  int highest_order = 0;               ///< the highest harmonic the THD counts
};
EmfSummary emf_summary(const MotionResult& r, int pole_pairs);

/// Back-EMF, flux-linkage and dq-inductance figures, the EMF table and headline rows of a study
/// whose rotor turns; the iron-loss table of any step-by-step study that estimated it.
void add_motion_parts(Page& page, std::vector<KeyValue>& head, const MotionResult& r, int pole_pairs, bool rotor_turns);

/// The per-speed table, headline rows and figures of an eddy-current study.
void add_speed_parts(Page& page, std::vector<KeyValue>& head, const std::vector<SpeedResult>& rows);

/// A table's column formatted against its largest magnitude (round-off prints as 0).
std::vector<std::string> column_text(const std::vector<double>& values, int digits);

}  // namespace tf::post
