#pragma once
// The report page of one case run (report.html): the inputs, the headline numbers with units and
// the figures of its study. Each builder turns results into a post::Page; write_report writes it.

#include <string>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "post/cross_section.hpp"
#include "post/eddy_quantities.hpp"
#include "post/html_report.hpp"
#include "post/motion_result.hpp"
#include "post/study.hpp"
#include "post/summary.hpp"

namespace tf::post {

/// What every case report shows besides its study's results.
struct ReportContext {
  std::string title;
  std::string study;        ///< study kind as case files spell it
  std::string model;        ///< which model was solved (whole cross-section or a sector)
  std::string inputs_json;  ///< the case as read, a JSON object
  int pole_pairs = 1;
  double winding_factor = 0.0;  ///< fundamental; NaN when not defined
  CrossSection section;
};

/// |B| [T] per triangle of nodal A_z [Wb/m].
Eigen::VectorXd flux_density_magnitude(const mesh::Mesh& m, const Eigen::VectorXd& a);

/// The report page of a run, assembled from the bodies its record has: headline numbers (field
/// metrics, torque, Newton, speeds), the cross-section, the gap-field figures over the steps, the
/// torque figure, the per-speed table and figures, and the inputs.
Page study_page(const ReportContext& x, const RunRecord& r);

/// The inputs echoed as rows "section.key = value" with the unit read from the key's suffix
/// ("frequency_Hz" -> Hz); an invalid document gives one row saying so.
Section inputs_section(const std::string& inputs_json);

}  // namespace tf::post
