// The field files of bundled cases, run end to end on coarse meshes and read back with VTK's own
// reader, as a reviewer's viewer reads them: the whole machine with the sector cuts closed, the
// field continuous across them with the anti-periodic sign, region names as in regions.csv, each
// coil side's phase and direction as in winding.csv, each step's metadata as in the CSV tables,
// and an eddy study's collection indexed by its speeds.
//
// The sign reference: a sector of an odd number of pole pitches carries the anti-periodic
// condition A(r, theta + tau) = -A(r, theta) (Salon, "Finite Element Analysis of Electrical
// Machines", 1995, sec. 6.2 on periodic and anti-periodic boundaries; from memory), so the whole
// machine drawn from it must satisfy it node by node, and first-order elements make the normal
// component of B exactly continuous across every edge between two triangles (B n = dA/dt along the
// edge, which only the edge's two nodal values set; common practice of P1 field checks).

#include <doctest/doctest.h>

#include "study/field_file_reading.hpp"

namespace fs = std::filesystem;
using namespace tf::testing;

namespace {

constexpr double kPi = std::numbers::pi;

/// x within rel of y, or within rel * floor of it where y is near zero.
bool near(double x, double y, double rel, double floor) { return std::abs(x - y) <= rel * std::max(std::abs(y), floor); }

/// Region names, ids and per-cell phase and direction of a file against regions.csv and winding.csv.
void check_regions(vtkUnstructuredGrid* g, const fs::path& dir) {
  const std::vector<std::string> names = field_strings(g, "region_names");
  const auto regions = read_rows(dir / "regions.csv");
  REQUIRE(names.size() == regions.size());
  for (std::size_t r = 0; r < regions.size(); ++r) {
    CHECK(std::stoul(regions[r].at("region")) == r);
    CHECK(names[r] == regions[r].at("name"));
  }
  CHECK(std::find(names.begin(), names.end(), "exterior_image") == names.end());
  const std::vector<std::string> phases = field_strings(g, "phase_names");
  // The slot table: (slot, layer) -> (1-based phase, direction).
  std::map<std::pair<int, int>, std::pair<int, int>> table;
  if (fs::exists(dir / "winding.csv"))
    for (const auto& row : read_rows(dir / "winding.csv")) {
      const auto phase = std::find(phases.begin(), phases.end(), row.at("phase")) - phases.begin() + 1;
      table[{std::stoi(row.at("slot")), std::stoi(row.at("layer"))}] = {static_cast<int>(phase),
                                                                       row.at("direction") == "+" ? 1 : -1};
    }
  vtkDataArray* region = cell_array(g, "region");
  vtkDataArray* phase = cell_array(g, "phase");
  vtkDataArray* direction = cell_array(g, "direction");
  const std::regex coil(R"((slot|pole|sector)_0*(\d+)_(layer|coil)_(\d+))");
  int coil_cells = 0, wrong = 0;
  for (vtkIdType t = 0; t < g->GetNumberOfCells(); ++t) {
    const auto r = static_cast<std::size_t>(region->GetTuple1(t));
    REQUIRE(r < names.size());
    std::smatch m;
    std::pair<int, int> expected{0, 0};
    if (std::regex_match(names[r], m, coil)) {
      ++coil_cells;
      expected = table.at({std::stoi(m[2]), std::stoi(m[4])});
    }
    if (std::make_pair(static_cast<int>(phase->GetTuple1(t)), static_cast<int>(direction->GetTuple1(t))) != expected)
      ++wrong;
  }
  CHECK(coil_cells > 0);
  CHECK(wrong == 0);
}

/// The drawing is one conforming mesh: an edge with a triangle on one side only lies on the outer
/// circle or on the sliding circle (whose two sides carry nodes of their own); unmerged sector cuts
/// would leave such edges along the cut lines.
void check_cuts_closed(vtkUnstructuredGrid* g, double outer_radius, double sliding_radius) {
  int open = 0, stray = 0;
  for (const auto& [edge, cells] : edges_of(g)) {
    if (cells.second >= 0) continue;
    ++open;
    for (vtkIdType node : {edge.first, edge.second}) {
      const double r = radius(g, node);
      if (std::abs(r - outer_radius) > 1e-6 && std::abs(r - sliding_radius) > 1e-6) ++stray;
    }
  }
  CHECK(open > 0);
  CHECK(stray == 0);
}

/// A_z(theta + tau) = -A_z(theta) at every node, tau the sector's angle (anti-periodic).
void check_anti_periodic(vtkUnstructuredGrid* g, int copies) {
  vtkDataArray* a = g->GetPointData()->GetArray("A_z_Wb_per_m");
  REQUIRE(a != nullptr);
  const PointFinder points(g);
  const double tau = 2 * kPi / copies, c = std::cos(tau), s = std::sin(tau);
  double scale = 0.0, worst = 0.0;
  int missing = 0;
  for (vtkIdType i = 0; i < g->GetNumberOfPoints(); ++i) scale = std::max(scale, std::abs(a->GetTuple1(i)));
  REQUIRE(scale > 1e-5);
  for (vtkIdType i = 0; i < g->GetNumberOfPoints(); ++i) {
    const double* p = g->GetPoint(i);
    const vtkIdType j = points.find(g, c * p[0] - s * p[1], s * p[0] + c * p[1]);
    if (j < 0) { ++missing; continue; }
    worst = std::max(worst, std::abs(a->GetTuple1(j) + a->GetTuple1(i)) / scale);
  }
  CHECK(missing == 0);
  CHECK(worst < 1e-9);
}

/// The file's B_T is the curl of its A_z in every triangle, B's normal component is continuous
/// across every interior edge, and across the stator's sector cuts (radial lines at
/// first_cut + k tau) B jumps no more than between neighbours inside a sector.
void check_flux_density(vtkUnstructuredGrid* g, double first_cut, int copies) {
  vtkDataArray* a = g->GetPointData()->GetArray("A_z_Wb_per_m");
  vtkDataArray* b = cell_array(g, "B_T");
  double b_max = 0.0;
  for (vtkIdType t = 0; t < g->GetNumberOfCells(); ++t) b_max = std::max(b_max, std::hypot(b->GetComponent(t, 0), b->GetComponent(t, 1)));
  REQUIRE(b_max > 0.1);
  double curl_error = 0.0;
  for (vtkIdType t = 0; t < g->GetNumberOfCells(); ++t) {
    const auto [bx, by] = curl_of(g, a, t);
    curl_error = std::max(curl_error, std::hypot(bx - b->GetComponent(t, 0), by - b->GetComponent(t, 1)) / b_max);
  }
  CHECK(curl_error < 1e-3);  // single-precision points and B
  const auto on_cut = [&](vtkIdType node) {
    const double* p = g->GetPoint(node);
    const double phase = std::remainder(std::atan2(p[1], p[0]) - first_cut, 2 * kPi / copies);
    return std::hypot(p[0], p[1]) > 1e-6 && std::abs(phase) < 1e-5;
  };
  double normal_jump = 0.0, cut_jump = 0.0, inside_jump = 0.0;
  int cut_edges = 0;
  for (const auto& [edge, cells] : edges_of(g)) {
    if (cells.second < 0) continue;
    const double* p = g->GetPoint(edge.first);
    const double* q = g->GetPoint(edge.second);
    const double length = std::hypot(q[0] - p[0], q[1] - p[1]);
    const double nx = (q[1] - p[1]) / length, ny = -(q[0] - p[0]) / length;
    const double dx = b->GetComponent(cells.first, 0) - b->GetComponent(cells.second, 0);
    const double dy = b->GetComponent(cells.first, 1) - b->GetComponent(cells.second, 1);
    normal_jump = std::max(normal_jump, std::abs(dx * nx + dy * ny) / b_max);
    if (on_cut(edge.first) && on_cut(edge.second)) {
      ++cut_edges;
      cut_jump = std::max(cut_jump, std::hypot(dx, dy));
    } else {
      inside_jump = std::max(inside_jump, std::hypot(dx, dy));
    }
  }
  CHECK(cut_edges > 0);
  CHECK(normal_jump < 2e-3);  // float coordinates in the thin gap's elements
  CHECK(cut_jump <= inside_jump);
}

}  // namespace

TEST_CASE("a quarter-model synchronous run: whole-machine field files, closed cuts, anti-periodic A, names and metadata") {
  const fs::path out = run_case("pump24_magnets_synchronous", "--fineness 0.5 --steps 8 --field-files 4");
  const auto summary = read_summary(out);
  const int copies = summary["mesh"]["sector_copies"];
  REQUIRE(copies == 4);
  REQUIRE(summary["mesh"]["anti_periodic"] == true);
  const auto collection = read_collection(out / "field.pvd");
  REQUIRE(collection.size() == 4);
  const auto steps = read_rows(out / "steps.csv");
  const auto torque = read_rows(out / "torque.csv");
  for (const auto& [time, file] : collection) {
    INFO(file);
    const auto grid = read_vtu(out / file);
    CHECK(grid->GetNumberOfCells() == copies * summary["mesh"]["triangles"].get<int>());
    // Metadata against the tables (steps.csv prints six significant digits).
    const auto k = static_cast<std::size_t>(field_number(grid, "step"));
    CHECK(file == "field_000" + std::to_string(k) + ".vtu");
    const double period = 1.0 / 50.0;  // the case's supply frequency
    CHECK(near(field_number(grid, "time_s"), time, 1e-10, period));
    CHECK(near(field_number(grid, "time_s"), std::stod(steps[k].at("time_s")), 1e-5, period));
    CHECK(field_number(grid, "rotor_angle_deg") ==
          doctest::Approx(std::stod(torque[k].at("rotor_angle_deg"))).epsilon(1e-9));
    CHECK(field_number(grid, "electrical_angle_deg") ==
          doctest::Approx(std::stod(steps[k].at("electrical_angle_deg"))).epsilon(1e-5));
    for (const char* phase : {"A", "B", "C"}) {
      const std::string column = std::string("current_") + phase + "_A";
      CHECK(field_number(grid, column) == doctest::Approx(std::stod(steps[k].at(column))).epsilon(1e-5));
    }
    CHECK(field_strings(grid, "collection_time") == std::vector<std::string>{"time_s"});
    check_regions(grid, out);
    check_cuts_closed(grid, 0.085, summary["mesh"]["sliding_circle_radius_m"].get<double>());  // outer radius of the case
    check_anti_periodic(grid, copies);
    // The stator sector is centred on slot 1 at 0 (DEVELOPERS.md): its first cut half a slot pitch before.
    check_flux_density(grid, -kPi / 24, copies);
  }
  const auto loss = read_vtu(out / "iron_loss.vtu");
  CHECK(loss->GetNumberOfCells() == copies * summary["mesh"]["triangles"].get<int>());
  check_regions(loss, out);
}

TEST_CASE("turnfield mesh of a sector case writes the whole machine, opening coloured by region") {
  const fs::path out = fresh_folder("field_files_mesh");
  const auto run = turnfield("mesh " + std::string(TF_SOURCE_DIR) + "/cases/pump24_magnets_synchronous.toml --fineness 0.5 --out " +
                             out.string());
  INFO(run.output);
  REQUIRE(run.status == 0);
  std::smatch m;
  REQUIRE(std::regex_search(run.output, m, std::regex(R"((\d+) triangles, \d+ regions)")));
  REQUIRE(run.output.find("1/4 of the machine") != std::string::npos);
  const auto grid = read_vtu(out / "mesh.vtu");
  CHECK(grid->GetNumberOfCells() == 4 * std::stol(m[1]));
  REQUIRE(grid->GetCellData()->GetScalars() != nullptr);
  CHECK(std::string(grid->GetCellData()->GetScalars()->GetName()) == "region");
  const auto names = field_strings(grid, "region_names");
  CHECK(std::find(names.begin(), names.end(), "slot_07_layer_2") != names.end());
  CHECK(std::find(names.begin(), names.end(), "magnet_4") != names.end());
  const auto regions = read_rows(out / "regions.csv");
  REQUIRE(names.size() == regions.size());
  for (std::size_t r = 0; r < names.size(); ++r) CHECK(names[r] == regions[r].at("name"));
}

TEST_CASE("an eddy study with an open boundary: no exterior image in the files, the collection's times its speeds") {
  const fs::path out = run_case("team30a_three_phase", "--fineness 0.5");
  const auto speeds = read_rows(out / "torque_speed.csv");
  const auto collection = read_collection(out / "field.pvd");
  REQUIRE(collection.size() == speeds.size());
  const auto summary = read_summary(out);
  for (std::size_t k = 0; k < collection.size(); ++k) {
    const auto& [time, file] = collection[k];
    INFO(file);
    // The case's speeds rise, so the collection is indexed by the speed in rpm (README).
    CHECK(time == doctest::Approx(std::stod(speeds[k].at("speed_rpm"))).epsilon(1e-9));
    const auto grid = read_vtu(out / file);
    CHECK(field_strings(grid, "collection_time") == std::vector<std::string>{"speed_rpm"});
    CHECK(field_number(grid, "speed_rpm") == doctest::Approx(time).epsilon(1e-10));
    CHECK(field_number(grid, "speed_rad_per_s") ==
          doctest::Approx(std::stod(speeds[k].at("speed_rad_per_s"))).epsilon(1e-9));
    CHECK(field_number(grid, "slip") == doctest::Approx(std::stod(speeds[k].at("slip"))).epsilon(1e-9));
    CHECK(field_number(grid, "frequency_Hz") == doctest::Approx(60.0).epsilon(1e-12).scale(0));  // the case's supply
    // The image disc lay three boundary radii to the right: every point now within the boundary circle.
    double r_max = 0.0;
    for (vtkIdType i = 0; i < grid->GetNumberOfPoints(); ++i) r_max = std::max(r_max, radius(grid, i));
    CHECK(r_max == doctest::Approx(0.1).epsilon(1e-6).scale(0));  // boundary_radius of the case
    CHECK(grid->GetNumberOfCells() < summary["mesh"]["triangles"].get<int>());  // the model's, image included
    CHECK(field_number(grid, "current_A_peak_A") == doctest::Approx(2892.317).epsilon(1e-12).scale(0));  // the case's
    check_regions(grid, out);
  }
}

TEST_CASE("a cage rotor by the slip method: each file's speed, slip, slip frequency and forward currents") {
  const fs::path out = run_case("pump24_cage_eddy", "--fineness 0.3");
  const auto speeds = read_rows(out / "torque_speed.csv");
  const auto collection = read_collection(out / "field.pvd");
  REQUIRE(collection.size() == 3);  // field_files = 3 of the case's ten speeds
  for (const auto& [time, file] : collection) {
    INFO(file);
    const auto grid = read_vtu(out / file);
    const auto k = static_cast<std::size_t>(field_number(grid, "speed_number"));
    CHECK(time == doctest::Approx(std::stod(speeds[k].at("speed_rpm"))).epsilon(1e-9));
    const double slip = std::stod(speeds[k].at("slip"));
    CHECK(field_number(grid, "slip") == doctest::Approx(slip).epsilon(1e-9));
    // The rotor-frame field of the forward wave pulsates at the slip frequency s f (f = 50 Hz, the case's).
    CHECK(near(field_number(grid, "frequency_Hz"), slip * 50.0, 1e-9, 1.0));
    // A balanced three-phase set is its own forward (positive-sequence) component (Fortescue,
    // "Method of symmetrical co-ordinates", 1918): 6 A peak (the case's), phases 0, -120, +120 deg.
    CHECK(field_number(grid, "current_A_peak_A") == doctest::Approx(6.0).epsilon(1e-9).scale(0));
    CHECK(field_number(grid, "current_B_peak_A") == doctest::Approx(6.0).epsilon(1e-9).scale(0));
    CHECK(field_number(grid, "current_B_phase_deg") == doctest::Approx(-120.0).epsilon(1e-9).scale(0));
    CHECK(field_number(grid, "current_C_phase_deg") == doctest::Approx(120.0).epsilon(1e-9).scale(0));
    check_regions(grid, out);
  }
}
