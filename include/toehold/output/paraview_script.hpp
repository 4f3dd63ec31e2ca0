// view_results.py: a ParaView Python script written into every results folder. It opens the parts of results.pvd,
// colours the stations by utilization, enlarges the stations with utilization > 1 in a flag colour, shows the
// read-out paths and the model, and saves a picture when run with pvbatch. Written for paraview.simple (5.11).
#pragma once

#include <string>

namespace toehold {

// The flag colour of stations with utilization > 1 in the script's picture, RGB 0-255 (magenta), for tests.
inline constexpr int kFlagColour[3] = {255, 0, 255};

// The script's text (Python 3). It finds results.pvd beside itself; `pvbatch view_results.py [picture.png]`
// saves the view to picture.png (default: view_results.png beside the script).
std::string paraview_script_text();

}  // namespace toehold
