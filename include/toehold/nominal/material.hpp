// Static strengths for the nominal weld check: a small handbook table (parent steels and weld-metal electrode
// classes, each with its source), user-defined materials, and the rule that a weld is checked with the weaker of
// its parent metal and its weld metal.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace toehold::nominal {

struct Material {
  std::string name;           // e.g. "AISI 1020 HR"
  double ultimate_MPa = 0.0;  // tensile (ultimate) strength S_ut, MPa; the minimum where the source gives a range
  double yield_MPa = 0.0;     // yield strength S_y (or R_eH), MPa
  std::string source;         // where the values come from, with its tag ([S], [M], ...)
};

// The built-in table, in a fixed order:
//   AISI 1020 HR, 1030 HR, 1045 HR: Budynas and Nisbett, Mechanical Engineering Design 9th ed. (2011),
//     Table A-20 (SAE/ASTM minimum values) [S];
//   ASTM A36: F_y 250 MPa, F_u 400-550 MPa (the minimum, 400, is used) [S];
//   S355 (EN 10025-2) by thickness band: R_eH 355 (t <= 16 mm), 345 (16-40 mm) [S], 335 (40-63), 325 (63-80),
//     315 (80-100) [M]; R_m 470 MPa, the minimum for 3-100 mm [S], also used below 3 mm where the standard's
//     minimum is higher (510 MPa [M]);
//   weld-metal electrodes E60xx ... E120xx: AWS minimums as tabulated in the textbook's Table 9-3, ultimate /
//     yield 427/345, 482/393, 551/462, 620/531, 689/600, 827/737 MPa [M].
const std::vector<Material>& material_table();

// A table entry by exact name. Throws Error listing the names when there is no such entry.
Material find_material(std::string_view name);

// S355 for a plate thickness t, mm (0 < t <= 100 mm; the band's upper limit is inclusive). Throws Error
// outside that range.
Material s355(double thickness_mm);

// A material of the analyst's own. Throws Error naming the material when a strength is missing (not finite),
// zero or negative, or when the yield strength exceeds the ultimate strength.
Material user_material(std::string name, double ultimate_MPa, double yield_MPa,
                       std::string source = "user-defined");

// Throws Error naming the material when its strengths are missing, not positive or inconsistent (as above).
void check_material(const Material& material);

// The strengths a weld is checked with: the smaller ultimate and the smaller yield strength of the parent metal
// and the weld metal, each taken on its own (common practice, no source). The source text says which material
// gave which value. Both inputs are checked first.
Material weaker_of(const Material& parent, const Material& weld_metal);

}  // namespace toehold::nominal
