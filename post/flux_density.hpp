#pragma once
#include <Eigen/Core>

#include "mesh/mesh.hpp"

namespace tf::post {

/// Flux density per triangle, #triangles by 2 (B_x, B_y) [T], from nodal A_z [Wb/m].
Eigen::MatrixX2d flux_density(const mesh::Mesh& m, const Eigen::VectorXd& a);

}  // namespace tf::post
