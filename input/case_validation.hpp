#pragma once
// Checks that the values of a case fit together: each key was in its own range when it was read,
// but a slot can still be wider than the tooth pitch, or a winding impossible to lay out.
// These functions see only the plain structs (so a geometry sweep can use them too) and name the
// offending key by its dotted path; the case reader turns that into a file and line.
//
// Limits (our choices, stated in the messages): teeth and tooth tips at least 0.50 mm wide,
// a yoke of at least 1.00 mm behind the slot corners, an air gap of at least 0.05 mm, and at least
// 20 % of the slot depth left for the coil behind the tooth tips and wedge.

#include <optional>
#include <string>
#include <vector>

#include "input/case.hpp"
#include "mesh/geometry.hpp"
#include "mesh/winding_spec.hpp"

namespace tf::input {

/// One inconsistency: the key to blame ("stator.slot.width"), what is wrong, what would be right.
struct Problem {
  std::string key;
  std::string what;
  std::string expected;
};

/// Stator, slot and rotor dimensions [m]; the first problem found, or nothing.
std::optional<Problem> geometry_problem(const mesh::Geometry& geometry);

/// The layout of `winding` on `stator` (by rule or the user's slot table); the first problem, or nothing.
std::optional<Problem> winding_problem(const mesh::WindingSpec& winding, const mesh::StatorGeometry& stator);

std::optional<Problem> study_problem(const StudyPlan& study);

/// The first problem of each group of checks (geometry, winding, rotor motion, supply, conductors,
/// mesh size, study), in the order of the case file.
std::vector<Problem> case_problems(const Case& c);

/// The first of case_problems, or nothing.
std::optional<Problem> case_problem(const Case& c);

/// Width [m] of the tooth between two neighbouring parallel-sided slots of width `slot_width` [m],
/// measured as the chord at radius `r` [m], with `n_slots` slots; negative if the slots overlap.
/// The slot walls lie slot_width/2 from radial centre lines 2π/n_slots apart, so a wall meets the
/// circle of radius r at asin(slot_width / 2r) from its centre line.
double tooth_width(double r, double slot_width, int n_slots);

}  // namespace tf::input
