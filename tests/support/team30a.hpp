#pragma once
// TEAM Workshop Problem 30a reference values (K. R. Davey, "TEAM Problem 30a: Induction Motor
// Analyses", International Compumag Society; as tabulated in docs/references.md §1, reproduced
// there to 4-6 digits by an exact Fourier-Bessel solution): per metre, at the rotor speeds below.

#include <array>

namespace tf::testing {

struct Team30aRow {
  double speed;     ///< rad/s
  double torque;    ///< N m/m, time average
  double emf;       ///< V rms, one-turn phase-A coil (sector at 0° go, 180° return)
  double rotor_loss;  ///< W/m, aluminium + steel
};

inline constexpr std::array<Team30aRow, 7> kTeam30a = {{{0, 3.825857, 0.637157, 1455.644},
                                                       {200, 6.505013, 0.845368, 1179.541},
                                                       {400, -3.89264, 1.477981, 120.0092},
                                                       {600, -5.75939, 0.76176, 1314.613},
                                                       {800, -3.59076, 0.617891, 1548.24},
                                                       {1000, -2.70051, 0.575699, 1710.686},
                                                       {1200, -2.24996, 0.556196, 1878.926}}};

}  // namespace tf::testing
