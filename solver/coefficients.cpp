#include "solver/coefficients.hpp"
#include "solver/materials.hpp"

#include <numbers>

namespace tf::solver {
namespace {

using Kind = mesh::RegionKind;

double relative_permeability(Kind k, const Materials& mat) {
  switch (k) {
    case Kind::stator_iron: return mat.stator_iron_mu_r;
    case Kind::rotor_iron: return mat.rotor_iron_mu_r;
    case Kind::shaft: return mat.shaft_mu_r;
    case Kind::rotor_sleeve: return mat.sleeve_mu_r;
    case Kind::magnet: return mat.magnet_mu_rec;
    // Air and copper or aluminium: the permeability of free space.
    case Kind::coil:
    case Kind::slot_air:
    case Kind::gap:
    case Kind::bore_air:
    case Kind::outer_air:
    case Kind::exterior_image:  // the Kelvin map is conformal: the image holds air as it is
    case Kind::rotor_air:
    case Kind::rotor_bar: return 1.0;
  }
  return 1.0;
}

bool moves_with_rotor(Kind k) {
  return k == Kind::rotor_iron || k == Kind::shaft || k == Kind::rotor_sleeve || k == Kind::magnet ||
         k == Kind::rotor_bar || k == Kind::rotor_air;
}

/// Air, coils (whose current is given) and magnets (taken as non-conducting) carry no eddy currents.
double conductivity(Kind k, const Materials& mat, EddyModel model) {
  if (model == EddyModel::slip_frequency && !moves_with_rotor(k)) return 0.0;
  switch (k) {
    case Kind::stator_iron: return mat.stator_iron_sigma;
    case Kind::rotor_iron: return mat.rotor_iron_sigma;
    case Kind::shaft: return mat.shaft_sigma;
    case Kind::rotor_sleeve: return mat.sleeve_sigma;
    case Kind::rotor_bar: return model == EddyModel::slip_frequency ? mat.bar_sigma : 0.0;
    default: return 0.0;
  }
}

std::optional<BhCurve> curve(Kind k, const Materials& mat) {
  const std::optional<BhTable>& t = k == Kind::stator_iron ? mat.stator_iron_bh
                                    : k == Kind::rotor_iron ? mat.rotor_iron_bh
                                                            : std::nullopt;
  if (!t) return std::nullopt;
  return BhCurve(t->h, t->b, t->stacking_factor);
}

IronLossData iron_loss(Kind k, const Materials& mat) {
  const std::optional<IronLossData>& d = k == Kind::stator_iron ? mat.stator_iron_loss
                                         : k == Kind::rotor_iron ? mat.rotor_iron_loss
                                                                 : std::nullopt;
  return d ? *d : IronLossData{};
}

}  // namespace

RegionCoefficients region_coefficients(const mesh::Mesh& m, const Materials& materials, EddyModel model) {
  RegionCoefficients c;
  for (const mesh::Region& r : m.regions) {
    c.nu.push_back(1.0 / (kMu0 * relative_permeability(r.kind, materials)));
    c.curve.push_back(curve(r.kind, materials));
    c.sigma.push_back(conductivity(r.kind, materials, model));
    c.moves_with_rotor.push_back(moves_with_rotor(r.kind));
    c.iron_loss.push_back(iron_loss(r.kind, materials));
  }
  return c;
}

}  // namespace tf::solver
