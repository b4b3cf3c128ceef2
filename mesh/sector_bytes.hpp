#pragma once
// A meshed sector as bytes, so that it can cross from the child process that ran Gmsh
// (mesh/isolated.hpp) back to the parent: a small format of our own, read back bit for bit.

#include <string>

#include "mesh/sector.hpp"

namespace tf::mesh::detail {

/// The sector's fields in a fixed order: a tag and format version first, every list with its
/// length, and the total length last, so that a truncated or foreign byte string is refused.
/// Numbers are in this machine's native layout (both ends are this program).
std::string encode_sector(const SectorMesh& s);

/// The sector encode_sector wrote, exactly (the same doubles, bit for bit). Throws MeshError when
/// `bytes` is not one complete encoding, or when an index in it points outside its lists.
SectorMesh decode_sector(const std::string& bytes);

}  // namespace tf::mesh::detail
