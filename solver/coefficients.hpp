#pragma once
// The material coefficients of every region, computed once from Materials and the regions' kinds
// (the only place that maps a mesh::RegionKind to a material). Every assembly and every
// post-processing step that needs nu, a B-H curve, sigma, the rotor's regions or iron-loss
// coefficients reads them from here.

#include <optional>
#include <vector>

#include "mesh/mesh.hpp"
#include "solver/bh_curve.hpp"
#include "solver/materials.hpp"

namespace tf::solver {

/// Which regions conduct in a time-harmonic study.
enum class EddyModel {
  /// Stator-frame study with the motion term (solver/time_harmonic.hpp): conducting iron, shaft and
  /// sleeve at their sigma, stator and rotor alike; rotor bars dead (sigma = 0: the motion term is
  /// exact only for a rotor smooth round the axis, so a cage goes through the slip method).
  motion_term,
  /// Slip-frequency method (solver/slip.hpp): rotor conductors only (iron, shaft, sleeve, and the
  /// bars at Materials::bar_sigma); the stator's laminated iron and stranded coils carry no eddy currents.
  slip_frequency,
};

/// Per region, indexed like m.regions.
struct RegionCoefficients {
  std::vector<double> nu;                     ///< reluctivity 1/(mu0 mu_r) [m/H], linear (also where a curve is set)
  std::vector<std::optional<BhCurve>> curve;  ///< the B-H curve of nonlinear iron (magnetostatics), or none
  std::vector<double> sigma;                  ///< conductivity [S/m] of the chosen EddyModel; 0: no eddy currents
  std::vector<bool> moves_with_rotor;         ///< inside the sliding circle: rotor iron, shaft, sleeve, magnets,
                                              ///< bars and rotor air (the rotor side of the gap counts as stator)
  std::vector<IronLossData> iron_loss;        ///< stator and rotor iron: their steel's coefficients; else none
};

/// The coefficients of every region of m. Magnets take the recoil permeability (the value
/// magnet_load assumes); air, coils, bars and the gap the permeability of free space.
/// Throws std::invalid_argument (from BhCurve) on an unusable B-H table.
RegionCoefficients region_coefficients(const mesh::Mesh& m, const Materials& materials,
                                       EddyModel model = EddyModel::motion_term);

}  // namespace tf::solver
