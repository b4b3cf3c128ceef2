#include "post/atomic_file.hpp"

#include <fstream>
#include <system_error>

namespace tf::post {

std::filesystem::path temporary_name(const std::filesystem::path& path) {
  return path.parent_path() / ("." + path.filename().string() + ".partial");
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
