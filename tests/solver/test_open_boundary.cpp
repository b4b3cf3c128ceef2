// The unknowns of an open boundary (Kelvin transformation): every image node tied to a boundary
// node shares its unknown, and A = 0 only at the image's centre. (The mesh side: tests/mesh/test_open_boundary.cpp.)

#include <doctest/doctest.h>

#include "mesh/build.hpp"
#include "solver/dofs.hpp"
#include "support/team30a_model.hpp"

using namespace tf;

TEST_CASE("open boundary: a tied node takes its partner's unknown; only the image's centre is fixed") {
  const testing::Team30aModel c = testing::team30a_model();  // as cases/team30a_three_phase.toml
  const mesh::Mesh m = mesh::build(c.geometry, mesh::slot_layers(c.winding), {1.0});
  REQUIRE(m.outer_nodes.size() == 1);
  REQUIRE(m.ties.size() >= 6u * 4u);
  const solver::DofMap d = solver::number_dofs(m);
  for (const auto& [node, partner] : m.ties) {
    CHECK(d.dof_of_node[node] == d.dof_of_node[partner]);
    CHECK(d.dof_of_node[node] >= 0);
  }
  CHECK(d.dof_of_node[m.outer_nodes[0]] == -1);
  int fixed = 0;
  for (int dof : d.dof_of_node) fixed += dof < 0;
  CHECK(fixed == 1);
}
