#pragma once
// What the user asks of a winding. The layout that follows from it is in winding.hpp.

#include <vector>

#include "mesh/geometry.hpp"

namespace tf::mesh {

/// One coil side: direction +1 means that a positive phase current flows along +z in it.
struct CoilSide {
  int slot = 0;   ///< 1-based; the pole number on a salient-pole stator
  int layer = 0;  ///< 1-based: 1 nearest the gap, or the counter-clockwise half when side by side
  int phase = 0;  ///< 0-based: 0 is phase A
  int direction = 1;
  int turns = 1;       ///< conductors in this coil side
  double angle = 0.0;  ///< mechanical position [rad] used for winding factors (the slot centre)
};

struct WindingSpec {
  int n_phases = 3;        ///< m
  int n_poles = 4;         ///< 2p, poles of the field
  int n_layers = 2;        ///< 1 or 2 coil sides per slot
  int coil_pitch = 0;      ///< coil span in slots (1: tooth coils)
  int turns_per_coil = 1;  ///< conductors in one coil side
  int parallel_paths = 1;  ///< a: each conductor carries the phase current / a
  /// A slot table given by the user instead of a rule (empty: laid out by rule). The angle of
  /// each side is filled in by the layout.
  std::vector<CoilSide> explicit_sides;

  int pole_pairs() const { return n_poles / 2; }
};

/// The slot division a winding needs: tooth coils (pitch 1) lie side by side, others over/under.
inline SlotLayers slot_layers(const WindingSpec& w) { return {w.n_layers, w.n_layers == 2 && w.coil_pitch == 1}; }

}  // namespace tf::mesh
