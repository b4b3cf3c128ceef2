#include "post/vtu.hpp"

#include <cassert>
#include <functional>

#include <fmt/format.h>

#include <vtkCellArray.h>
#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkErrorCode.h>
#include <vtkFieldData.h>
#include <vtkFloatArray.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkSmartPointer.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include "post/atomic_file.hpp"
#include "post/eddy_output.hpp"
#include "post/flux_density.hpp"

namespace tf::post {
namespace {

vtkNew<vtkIntArray> cell_ints(const char* name, int n, const std::function<int(int)>& value) {
  vtkNew<vtkIntArray> a;
  a->SetName(name);
  a->SetNumberOfValues(n);
  for (int t = 0; t < n; ++t) a->SetValue(t, value(t));
  return a;
}

vtkNew<vtkStringArray> strings(const char* name, const std::vector<std::string>& values) {
  vtkNew<vtkStringArray> a;
  a->SetName(name);
  a->SetNumberOfValues(static_cast<vtkIdType>(values.size()));
  for (std::size_t i = 0; i < values.size(); ++i) a->SetValue(static_cast<vtkIdType>(i), values[i]);
  return a;
}

/// The whole machine's points and triangles, the region, phase and direction of each triangle and
/// the names a viewer shows for them.
vtkSmartPointer<vtkUnstructuredGrid> grid_of(const FieldDrawing& d) {
  const WholeMachine& w = d.whole;
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  vtkNew<vtkPoints> points;
  points->SetDataTypeToFloat();
  points->SetNumberOfPoints(w.n_nodes());
  for (int i = 0; i < w.n_nodes(); ++i) points->SetPoint(i, w.nodes(i, 0), w.nodes(i, 1), 0.0);
  grid->SetPoints(points);
  vtkNew<vtkCellArray> cells;
  cells->AllocateExact(w.n_triangles(), 3 * w.n_triangles());
  for (int t = 0; t < w.n_triangles(); ++t) {
    const vtkIdType ids[3] = {w.triangles(t, 0), w.triangles(t, 1), w.triangles(t, 2)};
    cells->InsertNextCell(3, ids);
  }
  grid->SetCells(VTK_TRIANGLE, cells);
  const int n = w.n_triangles();
  const auto& region = d.triangle_region;
  grid->GetCellData()->AddArray(cell_ints("region", n, [&](int t) { return region(t); }));
  grid->GetCellData()->AddArray(cell_ints("phase", n, [&](int t) { return d.regions[region(t)].phase; }));
  grid->GetCellData()->AddArray(cell_ints("direction", n, [&](int t) { return d.regions[region(t)].direction; }));
  std::vector<std::string> names;
  for (const DrawnRegion& r : d.regions) names.push_back(r.name);
  grid->GetFieldData()->AddArray(strings("region_names", names));
  grid->GetFieldData()->AddArray(strings("phase_names", d.phase_names));
  return grid;
}

vtkNew<vtkFloatArray> cell_floats(const char* name, const Eigen::VectorXd& values) {
  vtkNew<vtkFloatArray> a;
  a->SetName(name);
  a->SetNumberOfValues(values.size());
  for (Eigen::Index t = 0; t < values.size(); ++t) a->SetValue(t, static_cast<float>(values(t)));
  return a;
}

vtkNew<vtkDoubleArray> node_array(const char* name, const Eigen::VectorXd& values) {
  vtkNew<vtkDoubleArray> a;
  a->SetName(name);
  a->SetNumberOfValues(values.size());
  for (Eigen::Index i = 0; i < values.size(); ++i) a->SetValue(i, values(i));
  return a;
}

void add_metadata(vtkUnstructuredGrid* grid, const FieldMetadata& info) {
  for (const auto& [name, value] : info.numbers) {
    vtkNew<vtkDoubleArray> a;
    a->SetName(name.c_str());
    a->SetNumberOfValues(1);
    a->SetValue(0, value);
    grid->GetFieldData()->AddArray(a);
  }
  for (const auto& [name, text] : info.texts) grid->GetFieldData()->AddArray(strings(name.c_str(), {text}));
}

void write_grid(const std::filesystem::path& path, vtkUnstructuredGrid* grid) {
  const auto temporary = temporary_name(path);
  vtkNew<vtkXMLUnstructuredGridWriter> writer;
  writer->SetFileName(temporary.c_str());
  writer->SetInputData(grid);
  writer->SetDataModeToAppended();
  writer->SetIdTypeToInt32();
  writer->SetHeaderTypeToUInt32();
  // LZ4, read by VTK from 8.1 and ParaView from 5.5 on. Measured on the saturated phase-angle demo
  // (36 field files of 50k nodes): 1.33 s to write against 3.16 s with zlib at level 1, for files
  // 47 % larger; a study's field files were the largest part of its run.
  writer->SetCompressorTypeToLZ4();
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

void write_mesh_vtu(const std::filesystem::path& path, const FieldDrawing& d) {
  auto grid = grid_of(d);
  grid->GetCellData()->SetActiveScalars("region");
  write_grid(path, grid);
}

void write_field_vtu(const std::filesystem::path& path, const FieldDrawing& d, const Eigen::VectorXd& a,
                     const FieldMetadata& info) {
  auto grid = grid_of(d);
  add_metadata(grid, info);
  const Eigen::VectorXd drawn = d.drawn_field(a);
  grid->GetPointData()->AddArray(node_array("A_z_Wb_per_m", unfold_nodal(d.whole, drawn)));

  // B of each model triangle, turned and signed with its copy.
  const Eigen::MatrixX2d b = unfold_cell_vectors(d.whole, flux_density(d.model, drawn));
  // Single precision is ample for looking at B and halves the files.
  vtkNew<vtkFloatArray> vector, magnitude;
  vector->SetName("B_T");
  vector->SetNumberOfComponents(3);
  vector->SetNumberOfTuples(b.rows());
  magnitude->SetName("B_magnitude_T");
  magnitude->SetNumberOfValues(b.rows());
  for (Eigen::Index t = 0; t < b.rows(); ++t) {
    vector->SetTuple3(t, b(t, 0), b(t, 1), 0.0);
    magnitude->SetValue(t, static_cast<float>(b.row(t).norm()));
  }
  grid->GetCellData()->AddArray(vector);
  grid->GetCellData()->AddArray(magnitude);
  grid->GetCellData()->SetActiveScalars("B_magnitude_T");
  write_grid(path, grid);
}

void write_cell_field_vtu(const std::filesystem::path& path, const FieldDrawing& d, const std::string& name,
                          const Eigen::VectorXd& values, const FieldMetadata& info) {
  auto grid = grid_of(d);
  add_metadata(grid, info);
  grid->GetCellData()->AddArray(cell_floats(name.c_str(), unfold_cells(d.whole, values)));
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

namespace {

/// Peak induced current density |J| = sigma |j w A + w_r dA/dtheta| [A/m^2] at each triangle's centroid.
Eigen::VectorXd induced_current_peak(const mesh::Mesh& m, const Eigen::VectorXcd& a, const SpeedInputs& in,
                                     double rotor_speed) {
  const Eigen::MatrixX2d b_re = flux_density(m, a.real()), b_im = flux_density(m, a.imag());
  const double omega = 2 * 3.14159265358979323846 * in.frequency;
  Eigen::VectorXd j = Eigen::VectorXd::Zero(m.n_triangles());
  for (int t = 0; t < m.n_triangles(); ++t) {
    const int r = m.triangle_region(t);
    if (in.sigma[r] <= 0.0) continue;
    std::complex<double> mean_a = 0.0;
    Eigen::Vector2d c = Eigen::Vector2d::Zero();
    for (int i = 0; i < 3; ++i) {
      mean_a += a(m.triangles(t, i)) / 3.0;
      c += m.nodes.row(m.triangles(t, i)).transpose() / 3.0;
    }
    const std::complex<double> grad_x(-b_re(t, 1), -b_im(t, 1)), grad_y(b_re(t, 0), b_im(t, 0));
    const std::complex<double> dtheta = c(0) * grad_y - c(1) * grad_x;
    const double speed = in.on_rotor[r] ? rotor_speed : 0.0;
    j(t) = in.sigma[r] * std::abs(std::complex<double>(0.0, omega) * mean_a + speed * dtheta);
  }
  return j;
}

}  // namespace

void write_eddy_vtu(const std::filesystem::path& path, const FieldDrawing& d, const Eigen::VectorXcd& a,
                    const SpeedInputs& in, double rotor_speed, const FieldMetadata& info) {
  assert(d.rotor_sign == 1);  // drawn as meshed: the rotor of a time-harmonic study is not turned
  auto grid = grid_of(d);
  add_metadata(grid, info);
  grid->GetPointData()->AddArray(node_array("A_z_real_Wb_per_m", unfold_nodal(d.whole, a.real())));
  grid->GetPointData()->AddArray(node_array("A_z_imag_Wb_per_m", unfold_nodal(d.whole, a.imag())));
  grid->GetCellData()->AddArray(cell_floats("B_peak_T", unfold_cells(d.whole, peak_flux_density(d.model, a))));
  grid->GetCellData()->AddArray(cell_floats("J_induced_peak_A_per_m2",
                                            unfold_cells(d.whole, induced_current_peak(d.model, a, in, rotor_speed))));
  grid->GetCellData()->SetActiveScalars("B_peak_T");
  write_grid(path, grid);
}

}  // namespace tf::post
