#pragma once
// Materials of the cross-section, per kind of part, as a case gives them. Coils and air have the
// permeability of free space and, as source regions of given current, no eddy currents.
// solver::region_coefficients (solver/coefficients.hpp) turns them into per-region coefficients.

#include <numbers>
#include <optional>
#include <string>
#include <vector>

namespace tf::solver {

/// Permeability of free space [H/m] (the classical SI value; the 2019 SI value differs by 1e-10).
inline constexpr double kMu0 = 4e-7 * std::numbers::pi;

/// A B-H curve as given: points (H [A/m], B [T]) of the solid steel, the stacking factor of the
/// laminations (iron's share of the stack), and where the data come from.
struct BhTable {
  std::vector<double> h, b;
  std::string source;
  double stacking_factor = 1.0;
};

/// Iron-loss coefficients of a steel (a Steinmetz-type law, post/iron_loss.hpp), the one type for
/// them: as read, per region in RegionCoefficients::iron_loss, and as post::iron_loss takes them.
/// k_h = k_e = 0 (the default): no estimate.
struct IronLossData {
  double hysteresis = 0.0;  ///< k_h [W/kg / (Hz T^exponent)]
  double exponent = 2.0;    ///< Steinmetz exponent [-]
  double eddy = 0.0;        ///< k_e [W/kg / (Hz T)^2]
  double density = 7650.0;  ///< mass density [kg/m^3]
  std::string source;       ///< where the coefficients come from
};

struct Materials {
  double stator_iron_mu_r = 1000.0;  ///< relative permeability of the stator laminations
  double rotor_iron_mu_r = 1000.0;
  double shaft_mu_r = 1.0;
  double sleeve_mu_r = 1.0;          ///< a conducting sleeve on the rotor surface
  /// Nonlinear iron: when given, the curve replaces the relative permeability (magnetostatics only).
  std::optional<BhTable> stator_iron_bh{};
  std::optional<BhTable> rotor_iron_bh{};
  /// Iron-loss coefficients, when given (studies over one electrical period).
  std::optional<IronLossData> stator_iron_loss{};
  std::optional<IronLossData> rotor_iron_loss{};
  // Conductivities [S/m] for eddy currents (time-harmonic studies); 0 is an insulator or laminations.
  double stator_iron_sigma = 0.0;
  double rotor_iron_sigma = 0.0;
  double shaft_sigma = 0.0;
  double sleeve_sigma = 0.0;
  // Permanent magnets (surface-magnet rotors), linear: B = mu0 mu_rec H + B_rem, |B_rem| = remanence.
  // Invented defaults of the order of sintered rare-earth magnets.
  double magnet_remanence = 1.2;  ///< B_r [T]
  double magnet_mu_rec = 1.05;    ///< recoil relative permeability [-]
  // Rotor bars (squirrel cage): non-magnetic. The conductivity serves eddy-current studies of a
  // cage by the slip-frequency method (solver/slip.hpp); magnetostatic studies leave the bars dead.
  // Invented default, of the order of cast aluminium.
  double bar_sigma = 3.0e7;  ///< [S/m]
};

}  // namespace tf::solver
