#pragma once
// summary.json: inputs echoed, headline numbers with units, solver statistics, version.
// Written last, so its presence marks a complete result folder.

#include <filesystem>
#include <string>
#include <utility>
#include <vector>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/study.hpp"
#include "solver/phase_fields.hpp"

namespace tf::post {

/// Printed in every report and summary.
inline constexpr const char* kSafetyCaution =
    "Results are design estimates from a 2D model. Electric machines carry dangerous voltages, currents and "
    "forces: confirm every design by tests and by licensed engineers under local codes before building or "
    "energising it.";

struct RunRecord {
  std::string version;
  std::string inputs_json;  ///< the case as read, echoed as a JSON object
  std::string drive_json;   ///< the currents as used and the inductances, a JSON object
  const mesh::Mesh* mesh = nullptr;
  const mesh::Winding* winding = nullptr;
  const StudyResult* study = nullptr;
  solver::SolveStats stats;
  std::vector<std::pair<std::string, double>> seconds;  ///< wall time per stage
  std::vector<std::string> files;                       ///< written before the summary
};

void write_summary(const std::filesystem::path& path, const RunRecord& r);

/// Writes a summary JSON document (given as text) with the parts every summary has: program,
/// version, caution, inputs, stage times and files.
void write_summary_document(const std::filesystem::path& path, const std::string& body_json, const std::string& version,
                            const std::string& inputs_json,
                            const std::vector<std::pair<std::string, double>>& seconds,
                            const std::vector<std::string>& files);

}  // namespace tf::post
