#pragma once
// Field files for any VTK viewer: one .vtu per step (nodal A; per-triangle B vector, |B| and
// region id) and a .pvd collection that a viewer plays as a time series.

#include <filesystem>
#include <string>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"

namespace tf::post {

/// The mesh alone, with region ids, for a look before solving.
void write_mesh_vtu(const std::filesystem::path& path, const mesh::Mesh& m);

/// One step: nodal potential a [Wb/m] ("A_z_Wb_per_m"), "B_T" (vector), "B_magnitude_T", "region".
void write_field_vtu(const std::filesystem::path& path, const mesh::Mesh& m, const Eigen::VectorXd& a);

/// One value per triangle under `name` (e.g. "iron_loss_W_per_m3"), with "region".
void write_cell_field_vtu(const std::filesystem::path& path, const mesh::Mesh& m, const std::string& name,
                          const Eigen::VectorXd& values);

struct CollectionEntry {
  double time;           ///< [s]
  std::string filename;  ///< relative to the collection file
};
void write_collection(const std::filesystem::path& path, const std::vector<CollectionEntry>& entries);

}  // namespace tf::post
