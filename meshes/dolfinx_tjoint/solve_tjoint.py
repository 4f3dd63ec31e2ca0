#!/usr/bin/python3
"""Small T-joint (plate + stem, no weld) in linear elasticity with DOLFINx 0.5.

A second, independent solver output for reader tests: written with dolfinx.io.VTKFile,
so it carries that writer's real layout (.pvd -> .pvtu -> piece .vtu, ASCII, Lagrange
cell types, 9-component row-major stress). Units mm, N, MPa. Invented data.

Usage: /usr/bin/python3 solve_tjoint.py [output-dir]
"""
import os
import sys

import gmsh
import numpy as np
import ufl
from dolfinx import fem, io
from dolfinx.io import gmshio
from dolfinx.fem.petsc import LinearProblem
from mpi4py import MPI
from petsc4py import PETSc

# geometry (mm): plate x in [0, 120], y in [0, 60], z in [-10, 0]; stem 10 thick at x = 55..65
PLATE_LX, PLATE_LY, PLATE_T = 120.0, 60.0, 10.0
STEM_X0, STEM_T, STEM_H = 55.0, 10.0, 40.0
SIZE_FINE, SIZE_FAR = 3.0, 9.0        # element size at the stem foot and far away, mm
E_MPA, NU = 210000.0, 0.3
TRACTION_MPA = 100.0                  # tension in x on the plate end face x = PLATE_LX
CLAMPED, LOADED = 1, 2                # facet tags


def build_mesh():
    """gmsh OCC plate + stem, fragmented, first-order tetrahedra."""
    gmsh.initialize()
    gmsh.option.setNumber("General.Terminal", 0)
    gmsh.option.setNumber("General.NumThreads", 1)
    occ = gmsh.model.occ
    plate = occ.addBox(0, 0, -PLATE_T, PLATE_LX, PLATE_LY, PLATE_T)
    stem = occ.addBox(STEM_X0, 0, 0, STEM_T, PLATE_LY, STEM_H)
    occ.fragment([(3, plate)], [(3, stem)])
    occ.synchronize()
    vols = [tag for _, tag in gmsh.model.getEntities(3)]
    gmsh.model.addPhysicalGroup(3, vols, 1)
    for tag, x in ((CLAMPED, 0.0), (LOADED, PLATE_LX)):
        faces = gmsh.model.getEntitiesInBoundingBox(x - 1e-3, -1e-3, -PLATE_T - 1e-3,
                                                    x + 1e-3, PLATE_LY + 1e-3, 1e-3, dim=2)
        gmsh.model.addPhysicalGroup(2, [t for _, t in faces], tag)
    toe_lines = gmsh.model.getEntitiesInBoundingBox(STEM_X0 - 1e-3, -1e-3, -1e-3, STEM_X0 + STEM_T + 1e-3,
                                                    PLATE_LY + 1e-3, 1e-3, dim=1)
    field = gmsh.model.mesh.field
    dist = field.add("Distance")
    field.setNumbers(dist, "CurvesList", [t for _, t in toe_lines])
    thr = field.add("Threshold")
    field.setNumber(thr, "InField", dist)
    for key, val in (("SizeMin", SIZE_FINE), ("SizeMax", SIZE_FAR), ("DistMin", 3.0), ("DistMax", 40.0)):
        field.setNumber(thr, key, val)
    field.setAsBackgroundMesh(thr)
    gmsh.option.setNumber("Mesh.MeshSizeFromPoints", 0)
    gmsh.option.setNumber("Mesh.MeshSizeExtendFromBoundary", 0)
    gmsh.model.mesh.generate(3)
    domain, _, facets = gmshio.model_to_mesh(gmsh.model, MPI.COMM_WORLD, 0, gdim=3)
    gmsh.finalize()
    return domain, facets


def sigma(u):
    mu = E_MPA / (2 * (1 + NU))
    lam = E_MPA * NU / ((1 + NU) * (1 - 2 * NU))
    eps = ufl.sym(ufl.grad(u))
    return 2 * mu * eps + lam * ufl.tr(eps) * ufl.Identity(3)


def solve(domain, facets):
    """P2 displacement; returns (P1 displacement, P1 projected stress)."""
    V = fem.VectorFunctionSpace(domain, ("CG", 2))
    u, v = ufl.TrialFunction(V), ufl.TestFunction(V)
    clamp_dofs = fem.locate_dofs_topological(V, 2, facets.find(CLAMPED))
    bc = fem.dirichletbc(np.zeros(3, dtype=PETSc.ScalarType), clamp_dofs, V)
    ds = ufl.Measure("ds", domain=domain, subdomain_data=facets)
    traction = fem.Constant(domain, PETSc.ScalarType((TRACTION_MPA, 0.0, 0.0)))
    lu = {"ksp_type": "preonly", "pc_type": "lu"}
    uh = LinearProblem(ufl.inner(sigma(u), ufl.grad(v)) * ufl.dx, ufl.dot(traction, v) * ds(LOADED),
                       bcs=[bc], petsc_options=lu).solve()
    W = fem.TensorFunctionSpace(domain, ("CG", 1))
    s, w = ufl.TrialFunction(W), ufl.TestFunction(W)
    stress = LinearProblem(ufl.inner(s, w) * ufl.dx, ufl.inner(sigma(uh), w) * ufl.dx,
                           petsc_options=lu).solve()
    stress.name = "stress"
    u1 = fem.Function(fem.VectorFunctionSpace(domain, ("CG", 1)), name="displacement")
    u1.interpolate(uh)
    return u1, stress


def main():
    out_dir = sys.argv[1] if len(sys.argv) > 1 else os.path.dirname(os.path.abspath(__file__))
    domain, facets = build_mesh()
    u1, stress = solve(domain, facets)
    with io.VTKFile(domain.comm, os.path.join(out_dir, "tjoint.pvd"), "w") as vtk_file:
        vtk_file.write_function([u1, stress], 0.0)
    cells = domain.topology.index_map(3).size_global
    nodes = domain.geometry.x.shape[0]
    sxx = stress.x.array.reshape(-1, 9)[:, 0]
    print(f"cells {cells}, nodes {nodes}, stress xx min {sxx.min():.1f} max {sxx.max():.1f} MPa")


if __name__ == "__main__":
    main()
