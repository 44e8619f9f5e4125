// SPDX-License-Identifier: MIT
#include "engine/slotting/coupling_class.hpp"

namespace rackreach {

CouplingClass calc_coupling_class(const Part& part, UnitSystem units) {
  if (part.coupling) return {*part.coupling, "given in the file"};
  const double width_cm = Length{part.box.width, units}.in_cm();
  const double height_cm = Length{part.box.height, units}.in_cm();
  if (width_cm > optimal_container_max_frontal_length_cm || height_cm > optimal_container_max_height_cm)
    return {Coupling::poor, "container larger than optimal (frontal length or height above Table 6's optimal container): poor"};
  if (!part.handhold) return {Coupling::poor, "no handhold given: the more stressful class, poor"};
  const Handhold& h = *part.handhold;
  if (h.kind != HandholdKind::none)
    return h.optimal ? CouplingClass{Coupling::good, "optimal container with optimal handles or cut-outs: good"}
                     : CouplingClass{Coupling::fair, "optimal container, handles or cut-outs less than optimal: fair"};
  return h.fingers_flex_90
             ? CouplingClass{Coupling::fair, "optimal container without handles, fingers flex about 90 degrees: fair"}
             : CouplingClass{Coupling::poor, "no handles and the fingers cannot flex under the box: poor"};
}

}  // namespace rackreach
