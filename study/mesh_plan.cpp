#include "study/mesh_plan.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <utility>

#include <fmt/format.h>

#include "post/eddy_quantities.hpp"
#include "study/motion_plan.hpp"

namespace tf::study {
namespace {

/// The thinnest skin of the rotor's conductors [m]: at the largest slip frequency among the
/// speeds; 0 when nothing conducts.
double rotor_skin_depth(const input::Case& c) {
  const double omega = 2 * std::numbers::pi * c.supply.frequency;
  double slip = 0.0;
  for (double w : c.study.rotor_speeds) slip = std::max(slip, std::abs(omega - c.winding.pole_pairs() * w));
  const auto& m = c.materials;
  const double bars = c.geometry.rotor.kind == mesh::RotorKind::slotted ? m.bar_sigma : 0.0;
  double depth = 0.0;
  for (const auto& [mu_r, sigma] : {std::pair{m.rotor_iron_mu_r, m.rotor_iron_sigma}, std::pair{m.shaft_mu_r, m.shaft_sigma},
                                    std::pair{m.sleeve_mu_r, m.sleeve_sigma}, std::pair{1.0, bars}})
    if (sigma > 0.0 && slip > 0.0) {
      const double d = post::skin_depth(slip, mu_r, sigma);
      depth = depth > 0.0 ? std::min(depth, d) : d;
    }
  return depth;
}

}  // namespace

std::optional<mesh::SectorChoice> model_sector(const input::Case& c, const mesh::Winding& w) {
  const auto& g = c.geometry;
  // Sector meshes are checked (tests/post/test_sector_field.cpp, tests/solver/test_sector.cpp) on
  // slotted stators with smooth or magnet rotors; the rest stays on the full model for now.
  const bool checked = g.stator.kind == mesh::StatorKind::slotted && !g.stator.open_boundary &&
                       (g.rotor.kind == mesh::RotorKind::iron || g.rotor.kind == mesh::RotorKind::surface_magnet) &&
                       g.rotor.sleeve_thickness == 0.0;
  if (c.full_model || !checked || c.study.kind == input::StudyKind::eddy_currents) return std::nullopt;
  return mesh::choose_sector(g, w);
}

mesh::MeshControls plan_mesh(const input::Case& c, const mesh::Winding& w) {
  mesh::MeshControls controls = c.mesh;
  controls.sliding_multiple = sliding_multiple(c);
  if (c.study.kind == input::StudyKind::eddy_currents) controls.skin_depth = rotor_skin_depth(c);
  if (const auto sector = model_sector(c, w)) controls = mesh::with_sector(controls, *sector);
  return controls;
}

MeshedCase mesh_and_wind(const input::Case& c) {
  mesh::Winding w = mesh::lay_out(c.winding, c.geometry.stator);
  const mesh::MeshControls controls = plan_mesh(c, w);
  return {mesh::build(c.geometry, mesh::slot_layers(c.winding), controls), std::move(w)};
}

std::string model_description(const mesh::Mesh& m) {
  if (m.symmetry.copies == 1) return "the whole cross-section";
  return fmt::format("one sector, 1/{} of the machine, with {} boundaries", m.symmetry.copies,
                     m.symmetry.anti_periodic ? "anti-periodic" : "periodic");
}

}  // namespace tf::study
