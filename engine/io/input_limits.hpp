// SPDX-License-Identifier: MIT
#pragma once
// Every limit the loaders put on their input, in one place (documented in DEVELOPERS.md, "Limits on input").
//
// Two kinds of number live here:
//  * Size limits (bytes, counts, lengths, nesting): they keep a broken or hostile file from exhausting memory or
//    time. Beyond them the loader stops with one clear problem (too_large, too_many, too_long, too_deep) naming the
//    file, the path, the value and the limit, before the rest is read.
//  * Plausibility limits on quantities: `common practice` values of Rackreach, NOT from the published method. They
//    catch a value in the wrong unit or a typo (a 5,000 kg part, a 40 m shelf, 1e9 lifts/min) as an out_of_range
//    problem. The equation's own domain (H 25-63 cm, V 0-175 cm, A 0-135 deg, F to 15 lifts/min; Waters et al.
//    1993, Applications Manual 1994, see rnle.md) is not a limit here: inside the plausibility limits a value
//    outside the domain is accepted and evaluated by the method's own rules (a multiplier of 0, or the task
//    marked outside the equation), never clamped and never refused.
// NaN and infinite numbers are always errors (JSON cannot write them; a number too large for a double is refused
// by the parser; the CSV import refuses "nan" and "inf").

#include <cstddef>
#include <cstdint>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "engine/problem.hpp"

namespace rackreach::input_limits {

// ---- Size limits ----------------------------------------------------------------------------------------------

/// Largest project file read: 256 MiB (far above the generated 100,000-slot store of the benchmarks).
inline constexpr std::uintmax_t max_project_file_bytes = 256u * 1024u * 1024u;
/// Largest CSV file read (a part master or a slot list): 64 MiB.
inline constexpr std::uintmax_t max_csv_file_bytes = 64u * 1024u * 1024u;
/// Largest population table file read: 16 MiB (the shipped tables are about 130 kB).
inline constexpr std::uintmax_t max_population_file_bytes = 16u * 1024u * 1024u;

/// Deepest nesting of JSON arrays and objects (the project file's own deepest value is at depth 6).
inline constexpr std::size_t max_json_depth = 32;
/// Longest string value (an id, a name, a description, a site), in bytes.
inline constexpr std::size_t max_string_bytes = 1024;

inline constexpr std::size_t max_jobs = 1'000'000;
inline constexpr std::size_t max_tasks_per_job = 10'000;
inline constexpr std::size_t max_work_periods = 1'000;  ///< periods of a work pattern or a zone's lifting pattern
inline constexpr std::size_t max_breaks = 100;          ///< breaks of a shift
inline constexpr std::size_t max_zones = 10'000;
inline constexpr std::size_t max_racks = 100'000;
inline constexpr std::size_t max_levels_per_rack = 100;
inline constexpr std::size_t max_parts = 1'000'000;
inline constexpr std::size_t max_slots = 1'000'000;
inline constexpr std::size_t max_routes = 100'000;
inline constexpr std::size_t max_slots_per_route = 10'000;
inline constexpr std::size_t max_limit_frequencies = 100;

/// CSV: data rows (the header not counted), columns, and bytes in one cell.
inline constexpr std::size_t max_csv_rows = 1'000'000;
inline constexpr std::size_t max_csv_columns = 100;
inline constexpr std::size_t max_csv_field_bytes = 1024;

/// Population table: percentiles listed and dimensions.
inline constexpr std::size_t max_population_percentiles = 1001;
inline constexpr std::size_t max_population_dimensions = 1000;

// ---- Plausibility limits (common practice, Rackreach's own; not from the method) ---------------------------------

/// Heaviest load of a task and heaviest part, kg.
inline constexpr double max_mass_kg = 2000.0;
/// Longest horizontal distance H of a lift, cm (the equation's HM is 0 beyond 63 cm).
inline constexpr double max_h_cm = 500.0;
/// Highest vertical position V of a hand, and highest level surface, cm: 15 m (the equation's domain ends at
/// 175 cm; higher levels are reached from a truck).
inline constexpr double max_height_cm = 1500.0;
/// Most lifts per minute: one a second (Table 5 ends at 15 lifts/min, FM 0 beyond).
inline constexpr double max_frequency_per_min = 60.0;
/// Rack geometry, cm: bay width, shelf depth, a level's clear height, a box side.
inline constexpr double max_bay_width_cm = 1000.0;
inline constexpr double max_shelf_depth_cm = 300.0;
inline constexpr double max_clear_height_cm = 500.0;
inline constexpr double max_box_side_cm = 500.0;
/// Standing distance (ankles to the rack face) and the cart's H, cm.
inline constexpr double max_standing_distance_cm = 100.0;
/// Kits per hour of the store's demand.
inline constexpr double max_kits_per_hour = 10'000.0;
/// Pieces per kit and per grasp; pieces in a pack; bays of a rack.
inline constexpr double max_pieces = 1000.0;
inline constexpr long long max_pack_pieces = 100'000;
inline constexpr long long max_bays = 1000;

/// Appended to the rule of a plausibility limit, so a message never presents it as the method's.
inline constexpr std::string_view plausibility_note = " (a plausibility limit of Rackreach, not of the method)";

// ---- Helpers ----------------------------------------------------------------------------------------------------

/// Reads a whole file if it is at most `max_bytes`; otherwise, or if it cannot be read, adds a problem (file_error
/// or too_large, naming `file_label`) and returns nothing. The size is checked before the content is read.
std::optional<std::string> read_input_file(const std::string& path, std::uintmax_t max_bytes,
                                           std::vector<Problem>& problems, const std::string& file_label = {});

/// The byte offset at which JSON text first nests deeper than `max_depth` arrays and objects (strings skipped),
/// or nothing.
std::optional<std::size_t> find_json_depth_excess(std::string_view text, std::size_t max_depth);

/// "line L, column C" of a byte offset.
std::string line_and_column(std::string_view text, std::size_t byte);

/// The problem for too deep a nesting at `byte`.
Problem too_deep_problem(std::string_view text, std::size_t byte, const std::string& file_label = {});

}  // namespace rackreach::input_limits
