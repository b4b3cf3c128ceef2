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
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>

#include "post/flux_density.hpp"
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
  std::vector<post::CollectionEntry> entries;
  std::vector<Eigen::VectorXd> fields;
  // Close times that print alike with six significant digits must still come out increasing.
  for (int k = 0; k < 3; ++k) {
    Eigen::VectorXd a(m.n_nodes());
    for (int n = 0; n < m.n_nodes(); ++n) a(n) = (k + 1) * 1e-3 * m.nodes(n, 0) + 2e-4 * m.nodes(n, 1);
    const std::string name = "field_000" + std::to_string(k) + ".vtu";
    post::write_field_vtu(dir / name, m, a);
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
    for (int n = 1; n < m.n_nodes(); n += 5) CHECK(a->GetTuple1(n) == doctest::Approx(fields[i](n)).epsilon(1e-14).scale(0));
  }
}
