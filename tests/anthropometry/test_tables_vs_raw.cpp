// SPDX-License-Identifier: MIT
// The shipped tables against the raw survey files they were generated from (read here with the tests' own
// reader) and against each survey's own percentiles.csv (computed by its python script). Needs ../shared; where it
// is absent each test says so and stops without passing anything.

#include <catch2/catch.hpp>
#include <filesystem>

#include "raw_survey_reader.hpp"
#include "shipped_tables.hpp"

namespace {

using raw_check::per_subject;
using raw_check::type7;

struct RawDimension {
  std::string key;                   // our dimension
  std::vector<std::string> columns;  // raw columns, lower case
  std::function<double(const std::vector<double>&)> f;
  double to_table_unit;  // raw file unit -> cm (or kg)
};

double one(const std::vector<double>& v) {
  return v[0];
}

// The formulas as the survey READMEs state them.
const std::vector<RawDimension> ansur2_dims = {
    {"stature", {"stature"}, one, 0.1},
    {"acromial_height", {"acromialheight"}, one, 0.1},
    {"hand_breadth", {"handbreadth"}, one, 0.1},
    {"thumb_tip_reach", {"thumbtipreach"}, one, 0.1},
    {"body_mass", {"weightkg"}, one, 0.1},  // file unit 0.1 kg
    {"grip_centre_height",
     {"wristheight", "handlength", "forearmhandlength", "forearmcenterofgriplength"},
     [](const std::vector<double>& v) { return v[0] - (v[1] - (v[2] - v[3])); },
     0.1},
    {"overhead_grip_reach",
     {"stature", "overheadfingertipreachsitting", "sittingheight", "forearmhandlength", "forearmcenterofgriplength"},
     [](const std::vector<double>& v) { return v[0] + v[1] - v[2] - (v[3] - v[4]); },
     0.1},
};

const std::vector<RawDimension> ansur1988_dims = {
    {"stature", {"stature"}, one, 0.1},
    {"acromial_height", {"acromion_ht"}, one, 0.1},
    {"overhead_grip_reach",
     {"ovrhd_reach", "hand_lnth", "wrist_to_center_of_grip_lnth"},
     [](const std::vector<double>& v) { return v[0] - (v[1] - v[2]); },
     0.1},
    {"shoulder_grip_length",
     {"acr-radl_lnth", "radiale-stylion_lnth", "wrist_to_center_of_grip_lnth"},
     [](const std::vector<double>& v) { return v[0] + v[1] + v[2]; },
     0.1},
    {"elbow_height",
     {"acromion_ht", "shoulder_elbow_lnth"},
     [](const std::vector<double>& v) { return v[0] - v[1]; },
     0.1},
};

void check_against_raw(const std::string& table_name, const std::string& female_file, const std::string& male_file,
                       char delimiter, const std::vector<RawDimension>& dims) {
  if (!raw_check::shared_present()) {
    WARN("../shared is not present: the shipped " + table_name + " table is NOT checked against the raw data");
    return;
  }
  const auto table = shipped::load(table_name);
  const std::string dir = raw_check::shared_dir() + "/anthropometry/" + table_name + "/";
  for (const auto& [sex, file, women] : {std::tuple{"female", female_file, 1.0}, std::tuple{"male", male_file, 0.0}}) {
    const auto rows = raw_check::read_rows(dir + file, delimiter);
    const rackreach::Workforce wf{table, rackreach::SexMix{women}, {}};
    for (const RawDimension& d : dims) {
      const std::vector<double> x = per_subject(rows, d.columns, d.f);
      // Tabulated percentiles: only the file's 0.01 mm rounding separates them from the raw type-7 value.
      for (double p : {1.0, 2.5, 5.0, 10.0, 25.0, 50.0, 75.0, 95.0, 99.0}) {
        INFO(table_name << " " << sex << " " << d.key << " P" << p);
        // Source: raw survey file, type-7 percentile (survey README); within 0.5 mm (0.05 kg for mass).
        CHECK(shipped::percentile(wf, d.key, p) == Approx(type7(x, p / 100.0) * d.to_table_unit).margin(0.05));
      }
      // Between tabulated percentiles the table is linear; the generator measured at most 0.3 cm off the exact
      // value from the 1st to the 99th percentile (docs/anthropometry.md). Checked here every 0.37 percentile.
      for (double p = 1.0; p <= 99.0; p += 0.37) {
        INFO(table_name << " " << sex << " " << d.key << " P" << p);
        CHECK(shipped::percentile(wf, d.key, p) == Approx(type7(x, p / 100.0) * d.to_table_unit).margin(0.3));
      }
      const auto* dim = table->find_dimension(d.key);
      REQUIRE(dim);
      CHECK(dim->of(women > 0 ? rackreach::Sex::female : rackreach::Sex::male)->n == static_cast<int>(x.size()));
    }
  }
}

}  // namespace

TEST_CASE("ansur2 table reproduces the raw ANSUR II files (type-7 percentiles)", "[anthropometry][raw]") {
  check_against_raw("ansur2", "ANSUR_II_FEMALE_Public.csv", "ANSUR_II_MALE_Public.csv", ',', ansur2_dims);
}

TEST_CASE("ansur1988 table reproduces the raw ANSUR 1988 files (type-7 percentiles)", "[anthropometry][raw]") {
  check_against_raw("ansur1988", "ansur_women.txt", "ansur_men.txt", '\t', ansur1988_dims);
}

TEST_CASE("shipped tables name the raw files by the sha256 and size their READMEs give", "[anthropometry][raw]") {
  if (!raw_check::shared_present()) {
    WARN("../shared is not present: source file checksums are NOT checked");
    return;
  }
  for (const std::string name : {"ansur2", "ansur1988"}) {
    const auto table = shipped::load(name);
    const std::string dir = raw_check::shared_dir() + "/anthropometry/" + name + "/";
    std::ifstream readme(dir + "README.md");
    std::stringstream text;
    text << readme.rdbuf();
    REQUIRE(table->source_files.size() == 2);
    for (const auto& f : table->source_files) {
      INFO(name << " " << f.name);
      // Source: the survey README's file table (sha256 column) and the file on disk.
      CHECK(text.str().find(f.sha256) != std::string::npos);
      CHECK(static_cast<long long>(std::filesystem::file_size(dir + f.name)) == f.bytes);
    }
  }
}

TEST_CASE("shipped tables agree with each survey's own percentiles.csv", "[anthropometry][raw]") {
  if (!raw_check::shared_present()) {
    WARN("../shared is not present: percentiles.csv is NOT compared");
    return;
  }
  // our dimension -> the python script's dimension name, per survey
  const std::vector<std::tuple<std::string, std::string, std::string>> pairs = {
      {"ansur2", "wrist_height", "wristheight"},
      {"ansur2", "elbow_height", "derived_elbowheight_flexed"},
      {"ansur2", "chest_depth", "chestdepth"},
      {"ansur2", "hand_length", "handlength"},
      {"ansur2", "body_mass", "weight_kg"},
      {"ansur1988", "wrist_height", "WRIST_HT"},
      {"ansur1988", "grip_centre_height", "derived_gripcenterheight"},
      {"ansur1988", "overhead_fingertip_reach", "OVRHD_REACH"},
      {"ansur1988", "forward_grip_reach_from_wall", "derived_forwardgripreach"},
      {"ansur1988", "body_mass", "weight_kg"}};
  for (const auto& [table_name, ours, theirs] : pairs) {
    const auto csv =
        raw_check::read_percentiles_csv(raw_check::shared_dir() + "/anthropometry/" + table_name + "/percentiles.csv");
    const auto table = shipped::load(table_name);
    const double unit = ours == "body_mass" ? 1.0 : 0.1;  // csv: mm, or kg for weight_kg
    for (const auto& [sex, women] : {std::pair{"female", 1.0}, std::pair{"male", 0.0}}) {
      const rackreach::Workforce wf{table, rackreach::SexMix{women}, {}};
      for (const auto& [stat, p] : {std::pair{"p01", 1.0}, std::pair{"p05", 5.0}, std::pair{"p50", 50.0},
                                    std::pair{"p95", 95.0}, std::pair{"p99", 99.0}}) {
        INFO(table_name << " " << ours << " " << sex << " " << stat);
        // Source: ../shared/anthropometry/<survey>/percentiles.csv; within 0.5 mm (0.05 kg).
        CHECK(shipped::percentile(wf, ours, p) == Approx(csv.at({theirs, sex, stat}) * unit).margin(0.05));
      }
      const auto* dim = table->find_dimension(ours);
      const auto& dist = *dim->of(women > 0 ? rackreach::Sex::female : rackreach::Sex::male);
      const double factor = rackreach::factor_to_cm_or_kg(dim->unit);
      CHECK(dist.mean * factor == Approx(csv.at({theirs, sex, "mean"}) * unit).margin(0.005));
      CHECK(dist.sd * factor == Approx(csv.at({theirs, sex, "sd"}) * unit).margin(0.005));
    }
  }
}
