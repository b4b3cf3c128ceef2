#include "study/compare.hpp"

#include <set>
#include <sstream>
#include <string>

#include <fmt/format.h>

#include "input/input_error.hpp"
#include "study/run.hpp"
#include "post/atomic_file.hpp"
#include "post/summary.hpp"

namespace tf::study {
namespace {

namespace fs = std::filesystem;

struct Row {
  std::string name, title;
  RunOutcome h;
};

std::string stem(const input::Case& c) { return fs::path(c.path).stem().string(); }

void write_csv(const fs::path& path, const std::vector<Row>& rows) {
  post::write_atomically(path, [&](std::ostream& o) {
    o << "case,title,solved_by,fundamental_T,amplitude_ripple,peak_field_ripple,rotation_uniformity_deg,"
         "backward_forward_ratio,harmonic_distortion,winding_factor\n";
    for (const auto& r : rows) {
      const auto& m = *r.h.field;
      o << fmt::format("{},\"{}\",{},{:.6g},{:.6g},{:.6g},{:.6g},{:.6g},{:.6g},{:.6g}\n", r.name, r.title,
                       strategy_name(r.h.strategy), m.mean_fundamental, m.amplitude_ripple, m.peak_ripple,
                       m.rotation_uniformity_deg, m.backward_forward_ratio, m.mean_distortion, r.h.winding_factor);
    }
  });
}

void print_table(std::ostream& out, const std::vector<Row>& rows) {
  std::size_t width = 4;
  for (const auto& r : rows) width = std::max(width, r.name.size());
  out << fmt::format("{:<{}}  {:<13}  {:>13}  {:>10}  {:>10}  {:>10}  {:>9}  {:>10}  {:>8}\n", "case", width, "solved by",
                     "fundamental T", "ampl. rip.", "peak rip.", "rot. dev.", "bwd/fwd", "distortion", "k_w1");
  for (const auto& r : rows) {
    const auto& m = *r.h.field;
    out << fmt::format("{:<{}}  {:<13}  {:>13.4f}  {:>9.3f}%  {:>9.2f}%  {:>7.3f}deg  {:>9.4f}  {:>9.2f}%  {:>8.4f}\n",
                       r.name, width, strategy_name(r.h.strategy), m.mean_fundamental, 100 * m.amplitude_ripple, 100 * m.peak_ripple,
                       m.rotation_uniformity_deg, m.backward_forward_ratio, 100 * m.mean_distortion, r.h.winding_factor);
  }
}

}  // namespace

void compare_cases(const std::vector<input::Case>& cases, const fs::path& out_dir, int field_files, std::ostream& out) {
  std::set<std::string> names;
  for (const auto& c : cases)
    if (c.study.kind != input::StudyKind::phase_angles)
      throw input::InputError(fmt::format("{}: compare tabulates phase-angle studies; this case's study is {}", c.path,
                                          input::study_kind_name(c.study.kind)));
  for (const auto& c : cases)
    if (!names.insert(stem(c)).second)
      throw input::InputError(
          fmt::format("{}: two cases are named '{}'; their result folders would clash", c.path, stem(c)));
  std::vector<Row> rows;
  for (const auto& c : cases) {
    out << fmt::format("running {} ...\n", c.path);
    input::Case run = c;
    if (field_files >= 0) run.study.n_field_files = std::min(field_files, run.study.n_steps);
    std::ostringstream quiet;
    rows.push_back({stem(c), c.title, run_study(run, {out_dir / stem(c), false, 0}, quiet)});
  }
  write_csv(out_dir / "comparison.csv", rows);
  out << '\n';
  print_table(out, rows);
  out << fmt::format("\nwritten: {}; each case's results in {}/<case name>\n", (out_dir / "comparison.csv").string(),
                     out_dir.string());
  out << post::kSafetyCaution << '\n';
}

}  // namespace tf::study
