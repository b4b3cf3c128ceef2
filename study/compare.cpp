#include "study/compare.hpp"

#include <cassert>
#include <cmath>
#include <set>
#include <sstream>
#include <string>

#include <fmt/format.h>

#include "input/input_error.hpp"
#include "post/atomic_file.hpp"
#include "post/compare_report.hpp"
#include "post/summary.hpp"
#include "study/run.hpp"

namespace tf::study {
namespace {

namespace fs = std::filesystem;

std::string stem(const input::Case& c) { return fs::path(c.path).stem().string(); }

/// Why a study kind has nothing to compare: its stator field does not turn over the steps.
const char* not_comparable(input::StudyKind k) {
  switch (k) {
    case input::StudyKind::eddy_currents:
      return "one time-harmonic solution per rotor speed, not an air-gap field stepping through a period";
    case input::StudyKind::cogging: return "no stator current, so no stator field turns";
    case input::StudyKind::rotor_sweep: return "its currents are held at one instant, so the stator field does not turn";
    default: return nullptr;
  }
}

/// Refuses, before anything is solved, a case compare cannot tabulate or two cases whose folders would clash.
void check_cases(const std::vector<input::Case>& cases) {
  for (const auto& c : cases)
    if (!input::stator_field_turns(c.study.kind))
      throw input::InputError(fmt::format(
          "{}: [study] kind = \"{}\": compare needs a study whose stator field turns over the steps (expected "
          "\"phase_angles\" or \"synchronous\"); this one has {}",
          c.path, input::study_kind_name(c.study.kind), not_comparable(c.study.kind)));
  std::set<std::string> names;
  for (const auto& c : cases)
    if (!names.insert(stem(c)).second)
      throw input::InputError(
          fmt::format("{}: two cases are named '{}'; their result folders would clash", c.path, stem(c)));
}

std::string optional_number(bool has, double v) { return has && std::isfinite(v) ? fmt::format("{:.6g}", v) : ""; }

void write_csv(const fs::path& path, const std::vector<post::ComparedCase>& rows) {
  post::write_atomically(path, [&](std::ostream& o) {
    o << "case,title,solved_by,fundamental_T,amplitude_ripple,peak_field_ripple,rotation_uniformity_deg,"
         "backward_forward_ratio,harmonic_distortion,winding_factor,locus_axis_ratio,torque_mean_N_m,torque_ripple\n";
    for (const auto& r : rows) {
      const auto& m = r.metrics;
      const bool torque = r.torque.has_value();
      o << fmt::format("{},\"{}\",{},{:.6g},{:.6g},{:.6g},{:.6g},{:.6g},{:.6g},{:.6g},{:.6g},{},{}\n", r.name, r.title,
                       r.solved_by, m.mean_fundamental, m.amplitude_ripple, m.peak_ripple, m.rotation_uniformity_deg,
                       m.backward_forward_ratio, m.mean_distortion, r.winding_factor, post::locus_axis_ratio(m),
                       optional_number(torque, torque ? r.torque->mean : 0.0),
                       optional_number(torque, torque ? r.torque->ripple : 0.0));
    }
  });
}

void print_table(std::ostream& out, const std::vector<post::ComparedCase>& rows) {
  std::size_t width = 4;
  for (const auto& r : rows) width = std::max(width, r.name.size());
  out << fmt::format("{:<{}}  {:<13}  {:>13}  {:>10}  {:>10}  {:>10}  {:>9}  {:>10}  {:>8}\n", "case", width, "solved by",
                     "fundamental T", "ampl. rip.", "peak rip.", "rot. dev.", "bwd/fwd", "distortion", "k_w1");
  for (const auto& r : rows) {
    const auto& m = r.metrics;
    out << fmt::format("{:<{}}  {:<13}  {:>13.4f}  {:>9.3f}%  {:>9.2f}%  {:>7.3f}deg  {:>9.4f}  {:>9.2f}%  {:>8.4f}\n",
                       r.name, width, r.solved_by, m.mean_fundamental, 100 * m.amplitude_ripple, 100 * m.peak_ripple,
                       m.rotation_uniformity_deg, m.backward_forward_ratio, 100 * m.mean_distortion, r.winding_factor);
  }
}

}  // namespace

void compare_cases(const std::vector<input::Case>& cases, const fs::path& out_dir, int field_files, std::ostream& out) {
  check_cases(cases);
  std::vector<post::ComparedCase> rows;
  for (const auto& c : cases) {
    out << fmt::format("running {} ...\n", c.path);
    input::Case run = c;
    if (field_files >= 0) run.study.n_field_files = std::min(field_files, run.study.n_steps);
    std::ostringstream quiet;
    const RunOutcome outcome = run_study(run, {out_dir / stem(c), false, 0}, quiet);
    // check_cases let only studies whose stator field turns through, and run_study compares those.
    assert(outcome.compared);
    rows.push_back(*outcome.compared);
    rows.back().name = stem(c);
    rows.back().solved_by = strategy_name(outcome.strategy);
  }
  write_csv(out_dir / "comparison.csv", rows);
  post::write_report(out_dir, post::comparison_page(rows));
  out << '\n';
  print_table(out, rows);
  out << fmt::format("\nwritten: {} and {}; each case's results in {}/<case name>\n",
                     (out_dir / "comparison.csv").string(), (out_dir / "report.html").string(), out_dir.string());
  out << post::kSafetyCaution << '\n';
}

}  // namespace tf::study
