#include "post/atomic_file.hpp"

#include <fstream>
#include <string>
#include <system_error>

#include <unistd.h>

namespace tf::post {

std::filesystem::path temporary_name(const std::filesystem::path& path) {
  // The process id keeps two processes that write the same file (shards of a sweep writing
  // sweep.json into one shared folder) from writing into each other's temporary file.
  return path.parent_path() / ("." + path.filename().string() + "." + std::to_string(getpid()) + ".partial");
}

void prepare_result_folder(const std::filesystem::path& dir) {
  std::error_code ec;
  std::filesystem::create_directories(dir, ec);
  if (ec) throw OutputError("could not create the output folder " + dir.string() + ": " + ec.message());
  std::filesystem::remove(dir / "summary.json", ec);
}

void commit_file(const std::filesystem::path& temporary, const std::filesystem::path& path) {
  std::error_code ec;
  std::filesystem::rename(temporary, path, ec);
  if (ec) {
    std::filesystem::remove(temporary, ec);
    throw OutputError("could not write " + path.string() + ": " + ec.message());
  }
}

void write_atomically(const std::filesystem::path& path, const std::function<void(std::ostream&)>& fill) {
  const auto temporary = temporary_name(path);
  {
    std::ofstream out(temporary, std::ios::binary | std::ios::trunc);
    if (!out) throw OutputError("could not open " + temporary.string() + " for writing");
    out.precision(10);
    fill(out);
    out.flush();
    if (!out) {
      out.close();
      std::error_code ec;
      std::filesystem::remove(temporary, ec);
      throw OutputError("could not write " + path.string() + " (disk full?)");
    }
  }
  commit_file(temporary, path);
}

}  // namespace tf::post
