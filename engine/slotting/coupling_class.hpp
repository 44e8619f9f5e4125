// SPDX-License-Identifier: MIT
#pragma once
// The coupling class of a part from its box and handhold, after the Applications Manual's Table 6 (Waters et al.
// 1994) as paraphrased in rnle.md: good = an optimal container (frontal length at most 40 cm, height at most
// 30 cm) with optimal handles or cut-outs; fair = an optimal container with less than optimal handles or
// cut-outs, or none but the fingers can flex about 90 degrees under it; poor = a container of less than optimal
// design, or no handhold and the fingers cannot flex under it. Without handhold information the more stressful
// class applies (poor), as the manual advises when in doubt. A class given in the file wins and is said so.

#include <string>

#include "engine/lifting/coupling_table.hpp"
#include "engine/quantities.hpp"
#include "engine/slotting/store.hpp"

namespace rackreach {

/// Optimal container limits of Table 6, in cm.
inline constexpr double optimal_container_max_frontal_length_cm = 40.0;
inline constexpr double optimal_container_max_height_cm = 30.0;

struct CouplingClass {
  Coupling coupling = Coupling::poor;
  const char* reason = "";  ///< static text: how the class follows from the part
};

CouplingClass calc_coupling_class(const Part& part, UnitSystem units);

}  // namespace rackreach
