#!/bin/bash
# Writes the shell test models with gmsh (Debian 12 package gmsh 4.8.4) and its own legacy VTK writer.
# quad8: 8-node quadrilaterals (VTK 23); tri6: 6-node triangles (VTK 22), the same geometry unrecombined.
set -euo pipefail
cd "$(dirname "$0")"
gmsh plate_attachment.geo -2 -format vtk -o plate_attachment_quad8.vtk
sed 's/Mesh.RecombineAll = 1;/Mesh.RecombineAll = 0;/' plate_attachment.geo > /tmp/plate_attachment_tri6.geo
gmsh /tmp/plate_attachment_tri6.geo -2 -format vtk -o plate_attachment_tri6.vtk
