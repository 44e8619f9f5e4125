// SPDX-License-Identifier: MIT
#pragma once
// CSV import of a part master and a slot list, as a warehouse system exports them, and CSV export of both in
// the form the import reads back.
//
// The file. A header row, then one row per part or slot. Parsed with libcsv in strict mode: fields may be quoted
// ("..."), quotes inside are doubled, quoted fields may hold commas and line breaks. A UTF-8 byte-order mark is
// skipped; LF, CRLF and CR line ends are all read. Rows with no cells or with every cell empty are skipped (a
// spreadsheet leaves them at the end). Every other row must have exactly as many cells as the header. Spaces and
// tabs around a cell are not part of its value. Text must be UTF-8. A cell that starts with an apostrophe
// followed by =, +, -, @, tab or CR is read without the apostrophe: that is how `csv_cell()` neutralises
// formula-like cells on export, so the export reads back as it was.
//
// Columns are found by name, not by position. A header is normalised before it is looked up: ASCII letters to
// lower case, spaces and hyphens to '_', and a trailing unit in brackets ("Weight (kg)", "Width [mm]") to a
// suffix ("weight_kg", "width_mm"). A name is looked up whole first; if it is not known, a unit suffix is split
// off and the rest is looked up:
//   _kg, _lb                 mass columns;
//   _cm, _mm, _m, _in        length columns (mm and m are converted to cm exactly, by 1/10 and 100);
//   _deg                     angle columns (degrees are the only angle unit; a name without it means degrees).
// A column of lengths or masses without a suffix takes `CsvOptions::units`; when that is absent, the column is an
// error (missing_unit). A suffix of the wrong kind (`width_kg`, `bay_cm`) is an error (wrong_unit). Values are
// converted into the project's unit system with the exact constants of engine/quantities.hpp.
//
// The canonical column names are the project file's keys (nested keys joined by '.'); `write_parts_csv` and
// `write_slots_csv` write them, with a unit suffix on lengths, masses and angles. The tables below are the only
// place where names and aliases are set; the rules and bounds are those of the project file's store loader
// (engine/io/store_loader.cpp), so that an import always makes a project file that loads, and they are given here
// in cm and kg (converted to the column's unit for the check and the message).
//
// Part master (one row per part; required columns marked *):
//   canonical                 also accepted                                           value
//   id *                      part, part_id, part_no, part_number, item, item_id,     text, unique in the file
//                             item_no, sku
//   family *                  part_family, family_id, group                           text
//   description               desc, part_description, item_description, name          text
//   unit_weight *             weight, unit_mass, mass, piece_weight                   mass > 0, <= 2000 kg
//   box.width *               box_width, width                                        length > 0, <= 500 cm
//                                                                                     (across the picker)
//   box.depth *               box_depth, depth, length, box_length                    length > 0, <= 500 cm
//                                                                                     (into the shelf)
//   box.height *              box_height, height                                      length > 0, <= 500 cm
//   coupling                  coupling_class                                          good, fair, poor
//   handhold.kind             handhold, handhold_kind, handholds                      handles, cutouts, none
//   handhold.optimal          handhold_optimal, optimal_handhold                      boolean (default no)
//   handhold.fingers_flex_90  fingers_flex_90, fingers_flex                           boolean (default no)
//   pieces_per_kit            per_kit, qty_per_kit, quantity_per_kit                  number > 0, <= 1000 (default 1)
//   pieces_per_grasp          per_grasp, qty_per_grasp, pieces_per_pick               number > 0, <= 1000 (default 1)
//   pack_pieces               pieces_per_pack, qty_per_pack, pack_qty                 whole number 1 to 100000
//                                                                                     (default 1)
//   truck_only                truck, truck_pick                                       boolean (default no)
//   grip_height               grip_height                                             length, 0 to box.height
//                                                                                     (default: half the box)
// A part master's "length" is read as the box's depth into the shelf (width across the picker, height up): the
// box is assumed to stand with its length into the shelf; turn it in the project file where it does not.
// A row gives coupling or handhold.kind, not both (the coupling class is otherwise derived from the handhold);
// handhold.optimal and handhold.fingers_flex_90 need handhold.kind on the same row; optimal needs handles or
// cutouts.
//
// Slot list (one row per slot):
//   canonical                 also accepted                                           value
//   id *                      slot, slot_id, location, location_id, bin, bin_id       text, unique in the file
//   part *                    part_id, part_no, part_number, item, item_id, item_no,  text (a part of the part
//                             sku                                                     master, checked by
//                                                                                     import_store_csv)
//   rack *                    rack_id                                                 text
//   level *                   level_id, shelf, tier                                   text
//   bay                       bay_no, bay_number                                      whole number 1 to 1000000
//                                                                                     (default 1)
//   position                  depth_position, front_back                              front, back (default front)
//   fixed                     locked, pinned                                          boolean (default no)
//   origin_angle              angle                                                   angle 0 to 180 deg
//   standing_distance         stand_off, standoff                                     length 0 to 100 cm
//
// Booleans are yes/no, true/false, 1/0; booleans and the named choices are read in any letter case. An empty cell
// of an optional column takes the default. Numbers are plain decimals with a point ("12.5"; "12,5" is an error).
//
// Problems. Every problem names the file (`Problem::file`), the line and the column, the value and the rule; the
// line is the physical line of the file on which the cell starts (the header is line 1; a quoted line break
// inside a cell moves the cells after it to the next line). `Problem::path` is `line 12, column 4 (weight_kg)`,
// `line 12` for a whole row, `line 1` for a column the header lacks. Codes: file_error, parse_error (the file is
// not CSV, or a row has the wrong number of cells), missing_column, unknown_column, duplicate_column,
// missing_unit, wrong_unit, empty (a required cell, or a file without rows), wrong_type (not a number, a whole
// number, or a finite number), out_of_range, invalid_value (not one of the choices, not UTF-8, an inconsistent
// row), duplicate_id, unknown_reference (a slot's part is not in the part master).
//
// How `rackreach import` will use it: `import_store_csv(parts, slots, project_units, options)`; if `problems` is
// not empty, print each with `format_problem` and exit 1 writing nothing; otherwise print `warnings` (ignored
// columns) to stderr, put `parts` and `slots` into the project's store and write the project file with
// `write_file_atomically`. The CLI's `--units metric|us` sets `CsvOptions::units` (for headers without a unit) and
// `--ignore-unknown-columns` sets `ignore_unknown_columns`.

#include <map>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "engine/problem.hpp"
#include "engine/quantities.hpp"
#include "engine/slotting/store.hpp"

namespace rackreach {

/// How a column's cells are read.
enum class CsvValueKind {
  text,           ///< any UTF-8 text (ids must not be empty)
  mass,           ///< a number in kg or lb, > 0
  length,         ///< a number in cm, mm, m or in
  angle,          ///< a number in degrees
  number,         ///< a plain number (counts), range set per column
  whole_number,   ///< an integer, range set per column
  boolean,        ///< yes/no, true/false, 1/0
  coupling,       ///< good, fair, poor
  handhold_kind,  ///< handles, cutouts, none
  position,       ///< front, back
};

/// One column of a CSV table: its canonical name, the other names accepted, and how its cells are read.
struct CsvColumnSpec {
  std::string_view name;     ///< canonical: the project file's key, nested keys joined by '.'
  std::string_view aliases;  ///< other accepted names (after normalisation), separated by single spaces
  CsvValueKind kind = CsvValueKind::text;
  bool required = false;
};

/// The part master's columns, in the order `write_parts_csv` writes them.
inline constexpr CsvColumnSpec part_csv_columns[] = {
    {"id", "part part_id part_no part_number item item_id item_no sku", CsvValueKind::text, true},
    {"family", "part_family family_id group", CsvValueKind::text, true},
    {"description", "desc part_description item_description name", CsvValueKind::text, false},
    {"unit_weight", "weight unit_mass mass piece_weight", CsvValueKind::mass, true},
    {"box.width", "box_width width", CsvValueKind::length, true},
    {"box.depth", "box_depth depth length box_length", CsvValueKind::length, true},
    {"box.height", "box_height height", CsvValueKind::length, true},
    {"coupling", "coupling_class", CsvValueKind::coupling, false},
    {"handhold.kind", "handhold handhold_kind handholds", CsvValueKind::handhold_kind, false},
    {"handhold.optimal", "handhold_optimal optimal_handhold", CsvValueKind::boolean, false},
    {"handhold.fingers_flex_90", "fingers_flex_90 fingers_flex", CsvValueKind::boolean, false},
    {"pieces_per_kit", "per_kit qty_per_kit quantity_per_kit", CsvValueKind::number, false},
    {"pieces_per_grasp", "per_grasp qty_per_grasp pieces_per_pick", CsvValueKind::number, false},
    {"pack_pieces", "pieces_per_pack qty_per_pack pack_qty", CsvValueKind::whole_number, false},
    {"truck_only", "truck truck_pick", CsvValueKind::boolean, false},
    {"grip_height", "", CsvValueKind::length, false},
};

/// The slot list's columns, in the order `write_slots_csv` writes them.
inline constexpr CsvColumnSpec slot_csv_columns[] = {
    {"id", "slot slot_id location location_id bin bin_id", CsvValueKind::text, true},
    {"part", "part_id part_no part_number item item_id item_no sku", CsvValueKind::text, true},
    {"rack", "rack_id", CsvValueKind::text, true},
    {"level", "level_id shelf tier", CsvValueKind::text, true},
    {"bay", "bay_no bay_number", CsvValueKind::whole_number, false},
    {"position", "depth_position front_back", CsvValueKind::position, false},
    {"fixed", "locked pinned", CsvValueKind::boolean, false},
    {"origin_angle", "angle", CsvValueKind::angle, false},
    {"standing_distance", "stand_off standoff", CsvValueKind::length, false},
};

struct CsvOptions {
  /// The units of length and mass columns whose header has no unit suffix; absent: such a column is an error.
  std::optional<UnitSystem> units;
  /// Columns the table does not know are errors (a typo must not pass silently); with this set they are skipped
  /// and reported in `warnings` instead.
  bool ignore_unknown_columns = false;
  /// The user's choice of column (a preview's mapping): 0-based column of the file -> the name to read it by
  /// instead of its header (a canonical name or alias, with a unit suffix where the column needs one, as a header
  /// would be written), or "" to leave the column out. Columns not in the map are read by their header. Every rule
  /// of the table applies to the names given here as to headers; problems still name the file's header.
  std::map<std::size_t, std::string> column_names;
};

/// The start of a CSV file as it is, for a preview: the header's cells and the first rows (blank rows skipped),
/// each with its line, or the problem that stops the file from being read.
struct CsvPreview {
  std::vector<std::string> header;
  struct Row {
    std::size_t line = 0;
    std::vector<std::string> cells;
  };
  std::vector<Row> rows;          ///< at most the number asked for
  std::size_t total_rows = 0;     ///< every row of the file after the header
  std::vector<Problem> problems;  ///< parse_error, empty, file_error
};
CsvPreview read_csv_preview(std::string_view text, const std::string& file_name, std::size_t max_rows);

/// The column a header names in `columns` (part_csv_columns or slot_csv_columns), as the import matches it: the
/// canonical name with the header's unit suffix ("unit_weight_kg"), or "" when no column has that name.
std::string match_csv_column(std::span<const CsvColumnSpec> columns, std::string_view header);

/// A part master read from CSV. `parts` holds the rows without problems, in file order; the import succeeded only
/// if `problems` is empty. Values are in the project's unit system.
struct PartsCsv {
  std::vector<Part> parts;
  std::vector<std::string> rejected_ids;  ///< ids of the rows left out because of their problems
  std::vector<Problem> problems;          ///< errors: the import must not be used
  std::vector<Problem> warnings;          ///< unknown columns skipped under `ignore_unknown_columns`
};

/// A slot list read from CSV; as `PartsCsv`.
struct SlotsCsv {
  std::vector<Slot> slots;
  /// Where each slot's part cell is (`line 5, column 2 (part)`), parallel to `slots`: for problems found later,
  /// such as a part the part master or the project lacks.
  std::vector<std::string> part_cell_paths;
  std::vector<Problem> problems;
  std::vector<Problem> warnings;
};

/// Both files of a store, checked against each other (every slot's part is in the part master).
struct CsvImport {
  std::vector<Part> parts;
  std::vector<Slot> slots;
  std::vector<Problem> problems;  ///< of both files, each naming its file; empty: the import may be used
  std::vector<Problem> warnings;

  bool ok() const { return problems.empty(); }
};

/// Reads a part master file; lengths and masses come back in `project_units`.
PartsCsv load_parts_csv(const std::string& file, UnitSystem project_units, const CsvOptions& options);
/// The same from text; `file_name` is what problems name.
PartsCsv load_parts_csv_text(std::string_view text, const std::string& file_name, UnitSystem project_units,
                             const CsvOptions& options);

/// Reads a slot list file; standing distances come back in `project_units`.
SlotsCsv load_slots_csv(const std::string& file, UnitSystem project_units, const CsvOptions& options);
SlotsCsv load_slots_csv_text(std::string_view text, const std::string& file_name, UnitSystem project_units,
                             const CsvOptions& options);

/// Reads both files and checks every slot's part against the part master (unknown_reference, on the slot list's
/// part cell; slots of a part whose row has problems of its own are not reported again). What `rackreach import`
/// calls.
CsvImport import_store_csv(const std::string& parts_file, const std::string& slots_file, UnitSystem project_units,
                           const CsvOptions& options);
/// The check import_store_csv() makes, on a part master and a slot list read separately (e.g. each with its own
/// column mapping): every slot's part must be in the part master. The files' names are what problems name.
CsvImport check_store_csv(PartsCsv parts, const std::string& parts_file, SlotsCsv slots, const std::string& slots_file);

/// The part master as CSV with canonical, unit-suffixed headers (`unit_weight_kg`, `box.width_cm`, ... for
/// metric; `_lb`, `_in` for us; `_deg` on angles); `units` is the unit system the parts are in. Numbers are written in
/// the shortest form that reads back to the same double; every text cell goes through `csv_cell()`. LF line ends, no
/// BOM.
std::string write_parts_csv(const std::vector<Part>& parts, UnitSystem units);
/// The slot list as CSV, as `write_parts_csv`.
std::string write_slots_csv(const std::vector<Slot>& slots, UnitSystem units);

}  // namespace rackreach
