#pragma once
// Reading field files back as a viewer does (VTK's own reader), and the CSV tables and .pvd
// collection beside them, for the end-to-end field-file tests.

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <map>
#include <numbers>
#include <regex>
#include <sstream>
#include <string>
#include <utility>
#include <vector>

#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkFieldData.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkSmartPointer.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>

#include "study/csv_rows.hpp"
#include "support/cli_run.hpp"

namespace tf::testing {

namespace fs = std::filesystem;

inline vtkSmartPointer<vtkUnstructuredGrid> read_vtu(const fs::path& path) {
  REQUIRE(fs::exists(path));
  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(path.c_str());
  reader->Update();
  vtkSmartPointer<vtkUnstructuredGrid> grid = reader->GetOutput();
  REQUIRE(grid != nullptr);
  REQUIRE(grid->GetNumberOfCells() > 0);
  return grid;
}

inline std::vector<std::string> field_strings(vtkUnstructuredGrid* grid, const char* name) {
  auto* a = vtkStringArray::SafeDownCast(grid->GetFieldData()->GetAbstractArray(name));
  REQUIRE(a != nullptr);
  std::vector<std::string> out;
  for (vtkIdType i = 0; i < a->GetNumberOfValues(); ++i) out.push_back(a->GetValue(i));
  return out;
}

inline double field_number(vtkUnstructuredGrid* grid, const std::string& name) {
  vtkDataArray* a = grid->GetFieldData()->GetArray(name.c_str());
  INFO(name);
  REQUIRE(a != nullptr);
  return a->GetTuple1(0);
}

inline vtkDataArray* cell_array(vtkUnstructuredGrid* grid, const char* name) {
  vtkDataArray* a = grid->GetCellData()->GetArray(name);
  INFO(name);
  REQUIRE(a != nullptr);
  return a;
}

/// The timesteps and files of a .pvd collection, in order.
inline std::vector<std::pair<double, std::string>> read_collection(const fs::path& path) {
  std::ifstream in(path);
  const std::string pvd((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  const std::regex dataset(R"re(<DataSet[^>]*timestep="([^"]+)"[^>]*file="([^"]+)")re");
  std::vector<std::pair<double, std::string>> out;
  for (auto it = std::sregex_iterator(pvd.begin(), pvd.end(), dataset); it != std::sregex_iterator(); ++it)
    out.emplace_back(std::stod((*it)[1]), (*it)[2]);
  return out;
}

inline fs::path run_case(const std::string& name, const std::string& options) {
  const fs::path out = fresh_folder("field_files_" + name);
  const auto run = turnfield("run " + std::string(TF_SOURCE_DIR) + "/cases/" + name + ".toml " + options +
                             " --out " + out.string());
  INFO(run.output);
  REQUIRE(run.status == 0);
  return out;
}

/// The points of a grid as a table for finding a point by position (float coordinates: 0.1 µm).
struct PointFinder {
  std::map<std::pair<long, long>, vtkIdType> cells;
  explicit PointFinder(vtkUnstructuredGrid* g) {
    for (vtkIdType i = 0; i < g->GetNumberOfPoints(); ++i) cells.emplace(cell_of(g->GetPoint(i)), i);
  }
  static std::pair<long, long> cell_of(const double* p) { return {std::lround(p[0] * 1e6), std::lround(p[1] * 1e6)}; }
  /// The point within 0.1 µm of (x, y), or -1.
  vtkIdType find(vtkUnstructuredGrid* g, double x, double y) const {
    const double p[2] = {x, y};
    const auto [cx, cy] = cell_of(p);
    for (long dx = -1; dx <= 1; ++dx)
      for (long dy = -1; dy <= 1; ++dy) {
        const auto it = cells.find({cx + dx, cy + dy});
        if (it == cells.end()) continue;
        const double* q = g->GetPoint(it->second);
        if (std::hypot(q[0] - x, q[1] - y) < 1e-7) return it->second;
      }
    return -1;
  }
};

/// B = curl(A e_z) = (dA/dy, -dA/dx) of the linear A on cell t, from the file's points and A.
inline std::pair<double, double> curl_of(vtkUnstructuredGrid* g, vtkDataArray* a, vtkIdType t) {
  vtkIdType n = 0;
  const vtkIdType* ids = nullptr;
  g->GetCellPoints(t, n, ids);
  double x[3], y[3], v[3];
  for (int i = 0; i < 3; ++i) {
    const double* p = g->GetPoint(ids[i]);
    x[i] = p[0];
    y[i] = p[1];
    v[i] = a->GetTuple1(ids[i]);
  }
  const double det = (x[1] - x[0]) * (y[2] - y[0]) - (x[2] - x[0]) * (y[1] - y[0]);
  const double dadx = ((v[1] - v[0]) * (y[2] - y[0]) - (v[2] - v[0]) * (y[1] - y[0])) / det;
  const double dady = ((v[2] - v[0]) * (x[1] - x[0]) - (v[1] - v[0]) * (x[2] - x[0])) / det;
  return {dady, -dadx};
}

/// Every edge of the grid with the cells on either side (the second -1 on the mesh's boundary).
inline std::map<std::pair<vtkIdType, vtkIdType>, std::pair<vtkIdType, vtkIdType>> edges_of(vtkUnstructuredGrid* g) {
  std::map<std::pair<vtkIdType, vtkIdType>, std::pair<vtkIdType, vtkIdType>> edges;
  for (vtkIdType t = 0; t < g->GetNumberOfCells(); ++t) {
    vtkIdType n = 0;
    const vtkIdType* ids = nullptr;
    g->GetCellPoints(t, n, ids);
    for (int i = 0; i < 3; ++i) {
      const auto e = std::minmax(ids[i], ids[(i + 1) % 3]);
      const auto [it, added] = edges.emplace(e, std::make_pair(t, vtkIdType{-1}));
      if (!added) it->second.second = t;
    }
  }
  return edges;
}

inline double radius(vtkUnstructuredGrid* g, vtkIdType i) {
  const double* p = g->GetPoint(i);
  return std::hypot(p[0], p[1]);
}

}  // namespace tf::testing
