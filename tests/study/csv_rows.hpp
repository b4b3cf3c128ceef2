#pragma once
// The CSV tables of a result folder read back as text cells, and as numeric columns.

#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <map>
#include <sstream>
#include <string>
#include <vector>

namespace tf::testing {

/// A CSV file's rows as text cells by column name.
inline std::vector<std::map<std::string, std::string>> read_rows(const std::filesystem::path& path) {
  std::ifstream in(path);
  REQUIRE(in.good());
  std::string line;
  std::getline(in, line);
  std::vector<std::string> names;
  std::stringstream header(line);
  for (std::string name; std::getline(header, name, ',');) names.push_back(name);
  std::vector<std::map<std::string, std::string>> rows;
  while (std::getline(in, line)) {
    std::stringstream row(line);
    std::map<std::string, std::string> cells;
    std::string cell;
    for (std::size_t i = 0; i < names.size() && std::getline(row, cell, ','); ++i) cells[names[i]] = cell;
    rows.push_back(cells);
  }
  return rows;
}

/// A CSV file of numbers as columns by name.
inline std::map<std::string, std::vector<double>> read_columns(const std::filesystem::path& path) {
  std::map<std::string, std::vector<double>> columns;
  for (const auto& row : read_rows(path))
    for (const auto& [name, cell] : row) columns[name].push_back(std::stod(cell));
  return columns;
}

}  // namespace tf::testing
