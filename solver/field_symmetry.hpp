#pragma once
// Steps whose field follows from another step's without a solve. B-H curves are odd (H(-B) =
// -H(B)), so negating every source of one side negates that side's field: the stator's field with
// its currents, the rotor's with its magnets. Two steps are so related when the rotor stands where
// the sliding circle ties the two sides alike, up to those signs: at rest; or, in an anti-periodic
// sector model, one sector (a pole pitch) further on, where every tie across the circle flips sign.
// A study over one electrical period meets the second half of its steps this way (the currents
// reversed, the rotor a pole pitch on): half the solves, with the same field to round-off.

#include <optional>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "solver/dofs.hpp"

namespace tf::solver {

/// The sign of each side's field in one step relative to another's.
struct SideSigns {
  double stator = 1.0;
  double rotor = 1.0;
};

/// What a step brings to the comparison: its numbering (number_dofs at its rotor shift) and currents [A].
struct StepSources {
  const DofMap& dofs;
  const std::vector<double>& currents;
};

/// The signs with which the field of `from` gives the field of `to`, when it does; nullopt otherwise.
/// Holds when (1) the currents of `to` are those of `from` times the stator's sign (to 1e-9 of the
/// largest), (2) the rotor's sign is +1 if the rotor carries magnets, and (3) the numberings agree
/// node for node with the unknowns of `to` those of `from` times one sign each that turns every
/// node's potential by its side's sign (checked on the maps themselves, whatever the model).
/// rotor_side: mesh::rotor_side_nodes of the mesh both numberings belong to.
std::optional<SideSigns> field_symmetry(const std::vector<bool>& rotor_side, bool magnets, const StepSources& from,
                                        const StepSources& to);

/// Nodal potentials a_nodes (#nodes) with the stator's and the rotor's nodes times their signs.
Eigen::VectorXd with_side_signs(const std::vector<bool>& rotor_side, const Eigen::VectorXd& a_nodes, SideSigns s);

}  // namespace tf::solver
