#pragma once
// Running a piece of work in a forked child process, so that nothing it does (an abort, a crash,
// an exception escaping a parallel loop) can end this process. Gmsh is run this way (sector.cpp).

#include <functional>
#include <string>

namespace tf::mesh::detail {

/// How the child ended.
enum class ChildEnd {
  result,       ///< work returned: `text` is the bytes it returned
  mesh_error,   ///< work threw a MeshError: `text` is its message
  exception,    ///< work threw anything else: `text` is its what() (empty if it had none)
  signal,       ///< the child was ended by a signal (abort, segfault): `text` is what escaped first, if anything
  exit_status,  ///< the child exited with a non-zero status, saying nothing
  truncated,    ///< the child exited normally but its message arrived incomplete
};

struct ChildOutcome {
  ChildEnd end = ChildEnd::result;
  std::string text;
  std::string how;  ///< how the child ended, in words: "aborted (signal 6, SIGABRT)", "exited with status 3"
};

/// Runs work() in a forked child and returns how it ended. The child starts with a copy of this
/// process's memory, so work may read anything the caller can; nothing it changes comes back but
/// the bytes it returns. The child runs the calling thread only, so no other thread may hold a lock
/// work needs: our meshing runs before the solvers' threads start, or while they idle between solves
/// (`turnfield compare`). Throws MeshError only when the child cannot be started or waited for.
ChildOutcome run_in_child(const std::function<std::string()>& work);

}  // namespace tf::mesh::detail
