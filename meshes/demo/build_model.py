#!/usr/bin/python3
"""Build the toehold demo model: geometry and mesh with gmsh (OCC), CalculiX deck.

Scenario: a longitudinal attachment plate fillet-welded onto the base plate of a
conveyor drive frame side rail (invented for the demo, see README.md).
Units: mm, N, MPa. Writes frame_rail.inp (CalculiX input deck, C3D10 elements).

Usage: /usr/bin/python3 build_model.py [output.inp]
"""
import sys

import gmsh
import numpy as np

# ---- geometry (mm); z = 0 is the base plate top face -------------------------
BASE_LX, BASE_LY, BASE_T = 240.0, 160.0, 12.0   # base plate x, y extent, thickness
ATT_LX, ATT_T, ATT_H = 100.0, 10.0, 50.0        # attachment length (x), thickness (y), height (z)
LEG = 8.0                                       # fillet weld leg length (both legs)
TOE_Y = ATT_T / 2.0 + LEG                       # weld toe lines at y = -TOE_Y, +TOE_Y, z = 0

# ---- mesh sizes (mm) ---------------------------------------------------------
SIZE_TOE = 2.5        # element size at the weld toes and weld faces
SIZE_FAR = 14.0       # element size far from the attachment
DIST_FINE = 6.0       # distance from the toe lines kept at SIZE_TOE
DIST_COARSE = 50.0    # distance at which SIZE_FAR is reached

# ---- material and loads -------------------------------------------------------
E_MPA, NU = 210000.0, 0.3
# Two load steps of the drive frame's duty: the loaded end carries a force in y and a moment about x together.
# Nominal stress on the base plate top face = F / (b t) + 6 |M| / (b t^2), b = 240 mm, t = 12 mm.
# The belt pulls off-centre while running: a moment about z adds 6 Mz / (t b^2) = +-20 MPa at x = +-120 mm.
RUNNING = (144000.0, -288000.0, 2304000.0)  # step 1 "drive running": 50 + 50 MPa on top, +-20 MPa in-plane
BRAKING = (-43200.0, 86400.0, 0.0)          # step 2 "drive braking": -15 - 15 = -30 MPa on top

REGIONS = {"BASE": 1, "ATTACH": 2, "WELD": 3}   # physical volume tags = "region" values


def weld_prism(side):
    """Triangular weld prism along x on the attachment side y = side * ATT_T / 2."""
    y0 = side * ATT_T / 2.0
    occ = gmsh.model.occ
    x0 = -ATT_LX / 2.0
    p1 = occ.addPoint(x0, y0, 0.0)
    p2 = occ.addPoint(x0, y0 + side * LEG, 0.0)
    p3 = occ.addPoint(x0, y0, LEG)
    loop = occ.addCurveLoop([occ.addLine(p1, p2), occ.addLine(p2, p3), occ.addLine(p3, p1)])
    surf = occ.addPlaneSurface([loop])
    out = occ.extrude([(2, surf)], ATT_LX, 0.0, 0.0)
    return [tag for dim, tag in out if dim == 3][0]


def build_geometry():
    """Create and fragment the four volumes; return {region name: [volume tags]}."""
    occ = gmsh.model.occ
    base = occ.addBox(-BASE_LX / 2, -BASE_LY / 2, -BASE_T, BASE_LX, BASE_LY, BASE_T)
    att = occ.addBox(-ATT_LX / 2, -ATT_T / 2, 0.0, ATT_LX, ATT_T, ATT_H)
    weld_neg, weld_pos = weld_prism(-1), weld_prism(+1)
    tools = [(3, att), (3, weld_neg), (3, weld_pos)]
    _, out_map = occ.fragment([(3, base)], tools)
    occ.synchronize()
    owners = {"BASE": out_map[0], "ATTACH": out_map[1], "WELD": out_map[2] + out_map[3]}
    return {name: [tag for dim, tag in ents if dim == 3] for name, ents in owners.items()}


def toe_curves():
    """Curves of the two weld toe lines (base plate top, y = +-TOE_Y)."""
    curves = []
    for side in (-1, 1):
        y = side * TOE_Y
        eps = 1e-3
        found = gmsh.model.getEntitiesInBoundingBox(
            -ATT_LX / 2 - eps, y - eps, -eps, ATT_LX / 2 + eps, y + eps, eps, dim=1)
        curves += [tag for _, tag in found]
    if len(curves) != 2:
        raise RuntimeError(f"expected 2 weld toe curves, found {len(curves)}")
    return curves


def weld_surfaces(volumes):
    """All boundary surfaces of the weld and attachment volumes (kept fine near the weld)."""
    ents = [(3, v) for v in volumes["WELD"]]
    return [tag for _, tag in gmsh.model.getBoundary(ents, oriented=False)]


def set_mesh_size(volumes):
    """Fine mesh at the toe lines and weld faces, growing away from them."""
    field = gmsh.model.mesh.field
    dist_toe = field.add("Distance")
    field.setNumbers(dist_toe, "CurvesList", toe_curves())
    field.setNumber(dist_toe, "NumPointsPerCurve", 200)
    thr_toe = field.add("Threshold")
    field.setNumber(thr_toe, "InField", dist_toe)
    field.setNumber(thr_toe, "SizeMin", SIZE_TOE)
    field.setNumber(thr_toe, "SizeMax", SIZE_FAR)
    field.setNumber(thr_toe, "DistMin", DIST_FINE)
    field.setNumber(thr_toe, "DistMax", DIST_COARSE)
    dist_weld = field.add("Distance")
    field.setNumbers(dist_weld, "SurfacesList", weld_surfaces(volumes))
    field.setNumber(dist_weld, "NumPointsPerCurve", 40)
    thr_weld = field.add("Threshold")
    field.setNumber(thr_weld, "InField", dist_weld)
    field.setNumber(thr_weld, "SizeMin", 1.4 * SIZE_TOE)
    field.setNumber(thr_weld, "SizeMax", SIZE_FAR)
    field.setNumber(thr_weld, "DistMin", 2.0)
    field.setNumber(thr_weld, "DistMax", DIST_COARSE)
    fmin = field.add("Min")
    field.setNumbers(fmin, "FieldsList", [thr_toe, thr_weld])
    field.setAsBackgroundMesh(fmin)
    gmsh.option.setNumber("Mesh.MeshSizeExtendFromBoundary", 0)
    gmsh.option.setNumber("Mesh.MeshSizeFromPoints", 0)
    gmsh.option.setNumber("Mesh.MeshSizeFromCurvature", 0)


def mesh_model(volumes):
    """Physical volumes, second-order tetrahedral mesh."""
    for name, tags in volumes.items():
        gmsh.model.addPhysicalGroup(3, tags, REGIONS[name])
        gmsh.model.setPhysicalName(3, REGIONS[name], name)
    set_mesh_size(volumes)
    gmsh.option.setNumber("Mesh.Algorithm3D", 1)        # Delaunay
    gmsh.option.setNumber("Mesh.ElementOrder", 2)
    gmsh.option.setNumber("Mesh.SecondOrderLinear", 1)  # mid-edge nodes on straight edges
    gmsh.option.setNumber("Mesh.Optimize", 1)
    gmsh.model.mesh.generate(3)


def collect_mesh():
    """Nodes (renumbered 1..n) and C3D10 connectivity per region."""
    tags, coords, _ = gmsh.model.mesh.getNodes()
    coords = coords.reshape(-1, 3)
    elems = {}
    used = set()
    for name, reg in REGIONS.items():
        conn = []
        for vol in gmsh.model.getEntitiesForPhysicalGroup(3, reg):
            etypes, _, enodes = gmsh.model.mesh.getElements(3, vol)
            for et, en in zip(etypes, enodes):
                if et != 11:
                    raise RuntimeError(f"unexpected gmsh element type {et} in volume {vol}")
                conn.append(en.reshape(-1, 10))
        conn = np.vstack(conn)
        # gmsh tet10 -> CalculiX C3D10: swap the last two mid-edge nodes (edges 2-3 and 1-3)
        elems[name] = conn[:, [0, 1, 2, 3, 4, 5, 6, 7, 9, 8]]
        used.update(conn.ravel().tolist())
    keep = np.array(sorted(used), dtype=np.int64)
    order = {int(t): i for i, t in enumerate(tags)}
    xyz = coords[[order[int(t)] for t in keep]]
    renum = {int(t): i + 1 for i, t in enumerate(keep)}
    elems = {k: np.vectorize(renum.get)(v) for k, v in elems.items()}
    return xyz, elems


def check_elements(xyz, elems):
    """Positive volume and mid-edge nodes at the CalculiX edge midpoints."""
    edges = [(0, 1), (1, 2), (2, 0), (0, 3), (1, 3), (2, 3)]
    for name, conn in elems.items():
        p = xyz[conn - 1]
        vol = np.einsum("ij,ij->i", np.cross(p[:, 1] - p[:, 0], p[:, 2] - p[:, 0]), p[:, 3] - p[:, 0])
        if (vol <= 0).any():
            raise RuntimeError(f"{name}: {int((vol <= 0).sum())} tetrahedra with non-positive volume")
        for k, (a, b) in enumerate(edges):
            off = np.abs(p[:, 4 + k] - 0.5 * (p[:, a] + p[:, b])).max()
            if off > 1e-9:
                raise RuntimeError(f"{name}: mid-edge node {4 + k} is {off} mm off its edge midpoint")


def node_set(xyz, axis, value):
    """1-based ids of nodes on the plane coordinate[axis] == value."""
    return np.nonzero(np.abs(xyz[:, axis] - value) < 1e-6)[0] + 1


def write_ids(f, ids, per_line=10):
    for i in range(0, len(ids), per_line):
        f.write(", ".join(str(int(n)) for n in ids[i:i + per_line]) + ",\n")


def write_deck(path, xyz, elems):
    """CalculiX deck: mesh, sets, material, two static steps."""
    n_nodes = len(xyz)
    ref, rot = n_nodes + 1, n_nodes + 2
    fixed = node_set(xyz, 1, -BASE_LY / 2)
    loaded = node_set(xyz, 1, +BASE_LY / 2)
    with open(path, "w") as f:
        f.write("** toehold demo: frame side rail with a fillet-welded longitudinal attachment\n")
        f.write("** units mm, N, MPa; generated by build_model.py, invented data for the demo only\n")
        f.write("*NODE, NSET=NALL\n")
        for i, (x, y, z) in enumerate(xyz, start=1):
            f.write(f"{i}, {x:.9g}, {y:.9g}, {z:.9g}\n")
        f.write(f"*NODE\n{ref}, 0, {BASE_LY / 2:g}, {-BASE_T / 2:g}\n{rot}, 0, {BASE_LY / 2:g}, {-BASE_T / 2:g}\n")
        eid = 1
        for name in REGIONS:
            f.write(f"*ELEMENT, TYPE=C3D10, ELSET={name}\n")
            for row in elems[name]:
                f.write(f"{eid}, " + ", ".join(str(int(n)) for n in row) + "\n")
                eid += 1
        f.write("*NSET, NSET=FIXED_END\n")
        write_ids(f, fixed)
        f.write("*NSET, NSET=LOADED_END\n")
        write_ids(f, loaded)
        for name in REGIONS:
            # one material per region so that the .frd material number carries the region
            f.write(f"*MATERIAL, NAME=STEEL_{name}\n*ELASTIC\n{E_MPA:g}, {NU:g}\n")
            f.write(f"*SOLID SECTION, ELSET={name}, MATERIAL=STEEL_{name}\n")
        f.write(f"*RIGID BODY, NSET=LOADED_END, REF NODE={ref}, ROT NODE={rot}\n")
        f.write("*BOUNDARY\nFIXED_END, 1, 3\n")
        for title, (force, moment, moment_z) in (("step 1: drive running", RUNNING),
                                                 ("step 2: drive braking", BRAKING)):
            write_step(f, title, f"{ref}, 2, {force:g}\n{rot}, 1, {moment:g}\n{rot}, 3, {moment_z:g}")


def write_step(f, title, cload):
    f.write(f"** {title}\n*STEP\n*STATIC\n*CLOAD, OP=NEW\n{cload}\n")
    f.write("*NODE FILE\nU\n*EL FILE\nS\n*END STEP\n")


def main():
    out = sys.argv[1] if len(sys.argv) > 1 else "frame_rail.inp"
    gmsh.initialize()
    gmsh.option.setNumber("General.Terminal", 1)
    gmsh.option.setNumber("General.NumThreads", 1)   # deterministic mesh
    gmsh.model.add("frame_rail")
    volumes = build_geometry()
    mesh_model(volumes)
    xyz, elems = collect_mesh()
    gmsh.finalize()
    check_elements(xyz, elems)
    write_deck(out, xyz, elems)
    n_el = sum(len(v) for v in elems.values())
    print(f"nodes {len(xyz)}, C3D10 elements {n_el} "
          + ", ".join(f"{k} {len(v)}" for k, v in elems.items()))


if __name__ == "__main__":
    main()
