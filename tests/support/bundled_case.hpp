#pragma once
// For the study layer's tests: a bundled case, a run on a coarse mesh, a file's whole text.

#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>

#include "input/case_reader.hpp"
#include "study/run.hpp"

namespace tf::testing {

/// cases/<name>.toml of the source tree, read and validated.
inline input::Case bundled(const std::string& name) {
  return input::read_case(std::string(TF_SOURCE_DIR) + "/cases/" + name + ".toml");
}

inline std::string text_of(const std::filesystem::path& path) {
  std::ifstream in(path);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

/// Runs a case on a coarse mesh with `steps` steps into a fresh folder of its own under the
/// temporary folder (test cases run as processes at once: no two may share one), the terminal
/// lines into `terminal`; returns the folder and the run's outcome.
inline std::filesystem::path run_coarse(input::Case c, int steps, const std::string& folder, study::RunOutcome& outcome,
                                        std::string* terminal = nullptr) {
  c.mesh.fineness = 0.5;
  input::override_steps(c, steps);
  c.study.n_field_files = 0;
  const std::filesystem::path dir = std::filesystem::temp_directory_path() / ("turnfield_" + folder);
  std::filesystem::remove_all(dir);
  std::ostringstream out;
  outcome = study::run_study(c, {dir, false, 0}, out);
  if (terminal) *terminal = out.str();
  return dir;
}

}  // namespace tf::testing
