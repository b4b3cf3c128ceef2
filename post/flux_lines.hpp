#pragma once
// Flux lines of a 2D field: the contours of A_z. Between two lines A_z = a1 and A_z = a2 flows
// the flux (a2 - a1) per metre of stack, so lines at equally spaced levels are equally spaced in
// flux and crowd where B is strong.

#include <vector>

#include <Eigen/Core>

#include "post/polylines.hpp"

namespace tf::post {

/// n levels equally spaced over [lo, hi], each in the middle of its n-th of the range:
/// lo + (i + 1/2) (hi - lo) / n, i = 0 .. n - 1. Empty when hi <= lo or n < 1.
std::vector<double> contour_levels(double lo, double hi, int n);

/// The contour a = level of a field linear on each triangle (first-order elements): the level
/// crosses an edge whose ends lie on either side of it at the linearly interpolated point, so
/// each triangle holds at most one straight segment. Nodes at exactly the level count as above
/// it. nodes: #nodes by 2 [m]; triangles: #triangles by 3; a: #nodes. The segments are joined
/// across shared edges into polylines.
std::vector<Polyline> contour(const Eigen::MatrixX2d& nodes, const Eigen::MatrixX3i& triangles,
                              const Eigen::VectorXd& a, double level);

}  // namespace tf::post
