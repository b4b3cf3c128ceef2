// The result tables and the terminal summary of a run, each from the bodies its record has.

#include <cmath>
#include <numbers>

#include <fmt/format.h>

#include "post/eddy_output.hpp"
#include "post/motion_output.hpp"
#include "post/space_harmonics.hpp"
#include "post/summary.hpp"
#include "post/tables.hpp"

namespace tf::post {
namespace {

constexpr double kDeg = 180.0 / std::numbers::pi;

void print_field(std::ostream& out, const RotationMetrics& x) {
  out << fmt::format("  air-gap B_r fundamental   {:.4f} T   amplitude ripple {:.4f} %\n", x.mean_fundamental,
                     100 * x.amplitude_ripple);
  out << fmt::format("  peak |B_r|                {:.4f} .. {:.4f} T   peak-field ripple {:.2f} %\n", x.min_peak,
                     x.max_peak, 100 * x.peak_ripple);
  out << fmt::format("  rotation                  {:.3f} deg per step expected, worst deviation {:.4f} deg\n",
                     x.expected_step_deg, x.rotation_uniformity_deg);
  out << fmt::format("  backward/forward ratio    {:.4f} ({})   harmonic distortion {:.2f} %\n",
                     x.backward_forward_ratio, x.forward >= x.backward ? "turning counter-clockwise" : "turning clockwise",
                     100 * x.mean_distortion);
}

void print_torque(std::ostream& out, const char* method, const TorqueStats& t) {
  out << fmt::format("  torque, {:<13} mean {:>10.5g} N m   {:>10.5g} .. {:<10.5g}  ripple {}\n", method, t.mean, t.min,
                     t.max, std::isnan(t.ripple) ? std::string("-") : fmt::format("{:.2f} %", 100 * t.ripple));
}

void print_motion(std::ostream& out, const RunRecord& rec) {
  const MotionResult& r = *rec.motion;
  if (rec.study == "synchronous")
    out << fmt::format("  rotor turning with the field, load angle {:.2f} electrical degrees\n", rec.load_angle * kDeg);
  print_torque(out, "Arkkio", r.arkkio);
  print_torque(out, "circle", r.circle);
  if (r.has_virtual_work) print_torque(out, "virtual work", r.virtual_work);
  out << fmt::format("  cogging period {:.3f} deg expected (360/LCM(Q, 2p)), {:.3f} deg in the Arkkio torque\n",
                     r.cogging_period_expected * kDeg, r.cogging_period_measured * kDeg);
}

/// Flux linkage range of phase A and Newton's work: every study solved step by step.
void print_steps(std::ostream& out, const MotionResult& r) {
  double lo = r.steps.front().flux_linkage[0], hi = lo;
  for (const auto& s : r.steps) lo = std::min(lo, s.flux_linkage[0]), hi = std::max(hi, s.flux_linkage[0]);
  out << fmt::format("  flux linkage A {:.5g} .. {:.5g} Wb, Newton iterations per solve {:.2f}\n", lo, hi,
                     r.mean_newton_iterations);
  if (r.n_solved < static_cast<int>(r.steps.size()))
    out << fmt::format("  {} of {} steps solved; each of the others mirrors one of them by the field's half-period symmetry\n",
                       r.n_solved, r.steps.size());
  if (!r.iron_loss.empty()) {
    double total = 0.0;
    for (const auto& [region, watts] : r.iron_loss) total += watts;
    out << fmt::format("  iron loss {:.4g} W (Steinmetz-type estimate, iron_loss.csv)\n", total);
  }
}

void print_speeds(std::ostream& out, const EddyResult& e) {
  if (e.slip_method) out << fmt::format("  {}\n", e.method);
  out << "  speed rad/s    slip     torque N m   rotor loss W (by power balance)   EMF A V rms\n";
  for (const auto& r : e.rows)
    out << fmt::format("  {:>11.1f}  {:>6.3f}  {:>13.5g}  {:>12.5g} ({:>12.5g})  {:>12.5g}\n", r.rotor_speed, r.slip,
                       r.torque, r.rotor_loss, r.rotor_loss_balance, r.emf_rms.front());
}

}  // namespace

std::vector<std::string> write_result_tables(const std::filesystem::path& dir, const RunRecord& r) {
  std::vector<std::string> files;
  if (r.field) {
    write_steps_table(dir / "steps.csv", *r.field, r.frequency);
    write_gap_table(dir / "gap_field.csv", *r.field);
    write_harmonics_table(dir / "harmonics.csv", *r.field, r.winding->spec.pole_pairs());
    write_poles_table(dir / "poles.csv", *r.field);
    files = {"steps.csv", "gap_field.csv", "harmonics.csv", "poles.csv"};
    // The steps of a turning field cover one electrical period: each order splits into its waves.
    if (r.field_rotates) {
      write_space_harmonics(dir / "space_harmonics.csv", space_harmonics(*r.field, *r.winding, r.frequency));
      files.push_back("space_harmonics.csv");
    }
  }
  write_winding_tables(dir, *r.winding, 13);
  files.insert(files.end(), {"winding.csv", "winding_factors.csv"});
  if (r.motion) {
    if (r.rotor_turns) {
      write_torque_table(dir / "torque.csv", *r.motion);
      files.push_back("torque.csv");
    }
    write_inductance_table(dir / "inductances.csv", *r.motion);
    files.push_back("inductances.csv");
  }
  if (r.eddy) {
    write_torque_speed(dir / "torque_speed.csv", r.eddy->rows, r.winding->spec.pole_pairs());
    files.push_back("torque_speed.csv");
  }
  return files;
}

void print_summary(std::ostream& out, const RunRecord& r, const std::filesystem::path& dir) {
  out << fmt::format("{}\n", r.title);
  for (const auto& w : r.warnings) out << "warning: " << w << "\n";
  out << fmt::format("  {}\n  {} study, solved by {}\n", r.machine, r.study, r.strategy);
  if (r.field && r.field_rotates) print_field(out, r.field->metrics);
  if (r.motion && r.rotor_turns) print_motion(out, r);
  if (r.motion) print_steps(out, *r.motion);
  if (r.eddy) print_speeds(out, *r.eddy);
  for (const auto& line : r.notes) out << "  " << line << "\n";
  out << fmt::format("  solved on {}\n", r.model);
  out << fmt::format("  results in {}\n", dir.string());
  out << "  " << kSafetyCaution << "\n";
}

}  // namespace tf::post
