#include "sweep/child_process.hpp"

#include <cerrno>
#include <csignal>
#include <cstdlib>
#include <cstring>
#include <stdexcept>

#include <fcntl.h>
#include <sys/prctl.h>
#include <sys/wait.h>
#include <unistd.h>

namespace tf::sweep {
namespace {

/// In the child, between fork and exec: only async-signal-safe calls.
[[noreturn]] void become(const ChildSpec& spec, pid_t parent, char* const* argv) {
  // Die with the sweep: without this, a SIGKILLed sweep would leave its variants running on.
  if (prctl(PR_SET_PDEATHSIG, SIGKILL) != 0 || getppid() != parent) _exit(126);
  const int fd = open(spec.log.c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0644);
  if (fd < 0) _exit(126);
  dup2(fd, STDOUT_FILENO);
  dup2(fd, STDERR_FILENO);
  close(fd);
  const int null = open("/dev/null", O_RDONLY);
  if (null >= 0) dup2(null, STDIN_FILENO);
  execv("/proc/self/exe", argv);
  const char message[] = "error: could not start turnfield for this variant (exec failed)\n";
  [[maybe_unused]] const auto n = write(STDERR_FILENO, message, sizeof message - 1);
  _exit(127);
}

}  // namespace

pid_t start_child(const ChildSpec& spec) {
  // Everything the child needs is prepared before fork: after it, the child may not allocate.
  std::vector<std::string> args = spec.args;
  args.insert(args.begin(), "turnfield");
  std::vector<char*> argv;
  for (auto& a : args) argv.push_back(a.data());
  argv.push_back(nullptr);
  if (spec.one_thread) {  // inherited by the child; set here because setenv is not fork-safe
    setenv("OMP_NUM_THREADS", "1", 1);
    setenv("OPENBLAS_NUM_THREADS", "1", 1);
  }
  const pid_t parent = getpid();
  const pid_t pid = fork();
  if (pid < 0) throw std::runtime_error(std::string("could not start a variant: fork failed: ") + std::strerror(errno));
  if (pid == 0) become(spec, parent, argv.data());
  return pid;
}

ChildEnd wait_for_child() {
  int status = 0;
  pid_t pid;
  do pid = waitpid(-1, &status, 0);
  while (pid < 0 && errno == EINTR);
  if (pid < 0) throw std::runtime_error(std::string("waiting for a variant failed: ") + std::strerror(errno));
  ChildEnd end{.pid = pid};
  if (WIFEXITED(status)) end.exit_status = WEXITSTATUS(status);
  else if (WIFSIGNALED(status)) end.signal = WTERMSIG(status);
  return end;
}

}  // namespace tf::sweep
