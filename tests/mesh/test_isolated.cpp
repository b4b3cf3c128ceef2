// Meshing in a child process (mesh/isolated.hpp): whatever kills the mesher, this process lives on
// and says which piece failed; what comes back is the mesh, bit for bit.

#include <doctest/doctest.h>

#include <cstdint>
#include <cstdlib>
#include <initializer_list>
#include <stdexcept>
#include <string>

#include <unistd.h>

#include "mesh/build.hpp"
#include "mesh/isolated.hpp"
#include "mesh/sector_bytes.hpp"
#include "support/sample_geometry.hpp"
#include "support/sector_machine.hpp"

using namespace tf;
using mesh::detail::ChildEnd;
using mesh::detail::run_in_child;

namespace {

/// FNV-1a over the bytes of the nodes' coordinates, the triangles and their regions.
std::uint64_t fingerprint(const mesh::Mesh& m) {
  std::uint64_t h = 1469598103934665603ull;
  auto add = [&](const void* data, std::size_t n) {
    for (std::size_t i = 0; i < n; ++i) h = (h ^ static_cast<const unsigned char*>(data)[i]) * 1099511628211ull;
  };
  add(m.nodes.data(), static_cast<std::size_t>(m.nodes.size()) * sizeof(double));
  add(m.triangles.data(), static_cast<std::size_t>(m.triangles.size()) * sizeof(int));
  add(m.triangle_region.data(), static_cast<std::size_t>(m.triangle_region.size()) * sizeof(int));
  return h;
}

/// mesh::build on g must throw a MeshError whose message holds every one of `parts`.
void check_refused(const mesh::Geometry& g, std::initializer_list<const char*> parts) {
  std::string message;
  try {
    mesh::build(g, {2, false}, {});
  } catch (const mesh::MeshError& e) {
    message = e.what();
  }
  INFO(message);
  for (const char* part : parts) CHECK(message.find(part) != std::string::npos);
}

[[noreturn]] void fail_to_mesh() { throw std::runtime_error("no room for a triangle"); }

/// A small sector by hand: every list non-empty, every index in range.
mesh::detail::SectorMesh small_sector() {
  mesh::detail::SectorMesh s;
  s.start_angle = -0.1;
  s.span = 0.2 / 3;  // not a round number in binary
  s.nodes.resize(4, 2);
  s.nodes << 0.0, 0.0, 1.0 / 3, 0.0, 0.0, 2.0 / 7, 1e-300, -5e-324;
  s.triangles.resize(2, 3);
  s.triangles << 0, 1, 2, 1, 3, 2;
  s.triangle_piece = {0, 1};
  s.pieces = {{mesh::RegionKind::coil, 2}, {mesh::RegionKind::gap, 0}};
  s.start_cut = {0, 1};
  s.end_cut = {2, 3};
  s.sliding = {1, 3};
  s.outer = {3};
  return s;
}

}  // namespace

TEST_CASE("a magnet 0.1 µm thick crashes Gmsh 4.8 in the child: a MeshError names the rotor sector") {
  // In the process itself this geometry ended it with SIGSEGV (exit status 139); thinner magnets
  // make Gmsh throw instead, which comes back with Gmsh's own words.
  mesh::Geometry g = testing::magnet_machine();
  g.rotor.magnets.thickness = 1e-7;
  check_refused(g, {"meshing the rotor sector (magnets) failed inside Gmsh: the mesher crashed (signal 11, SIGSEGV)",
                    "check the rotor's dimensions (shaft, magnets and the air between them)"});
  g.rotor.magnets.thickness = 1e-8;
  check_refused(g, {"meshing the rotor sector (magnets) failed inside Gmsh: Could not create"});
}

TEST_CASE("a slot opening of 1 nm: Gmsh's OpenCASCADE error, naming the stator slot pitch") {
  mesh::Geometry g = testing::semi_closed_stator();
  g.stator.slot.opening_width = 1e-9;
  check_refused(g, {"meshing the stator slot pitch failed inside Gmsh: OpenCASCADE exception",
                    "check the stator's dimensions"});
}

TEST_CASE("a child that aborts, crashes, exits or throws: how it ended, and this process lives on") {
  // No case file reaches these: they stand for what Gmsh may do inside its meshing loops.
  auto aborted = run_in_child([]() -> std::string { std::abort(); });
  CHECK(aborted.end == ChildEnd::signal);
  CHECK(aborted.how == "aborted (signal 6, SIGABRT)");
  // An exception escaping a parallel loop ends in std::terminate; its words still come back.
  auto terminated = run_in_child([]() -> std::string {
    [] () noexcept { fail_to_mesh(); }();
    return "";
  });
  CHECK(terminated.end == ChildEnd::signal);
  CHECK(terminated.how == "aborted (signal 6, SIGABRT)");
  CHECK(terminated.text == "no room for a triangle");
  auto exited = run_in_child([]() -> std::string { _exit(3); });
  CHECK(exited.end == ChildEnd::exit_status);
  CHECK(exited.how == "exited with status 3");
  auto silent = run_in_child([]() -> std::string { _exit(0); });
  CHECK(silent.end == ChildEnd::truncated);
  auto ours = run_in_child([]() -> std::string { throw mesh::MeshError("sector cuts do not match"); });
  CHECK(ours.end == ChildEnd::mesh_error);
  CHECK(ours.text == "sector cuts do not match");
  auto other = run_in_child([]() -> std::string { throw std::runtime_error("Could not create line"); });
  CHECK(other.end == ChildEnd::exception);
  CHECK(other.text == "Could not create line");
  // A result larger than a pipe holds comes back whole.
  std::string big(3'000'000, '\0');
  for (std::size_t i = 0; i < big.size(); ++i) big[i] = static_cast<char>(i * 7919 % 251);
  auto returned = run_in_child([&] { return big; });
  CHECK(returned.end == ChildEnd::result);
  CHECK(returned.text == big);
}

TEST_CASE("the sector's bytes read back bit for bit; a truncated or altered copy is refused") {
  const mesh::detail::SectorMesh s = small_sector();
  const std::string bytes = mesh::detail::encode_sector(s);
  const mesh::detail::SectorMesh back = mesh::detail::decode_sector(bytes);
  CHECK(mesh::detail::encode_sector(back) == bytes);
  CHECK(back.span == s.span);
  CHECK(back.nodes == s.nodes);  // exact: the same doubles, subnormals included
  CHECK(back.triangles == s.triangles);
  CHECK(back.pieces == s.pieces);
  CHECK(back.outer == s.outer);
  for (std::size_t n = 0; n < bytes.size(); ++n) CHECK_THROWS_AS(mesh::detail::decode_sector(bytes.substr(0, n)), mesh::MeshError);
  CHECK_THROWS_AS(mesh::detail::decode_sector(bytes + '\0'), mesh::MeshError);
  std::string foreign = bytes;
  foreign[0] = 'X';
  CHECK_THROWS_AS(mesh::detail::decode_sector(foreign), mesh::MeshError);
  mesh::detail::SectorMesh bad = s;
  bad.outer = {4};  // one past the last node
  CHECK_THROWS_AS(mesh::detail::decode_sector(mesh::detail::encode_sector(bad)), mesh::MeshError);
}

TEST_CASE("meshing in a child gives the mesh meshing in this process gave, bit for bit") {
  // Counts and fingerprints recorded from mesh::build before it meshed in a child (the same Gmsh
  // 4.8.4). A change to the sizes or shapes changes them too: then record them anew, after checking
  // the other mesh tests.
  const mesh::Mesh stator = mesh::build(testing::semi_closed_stator(), {1}, {0.5});
  CHECK(stator.n_nodes() == 51937);
  CHECK(stator.n_triangles() == 97488);
  CHECK(fingerprint(stator) == 0x76f87d1c9194b834ull);
  const mesh::Mesh magnets = mesh::build(testing::magnet_machine(), {2, false}, {});
  CHECK(magnets.n_nodes() == 52961);
  CHECK(magnets.n_triangles() == 99464);
  CHECK(fingerprint(magnets) == 0x409f4faae9ddbff5ull);
  // And every child meshes alike.
  CHECK(fingerprint(mesh::build(testing::magnet_machine(), {2, false}, {})) == fingerprint(magnets));
}
