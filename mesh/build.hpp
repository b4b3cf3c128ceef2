#pragma once
// From parameters to the mesh of the whole cross-section.

#include "mesh/geometry.hpp"
#include "mesh/mesh.hpp"

namespace tf::mesh {

/// Element sizes [m] that follow from the geometry and the fineness knob.
struct ElementSizes {
  double gap;       ///< in the air gap: at least four elements across it
  double largest;   ///< far from the gap, in the yoke and the rotor; beyond the stator, in outer
                    ///< air, elements grow further with the distance
  double grading;   ///< growth of the size per metre of distance from the gap [-]
};
ElementSizes element_sizes(const Geometry& g, const MeshControls& c);

/// The narrowest part [m] that elements far from the gap must resolve (their largest size is half
/// of it): a slot, a salient pole's body or coil side, a slotless stator's annulus, sectors and ring,
/// a slotted rotor's bars.
double narrowest_part(const Geometry& g);

/// The most triangles a mesh may hold: more would exhaust memory or time on one machine.
inline constexpr double kMostTriangles = 4e6;

/// At least how many triangles the whole cross-section inside the stator's outer radius takes at
/// the largest element size (an equilateral triangle of that side each): a lower bound that
/// build() and the case checks compare with kMostTriangles before anything is meshed.
double least_triangles(const Geometry& g, const MeshControls& c);

/// Meshes one stator slot pitch and one rotor sector with Gmsh and copies them round by rotation,
/// merging the nodes on the cuts: every slot gets the identical mesh. `layers` says how each slot
/// is divided among coil sides. With c.sector_slots = S > 0, only the first S slot pitches (from
/// the start cut of slot 1's pitch, at -pi/Q) and the rotor under them: a sector model whose
/// Mesh::symmetry says how it repeats (the sliding circle keeps the full model's node pitch).
/// Throws MeshError.
Mesh build(const Geometry& g, const SlotLayers& layers, const MeshControls& c);

}  // namespace tf::mesh
