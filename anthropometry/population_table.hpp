// SPDX-License-Identifier: MIT
#pragma once
// A population table: for each body dimension and each sex, the quantile function tabulated at a list of
// percentiles, with mean, SD and the number of subjects, plus the table's citation and provenance.
//
// The quantile function between two listed percentiles is the straight line between them; outside the first and
// last listed percentile it is unknown (never extrapolated). Values are kept in the unit the table declares and
// returned in cm (lengths) or kg (masses). The file format is described in docs/anthropometry.md.

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace rackreach {

enum class Sex { female, male };
constexpr std::string_view sex_name(Sex s) {
  return s == Sex::female ? "female" : "male";
}

/// The unit a table declares for one dimension.
enum class TableUnit { mm, cm, in, kg, lb };
std::string_view table_unit_name(TableUnit u);
std::optional<TableUnit> find_table_unit(std::string_view name);
constexpr bool is_mass_unit(TableUnit u) {
  return u == TableUnit::kg || u == TableUnit::lb;
}
/// Factor from the declared unit to cm (lengths) or kg (masses); exact (1 in = 2.54 cm, 1 lb = 0.45359237 kg).
double factor_to_cm_or_kg(TableUnit u);
/// "cm" or "kg": the unit the library returns values of this dimension in.
constexpr std::string_view canonical_unit_name(TableUnit u) {
  return is_mass_unit(u) ? "kg" : "cm";
}

/// Measured in the survey, or formed per subject from measured columns before summarising.
enum class DimensionKind { measured, derived };

/// One sex's distribution of one dimension, in the dimension's declared unit.
struct SexDistribution {
  int n = 0;  ///< subjects, > 0
  double mean = 0.0;
  double sd = 0.0;                ///< sample SD (divisor n - 1), >= 0
  std::vector<double> quantiles;  ///< value at each of the table's percentiles; non-decreasing
};

struct Dimension {
  std::string key;    ///< e.g. "acromial_height"
  std::string label;  ///< e.g. "Shoulder (acromial) height"
  TableUnit unit = TableUnit::mm;
  DimensionKind kind = DimensionKind::measured;
  std::string definition;                   ///< what is measured, landmark to landmark, posture
  std::vector<std::string> source_columns;  ///< survey columns it is computed from
  std::string derivation;                   ///< the per-subject formula (derived dimensions)
  std::string note;                         ///< caveats, comparison with other routes
  std::optional<SexDistribution> female;
  std::optional<SexDistribution> male;

  const std::optional<SexDistribution>& of(Sex s) const { return s == Sex::female ? female : male; }
};

/// One raw file a table was generated from.
struct SourceFile {
  std::string name;
  std::string sex;  ///< "female" or "male"
  long long bytes = 0;
  std::string sha256;  ///< lowercase hex
};

struct PopulationTable {
  int format_version = 1;
  std::string name;  ///< short name used on the command line, e.g. "ansur2"
  std::string title;
  std::string citation;  ///< author, year, title, report number
  std::string survey;    ///< who was measured, where, when
  std::optional<int> subjects_female;
  std::optional<int> subjects_male;
  std::vector<SourceFile> source_files;
  std::string generated_by;         ///< the command that wrote the file, if generated
  std::vector<std::string> method;  ///< how the percentiles and derived dimensions were computed
  std::vector<std::string> caveats;
  std::vector<double> percentiles;    ///< 0..100, strictly increasing, shared by every dimension and sex
  std::vector<Dimension> dimensions;  ///< in the table's order

  const Dimension* find_dimension(std::string_view key) const;
  bool has_sex(Sex s) const { return (s == Sex::female ? subjects_female : subjects_male).has_value(); }
};

/// The value of one sex's quantile function at `percentile` (0..100), in cm or kg: linear between the listed
/// percentiles; empty outside the first and last of them.
std::optional<double> calc_sex_percentile(const PopulationTable& table, const Dimension& dim,
                                          const SexDistribution& dist, double percentile);

}  // namespace rackreach
