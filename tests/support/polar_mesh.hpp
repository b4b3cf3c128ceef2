#pragma once
// Structured meshes of discs and rings for tests, made without Gmsh so that refinement is exact:
// rings of nodes at given radii, n_theta nodes each, quads split into two triangles.
// One ring may be doubled into a sliding circle (rotor-side and stator-side copies).

#include <cmath>
#include <numbers>
#include <vector>

#include "mesh/mesh.hpp"

namespace tf::testing {

struct PolarBand {
  double r_outer;  ///< outer radius of the band [m]
  int n_rings;     ///< element layers across the band
  mesh::RegionKind kind;
  const char* name;
};

/// Bands from the centre (or from r_inner > 0, a ring) outwards; A = 0 on the outermost ring.
/// If sliding_after_band >= 0, the ring at the outer edge of that band is the sliding circle.
inline mesh::Mesh polar_mesh(double r_inner, const std::vector<PolarBand>& bands, int n_theta,
                             int sliding_after_band = -1) {
  const double two_pi = 2 * std::numbers::pi;
  mesh::Mesh m;
  std::vector<Eigen::Vector2d> xy;
  std::vector<Eigen::Vector3i> tris;
  std::vector<int> tri_region;
  // Ring 0: the centre node (r_inner == 0) or a ring of n_theta nodes.
  std::vector<int> ring;
  if (r_inner == 0.0) {
    xy.push_back({0, 0});
    ring.assign(n_theta, 0);
  } else {
    for (int j = 0; j < n_theta; ++j) {
      ring.push_back(static_cast<int>(xy.size()));
      xy.push_back({r_inner * std::cos(two_pi * j / n_theta), r_inner * std::sin(two_pi * j / n_theta)});
    }
  }
  double r = r_inner;
  for (std::size_t b = 0; b < bands.size(); ++b) {
    m.regions.push_back({bands[b].name, bands[b].kind, 0, 0});
    const double dr = (bands[b].r_outer - r) / bands[b].n_rings;
    for (int k = 1; k <= bands[b].n_rings; ++k) {
      const double rk = r + k * dr;
      std::vector<int> next;
      for (int j = 0; j < n_theta; ++j) {
        next.push_back(static_cast<int>(xy.size()));
        xy.push_back({rk * std::cos(two_pi * j / n_theta), rk * std::sin(two_pi * j / n_theta)});
      }
      for (int j = 0; j < n_theta; ++j) {
        const int j1 = (j + 1) % n_theta;
        if (ring[j] == ring[j1]) {  // fan round the centre
          tris.push_back({ring[j], next[j], next[j1]});
        } else {
          tris.push_back({ring[j], next[j], next[j1]});
          tris.push_back({ring[j], next[j1], ring[j1]});
        }
        tri_region.resize(tris.size(), static_cast<int>(b));
      }
      ring = next;
    }
    r = bands[b].r_outer;
    if (static_cast<int>(b) == sliding_after_band) {
      // Duplicate the ring: the band below keeps its nodes (rotor side), the band above gets new ones.
      m.sliding.radius = r;
      m.sliding.start_angle = 0.0;
      m.sliding.rotor_nodes = ring;
      std::vector<int> copy;
      for (int j = 0; j < n_theta; ++j) {
        copy.push_back(static_cast<int>(xy.size()));
        xy.push_back(xy[ring[j]]);
      }
      m.sliding.stator_nodes = copy;
      ring = copy;
    }
  }
  m.outer_nodes = ring;
  m.nodes.resize(static_cast<Eigen::Index>(xy.size()), 2);
  for (std::size_t i = 0; i < xy.size(); ++i) m.nodes.row(static_cast<Eigen::Index>(i)) = xy[i].transpose();
  m.triangles.resize(static_cast<Eigen::Index>(tris.size()), 3);
  m.triangle_region.resize(static_cast<Eigen::Index>(tris.size()));
  for (std::size_t t = 0; t < tris.size(); ++t) {
    m.triangles.row(static_cast<Eigen::Index>(t)) = tris[t].transpose();
    m.triangle_region(static_cast<Eigen::Index>(t)) = tri_region[t];
  }
  return m;
}

}  // namespace tf::testing
