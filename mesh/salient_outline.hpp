#pragma once
// Where the parts of a salient pole lie: the one description of the outline that both the mesher
// (mesh/salient_shapes.cpp) and the case checks (app/case_validation.cpp) use, so the two cannot
// drift apart. Pure geometry, no Gmsh.
//
// Pole-local coordinates [m]: x along the pole centre line, outwards from the machine axis;
// y across it, positive counter-clockwise. Pole k is this picture turned by 2*pi*(k - 1)/P.
//
//        yoke (r >= yoke_radius)
//   ──────┬──────────┬──────┬──────────┬────── r = yoke_radius
//         │  coil 2  │ body │  coil 1  │          coil_top
//         │ (layer 2)│      │ (layer 1)│
//         └──────────┤      ├──────────┘          coil_floor
//      ╲_____________│      │_____________╱       shoe_back_radius (an arc)
//       ╲____________ pole face _________╱        bore_radius (an arc spanning shoe_arc)

#include <cmath>

#include "mesh/geometry.hpp"

namespace tf::mesh {

struct PoleOutline {
  double shoe_back_radius = 0.0;  ///< the shoe's outer arc, where the body starts [m]
  double yoke_radius = 0.0;       ///< the yoke's inner circle, where the body ends [m]
  double half_shoe_arc = 0.0;     ///< the shoe spans -half_shoe_arc .. +half_shoe_arc [rad]
  double body_half_width = 0.0;   ///< the body's sides are y = -body_half_width and +body_half_width [m]
  double coil_outer_y = 0.0;      ///< layer 1 spans y from body_half_width to coil_outer_y; layer 2 mirrors it [m]
  /// x of the coil sides' gap-side edge. The coils rest on the shoe where the body meets it; the
  /// shoe's back curves away from there, leaving a thin wedge of air under each coil.
  double coil_floor = 0.0;
  double coil_top = 0.0;  ///< x of the coil sides' outer edge: coil_floor + coil_height [m]
};

/// The outline of a salient pole. Precondition: s.kind == StatorKind::salient and the body
/// narrower than the shoe back (the case checks ensure both).
inline PoleOutline pole_outline(const StatorGeometry& s) {
  const SalientPoles& p = s.poles;
  PoleOutline o;
  o.shoe_back_radius = s.bore_radius + p.shoe_height;
  o.yoke_radius = o.shoe_back_radius + p.body_height;
  o.half_shoe_arc = 0.5 * p.shoe_arc;
  o.body_half_width = 0.5 * p.body_width;
  o.coil_outer_y = o.body_half_width + p.coil_width;
  o.coil_floor = std::sqrt(o.shoe_back_radius * o.shoe_back_radius - o.body_half_width * o.body_half_width);
  o.coil_top = o.coil_floor + p.coil_height;
  return o;
}

}  // namespace tf::mesh
