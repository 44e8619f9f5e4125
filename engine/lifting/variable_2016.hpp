// SPDX-License-Identifier: MIT
#pragma once
// Variable Lifting Index for jobs whose lifts vary from lift to lift (an order picker's shift).
// Source: Waters T., Occhipinti E., Colombini D., Alvarez-Casado E., Fox R. (2016), Variable Lifting Index (VLI): a
// new method for evaluating variable lifting tasks, Human Factors 58(5):695-711, doi:10.1177/0018720815612256.
// The procedure as that paper's abstract states it: compute the FILI of every lift (sub-task), aggregate the FILI
// values into six categories, and apply the Composite Lifting Index equation (composite.hpp; Applications Manual
// 2.4) to the categories with their frequencies:
//   VLI = STLI_1 + sum_{k=2..n} FILI_k x (1/FM(F_1+...+F_k) - 1/FM(F_1+...+F_(k-1))),
// categories numbered by decreasing FILI, F_k a category's total frequency, each FM from Table 5 at the summed
// frequency and the job's duration, STLI_1 = FILI_1 / FM(F_1).
//
// Scope: one job (one worker's lifts over one duration category). Sub-task frequencies are lifts/min averaged over
// the job's duration; a route has at most a few hundred sub-tasks (the work is O(n log n)).
// Bounds: as Table 5 (frequency_table.hpp): a summed frequency beyond the last non-zero row of its column has FM = 0
// and the VLI is then undefined, never a huge number; so is a job longer than 8 h or with an undefined FILI.
//
// Our rules, PENDING CONFIRMATION AGAINST WATERS ET AL. 2016 (the paper's category boundaries and the FILI that
// stands for a category were not available to us; the methods reference marks them as from memory):
//  - Categories: six equal-width FILI classes between the job's least and greatest sub-task FILI. With
//    w = (FILI_max - FILI_min) / 6, a sub-task falls in class floor((FILI - FILI_min) x 6 / (FILI_max - FILI_min)),
//    0 to 5, the greatest FILI in class 5 (each class holds its lower bound; the top class also its upper bound).
//    All FILI equal: one class. Empty classes are dropped, so a job has one to six categories.
//  - The FILI of a category is the GREATEST sub-task FILI in it, not a frequency-weighted mean. Why: with a
//    weighted mean, raising the frequency of a lighter lift within a category lowers the category's FILI and can
//    lower the VLI (e.g. a top category whose total frequency stays under 0.2/min, where FM does not change);
//    with the greatest FILI, classes and their FILI do not depend on frequencies, and the VLI, written as
//    sum_k (FILI_k - FILI_(k+1)) / FM(F_1+...+F_k), never falls when any frequency rises. It is also the
//    conservative choice: the VLI is never below the one a weighted mean would give, and exceeds it by at most
//    one class width per unit of 1/FM.
//  - Categories are ordered by decreasing FILI (the classes are disjoint, so no two tie), as the procedure
//    above states it. The CLI orders its tasks by STLI instead; the two agree when the FILI order and the STLI
//    order of the categories agree (e.g. when one Table 5 column applies and frequencies do not rise as FILI falls).
//  - Table 5 column of a summed frequency: V < 75 cm (30 in) if any sub-task in the sum has its origin below it
//    (the composite code's rule); a category's own FM, for its STLI, likewise over its members.
// A sub-task's contribution is its frequency share of its category's increment: (f_i / F_k) x increment_k, where
// increment_1 = STLI_1 and increment_k = FILI_k x (1/FM(F_1..F_k) - 1/FM(F_1..F_(k-1))). The contributions of all
// sub-tasks sum to the VLI. Ours, for ranking which lifts load the job most; it is the CLI's own attribution of
// the index to its terms, shared within a category in proportion to the lifts.

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "engine/lifting/composite.hpp"

namespace rackreach {

/// The name reports print for the category rule above (ours, pending confirmation against Waters et al. 2016).
inline constexpr std::string_view vli_category_rule_name =
    "six equal-width FILI classes between the least and greatest FILI, class FILI = greatest FILI in the class "
    "(our rule, pending confirmation against Waters et al. 2016)";

/// Number of FILI categories (Waters et al. 2016: six).
inline constexpr int vli_category_count = 6;

/// One lift of a variable job.
struct VariableSubtask {
  std::string id;
  std::optional<double> fili;        ///< max load / FIRWL, dimensionless, >= 0; undefined where FIRWL = 0
  double frequency_per_min = 0.0;    ///< lifts/min of this sub-task averaged over the job's duration, > 0
  bool origin_v_below_split = true;  ///< V at the origin below 75 cm (30 in): Table 5's V < 75 column
};

/// One FILI category, in procedure order (decreasing FILI).
struct VariableCategory {
  int fili_class = 0;                ///< 0 (lowest FILI) to 5 (highest)
  double class_low = 0.0;            ///< FILI at the class's lower bound (included)
  double class_high = 0.0;           ///< FILI at its upper bound (included only for class 5)
  double fili = 0.0;                 ///< the category's FILI: the greatest member FILI
  double frequency_per_min = 0.0;    ///< F_k: sum of the members' frequencies, lifts/min
  bool origin_v_below_split = true;  ///< any member's origin below 75 cm (30 in)
  double fm = 0.0;                   ///< FM(F_k) of the category alone (its own column), 0 beyond Table 5
  std::optional<double> stli;        ///< FILI / FM(F_k); undefined where FM(F_k) = 0
  std::vector<std::size_t> members;  ///< indices into the sub-task list, in input order
};

struct VariableResult {
  std::optional<double> vli;
  std::vector<VariableCategory> categories;  ///< decreasing FILI; empty where a FILI is undefined
  std::vector<CompositeTerm> terms;          ///< the CLI terms over the categories, same order
  /// Per sub-task, in input order: its frequency share of its category's increment (sums to the VLI).
  /// Empty where the VLI is undefined.
  std::vector<double> contributions;
  std::optional<std::string> undefined_reason;
  std::string_view category_rule = vli_category_rule_name;
};

/// The sub-task of a task: FILI from the end with the lower FIRWL (origin unless significant control), as the CLI.
VariableSubtask make_variable_subtask(const LiftTask& task, const TaskResult& result, UnitSystem units);

/// The six-class grouping above, without FM: members, bounds, FILI and total frequency of each non-empty class, in
/// decreasing FILI. Empty if there are no sub-tasks or any FILI is undefined. `fm` and `stli` are left unset.
std::vector<VariableCategory> calc_vli_categories(const std::vector<VariableSubtask>& subtasks);

/// VLI of a job's sub-tasks at the job's duration (empty: more than 8 h), rounded per `mode` as the CLI is.
VariableResult calc_variable_li(const std::vector<VariableSubtask>& subtasks, std::optional<DurationCategory> duration,
                                RoundingMode mode);

/// Sub-task indices by decreasing contribution (ties: input order). Empty where the VLI is undefined.
std::vector<std::size_t> order_by_contribution(const VariableResult& result);

}  // namespace rackreach
