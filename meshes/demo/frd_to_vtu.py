#!/usr/bin/python3
"""Convert the CalculiX .frd result of the demo model to VTK (.vtu per step + .pvd).

Reads the ASCII .frd written by ccx 2.20 (nodes, C3D10 elements, DISP and STRESS
blocks of each step), marks the weld-toe nodes and the region of each element, and
writes one binary appended zlib-compressed .vtu per step plus a .pvd collection.

Usage: /usr/bin/python3 frd_to_vtu.py frame_rail.frd [--out-dir DIR] [--stem frame_rail]
"""
import argparse
import os
import sys
import xml.etree.ElementTree as ET

import numpy as np
import vtk
from vtk.util import numpy_support as nps

FRD_TET10 = 6                          # .frd element type of C3D10 (node order equals VTK's)
REGION_OF_MATERIAL = {"STEEL_BASE": 1, "STEEL_ATTACH": 2, "STEEL_WELD": 3}
STRESS_COMPONENTS = ["XX", "YY", "ZZ", "XY", "YZ", "XZ"]   # frd: SXX SYY SZZ SXY SYZ SZX
LEGACY_LIMIT_BYTES = 1_000_000


def fixed_fields(line, count, start=13, width=12):
    """Values of `count` fixed-width E12.5 fields after the ' -1' + I10 record head."""
    return [float(line[start + i * width:start + (i + 1) * width]) for i in range(count)]


class FrdModel:
    """Nodes, tet10 elements, material names and per-step nodal results of one .frd."""

    def __init__(self):
        self.node_ids, self.coords = None, None
        self.elem_nodes, self.elem_mat = None, None
        self.materials = {}                 # material number -> name
        self.steps = {}                     # step number -> {block name: (ids, values)}


def read_nodes(lines, i, model):
    ids, xyz = [], []
    while not lines[i].startswith(" -3"):
        ln = lines[i]
        ids.append(int(ln[3:13]))
        xyz.append(fixed_fields(ln, 3))
        i += 1
    model.node_ids = np.array(ids, dtype=np.int64)
    model.coords = np.array(xyz, dtype=np.float64)
    return i + 1


def read_elements(lines, i, model):
    conn, mats = [], []
    while not lines[i].startswith(" -3"):
        head = lines[i].split()
        etype, mat = int(head[2]), int(head[4])
        if etype != FRD_TET10:
            raise ValueError(f"element {head[1]}: .frd type {etype} is not supported "
                             f"(only C3D10, type {FRD_TET10}); remesh with 10-node tetrahedra")
        nodes = []
        i += 1
        while len(nodes) < 10:
            ln = lines[i]
            nodes += [int(ln[3 + k * 10:13 + k * 10]) for k in range((len(ln.rstrip()) - 3) // 10)]
            i += 1
        conn.append(nodes)
        mats.append(mat)
    model.elem_nodes = np.array(conn, dtype=np.int64)
    model.elem_mat = np.array(mats, dtype=np.int64)
    return i + 1


def read_result(lines, i, model):
    """One '100CL' block; stores (node ids, values) under its step number and name."""
    step = int(lines[i].split()[-2])
    head = lines[i + 1].split()
    name, ncomp = head[1], 0
    i += 2
    while lines[i].startswith(" -5"):
        ncomp += lines[i].split()[1] != "ALL"     # 'ALL' is a derived magnitude, not stored
        i += 1
    ids, vals = [], []
    while not lines[i].startswith(" -3"):
        ln = lines[i]
        ids.append(int(ln[3:13]))
        vals.append(fixed_fields(ln, ncomp))
        i += 1
    model.steps.setdefault(step, {})[name] = (np.array(ids), np.array(vals, dtype=np.float64))
    return i + 1


def read_frd(path):
    with open(path) as f:
        lines = f.read().splitlines()
    model = FrdModel()
    i = 0
    while i < len(lines):
        ln = lines[i]
        key = ln[:7].strip()
        if ln.startswith("    1UMAT"):
            model.materials[int(ln[9:14])] = ln[14:].strip()
            i += 1
        elif key == "2C":
            i = read_nodes(lines, i + 1, model)
        elif key == "3C":
            i = read_elements(lines, i + 1, model)
        elif key == "100CL":
            i = read_result(lines, i, model)
        else:
            i += 1
    if model.coords is None or model.elem_nodes is None:
        raise ValueError(f"{path}: no node or element block found; is this an ASCII .frd?")
    return model


def nodal_array(model, ids, values):
    """Values reordered to the node order of the mesh (missing nodes raise)."""
    index = {int(n): k for k, n in enumerate(model.node_ids)}
    out = np.full((len(model.node_ids), values.shape[1]), np.nan)
    out[[index[int(n)] for n in ids]] = values
    if np.isnan(out).any():
        raise ValueError("a result block does not cover every node of the mesh")
    return out


def toe_marks(coords, toe_y, half_length, tol=1e-4):
    """Int32 per node: 1 on the toe line y = -toe_y, 2 on y = +toe_y (z = 0, |x| <= half_length)."""
    x, y, z = coords.T
    on_line = (np.abs(z) < tol) & (np.abs(x) <= half_length + tol)
    marks = np.zeros(len(coords), dtype=np.int32)
    marks[on_line & (np.abs(y + toe_y) < tol)] = 1
    marks[on_line & (np.abs(y - toe_y) < tol)] = 2
    return marks


def frd_precision(values):
    """Float64 values rounded to float32 precision (7 digits; .frd carries only 6).

    The zero low mantissa bits let zlib compress the Float64 arrays about twice as well.
    """
    return np.asarray(values, dtype=np.float32).astype(np.float64)


def vtk_array(values, name, dtype, components=None):
    arr = nps.numpy_to_vtk(np.ascontiguousarray(values, dtype=dtype), deep=True)
    arr.SetName(name)
    for k, comp in enumerate(components or []):
        arr.SetComponentName(k, comp)
    return arr


def base_grid(model, toe, region):
    """Unstructured grid with points, quadratic tets, 'toe' and 'region'."""
    index = {int(n): k for k, n in enumerate(model.node_ids)}
    conn = np.vectorize(index.get)(model.elem_nodes)
    grid = vtk.vtkUnstructuredGrid()
    points = vtk.vtkPoints()
    points.SetData(vtk_array(frd_precision(model.coords), "Points", np.float64))
    grid.SetPoints(points)
    cells = vtk.vtkCellArray()
    offsets = np.arange(0, 10 * len(conn) + 1, 10, dtype=np.int64)
    cells.SetData(nps.numpy_to_vtkIdTypeArray(offsets, deep=True),
                  nps.numpy_to_vtkIdTypeArray(conn.ravel().astype(np.int64), deep=True))
    cells.ConvertTo32BitStorage()       # Int32 connectivity and offsets: smaller files
    grid.SetCells(vtk.VTK_QUADRATIC_TETRA, cells)
    grid.GetPointData().AddArray(vtk_array(toe, "toe", np.int32))
    grid.GetCellData().AddArray(vtk_array(region, "region", np.int32))
    return grid


def step_grid(model, step, toe, region):
    blocks = model.steps[step]
    for need in ("DISP", "STRESS"):
        if need not in blocks:
            raise ValueError(f"step {step} has no {need} block; request *NODE FILE U and *EL FILE S")
    grid = base_grid(model, toe, region)
    disp = frd_precision(nodal_array(model, *blocks["DISP"])[:, :3])
    stress = frd_precision(nodal_array(model, *blocks["STRESS"]))
    pd = grid.GetPointData()
    pd.AddArray(vtk_array(stress, "stress", np.float64, STRESS_COMPONENTS))
    pd.AddArray(vtk_array(disp, "displacement", np.float64, ["X", "Y", "Z"]))
    return grid


def write_vtu(grid, path):
    w = vtk.vtkXMLUnstructuredGridWriter()
    w.SetFileName(path)
    w.SetInputData(grid)
    w.SetDataModeToAppended()
    w.EncodeAppendedDataOff()
    w.SetCompressorTypeToZLib()
    w.GetCompressor().SetCompressionLevel(9)
    w.SetIdTypeToInt32()
    if not w.Write():
        raise OSError(f"could not write {path}")


def write_pvd(path, vtu_names):
    root = ET.Element("VTKFile", type="Collection", version="0.1", byte_order="LittleEndian")
    coll = ET.SubElement(root, "Collection")
    for k, name in enumerate(vtu_names, start=1):
        ET.SubElement(coll, "DataSet", timestep=str(k), group="", part="0", file=name)
    ET.indent(root)
    ET.ElementTree(root).write(path, xml_declaration=True, encoding="utf-8")


def write_legacy_if_small(grid, path):
    """Binary legacy .vtk; removed again when larger than LEGACY_LIMIT_BYTES."""
    w = vtk.vtkUnstructuredGridWriter()
    w.SetFileName(path)
    w.SetInputData(grid)
    w.SetFileTypeToBinary()
    w.Write()
    size = os.path.getsize(path)
    if size > LEGACY_LIMIT_BYTES:
        os.remove(path)
        return f"legacy {os.path.basename(path)} skipped ({size} bytes > {LEGACY_LIMIT_BYTES})"
    return f"legacy {os.path.basename(path)} written ({size} bytes)"


def regions_of(model):
    names = {num: name.upper() for num, name in model.materials.items()}
    try:
        return np.array([REGION_OF_MATERIAL[names[m]] for m in model.elem_mat], dtype=np.int32)
    except KeyError as err:
        raise ValueError(f"material {err} has no region; name materials "
                         f"{', '.join(REGION_OF_MATERIAL)}") from None


def main(argv=None):
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("frd")
    ap.add_argument("--out-dir", default=".")
    ap.add_argument("--stem", default="frame_rail")
    ap.add_argument("--toe-y", type=float, default=13.0, help="|y| of the toe lines, mm")
    ap.add_argument("--toe-half-length", type=float, default=50.0, help="toe lines span |x| <= this, mm")
    args = ap.parse_args(argv)
    model = read_frd(args.frd)
    toe = toe_marks(model.coords, args.toe_y, args.toe_half_length)
    region = regions_of(model)
    names = []
    for k, step in enumerate(sorted(model.steps)):
        grid = step_grid(model, step, toe, region)
        names.append(f"{args.stem}_{k:03d}.vtu")
        write_vtu(grid, os.path.join(args.out_dir, names[-1]))
        if k == 0:
            print(write_legacy_if_small(grid, os.path.join(args.out_dir, f"{args.stem}_000.vtk")))
    write_pvd(os.path.join(args.out_dir, f"{args.stem}.pvd"), names)
    print(f"nodes {len(model.coords)}, elements {len(model.elem_nodes)}, steps {len(names)}, "
          f"toe nodes side 1: {int((toe == 1).sum())}, side 2: {int((toe == 2).sum())}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
