#pragma once
// Field files for any VTK viewer: one .vtu per step and a .pvd collection that a viewer plays as a
// time series. Every file draws the whole machine (post/field_drawing.hpp: a sector model unfolded
// with its signs, no exterior image) and carries per triangle "region" (an id), "phase" (1-based,
// 0 for no coil) and "direction" (+1/-1/0), and as field data "region_names" (indexed by the id),
// "phase_names" and the step's metadata.

#include <filesystem>
#include <string>
#include <utility>
#include <vector>

#include <Eigen/Core>

#include "post/field_drawing.hpp"

namespace tf::post {

/// What a file says about its step, as field data: one-value arrays (e.g. "rotor_angle_deg",
/// "current_A_A", named like the CSV columns) and strings (e.g. what the collection's time means).
struct FieldMetadata {
  std::vector<std::pair<std::string, double>> numbers;
  std::vector<std::pair<std::string, std::string>> texts;
};

/// The mesh alone, for a look before solving; it opens coloured by "region".
void write_mesh_vtu(const std::filesystem::path& path, const FieldDrawing& d);

/// One step of the drawing's model field a [Wb/m] (#model nodes): "A_z_Wb_per_m" at nodes, "B_T"
/// (vector) and "B_magnitude_T" per triangle, unfolded with the sector's signs.
void write_field_vtu(const std::filesystem::path& path, const FieldDrawing& d, const Eigen::VectorXd& a,
                     const FieldMetadata& info = {});

/// One value per model triangle under `name` (e.g. "iron_loss_W_per_m3"), a value that does not
/// change sign with the field: copied to every copy.
void write_cell_field_vtu(const std::filesystem::path& path, const FieldDrawing& d, const std::string& name,
                          const Eigen::VectorXd& values, const FieldMetadata& info = {});

struct CollectionEntry {
  double time;           ///< [s]
  std::string filename;  ///< relative to the collection file
};
void write_collection(const std::filesystem::path& path, const std::vector<CollectionEntry>& entries);

}  // namespace tf::post
