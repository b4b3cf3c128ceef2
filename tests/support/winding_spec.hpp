#pragma once
#include "mesh/winding_spec.hpp"

namespace tf::testing {

/// A winding by rule: m phases, 2p poles, layers, coil pitch in slots, conductors per coil side.
inline mesh::WindingSpec winding_spec(int phases, int poles, int layers, int pitch, int turns) {
  mesh::WindingSpec spec;
  spec.n_phases = phases;
  spec.n_poles = poles;
  spec.n_layers = layers;
  spec.coil_pitch = pitch;
  spec.turns_per_coil = turns;
  return spec;
}

}  // namespace tf::testing
