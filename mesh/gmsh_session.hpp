#pragma once
// Gmsh keeps global state: one guard opens it and closes it again, and nothing outside mesh/ sees it.

namespace tf::mesh::detail {

class GmshSession {
 public:
  GmshSession();
  ~GmshSession();
  GmshSession(const GmshSession&) = delete;
  GmshSession& operator=(const GmshSession&) = delete;
};

}  // namespace tf::mesh::detail
