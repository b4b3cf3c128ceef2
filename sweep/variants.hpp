#pragma once
// The variants of a sweep file: every combination of the varied values (a grid, last key fastest) or
// the i-th values together (zip), each as the base case's text with its values put in place.

#include <cstddef>
#include <string>
#include <vector>

#include "sweep/sweep_file.hpp"

namespace tf::sweep {

struct Variant {
  std::size_t index = 0;            ///< 0-based, in the sweep file's order
  std::vector<std::string> inputs;  ///< one TOML literal per SweepFile::varied key
  std::string case_text;            ///< the base case with the fixed and varied values replaced
  std::string id;                   ///< folder name: "v" + 16 hex digits of a hash of case_text
};

/// All variants of a sweep file, in order. Throws input::InputError if the base case is not valid TOML.
std::vector<Variant> expand_variants(const SweepFile& s);

/// "v" + FNV-1a (64 bit) of the text in hex: the same on every machine and every run, and
/// different whenever anything in the case differs (including the base case's comments).
std::string variant_id(const std::string& case_text);

/// "key = value, key = value" of a variant's varied inputs, for messages.
std::string describe_inputs(const SweepFile& s, const Variant& v);

/// A deterministic share of the variants: shard k of n (1-based) takes indices i with i % n == k - 1.
struct Shard {
  int k = 1, n = 1;
};
bool in_shard(std::size_t index, const Shard& shard);
/// "k/N", as --shard takes it.
std::string shard_text(const Shard& shard);

}  // namespace tf::sweep
