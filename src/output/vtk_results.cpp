// stations.vtp (one point per station, a polyline per toe) and readout.vtp (the read-out points and each
// station's walked read-out path), with the arrays docs/outputs.md lists. Lengths in the output unit, MPa.
#include "result_files.hpp"

#include <vtkCellArray.h>
#include <vtkDoubleArray.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkPolyData.h>
#include <vtkSmartPointer.h>
#include <vtkXMLPolyDataWriter.h>

#include <limits>
#include <vector>

namespace toehold::detail {
namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

vtkSmartPointer<vtkDoubleArray> doubles(vtkPolyData* data, const std::string& name, int components = 1) {
  auto array = vtkSmartPointer<vtkDoubleArray>::New();
  array->SetName(vtk_safe_name(name).c_str());
  array->SetNumberOfComponents(components);
  array->SetNumberOfTuples(data->GetNumberOfPoints());
  array->Fill(kNaN);
  data->GetPointData()->AddArray(array);
  return array;
}

vtkSmartPointer<vtkIntArray> ints(vtkPolyData* data, const std::string& name) {
  auto array = vtkSmartPointer<vtkIntArray>::New();
  array->SetName(vtk_safe_name(name).c_str());
  array->SetNumberOfTuples(data->GetNumberOfPoints());
  array->Fill(0);
  data->GetPointData()->AddArray(array);
  return array;
}

void set_vector(vtkDoubleArray* array, vtkIdType row, const Vec3& v) {
  for (int k = 0; k < 3; ++k) array->SetComponent(row, k, v[k]);
}

std::vector<std::string> toe_names(const Assessment& a) {
  std::vector<std::string> names;
  for (const auto& t : a.toes) names.push_back(t.plan.name);
  return names;
}

// Field data every result polydata carries.
void add_common_fields(const OutputContext& c, vtkPolyData* data) {
  add_field_strings(data, kToeNames, toe_names(*c.a));
  add_field_strings(data, kLoadSteps, c.a->steps);
  add_field_strings(data, kProvenance, c.provenance);
  if (!c.a->counting.empty()) add_field_strings(data, "counting", {c.a->counting});
}

vtkSmartPointer<vtkPoints> double_points() {
  auto points = vtkSmartPointer<vtkPoints>::New();
  points->SetDataTypeToDouble();
  return points;
}

void insert_point(vtkPoints* points, const OutputContext& c, const Vec3& x_mm) {
  points->InsertNextPoint(c.length(x_mm.x()), c.length(x_mm.y()), c.length(x_mm.z()));
}

// ---- stations.vtp ---------------------------------------------------------------------------------------------

// The point arrays of stations.vtp, one row per station.
struct StationArrays {
  vtkSmartPointer<vtkIntArray> toe, id, exceeds, has_result;
  vtkSmartPointer<vtkDoubleArray> arc, range, allowable, utilization, life, tangent, normal, readout;
  std::vector<vtkSmartPointer<vtkDoubleArray>> hot_spot;  // one per load step
  // Toes with [toe.nominal] only (null when no toe has one).
  vtkSmartPointer<vtkDoubleArray> nominal_range, nominal_utilization, nominal_life, concentration;
  vtkSmartPointer<vtkIntArray> nominal_governs;
  // Damage kinds only (null for range).
  vtkSmartPointer<vtkDoubleArray> damage, life_repeats, life_years, equivalent, governing_range, governing_share;

  // Shell models only: the layer read, the origin of the distances and the hot-spot location (which lies off the
  // station point when the distances start at the weld toe).
  vtkSmartPointer<vtkIntArray> shell_layer, weld_toe_origin;
  vtkSmartPointer<vtkDoubleArray> shell_offset, hot_spot_location;
  // Toes with through_thickness only: the linearization beside the surface value.
  vtkSmartPointer<vtkIntArray> has_line;
  vtkSmartPointer<vtkDoubleArray> structural_range, one_mm_range, ratio;
  std::vector<vtkSmartPointer<vtkDoubleArray>> membrane, bending, structural;  // one per load step

  void add_shell_arrays(const OutputContext& c, vtkPolyData* data) {
    shell_layer = ints(data, "shell layer [1 = top, 2 = bottom]");
    weld_toe_origin = ints(data, "distances from weld toe [1 = yes]");
    shell_offset = doubles(data, c.length_name("offset from intersection line"));
    hot_spot_location = doubles(data, c.length_name("hot-spot location"), 3);
  }

  void add_linearization_arrays(const OutputContext& c, vtkPolyData* data) {
    has_line = ints(data, "has linearization [1 = yes]");
    structural_range = doubles(data, "linearized structural stress range [MPa]");
    one_mm_range = doubles(data, "stress range 1 mm below surface [MPa]");
    ratio = doubles(data, "ratio linearized to surface range [-]");
    for (const auto& step : c.a->steps) {
      membrane.push_back(doubles(data, "membrane stress " + step + " [MPa]"));
      bending.push_back(doubles(data, "bending stress " + step + " [MPa]"));
      structural.push_back(doubles(data, "linearized structural stress " + step + " [MPa]"));
    }
  }

  void fill_shell(vtkIdType row, const StationResult& s, const OutputContext& c) {
    if (!shell_layer || !s.shell) return;
    shell_layer->SetValue(row, s.shell->layer == "top" ? 1 : 2);
    weld_toe_origin->SetValue(row, s.shell->origin == "weld-toe" ? 1 : 0);
    shell_offset->SetValue(row, c.length(s.shell->offset));
    set_vector(hot_spot_location, row, s.shell->hot_spot / c.mm_per_unit);
  }

  static void put_steps(std::vector<vtkSmartPointer<vtkDoubleArray>>& arrays, vtkIdType row,
                        const std::vector<double>& values) {
    for (std::size_t k = 0; k < arrays.size() && k < values.size(); ++k) arrays[k]->SetValue(row, values[k]);
  }

  void fill_linearization(vtkIdType row, const StationResult& s) {
    if (!has_line || !s.through_thickness || !s.through_thickness->ok()) return;
    const ThroughThicknessResult& l = *s.through_thickness;
    has_line->SetValue(row, 1);
    structural_range->SetValue(row, l.structural_range);
    one_mm_range->SetValue(row, l.one_mm_range);
    ratio->SetValue(row, linearized_ratio(s));
    put_steps(membrane, row, l.membrane);
    put_steps(bending, row, l.bending);
    put_steps(structural, row, l.structural);
  }

  void add_damage_arrays(vtkPolyData* data) {
    damage = doubles(data, "damage [-]");
    life_repeats = doubles(data, "life [repeats]");
    life_years = doubles(data, "life [years]");
    equivalent = doubles(data, "equivalent stress range at 2e6 [MPa]");
    governing_range = doubles(data, "governing range [MPa]");
    governing_share = doubles(data, "governing damage share [-]");
  }

  void add_nominal_arrays(vtkPolyData* data) {
    nominal_range = doubles(data, "nominal stress range [MPa]");
    nominal_utilization = doubles(data, "nominal utilization [-]");
    nominal_life = doubles(data, "nominal life [cycles]");
    concentration = doubles(data, "structural stress concentration factor [-]");
    nominal_governs = ints(data, "nominal governs [1 = yes]");
  }

  void fill_nominal(vtkIdType row, const StationResult& s) {
    if (!nominal_range || !s.nominal || !s.nominal->check.ok()) return;
    const StationNominal& n = *s.nominal;
    nominal_range->SetValue(row, n.check.range);
    nominal_utilization->SetValue(row, n.check.utilization);
    nominal_life->SetValue(row, n.check.life);
    if (n.concentration_factor) concentration->SetValue(row, *n.concentration_factor);
    nominal_governs->SetValue(row, n.governing == "nominal" ? 1 : 0);
  }

  void fill_damage(vtkIdType row, const StationResult& s) {
    if (!damage) return;
    damage->SetValue(row, s.damage);
    life_repeats->SetValue(row, s.life_repeats);
    life_years->SetValue(row, s.life_years);
    equivalent->SetValue(row, s.equivalent_range);
    if (s.governing.empty()) return;
    governing_range->SetValue(row, s.governing.front().cycle.range);
    governing_share->SetValue(row, s.governing.front().share);
  }

  StationArrays(const OutputContext& c, vtkPolyData* data)
      : toe(ints(data, kToeNumber)), id(ints(data, kStationId)), exceeds(ints(data, "exceeds allowable [1 = yes]")),
        has_result(ints(data, "has result [1 = yes]")), arc(doubles(data, c.length_name("arc length"))),
        range(doubles(data, "hot-spot stress range [MPa]")), allowable(doubles(data, "allowable stress range [MPa]")),
        utilization(doubles(data, kUtilization)), life(doubles(data, "life [cycles]")),
        tangent(doubles(data, "toe tangent [unit vector]", 3)), normal(doubles(data, "surface normal [unit vector]", 3)),
        readout(doubles(data, "read-out direction [unit vector]", 3)) {
    for (const auto& step : c.a->steps) hot_spot.push_back(doubles(data, hot_spot_name(step)));
    if (c.a->plan.loading.kind != LoadingKind::range) add_damage_arrays(data);
    if (has_nominal(*c.a)) add_nominal_arrays(data);
    if (has_shell(*c.a)) add_shell_arrays(c, data);
    if (has_linearization(*c.a)) add_linearization_arrays(c, data);
  }

  void fill(vtkIdType row, int toe_number, const StationResult& s, const OutputContext& c) {
    toe->SetValue(row, toe_number);
    id->SetValue(row, s.station.id);
    arc->SetValue(row, c.length(s.station.arc));
    if (s.station.problem.empty()) {
      set_vector(tangent, row, s.station.frame.tangent);
      set_vector(normal, row, s.station.frame.normal);
      set_vector(readout, row, s.station.frame.readout);
    }
    fill_shell(row, s, c);
    fill_linearization(row, s);
    if (!s.ok()) return;
    has_result->SetValue(row, 1);
    exceeds->SetValue(row, s.exceeds() ? 1 : 0);
    for (std::size_t k = 0; k < hot_spot.size() && k < s.hot_spot.size(); ++k) hot_spot[k]->SetValue(row, s.hot_spot[k]);
    range->SetValue(row, s.range);
    allowable->SetValue(row, s.allowable);
    utilization->SetValue(row, s.utilization);
    life->SetValue(row, s.life);
    fill_damage(row, s);
    fill_nominal(row, s);
  }
};

// One polyline per toe through its stations (closed loops repeat the first station) and a vertex per station.
void add_station_cells(const Assessment& a, vtkPolyData* data) {
  vtkNew<vtkCellArray> verts, lines;
  vtkIdType next = 0;
  for (const auto& toe : a.toes) {
    const auto n = static_cast<vtkIdType>(toe.stations.size());
    for (vtkIdType i = 0; i < n; ++i) verts->InsertNextCell({next + i});
    if (n >= 2) {
      std::vector<vtkIdType> ids;
      for (vtkIdType i = 0; i < n; ++i) ids.push_back(next + i);
      if (toe.line.closed && n >= 3) ids.push_back(next);
      lines->InsertNextCell(static_cast<vtkIdType>(ids.size()), ids.data());
    }
    next += n;
  }
  data->SetVerts(verts);
  data->SetLines(lines);
}

// ---- readout.vtp ----------------------------------------------------------------------------------------------

struct ReadoutArrays {
  vtkSmartPointer<vtkIntArray> toe, id, is_readout;
  vtkSmartPointer<vtkDoubleArray> distance, outside;
  std::vector<vtkSmartPointer<vtkDoubleArray>> stress;  // one per load step

  ReadoutArrays(const OutputContext& c, vtkPolyData* data)
      : toe(ints(data, kToeNumber)), id(ints(data, kStationId)), is_readout(ints(data, "read-out point [1 = yes]")),
        distance(doubles(data, c.length_name("distance from toe"))),
        outside(doubles(data, c.length_name("distance outside model"))) {
    for (const auto& step : c.a->steps) stress.push_back(doubles(data, normal_stress_name(step)));
  }

  void label(vtkIdType row, int toe_number, int station_id, double distance_out) {
    toe->SetValue(row, toe_number);
    id->SetValue(row, station_id);
    distance->SetValue(row, distance_out);
  }

  void fill_point(vtkIdType row, const ReadoutPoint& p, const OutputContext& c) {
    is_readout->SetValue(row, 1);
    outside->SetValue(row, c.length(p.off_model));
    for (std::size_t k = 0; k < stress.size() && k < p.normal_stress.size(); ++k) stress[k]->SetValue(row, p.normal_stress[k]);
  }
};

vtkIdType count_readout_points(const Assessment& a) {
  vtkIdType n = 0;
  for (const auto& toe : a.toes)
    for (const auto& s : toe.stations) n += static_cast<vtkIdType>(s.points.size() + s.path.size());
  return n;
}

// Fills readout.vtp station by station: the read-out points (vertices), then the walked path (a polyline).
struct ReadoutBuilder {
  const OutputContext& c;
  vtkPoints* points;  // sized to count_readout_points
  ReadoutArrays& arrays;
  vtkNew<vtkCellArray> verts, lines;
  vtkIdType next = 0;

  vtkIdType put(const Vec3& x_mm, int toe_number, int station_id, double distance_mm) {
    points->SetPoint(next, c.length(x_mm.x()), c.length(x_mm.y()), c.length(x_mm.z()));
    arrays.label(next, toe_number, station_id, c.length(distance_mm));
    return next++;
  }

  void add_station(int toe_number, const StationResult& s) {
    for (const auto& p : s.points) {
      const vtkIdType row = put(p.x, toe_number, s.station.id, p.distance);
      verts->InsertNextCell({row});
      arrays.fill_point(row, p, c);
    }
    if (s.path.empty()) return;
    std::vector<vtkIdType> ids;
    double walked = 0.0;  // mm along the path from the station
    for (std::size_t i = 0; i < s.path.size(); ++i) {
      if (i > 0) walked += (s.path[i] - s.path[i - 1]).norm();
      ids.push_back(put(s.path[i], toe_number, s.station.id, walked));
    }
    lines->InsertNextCell(static_cast<vtkIdType>(ids.size()), ids.data());
  }
};

}  // namespace

void write_stations_vtp(const OutputContext& c, const std::string& path) {
  vtkNew<vtkPolyData> data;
  auto points = double_points();
  for (const auto& toe : c.a->toes)
    for (const auto& s : toe.stations) insert_point(points, c, s.station.x);
  data->SetPoints(points);
  StationArrays arrays(c, data);
  vtkIdType row = 0;
  for (std::size_t t = 0; t < c.a->toes.size(); ++t)
    for (const auto& s : c.a->toes[t].stations) arrays.fill(row++, static_cast<int>(t + 1), s, c);
  add_station_cells(*c.a, data);
  data->GetPointData()->SetActiveScalars(kUtilization);
  add_common_fields(c, data);
  vtkNew<vtkXMLPolyDataWriter> writer;
  write_xml(writer, data, path);
}

void write_readout_vtp(const OutputContext& c, const std::string& path) {
  vtkNew<vtkPolyData> data;
  auto points = double_points();
  points->SetNumberOfPoints(count_readout_points(*c.a));
  data->SetPoints(points);
  ReadoutArrays arrays(c, data);
  ReadoutBuilder builder{c, points, arrays, {}, {}, 0};
  for (std::size_t t = 0; t < c.a->toes.size(); ++t)
    for (const auto& s : c.a->toes[t].stations) builder.add_station(static_cast<int>(t + 1), s);
  data->SetVerts(builder.verts);
  data->SetLines(builder.lines);
  add_common_fields(c, data);
  vtkNew<vtkXMLPolyDataWriter> writer;
  write_xml(writer, data, path);
}

}  // namespace toehold::detail
