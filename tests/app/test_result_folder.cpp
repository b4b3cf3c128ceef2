// What a result folder holds after a run that could not finish writing, and after a run into a
// folder used before: nothing that looks complete but is not, nothing stale beside new results.

#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <iterator>
#include <string>

#include "support/cli_run.hpp"

namespace fs = std::filesystem;
using tf::testing::fresh_folder;
using tf::testing::turnfield;

namespace {

const std::string kDemo = (fs::path(TF_SOURCE_DIR) / "cases" / "pump24_three_phase.toml").string();

int count_field_files(const fs::path& dir) {
  int n = 0;
  for (const auto& e : fs::directory_iterator(dir)) n += e.path().filename().string().rfind("field_", 0) == 0;
  return n;
}

}  // namespace

TEST_CASE("a disk that fills while field files are written leaves no truncated file under its final name") {
  // The file-size limit of the shell (ulimit -f, in KiB; SIGXFSZ ignored so that a write fails with
  // EFBIG as on a full disk) lets the tables (under 1 MB) through and stops the 3.5 MB field files.
  const fs::path out = fresh_folder("full_disk");
  const auto r = turnfield("run " + kDemo + " --fineness 2 --field-files 3 --out " + out.string());
  REQUIRE(r.status == 0);  // the same run without a limit succeeds
  fs::remove_all(out);
  const auto limited = tf::testing::run_command("bash -c 'trap \"\" XFSZ; ulimit -f 1500; exec " +
                                                std::string(TF_BINARY) + " run " + kDemo +
                                                " --fineness 2 --field-files 3 --out " + out.string() + "'");
  CHECK(limited.status == 1);
  CHECK(limited.output.find("could not write") != std::string::npos);
  CHECK(limited.output.find("field_0000.vtu") != std::string::npos);
  CHECK_FALSE(fs::exists(out / "summary.json"));
  CHECK(count_field_files(out) == 0);
  CHECK_FALSE(fs::exists(out / "field.pvd"));
  // What is there is whole: no file stopped at the limit, no temporary left behind.
  for (const auto& e : fs::directory_iterator(out)) {
    INFO(e.path().string());
    CHECK(e.path().filename().string()[0] != '.');
    if (e.is_regular_file()) CHECK(fs::file_size(e.path()) < 1500u * 1024u);
  }
}

TEST_CASE("a run into a folder used before leaves nothing of the earlier run but the user's own files") {
  const fs::path out = fresh_folder("reused");
  REQUIRE(turnfield("run " + kDemo + " --fineness 0.5 --field-files 6 --out " + out.string()).status == 0);
  CHECK(count_field_files(out) == 6);
  std::ofstream(out / "notes.txt") << "the reviewer's own notes\n";
  REQUIRE(turnfield("run " + kDemo + " --fineness 0.5 --field-files 2 --out " + out.string()).status == 0);
  CHECK(count_field_files(out) == 2);
  CHECK(fs::exists(out / "notes.txt"));
  std::ifstream pvd(out / "field.pvd");
  const std::string collection((std::istreambuf_iterator<char>(pvd)), std::istreambuf_iterator<char>());
  for (const auto& e : fs::directory_iterator(out)) {
    const std::string name = e.path().filename().string();
    if (name.rfind("field_", 0) == 0) CHECK_MESSAGE(collection.find(name) != std::string::npos, name);
  }
}
