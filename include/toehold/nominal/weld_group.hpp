// Fillet-weld groups treated as lines (the textbook hand method): throat area, unit second and polar moments,
// centroid, and the throat stress at the critical point under shear, normal force, torsion and bending.
// Source: Budynas and Nisbett, Mechanical Engineering Design, 9th ed. (2011), Tables 9-1 and 9-2.
#pragma once

#include <Eigen/Core>

#include <optional>
#include <string>
#include <vector>

namespace toehold::nominal {

using Vec2 = Eigen::Vector2d;

// Plane of the weld group: x horizontal, y vertical, z normal to the plane pointing into the attached part.
// Each layout's dimensions: b = width_mm (along x), d = depth_mm (along y), r = radius_mm.
enum class WeldLayout {
  single,         // one straight weld of length d along y
  parallel_pair,  // two welds of length d along y, b apart (centre line to centre line)
  across_pair,    // two welds of length b along x, d apart: the "two welds at the ends" of a member
  angle,          // L: a weld of length b along x and one of length d along y meeting at a corner (torsion only)
  channel,        // three welds: one of length d along y at x = 0, and one of length b along +x at each end
  box,            // closed rectangle b wide and d high
  circle,         // closed circle of radius r
};

// What the analyst gives for a weld group. Dimensions a layout does not use are ignored.
struct WeldGroupShape {
  WeldLayout layout = WeldLayout::single;
  double leg_mm = 0.0;     // fillet leg size h, mm; the throat is 0.707 h
  double width_mm = 0.0;   // b, mm (parallel_pair, across_pair, angle, channel, box)
  double depth_mm = 0.0;   // d, mm (all layouts but circle)
  double radius_mm = 0.0;  // r, mm (circle only)
  std::string name;        // label used in messages, e.g. "bracket to column weld"; may be empty
};

// Section properties of a weld group, all about its centroid.
struct WeldGroupProperties {
  std::string label;                            // "weld group 'name' (layout)" for messages
  WeldLayout layout = WeldLayout::single;
  double leg_mm = 0.0;                          // h, mm
  double throat_mm = 0.0;                       // 0.707 h, mm
  double length_mm = 0.0;                       // total weld length, mm
  double area_mm2 = 0.0;                        // throat area A, mm^2
  Vec2 centroid_mm = Vec2::Zero();              // from the lower-left corner of the group's bounding box, mm
  std::optional<double> unit_second_moment_mm3;  // I_u about the centroidal x axis, mm^3 (none for angle)
  std::optional<double> second_moment_mm4;      // I = 0.707 h I_u, mm^4
  double unit_polar_moment_mm3 = 0.0;           // J_u about the centroid, mm^3
  double polar_moment_mm4 = 0.0;                // J = 0.707 h J_u, mm^4
  std::vector<Vec2> ends_mm;                    // weld ends and corners relative to the centroid, mm (not circle)
  double radius_mm = 0.0;                       // circle radius, mm (circle only, else 0)
};

// Throat area, centroid and unit moments from the textbook's closed forms. Throws Error naming the weld group
// when the leg or a dimension the layout uses is zero, negative or not finite.
WeldGroupProperties weld_group_properties(const WeldGroupShape& shape);

// Load carried by the weld group, resolved at its centroid. Forces in N, moments in N mm.
struct WeldLoad {
  double shear_x_N = 0.0;    // in-plane force along x, N
  double shear_y_N = 0.0;    // in-plane force along y, N
  double normal_N = 0.0;     // force along z, N; positive pulls the attached part off the weld (throat tension)
  double torsion_Nmm = 0.0;  // moment about z through the centroid, N mm, counter-clockwise seen from +z positive
  double bending_Nmm = 0.0;  // moment about the centroidal x axis, N mm; positive puts the throat at y > 0 in tension
};

// Throat stresses at the critical point: the point of the group where the combined magnitude is largest.
struct ThroatStress {
  Vec2 point_mm = Vec2::Zero();          // critical point relative to the centroid (x, y), mm
  double primary_shear_MPa = 0.0;        // |(F_x, F_y)| / A, MPa
  double primary_normal_MPa = 0.0;       // F_z / A, MPa, tension positive
  double torsion_MPa = 0.0;              // |T| r / J at the point, MPa (secondary shear)
  double bending_MPa = 0.0;              // M y / I at the point, MPa, tension positive (secondary)
  Eigen::Vector3d components_MPa = Eigen::Vector3d::Zero();  // (tau_x, tau_y, sigma_z) at the point, MPa
  double combined_MPa = 0.0;             // vector magnitude of the components, MPa
};

// Primary shear F/A plus secondary T r/J (perpendicular to the radius from the centroid) and M c/I (normal to
// the plane), added as vectors at every weld end and corner (for a circle, all round it); the largest
// magnitude wins. Torsion about the centroid: tau = (T/J) (-y, x). Throws Error naming the weld group when a
// bending moment acts on a layout without a tabulated I_u (angle).
ThroatStress throat_stress(const WeldGroupProperties& group, const WeldLoad& load);

// The stress components (tau_x, tau_y, sigma_z), MPa, at `point_mm` (relative to the centroid, mm).
Eigen::Vector3d throat_stress_at(const WeldGroupProperties& group, const WeldLoad& load, const Vec2& point_mm);

}  // namespace toehold::nominal
