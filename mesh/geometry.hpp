#pragma once
// Parametric cross-section of a stator and its rotor. Plain data, SI units (m).
// Angles: slot 1 is centred on the +x axis; slots are numbered counter-clockwise.

namespace tf::mesh {

enum class SlotShape {
  open,         ///< parallel-sided slot open over its full width to the air gap
  semi_closed,  ///< parallel-sided body behind tooth tips that leave a narrower opening
};

/// One stator slot, measured along its centre line from the bore.
struct Slot {
  SlotShape shape = SlotShape::open;
  double width = 0.0;          ///< body width between the parallel walls [m]
  double depth = 0.0;          ///< bore to slot bottom, on the slot centre line [m]
  double opening_width = 0.0;  ///< semi-closed: width of the opening between the tooth tips [m]
  double tip_height = 0.0;     ///< semi-closed: radial height of the tooth tips [m]
  double wedge_height = 0.0;   ///< semi-closed: air between the tips and the coil [m]
};

enum class StatorKind {
  slotted,   ///< a yoke with Q slots in its bore
  salient,   ///< P projecting poles, each carrying a concentrated coil round its body
  slotless,  ///< an air-cored winding annulus of conductor sectors inside a smooth iron ring
};

/// The winding annulus of a slotless stator: n_positions conductor sectors, sector k centred at
/// 2*pi*(k - 1)/n_positions, between the bore radius and outer_radius; air between the sectors.
/// The iron ring runs from outer_radius to the stator's outer radius.
struct SlotlessBelts {
  double outer_radius = 0.0;  ///< [m]
  double span = 0.0;          ///< angle of each conductor sector [rad], below 2*pi/n_positions
};

/// Projecting poles of a salient-pole stator. Pole k is centred at 2*pi*(k - 1)/P.
struct SalientPoles {
  double shoe_arc = 0.0;     ///< angle spanned by the pole face at the bore [rad], mechanical
  double shoe_height = 0.0;  ///< radial thickness of the pole shoe at its tips [m]
  double body_width = 0.0;   ///< width of the parallel-sided pole body [m]
  double body_height = 0.0;  ///< radial length of the body, from the shoe to the yoke [m]
  double coil_width = 0.0;   ///< tangential thickness of each coil side beside the body [m]
  double coil_height = 0.0;  ///< radial length of each coil side, from the shoe outwards [m]
};

struct StatorGeometry {
  StatorKind kind = StatorKind::slotted;
  double bore_radius = 0.0;   ///< [m]: the slotted bore, or the circle of the pole faces
  double outer_radius = 0.0;  ///< [m], A = 0 is imposed here
  int n_positions = 0;        ///< winding positions round the bore: slots Q, salient poles P, or conductor sectors
  Slot slot;                  ///< slotted stators only
  SalientPoles poles;         ///< salient-pole stators only
  SlotlessBelts belts;        ///< slotless stators only
  /// Where A = 0 is imposed [m]: 0 for the stator's outer surface; larger for an air ring outside
  /// the stator (machines whose yoke does not keep the field in, such as TEAM problem 30a).
  double boundary_radius = 0.0;
  /// The air beyond boundary_radius reaches to infinity, by the Kelvin transformation of an outer
  /// disc (an exact open boundary), instead of A = 0 on the boundary circle.
  bool open_boundary = false;
};

/// How each slot is divided among coil sides. Salient-pole stators always carry two sides per
/// pole, one on each side of its body (layer 1 counter-clockwise of the body, layer 2 clockwise).
struct SlotLayers {
  int count = 1;              ///< 1 or 2 coil sides per slot
  bool side_by_side = false;  ///< two layers split tangentially (tooth coils), not radially
};

enum class RotorKind {
  none,            ///< no rotor: the bore is filled with air
  iron,            ///< smooth solid iron cylinder on a shaft
  surface_magnet,  ///< iron cylinder carrying arc-shaped permanent magnets on its surface
  slotted,         ///< iron cylinder with bar slots (a squirrel cage) under its surface
};

/// How the magnets of a surface-magnet rotor are magnetized.
enum class Magnetization {
  radial,    ///< along the radius through each point of the magnet
  parallel,  ///< everywhere along the radius through the pole centre (uniform in each magnet)
};

/// Arc magnets glued on the rotor iron. Pole k (1-based) is centred at the angle 2*pi*(k - 1)/n_poles,
/// so pole 1 faces slot 1 (on the +x axis) when the rotor has not turned. Odd poles are north:
/// magnetized outwards (towards the gap); even poles south, inwards. The magnets' outer surface is
/// the rotor's outer_radius; the iron runs to outer_radius - thickness. Between neighbouring
/// magnets lies air (RegionKind::rotor_air).
struct SurfaceMagnets {
  int n_poles = 0;         ///< 2p, even
  double thickness = 0.0;  ///< radial thickness of each magnet [m]
  double arc = 0.0;        ///< angle spanned by one magnet [rad], 0 < arc <= pole pitch 2*pi/n_poles
  Magnetization direction = Magnetization::radial;
};

/// Bar slots of a squirrel-cage rotor, bar k (1-based) centred on the radius at angle
/// 2*pi*(k - 1)/count. Each bar is a parallel-sided rectangle (width by depth, area width * depth)
/// whose flat top lies `bridge` below the rotor surface, measured on its centre line. Closed slots
/// (opening_width = 0) leave an iron bridge of that thickness over the bar; open slots cut a
/// parallel-sided opening of opening_width through it, from the bar top to the gap (air,
/// RegionKind::rotor_air). In magnetostatics the bars carry no current.
struct RotorBars {
  int count = 0;               ///< number of bars N
  double width = 0.0;          ///< bar width [m]
  double depth = 0.0;          ///< radial depth of the bar [m]
  double bridge = 0.0;         ///< rotor surface to bar top on the centre line [m], > 0
  double opening_width = 0.0;  ///< [m]; 0 for a closed slot, else below width
};

struct RotorGeometry {
  RotorKind kind = RotorKind::iron;
  double outer_radius = 0.0;  ///< [m]; with no rotor, the inner edge of the gap band that is sampled;
                              ///< with surface magnets, the magnets' outer surface
  double shaft_radius = 0.0;  ///< [m]; 0 for no separate shaft
  double sleeve_thickness = 0.0;  ///< [m]; a conducting sleeve on the iron rotor's surface, 0 for none
  SurfaceMagnets magnets{};   ///< surface_magnet rotors only
  RotorBars bars{};          ///< slotted (cage) rotors only: the bars in their slots
};

struct Geometry {
  StatorGeometry stator;
  RotorGeometry rotor;

  double gap_length() const { return stator.bore_radius - rotor.outer_radius; }
  /// The sliding circle, where the air-gap field is sampled: the middle of the gap.
  double mid_gap_radius() const { return 0.5 * (stator.bore_radius + rotor.outer_radius); }
};

/// One knob for the element sizes: 1 is the default, 2 halves every element size.
struct MeshControls {
  double fineness = 1.0;
  /// Eddy currents: the rotor's skin, one skin_depth [m] deep under its surface, gets at least
  /// this many elements per skin depth; 0 leaves the sizes to the fineness alone. The study that
  /// knows the frequencies sets skin_depth.
  double elements_per_skin_depth = 0.0;
  double skin_depth = 0.0;
  /// The node count of the sliding circle is made a multiple of this: a rotor-position study
  /// stepping by a given angle needs that step to be a whole number of node pitches.
  int sliding_multiple = 1;
  /// A sector model of this many stator slot pitches (pole pitches of a salient-pole stator, belt
  /// pitches of a slotless one) from the start cut of slot 1's pitch; 0 for the full model. Take it
  /// and anti_periodic from mesh::choose_sector, which checks that the winding and the rotor repeat.
  int sector_slots = 0;
  bool anti_periodic = false;  ///< the field changes sign from one sector to the next
};

}  // namespace tf::mesh
