#include "post/vtu.hpp"

#include <vtkCellArray.h>
#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkFloatArray.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkSmartPointer.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include "post/atomic_file.hpp"
#include "post/flux_density.hpp"

namespace tf::post {
namespace {

vtkSmartPointer<vtkUnstructuredGrid> grid_of(const mesh::Mesh& m) {
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  vtkNew<vtkPoints> points;
  points->SetDataTypeToFloat();
  points->SetNumberOfPoints(m.n_nodes());
  for (int i = 0; i < m.n_nodes(); ++i) points->SetPoint(i, m.nodes(i, 0), m.nodes(i, 1), 0.0);
  grid->SetPoints(points);
  vtkNew<vtkCellArray> cells;
  cells->AllocateExact(m.n_triangles(), 3 * m.n_triangles());
  for (int t = 0; t < m.n_triangles(); ++t) {
    const vtkIdType ids[3] = {m.triangles(t, 0), m.triangles(t, 1), m.triangles(t, 2)};
    cells->InsertNextCell(3, ids);
  }
  grid->SetCells(VTK_TRIANGLE, cells);
  vtkNew<vtkIntArray> region;
  region->SetName("region");
  region->SetNumberOfValues(m.n_triangles());
  for (int t = 0; t < m.n_triangles(); ++t) region->SetValue(t, m.triangle_region(t));
  grid->GetCellData()->AddArray(region);
  return grid;
}

void write_grid(const std::filesystem::path& path, vtkUnstructuredGrid* grid) {
  const auto temporary = temporary_name(path);
  vtkNew<vtkXMLUnstructuredGridWriter> writer;
  writer->SetFileName(temporary.c_str());
  writer->SetInputData(grid);
  writer->SetDataModeToAppended();
  writer->SetIdTypeToInt32();
  writer->SetHeaderTypeToUInt32();
  writer->SetCompressorTypeToZLib();
  writer->SetCompressionLevel(1);  // measured here: about twice as fast as the default level
  if (writer->Write() != 1) {
    std::filesystem::remove(temporary);
    throw OutputError("could not write " + path.string());
  }
  commit_file(temporary, path);
}

}  // namespace

void write_mesh_vtu(const std::filesystem::path& path, const mesh::Mesh& m) {
  auto grid = grid_of(m);
  write_grid(path, grid);
}

void write_field_vtu(const std::filesystem::path& path, const mesh::Mesh& m, const Eigen::VectorXd& a) {
  auto grid = grid_of(m);
  vtkNew<vtkDoubleArray> potential;
  potential->SetName("A_z_Wb_per_m");
  potential->SetNumberOfValues(m.n_nodes());
  for (int i = 0; i < m.n_nodes(); ++i) potential->SetValue(i, a(i));
  grid->GetPointData()->AddArray(potential);

  const Eigen::MatrixX2d b = flux_density(m, a);
  // Single precision is ample for looking at B and halves the files.
  vtkNew<vtkFloatArray> vector, magnitude;
  vector->SetName("B_T");
  vector->SetNumberOfComponents(3);
  vector->SetNumberOfTuples(m.n_triangles());
  magnitude->SetName("B_magnitude_T");
  magnitude->SetNumberOfValues(m.n_triangles());
  for (int t = 0; t < m.n_triangles(); ++t) {
    vector->SetTuple3(t, b(t, 0), b(t, 1), 0.0);
    magnitude->SetValue(t, b.row(t).norm());
  }
  grid->GetCellData()->AddArray(vector);
  grid->GetCellData()->AddArray(magnitude);
  grid->GetCellData()->SetActiveScalars("B_magnitude_T");
  write_grid(path, grid);
}

void write_collection(const std::filesystem::path& path, const std::vector<CollectionEntry>& entries) {
  write_atomically(path, [&](std::ostream& out) {
    out << "<?xml version=\"1.0\"?>\n<VTKFile type=\"Collection\" version=\"0.1\">\n  <Collection>\n";
    for (const auto& e : entries)
      out << "    <DataSet timestep=\"" << e.time << "\" part=\"0\" file=\"" << e.filename << "\"/>\n";
    out << "  </Collection>\n</VTKFile>\n";
  });
}

}  // namespace tf::post
