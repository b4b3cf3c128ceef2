#pragma once
// Running turnfield itself as a child process (POSIX). A sweep runs each variant in its own
// process: Gmsh keeps one model per process, and a crash or a failed solve stays in its variant.

#include <filesystem>
#include <string>
#include <vector>

#include <sys/types.h>

namespace tf::sweep {

struct ChildSpec {
  std::vector<std::string> args;  ///< after the program name, e.g. {"run", "case.toml", "--out", "dir"}
  std::filesystem::path log;      ///< receives the child's standard output and error
  bool one_thread = false;        ///< one BLAS/OpenMP thread: several children share the cores
};

/// Starts this program again with spec.args. The child is killed when this process dies (so a
/// killed sweep leaves no variant running). Throws std::runtime_error if fork fails.
pid_t start_child(const ChildSpec& spec);

struct ChildEnd {
  pid_t pid = 0;
  int exit_status = -1;  ///< -1 when a signal ended it
  int signal = 0;
};

/// Waits for any child to end. Throws std::runtime_error if there is none.
ChildEnd wait_for_child();

}  // namespace tf::sweep
