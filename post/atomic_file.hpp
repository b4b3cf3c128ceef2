#pragma once
// Every output file is written under a temporary name and renamed into place when complete,
// so a killed run never leaves a truncated file that looks finished.

#include <filesystem>
#include <functional>
#include <ostream>
#include <stdexcept>

namespace tf::post {

/// Writing an output file failed (disk full, no permission); the message names the file.
struct OutputError : std::runtime_error {
  using std::runtime_error::runtime_error;
};

/// Writes `path` through `fill`; throws OutputError and leaves no file on failure.
void write_atomically(const std::filesystem::path& path, const std::function<void(std::ostream&)>& fill);

/// Renames a finished temporary file into place; throws OutputError.
void commit_file(const std::filesystem::path& temporary, const std::filesystem::path& path);

/// Creates the result folder and removes what an earlier run wrote there: summary.json first
/// (which would mark a half-rewritten folder as complete), then every file of ours (tables, field
/// files and their collection, iron loss, report and figures, left-over temporaries), so that no
/// stale field file stands beside new results. Files of other names are left alone. Throws OutputError.
void prepare_result_folder(const std::filesystem::path& dir);

/// The temporary name used while `path` is being written.
std::filesystem::path temporary_name(const std::filesystem::path& path);

}  // namespace tf::post
