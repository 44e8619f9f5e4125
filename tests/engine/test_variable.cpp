// SPDX-License-Identifier: MIT
// The Variable Lifting Index (Waters et al. 2016, Human Factors 58(5):695-711) with our six-class category rule,
// and the Sequential Lifting Index (Waters, Lu, Occhipinti 2007, Ergonomics 50(11):1761-1770) as our methods
// reference states it. Both are pending confirmation against the papers; the properties checked here are the ones
// the methods reference asks of them. FM values are from Table 5 of the Applications Manual (Waters et al. 1994).

#include <algorithm>
#include <catch2/catch.hpp>
#include <numeric>
#include <random>

#include "engine/lifting/composite.hpp"
#include "engine/lifting/sequential_2007.hpp"
#include "engine/lifting/variable_2016.hpp"

using namespace rackreach;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;

namespace {

constexpr auto long_8h = DurationCategory::long_duration;

VariableSubtask lift(std::string id, double fili, double f, bool below = true) {
  return {std::move(id), fili, f, below};
}

double sum(const std::vector<double>& v) {
  return std::accumulate(v.begin(), v.end(), 0.0);
}

}  // namespace

TEST_CASE("VLI, our own worked example: three of six classes occupied, long duration", "[variable]") {
  // Our own example, computed by hand. FILI 0.5 to 2.0: six classes of width 0.25 (our rule).
  std::vector<VariableSubtask> lifts = {lift("a", 2.0, 0.5, false), lift("b", 1.8, 1.0, false),
                                        lift("c", 1.1, 1.0, true),  lift("d", 1.2, 0.5, false),
                                        lift("e", 0.6, 1.0, false), lift("f", 0.5, 1.0, false)};
  const VariableResult r = calc_variable_li(lifts, long_8h, RoundingMode::full);
  REQUIRE(r.vli);
  REQUIRE(r.categories.size() == 3);
  // Category 1: class 6 [1.75, 2.0], {a, b}, FILI 2.0 (greatest), F = 1.5, all origins >= 75 cm.
  CHECK(r.categories[0].fili_class == 5);
  CHECK(r.categories[0].members == std::vector<std::size_t>{0, 1});
  CHECK(r.categories[0].fili == 2.0);
  CHECK(r.categories[0].frequency_per_min == 1.5);
  CHECK_FALSE(r.categories[0].origin_v_below_split);
  // Category 2: class 3 [1.0, 1.25), {c, d}, FILI 1.2, F = 1.5, c below 75 cm.
  CHECK(r.categories[1].fili_class == 2);
  CHECK(r.categories[1].members == std::vector<std::size_t>{2, 3});
  CHECK(r.categories[1].fili == 1.2);
  CHECK(r.categories[1].origin_v_below_split);
  // Category 3: class 1 [0.5, 0.75), {e, f}, FILI 0.6, F = 2.0.
  CHECK(r.categories[2].fili_class == 0);
  CHECK(r.categories[2].members == std::vector<std::size_t>{4, 5});
  CHECK(r.categories[2].fili == 0.6);
  CHECK(r.categories[2].frequency_per_min == 2.0);

  // Table 5, <= 8 h ([AM94]): FM(1) = .75, FM(2) = .65 -> FM(1.5) = .70 by linear interpolation (V >= 75 column;
  // the two columns agree up to 8/min); FM(3) = .55 (V < 75: c is in the sum); FM(5) = .35.
  const double fm_1_5 = 0.70, fm_3 = 0.55, fm_5 = 0.35, fm_2 = 0.65;
  CHECK_THAT(r.terms[0].fm_cumulative, WithinAbs(fm_1_5, 1e-12));
  CHECK_THAT(r.terms[1].fm_cumulative, WithinAbs(fm_3, 1e-12));
  CHECK_THAT(r.terms[2].fm_cumulative, WithinAbs(fm_5, 1e-12));
  // VLI = STLI_1 + FILI_2 (1/FM(3) - 1/FM(1.5)) + FILI_3 (1/FM(5) - 1/FM(3)) = 2.857 + 0.468 + 0.623 = 3.948
  const double inc1 = 2.0 / fm_1_5, inc2 = 1.2 * (1 / fm_3 - 1 / fm_1_5), inc3 = 0.6 * (1 / fm_5 - 1 / fm_3);
  CHECK_THAT(*r.vli, WithinAbs(inc1 + inc2 + inc3, 1e-12));
  CHECK_THAT(*r.vli, WithinAbs(3.948052, 1e-6));
  // Category STLI at the category's own frequency: 1.2 / FM(1.5) and 0.6 / FM(2).
  REQUIRE(r.categories[1].stli);
  CHECK_THAT(*r.categories[1].stli, WithinAbs(1.2 / fm_1_5, 1e-12));
  CHECK_THAT(*r.categories[2].stli, WithinAbs(0.6 / fm_2, 1e-12));

  // Contributions (our definition): frequency share of the category's increment; they sum to the VLI.
  REQUIRE(r.contributions.size() == 6);
  CHECK_THAT(r.contributions[0], WithinAbs(inc1 * 0.5 / 1.5, 1e-12));
  CHECK_THAT(r.contributions[1], WithinAbs(inc1 * 1.0 / 1.5, 1e-12));
  CHECK_THAT(r.contributions[2], WithinAbs(inc2 * 1.0 / 1.5, 1e-12));
  CHECK_THAT(r.contributions[4], WithinAbs(inc3 * 0.5, 1e-12));
  CHECK_THAT(sum(r.contributions), WithinAbs(*r.vli, 1e-12));
  CHECK(order_by_contribution(r).front() == 1);  // b: the frequent lift of the heaviest class
  CHECK(r.category_rule == vli_category_rule_name);
}

TEST_CASE("VLI class boundaries: lower bound included, top class closed (our rule)", "[variable]") {
  // FILI 1.0 to 4.0: width 0.5, boundaries exact in binary.
  std::vector<VariableSubtask> lifts;
  for (double x : {1.0, 1.4999, 1.5, 2.0, 2.5, 3.0, 3.5, 3.9999, 4.0}) lifts.push_back(lift("x", x, 0.1));
  const auto cats = calc_vli_categories(lifts);
  REQUIRE(cats.size() == 6);
  // Decreasing FILI: class 6 holds 3.5, 3.9999 and 4.0; class 1 holds 1.0 and 1.4999; 1.5 opens class 2.
  CHECK(cats[0].members == std::vector<std::size_t>{6, 7, 8});
  CHECK(cats[0].fili == 4.0);
  CHECK(cats[5].members == std::vector<std::size_t>{0, 1});
  CHECK(cats[5].fili == 1.4999);
  CHECK(cats[4].members == std::vector<std::size_t>{2});
  CHECK(cats[4].class_low == 1.5);
  CHECK(cats[4].class_high == 2.0);
  // All FILI equal: one category.
  const auto one = calc_vli_categories({lift("p", 0.8, 1.0), lift("q", 0.8, 2.0)});
  REQUIRE(one.size() == 1);
  CHECK(one[0].frequency_per_min == 3.0);
}

TEST_CASE("VLI of one lift is its STLI, FILI / FM(F) (Applications Manual 2.4 with n = 1)", "[variable]") {
  const auto r = calc_variable_li({lift("only", 1.3, 4.0)}, DurationCategory::moderate_duration, RoundingMode::full);
  REQUIRE(r.vli);
  CHECK_THAT(*r.vli, WithinAbs(1.3 / 0.72, 1e-12));  // FM(4), <= 2 h, V < 75 = .72 ([AM94] Table 5)
}

TEST_CASE("VLI orders categories by decreasing FILI, where the CLI orders by STLI (our reading of Waters 2016)",
          "[variable]") {
  // A: FILI 1.0 at 0.2/min; B: FILI 0.8 at 5/min; <= 8 h, V < 75. Each is its own category.
  // Table 5 ([AM94]): FM(0.2) = .85, FM(5) = .35, FM(5.2) = .35 + 0.2 x (.27 - .35) = .334.
  const double fm_02 = 0.85, fm_5 = 0.35, fm_52 = 0.334;
  const auto v = calc_variable_li({lift("A", 1.0, 0.2), lift("B", 0.8, 5.0)}, long_8h, RoundingMode::full);
  REQUIRE(v.vli);
  CHECK_THAT(*v.vli, WithinAbs(1.0 / fm_02 + 0.8 * (1 / fm_52 - 1 / fm_02), 1e-12));  // A first: 2.631
  const auto c = calc_composite_li({{"A", 1.0, 1.0 / fm_02, 0.2, true}, {"B", 0.8, 0.8 / fm_5, 5.0, true}}, long_8h,
                                   RoundingMode::full);
  REQUIRE(c.cli);
  CHECK_THAT(*c.cli, WithinAbs(0.8 / fm_5 + 1.0 * (1 / fm_52 - 1 / fm_5), 1e-12));  // B first: 2.423
  CHECK(*v.vli > *c.cli + 0.1);
}

TEST_CASE("VLI equals the CLI when every category holds one lift and the FILI and STLI orders agree",
          "[variable][property]") {
  // Property from the methods reference for [VLI16]. The orders agree by construction: one Table 5 column and
  // frequencies that do not rise as FILI falls.
  std::mt19937 rng(20160501);
  std::uniform_real_distribution<double> fili(0.2, 3.0), f(0.1, 2.0);
  std::uniform_int_distribution<int> n_dist(1, 6), dur(0, 2), coin(0, 1);
  int compared = 0;
  for (int trial = 0; trial < 600; ++trial) {
    const int n = n_dist(rng);
    const bool below = coin(rng) == 1;
    const auto duration = static_cast<DurationCategory>(dur(rng));
    std::vector<double> fs(n), xs(n);
    for (auto& x : xs) x = fili(rng);
    for (auto& y : fs) y = f(rng);
    std::sort(xs.rbegin(), xs.rend());
    std::sort(fs.rbegin(), fs.rend());
    std::vector<std::size_t> perm(n);
    std::iota(perm.begin(), perm.end(), std::size_t{0});
    std::shuffle(perm.begin(), perm.end(), rng);  // input order is not procedure order
    std::vector<VariableSubtask> lifts;
    std::vector<CompositeItem> items;
    for (std::size_t i : perm) {
      const std::string id = "t" + std::to_string(i);
      lifts.push_back(lift(id, xs[i], fs[i], below));
      const double fm = calc_fm(fs[i], duration, !below).fm;
      items.push_back({id, xs[i], fm > 0 ? std::optional<double>(xs[i] / fm) : std::nullopt, fs[i], below});
    }
    const auto v = calc_variable_li(lifts, duration, RoundingMode::full);
    if (v.categories.size() != static_cast<std::size_t>(n)) continue;  // some class holds two lifts
    const auto c = calc_composite_li(items, duration, RoundingMode::full);
    REQUIRE(v.vli.has_value() == c.cli.has_value());
    if (!v.vli) continue;
    CHECK_THAT(*v.vli, WithinAbs(*c.cli, 1e-12));
    ++compared;
  }
  CHECK(compared >= 150);
}

TEST_CASE("VLI is never below the largest category STLI and never falls when a frequency rises",
          "[variable][property]") {
  // Properties from the methods reference for [VLI16]; they hold for our class rule by construction (the header
  // says why a frequency-weighted class FILI would break the second).
  std::mt19937 rng(58695711);
  std::uniform_real_distribution<double> fili(0.05, 3.0), f(0.01, 0.4), raise(1.01, 3.0);
  std::uniform_int_distribution<int> n_dist(1, 40), dur(0, 2), coin(0, 1);
  int checked = 0;
  for (int trial = 0; trial < 500; ++trial) {
    const int n = n_dist(rng);
    const auto duration = static_cast<DurationCategory>(dur(rng));
    std::vector<VariableSubtask> lifts;
    for (int i = 0; i < n; ++i) lifts.push_back(lift("t" + std::to_string(i), fili(rng), f(rng), coin(rng) == 1));
    const auto before = calc_variable_li(lifts, duration, RoundingMode::full);
    const std::size_t i = std::uniform_int_distribution<std::size_t>(0, n - 1)(rng);
    lifts[i].frequency_per_min *= raise(rng);
    const auto after = calc_variable_li(lifts, duration, RoundingMode::full);
    if (!before.vli || !after.vli) continue;  // a zero cell of Table 5 at a summed frequency: undefined is right
    double max_stli = 0.0;
    for (const auto& cat : before.categories) max_stli = std::max(max_stli, cat.stli.value_or(0.0));
    CHECK(*before.vli >= max_stli - 1e-12);
    CHECK(*after.vli >= *before.vli - 1e-12);
    CHECK_THAT(sum(before.contributions), WithinAbs(*before.vli, 1e-9));
    ++checked;
  }
  CHECK(checked >= 250);
}

TEST_CASE("VLI: a lighter lift's frequency rising in the top category does not lower it (our class FILI)",
          "[variable]") {
  // Top class {2.0, 1.9}, total under 0.2/min so FM stays 1.00 (<= 1 h, [AM94] Table 5): a frequency-weighted
  // class FILI would fall from 1.95 to 1.933 here; the greatest FILI keeps the VLI at 2.0.
  std::vector<VariableSubtask> lifts = {lift("h", 2.0, 0.05), lift("l", 1.9, 0.05), lift("z", 0.2, 0.01)};
  const auto before = calc_variable_li(lifts, DurationCategory::short_duration, RoundingMode::full);
  lifts[1].frequency_per_min = 0.1;
  const auto after = calc_variable_li(lifts, DurationCategory::short_duration, RoundingMode::full);
  REQUIRE(before.vli);
  REQUIRE(after.vli);
  CHECK_THAT(*before.vli, WithinAbs(2.0, 1e-12));
  CHECK(*after.vli >= *before.vli);
}

TEST_CASE("VLI undefined: a zero FM at a summed frequency, an undefined FILI, more than 8 h", "[variable]") {
  // <= 8 h, Table 5 ([AM94]): F = 9.5 is .14 in the V >= 75 column (between .15 and .13) and 0 in V < 75.
  std::vector<VariableSubtask> lifts = {lift("heavy", 1.0, 5.0, false), lift("light", 0.5, 4.5, false)};
  auto r = calc_variable_li(lifts, long_8h, RoundingMode::full);
  REQUIRE(r.vli);
  CHECK_THAT(r.terms[1].fm_cumulative, WithinAbs(0.14, 1e-12));
  lifts[1].origin_v_below_split = true;  // the sum now takes the V < 75 column (the composite rule)
  r = calc_variable_li(lifts, long_8h, RoundingMode::full);
  CHECK_FALSE(r.vli);
  REQUIRE(r.undefined_reason);
  CHECK_THAT(*r.undefined_reason, Contains("combined frequency 9.5"));
  CHECK(r.contributions.empty());

  // The first category alone beyond the table: 9.5/min, V < 75, <= 8 h.
  r = calc_variable_li({lift("fast", 1.0, 9.5, true)}, long_8h, RoundingMode::full);
  CHECK_FALSE(r.vli);
  REQUIRE(r.undefined_reason);
  CHECK_THAT(*r.undefined_reason, Contains("combined frequency 9.5"));

  r = calc_variable_li({lift("ok", 1.0, 1.0), {"far", std::nullopt, 1.0, true}}, long_8h, RoundingMode::full);
  CHECK_FALSE(r.vli);
  REQUIRE(r.undefined_reason);
  CHECK_THAT(*r.undefined_reason, Contains("\"far\" has no FILI"));

  r = calc_variable_li({lift("ok", 1.0, 1.0)}, std::nullopt, RoundingMode::full);
  CHECK_FALSE(r.vli);
  REQUIRE(r.undefined_reason);
  CHECK_THAT(*r.undefined_reason, Contains("more than 8 h"));

  CHECK_FALSE(calc_variable_li({}, long_8h, RoundingMode::full).vli);
}

TEST_CASE("SLI, our own worked example (formula of Waters, Lu, Occhipinti 2007 as our reference states it)",
          "[sequential]") {
  // Three slots over T = 480 min. K = (2.0 x 120 + 1.5 x 240 + 1.0 x 120) / (2.0 x 480) = 720 / 960 = 0.75;
  // SLI = 2.0 + (2.6 - 2.0) x 0.75 = 2.45.
  const std::vector<SequentialSlot> slots = {{"A", 2.0, 120.0, 2.6}, {"B", 1.5, 240.0, 1.9}, {"C", 1.0, 120.0, 1.2}};
  const auto r = calc_sequential_li(slots, RoundingMode::full);
  REQUIRE(r.sli);
  CHECK(r.max_slot == std::optional<std::size_t>{0});
  CHECK(r.total_time_min == 480.0);
  CHECK_THAT(*r.k, WithinAbs(0.75, 1e-12));
  CHECK_THAT(*r.sli, WithinAbs(2.45, 1e-12));
  CHECK_THAT(*calc_sequential_li(slots, RoundingMode::worksheet).sli, WithinAbs(2.5, 1e-12));  // 2.45 -> 2.5
}

TEST_CASE("SLI of a one-job rotation lasting the whole time is that job's CLI", "[sequential]") {
  // K = CLI x T / (CLI x T) = 1 and CLI_max,total = CLI_max: SLI = CLI (follows from the formula).
  const std::vector<CompositeItem> items = {{"x", 0.8, 1.0, 1.0, true}, {"y", 0.6, 0.7, 2.0, true}};
  const auto slot = make_sequential_slot("only", items, long_8h, long_8h, 480.0, RoundingMode::full);
  const auto cli = calc_composite_li(items, long_8h, RoundingMode::full).cli;
  REQUIRE(cli);
  const auto r = calc_sequential_li({slot}, RoundingMode::full);
  REQUIRE(r.sli);
  CHECK_THAT(*r.sli, WithinAbs(*cli, 1e-12));
}

TEST_CASE("SLI lies between CLI_max and CLI_max,total", "[sequential][property]") {
  // Follows from 0 < K <= 1 (T is the sum of the slots' times).
  std::mt19937 rng(50111761);
  std::uniform_real_distribution<double> cli(0.3, 3.0), stretch(0.8, 1.6), t(10.0, 240.0);
  std::uniform_int_distribution<int> n_dist(1, 5);
  for (int trial = 0; trial < 300; ++trial) {
    std::vector<SequentialSlot> slots;
    for (int j = 0, n = n_dist(rng); j < n; ++j) {
      const double c = cli(rng);
      slots.push_back({"s" + std::to_string(j), c, t(rng), c * stretch(rng)});
    }
    const auto r = calc_sequential_li(slots, RoundingMode::full);
    REQUIRE(r.sli);
    const double lo = std::min(r.cli_max, r.cli_max_total), hi = std::max(r.cli_max, r.cli_max_total);
    CHECK(*r.sli >= lo - 1e-12);
    CHECK(*r.sli <= hi + 1e-12);
    CHECK(*r.k > 0.0);
    CHECK(*r.k <= 1.0 + 1e-12);
    for (const auto& s : slots) CHECK(*s.cli <= r.cli_max);
  }
}

TEST_CASE("SLI: tie for CLI_max goes to the larger whole-rotation CLI (our rule); undefined inputs", "[sequential]") {
  auto r = calc_sequential_li({{"a", 1.5, 60.0, 1.7}, {"b", 1.5, 60.0, 2.1}}, RoundingMode::full);
  CHECK(r.max_slot == std::optional<std::size_t>{1});
  REQUIRE(r.sli);
  CHECK_THAT(*r.sli, WithinAbs(2.1, 1e-12));  // K = 1: both slots at CLI_max
  r = calc_sequential_li({{"a", 1.5, 60.0, 1.7}, {"b", std::nullopt, 60.0, 2.1}}, RoundingMode::full);
  CHECK_FALSE(r.sli);
  REQUIRE(r.undefined_reason);
  CHECK_THAT(*r.undefined_reason, Contains("\"b\" has no CLI"));
  r = calc_sequential_li({{"a", 1.5, 60.0, std::nullopt}, {"b", 1.0, 60.0, 2.1}}, RoundingMode::full);
  CHECK_FALSE(r.sli);
  CHECK(r.undefined_reason);
  r = calc_sequential_li({{"a", 1.5, 0.0, 1.7}}, RoundingMode::full);
  CHECK_FALSE(r.sli);
  CHECK_FALSE(calc_sequential_li({}, RoundingMode::full).sli);
}
