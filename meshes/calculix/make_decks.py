#!/usr/bin/python3
"""Write the CalculiX decks of the small .frd test models (units: mm, N, MPa).

Every model is a box of bricks on a structured grid. Node and element numbers are
sparse on purpose (node = 1000 + 7 * lattice index, element = 101 + 2 * k), so a
reader must map them. Usage: /usr/bin/python3 make_decks.py [out-dir]
"""
import os
import sys

E, NU = 210000.0, 0.3

# Abaqus/CalculiX deck node order of a brick's sub-elements, as (i, j, k) offsets on
# the half-step lattice (2 = one brick). Corners 1-4 at z0, 5-8 at z1.
HEX_CORNERS = [(0, 0, 0), (2, 0, 0), (2, 2, 0), (0, 2, 0), (0, 0, 2), (2, 0, 2), (2, 2, 2), (0, 2, 2)]
HEX20_EDGES = [(0, 1), (1, 2), (2, 3), (3, 0), (4, 5), (5, 6), (6, 7), (7, 4), (0, 4), (1, 5), (2, 6), (3, 7)]
TET_EDGES = [(0, 1), (1, 2), (2, 0), (0, 3), (1, 3), (2, 3)]
WEDGE_EDGES = [(0, 1), (1, 2), (2, 0), (3, 4), (4, 5), (5, 3), (0, 3), (1, 4), (2, 5)]
# Kuhn split of a brick into 6 tets around the diagonal 0-6 (corner numbers as HEX_CORNERS).
KUHN = [(0, 1, 2, 6), (0, 2, 3, 6), (0, 3, 7, 6), (0, 7, 4, 6), (0, 4, 5, 6), (0, 5, 1, 6)]
# Two wedges of a brick, triangles in the xy plane, split along the diagonal 0-2.
WEDGES = [(0, 1, 2, 4, 5, 6), (0, 2, 3, 4, 6, 7)]
# Faces of each element type (deck order) for consistent nodal loads: corners, mid-edge nodes.
FACES = {
    "C3D8": [(0, 1, 2, 3), (4, 5, 6, 7), (0, 1, 5, 4), (1, 2, 6, 5), (2, 3, 7, 6), (3, 0, 4, 7)],
    "C3D20R": [(0, 1, 2, 3), (4, 5, 6, 7), (0, 1, 5, 4), (1, 2, 6, 5), (2, 3, 7, 6), (3, 0, 4, 7)],
    "C3D10": [(0, 1, 2), (0, 1, 3), (1, 2, 3), (2, 0, 3)],
    "C3D6": [(0, 1, 2), (3, 4, 5), (0, 1, 4, 3), (1, 2, 5, 4), (2, 0, 3, 5)],
    "C3D15": [(0, 1, 2), (3, 4, 5), (0, 1, 4, 3), (1, 2, 5, 4), (2, 0, 3, 5)],
}


class Box:
    """A box of nx x ny x nz bricks of size h (mm), origin at 0."""

    def __init__(self, nx, ny, nz, h):
        self.n, self.h = (nx, ny, nz), h
        self.used = {}                      # lattice (i, j, k) -> node number
        self.elements = []                  # (type, material name, [lattice points])

    def node(self, p):
        if p not in self.used:
            i, j, k = p
            nx, ny, _ = self.n
            self.used[p] = 1000 + 7 * (i + (2 * nx + 1) * (j + (2 * ny + 1) * k))
        return self.used[p]

    def xyz(self, p):
        return tuple(self.h * c / 2 for c in p)

    def bricks(self):
        nx, ny, nz = self.n
        for k in range(nz):
            for j in range(ny):
                for i in range(nx):
                    yield i, j, k


def mid(a, b):
    return tuple((u + v) // 2 for u, v in zip(a, b))


def add(box, etype, material, corners, edges):
    pts = list(corners) + [mid(corners[a], corners[b]) for a, b in edges]
    box.elements.append((etype, material, pts))


def brick_corners(i, j, k):
    return [(2 * i + a, 2 * j + b, 2 * k + c) for a, b, c in HEX_CORNERS]


def fill(box, kind, material_of):
    for i, j, k in box.bricks():
        c = brick_corners(i, j, k)
        mat = material_of(i)
        if kind == "C3D20R":
            add(box, kind, mat, c, HEX20_EDGES)
        elif kind == "C3D8":
            add(box, kind, mat, c, [])
        elif kind == "C3D10":
            for t in KUHN:
                add(box, kind, mat, [c[v] for v in t], TET_EDGES)
        elif kind in ("C3D6", "C3D15"):
            for w in WEDGES:
                add(box, kind, mat, [c[v] for v in w], WEDGE_EDGES if kind == "C3D15" else [])
        elif kind == "C3D8+C3D6":      # hexes in even columns, wedge pairs in odd ones
            fill_mixed(box, mat, c, i)


def fill_mixed(box, mat, c, i):
    if i % 2 == 0:
        add(box, "C3D8", mat, c, [])
    else:
        for w in WEDGES:
            add(box, "C3D6", mat, [c[v] for v in w], [])


def face_area(box, pts):
    a, b, c = (box.xyz(p) for p in pts[:3])
    u = [b[m] - a[m] for m in range(3)]
    v = [c[m] - a[m] for m in range(3)]
    cross = (u[1] * v[2] - u[2] * v[1], u[2] * v[0] - u[0] * v[2], u[0] * v[1] - u[1] * v[0])
    area = sum(x * x for x in cross) ** 0.5
    return area if len(pts) == 4 else area / 2


def end_loads(box, traction):
    """Consistent nodal forces (N) of a uniform traction (MPa) in +x on the face x = xmax."""
    xmax = 2 * box.n[0]
    loads = {}
    for etype, _, pts in box.elements:
        for face in FACES[etype]:
            corners = [pts[v] for v in face]
            if any(p[0] != xmax for p in corners):
                continue
            force = traction * face_area(box, corners)
            quadratic = len(pts) in (10, 15, 20)
            mids = [mid(corners[m], corners[(m + 1) % len(corners)]) for m in range(len(corners))]
            share = consistent_shares(len(corners), quadratic)
            for p, s in zip(corners + (mids if quadratic else []), share):
                loads[box.node(p)] = loads.get(box.node(p), 0.0) + s * force
    return loads


def consistent_shares(corners, quadratic):
    """Fractions of the face force on corner nodes, then mid-edge nodes (uniform traction)."""
    if not quadratic:
        return [1.0 / corners] * corners
    if corners == 3:
        return [0.0] * 3 + [1.0 / 3] * 3          # 6-node triangle
    return [-1.0 / 12] * 4 + [1.0 / 3] * 4          # 8-node quadrilateral


def write_mesh(box, out):
    for etype, _, pts in box.elements:
        for p in pts:
            box.node(p)
    out.write("*NODE, NSET=NALL\n")
    for p, n in sorted(box.used.items(), key=lambda t: t[1]):
        out.write("%d, %.6f, %.6f, %.6f\n" % ((n,) + box.xyz(p)))
    groups = {}
    for e, (etype, mat, pts) in enumerate(box.elements):
        groups.setdefault((etype, mat), []).append((101 + 2 * e, pts))
    for (etype, mat), elems in groups.items():
        out.write("*ELEMENT, TYPE=%s, ELSET=E_%s\n" % (etype, mat))
        for number, pts in elems:
            ids = [str(box.node(p)) for p in pts]
            for start in range(0, len(ids), 15):
                line = ", ".join(ids[start:start + 15])
                more = start + 15 < len(ids)
                out.write(("%d, " % number if start == 0 else "") + line + (",\n" if more else "\n"))
    for mat in sorted({m for _, m, _ in box.elements}):
        out.write("*MATERIAL, NAME=%s\n*ELASTIC\n%g, %g\n" % (mat, E, NU))
        out.write("*SOLID SECTION, ELSET=E_%s, MATERIAL=%s\n" % (mat, mat))


def nodes_where(box, test):
    return sorted(n for p, n in box.used.items() if test(p))


def write_nset(out, name, nodes):
    out.write("*NSET, NSET=%s\n" % name)
    for start in range(0, len(nodes), 8):
        out.write(", ".join(str(n) for n in nodes[start:start + 8]) + "\n")


def rollers(box, out):
    """Symmetry planes x = 0, y = 0, z = 0: free lateral contraction, uniform stress."""
    for axis, name in ((0, "NX0"), (1, "NY0"), (2, "NZ0")):
        write_nset(out, name, nodes_where(box, lambda p, a=axis: p[a] == 0))
    out.write("*BOUNDARY\nNX0, 1, 1\nNY0, 2, 2\nNZ0, 3, 3\n")


def static_step(out, loads, first=True):
    out.write("*STEP\n*STATIC\n*CLOAD%s\n" % ("" if first else ", OP=NEW"))
    for n, f in sorted(loads.items()):
        if f != 0.0:
            out.write("%d, 1, %.10g\n" % (n, f))
    out.write("*NODE FILE\nU\n*EL FILE\nS\n*END STEP\n")


def bar20(path):
    """Cantilever bar 50 x 10 x 10, C3D20R, clamped at x = 0, 50 MPa tension at x = 50."""
    box = Box(10, 2, 2, 5.0)
    fill(box, "C3D20R", lambda i: "STEEL_A" if i < 5 else "STEEL_B")
    with open(path, "w") as out:
        out.write("** bar20: 50 x 10 x 10 mm bar, 10 x 2 x 2 C3D20R (5 mm bricks), clamped at x = 0; STEEL_A for x < 25, STEEL_B beyond\n")
        out.write("** uniform traction 50 MPa in +x on x = 50 (F = 5000 N)\n")
        write_mesh(box, out)
        write_nset(out, "NCLAMP", nodes_where(box, lambda p: p[0] == 0))
        out.write("*BOUNDARY\nNCLAMP, 1, 3\n")
        static_step(out, end_loads(box, 50.0))


def uniform_model(path, kind, n, h, steps, title):
    box = Box(*n, h)
    fill(box, kind, lambda i: "STEEL")
    with open(path, "w") as out:
        out.write("** %s\n" % title)
        write_mesh(box, out)
        rollers(box, out)
        for s, traction in enumerate(steps):
            static_step(out, end_loads(box, traction), first=(s == 0))


def main(argv):
    out_dir = argv[1] if len(argv) > 1 else "."
    os.makedirs(out_dir, exist_ok=True)
    p = lambda name: os.path.join(out_dir, name)  # noqa: E731
    bar20(p("bar20.inp"))
    uniform_model(p("block_tet10.inp"), "C3D10", (4, 2, 2), 5.0, [30.0],
                  "block_tet10: 20 x 10 x 10 mm, 96 C3D10, rollers, 30 MPa tension in x")
    uniform_model(p("block_wedge15.inp"), "C3D15", (2, 1, 1), 10.0, [25.0],
                  "block_wedge15: 20 x 10 x 10 mm, 4 C3D15, rollers, 25 MPa tension in x")
    uniform_model(p("steps_hex8.inp"), "C3D8+C3D6", (4, 2, 2), 5.0, [40.0, -20.0],
                  "steps_hex8: 20 x 10 x 10 mm, C3D8 and C3D6, rollers; step 1: 40 MPa, step 2: -20 MPa in x")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
