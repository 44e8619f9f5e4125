// SPDX-License-Identifier: MIT
// Percentiles of a mixed workforce: the mixed-CDF rule of the survey READMEs, against their percentiles.csv.

#include <catch2/catch.hpp>

#include "anthropometry/mixture.hpp"
#include "raw_survey_reader.hpp"
#include "shipped_tables.hpp"

namespace {

// min{x : M(x) >= p} by bisection on the mixed CDF, the check the survey READMEs name for the exact rule.
double bisect_mixture(const std::vector<rackreach::WeightedCurve>& parts, double p) {
  auto cdf = [](const rackreach::QuantileCurve& c, double x) {
    if (x < c.values.front()) return 0.0;
    if (x >= c.values.back()) return 100.0;
    std::size_t k = 0;
    while (k + 1 < c.values.size() && c.values[k + 1] <= x) ++k;
    return c.percentiles[k] +
           (x - c.values[k]) / (c.values[k + 1] - c.values[k]) * (c.percentiles[k + 1] - c.percentiles[k]);
  };
  double lo = 1e9, hi = -1e9;
  for (const auto& part : parts) {
    lo = std::min(lo, part.curve->values.front());
    hi = std::max(hi, part.curve->values.back());
  }
  while (hi - lo > 1e-9) {
    const double mid = 0.5 * (lo + hi);
    double m = 0.0;
    for (const auto& part : parts) m += part.weight * cdf(*part.curve, mid);
    (m >= p ? hi : lo) = mid;
  }
  return hi;
}

}  // namespace

TEST_CASE("50/50 mixture matches the survey's mixed5050 percentiles within 1 mm", "[anthropometry][mixture]") {
  if (!raw_check::shared_present()) {
    WARN("../shared is not present: the mixture is NOT compared with percentiles.csv");
    return;
  }
  const std::vector<std::tuple<std::string, std::string, std::string>> pairs = {
      {"ansur2", "stature", "stature"},
      {"ansur2", "acromial_height", "acromialheight"},
      {"ansur2", "wrist_height", "wristheight"},
      {"ansur2", "thumb_tip_reach", "thumbtipreach"},
      {"ansur2", "biacromial_breadth", "biacromialbreadth"},
      {"ansur2", "grip_centre_height", "derived_gripcenterheight"},
      {"ansur2", "elbow_height", "derived_elbowheight_flexed"},
      {"ansur2", "overhead_grip_reach", "derived_overheadgripreach_standing"},
      {"ansur2", "body_mass", "weight_kg"},
      {"ansur1988", "stature", "STATURE"},
      {"ansur1988", "overhead_grip_reach", "derived_overheadgripreach_standing"},
      {"ansur1988", "grip_centre_height", "derived_gripcenterheight"}};
  for (const auto& [table_name, ours, theirs] : pairs) {
    const auto csv =
        raw_check::read_percentiles_csv(raw_check::shared_dir() + "/anthropometry/" + table_name + "/percentiles.csv");
    const auto wf = shipped::workforce(table_name, 0.5);
    const double unit = ours == "body_mass" ? 1.0 : 0.1;
    for (const auto& [stat, p] : {std::pair{"p05", 5.0}, std::pair{"p50", 50.0}, std::pair{"p95", 95.0}}) {
      INFO(table_name << " " << ours << " mixed5050 " << stat);
      // Source: ../shared/anthropometry/<survey>/percentiles.csv, sex "mixed5050"; 1 mm (0.1 kg for mass).
      CHECK(shipped::percentile(wf, ours, p) == Approx(csv.at({theirs, "mixed5050", stat}) * unit).margin(0.1));
    }
    const rackreach::WorkforceMeanSd m = rackreach::calc_workforce_mean_sd(wf, ours);
    REQUIRE(m.mean);
    CHECK(*m.mean == Approx(csv.at({theirs, "mixed5050", "mean"}) * unit).margin(0.005));
    CHECK(*m.sd == Approx(csv.at({theirs, "mixed5050", "sd"}) * unit).margin(0.005));
  }
}

TEST_CASE("a one-sex mixture returns that sex's percentile exactly", "[anthropometry][mixture]") {
  const auto table = shipped::load("ansur2");
  for (const std::string key : {"stature", "acromial_height", "overhead_grip_reach", "body_mass"}) {
    const auto* dim = table->find_dimension(key);
    REQUIRE(dim);
    for (const auto& [women, sex] : {std::pair{1.0, rackreach::Sex::female}, std::pair{0.0, rackreach::Sex::male}}) {
      const rackreach::Workforce wf{table, rackreach::SexMix{women}, {}};
      for (double p : {0.0, 0.35, 1.0, 5.0, 12.3, 50.0, 77.77, 95.0, 99.95, 100.0}) {
        INFO(key << " " << rackreach::sex_name(sex) << " P" << p);
        const auto expected = rackreach::calc_sex_percentile(*table, *dim, *dim->of(sex), p);
        REQUIRE(expected);
        // The mixed-CDF rule with one sex at weight 1 is that sex's quantile function (survey README).
        CHECK(shipped::percentile(wf, key, p) == Approx(*expected).margin(1e-9));
      }
    }
  }
}

TEST_CASE("mixture: exact solution equals a bisection of the mixed CDF, and respects ties",
          "[anthropometry][mixture]") {
  const auto table = shipped::load("ansur2");
  const auto* dim = table->find_dimension("wrist_height");
  REQUIRE(dim);
  rackreach::QuantileCurve f{table->percentiles, dim->female->quantiles};
  rackreach::QuantileCurve m{table->percentiles, dim->male->quantiles};
  for (double women : {0.3, 0.5, 0.8}) {
    const std::vector<rackreach::WeightedCurve> parts = {{&f, women}, {&m, 1.0 - women}};
    for (double p : {1.0, 5.0, 33.0, 50.0, 95.0, 99.0}) {
      INFO("women " << women << " P" << p);
      const auto exact = rackreach::calc_mixture_percentile(parts, p);
      REQUIRE(exact);
      CHECK(*exact == Approx(bisect_mixture(parts, p)).margin(1e-6));
    }
  }
  // Two identical samples mixed 50/50 equal either one; a repeated value makes a step (survey README self-test:
  // sample 1, 2, 2, 3 gives P20 = 1.6 and P50 = 2).
  const rackreach::QuantileCurve tiny{{0.0, 100.0 / 3, 200.0 / 3, 100.0}, {1.0, 2.0, 2.0, 3.0}};
  const std::vector<rackreach::WeightedCurve> same = {{&tiny, 0.5}, {&tiny, 0.5}};
  CHECK(*rackreach::calc_mixture_percentile(same, 20.0) == Approx(1.6).margin(1e-12));
  CHECK(*rackreach::calc_mixture_percentile(same, 50.0) == Approx(2.0).margin(1e-12));
}

TEST_CASE("mixture: a table that stops at the 5th and 95th gives no value where the answer depends on what it lacks",
          "[anthropometry][mixture]") {
  const rackreach::QuantileCurve f{{5.0, 50.0, 95.0}, {150.0, 160.0, 170.0}};
  const rackreach::QuantileCurve m{{5.0, 50.0, 95.0}, {160.0, 175.0, 190.0}};
  // One sex: inside the range it is the table, outside there is no value.
  const std::vector<rackreach::WeightedCurve> women_only = {{&f, 1.0}};
  CHECK(*rackreach::calc_mixture_percentile(women_only, 50.0) == Approx(160.0));
  CHECK_FALSE(rackreach::calc_mixture_percentile(women_only, 4.0));
  CHECK_FALSE(rackreach::calc_mixture_percentile(women_only, 96.0));
  // 50/50: at x = 165 women are at 72.5 and men at 20 (both covered): the 46.25th percentile is defined.
  const std::vector<rackreach::WeightedCurve> mix = {{&f, 0.5}, {&m, 0.5}};
  CHECK(*rackreach::calc_mixture_percentile(mix, 46.25) == Approx(165.0).margin(1e-9));
  // Its 5th percentile needs the men below their 5th: not determined by this table.
  CHECK_FALSE(rackreach::calc_mixture_percentile(mix, 5.0));
}

TEST_CASE("sex mix parsing", "[anthropometry][mixture]") {
  std::string error;
  CHECK(rackreach::parse_sex_mix("women=0.3", error)->women == Approx(0.3));
  CHECK(rackreach::parse_sex_mix("men=70%", error)->women == Approx(0.3));
  CHECK(rackreach::parse_sex_mix("0.25", error)->women == Approx(0.25));
  CHECK_FALSE(rackreach::parse_sex_mix("women=1.2", error));
  CHECK(error.find("from 0 to 1") != std::string::npos);
  CHECK_FALSE(rackreach::parse_sex_mix("kids=0.1", error));
  CHECK_FALSE(rackreach::parse_sex_mix("women=abc", error));
}
