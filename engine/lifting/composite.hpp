// SPDX-License-Identifier: MIT
#pragma once
// Composite Lifting Index for multi-task jobs (Waters et al. 1994, Applications Manual 2.4):
//   1. FIRWL = RWL with FM = 1; STRWL = FIRWL x FM(task's own F).
//   2. FILI = maximum load / FIRWL; STLI = load / STRWL.
//   3. Tasks numbered by decreasing STLI; ties: the higher frequency first (then input order).
//   4. CLI = STLI_1 + sum_{k=2..n} FILI_k x (1/FM(F_1+...+F_k) - 1/FM(F_1+...+F_(k-1))),
//      each FM from Table 5 at the summed frequency and the job's duration.
// Our rules where the manual is silent (stated in every report):
//  - the Table 5 column for a summed frequency is the V < 75 cm (30 in) column if any task in the sum has its
//    origin below the split height (the more protective column);
//  - with significant control at the destination, the end with the lower FIRWL feeds FILI and STLI.
// The CLI is undefined (never a huge number) where a FILI or the first STLI is undefined or an FM of a summed
// frequency is zero.

#include <optional>
#include <string>
#include <vector>

#include "engine/lifting/rnle_1994.hpp"

namespace rackreach {

/// One task as the composite procedure sees it.
struct CompositeItem {
  std::string id;
  std::optional<double> fili;
  std::optional<double> stli;
  double frequency_per_min = 0.0;
  bool origin_v_below_split = true;
};

/// One term of the CLI sum, in procedure order.
struct CompositeTerm {
  std::string id;
  std::optional<double> fili;
  std::optional<double> stli;
  double frequency_per_min = 0.0;
  double cumulative_frequency_per_min = 0.0;
  double fm_cumulative = 0.0;   ///< FM(F_1 + ... + F_k)
  double fm_previous = 0.0;     ///< FM(F_1 + ... + F_(k-1)); 0 for the first term
  double increment = 0.0;       ///< STLI_1 for k = 1, FILI_k x (1/FM_k - 1/FM_(k-1)) after
};

struct CompositeResult {
  std::optional<double> cli;
  std::vector<CompositeTerm> terms;  ///< in procedure order (decreasing STLI)
  std::optional<std::string> undefined_reason;
};

/// The item of a task: FILI and STLI from the end with the lower FIRWL (origin unless significant control).
CompositeItem make_composite_item(const LiftTask& task, const TaskResult& result, UnitSystem units);

/// The ordering of step 3: decreasing STLI, ties by higher frequency, then input order. Undefined STLI first.
std::vector<std::size_t> order_for_composite(const std::vector<CompositeItem>& items);

/// CLI of a job's items at the job's duration (empty: more than 8 h).
CompositeResult calc_composite_li(const std::vector<CompositeItem>& items, std::optional<DurationCategory> duration,
                                  RoundingMode mode);

/// Step 4 alone: the CLI sum over items already in procedure order (item 0 gives STLI_1), at the job's duration
/// (empty: more than 8 h). calc_composite_li is order_for_composite followed by this; the Variable Lifting Index
/// (variable_2016.hpp) applies it to FILI categories in its own order.
CompositeResult calc_composite_sum(const std::vector<CompositeItem>& ordered, std::optional<DurationCategory> duration,
                                   RoundingMode mode);

}  // namespace rackreach
