// Shell (mid-surface) model of a base plate with a plate attachment standing on it, for toehold's shell tests.
// Base plate: mid-surface z = 0, x -100..100, y -60..60 (mm). Attachment: mid-surface y = 0, x -50..50,
// z 0..50 (mm), standing on the +z side of the base plate. The two surfaces are fragmented so that the mesh is
// conformal along the intersection line y = 0, z = 0, x -50..50. Quadrilaterals, 10 mm, second order.
SetFactory("OpenCASCADE");
Rectangle(1) = {-100, -60, 0, 200, 120};
Rectangle(2) = {-50, 0, 0, 100, 50};
Rotate {{1, 0, 0}, {0, 0, 0}, Pi/2} { Surface{2}; }
BooleanFragments{ Surface{1}; Delete; }{ Surface{2}; Delete; }
Mesh.MeshSizeMin = 10;
Mesh.MeshSizeMax = 10;
Mesh.RecombineAll = 1;
Mesh.Algorithm = 6;
Mesh.ElementOrder = 2;
Mesh.SecondOrderIncomplete = 1;
Mesh.MaxNumThreads2D = 1;
