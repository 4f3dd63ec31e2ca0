// Nominal stress from the FE model: cut the volume mesh with a plane, keep the plate's cross-section, and integrate
// the stress over it: area, membrane (area-averaged) normal stress, linear bending about the section's principal
// axes, and the area-averaged tensor. The nominal-stress method's "section away from the weld" (docs/nominal-method.md).
#pragma once

#include "toehold/common/tensor.hpp"
#include "toehold/model/mesh.hpp"
#include "toehold/model/stress_field.hpp"

#include <array>
#include <optional>
#include <string>
#include <vector>

namespace toehold {

// An axis-aligned box in model coordinates, mm. Valid when lo <= hi in every coordinate.
struct SectionBox {
  Vec3 lo = Vec3::Zero();  // smallest x, y, z, mm
  Vec3 hi = Vec3::Zero();  // largest x, y, z, mm
};

// Which cells of the cut make up the plate's cross-section. Every limit that is set must hold (they combine with
// "and"); none set keeps every cut cell. The test is per cell, on the centroid of the cell's own part of the cut,
// so the section's edge follows cell boundaries: give limits that clear the plate by part of a cell.
struct SectionLimits {
  std::string region_array;         // name of an integer cell array (e.g. a material or part id); "" = not used
  std::vector<int> region_values;   // cells whose region_array value is one of these; needs region_array
  std::optional<Vec3> centre_mm;    // centre of a disc in the cut plane, mm (projected onto the plane)
  double radius_mm = 0.0;           // disc radius, mm, > 0 when centre_mm is set; distances measured in the plane
  std::optional<SectionBox> box;    // axis-aligned box, mm; the cut-centroid of a kept cell lies inside it
};

// One section: a cut plane, the limits that pick the plate, and the direction of the wanted normal stress.
struct SectionSpec {
  std::string name;                       // label used in messages and reports, e.g. "flange far field"
  Vec3 point_mm = Vec3::Zero();           // a point of the cut plane, mm
  Vec3 normal = Vec3::UnitX();            // plane normal, any length > 0 (normalised here), dimensionless
  SectionLimits limits;
  std::optional<Vec3> direction;          // direction of the normal stress d.S.d, any length > 0; none = normal
};

// The linear part of the normal stress across one principal direction of the section.
struct SectionBending {
  Vec3 across = Vec3::Zero();     // unit in-plane direction along which the fitted stress varies
  Vec3 axis = Vec3::Zero();       // unit bending axis in the plane: plane normal x across
  double second_moment_mm4 = 0.0; // integral over the cut of (distance from the centroid along across)^2, mm^4
  double gradient_MPa_per_mm = 0.0;  // slope of the least-squares linear fit along across, MPa/mm
  double fibre_max_mm = 0.0;      // largest coordinate along across of the cut (from the centroid), mm, >= 0
  double fibre_min_mm = 0.0;      // smallest coordinate along across (from the centroid), mm, <= 0
  double bending_MPa = 0.0;       // gradient x fibre_max: bending stress at the extreme fibre on the +across side
  double bending_min_MPa = 0.0;   // gradient x fibre_min: bending stress at the extreme fibre on the -across side
};

// The integrated section. Sign convention: tension positive; the normal is the spec's, normalised.
struct SectionStress {
  std::string name;                 // SectionSpec::name
  Vec3 normal = Vec3::UnitX();      // unit plane normal
  Vec3 direction = Vec3::UnitX();   // unit direction of the normal stress d.S.d
  double area_mm2 = 0.0;            // cut area of the kept cells, mm^2
  Vec3 centroid_mm = Vec3::Zero();  // area centroid of the cut, mm
  double membrane_MPa = 0.0;        // area average of d.S.d, MPa: the nominal membrane stress
  // Bending about the principal axes of the cut's second moment of area: [0] the weak axis (smaller second
  // moment; for a plate cross-section, bending through the thickness), [1] the strong axis.
  std::array<SectionBending, 2> bending;
  double fit_max_MPa = 0.0;         // largest value of the linear fit (membrane + both bendings) on the cut, MPa
  double fit_min_MPa = 0.0;         // smallest value of that fit on the cut, MPa
  Tensor mean_tensor = Tensor::Zero();  // area average of the full tensor, MPa
  Vec3 mean_traction_MPa = Vec3::Zero();  // mean_tensor x normal: average traction on the cut, MPa
  double mean_shear_MPa = 0.0;      // in-plane part of mean_traction (magnitude), MPa
  long long cut_cells = 0;          // cells that contributed to the cut
};

// Integrates `field` (point or cell data of `mesh`, MPa) over the cut of `spec`.
//
// Each cell is split in its parametric space into linear tetrahedra through its corner nodes (linear cells) or
// through its corner and mid-edge positions (quadratic and Lagrange cells: halves along every parametric edge),
// each placed in the model with the cell's own geometric map. The plane cuts these tetrahedra into triangles and
// quadrilaterals; a 7-point degree-5 triangle rule on them evaluates point data with the cell's own shape
// functions at the Gauss points' parametric coordinates (cell data: the cell's value). Exact to round-off when
// the cell's geometric map is affine (straight-edged tetrahedra, wedges and hexahedra that are parallelepipeds)
// and the field restricted to the plane is of degree <= 4 (tet4/tet10, hex8, hex20, wedge6/15; hex27 on planes
// parallel to a cell face); curved cells are cut through the linear subdivision, with an area error of order
// (edge curvature)^2. Points within 1e-9 of the cell size of the plane count as on it, so a plane through
// nodes counts shared faces once.
//
// Throws Error naming the section when the normal or direction is zero or not finite, the region array is
// missing or not a cell array, a limit is malformed, the plane misses the mesh, the limits leave no cell, or the
// kept cut has zero area.
SectionStress section_stress(const Mesh& mesh, const StressField& field, const SectionSpec& spec);

}  // namespace toehold
