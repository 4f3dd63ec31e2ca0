#!/usr/bin/python3
"""Reference values for probe_reference_test.cpp, computed by VTK's own vtkProbeFilter.

Usage: probe_reference.py GRID.vtu POINTS.txt OUT.txt [GRID.vtu POINTS.txt OUT.txt ...]
POINTS.txt holds one point per line (x y z, mm). OUT.txt gets one line per point: the probe filter's valid-point
flag (1 found in a cell, 0 not) and the six components of the point array "stress" interpolated there.
"""
import sys

import vtk


def read_points(path):
    points = vtk.vtkPoints()
    points.SetDataTypeToDouble()
    with open(path) as f:
        for line in f:
            if line.strip():
                x, y, z = (float(v) for v in line.split())
                points.InsertNextPoint(x, y, z)
    return points


def probe(grid_path, points_path, out_path):
    reader = vtk.vtkXMLUnstructuredGridReader()
    reader.SetFileName(grid_path)
    reader.Update()
    targets = vtk.vtkPolyData()
    targets.SetPoints(read_points(points_path))
    probe_filter = vtk.vtkProbeFilter()
    probe_filter.SetInputData(targets)
    probe_filter.SetSourceData(reader.GetOutput())
    probe_filter.SetCellLocatorPrototype(vtk.vtkStaticCellLocator())
    probe_filter.Update()
    out = probe_filter.GetOutput()
    stress = out.GetPointData().GetArray("stress")
    valid = out.GetPointData().GetArray(probe_filter.GetValidPointMaskArrayName())
    with open(out_path, "w") as f:
        for i in range(out.GetNumberOfPoints()):
            values = " ".join("%.17g" % stress.GetComponent(i, c) for c in range(6))
            f.write("%d %s\n" % (int(valid.GetTuple1(i)), values))


def main(args):
    if len(args) == 0 or len(args) % 3 != 0:
        sys.exit(__doc__)
    for i in range(0, len(args), 3):
        probe(*args[i:i + 3])


if __name__ == "__main__":
    main(sys.argv[1:])
