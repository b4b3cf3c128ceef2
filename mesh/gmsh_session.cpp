#include "mesh/gmsh_session.hpp"

#include <gmsh.h>

namespace tf::mesh::detail {

GmshSession::GmshSession() {
  gmsh::initialize();
  gmsh::option::setNumber("General.Terminal", 0);
  gmsh::option::setNumber("General.Verbosity", 1);
  // Sizes come from our size callback alone (see sector.cpp), not from points or curvature.
  gmsh::option::setNumber("Mesh.MeshSizeExtendFromBoundary", 0);
  gmsh::option::setNumber("Mesh.MeshSizeFromPoints", 0);
  gmsh::option::setNumber("Mesh.MeshSizeFromCurvature", 0);
  gmsh::option::setNumber("Mesh.Algorithm", 6);  // frontal-Delaunay: well-shaped triangles
  gmsh::option::setNumber("General.NumThreads", 1);
}

GmshSession::~GmshSession() { gmsh::finalize(); }

}  // namespace tf::mesh::detail
