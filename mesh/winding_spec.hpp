#pragma once
// What the user asks of a winding. The layout that follows from it is in winding.hpp.

#include "mesh/geometry.hpp"

namespace tf::mesh {

struct WindingSpec {
  int n_phases = 3;        ///< m
  int n_poles = 4;         ///< 2p
  int n_layers = 2;        ///< 1 or 2 coil sides per slot
  int coil_pitch = 0;      ///< coil span in slots
  int turns_per_coil = 1;  ///< conductors in one coil side
  int parallel_paths = 1;  ///< a: each conductor carries the phase current / a

  int pole_pairs() const { return n_poles / 2; }
};

/// The slot division a winding needs: tooth coils (pitch 1) lie side by side, others over/under.
inline SlotLayers slot_layers(const WindingSpec& w) { return {w.n_layers, w.n_layers == 2 && w.coil_pitch == 1}; }

}  // namespace tf::mesh
