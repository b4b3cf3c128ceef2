#pragma once
// Arrays in case files: lists of numbers, rows of numbers, and the slot table of a winding.
// Errors name the file, the line of the element, the key with its index, and what was expected.

#include <string_view>
#include <vector>

#include "input/toml_fields.hpp"
#include "mesh/winding_spec.hpp"

namespace tf::input {

/// A required array of numbers, each in range; `size` > 0 is the length it must have.
std::vector<double> read_reals(const Fields& f, std::string_view key, const RealRange& range, std::size_t size = 0);

/// A required array of rows, each of `row_size` numbers in range.
std::vector<std::vector<double>> read_real_rows(const Fields& f, std::string_view key, const RealRange& range,
                                                std::size_t row_size);

/// The slot table: rows [slot, layer, "phase letter", "+" or "-", turns]. Each slot-layer once;
/// slots 1..n_positions, layers 1..n_layers, phases A.. of n_phases.
std::vector<mesh::CoilSide> read_slot_table(const Fields& f, std::string_view key, int n_slots, int n_layers,
                                            int n_phases);

}  // namespace tf::input
