#pragma once
// The quantities a designer checks by eye before solving, derived from a case's dimensions and
// winding: air gap, slot and pole pitch, tooth widths, slot and coil areas, conductors per slot,
// Carter's factor, slots per pole and phase, synchronous speed.

#include <optional>

#include "input/case.hpp"

namespace tf::input {

struct DerivedGeometry {
  std::optional<double> air_gap;       ///< [m]; none without a rotor
  double slot_pitch = 0.0;             ///< [m], the arc at the bore (pole or belt pitch of salient, slotless stators)
  double pole_pitch = 0.0;             ///< [m], the arc at the bore
  std::optional<double> tooth_at_bore;     ///< [m] chord (slotted stators): the tooth tips', or the tooth of an open slot
  std::optional<double> tooth_narrowest;   ///< [m] chord where the parallel-sided slot body begins
  std::optional<double> slot_area;         ///< [m^2] of one slot, opening and wedge included (slotted)
  double coil_area = 0.0;                  ///< [m^2] of the coil sides in one slot (or pole, or belt)
  int conductors = 0;                      ///< in the fullest slot (pole, belt): its coil sides' turns
  std::optional<double> carter_factor;     ///< of the stator slot openings; none without a rotor or slots
  int q_numerator = 0, q_denominator = 1;  ///< q = Q / (2p m), reduced
  std::optional<double> synchronous_rpm;   ///< 60 f / p; none for stepped DC
};

DerivedGeometry derive_geometry(const Case& c);

/// Carter's factor of slot openings b [m] every slot pitch tau [m] over an air gap g [m]:
/// k_C = tau / (tau - gamma g), gamma = (4/pi) [x atan x - ln sqrt(1 + x^2)], x = b / 2g
/// (F. W. Carter, "Air-gap induction", Electrical World and Engineer, 1901; in this form in
/// Pyrhonen, Jokinen, Hrabovcova, "Design of Rotating Electrical Machines", 2008, ch. 3; from memory).
double carter_factor(double tau, double b, double g);

/// The area [m^2] of the part of a slot of width w [m], reaching down below a bore of radius r [m],
/// that lies outside the bore circle and below the line tangent to it at the slot centre: the
/// sliver by which a slot cut at the bore exceeds its rectangle above that line.
double bore_sliver(double r, double w);

}  // namespace tf::input
