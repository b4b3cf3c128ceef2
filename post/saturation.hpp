#pragma once
// Saturation honesty: iron given a constant permeability carries whatever flux density the
// linear equations ask of it, 15 T as readily as 1.5 T. Real electrical steels saturate near 2 T
// (common practice; J. Pyrhönen, T. Jokinen, V. Hrabovcová, Design of Rotating Electrical
// Machines, Wiley 2008, the table of permitted flux densities: teeth and yokes of electrical
// machines up to about 2 T, from memory), so a linear-iron region that carries more than that
// over a fair part of its area (not only in a few corner triangles) has results that overstate
// the field. This measures it per region and words the warning.

#include <string>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "solver/coefficients.hpp"

namespace tf::post {

/// What counts as saturated and how much of a region must be.
struct SaturationLimits {
  double threshold = 2.0;       ///< |B| [T] above which steel saturates (common practice)
  double min_fraction = 0.01;   ///< warn when more than this fraction of a region's area is above it
  double percentile = 0.99;     ///< the area-weighted percentile of |B| the warning quotes
};

/// One region's worst step.
struct RegionSaturation {
  int region = -1;              ///< index into mesh::Mesh::regions
  double fraction_above = 0.0;  ///< area fraction with |B| > threshold, in [0, 1]
  double percentile_b = 0.0;    ///< area-weighted percentile of |B| [T]
  std::string when;             ///< the step it was worst at, e.g. "step 3"
};

/// Regions the check watches: iron with a constant permeability (relative permeability of 10 or
/// more and no B-H curve). Iron with a B-H curve saturates in the solver; magnets (near 1) are no iron.
std::vector<bool> linear_iron_regions(const solver::RegionCoefficients& k);

/// Area-weighted percentile of values (#triangles, e.g. |B| [T]) over the triangles of `region`:
/// the smallest value v such that the triangles with value <= v hold at least `percentile` of
/// the region's area. 0 for a region without triangles.
double area_percentile(const mesh::Mesh& m, const Eigen::VectorXd& values, int region, double percentile);

/// Area fraction of `region` whose value exceeds `threshold`.
double area_fraction_above(const mesh::Mesh& m, const Eigen::VectorXd& values, int region, double threshold);

/// Watches the steps of a study: add each step's |B| per triangle, then ask for the warnings.
class SaturationWatch {
 public:
  /// watched: per region (linear_iron_regions); m must outlive the watch.
  SaturationWatch(const mesh::Mesh& m, std::vector<bool> watched, SaturationLimits limits = {});
  /// |B| [T] per triangle (#triangles) of one step; `when` names the step in the warning.
  void add_step(const Eigen::VectorXd& b_magnitude, const std::string& when);
  /// Per watched region, its worst step (largest area fraction above the threshold).
  const std::vector<RegionSaturation>& worst() const { return worst_; }
  /// No region to watch (every iron has a B-H curve): the steps need not be fed.
  bool idle() const { return worst_.empty(); }
  /// One warning per watched region above the limits, naming region, fraction, percentile and
  /// step; `steps_checked` says which steps were looked at ("all 36 steps"), `remedy` what the
  /// user can do about it.
  std::vector<std::string> warnings(const std::string& steps_checked,
                                    const std::string& remedy = "give the iron a B-H curve or enlarge the part") const;

 private:
  const mesh::Mesh* m_;
  std::vector<bool> watched_;
  SaturationLimits limits_;
  std::vector<RegionSaturation> worst_;
};

}  // namespace tf::post
