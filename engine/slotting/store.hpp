// SPDX-License-Identifier: MIT
#pragma once
// The store model: zones, racks with levels, parts, slots, routes and demand, as a project file describes them.
// Every length and mass is in the project's unit system (cm and kg, or in and lb); angles in degrees.
// Defaults are filled by the loader and kept visible: each derived or defaulted value says where it came from.

#include <optional>
#include <string>
#include <vector>

#include "engine/lifting/coupling_table.hpp"
#include "engine/lifting/duration.hpp"
#include "engine/lifting/limits_of_application.hpp"

namespace rackreach {

/// Where a value used in a derivation came from, so that every number can be explained.
enum class ValueSource { file, zone_default, built_in_default, derived };
constexpr const char* value_source_name(ValueSource s) {
  switch (s) {
    case ValueSource::file: return "file";
    case ValueSource::zone_default: return "zone";
    case ValueSource::built_in_default: return "default";
    case ValueSource::derived: return "derived";
  }
  return "?";
}

/// A number with its source.
struct SourcedValue {
  double value = 0.0;
  ValueSource source = ValueSource::built_in_default;
  bool operator==(const SourcedValue&) const = default;
};

/// Built-in defaults of a zone (our assumptions, shown with every result; override them in the file).
struct ZoneDefaults {
  static constexpr double standing_distance_cm = 25.0;  ///< ankles to rack face (as the reach model's default)
  static constexpr double cart_deck_height_cm = 90.0;   ///< the store's kit carts
  static constexpr double cart_h_cm = 40.0;             ///< ankles to the hands at the cart
  static constexpr double turn_angle_deg = 45.0;        ///< rack to cart
  static constexpr double origin_angle_deg = 0.0;       ///< facing the rack
};

/// A pick zone: where pickers stand, where they put the parts, and how they turn.
struct Zone {
  std::string id;
  SourcedValue standing_distance;   ///< ankles to rack face
  SourcedValue cart_deck_height;    ///< floor to the deck of the kit cart or tote
  SourcedValue cart_h;              ///< the lifting equation's H at the cart
  SourcedValue turn_angle_deg;      ///< A at the destination
  SourcedValue origin_angle_deg;    ///< A at the rack
  bool control_at_destination = false;  ///< parts are placed with care in the kit
  /// The zone's own lifting pattern (e.g. pickers rotate to other work); empty: the shift's.
  std::optional<std::vector<WorkPeriod>> lifting_pattern;
  LimitsOfApplication limits;
  bool operator==(const Zone&) const = default;
};

enum class RackKind { hand, truck, mixed };
enum class LevelAccess { hand, truck };

struct Level {
  std::string id;
  double surface_height = 0.0;  ///< floor to the top of the shelf or beam the boxes stand on
  double clear_height = 0.0;    ///< free height above the surface, to the underside of the level above
  LevelAccess access = LevelAccess::hand;
  bool operator==(const Level&) const = default;
};

struct Rack {
  std::string id;
  RackKind kind = RackKind::hand;
  std::string zone;  ///< zone id
  double bay_width = 0.0;
  double shelf_depth = 0.0;
  int bays = 1;
  std::vector<Level> levels;  ///< from the floor up
  bool operator==(const Rack&) const = default;
};

/// How the hands hold a box (Applications Manual Table 6), from which the coupling class is derived.
enum class HandholdKind { handles, cutouts, none };
struct Handhold {
  HandholdKind kind = HandholdKind::none;
  bool optimal = false;          ///< handles 1.9-3.8 cm thick, >= 11.5 cm long, 5 cm clearance; cut-outs likewise
  bool fingers_flex_90 = false;  ///< without handles: can the fingers curl about 90 degrees under the box
  bool operator==(const Handhold&) const = default;
};

struct Box {
  double width = 0.0;   ///< frontal length, across the picker
  double depth = 0.0;   ///< into the shelf
  double height = 0.0;
  bool operator==(const Box&) const = default;
};

struct Part {
  std::string id;
  std::string family;
  std::string description;
  double unit_weight = 0.0;
  Box box;
  std::optional<Coupling> coupling;  ///< given in the file; otherwise derived from the handhold and box
  std::optional<Handhold> handhold;
  double pieces_per_kit = 1.0;
  double pieces_per_grasp = 1.0;
  int pack_pieces = 1;                ///< pieces in one pack (a box of 50 bolts); above 1 the pack can be split
  bool truck_only = false;            ///< the file says so (e.g. a pallet load)
  std::optional<double> grip_height;  ///< above the box's base; default half the box height
  bool operator==(const Part&) const = default;
};

enum class SlotPosition { front, back };

struct Slot {
  std::string id;
  std::string part;  ///< part id
  std::string rack;
  std::string level;
  int bay = 1;
  SlotPosition position = SlotPosition::front;
  bool fixed = false;  ///< stays where it is when re-slotting
  std::optional<double> origin_angle_deg;  ///< overrides the zone's
  std::optional<double> standing_distance; ///< overrides the zone's
  bool operator==(const Slot&) const = default;
};

/// A picker's route: the slots picked for one kit, in order.
struct Route {
  std::string id;
  std::string name;
  std::vector<std::string> slots;
  bool operator==(const Route&) const = default;
};

/// The shift: start and end (minutes after midnight; an end before the start is the next day) and breaks;
/// lifting is assumed during all working time unless a zone gives its own lifting pattern.
struct Shift {
  int start_min = 6 * 60;
  int end_min = 14 * 60;
  struct Break {
    int start_min = 0;
    double minutes = 0.0;
    bool operator==(const Break&) const = default;
  };
  std::vector<Break> breaks;

  double length_min() const { return end_min > start_min ? end_min - start_min : end_min + 24 * 60 - start_min; }
  /// Lifting and recovery periods in order: work between breaks is lifting, breaks are recovery.
  std::vector<WorkPeriod> work_pattern() const;
  bool operator==(const Shift&) const = default;
};

/// A reference box for the level-limits table (stated in the output).
struct ReferenceBox {
  Box box;
  Coupling coupling = Coupling::fair;
  bool operator==(const ReferenceBox&) const = default;
};

struct Store {
  std::optional<Shift> shift;
  double kits_per_hour = 0.0;
  std::vector<Zone> zones;
  std::vector<Rack> racks;
  std::vector<Part> parts;
  std::vector<Slot> slots;
  std::vector<Route> routes;
  ReferenceBox reference_box;
  std::vector<double> limit_frequencies_per_min = {0.2, 0.5, 1.0, 2.0, 4.0, 6.0};

  bool empty() const { return racks.empty() && slots.empty(); }

  const Part* find_part(const std::string& id) const;
  const Rack* find_rack(const std::string& id) const;
  const Zone* find_zone(const std::string& id) const;
  const Level* find_level(const Rack& rack, const std::string& level_id) const;
  bool operator==(const Store&) const = default;
};

}  // namespace rackreach
