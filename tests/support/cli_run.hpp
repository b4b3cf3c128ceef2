#pragma once
// Running the turnfield program from a test: its exit status and output, a fresh output folder,
// and the summary.json it wrote.

#include <doctest/doctest.h>

#include <array>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <string>
#include <sys/wait.h>

#include <nlohmann/json.hpp>

namespace tf::testing {

struct Outcome {
  int status;
  std::string output;  // standard output and standard error together
};

/// Runs a shell command line; its exit status (128 + n for a death by signal n, as the shell
/// reports it) and its standard output and standard error together.
inline Outcome run_command(const std::string& command) {
  FILE* pipe = popen((command + " 2>&1").c_str(), "r");
  REQUIRE(pipe != nullptr);
  std::string output;
  std::array<char, 4096> buffer{};
  while (fgets(buffer.data(), buffer.size(), pipe)) output += buffer.data();
  const int raw = pclose(pipe);
  return {WIFEXITED(raw) ? WEXITSTATUS(raw) : -1, output};
}

/// Runs the program built with the tests (TF_BINARY) with the given arguments.
inline Outcome turnfield(const std::string& arguments) { return run_command(std::string(TF_BINARY) + " " + arguments); }

/// An empty folder path under the system's temporary folder (removed if it existed).
inline std::filesystem::path fresh_folder(const std::string& name) {
  const std::filesystem::path dir = std::filesystem::temp_directory_path() / ("turnfield_test_" + name);
  std::filesystem::remove_all(dir);
  return dir;
}

inline nlohmann::json read_summary(const std::filesystem::path& dir) {
  std::ifstream in(dir / "summary.json");
  REQUIRE(in.good());
  return nlohmann::json::parse(in);
}

}  // namespace tf::testing
