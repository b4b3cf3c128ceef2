#pragma once
// A case: everything one run needs, read and validated from a TOML case file.
// Plain data in SI units; nothing after the reader touches the file again.

#include <optional>
#include <string>

#include "mesh/geometry.hpp"
#include "mesh/winding_spec.hpp"
#include "input/study_plan.hpp"
#include "solver/materials.hpp"
#include "solver/slip.hpp"
#include "solver/supply.hpp"

namespace tf::input {

struct Case {
  std::string path;   ///< the case file, as given
  std::string title;  ///< free text for reports
  double stack_length = 0.1;  ///< [m]; per-metre results are multiplied by it where said
  mesh::Geometry geometry;
  mesh::WindingSpec winding;
  solver::Materials materials;
  std::optional<solver::EndRings> end_rings;  ///< a cage's end rings; none: ideal rings
  solver::Supply supply;
  StudyPlan study;
  mesh::MeshControls mesh;
  /// Solve the whole cross-section even when a sector would do ([mesh] model = "full").
  bool full_model = false;
};

}  // namespace tf::input
