// The belt pitch of a slotless stator as OpenCASCADE surfaces, labelled like the pieces of a slot
// pitch: the fragment map, not point probing, says which piece is conductor, air or iron.

#include "mesh/slotless_shapes.hpp"

#include <numbers>

namespace tf::mesh::detail {
namespace {

/// The conductor sector centred on the +x axis, divided among the coil sides like a slot: radially
/// into equal thicknesses (layer 1 nearest the gap), or side by side (layer 1 counter-clockwise).
std::vector<Piece> conductor_shapes(const StatorGeometry& s, const SlotLayers& layers) {
  const double r_in = s.bore_radius, r_out = s.belts.outer_radius, half = 0.5 * s.belts.span;
  if (layers.count == 1) return {{add_annular_sector(r_in, r_out, -half, half), {RegionKind::coil, 1}}};
  if (layers.side_by_side)
    return {{add_annular_sector(r_in, r_out, 0.0, half), {RegionKind::coil, 1}},
            {add_annular_sector(r_in, r_out, -half, 0.0), {RegionKind::coil, 2}}};
  const double r_mid = 0.5 * (r_in + r_out);
  return {{add_annular_sector(r_in, r_mid, -half, half), {RegionKind::coil, 1}},
          {add_annular_sector(r_mid, r_out, -half, half), {RegionKind::coil, 2}}};
}

}  // namespace

std::vector<Piece> build_slotless_pieces(const Geometry& g, const SlotLayers& layers) {
  const StatorGeometry& s = g.stator;
  const double a = std::numbers::pi / s.n_positions;
  // What of the winding annulus is not conductor is air, shared with the neighbouring pitches.
  const int annulus = add_annular_sector(s.bore_radius, s.belts.outer_radius, -a, a);
  std::vector<Piece> pieces = fragment_domain(annulus, conductor_shapes(s, layers), {RegionKind::slot_air, 0});
  const int ring = add_annular_sector(s.belts.outer_radius, s.outer_radius, -a, a);
  pieces = fragment_pieces(pieces, {ring, {RegionKind::stator_iron, 0}});
  const int gap = add_annular_sector(g.mid_gap_radius(), s.bore_radius, -a, a);
  return fragment_pieces(pieces, {gap, {RegionKind::gap, 0}});
}

}  // namespace tf::mesh::detail
