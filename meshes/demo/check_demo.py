#!/usr/bin/python3
"""Plausibility check of the demo result: toe stress vs far field, per step.

Prints, for each .vtu of frame_rail.pvd: the section-average sigma_yy and the section
moment at y = -45 and +45 mm (50 MPa and -288000 N mm in step 1, -15 MPa and 86400 N mm in
step 2, by equilibrium; sign: moment vector along +x), sigma_yy on the base
plate top at x = 0, the maximum sigma_yy on each toe line, and a type-a hot-spot
value by linear extrapolation from 0.4 t and 1.0 t (t = 12 mm), each divided by the
nominal top-face stress at x = 0 (100 MPa in step 1, -30 MPa in step 2). Units mm, MPa.

Usage: /usr/bin/python3 check_demo.py [frame_rail.pvd]
"""
import os
import sys
import xml.etree.ElementTree as ET

import numpy as np
import vtk
from vtk.util import numpy_support as nps

T = 12.0          # base plate thickness, mm
TOE_Y = 13.0      # |y| of the toe lines, mm
NOMINALS = (100.0, -30.0)  # nominal sigma_yy on the base plate top at x = 0, per step, MPa
YY = 1            # component index of sigma_yy in "stress" (XX YY ZZ XY YZ XZ)


def read(path):
    r = vtk.vtkXMLUnstructuredGridReader()
    r.SetFileName(path)
    r.Update()
    return r.GetOutput()


def probe(grid, pts):
    """Interpolated sigma_yy at the points (n x 3, mm)."""
    vp = vtk.vtkPoints()
    vp.SetData(nps.numpy_to_vtk(np.ascontiguousarray(pts, dtype=np.float64), deep=True))
    poly = vtk.vtkPolyData()
    poly.SetPoints(vp)
    pf = vtk.vtkProbeFilter()
    pf.SetInputData(poly)
    pf.SetSourceData(grid)
    pf.Update()
    out = pf.GetOutput()
    valid = nps.vtk_to_numpy(out.GetPointData().GetArray("vtkValidPointMask"))
    if not valid.all():
        raise RuntimeError(f"{int((valid == 0).sum())} probe points fell outside the mesh")
    return nps.vtk_to_numpy(out.GetPointData().GetArray("stress"))[:, YY]


def section_resultants(grid, y):
    """Mean sigma_yy (MPa) and moment about the mid-plane (N mm, x axis) over the base plate
    cross-section at y (240 x 12 mm), midpoint rule on a 1 x 0.5 mm grid."""
    xs = np.linspace(-120, 120, 241)[:-1] + 0.5
    zs = np.linspace(-T, 0, 25)[:-1] + 0.25
    xx, zz = np.meshgrid(xs, zs)
    pts = np.column_stack([xx.ravel(), np.full(xx.size, y), zz.ravel()])
    syy = probe(grid, pts)
    area = 240.0 * T / syy.size
    return syy.mean(), -(syy * (zz.ravel() + T / 2)).sum() * area


def hot_spot(grid, side, x=0.0):
    """IIW type-a linear extrapolation from 0.4 t and 1.0 t at position x along the toe."""
    y0 = side * TOE_Y
    pts = np.array([[x, y0 + side * 0.4 * T, 0.0], [x, y0 + side * 1.0 * T, 0.0]])
    s04, s10 = probe(grid, pts)
    return 1.67 * s04 - 0.67 * s10, s04, s10


def hot_spot_sweep(grid, side):
    """Largest |hot spot| over x = -49 ... 49 mm along the toe; returns (value, x)."""
    xs = np.linspace(-49.0, 49.0, 99)
    vals = np.array([hot_spot(grid, side, x)[0] for x in xs])
    k = int(np.argmax(np.abs(vals)))
    return vals[k], xs[k]


def report(path, nominal):
    NOMINAL = nominal
    grid = read(path)
    stress = nps.vtk_to_numpy(grid.GetPointData().GetArray("stress"))
    toe = nps.vtk_to_numpy(grid.GetPointData().GetArray("toe"))
    print(f"{os.path.basename(path)}")
    for y in (-45.0, 45.0):
        mean, moment = section_resultants(grid, y)
        print(f"  section at y = {y:+.0f}: mean sigma_yy {mean:8.2f} MPa, "
              f"moment about x {moment:10.0f} N mm")
    line = np.array([[0.0, y, 0.0] for y in (-60, -45, -30, 30, 45, 60)])
    vals = probe(grid, line)
    print("  top surface sigma_yy at x = 0, y = -60 -45 -30 30 45 60:",
          " ".join(f"{v:.1f}" for v in vals))
    for mark, side in ((1, -1), (2, +1)):
        syy = stress[toe == mark, YY]
        hs, s04, s10 = hot_spot(grid, side)
        print(f"  toe {mark} (y = {side * TOE_Y:+.0f}): max nodal sigma_yy {syy.max():7.1f} MPa "
              f"(x {syy.max() / NOMINAL:.2f} nominal); at x=0: s(0.4t) {s04:.1f}, "
              f"s(1.0t) {s10:.1f}, hot spot {hs:.1f} MPa = {hs / NOMINAL:.2f} x nominal")
        peak, x_peak = hot_spot_sweep(grid, side)
        print(f"          largest hot spot along the toe: {peak:.1f} MPa = {peak / NOMINAL:.2f} x nominal "
              f"at x = {x_peak:+.0f} mm")


def main():
    pvd = sys.argv[1] if len(sys.argv) > 1 else "frame_rail.pvd"
    base = os.path.dirname(os.path.abspath(pvd))
    for ds, nominal in zip(ET.parse(pvd).getroot().iter("DataSet"), NOMINALS):
        report(os.path.join(base, ds.get("file")), nominal)


if __name__ == "__main__":
    main()
