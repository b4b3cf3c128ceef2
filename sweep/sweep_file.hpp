#pragma once
// A sweep file (TOML) names a base case and the case keys to vary, each as a list of values or a
// range, combined as a full grid or zipped; cases/sweeps/*.toml are examples:
//
//   title = "Slot opening against coil pitch"
//   base_case = "pump24_three_phase.toml"     # relative to the sweep file
//   combine = "grid"                          # or "zip": the i-th values of every key together
//   rank_by = "peak_field_ripple"             # optional; metrics in sweep_metrics.hpp
//   rank_tolerance = 0.005                    # optional: within 0.5 % of the best is a tie
//   tie_break = "harmonic_distortion"         # optional: orders the variants tied with the best
//   pareto = ["peak_field_ripple:lowest", "fundamental_T:highest"]   # optional: x and y of a Pareto view
//   [fixed]                                   # optional: the same change in every variant
//   "study.field_files" = 4
//   [[vary]]
//   key = "stator.slot.opening"               # dotted, as the case file nests it
//   values = [0.0015, 0.0025, 0.004]
//   [[vary]]
//   key = "winding.coil_pitch"
//   range = { start = 4, stop = 6, count = 3 }  # or step = 1 instead of count
//
// A varied or fixed key must be set in the base case: its value there is replaced, in the base
// case's own text, so a variant's case file reads line for line like the base case.

#include <string>
#include <vector>

#include "sweep/sweep_ranking.hpp"

namespace tf::sweep {

/// One varied key and its values as TOML literals (0.0025, 5, "open", true).
struct VariedKey {
  std::string key;
  std::vector<std::string> values;
  int line = 0;  ///< in the sweep file
};

struct FixedKey {
  std::string key;
  std::string value;  ///< a TOML literal
  int line = 0;
};

enum class Combine { grid, zip };

struct SweepFile {
  std::string path;       ///< as given
  std::string title;
  std::string base_case;  ///< path of the base case, relative to the working folder
  std::string base_text;  ///< the base case's text as read
  Combine combine = Combine::grid;
  std::vector<VariedKey> varied;
  std::vector<FixedKey> fixed;
  RankSpec ranking;       ///< rank_by, rank_tolerance, tie_break, pareto as the file states them
};

/// The most variants a sweep file may make; more is almost surely a typo in a range.
inline constexpr std::size_t kMaxVariants = 100000;

/// Reads and checks a sweep file (and reads its base case's text). Throws input::InputError naming the
/// file, line and key: unknown keys, a missing base case, empty or mixed-type value lists, bad
/// ranges, zipped lists of different lengths, keys the base case does not set or sets to a table
/// or an array, unknown metrics, more than kMaxVariants variants. A misspelt key gets the nearest
/// one suggested ("did you mean").
SweepFile read_sweep_file(const std::string& path);

}  // namespace tf::sweep
