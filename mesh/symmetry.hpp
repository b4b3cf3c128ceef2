#pragma once
// Which sector of the machine can stand for the whole: the smallest number of slot pitches over
// which the winding and the rotor repeat, with the same sign (periodic) or with every sign flipped
// (anti-periodic). A magnetostatic field driven by such sources repeats the same way, so one sector
// with matched cut nodes gives the whole machine's field (DEVELOPERS.md, "Sector models").

#include <optional>

#include "mesh/geometry.hpp"
#include "mesh/winding.hpp"

namespace tf::mesh {

struct SectorChoice {
  int slots = 0;               ///< S: slot pitches in the sector (pole or belt pitches of salient or slotless stators)
  int copies = 1;              ///< Q / S sectors round the machine
  bool anti_periodic = false;  ///< the sources, hence the field, change sign from one sector to the next
};

/// The sector of fewest slot pitches S (a proper divisor of Q = g.stator.n_positions) for which
/// - the winding repeats: the coil sides of slot s + S (mod Q) are those of slot s (same layer,
///   phase and turns) with the same direction (periodic) or every direction reversed (anti-periodic);
/// - the rotor repeats: a smooth iron rotor or none always; surface magnets when 2*pi*S/Q is a whole
///   number j of pole pitches, anti-periodic for odd j (the next sector faces the opposite poles), and
///   then the winding must repeat with the same sign; bars (no current in magnetostatics) when the
///   bar count times S/Q is whole, with either sign of the winding.
/// Salient-pole and slotless stators are meshed per pole or belt pitch, which plays the slot pitch.
/// Nothing when only the full model fits (or w lays out a different number of slots).
std::optional<SectorChoice> choose_sector(const Geometry& g, const Winding& w);

/// MeshControls for the sector model of a choice (the other knobs copied from c).
MeshControls with_sector(MeshControls c, const SectorChoice& s);

}  // namespace tf::mesh
