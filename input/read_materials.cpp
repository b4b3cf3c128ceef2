#include "input/read_materials.hpp"

#include <iterator>
#include <numbers>
#include <optional>
#include <string_view>

#include <fmt/format.h>

#include "input/toml_arrays.hpp"
#include "solver/bh_curve.hpp"
#include "solver/materials.hpp"

namespace tf::input {
namespace {

constexpr RealRange permeability{.min = 0, .max = 1e6, .min_excluded = true};
constexpr const char* kIronKeys[] = {"relative_permeability", "conductivity", "bh_curve", "iron_loss"};

/// A part's optional conductivity [S/m]: 0 (the default) for laminations and insulators. Only
/// eddy-current studies use it.
double read_conductivity(const Fields& f) {
  return f.real_or("conductivity", 0.0, {.min = 0, .max = 1e9, .unit = "S/m"});
}

/// [<part>.bh_curve]: points of the solid steel, where they come from, and the stacking factor.
solver::BhTable read_bh_table(const Fields& part) {
  const Fields f = part.table("bh_curve", {"h", "b", "source", "stacking_factor"});
  solver::BhTable t;
  t.h = read_reals(f, "h", {.min = 0, .max = 1e8, .unit = "A/m"});
  t.b = read_reals(f, "b", {.min = 0, .max = 10, .unit = "T"});
  if (t.h.size() != t.b.size())
    f.fail("b", fmt::format("{} values of B for {} values of H", t.b.size(), t.h.size()), "one B per H");
  // A first point off the origin would put a remanent flux density in the steel (or an H without B).
  if (!t.h.empty() && (t.h.front() != 0.0 || t.b.front() != 0.0))
    f.fail("h", fmt::format("the curve starts at (H, B) = ({:g} A/m, {:g} T)", t.h.front(), t.b.front()),
           "a first point (0, 0), the demagnetized state");
  if (const auto problem = solver::BhCurve::table_problem(t.h, t.b))
    f.fail("b", *problem, "a monotone B-H curve of the solid steel");
  t.source = f.text_or("source", "");
  if (t.source.empty())
    f.fail("source", "missing", "where the curve comes from (a publication, a measurement, or \"invented\")");
  t.stacking_factor = f.real_or("stacking_factor", 1.0, {.min = 0.5, .max = 1.0});
  return t;
}

/// [<part>.iron_loss]: coefficients of a Steinmetz-type law and where they come from.
std::optional<solver::IronLossData> read_iron_loss(const Fields& part) {
  const auto f = part.optional_table("iron_loss", {"hysteresis", "exponent", "eddy", "density", "source"});
  if (!f) return std::nullopt;
  solver::IronLossData d;
  d.hysteresis = f->real("hysteresis", {.min = 0, .max = 1, .unit = "W/kg per Hz T^exponent"});
  d.exponent = f->real_or("exponent", d.exponent, {.min = 1, .max = 3});
  d.eddy = f->real("eddy", {.min = 0, .max = 1, .unit = "W/kg per (Hz T)^2"});
  d.density = f->real_or("density", d.density, {.min = 1000, .max = 20000, .unit = "kg/m^3"});
  d.source = f->text_or("source", "");
  if (d.source.empty())
    f->fail("source", "missing", "where the coefficients come from (a publication, a fit to measurements, or \"invented\")");
  return d;
}

struct Iron {
  double mu_r = 1000.0;
  double sigma = 0.0;
  std::optional<solver::BhTable> bh;
  std::optional<solver::IronLossData> loss;
};

/// An iron part: relative_permeability (required, or with a fallback) or a B-H curve, not both;
/// the curve's initial permeability stands in for the studies that stay linear.
Iron read_iron(const Fields& part, const std::optional<Iron>& fallback) {
  Iron iron = fallback.value_or(Iron{});
  iron.sigma = read_conductivity(part);
  iron.loss = read_iron_loss(part);
  if (!part.has("bh_curve")) {
    iron.mu_r = fallback ? part.real_or("relative_permeability", fallback->mu_r, permeability)
                         : part.real("relative_permeability", permeability);
    return iron;
  }
  part.reject("relative_permeability", "given beside a B-H curve", "one of the two");
  iron.bh = read_bh_table(part);
  const solver::BhCurve curve(iron.bh->h, iron.bh->b, iron.bh->stacking_factor);
  iron.mu_r = 1.0 / (solver::kMu0 * curve.reluctivity(0.0).nu);
  return iron;
}

struct Part {
  double mu_r, sigma;
};

/// An optional [materials.<part>] table: its permeability and conductivity, each with its default.
Part read_part(const Fields& materials, std::string_view part, Part defaults) {
  const auto t = materials.optional_table(part, {"relative_permeability", "conductivity"});
  if (!t) return defaults;
  return {t->real_or("relative_permeability", defaults.mu_r, permeability), read_conductivity(*t)};
}

/// [materials.magnets] (remanence, recoil permeability) and [materials.rotor_bars] (conductivity),
/// each only with its rotor kind; defaults as in solver::Materials.
void read_rotor_parts(const Fields& f, const mesh::RotorGeometry& rotor, solver::Materials& m) {
  if (rotor.kind != mesh::RotorKind::surface_magnet)
    f.reject("magnets", "no magnets on this rotor", "no such table, or [rotor] kind = \"magnets\"");
  else if (const auto t = f.optional_table("magnets", {"remanence", "recoil_permeability"})) {
    m.magnet_remanence = t->real_or("remanence", m.magnet_remanence, {.min = 0, .max = 3, .unit = "T"});
    m.magnet_mu_rec = t->real_or("recoil_permeability", m.magnet_mu_rec, {.min = 1, .max = 100});
  }
  if (rotor.kind != mesh::RotorKind::slotted)
    f.reject("rotor_bars", "no bars in this rotor", "no such table, or [rotor] kind = \"slotted\"");
  else if (const auto t = f.optional_table("rotor_bars", {"conductivity"}))
    m.bar_sigma = read_conductivity(*t);
}

}  // namespace

solver::Materials read_materials(const Fields& root, const mesh::RotorGeometry& rotor) {
  const Fields f =
      root.table("materials", {"stator_iron", "rotor_iron", "shaft", "rotor_sleeve", "magnets", "rotor_bars"});
  solver::Materials m;
  const std::vector<std::string> iron_keys(std::begin(kIronKeys), std::end(kIronKeys));
  const Iron stator = read_iron(f.table("stator_iron", iron_keys), std::nullopt);
  m.stator_iron_mu_r = stator.mu_r;
  m.stator_iron_sigma = stator.sigma;
  m.stator_iron_bh = stator.bh;
  m.stator_iron_loss = stator.loss;
  // A material for a part that is not there is most likely a leftover of another case.
  read_rotor_parts(f, rotor, m);
  if (rotor.kind == mesh::RotorKind::none) {
    for (const char* key : {"rotor_iron", "shaft", "rotor_sleeve"})
      f.reject(key, "not used, since [rotor] kind = \"none\"", "no such table, or [rotor] kind = \"iron\"");
    return m;
  }
  if (rotor.sleeve_thickness <= 0.0)
    f.reject("rotor_sleeve", "not used, since the rotor has no sleeve",
             "no such table, or a sleeve given by [rotor] sleeve_thickness");
  if (const auto t = f.optional_table("rotor_iron", iron_keys)) {
    const Iron iron = read_iron(*t, Iron{m.rotor_iron_mu_r, m.rotor_iron_sigma, std::nullopt, std::nullopt});
    m.rotor_iron_loss = iron.loss;
    m.rotor_iron_mu_r = iron.mu_r;
    m.rotor_iron_sigma = iron.sigma;
    m.rotor_iron_bh = iron.bh;
  }
  const Part shaft = read_part(f, "shaft", {m.shaft_mu_r, m.shaft_sigma});
  const Part sleeve = read_part(f, "rotor_sleeve", {m.sleeve_mu_r, m.sleeve_sigma});
  m.shaft_mu_r = shaft.mu_r;
  m.shaft_sigma = shaft.sigma;
  m.sleeve_mu_r = sleeve.mu_r;
  m.sleeve_sigma = sleeve.sigma;
  return m;
}

}  // namespace tf::input
