// SPDX-License-Identifier: MIT
#pragma once
// Sequential Lifting Index for rotation: workers rotate between lifting jobs ("slots") during the shift.
// Source: Waters T.R., Lu M.-L., Occhipinti E. (2007), New procedure for assessing sequential manual lifting jobs
// using the revised NIOSH lifting equation, Ergonomics 50(11):1761-1770.
//
//   SLI = CLI_max + (CLI_max,total - CLI_max) x K,   K = sum_j (CLI_j x t_j) / (CLI_max x T)
//
// CLI_j: slot j's CLI at its own duration category; t_j: the time spent in slot j; CLI_max: the largest CLI_j;
// CLI_max,total: that slot's CLI recomputed as if it lasted the whole rotation (same tasks and frequencies, the
// duration category of T); T: the rotation's total time.
// PENDING CONFIRMATION AGAINST WATERS, LU, OCCHIPINTI 2007: the formula is as our methods reference gives it from
// memory, not yet read in the paper.
//
// Scope: one rotation of one worker. Bounds: t_j > 0 (minutes), CLI_j > 0; T is the sum of the slots' times (a
// rotation is its slots; time without lifting is not a slot). Then 0 < K <= 1 and the SLI lies between CLI_max and
// CLI_max,total.
// Our rules where the formula is silent: a tie for CLI_max goes to the slot with the larger CLI_max,total (the more
// protective), then to the earlier slot. The SLI is undefined (never a number) where any slot's CLI, or the
// CLI_max slot's whole-rotation CLI, is undefined.

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "engine/lifting/composite.hpp"

namespace rackreach {

/// The name reports print for this method and its status.
inline constexpr std::string_view sli_method_name =
    "Sequential Lifting Index, Waters, Lu, Occhipinti 2007 (formula pending confirmation against the paper)";

/// One slot of a rotation.
struct SequentialSlot {
  std::string id;
  std::optional<double> cli;                 ///< CLI at the slot's own duration category, > 0; undefined if so
  double time_min = 0.0;                     ///< t_j: minutes spent in the slot over the rotation, > 0
  std::optional<double> cli_whole_rotation;  ///< the slot's CLI as if it lasted the whole rotation
};

struct SequentialResult {
  std::optional<double> sli;
  std::optional<double> k;              ///< K, in (0, 1]
  std::optional<std::size_t> max_slot;  ///< index of the CLI_max slot
  double cli_max = 0.0;
  double cli_max_total = 0.0;
  double total_time_min = 0.0;  ///< T = sum of t_j
  std::optional<std::string> undefined_reason;
  std::string_view method = sli_method_name;
};

/// SLI of a rotation's slots, rounded per `mode` (1 decimal in worksheet mode, as the CLI).
SequentialResult calc_sequential_li(const std::vector<SequentialSlot>& slots, RoundingMode mode);

/// A slot from its CLI items: its CLI at `own_duration` and again at `rotation_duration` (empty: more than 8 h).
SequentialSlot make_sequential_slot(std::string id, const std::vector<CompositeItem>& items,
                                    std::optional<DurationCategory> own_duration,
                                    std::optional<DurationCategory> rotation_duration, double time_min,
                                    RoundingMode mode);

}  // namespace rackreach
