#pragma once
// The source term of linear permanent magnets in the A-formulation.
//
// In a magnet H = nu (B - B_rem), nu = 1/(mu0 mu_rec). With B = curl(A e_z) and the test function
// v, the weak form of curl H = J becomes
//   int nu grad A . grad v dS = int J v dS + int nu (B_rem,x dv/dy - B_rem,y dv/dx) dS,
// so a magnet adds the load f_i = sum over its triangles of nu * area * (B_rem,x g_iy - B_rem,y g_ix),
// g_i the (constant) gradient of shape function i. For a uniform B_rem this is the load of the
// equivalent surface current K_z = nu (B_rem x n)_z on the magnet's boundary (n outward), and zero
// at nodes inside it.
//
// The load is in the rotor's own frame: rotor nodes do not move when the rotor turns (only the
// sliding-circle ties change), so it depends on the mesh alone and is computed once.

#include <Eigen/Core>

#include "mesh/geometry.hpp"
#include "mesh/mesh.hpp"
#include "solver/dofs.hpp"
#include "solver/materials.hpp"

namespace tf::solver {

/// Where the poles are and how they are magnetized. Pole k (1-based, a magnet region's `slot`) is
/// centred at first_pole_angle + 2*pi*(k - 1)/n_poles [rad]; odd poles are north (B_rem points
/// outwards), even poles south.
struct MagnetLayout {
  int n_poles = 0;
  mesh::Magnetization direction = mesh::Magnetization::radial;
  double first_pole_angle = 0.0;  ///< [rad]; 0 for mesh::build's rotors (pole 1 on the +x axis)
};

/// The layout of a surface-magnet rotor as mesh::build draws it.
MagnetLayout magnet_layout(const mesh::RotorGeometry& r);

/// Remanent flux density (B_rem,x, B_rem,y) [T] in a triangle of pole `pole` (1-based) whose
/// centroid is `centroid` [m]: radial, +-B_r along the unit vector of the centroid; parallel,
/// +-B_r along the unit vector of the pole centre; + for odd (north) poles.
Eigen::Vector2d remanence(const MagnetLayout& layout, double b_r, int pole, const Eigen::Vector2d& centroid);

/// Load vector, #dofs, of every magnet region (RegionKind::magnet) of m: remanence
/// mat.magnet_remanence, reluctivity 1/(mu0 mat.magnet_mu_rec) (the value region_coefficients gives
/// the magnets, which the stiffness must use too). Entries of nodes without an unknown are dropped.
Eigen::VectorXd magnet_load(const mesh::Mesh& m, const DofMap& d, const Materials& mat, const MagnetLayout& layout);

}  // namespace tf::solver
