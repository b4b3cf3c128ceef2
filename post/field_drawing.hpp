#pragma once
// What every field file draws: the whole machine of a (sector) model, its rotor where it stood, the
// exterior image of an open boundary left out, and regions named for the whole machine (copy k of
// a quarter model's slot_01_layer_1 is slot_07_layer_1 of a 24-slot stator) with the phase and
// direction of each coil side.

#include <string>
#include <vector>

#include <Eigen/Core>

#include "mesh/geometry.hpp"
#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/whole_machine.hpp"

namespace tf::post {

/// A region of the whole machine, as a viewer names and colours it.
struct DrawnRegion {
  std::string name;       ///< e.g. "slot_07_layer_2", "magnet_3", "stator_iron"
  mesh::RegionKind kind = mesh::RegionKind::stator_iron;
  int phase = 0;          ///< 1-based phase of a coil side (1 is A); 0 for no coil
  int direction = 0;      ///< +1 or -1 for a coil side (the winding's sign), else 0
};

struct FieldDrawing {
  mesh::Mesh model;  ///< the model drawn: its rotor turned to where the drawing shows it
  /// Sign of the field on the model's rotor side in the drawing: a sector model draws its rotor
  /// turned back by whole sectors, which shows the image of the field, -1 per anti-periodic sector.
  int rotor_sign = 1;
  WholeMachine whole;
  std::vector<DrawnRegion> regions;  ///< indexed by the ids of triangle_region
  Eigen::VectorXi triangle_region;   ///< #whole triangles
  std::vector<std::string> phase_names;  ///< "A", "B", ... (the winding's phases)

  /// A nodal field of the model (#model nodes, e.g. A_z [Wb/m]) on the whole machine.
  Eigen::VectorXd nodal(const Eigen::VectorXd& model_values) const;
  /// The model's nodal field as the drawn model carries it (the rotor side times rotor_sign).
  Eigen::VectorXd drawn_field(const Eigen::VectorXd& model_values) const;
};

/// The model with its rotor drawn where it stood at rotor_angle [rad]: a sector model's rotor piece
/// turned back by `turns` whole sectors into the stator's sector, which shows the image of the rotor
/// that many sectors on, whose field carries the sign (-1)^turns when anti-periodic.
struct RotorDrawn {
  mesh::Mesh model;
  int turns = 0;
  int rotor_sign = 1;
};
RotorDrawn rotor_drawn(const mesh::Mesh& model, double rotor_angle);

/// A nodal field of the model (#model nodes) with its rotor side times rotor_sign.
Eigen::VectorXd rotor_signed(const mesh::Mesh& model, const Eigen::VectorXd& values, int rotor_sign);

/// The model drawn whole with its rotor at rotor_angle [rad] (a sector model: turned back by whole
/// sectors into the stator's sector, then unfolded). g numbers the whole machine's slots and rotor
/// poles or bars; w (may be null) gives the coil sides' phases and directions.
FieldDrawing field_drawing(const mesh::Mesh& model, const mesh::Geometry& g, const mesh::Winding* w,
                           double rotor_angle = 0.0);

/// The drawing as a mesh with the whole machine's regions (for region tables and areas): drawing only.
mesh::Mesh drawing_as_mesh(const FieldDrawing& d);

}  // namespace tf::post
