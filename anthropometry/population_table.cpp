// SPDX-License-Identifier: MIT
#include "anthropometry/population_table.hpp"

#include <algorithm>

#include "engine/quantities.hpp"

namespace rackreach {

std::string_view table_unit_name(TableUnit u) {
  switch (u) {
    case TableUnit::mm:
      return "mm";
    case TableUnit::cm:
      return "cm";
    case TableUnit::in:
      return "in";
    case TableUnit::kg:
      return "kg";
    case TableUnit::lb:
      return "lb";
  }
  return "";
}

std::optional<TableUnit> find_table_unit(std::string_view name) {
  for (TableUnit u : {TableUnit::mm, TableUnit::cm, TableUnit::in, TableUnit::kg, TableUnit::lb}) {
    if (table_unit_name(u) == name) return u;
  }
  return std::nullopt;
}

double factor_to_cm_or_kg(TableUnit u) {
  switch (u) {
    case TableUnit::mm:
      return 0.1;
    case TableUnit::cm:
      return 1.0;
    case TableUnit::in:
      return cm_per_in;
    case TableUnit::kg:
      return 1.0;
    case TableUnit::lb:
      return kg_per_lb;
  }
  return 1.0;
}

const Dimension* PopulationTable::find_dimension(std::string_view key) const {
  auto it = std::find_if(dimensions.begin(), dimensions.end(), [&](const Dimension& d) { return d.key == key; });
  return it == dimensions.end() ? nullptr : &*it;
}

std::optional<double> calc_sex_percentile(const PopulationTable& table, const Dimension& dim,
                                          const SexDistribution& dist, double percentile) {
  const std::vector<double>& p = table.percentiles;
  const std::vector<double>& q = dist.quantiles;
  if (p.size() < 2 || q.size() != p.size() || percentile < p.front() || percentile > p.back()) return std::nullopt;
  // k: the last listed percentile <= the one asked for, kept below the last so that k + 1 exists.
  auto k = static_cast<std::size_t>(std::upper_bound(p.begin(), p.end(), percentile) - p.begin()) - 1;
  k = std::min(k, p.size() - 2);
  const double value = q[k] + (percentile - p[k]) / (p[k + 1] - p[k]) * (q[k + 1] - q[k]);
  return value * factor_to_cm_or_kg(dim.unit);
}

}  // namespace rackreach
