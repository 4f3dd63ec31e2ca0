// Units the analyst declares for a model (VTK files carry none), and their conversion to the internal
// system: lengths in mm, stresses in MPa. Conversion happens once, where data enters the library.
#pragma once

#include <string>
#include <string_view>

namespace toehold {

enum class LengthUnit {
  mm,  // millimetre
  m,   // metre
  in,  // inch (25.4 mm exactly)
};

enum class StressUnit {
  MPa,  // megapascal (N/mm^2)
  Pa,   // pascal (N/m^2)
  psi,  // pound-force per square inch (6894.757293168 Pa)
  ksi,  // 1000 psi
};

// Millimetres in one `unit`.
double mm_per(LengthUnit unit);
// Megapascals in one `unit`.
double mpa_per(StressUnit unit);

// The strings users type, in one place. Parsing throws Error naming `where` (e.g. "plan key model.length_unit")
// and listing the accepted spellings.
LengthUnit parse_length_unit(std::string_view text, const std::string& where);
StressUnit parse_stress_unit(std::string_view text, const std::string& where);
std::string to_string(LengthUnit unit);
std::string to_string(StressUnit unit);

}  // namespace toehold
