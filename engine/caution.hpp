// SPDX-License-Identifier: MIT
#pragma once
// The caution every output of Rackreach carries: results screen, they do not certify.

namespace rackreach {

inline constexpr const char* caution_text =
    "Results screen lifting and reach risk with published methods; they support, and do not replace, a qualified "
    "occupational-health or ergonomics professional, the employer's risk assessment and local regulations. The "
    "lifting equation applies only within its stated limits; tasks outside them are marked.";

/// The method the lifting results follow, as every report names it.
inline constexpr const char* lifting_method_text =
    "Revised NIOSH Lifting Equation (Waters, Putz-Anderson, Garg, Fine 1993; Applications Manual, Waters, "
    "Putz-Anderson, Garg 1994, DHHS (NIOSH) 94-110, revised 2021)";

}  // namespace rackreach
