#!/usr/bin/python3
"""Write the CalculiX decks of the shell and solid models of one T-joint (units: mm, N, MPa).

The joint: a gusset (attached plate, 8 mm) standing on a pump-skid base plate (10 mm), a 20 mm wide strip (x 0 ...
20) with free edges at x = 0 and x = 20. The base plate spans 200 mm between two line supports (uz = 0 at
y = -100 and y = +100, on its mid-plane); the gusset is pulled up with F = 600 N at its top edge (z = 60), so
the base plate bends across the toe like a beam under a central load. Rigid-body motion is held on the two
symmetry planes of the strip: ux = 0 at the support nodes on x = 10, uy = 0 at the top-edge node on x = 10,
y = 0 (no reaction there: the joint and its load are symmetric about both planes).

  shell_tjoint.inp  S8R shells on the mid-surfaces: base z = 0, gusset y = 0 (z 0 ... 60).
  solid_tjoint.inp  C3D20R bricks: base z -5 ... 5 (4 bricks through the thickness), gusset y -4 ... 4, z 5 ... 60,
                    no weld (the toe is the corner of the gusset face and the base plate's top surface).

Usage: /usr/bin/python3 make_decks.py [out-dir]
"""
import os
import sys

E, NU = 210000.0, 0.3
T_BASE, T_GUSSET = 10.0, 8.0      # mm
WIDTH = 20.0                      # mm, along the toe (x)
SPAN_HALF = 100.0                 # mm, supports at y = +-SPAN_HALF
TOP = 60.0                        # mm, gusset top edge above the base plate's mid-plane
FORCE = 600.0                     # N, total pull on the gusset, +z

# Hexahedron (C3D20R) deck order: corners 1-4 at z0, 5-8 at z1, then the mid-edge nodes of these edges.
HEX20_EDGES = [(0, 1), (1, 2), (2, 3), (3, 0), (4, 5), (5, 6), (6, 7), (7, 4), (0, 4), (1, 5), (2, 6), (3, 7)]
QUAD8_EDGES = [(0, 1), (1, 2), (2, 3), (3, 0)]


def steps(*pieces):
    """A 1D grid from (start, end, count) pieces, joined without repeats."""
    out = []
    for a, b, n in pieces:
        for i in range(n + 1):
            v = a + (b - a) * i / n
            if not out or abs(v - out[-1]) > 1e-9:
                out.append(round(v, 9))
    return out


class Nodes:
    """Nodes keyed by their rounded coordinates: patches that touch share nodes."""

    def __init__(self):
        self.ids, self.xyz = {}, []

    def at(self, p):
        key = tuple(round(c, 6) + 0.0 for c in p)
        if key not in self.ids:
            self.xyz.append(key)
            self.ids[key] = len(self.xyz)
        return self.ids[key]


def mid(a, b):
    return tuple((u + v) / 2 for u, v in zip(a, b))


def quad8(nodes, corners):
    pts = list(corners) + [mid(corners[i], corners[j]) for i, j in QUAD8_EDGES]
    return [nodes.at(p) for p in pts]


def hex20(nodes, corners):
    pts = list(corners) + [mid(corners[i], corners[j]) for i, j in HEX20_EDGES]
    return [nodes.at(p) for p in pts]


def shell_model():
    nodes = Nodes()
    xs = steps((0.0, WIDTH, 2))
    ys = steps((-SPAN_HALF, -28.0, 3), (-28.0, 0.0, 7), (0.0, 28.0, 7), (28.0, SPAN_HALF, 3))
    zs = steps((0.0, 20.0, 5), (20.0, TOP, 3))
    base, gusset = [], []
    for i in range(len(xs) - 1):
        for j in range(len(ys) - 1):  # counter-clockwise seen from +z: normal +z
            x0, x1, y0, y1 = xs[i], xs[i + 1], ys[j], ys[j + 1]
            base.append(quad8(nodes, [(x0, y0, 0), (x1, y0, 0), (x1, y1, 0), (x0, y1, 0)]))
        for k in range(len(zs) - 1):  # (x, z) counter-clockwise: normal x cross z = -y
            x0, x1, z0, z1 = xs[i], xs[i + 1], zs[k], zs[k + 1]
            gusset.append(quad8(nodes, [(x0, 0, z0), (x1, 0, z0), (x1, 0, z1), (x0, 0, z1)]))
    return nodes, base, gusset


def solid_model():
    nodes = Nodes()
    xs = [0.0, WIDTH]
    h = T_BASE / 2
    g = T_GUSSET / 2
    ys = steps((-SPAN_HALF, -24.0, 3), (-24.0, -g, 8), (-g, g, 4), (g, 24.0, 8), (24.0, SPAN_HALF, 3))
    ys = [-SPAN_HALF, -70.0, -45.0] + [y for y in ys if -45.0 < y < 45.0] + [45.0, 70.0, SPAN_HALF]
    zb = steps((-h, h, 4))
    yg = steps((-g, g, 4))
    zg = steps((h, 15.0, 4), (15.0, 25.0, 1), (25.0, 40.0, 1), (40.0, TOP, 1))
    base, gusset = [], []

    def brick(x0, x1, y0, y1, z0, z1):
        return hex20(nodes, [(x0, y0, z0), (x1, y0, z0), (x1, y1, z0), (x0, y1, z0),
                             (x0, y0, z1), (x1, y0, z1), (x1, y1, z1), (x0, y1, z1)])

    for j in range(len(ys) - 1):
        for k in range(len(zb) - 1):
            base.append(brick(xs[0], xs[1], ys[j], ys[j + 1], zb[k], zb[k + 1]))
    for j in range(len(yg) - 1):
        for k in range(len(zg) - 1):
            gusset.append(brick(xs[0], xs[1], yg[j], yg[j + 1], zg[k], zg[k + 1]))
    return nodes, base, gusset


def write_list(out, ids, per_line=16):
    for i in range(0, len(ids), per_line):
        out.append(", ".join(str(n) for n in ids[i:i + per_line]) + ",")


def header_nodes(out, nodes):
    out.append("*NODE, NSET=NALL")
    for n, (x, y, z) in enumerate(nodes.xyz, start=1):
        out.append(f"{n}, {x:.6f}, {y:.6f}, {z:.6f}")


def elements(out, etype, elset, conn, first):
    out.append(f"*ELEMENT, TYPE={etype}, ELSET={elset}")
    for e, c in enumerate(conn, start=first):
        line = [str(e)] + [str(n) for n in c]
        if len(line) > 16:  # a 20-node brick continues on a second line
            out.append(", ".join(line[:16]) + ",")
            out.append(", ".join(line[16:]))
        else:
            out.append(", ".join(line))


def common_bcs(out, nodes, support_z):
    sup = [n for n, p in enumerate(nodes.xyz, 1) if abs(abs(p[1]) - SPAN_HALF) < 1e-6 and abs(p[2] - support_z) < 1e-6]
    pin = [n for n, p in enumerate(nodes.xyz, 1)
           if abs(p[0] - WIDTH / 2) < 1e-6 and abs(p[1]) < 1e-6 and abs(p[2] - TOP) < 1e-6]
    centre = [n for n in sup if abs(nodes.xyz[n - 1][0] - WIDTH / 2) < 1e-6]
    out.append("*NSET, NSET=NSUPPORT")
    write_list(out, sup)
    out.append("*NSET, NSET=NPIN")
    write_list(out, pin)
    out.append("*NSET, NSET=NCENTRE")
    write_list(out, centre)
    out.append("*MATERIAL, NAME=STEEL")
    out.append("*ELASTIC")
    out.append(f"{E:.1f}, {NU}")
    return sup, pin


def boundary(out):
    out.append("*BOUNDARY")
    out.append("NSUPPORT, 3, 3")   # line supports under the base plate's mid-plane
    out.append("NCENTRE, 1, 1")    # rigid-body x and rotation about z, on the strip's symmetry plane x = 10
    out.append("NPIN, 2, 2")       # rigid-body y, on the joint's symmetry plane y = 0


def write_shell(path):
    nodes, base, gusset = shell_model()
    out = ["** shell_tjoint: gusset (8 mm) on a base plate (10 mm), S8R on the mid-surfaces, mm N MPa",
           f"** base z = 0, y -{SPAN_HALF:g} ... {SPAN_HALF:g}; gusset y = 0, z 0 ... {TOP:g}; x 0 ... {WIDTH:g}"]
    header_nodes(out, nodes)
    elements(out, "S8R", "EBASE", base, 1)
    elements(out, "S8R", "EGUSSET", gusset, 1 + len(base))
    common_bcs(out, nodes, 0.0)
    out.append("*SHELL SECTION, ELSET=EBASE, MATERIAL=STEEL")
    out.append(f"{T_BASE}")
    out.append("*SHELL SECTION, ELSET=EGUSSET, MATERIAL=STEEL")
    out.append(f"{T_GUSSET}")
    boundary(out)
    out += ["*STEP", "*STATIC", "*CLOAD"]
    edge = sorted((p[0], n) for n, p in enumerate(nodes.xyz, 1) if abs(p[1]) < 1e-6 and abs(p[2] - TOP) < 1e-6)
    per_edge = FORCE * (WIDTH / 2) / WIDTH   # two element edges of 10 mm along the top
    for x, n in edge:  # consistent forces of a uniform line load on 3-node edges: 1/6, 2/3, 1/6
        on_end = abs(x) < 1e-6 or abs(x - WIDTH) < 1e-6
        corner = abs(x - WIDTH / 2) < 1e-6
        f = per_edge / 6 if on_end else (per_edge / 3 if corner else per_edge * 2 / 3)
        out.append(f"{n}, 3, {f:.6f}")
    out += ["*NODE FILE", "U", "*EL FILE", "S", "*END STEP"]
    with open(path, "w") as f:
        f.write("\n".join(out) + "\n")


def write_solid(path):
    nodes, base, gusset = solid_model()
    out = ["** solid_tjoint: the same joint in C3D20R bricks, no weld, mm N MPa",
           f"** base z -{T_BASE / 2:g} ... {T_BASE / 2:g} (4 bricks), gusset y -{T_GUSSET / 2:g} ... {T_GUSSET / 2:g}, "
           f"z {T_BASE / 2:g} ... {TOP:g}; x 0 ... {WIDTH:g}"]
    header_nodes(out, nodes)
    elements(out, "C3D20R", "EBASE", base, 1)
    elements(out, "C3D20R", "EGUSSET", gusset, 1 + len(base))
    common_bcs(out, nodes, 0.0)
    out.append("*SOLID SECTION, ELSET=EBASE, MATERIAL=STEEL")
    out.append("*SOLID SECTION, ELSET=EGUSSET, MATERIAL=STEEL")
    boundary(out)
    out += ["*STEP", "*STATIC", "*DLOAD"]
    first = 1 + len(base)
    top_layer = [first + e for e, c in enumerate(gusset) if abs(nodes.xyz[c[4] - 1][2] - TOP) < 1e-6]
    pull = FORCE / (WIDTH * T_GUSSET)
    for e in top_layer:   # face 2 = nodes 5-8 (the top); a negative pressure pulls
        out.append(f"{e}, P2, {-pull:.6f}")
    out += ["*EL FILE", "S", "*END STEP"]
    with open(path, "w") as f:
        f.write("\n".join(out) + "\n")


def main():
    where = sys.argv[1] if len(sys.argv) > 1 else "."
    write_shell(os.path.join(where, "shell_tjoint.inp"))
    write_solid(os.path.join(where, "solid_tjoint.inp"))


if __name__ == "__main__":
    main()
