#pragma once
// CSV tables of a study. Column names carry their units; angles are in degrees and say so.

#include <filesystem>
#include <string>

#include "mesh/winding.hpp"
#include "post/study.hpp"

namespace tf::post {

/// Phase letter of 0-based phase k: A, B, C, ...
std::string phase_name(int k);

/// steps.csv: one row per step: angle, currents, fundamental, axis, peak, distortion, pole counts.
void write_steps_table(const std::filesystem::path& path, const StudyResult& r, double frequency);
/// gap_field.csv: one row per step and sample angle: B_r and B_θ on the mid-gap circle.
void write_gap_table(const std::filesystem::path& path, const StudyResult& r);
/// poles.csv: per step, every north and south pole of the stator field: where, and its flux.
void write_poles_table(const std::filesystem::path& path, const StudyResult& r);
/// harmonics.csv: one row per step and space order n = 1 .. p*max_harmonic.
void write_harmonics_table(const std::filesystem::path& path, const StudyResult& r, int pole_pairs);
/// winding.csv: the slot table; winding_factors.csv: factors per electrical order.
/// regions.csv: region id (as in the field files' "region" array), name and area [m²] of each region.
void write_regions_table(const std::filesystem::path& path, const mesh::Mesh& m);

void write_winding_tables(const std::filesystem::path& folder, const mesh::Winding& w, int max_order);

}  // namespace tf::post
