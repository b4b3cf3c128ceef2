// The only POSIX process code of mesh/. Gmsh keeps global state, and some of its failures cannot
// be caught: an exception thrown inside its OpenMP meshing loops calls std::terminate, which
// aborts the whole process. So each Gmsh session runs in a child made by fork (no exec: the child
// has the caller's geometry and size rule in its copy of memory), which sends its result back
// through a pipe and exits; whatever kills the child, the parent lives on to say which piece failed.

#include "mesh/isolated.hpp"

#include <cerrno>
#include <csignal>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <exception>

#include <fcntl.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include "mesh/mesh.hpp"

namespace tf::mesh::detail {
namespace {

// A message from the child: one byte saying what it is, its length (8 bytes), then its text.
constexpr char kResult = 'R', kMeshError = 'M', kException = 'E', kTerminated = 'T';
constexpr std::size_t kHeader = 1 + sizeof(std::uint64_t);

int g_child_fd = -1;  // the child's end of the pipe, for the terminate handler

void write_all(int fd, const char* data, std::size_t n) {
  while (n > 0) {
    const ssize_t written = ::write(fd, data, n);
    if (written < 0 && errno == EINTR) continue;
    if (written <= 0) return;  // the parent is gone; nobody is left to tell
    data += written;
    n -= static_cast<std::size_t>(written);
  }
}

void send(int fd, char kind, const std::string& text) {
  char header[kHeader];
  header[0] = kind;
  const auto length = static_cast<std::uint64_t>(text.size());
  std::memcpy(header + 1, &length, sizeof length);
  write_all(fd, header, kHeader);
  write_all(fd, text.data(), text.size());
}

/// An exception that escapes a parallel loop (or a destructor) ends in std::terminate: tell the
/// parent what it said, instead of the runtime's "terminate called after ..." on the terminal.
[[noreturn]] void on_terminate() {
  std::string text;
  if (const std::exception_ptr e = std::current_exception()) {
    try {
      std::rethrow_exception(e);
    } catch (const std::exception& x) {
      text = x.what();
    } catch (...) {
    }
  }
  send(g_child_fd, kTerminated, text);
  std::abort();
}

/// The child's life: it must never return into the caller's code (no destructors, no atexit
/// handlers, no flushing of the parent's buffers), so every path ends in _exit or abort.
[[noreturn]] void be_child(int fd, const std::function<std::string()>& work) {
  // Handlers the parent installed (a test framework's, say) would report a crash as the parent's.
  for (int s : {SIGABRT, SIGSEGV, SIGBUS, SIGFPE, SIGILL}) std::signal(s, SIG_DFL);
  // An abort is reported by the parent; a core file of a copy of it would only litter the folder.
  const rlimit no_core{0, 0};
  setrlimit(RLIMIT_CORE, &no_core);
  g_child_fd = fd;
  std::set_terminate(on_terminate);
  try {
    send(fd, kResult, work());
  } catch (const MeshError& e) {
    send(fd, kMeshError, e.what());
  } catch (const std::exception& e) {
    send(fd, kException, e.what());
  } catch (...) {
    send(fd, kException, "");
  }
  ::close(fd);
  _exit(0);
}

std::string signal_name(int s) {
  switch (s) {
    case SIGABRT: return "SIGABRT";
    case SIGSEGV: return "SIGSEGV";
    case SIGBUS: return "SIGBUS";
    case SIGFPE: return "SIGFPE";
    case SIGILL: return "SIGILL";
    case SIGKILL: return "SIGKILL";
    case SIGTERM: return "SIGTERM";
    case SIGINT: return "SIGINT";
    default: return "";
  }
}

std::string how_signalled(int s) {
  const std::string name = signal_name(s);
  const std::string which = "(signal " + std::to_string(s) + (name.empty() ? "" : ", " + name) + ")";
  if (s == SIGABRT) return "aborted " + which;
  if (s == SIGKILL) return "was killed " + which;
  return "crashed " + which;
}

std::string read_all(int fd) {
  std::string bytes;
  char buffer[1 << 16];
  for (;;) {
    const ssize_t n = ::read(fd, buffer, sizeof buffer);
    if (n < 0 && errno == EINTR) continue;
    if (n <= 0) return bytes;
    bytes.append(buffer, static_cast<std::size_t>(n));
  }
}

int wait_for(pid_t pid) {
  int status = 0;
  while (waitpid(pid, &status, 0) < 0)
    if (errno != EINTR) throw MeshError(std::string("could not wait for the mesher's process: ") + std::strerror(errno));
  return status;
}

/// The child's one message, if it arrived whole: (kind, text); kind 0 if not.
std::pair<char, std::string> message(const std::string& bytes) {
  if (bytes.size() < kHeader) return {0, {}};
  std::uint64_t length = 0;
  std::memcpy(&length, bytes.data() + 1, sizeof length);
  if (length != bytes.size() - kHeader) return {0, {}};
  return {bytes[0], bytes.substr(kHeader)};
}

}  // namespace

ChildOutcome run_in_child(const std::function<std::string()>& work) {
  int fds[2];
  if (::pipe(fds) != 0) throw MeshError(std::string("could not start the mesher's process: ") + std::strerror(errno));
  for (int fd : fds) ::fcntl(fd, F_SETFD, FD_CLOEXEC);
  std::fflush(nullptr);  // else the child's copy of unwritten output could be written twice
  const pid_t pid = ::fork();
  if (pid < 0) {
    const int error = errno;
    ::close(fds[0]);
    ::close(fds[1]);
    throw MeshError(std::string("could not start the mesher's process: ") + std::strerror(error));
  }
  if (pid == 0) {
    ::close(fds[0]);
    be_child(fds[1], work);
  }
  ::close(fds[1]);
  const std::string bytes = read_all(fds[0]);  // until the child's end closes: it exited
  ::close(fds[0]);
  const int status = wait_for(pid);
  const auto [kind, text] = message(bytes);
  if (WIFSIGNALED(status))
    return {ChildEnd::signal, kind == kTerminated ? text : std::string(), how_signalled(WTERMSIG(status))};
  if (!WIFEXITED(status) || WEXITSTATUS(status) != 0)
    return {ChildEnd::exit_status, {}, "exited with status " + std::to_string(WEXITSTATUS(status))};
  switch (kind) {
    case kResult: return {ChildEnd::result, text, "returned"};
    case kMeshError: return {ChildEnd::mesh_error, text, "threw"};
    case kException: return {ChildEnd::exception, text, "threw"};
    default:
      return {ChildEnd::truncated, {},
              "sent an incomplete result (" + std::to_string(bytes.size()) + " bytes) and exited"};
  }
}

}  // namespace tf::mesh::detail
