#include "post/vtu.hpp"

#include <fmt/format.h>

#include <vtkCellArray.h>
#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkErrorCode.h>
#include <vtkFloatArray.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkSmartPointer.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include "post/atomic_file.hpp"
#include "post/eddy_output.hpp"
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
  // VTK reports a short write (a full disk) through its error code, not always through Write()'s
  // result: check both, and never rename an incomplete file to its final name.
  if (writer->Write() != 1 || writer->GetErrorCode() != vtkErrorCode::NoError) {
    const char* why = vtkErrorCode::GetStringFromErrorCode(writer->GetErrorCode());
    std::error_code ec;
    std::filesystem::remove(temporary, ec);
    throw OutputError("could not write " + path.string() + " (" + (why && *why ? why : "unknown error") +
                      "; disk full?)");
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

void write_cell_field_vtu(const std::filesystem::path& path, const mesh::Mesh& m, const std::string& name,
                          const Eigen::VectorXd& values) {
  auto grid = grid_of(m);
  vtkNew<vtkFloatArray> field;
  field->SetName(name.c_str());
  field->SetNumberOfValues(m.n_triangles());
  for (int t = 0; t < m.n_triangles(); ++t) field->SetValue(t, static_cast<float>(values(t)));
  grid->GetCellData()->AddArray(field);
  grid->GetCellData()->SetActiveScalars(name.c_str());
  write_grid(path, grid);
}

void write_collection(const std::filesystem::path& path, const std::vector<CollectionEntry>& entries) {
  write_atomically(path, [&](std::ostream& out) {
    out << "<?xml version=\"1.0\"?>\n<VTKFile type=\"Collection\" version=\"0.1\">\n  <Collection>\n";
    for (const auto& e : entries)
      // 12 significant digits: the default 6 can print two close steps of a long study as the same time.
      out << "    <DataSet timestep=\"" << fmt::format("{:.12g}", e.time) << "\" part=\"0\" file=\"" << e.filename
          << "\"/>\n";
    out << "  </Collection>\n</VTKFile>\n";
  });
}

}  // namespace tf::post

namespace tf::post {
namespace {

vtkNew<vtkDoubleArray> node_array(const char* name, const Eigen::VectorXd& values) {
  vtkNew<vtkDoubleArray> a;
  a->SetName(name);
  a->SetNumberOfValues(values.size());
  for (Eigen::Index i = 0; i < values.size(); ++i) a->SetValue(i, values(i));
  return a;
}

}  // namespace

Eigen::VectorXd peak_flux_density(const mesh::Mesh& m, const Eigen::VectorXcd& a) {
  const Eigen::MatrixX2d b_re = flux_density(m, a.real()), b_im = flux_density(m, a.imag());
  Eigen::VectorXd peak(m.n_triangles());
  for (int t = 0; t < m.n_triangles(); ++t) {
    // Peak over a period of |Re(B e^{j w t})|: the major semi-axis of the ellipse B traces.
    const std::complex<double> bx(b_re(t, 0), b_im(t, 0)), by(b_re(t, 1), b_im(t, 1));
    const double mean = 0.5 * (std::norm(bx) + std::norm(by)), swing = 0.5 * std::abs(bx * bx + by * by);
    peak(t) = std::sqrt(mean + swing);
  }
  return peak;
}

void write_eddy_vtu(const std::filesystem::path& path, const mesh::Mesh& m, const Eigen::VectorXcd& a,
                    const SpeedInputs& in, double rotor_speed) {
  auto grid = grid_of(m);
  grid->GetPointData()->AddArray(node_array("A_z_real_Wb_per_m", a.real()));
  grid->GetPointData()->AddArray(node_array("A_z_imag_Wb_per_m", a.imag()));
  const Eigen::MatrixX2d b_re = flux_density(m, a.real()), b_im = flux_density(m, a.imag());
  const Eigen::VectorXd peak = peak_flux_density(m, a);
  const double omega = 2 * 3.14159265358979323846 * in.frequency;
  vtkNew<vtkFloatArray> b_peak, j_peak;
  b_peak->SetName("B_peak_T");
  j_peak->SetName("J_induced_peak_A_per_m2");
  b_peak->SetNumberOfValues(m.n_triangles());
  j_peak->SetNumberOfValues(m.n_triangles());
  for (int t = 0; t < m.n_triangles(); ++t) {
    b_peak->SetValue(t, static_cast<float>(peak(t)));
    // |J| = sigma |j w A + w_r dA/dtheta| at the centroid.
    const int r = m.triangle_region(t);
    double j = 0.0;
    if (in.sigma[r] > 0.0) {
      std::complex<double> mean_a = 0.0;
      Eigen::Vector2d c = Eigen::Vector2d::Zero();
      for (int i = 0; i < 3; ++i) {
        mean_a += a(m.triangles(t, i)) / 3.0;
        c += m.nodes.row(m.triangles(t, i)).transpose() / 3.0;
      }
      const std::complex<double> grad_x(-b_re(t, 1), -b_im(t, 1)), grad_y(b_re(t, 0), b_im(t, 0));
      const std::complex<double> dtheta = c(0) * grad_y - c(1) * grad_x;
      const double speed = in.on_rotor[r] ? rotor_speed : 0.0;
      j = in.sigma[r] * std::abs(std::complex<double>(0.0, omega) * mean_a + speed * dtheta);
    }
    j_peak->SetValue(t, static_cast<float>(j));
  }
  grid->GetCellData()->AddArray(b_peak);
  grid->GetCellData()->AddArray(j_peak);
  grid->GetCellData()->SetActiveScalars("B_peak_T");
  write_grid(path, grid);
}

}  // namespace tf::post
