#pragma once
// The cross-section the report draws: the whole machine (a sector model unfolded with the
// anti-periodic sign applied, the exterior image of an open boundary left out), |B| per triangle,
// the flux lines (contours of A_z), the winding (each coil side outlined in its phase's colour
// and labelled "A+" / "B−"), magnets with an arrow of their magnetization, and rotor bars.

#include <string>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/svg_plot.hpp"
#include "post/whole_machine.hpp"

namespace tf::post {

/// The drawing's data, on the whole machine. Empty (no triangles): the figure says "no data".
struct CrossSection {
  WholeMachine machine;               ///< regions index `regions`
  std::vector<mesh::Region> regions;  ///< the model's
  double sliding_radius = 0.0;        ///< [m]; the seam there is not an outline
  int rotor_sign = 1;                 ///< -1 where the rotor drawn is the image of the model's (anti-periodic)
  Eigen::VectorXd b_magnitude;        ///< #machine triangles [T]
  Eigen::VectorXd a;                  ///< #machine nodes [Wb/m], each copy's sign applied
  std::string a_name = "A_z";         ///< what `a` is, e.g. "Re(A_z), the field at ωt = 0"
  mesh::Winding winding;              ///< its sides label the coil regions
  std::string when;                   ///< e.g. "step 0 (ωt = 0°)"

  bool empty() const { return machine.n_triangles() == 0; }
};

/// What a strategy hands over: the model as solved, with the rotor where the model has it.
struct SectionInput {
  const mesh::Mesh& model;
  const mesh::Winding& winding;
  Eigen::VectorXd a;            ///< #model nodes [Wb/m]: the solved A_z (eddy currents: Re of the phasor)
  Eigen::VectorXd b_magnitude;  ///< #model triangles [T]
  double rotor_angle = 0.0;     ///< [rad] the rotor stood at (counter-clockwise)
  std::string when;
  std::string a_name = "A_z";
};

/// The section of a solved model: the rotor drawn where it stood (a sector model's rotor piece
/// turned back by whole sectors, its field signed as the image it then is), then unfolded.
CrossSection cross_section(const SectionInput& in);

/// Flux lines drawn: this many levels equally spaced in A over the machine.
inline constexpr int kFluxLevels = 24;
/// The colour scale ends at this area-weighted quantile of |B|.
inline constexpr double kClipFraction = 0.995;

/// A coil side's label: phase and direction, "A+" for a positive current out of the page (+z).
std::string coil_label(const mesh::CoilSide& side);

/// The figure's map: |B| clipped at kClipFraction, the flux lines, outlines, labels, arrows and
/// key. Points into `s`, which must outlive it.
svg::FieldMap section_map(const CrossSection& s);

/// The figure's caption: what is drawn, at which instant, and how.
std::string section_caption(const CrossSection& s);

}  // namespace tf::post
