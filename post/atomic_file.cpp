#include "post/atomic_file.hpp"

#include <fstream>
#include <set>
#include <string>
#include <system_error>

#include <unistd.h>

namespace tf::post {

std::filesystem::path temporary_name(const std::filesystem::path& path) {
  // The process id keeps two processes that write the same file (shards of a sweep writing
  // sweep.json into one shared folder) from writing into each other's temporary file.
  return path.parent_path() / ("." + path.filename().string() + "." + std::to_string(getpid()) + ".partial");
}

namespace {

/// A file name a run writes: its tables, field files, report and temporaries (temporary_name).
bool written_by_a_run(const std::string& name) {
  static const std::set<std::string> fixed = {
      "steps.csv",   "gap_field.csv",   "harmonics.csv",   "poles.csv",    "winding.csv", "winding_factors.csv",
      "torque.csv",  "inductances.csv", "torque_speed.csv", "iron_loss.csv", "iron_loss.vtu", "regions.csv",
      "field.pvd",   "report.html"};
  const bool field_file = name.rfind("field_", 0) == 0 && name.size() > 4 && name.substr(name.size() - 4) == ".vtu";
  const bool temporary = name.size() > 8 && name[0] == '.' && name.substr(name.size() - 8) == ".partial";
  return fixed.count(name) > 0 || field_file || temporary;
}

}  // namespace

void prepare_result_folder(const std::filesystem::path& dir) {
  namespace fs = std::filesystem;
  std::error_code ec;
  fs::create_directories(dir, ec);
  if (ec) throw OutputError("could not create the output folder " + dir.string() + ": " + ec.message());
  fs::remove(dir / "summary.json", ec);
  if (ec) throw OutputError("could not remove the earlier " + (dir / "summary.json").string() + ": " + ec.message());
  for (const fs::path& folder : {dir, dir / "figures"}) {
    if (!fs::is_directory(folder, ec)) continue;
    for (const auto& entry : fs::directory_iterator(folder, ec)) {
      const std::string name = entry.path().filename().string();
      const bool figure = folder != dir && entry.path().extension() == ".svg";
      if (entry.is_regular_file(ec) && (figure || written_by_a_run(name))) fs::remove(entry.path(), ec);
    }
  }
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
