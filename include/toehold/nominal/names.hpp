// The strings users type for the nominal method's choices (weld layout, surface finish, load kind, weld detail,
// criterion), kept in one place. Parsing throws Error naming `where` and listing the accepted spellings.
#pragma once

#include "toehold/nominal/infinite_life.hpp"
#include "toehold/nominal/marin.hpp"
#include "toehold/nominal/weld_group.hpp"

#include <string>
#include <string_view>

namespace toehold::nominal {

// single, parallel-pair, across-pair, angle, channel, box, circle
WeldLayout parse_weld_layout(std::string_view text, const std::string& where);
// ground, machined, hot-rolled, as-forged
Surface parse_surface(std::string_view text, const std::string& where);
// bending, axial, torsion-shear
LoadKind parse_load_kind(std::string_view text, const std::string& where);
// reinforced-butt, transverse-fillet-toe, parallel-fillet-end, t-butt-sharp-corners
WeldDetail parse_weld_detail(std::string_view text, const std::string& where);
// goodman, gerber, asme-elliptic, first-cycle-yield
Criterion parse_criterion(std::string_view text, const std::string& where);

std::string to_string(WeldLayout layout);
std::string to_string(Surface surface);
std::string to_string(LoadKind load);
std::string to_string(WeldDetail detail);
std::string to_string(Criterion criterion);

}  // namespace toehold::nominal
