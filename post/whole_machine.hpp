#pragma once
// The cross-section a model stands for, drawn whole: a sector model's copies turned round the axis
// with the anti-periodic sign applied, so that no reader unfolds it by hand with the wrong sign.
// The exterior image of an open boundary (a disc drawn beside the machine) is left out.

#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"

namespace tf::post {

/// Copy k of the model is turned by k * 2 pi / copies; nodes that copies share on their cuts are
/// merged. Regions index the model's regions.
struct WholeMachine {
  Eigen::MatrixX2d nodes;
  Eigen::MatrixX3i triangles;
  Eigen::VectorXi triangle_region;
  std::vector<int> node_source;      ///< the model's node each node is a copy of
  std::vector<int> node_copy;        ///< which copy it belongs to
  std::vector<int> triangle_source;  ///< the model's triangle each triangle is a copy of
  std::vector<int> triangle_copy;
  mesh::Symmetry symmetry;           ///< the model's: copies and whether the field changes sign

  int n_nodes() const { return static_cast<int>(nodes.rows()); }
  int n_triangles() const { return static_cast<int>(triangles.rows()); }
  /// Angle [rad] copy k is turned by.
  double copy_angle(int copy) const;
};

/// The whole machine of a (sector or whole) model, without its exterior image.
WholeMachine unfold(const mesh::Mesh& model);

/// A nodal field of the model (e.g. A_z) on the whole machine: each copy's values times its sign.
Eigen::VectorXd unfold_nodal(const WholeMachine& w, const Eigen::VectorXd& model_values);

/// A per-triangle value that does not change sign with the field (|B|, a loss density, a region's
/// property) on the whole machine.
Eigen::VectorXd unfold_cells(const WholeMachine& w, const Eigen::VectorXd& model_values);

/// A per-triangle vector (B, rows x y) on the whole machine: turned with its copy and signed.
Eigen::MatrixX2d unfold_cell_vectors(const WholeMachine& w, const Eigen::MatrixX2d& model_vectors);

/// The model as a mesh of the whole machine (its regions kept; no sliding circle, cuts or ties):
/// for drawing and field files only, never for solving.
mesh::Mesh drawing_mesh(const mesh::Mesh& model, const WholeMachine& w);

}  // namespace tf::post
