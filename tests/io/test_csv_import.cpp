// SPDX-License-Identifier: MIT
// CSV import of a part master and a slot list: the good fixtures of the Marlow Valley Pumps kitting store load
// with every alias, unit and quoting case; every bad fixture (named after what is wrong) gives its code at its
// line and column; line numbers follow the physical lines of the file; export and import round trip.

#include <catch2/catch.hpp>
#include <cmath>
#include <string>
#include <vector>

#include "engine/io/csv_import.hpp"
#include "tests/shared_reference.hpp"

using namespace rackreach;

namespace {

std::string fixture(const std::string& name) {
  return shared_reference::repo_path("tests/data/csv/" + name);
}

std::string all_problems(const std::vector<Problem>& ps) {
  std::string s;
  for (const Problem& p : ps) s += format_problem(p) + "\n";
  return s;
}

bool has_problem(const std::vector<Problem>& ps, const std::string& code, const std::string& path) {
  for (const Problem& p : ps)
    if (p.code == code && p.path == path) return true;
  return false;
}

// Reference conversions: exact by definition (1959 agreement), as engine/quantities.hpp states them.
constexpr double kg_per_lb_ref = 0.45359237;
constexpr double cm_per_in_ref = 2.54;

enum class Kind { parts, slots, store };

struct BadFixture {
  const char* file;
  Kind kind;
  const char* code;
  const char* path;
};

// Every bad fixture, the problem it must give and where. Lines are physical lines of the file, the header is line 1.
const BadFixture bad_fixtures[] = {
    {"parts_missing_weight_column.csv", Kind::parts, "missing_column", "line 1"},
    {"parts_weight_decimal_comma.csv", Kind::parts, "wrong_type", "line 3, column 4 (weight_kg)"},
    {"parts_weight_zero.csv", Kind::parts, "out_of_range", "line 2, column 4 (weight_kg)"},
    {"parts_width_in_kg.csv", Kind::parts, "wrong_unit", "line 1, column 5 (width_kg)"},
    {"parts_weight_without_unit.csv", Kind::parts, "missing_unit", "line 1, column 4 (weight)"},
    {"parts_unterminated_quote.csv", Kind::parts, "parse_error", "line 3, column 3"},
    {"parts_duplicate_id.csv", Kind::parts, "duplicate_id", "line 4, column 1 (part_id)"},
    {"parts_unknown_column.csv", Kind::parts, "unknown_column", "line 1, column 6 (colour)"},
    {"parts_unknown_coupling.csv", Kind::parts, "invalid_value", "line 3, column 6 (coupling)"},
    {"parts_truck_only_not_boolean.csv", Kind::parts, "invalid_value", "line 2, column 6 (truck_only)"},
    {"parts_stray_quote.csv", Kind::parts, "parse_error", "line 2, column 3"},
    {"parts_too_many_cells.csv", Kind::parts, "parse_error", "line 3, column 8"},
    {"parts_too_few_cells.csv", Kind::parts, "parse_error", "line 2"},
    {"parts_bad_number_after_quoted_line_break.csv", Kind::parts, "wrong_type", "line 6, column 7 (height_cm)"},
    {"parts_weight_given_twice.csv", Kind::parts, "duplicate_column", "line 1, column 6 (weight_lb)"},
    {"parts_grip_above_box.csv", Kind::parts, "out_of_range", "line 2, column 6 (grip_height_cm)"},
    {"parts_latin1_description.csv", Kind::parts, "invalid_value", "line 2, column 3 (description)"},
    {"parts_empty_id.csv", Kind::parts, "empty", "line 3, column 1 (part_id)"},
    {"parts_weight_nan.csv", Kind::parts, "wrong_type", "line 2, column 4 (weight_kg)"},
    {"parts_optimal_without_handhold.csv", Kind::parts, "invalid_value", "line 2, column 6 (handhold_optimal)"},
    {"parts_header_only.csv", Kind::parts, "empty", "line 2"},
    {"parts_cr_line_ends_bad_height.csv", Kind::parts, "out_of_range", "line 4, column 7 (height_cm)"},
    {"parts_pieces_per_grasp_zero.csv", Kind::parts, "out_of_range", "line 2, column 6 (pieces_per_grasp)"},
    {"parts_coupling_and_handhold.csv", Kind::parts, "invalid_value", "line 2, column 7 (handhold)"},
    {"parts_box_width_above_500_cm.csv", Kind::parts, "out_of_range", "line 2, column 4 (width_in)"},
    {"parts_pack_pieces_not_whole.csv", Kind::parts, "wrong_type", "line 2, column 7 (pack_pieces)"},
    {"slots_bay_not_whole.csv", Kind::slots, "wrong_type", "line 3, column 5 (bay)"},
    {"slots_unknown_position.csv", Kind::slots, "invalid_value", "line 2, column 6 (position)"},
    {"slots_duplicate_id.csv", Kind::slots, "duplicate_id", "line 3, column 1 (slot_id)"},
    {"slots_origin_angle_above_180.csv", Kind::slots, "out_of_range", "line 2, column 5 (origin_angle_deg)"},
    {"slots_missing_level_column.csv", Kind::slots, "missing_column", "line 1"},
    {"slots_bay_zero.csv", Kind::slots, "out_of_range", "line 2, column 5 (bay)"},
    {"slots_standing_distance_in_lb.csv", Kind::slots, "wrong_unit", "line 1, column 5 (standing_distance_lb)"},
    {"slots_angle_with_length_unit.csv", Kind::slots, "wrong_unit", "line 1, column 5 (origin_angle_cm)"},
    {"slots_standing_distance_above_100_cm.csv", Kind::slots, "out_of_range",
     "line 2, column 5 (standing_distance_mm)"},
    {"slots_unknown_part.csv", Kind::store, "unknown_reference", "line 3, column 2 (part_id)"},
    // Numbers that are not finite, and plausibility limits (common practice, Rackreach's own; input_limits.hpp).
    {"parts_weight_infinite.csv", Kind::parts, "wrong_type", "line 2, column 4 (weight_kg)"},
    {"parts_weight_overflow.csv", Kind::parts, "wrong_type", "line 2, column 4 (weight_kg)"},
    {"parts_weight_5000_kg.csv", Kind::parts, "out_of_range", "line 2, column 4 (weight_kg)"},
    {"slots_standing_distance_40_m.csv", Kind::slots, "out_of_range", "line 2, column 5 (standing_distance_m)"},
    {"slots_bay_above_a_million.csv", Kind::slots, "out_of_range", "line 2, column 5 (bay)"},
    // Size limits: the file is refused as a whole.
    {"parts_description_too_long.csv", Kind::parts, "too_long", "line 2, column 3"},
    {"parts_too_many_columns.csv", Kind::parts, "too_many", "line 1, column 101"},
};

const Part* find_part(const std::vector<Part>& parts, const std::string& id) {
  for (const Part& p : parts)
    if (p.id == id) return &p;
  return nullptr;
}

void check_same_parts(const std::vector<Part>& a, const std::vector<Part>& b, double rel_tol) {
  REQUIRE(a.size() == b.size());
  for (std::size_t i = 0; i < a.size(); ++i) {
    INFO("part " << a[i].id);
    CHECK(a[i].id == b[i].id);
    CHECK(a[i].family == b[i].family);
    CHECK(a[i].description == b[i].description);
    CHECK(a[i].unit_weight == Approx(b[i].unit_weight).epsilon(rel_tol));
    CHECK(a[i].box.width == Approx(b[i].box.width).epsilon(rel_tol));
    CHECK(a[i].box.depth == Approx(b[i].box.depth).epsilon(rel_tol));
    CHECK(a[i].box.height == Approx(b[i].box.height).epsilon(rel_tol));
    CHECK(a[i].coupling == b[i].coupling);
    REQUIRE(a[i].handhold.has_value() == b[i].handhold.has_value());
    if (a[i].handhold) {
      CHECK(a[i].handhold->kind == b[i].handhold->kind);
      CHECK(a[i].handhold->optimal == b[i].handhold->optimal);
      CHECK(a[i].handhold->fingers_flex_90 == b[i].handhold->fingers_flex_90);
    }
    CHECK(a[i].pieces_per_kit == b[i].pieces_per_kit);
    CHECK(a[i].pieces_per_grasp == b[i].pieces_per_grasp);
    CHECK(a[i].pack_pieces == b[i].pack_pieces);
    CHECK(a[i].truck_only == b[i].truck_only);
    REQUIRE(a[i].grip_height.has_value() == b[i].grip_height.has_value());
    if (a[i].grip_height) CHECK(*a[i].grip_height == Approx(*b[i].grip_height).epsilon(rel_tol));
  }
}

void check_same_slots(const std::vector<Slot>& a, const std::vector<Slot>& b, double rel_tol) {
  REQUIRE(a.size() == b.size());
  for (std::size_t i = 0; i < a.size(); ++i) {
    INFO("slot " << a[i].id);
    CHECK(a[i].id == b[i].id);
    CHECK(a[i].part == b[i].part);
    CHECK(a[i].rack == b[i].rack);
    CHECK(a[i].level == b[i].level);
    CHECK(a[i].bay == b[i].bay);
    CHECK(a[i].position == b[i].position);
    CHECK(a[i].fixed == b[i].fixed);
    CHECK(a[i].origin_angle_deg == b[i].origin_angle_deg);
    REQUIRE(a[i].standing_distance.has_value() == b[i].standing_distance.has_value());
    if (a[i].standing_distance) CHECK(*a[i].standing_distance == Approx(*b[i].standing_distance).epsilon(rel_tol));
  }
}

const CsvOptions no_options{};

}  // namespace

TEST_CASE("The good part master loads: BOM, CRLF, aliases, lb and mm headers, quoted comma and line break",
          "[io][csv]") {
  const PartsCsv r = load_parts_csv(fixture("parts_marlow_valley.csv"), UnitSystem::metric, no_options);
  INFO(all_problems(r.problems));
  REQUIRE(r.problems.empty());
  CHECK(r.warnings.empty());
  REQUIRE(r.parts.size() == 4);  // the blank line and the row of empty cells are skipped

  const Part& gasket = r.parts[0];
  CHECK(gasket.id == "GK-2210");  // "Part No" is an alias of id, and the BOM is not part of the first header
  CHECK(gasket.family == "gaskets");
  CHECK(gasket.description == "Pump housing gasket, 4 in");
  CHECK(gasket.unit_weight == Approx(0.4 * kg_per_lb_ref).epsilon(1e-12));  // "Weight (lb)"
  CHECK(gasket.box.width == Approx(30.0).epsilon(1e-12));                   // 300 mm
  CHECK(gasket.box.depth == Approx(40.0).epsilon(1e-12));                   // "Length_mm" is the depth
  CHECK(gasket.box.height == Approx(6.0).epsilon(1e-12));
  CHECK(gasket.coupling == Coupling::good);
  CHECK_FALSE(gasket.handhold.has_value());
  CHECK(gasket.pieces_per_kit == 2.0);
  CHECK_FALSE(gasket.grip_height.has_value());

  const Part& bolts = r.parts[1];
  CHECK(bolts.description == "Bolt kit\r\nM10 x 40, zinc plated");  // the line break inside the quotes is kept
  CHECK_FALSE(bolts.coupling.has_value());
  CHECK(bolts.pack_pieces == 50);
  REQUIRE(bolts.handhold.has_value());
  CHECK(bolts.handhold->kind == HandholdKind::cutouts);
  CHECK_FALSE(bolts.handhold->optimal);
  REQUIRE(bolts.grip_height.has_value());
  CHECK(*bolts.grip_height == Approx(7.5).epsilon(1e-12));

  const Part& impeller = r.parts[2];
  CHECK(impeller.description == "Impeller \"22 kg\" cast iron");
  CHECK(impeller.unit_weight == Approx(48.5 * kg_per_lb_ref).epsilon(1e-12));
  CHECK_FALSE(impeller.coupling.has_value());
  REQUIRE(impeller.handhold.has_value());
  CHECK(impeller.handhold->kind == HandholdKind::handles);
  CHECK(impeller.handhold->optimal);

  const Part& mount = r.parts[3];
  CHECK(mount.id == "MM-5010");
  CHECK(mount.coupling == Coupling::poor);
  CHECK_FALSE(mount.handhold.has_value());
  CHECK(mount.pack_pieces == 1);
  CHECK(mount.truck_only);
  CHECK(mount.pieces_per_kit == 0.5);
  CHECK(mount.pieces_per_grasp == 1.0);
}

TEST_CASE("The good part master in US units: lb as given, mm to in by 25.4", "[io][csv]") {
  const PartsCsv r = load_parts_csv(fixture("parts_marlow_valley.csv"), UnitSystem::us, no_options);
  INFO(all_problems(r.problems));
  REQUIRE(r.problems.empty());
  REQUIRE(r.parts.size() == 4);
  CHECK(r.parts[0].unit_weight == Approx(0.4).epsilon(1e-12));
  CHECK(r.parts[0].box.width == Approx(300.0 / 10.0 / cm_per_in_ref).epsilon(1e-12));
  CHECK(r.parts[2].box.height == Approx(320.0 / 25.4).epsilon(1e-12));
}

TEST_CASE("The good slot list loads: aliases, letter case, inches, defaults", "[io][csv]") {
  const SlotsCsv r = load_slots_csv(fixture("slots_marlow_valley.csv"), UnitSystem::metric, no_options);
  INFO(all_problems(r.problems));
  REQUIRE(r.problems.empty());
  REQUIRE(r.slots.size() == 4);
  CHECK(r.slots[0].id == "HR1-L1-B1-F");
  CHECK(r.slots[0].part == "GK-2210");
  CHECK(r.slots[0].rack == "HR1");
  CHECK(r.slots[0].level == "L1");
  CHECK(r.slots[0].position == SlotPosition::front);
  CHECK_FALSE(r.slots[0].origin_angle_deg.has_value());
  CHECK_FALSE(r.slots[0].standing_distance.has_value());
  CHECK(r.slots[1].position == SlotPosition::back);  // "Back"
  CHECK(r.slots[1].fixed);
  CHECK(r.slots[1].origin_angle_deg == 15.0);
  REQUIRE(r.slots[1].standing_distance.has_value());
  CHECK(*r.slots[1].standing_distance == Approx(12.0 * cm_per_in_ref).epsilon(1e-12));
  CHECK(r.slots[2].bay == 2);
  CHECK_FALSE(r.slots[2].fixed);
  CHECK(r.slots[3].position == SlotPosition::front);  // empty cell: the default
  CHECK(r.slots[3].bay == 1);
  REQUIRE(r.part_cell_paths.size() == 4);
  CHECK(r.part_cell_paths[3] == "line 5, column 2 (Item)");
}

TEST_CASE("import_store_csv reads both files and checks the slots' parts", "[io][csv]") {
  const CsvImport ok = import_store_csv(fixture("parts_marlow_valley.csv"), fixture("slots_marlow_valley.csv"),
                                        UnitSystem::metric, no_options);
  INFO(all_problems(ok.problems));
  CHECK(ok.ok());
  CHECK(ok.parts.size() == 4);
  CHECK(ok.slots.size() == 4);

  const CsvImport missing =
      import_store_csv(fixture("no_such_parts.csv"), fixture("slots_marlow_valley.csv"), UnitSystem::metric, {});
  CHECK_FALSE(missing.ok());
  REQUIRE(missing.problems.size() == 1);  // the slots are not all reported against a part master never read
  CHECK(missing.problems[0].code == "file_error");
  CHECK(missing.problems[0].file == fixture("no_such_parts.csv"));
}

TEST_CASE("Every bad fixture gives its code at its line and column", "[io][csv][invalid]") {
  for (const BadFixture& e : bad_fixtures) {
    INFO(e.file);
    std::vector<Problem> problems;
    std::string file = fixture(e.file);
    switch (e.kind) {
      case Kind::parts: {
        const PartsCsv r = load_parts_csv(file, UnitSystem::metric, no_options);
        problems = r.problems;
        break;
      }
      case Kind::slots: {
        const SlotsCsv r = load_slots_csv(file, UnitSystem::metric, no_options);
        problems = r.problems;
        break;
      }
      case Kind::store: {
        const CsvImport r = import_store_csv(fixture("parts_marlow_valley.csv"), file, UnitSystem::metric, no_options);
        problems = r.problems;
        break;
      }
    }
    INFO("problems:\n" << all_problems(problems));
    CHECK(has_problem(problems, e.code, e.path));
    for (const Problem& p : problems) {
      CHECK(p.file == file);  // every problem names its file
      CHECK_FALSE(p.rule.empty());
    }
  }
}

TEST_CASE("A problem reads as file, line, column, rule, value and code", "[io][csv][invalid]") {
  const std::string text =
      "part,family,description,weight_kg,width_cm,depth_cm,height_cm\n"
      "GK-2210,gaskets,Gasket,0.2,30,40,6\n"
      "IM-3300,impellers,Impeller,\"12,5\",45,45,32\n";
  const PartsCsv r = load_parts_csv_text(text, "parts.csv", UnitSystem::metric, no_options);
  REQUIRE(r.problems.size() == 1);
  CHECK(format_problem(r.problems[0]) ==
        "parts.csv: line 3, column 4 (weight_kg): must be a number greater than 0 and at most 2000 kg; it is \"12,5\" [wrong_type]");
  CHECK(r.parts.size() == 1);  // the good row is kept, the bad one is not
}

TEST_CASE("Every problem of a file comes at once", "[io][csv][invalid]") {
  const std::string text =
      "part,weight_kg,width_cm,depth_cm,height_cm,colour,family\n"
      "GK-2210,0,30,40,6,black,gaskets\n"
      "GK-2210,0.2,thirty,40,6,black,gaskets\n";
  const PartsCsv r = load_parts_csv_text(text, "parts.csv", UnitSystem::metric, no_options);
  INFO(all_problems(r.problems));
  CHECK(has_problem(r.problems, "unknown_column", "line 1, column 6 (colour)"));
  CHECK(has_problem(r.problems, "out_of_range", "line 2, column 2 (weight_kg)"));
  CHECK(has_problem(r.problems, "wrong_type", "line 3, column 3 (width_cm)"));
  CHECK(has_problem(r.problems, "duplicate_id", "line 3, column 1 (part)"));
  CHECK(r.problems.size() == 4);
}

TEST_CASE("Unknown columns are errors unless the caller ignores them; then they are warnings", "[io][csv]") {
  const std::string file = fixture("parts_unknown_column.csv");
  const PartsCsv strict = load_parts_csv(file, UnitSystem::metric, no_options);
  CHECK(has_problem(strict.problems, "unknown_column", "line 1, column 6 (colour)"));
  CHECK(strict.warnings.empty());

  CsvOptions lenient;
  lenient.ignore_unknown_columns = true;
  const PartsCsv r = load_parts_csv(file, UnitSystem::metric, lenient);
  INFO(all_problems(r.problems));
  CHECK(r.problems.empty());
  REQUIRE(r.warnings.size() == 1);
  CHECK(r.warnings[0].code == "unknown_column");
  CHECK(r.warnings[0].path == "line 1, column 6 (colour)");
  REQUIRE(r.parts.size() == 1);
  CHECK(r.parts[0].box.depth == 40.0);  // the columns after the ignored one are still found by name
}

TEST_CASE("A typo of a column name is suggested", "[io][csv][invalid]") {
  const PartsCsv r =
      load_parts_csv_text("part,wieght_kg,width_cm,depth_cm,height_cm,family\nGK-2210,0.2,30,40,6,gaskets\n", "p.csv",
                          UnitSystem::metric, no_options);
  REQUIRE(has_problem(r.problems, "unknown_column", "line 1, column 2 (wieght_kg)"));
  CHECK(r.problems[0].rule.find("did you mean unit_weight?") != std::string::npos);
  CHECK(has_problem(r.problems, "missing_column", "line 1"));
}

TEST_CASE("Headers without a unit take the units chosen on import, and only then", "[io][csv]") {
  const std::string text = "item,weight,width,depth,height,family\nIM-3300,48.5,17.7,17.7,12.6,impellers\n";
  const PartsCsv none = load_parts_csv_text(text, "p.csv", UnitSystem::metric, no_options);
  CHECK(has_problem(none.problems, "missing_unit", "line 1, column 2 (weight)"));
  CHECK(has_problem(none.problems, "missing_unit", "line 1, column 5 (height)"));
  CHECK_FALSE(has_problem(none.problems, "missing_column", "line 1"));  // the column is there, its unit is not

  CsvOptions us;
  us.units = UnitSystem::us;
  const PartsCsv r = load_parts_csv_text(text, "p.csv", UnitSystem::metric, us);
  INFO(all_problems(r.problems));
  REQUIRE(r.parts.size() == 1);
  CHECK(r.parts[0].unit_weight == Approx(48.5 * kg_per_lb_ref).epsilon(1e-12));
  CHECK(r.parts[0].box.width == Approx(17.7 * cm_per_in_ref).epsilon(1e-12));
}

TEST_CASE("Header names: letter case, spaces, brackets, metres", "[io][csv]") {
  const std::string text =
      "SKU,Unit Weight (kg),Box Width [m],Box-Depth_MM,HEIGHT_IN,Part Family\nGK-2210,0.25,0.3,400,2.5,gaskets\n";
  const PartsCsv r = load_parts_csv_text(text, "p.csv", UnitSystem::metric, no_options);
  INFO(all_problems(r.problems));
  REQUIRE(r.parts.size() == 1);
  CHECK(r.parts[0].unit_weight == 0.25);
  CHECK(r.parts[0].box.width == Approx(30.0).epsilon(1e-12));
  CHECK(r.parts[0].box.depth == Approx(40.0).epsilon(1e-12));
  CHECK(r.parts[0].box.height == Approx(2.5 * cm_per_in_ref).epsilon(1e-12));
}

TEST_CASE("Line numbers follow the physical lines through quoted line breaks, blank lines and every line end",
          "[io][csv][lines]") {
  // Each row's description holds k line breaks; the weight of row `bad` is wrong. The expected line is counted
  // here from the text itself, independently of the reader.
  for (const std::string eol : {"\n", "\r\n", "\r"}) {
    for (const std::string inner : {"\n", "\r\n"}) {
      for (int bad = 0; bad < 6; ++bad) {
        std::string text = "\xEF\xBB\xBFpart,description,weight_kg,width_cm,depth_cm,height_cm,family" + eol;
        std::size_t expected_line = 0;
        for (int row = 0; row < 6; ++row) {
          std::string description = "\"Gasket";
          for (int k = 0; k < row % 3; ++k) description += inner + "line " + std::to_string(k);
          description += "\"";
          const std::string before = "P" + std::to_string(row) + "," + description + ",";
          if (row == bad) {
            std::size_t line = 1;
            const std::string upto = text + before;
            for (std::size_t i = 0; i < upto.size(); ++i)
              if (upto[i] == '\n' || (upto[i] == '\r' && (i + 1 == upto.size() || upto[i + 1] != '\n'))) ++line;
            expected_line = line;
          }
          text += before + (row == bad ? "heavy" : "1.5") + ",10,20,5,gaskets" + eol;
          if (row == 2) text += eol + "  " + eol;  // a blank line and a line of spaces
        }
        const PartsCsv r = load_parts_csv_text(text, "p.csv", UnitSystem::metric, no_options);
        INFO("eol " << (eol == "\n" ? "LF" : eol == "\r" ? "CR" : "CRLF") << ", bad row " << bad);
        INFO(all_problems(r.problems));
        REQUIRE(r.problems.size() == 1);
        CHECK(r.problems[0].path == "line " + std::to_string(expected_line) + ", column 3 (weight_kg)");
        CHECK(r.parts.size() == 5);
      }
    }
  }
}

TEST_CASE("A cell that spans lines is reported on the line where it starts", "[io][csv][lines]") {
  const std::string text =
      "part,coupling,weight_kg,width_cm,depth_cm,height_cm,family\r\n"
      "GK-2210,good,0.2,30,40,6,gaskets\r\n"
      "FS-0410,\"very\r\ngood\",1.5,25,35,15,fasteners\r\n"
      "IM-3300,\"fair\",22,45,45,\"3\n2\",impellers\r\n"
      "\"MM-\n5010\",poor,30,60,50,25,motor mounts,extra\r\n";
  const PartsCsv r = load_parts_csv_text(text, "p.csv", UnitSystem::metric, no_options);
  INFO(all_problems(r.problems));
  CHECK(has_problem(r.problems, "invalid_value", "line 3, column 2 (coupling)"));
  CHECK(has_problem(r.problems, "wrong_type", "line 5, column 6 (height_cm)"));
  CHECK(has_problem(r.problems, "parse_error", "line 8, column 8"));
  CHECK(r.problems.size() == 3);
}

TEST_CASE("The last row needs no line end, and a quote left open at the end is reported where it opened",
          "[io][csv][lines]") {
  const PartsCsv ok =
      load_parts_csv_text("part,weight_kg,width_cm,depth_cm,height_cm,family\r\nGK-2210,0.2,30,40,6,gaskets", "p.csv",
                          UnitSystem::metric, no_options);
  INFO(all_problems(ok.problems));
  CHECK(ok.parts.size() == 1);

  const PartsCsv open = load_parts_csv_text(
      "part,description,weight_kg,width_cm,depth_cm,height_cm,family\nGK-2210,ok,0.2,30,40,6,gaskets\n"
      "FS-0410,\"Bolts\nM10,1,2,3,4,fasteners\n",
      "p.csv", UnitSystem::metric, no_options);
  REQUIRE(open.problems.size() == 1);
  CHECK(open.problems[0].code == "parse_error");
  CHECK(open.problems[0].path == "line 3, column 2");
  CHECK(open.parts.size() == 1);  // the rows before the broken one are read
}

TEST_CASE("Export then import gives the same parts and slots", "[io][csv][roundtrip]") {
  const PartsCsv parts = load_parts_csv(fixture("parts_marlow_valley.csv"), UnitSystem::metric, no_options);
  const SlotsCsv slots = load_slots_csv(fixture("slots_marlow_valley.csv"), UnitSystem::metric, no_options);
  REQUIRE(parts.problems.empty());
  REQUIRE(slots.problems.empty());

  SECTION("in the same units: exact (numbers are written in their shortest exact form)") {
    const std::string pcsv = write_parts_csv(parts.parts, UnitSystem::metric);
    const std::string scsv = write_slots_csv(slots.slots, UnitSystem::metric);
    CHECK(pcsv.rfind("id,family,description,unit_weight_kg,box.width_cm,box.depth_cm,box.height_cm,coupling,", 0) == 0);
    CHECK(scsv.rfind("id,part,rack,level,bay,position,fixed,origin_angle_deg,standing_distance_cm\n", 0) == 0);
    const PartsCsv p2 = load_parts_csv_text(pcsv, "export.csv", UnitSystem::metric, no_options);
    const SlotsCsv s2 = load_slots_csv_text(scsv, "export.csv", UnitSystem::metric, no_options);
    INFO(all_problems(p2.problems) << all_problems(s2.problems));
    REQUIRE(p2.problems.empty());
    REQUIRE(s2.problems.empty());
    check_same_parts(p2.parts, parts.parts, 0.0);
    check_same_slots(s2.slots, slots.slots, 0.0);
    for (std::size_t i = 0; i < parts.parts.size(); ++i) CHECK(p2.parts[i].unit_weight == parts.parts[i].unit_weight);
  }
  SECTION("written in US units and read into metric: within 1e-12 relative (two conversions)") {
    // Convert to US units as a US project would hold them, export, import into metric.
    std::vector<Part> us_parts = parts.parts;
    for (Part& p : us_parts) {
      p.unit_weight = Mass{p.unit_weight, UnitSystem::metric}.in_units(UnitSystem::us);
      for (double* x : {&p.box.width, &p.box.depth, &p.box.height})
        *x = Length{*x, UnitSystem::metric}.in_units(UnitSystem::us);
      if (p.grip_height) p.grip_height = Length{*p.grip_height, UnitSystem::metric}.in_units(UnitSystem::us);
    }
    std::vector<Slot> us_slots = slots.slots;
    for (Slot& s : us_slots)
      if (s.standing_distance)
        s.standing_distance = Length{*s.standing_distance, UnitSystem::metric}.in_units(UnitSystem::us);
    const std::string pcsv = write_parts_csv(us_parts, UnitSystem::us);
    CHECK(pcsv.find("unit_weight_lb,box.width_in") != std::string::npos);
    const PartsCsv p2 = load_parts_csv_text(pcsv, "export.csv", UnitSystem::metric, no_options);
    const SlotsCsv s2 =
        load_slots_csv_text(write_slots_csv(us_slots, UnitSystem::us), "export.csv", UnitSystem::metric, no_options);
    INFO(all_problems(p2.problems) << all_problems(s2.problems));
    REQUIRE(p2.problems.empty());
    REQUIRE(s2.problems.empty());
    check_same_parts(p2.parts, parts.parts, 1e-12);
    check_same_slots(s2.slots, slots.slots, 1e-12);
    CHECK(p2.parts[0].unit_weight != parts.parts[0].unit_weight * 2);  // the conversion really happened...
    CHECK(us_parts[0].unit_weight == Approx(0.4).epsilon(1e-12));      // ...through lb
  }
}

TEST_CASE("Export neutralises formula-like cells, and import reads them back as they were", "[io][csv][roundtrip]") {
  Part p;
  p.id = "=HYPERLINK(\"http://x\",\"GK\")";
  p.family = "+gaskets";
  p.description = "@SUM(A1:A9), -20 C rated";
  p.unit_weight = 0.2;
  p.box = {30.0, 40.0, 6.0};
  Part q;
  q.id = "-5";  // a plain number is not a formula: left as it is
  q.family = "-fasteners";
  q.description = "Washer";
  q.unit_weight = 0.01;
  q.box = {5.0, 5.0, 1.0};
  Slot s;
  s.id = "=1+2";
  s.part = p.id;
  s.rack = "HR1";
  s.level = "L1";

  const std::string pcsv = write_parts_csv({p, q}, UnitSystem::metric);
  CHECK(pcsv.find("\"'=HYPERLINK(\"\"http://x\"\",\"\"GK\"\")\",'+gaskets,\"'@SUM(A1:A9), -20 C rated\"") !=
        std::string::npos);
  CHECK(pcsv.find("\n-5,'-fasteners,Washer,") != std::string::npos);
  const std::string scsv = write_slots_csv({s}, UnitSystem::metric);
  CHECK(scsv.find("\n'=1+2,") != std::string::npos);
  // No exported cell starts with a character a spreadsheet would run, except plain numbers.
  for (const std::string& csv : {pcsv, scsv}) {
    std::size_t start = 0;
    bool in_quotes = false;
    for (std::size_t i = 0; i <= csv.size(); ++i) {
      if (i < csv.size() && csv[i] == '"') in_quotes = !in_quotes;
      if (i == csv.size() || (!in_quotes && (csv[i] == ',' || csv[i] == '\n'))) {
        std::string cell = csv.substr(start, i - start);
        if (!cell.empty() && cell[0] == '"') cell = cell.substr(1);
        INFO(cell);
        if (!cell.empty() && std::string("=+@").find(cell[0]) != std::string::npos) FAIL("formula-like cell");
        if (!cell.empty() && cell[0] == '-') CHECK(cell == "-5");
        start = i + 1;
      }
    }
  }

  const PartsCsv back = load_parts_csv_text(pcsv, "export.csv", UnitSystem::metric, no_options);
  INFO(all_problems(back.problems));
  REQUIRE(back.parts.size() == 2);
  CHECK(back.parts[0].id == p.id);
  CHECK(back.parts[0].family == p.family);
  CHECK(back.parts[0].description == p.description);
  CHECK(back.parts[1].id == "-5");
  CHECK(back.parts[1].family == "-fasteners");
  const SlotsCsv sback = load_slots_csv_text(scsv, "export.csv", UnitSystem::metric, no_options);
  REQUIRE(sback.slots.size() == 1);
  CHECK(sback.slots[0].id == "=1+2");
}

TEST_CASE("A part found in the part master is found by the slots of the same store", "[io][csv]") {
  const CsvImport r = import_store_csv(fixture("parts_marlow_valley.csv"), fixture("slots_unknown_part.csv"),
                                       UnitSystem::metric, no_options);
  REQUIRE(r.problems.size() == 1);
  CHECK(r.problems[0].value == "\"VH-7700\"");
  CHECK(r.problems[0].file == fixture("slots_unknown_part.csv"));
  CHECK(find_part(r.parts, "GK-2210") != nullptr);
}
