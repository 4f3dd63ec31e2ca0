#!/usr/bin/python3
"""Convert a CalculiX shell result (.inp deck + .frd) to a shell (mid-surface) .vtu for toehold.

CalculiX expands every shell element into a 20-node brick (8-node shells) before solving and, by default, writes
the .frd on the expanded bricks: three nodes per shell corner node (at -t/2, 0 and +t/2 along the nodal normal),
two per mid-edge node (-t/2 and +t/2), new node numbers, the shell's element numbers. The mid-surface shell
mesh is taken from the deck; each shell node's top and bottom surface stresses are the .frd stresses of its
expanded nodes at +t/2 and -t/2, found by position (see README.md for what was measured).

Output (.vtu, binary, zlib-compressed), points in mm as in the deck (the deck must be in mm):
  cells      the deck's shell elements: S8/S8R -> VTK 23 (quadratic quad), S4/S4R -> VTK 9, S6 -> VTK 22,
             S3 -> VTK 5; node order as in the deck (the same as VTK's for these types)
  point data "stress_top", "stress_bottom": 6 components XX YY ZZ XY YZ XZ (global axes, MPa): the surface at
             +t/2 (top) and -t/2 (bottom) along the cell normal by the right-hand rule on the node order
             "toe": 1 on nodes shared by cells of two or more regions (the plate intersection line), else 0
             "deck node": the deck's node number
  cell data  "thickness" (mm, from *SHELL SECTION), "region" (the number given for the element's ELSET),
             "deck element"

At a node shared by several regions (the intersection line), CalculiX writes one set of expanded nodes per
plate; the .vtu keeps the values of the region named first in --region (the carrying plate).

Usage:
  /usr/bin/python3 frd_to_shell_vtu.py DECK.inp RESULT.frd OUT.vtu --region EBASE=1 --region EGUSSET=2
      [--excerpt FILE --excerpt-line x=10]
--excerpt writes the .frd's own lines (coordinates and STRESS records, verbatim) of the expanded nodes of the
shell nodes on the line AXIS=VALUE, for tests that check the conversion against the solver's text.
"""
import argparse
import sys

import vtk

VTK_TYPES = {"S8": (23, 8), "S8R": (23, 8), "S4": (9, 4), "S4R": (9, 4), "S6": (22, 6), "S3": (5, 3)}
COMPONENTS = ["XX", "YY", "ZZ", "XY", "YZ", "XZ"]  # the .frd's SXX SYY SZZ SXY SYZ SZX, in that order


def fail(message):
    sys.exit("frd_to_shell_vtu: " + message)


# ---- deck -------------------------------------------------------------------------------------------------


def keyword(line):
    """(NAME, {PARAM: value}) of a keyword line '*NAME, P=V, ...'."""
    parts = [p.strip() for p in line[1:].split(",")]
    params = {}
    for p in parts[1:]:
        k, _, v = p.partition("=")
        params[k.strip().upper()] = v.strip()
    return parts[0].upper(), params


def read_deck(path):
    """Nodes {number: (x, y, z)}, shell elements {number: (type, elset, [nodes])}, thickness {elset: t}."""
    nodes, elements, thickness = {}, {}, {}
    mode, params, pending = None, {}, None
    with open(path) as f:
        lines = [l.strip() for l in f if l.strip() and not l.startswith("**")]
    for line in lines:
        if line.startswith("*"):
            mode, params = keyword(line)
            continue
        values = [v.strip() for v in line.split(",") if v.strip()]
        if mode == "NODE":
            nodes[int(values[0])] = tuple(float(v) for v in values[1:4])
        elif mode == "ELEMENT" and params.get("TYPE", "").upper() in VTK_TYPES:
            etype = params["TYPE"].upper()
            need = VTK_TYPES[etype][1]
            conn = pending[2] + [int(v) for v in values] if pending else [int(v) for v in values]
            if len(conn) < need + 1:
                pending = (etype, params.get("ELSET", ""), conn)
                continue
            pending = None
            elements[conn[0]] = (etype, params.get("ELSET", "").upper(), conn[1:need + 1])
        elif mode == "SHELL SECTION":
            thickness[params.get("ELSET", "").upper()] = float(values[0])
            mode = None  # only the first data line holds the thickness
    return nodes, elements, thickness


# ---- .frd ---------------------------------------------------------------------------------------------------


def fixed(line, start, width, count):
    return [line[start + width * k:start + width * (k + 1)] for k in range(count)]


def read_frd(path):
    """Nodes {n: (x, y, z)}, node lines {n: text}, stress {n: [6 values]}, stress lines {n: text}, from the
    first STRESS block. Long format (10-digit numbers), ASCII, as ccx 2.20 writes."""
    nodes, node_lines, stress, stress_lines = {}, {}, {}, {}
    with open(path) as f:
        lines = f.read().splitlines()
    i = 0
    while i < len(lines):
        head = lines[i][:6].strip()
        if head == "2C":
            i += 1
            while lines[i].startswith(" -1"):
                n = int(lines[i][3:13])
                nodes[n] = tuple(float(v) for v in fixed(lines[i], 13, 12, 3))
                node_lines[n] = lines[i]
                i += 1
        elif head.startswith("100C") and not stress and lines[i + 1].split()[1] == "STRESS":
            i += 2
            while lines[i].startswith(" -5"):
                i += 1
            while lines[i].startswith(" -1"):
                n = int(lines[i][3:13])
                stress[n] = [float(v) for v in fixed(lines[i], 13, 12, 6)]
                stress_lines[n] = lines[i]
                i += 1
        else:
            i += 1
    if not stress:
        fail(f"{path} has no STRESS block: ask for it with *EL FILE / S in the deck")
    return nodes, node_lines, stress, stress_lines


# ---- geometry -----------------------------------------------------------------------------------------------


def sub(a, b):
    return [a[k] - b[k] for k in range(3)]


def dot(a, b):
    return sum(a[k] * b[k] for k in range(3))


def cross(a, b):
    return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]]


def unit(a):
    n = dot(a, a) ** 0.5
    return [c / n for c in a]


def cell_normal(corners):
    """Right-hand rule on the corner order: diagonals' cross product (quads), edge cross product (triangles)."""
    if len(corners) == 4:
        return unit(cross(sub(corners[2], corners[0]), sub(corners[3], corners[1])))
    return unit(cross(sub(corners[1], corners[0]), sub(corners[2], corners[0])))


def surface_nodes(x_mid, normal, t, candidates, frd_nodes):
    """The expanded nodes at +t/2 and -t/2 along `normal` from x_mid: (top, bottom). Each must lie within 1 % of
    t of the normal line and within 1 % of t of the offset t/2."""
    found = {}
    for q in candidates:
        d = sub(frd_nodes[q], x_mid)
        h = dot(d, normal)
        lateral = sub(d, [h * c for c in normal])
        if dot(lateral, lateral) ** 0.5 < 0.01 * t and abs(abs(h) - t / 2) < 0.01 * t:
            found.setdefault("top" if h > 0 else "bottom", set()).add(q)
    if any(len(found.get(k, ())) != 1 for k in ("top", "bottom")):
        return None
    return next(iter(found["top"])), next(iter(found["bottom"]))


# ---- conversion ---------------------------------------------------------------------------------------------


def frd_elements(path):
    """{element number: [node numbers]} of the .frd's element block."""
    out, current = {}, None
    with open(path) as f:
        in_block = False
        for line in f:
            if line[:6].strip() == "3C":
                in_block = True
                continue
            if in_block and line.startswith(" -1"):
                current = int(line.split()[1])
                out[current] = []
            elif in_block and line.startswith(" -2"):
                out[current] += [int(v) for v in fixed(line.rstrip("\n"), 3, 10, (len(line.rstrip("\n")) - 3) // 10)]
            elif in_block and line.startswith(" -3"):
                break
    return out


def convert(deck, frd, regions):
    nodes, elements, thickness = read_deck(deck)
    frd_nodes, _, stress, _ = read_frd(frd)
    expanded = frd_elements(frd)
    rank = {name: i for i, (name, _) in enumerate(regions)}
    region_of = dict(regions)
    layer = {}     # shell node -> (rank, top frd node, bottom frd node, cell normal)
    regions_at = {}
    for e, (etype, elset, conn) in sorted(elements.items()):
        if elset not in region_of:
            fail(f"element {e} is in ELSET {elset}, which no --region names")
        if elset not in thickness:
            fail(f"ELSET {elset} has no *SHELL SECTION thickness")
        if e not in expanded:
            fail(f"shell element {e} is not in {frd}: write the default (expanded) output, not OUTPUT=2D")
        t = thickness[elset]
        corners = [nodes[n] for n in conn[:4 if len(conn) in (4, 8) else 3]]
        normal = cell_normal(corners)
        for n in conn:
            regions_at.setdefault(n, set()).add(region_of[elset])
            pair = surface_nodes(nodes[n], normal, t, expanded[e], frd_nodes)
            if pair is None:
                fail(f"no single expanded node at +-t/2 of shell node {n} in element {e}")
            entry = (rank[elset], pair[0], pair[1], normal)
            old = layer.get(n)
            if old is None or entry[0] < old[0]:
                layer[n] = entry
            elif entry[0] == old[0] and (entry[1:3] != old[1:3] or dot(entry[3], old[3]) <= 0):
                fail(f"shell node {n}: cells of one region disagree on its surfaces (flipped normals or a fold)")
    return nodes, elements, thickness, region_of, layer, regions_at, stress


def tensor_array(name, count):
    a = vtk.vtkDoubleArray()
    a.SetName(name)
    a.SetNumberOfComponents(6)
    for k, c in enumerate(COMPONENTS):
        a.SetComponentName(k, c)
    a.SetNumberOfTuples(count)
    return a


def int_array(name, count):
    a = vtk.vtkIntArray()
    a.SetName(name)
    a.SetNumberOfTuples(count)
    return a


def write_vtu(out, nodes, elements, thickness, region_of, layer, regions_at, stress):
    used = sorted({n for _, _, conn in elements.values() for n in conn})
    index = {n: i for i, n in enumerate(used)}
    grid = vtk.vtkUnstructuredGrid()
    points = vtk.vtkPoints()
    points.SetDataTypeToDouble()
    top, bottom = tensor_array("stress_top", len(used)), tensor_array("stress_bottom", len(used))
    toe, deck_node = int_array("toe", len(used)), int_array("deck node", len(used))
    for n in used:
        points.InsertNextPoint(*nodes[n])
        i = index[n]
        top.SetTuple(i, stress[layer[n][1]])
        bottom.SetTuple(i, stress[layer[n][2]])
        toe.SetValue(i, 1 if len(regions_at[n]) > 1 else 0)
        deck_node.SetValue(i, n)
    grid.SetPoints(points)
    ne = len(elements)
    t_arr = vtk.vtkDoubleArray()
    t_arr.SetName("thickness")
    t_arr.SetNumberOfTuples(ne)
    reg, deck_el = int_array("region", ne), int_array("deck element", ne)
    for c, (e, (etype, elset, conn)) in enumerate(sorted(elements.items())):
        ids = vtk.vtkIdList()
        for n in conn:
            ids.InsertNextId(index[n])
        grid.InsertNextCell(VTK_TYPES[etype][0], ids)
        t_arr.SetValue(c, thickness[elset])
        reg.SetValue(c, region_of[elset])
        deck_el.SetValue(c, e)
    for a in (top, bottom, toe, deck_node):
        grid.GetPointData().AddArray(a)
    for a in (t_arr, reg, deck_el):
        grid.GetCellData().AddArray(a)
    w = vtk.vtkXMLUnstructuredGridWriter()
    w.SetFileName(out)
    w.SetInputData(grid)
    w.SetDataModeToAppended()
    w.EncodeAppendedDataOff()
    w.SetCompressorTypeToZLib()
    if w.Write() != 1:
        fail(f"could not write {out}")


def write_excerpt(path, frd, nodes, layer, line_spec):
    axis, _, value = line_spec.partition("=")
    k = "xyz".index(axis.strip().lower())
    v = float(value)
    _, node_lines, _, stress_lines = read_frd(frd)
    rows = ["# frd_to_shell_vtu excerpt: verbatim .frd lines (coordinates, then STRESS SXX SYY SZZ SXY SYZ SZX) of",
            f"# the expanded nodes at +t/2 (top) and -t/2 (bottom) of the shell nodes with {axis} = {value} mm,",
            f"# from {frd.split('/')[-1]}; 'shell N top|bottom' precedes each pair"]
    for n in sorted(layer, key=lambda m: (nodes[m][1], nodes[m][2], nodes[m][0])):
        if abs(nodes[n][k] - v) > 1e-6:
            continue
        for side, q in (("top", layer[n][1]), ("bottom", layer[n][2])):
            rows += [f"shell {n} {side}", node_lines[q], stress_lines[q]]
    with open(path, "w") as f:
        f.write("\n".join(rows) + "\n")


def main():
    p = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    p.add_argument("deck")
    p.add_argument("frd")
    p.add_argument("out")
    p.add_argument("--region", action="append", required=True, help="ELSET=number, carrying plate first")
    p.add_argument("--excerpt")
    p.add_argument("--excerpt-line", default="x=0")
    a = p.parse_args()
    regions = []
    for r in a.region:
        name, _, num = r.partition("=")
        regions.append((name.strip().upper(), int(num)))
    data = convert(a.deck, a.frd, regions)
    write_vtu(a.out, *data)
    if a.excerpt:
        write_excerpt(a.excerpt, a.frd, data[0], data[4], a.excerpt_line)


if __name__ == "__main__":
    main()
