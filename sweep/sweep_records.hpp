#pragma once
// What a sweep leaves on disk besides the variants' own results:
//   <out>/sweep.json          the sweep's variants (ids, inputs, problems found up front); the
//                             same for every shard, so `collect` can tell what is missing
//   <out>/<id>/variant.json   written last when a variant ends: its status and message. Its
//                             presence marks the variant done; a folder without it is redone.

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "sweep/sweep_file.hpp"
#include "sweep/variants.hpp"

namespace tf::sweep {

struct VariantRecord {
  std::string id;
  std::string status;   ///< "ok", "failed" or "invalid"
  std::string message;  ///< empty when ok
  double seconds = 0.0;
  std::string shard;    ///< "k/N" of the `turnfield sweep` that ran it ("1/1" unsharded); empty if unknown
};

struct ManifestEntry {
  std::string id;
  std::vector<std::string> inputs;
  std::string problem;  ///< the validation message of an invalid variant; empty if valid
};

struct Manifest {
  std::string sweep_file, title, base_case;
  RankSpec ranking;  ///< as the sweep file states it
  std::vector<std::string> parameters;
  std::vector<ManifestEntry> variants;
};

Manifest make_manifest(const SweepFile& s, const std::vector<Variant>& variants, const std::vector<std::string>& problems);

/// Writes out/sweep.json atomically. Throws post::OutputError.
void write_manifest(const std::filesystem::path& out, const Manifest& m);

/// Reads dir/sweep.json. Throws input::InputError when it is missing or not a sweep's.
Manifest read_manifest(const std::filesystem::path& dir);

/// Writes dir/variant.json atomically. Throws post::OutputError.
void write_variant_record(const std::filesystem::path& dir, const VariantRecord& r);

/// The record of a finished variant; nothing when the folder has none (never run, or cut off).
/// A record whose status is ok but whose summary.json is gone counts as unfinished.
std::optional<VariantRecord> read_variant_record(const std::filesystem::path& dir);

}  // namespace tf::sweep
