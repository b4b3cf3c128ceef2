#include "study/strategy.hpp"

namespace tf::study {

Strategy choose_strategy(const input::Case& c) {
  if (c.study.kind == input::StudyKind::eddy_currents)
    return c.geometry.rotor.kind == mesh::RotorKind::slotted ? Strategy::slip_method : Strategy::motion_term;
  const bool saturates = c.materials.stator_iron_bh || c.materials.rotor_iron_bh;
  if (input::rotor_turns(c.study.kind) || saturates) return Strategy::step_by_step;
  return Strategy::superposition;
}

const char* strategy_name(Strategy s) {
  switch (s) {
    case Strategy::superposition: return "superposition";
    case Strategy::step_by_step: return "step_by_step";
    case Strategy::motion_term: return "motion_term";
    case Strategy::slip_method: return "slip_method";
  }
  return "?";
}

const char* strategy_description(Strategy s) {
  switch (s) {
    case Strategy::superposition: return "superposition of the unit phase fields (one factorization)";
    case Strategy::step_by_step: return "one magnetostatic solution per step (Newton's method)";
    case Strategy::motion_term: return "time-harmonic solutions with the motion term";
    case Strategy::slip_method: return "the slip-frequency method";
  }
  return "?";
}

}  // namespace tf::study
