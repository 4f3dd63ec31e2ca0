// Is the mesh fit for the read-out scheme at a station? Element size at the toe against the scheme's published
// mesh rule, quadratic read-out points sharing an element, element order, distorted host cells. Each check says
// what was checked and whether it passed, so a reviewer sees why a station's value may not be trusted.
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/mesh.hpp"
#include "toehold/readout/scheme.hpp"

#include <string>
#include <vector>

namespace toehold {

struct FitnessCheck {
  std::string name;    // short identifier: "element size", "separate elements", "element order", "cell shape"
  bool passed = true;
  std::string detail;  // what was found, with numbers and units
};

// Checks for one station. toe_cell: the plate cell at the toe (owner of the facet the read-out path starts on);
// host_cells: the cells of the read-out points, in scheme order; readout: unit read-out direction; thickness: t, mm.
//   element size: the toe cell's extent along the read-out direction (mm) <= the scheme's mesh rule
//     (readout/scheme.hpp mesh_rule: fine <= 0.4t, coarse t x t, type b 4 mm / 10 mm; 5 % allowance, common practice)
//   separate elements: schemes with three read-out points (quadratic extrapolation) need each point in its own
//     element (Lotsberg et al., Procedia Structural Integrity 57, 2024)
//   element order: the coarse type a scheme needs higher-order elements (IIW 2016 sec. 3.3, from memory)
//   cell shape: longest / shortest corner edge of each host cell <= 5 (common practice, no source)
std::vector<FitnessCheck> check_station_fitness(const Mesh& mesh, const ReadoutScheme& scheme, double thickness,
                                                const Vec3& readout, long long toe_cell,
                                                const std::vector<long long>& host_cells);

}  // namespace toehold
