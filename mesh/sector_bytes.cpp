#include "mesh/sector_bytes.hpp"

#include <cstdint>
#include <cstring>
#include <vector>

namespace tf::mesh::detail {
namespace {

constexpr char kTag[8] = {'T', 'F', 'S', 'E', 'C', 'T', 'O', 'R'};
constexpr std::uint32_t kVersion = 1;

struct Writer {
  std::string bytes;
  template <class T>
  void put(const T& value) {
    bytes.append(reinterpret_cast<const char*>(&value), sizeof value);
  }
  template <class T>
  void put_array(const T* values, std::size_t n) {
    put(static_cast<std::uint64_t>(n));
    bytes.append(reinterpret_cast<const char*>(values), n * sizeof(T));
  }
};

[[noreturn]] void malformed(const std::string& why) {
  throw MeshError("the sector mesh that came back from the mesher is malformed: " + why);
}

/// Reads in order; every read is checked against what is left, so a bad length cannot make it
/// allocate more than the bytes could hold.
struct Reader {
  const std::string& bytes;
  std::size_t at = 0;
  void need(std::size_t n) const {
    if (n > bytes.size() - at) malformed("it ends early (" + std::to_string(bytes.size()) + " bytes)");
  }
  template <class T>
  T get() {
    need(sizeof(T));
    T value;
    std::memcpy(&value, bytes.data() + at, sizeof value);
    at += sizeof value;
    return value;
  }
  /// The length of a list of items of `size` bytes, checked against what is left.
  std::size_t get_count(std::size_t size) {
    const auto n = get<std::uint64_t>();
    if (n > (bytes.size() - at) / size) malformed("a list is longer than the bytes that follow");
    return static_cast<std::size_t>(n);
  }
  template <class T>
  void get_into(T* out, std::size_t n) {
    if (n == 0) return;  // an empty list's data() may be null, which memcpy must not be given
    need(n * sizeof(T));
    std::memcpy(out, bytes.data() + at, n * sizeof(T));
    at += n * sizeof(T);
  }
  std::vector<int> get_ints() {
    std::vector<int> v(get_count(sizeof(int)));
    get_into(v.data(), v.size());
    return v;
  }
};

void check_indices(const std::vector<int>& v, long size, const char* what) {
  for (int i : v)
    if (i < 0 || i >= size) malformed(std::string("a ") + what + " index is out of range");
}

}  // namespace

std::string encode_sector(const SectorMesh& s) {
  Writer w;
  w.bytes.append(kTag, sizeof kTag);
  w.put(kVersion);
  w.put(s.start_angle);
  w.put(s.span);
  // Eigen matrices are column-major: rows x then y (or the three corners), each list whole.
  w.put_array(s.nodes.data(), static_cast<std::size_t>(s.nodes.size()));
  w.put_array(s.triangles.data(), static_cast<std::size_t>(s.triangles.size()));
  w.put_array(s.triangle_piece.data(), s.triangle_piece.size());
  w.put(static_cast<std::uint64_t>(s.pieces.size()));
  for (const PieceKind& p : s.pieces) {
    w.put(static_cast<std::int32_t>(p.kind));
    w.put(static_cast<std::int32_t>(p.layer));
  }
  for (const std::vector<int>* list : {&s.start_cut, &s.end_cut, &s.sliding, &s.outer})
    w.put_array(list->data(), list->size());
  w.put(static_cast<std::uint64_t>(w.bytes.size() + sizeof(std::uint64_t)));
  return w.bytes;
}

SectorMesh decode_sector(const std::string& bytes) {
  Reader r{bytes};
  r.need(sizeof kTag);
  if (std::memcmp(bytes.data(), kTag, sizeof kTag) != 0) malformed("it does not start with our tag");
  r.at = sizeof kTag;
  if (r.get<std::uint32_t>() != kVersion) malformed("it is in another format version");
  SectorMesh s;
  s.start_angle = r.get<double>();
  s.span = r.get<double>();
  const std::size_t n_coordinates = r.get_count(sizeof(double));
  if (n_coordinates % 2 != 0) malformed("an odd number of node coordinates");
  s.nodes.resize(static_cast<Eigen::Index>(n_coordinates / 2), 2);
  r.get_into(s.nodes.data(), n_coordinates);
  const std::size_t n_corners = r.get_count(sizeof(int));
  if (n_corners % 3 != 0) malformed("triangle corners not in threes");
  s.triangles.resize(static_cast<Eigen::Index>(n_corners / 3), 3);
  r.get_into(s.triangles.data(), n_corners);
  s.triangle_piece = r.get_ints();
  s.pieces.resize(r.get_count(2 * sizeof(std::int32_t)));
  for (PieceKind& p : s.pieces) {
    p.kind = static_cast<RegionKind>(r.get<std::int32_t>());
    p.layer = r.get<std::int32_t>();
  }
  for (std::vector<int>* list : {&s.start_cut, &s.end_cut, &s.sliding, &s.outer}) *list = r.get_ints();
  const auto length = r.get<std::uint64_t>();
  if (length != bytes.size() || r.at != bytes.size()) malformed("its length does not match its contents");
  const long n_nodes = s.nodes.rows();
  check_indices(std::vector<int>(s.triangles.data(), s.triangles.data() + s.triangles.size()), n_nodes, "node");
  if (s.triangle_piece.size() != static_cast<std::size_t>(s.triangles.rows()))
    malformed("the piece list and the triangles differ in length");
  check_indices(s.triangle_piece, static_cast<long>(s.pieces.size()), "piece");
  for (const std::vector<int>* list : {&s.start_cut, &s.end_cut, &s.sliding, &s.outer})
    check_indices(*list, n_nodes, "node");
  return s;
}

}  // namespace tf::mesh::detail
