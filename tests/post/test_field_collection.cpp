// The field files as a viewer meets them: the .pvd collection lists its steps in time order and
// every file it names exists, and each .vtu holds the arrays a reviewer looks for under the
// names the README gives, with one value per node or per triangle.

#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <iterator>
#include <regex>
#include <string>
#include <vector>

#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkFieldData.h>
#include <vtkStringArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>

#include "post/flux_density.hpp"
#include "post/motion_output.hpp"
#include "post/vtu.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;
namespace fs = std::filesystem;

TEST_CASE("a written collection reads back: increasing times, existing files, named arrays of the right sizes") {
  const mesh::Mesh m = testing::polar_mesh(0.0,
                                           {{0.02, 2, mesh::RegionKind::rotor_iron, "rotor"},
                                            {0.025, 1, mesh::RegionKind::gap, "gap"},
                                            {0.04, 2, mesh::RegionKind::stator_iron, "stator"}},
                                           12);
  const fs::path dir = fs::temp_directory_path() / "turnfield_test_collection";
  fs::remove_all(dir);
  fs::create_directories(dir);
  const post::FieldDrawing drawing = post::field_drawing(m, mesh::Geometry{}, nullptr);
  std::vector<post::CollectionEntry> entries;
  std::vector<Eigen::VectorXd> fields;
  // Close times that print alike with six significant digits must still come out increasing.
  for (int k = 0; k < 3; ++k) {
    Eigen::VectorXd a(m.n_nodes());
    for (int n = 0; n < m.n_nodes(); ++n) a(n) = (k + 1) * 1e-3 * m.nodes(n, 0) + 2e-4 * m.nodes(n, 1);
    const std::string name = "field_000" + std::to_string(k) + ".vtu";
    post::write_field_vtu(dir / name, drawing, a, post::step_metadata(k, 0.1 * k, 0.2 * k, 1000.0 + 1e-5 * k, {1.5 * k, -2.0}));
    entries.push_back({1000.0 + 1e-5 * k, name});
    fields.push_back(a);
  }
  post::write_collection(dir / "field.pvd", entries);

  std::ifstream in(dir / "field.pvd");
  const std::string pvd((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  const std::regex dataset(R"re(<DataSet[^>]*timestep="([^"]+)"[^>]*file="([^"]+)")re");
  std::vector<double> times;
  std::vector<std::string> files;
  for (auto it = std::sregex_iterator(pvd.begin(), pvd.end(), dataset); it != std::sregex_iterator(); ++it) {
    times.push_back(std::stod((*it)[1]));
    files.push_back((*it)[2]);
  }
  REQUIRE(files.size() == 3);
  for (std::size_t i = 1; i < times.size(); ++i) CHECK(times[i] > times[i - 1]);

  for (std::size_t i = 0; i < files.size(); ++i) {
    INFO(files[i]);
    REQUIRE(fs::exists(dir / files[i]));
    vtkNew<vtkXMLUnstructuredGridReader> reader;
    reader->SetFileName((dir / files[i]).c_str());
    reader->Update();
    vtkUnstructuredGrid* grid = reader->GetOutput();
    REQUIRE(grid != nullptr);
    CHECK(grid->GetNumberOfPoints() == m.n_nodes());
    CHECK(grid->GetNumberOfCells() == m.n_triangles());
    vtkDataArray* region = grid->GetCellData()->GetArray("region");
    vtkDataArray* b = grid->GetCellData()->GetArray("B_magnitude_T");
    vtkDataArray* a = grid->GetPointData()->GetArray("A_z_Wb_per_m");
    REQUIRE(region != nullptr);
    REQUIRE(b != nullptr);
    REQUIRE(a != nullptr);
    CHECK(region->GetNumberOfTuples() == m.n_triangles());
    CHECK(b->GetNumberOfTuples() == m.n_triangles());
    CHECK(a->GetNumberOfTuples() == m.n_nodes());
    // Exact: what was written (A in double precision, |B| in single precision).
    const Eigen::MatrixX2d flux = post::flux_density(m, fields[i]);
    for (int t = 0; t < m.n_triangles(); t += 7) {
      CHECK(region->GetTuple1(t) == m.triangle_region(t));
      CHECK(b->GetTuple1(t) == doctest::Approx(flux.row(t).norm()).epsilon(1e-6).scale(0));
    }
    // Field data: the region names by id, and the step's metadata under the CSV columns' names.
    auto* names = vtkStringArray::SafeDownCast(grid->GetFieldData()->GetAbstractArray("region_names"));
    REQUIRE(names != nullptr);
    REQUIRE(names->GetNumberOfValues() == static_cast<vtkIdType>(m.regions.size()));
    for (std::size_t r = 0; r < m.regions.size(); ++r) CHECK(names->GetValue(static_cast<vtkIdType>(r)) == m.regions[r].name);
    const auto number = [&](const char* name) {
      vtkDataArray* v = grid->GetFieldData()->GetArray(name);
      REQUIRE(v != nullptr);
      return v->GetTuple1(0);
    };
    CHECK(number("step") == static_cast<double>(i));
    CHECK(number("electrical_angle_deg") == doctest::Approx(0.1 * i * 180 / 3.14159265358979323846).epsilon(1e-14));  // absolute near 0
    CHECK(number("rotor_angle_deg") == doctest::Approx(0.2 * i * 180 / 3.14159265358979323846).epsilon(1e-14));  // absolute near 0
    CHECK(number("time_s") == doctest::Approx(times[i]).epsilon(1e-11).scale(0));  // the .pvd prints 12 digits
    CHECK(number("current_A_A") == 1.5 * static_cast<double>(i));
    CHECK(number("current_B_A") == -2.0);
    for (int n = 1; n < m.n_nodes(); n += 5) CHECK(a->GetTuple1(n) == doctest::Approx(fields[i](n)).epsilon(1e-14).scale(0));
  }
}
