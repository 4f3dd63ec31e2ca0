// The text of view_results.py. It uses only paraview.simple calls present in ParaView 5.9 to 5.12 and guards the
// few property names that changed between versions.
#include "toehold/output/paraview_script.hpp"

namespace toehold {

std::string paraview_script_text() {
  return R"PY(# Written by toehold. Opens the results in this folder in ParaView: the stations coloured by utilization,
# stations with utilization > 1 enlarged in magenta, the read-out paths as dark lines, the model as a faint surface.
#
#   In the ParaView window: View > Python Shell > Run Script, and pick this file.
#   Without a window:       pvbatch view_results.py [picture.png]   (default picture: view_results.png here)
import os
import sys
import xml.etree.ElementTree as ElementTree

from paraview.simple import (ColorBy, GetActiveViewOrCreate, GetColorTransferFunction, GetScalarBar, Render,
                             ResetCamera, SaveScreenshot, Show, Text, Threshold, XMLPolyDataReader,
                             XMLUnstructuredGridReader)

FLAG_COLOUR = [1.0, 0.0, 1.0]  # magenta
UTILIZATION = 'utilization [-]'
EXCEEDS = 'exceeds allowable [1 = yes]'
PICTURE_SIZE = [1280, 1024]


def folder_of_script():
    try:
        return os.path.dirname(os.path.abspath(__file__))
    except NameError:
        return os.getcwd()


def collection_parts(folder):
    """The files results.pvd lists, by file name (model.vtu, stations.vtp, readout.vtp)."""
    root = ElementTree.parse(os.path.join(folder, 'results.pvd')).getroot()
    return {os.path.basename(d.get('file')): os.path.join(folder, d.get('file')) for d in root.iter('DataSet')}


def try_set(proxy, **values):
    """Sets the properties this ParaView version has; names changed between versions."""
    for name, value in values.items():
        try:
            setattr(proxy, name, value)
        except Exception:  # AttributeError, or ParaView's NotSupportedException for a removed property
            pass


def solid(display, colour):
    display.ColorArrayName = ['POINTS', '']
    display.AmbientColor = colour
    display.DiffuseColor = colour


def show_model(path, view):
    model = XMLUnstructuredGridReader(FileName=[path])
    display = Show(model, view)
    display.SetRepresentationType('Surface')
    solid(display, [0.75, 0.75, 0.75])
    display.Opacity = 0.25
    return model, display


def show_paths(path, view):
    readout = XMLPolyDataReader(FileName=[path])
    display = Show(readout, view)
    display.SetRepresentationType('Wireframe')
    solid(display, [0.1, 0.1, 0.1])
    display.LineWidth = 2.0
    display.PointSize = 3.0
    return readout, display


def show_stations(path, view):
    stations = XMLPolyDataReader(FileName=[path])
    display = Show(stations, view)
    display.SetRepresentationType('Points')
    ColorBy(display, ('POINTS', UTILIZATION))
    display.PointSize = 9.0
    try_set(display, RenderPointsAsSpheres=1)
    stations.UpdatePipeline()
    low, high = stations.PointData[UTILIZATION].GetRange()
    lut = GetColorTransferFunction(UTILIZATION)
    lut.ApplyPreset('Cool to Warm', True)
    lut.RescaleTransferFunction(0.0, max(1.0, high if high == high else 1.0))
    display.SetScalarBarVisibility(view, True)
    bar = GetScalarBar(lut, view)
    try_set(bar, Title=UTILIZATION, TitleColor=[0.0, 0.0, 0.0], LabelColor=[0.0, 0.0, 0.0])
    return stations, display


def show_flagged(stations, view):
    """The stations with utilization > 1 (exceeds allowable = 1) as large flat squares in the flag colour."""
    flagged = Threshold(Input=stations)
    flagged.Scalars = ['POINTS', EXCEEDS]
    if hasattr(flagged, 'LowerThreshold'):  # ParaView 5.10 and later
        try_set(flagged, LowerThreshold=0.5, UpperThreshold=1.5, ThresholdMethod='Between')
    else:
        try_set(flagged, ThresholdRange=[0.5, 1.5])
    display = Show(flagged, view)
    display.SetRepresentationType('Points')
    solid(display, FLAG_COLOUR)
    display.PointSize = 24.0
    try_set(display, RenderPointsAsSpheres=0, Ambient=1.0, Diffuse=0.0, Specular=0.0)
    flagged.UpdatePipeline()
    return flagged, display


def show_caption(view, stations, flagged):
    count = stations.GetDataInformation().GetNumberOfPoints()
    exceeding = flagged.GetDataInformation().GetNumberOfPoints()
    caption = Text(Text='toehold: %d stations coloured by utilization; %d with utilization > 1 enlarged in magenta'
                   % (count, exceeding))
    display = Show(caption, view)
    try_set(display, Color=[0.0, 0.0, 0.0], FontSize=14)
    try_set(display, WindowLocation='Upper Left Corner')
    return count, exceeding


def place_camera(view, model_display, stations):
    """Looks down on the stations from above and a little to the side, fitted to the stations and paths."""
    xmin, xmax, ymin, ymax, zmin, zmax = stations.GetDataInformation().GetBounds()
    centre = [(xmin + xmax) / 2, (ymin + ymax) / 2, (zmin + zmax) / 2]
    size = max(xmax - xmin, ymax - ymin, zmax - zmin, 1e-9)
    view.CameraFocalPoint = centre
    view.CameraPosition = [centre[0] + 0.25 * size, centre[1] - 0.6 * size, centre[2] + 1.2 * size]
    view.CameraViewUp = [0.0, 1.0, 0.0]
    model_display.Visibility = 0
    ResetCamera(view)
    model_display.Visibility = 1


def main():
    folder = folder_of_script()
    parts = collection_parts(folder)
    picture = sys.argv[1] if len(sys.argv) > 1 else os.path.join(folder, 'view_results.png')
    view = GetActiveViewOrCreate('RenderView')
    view.ViewSize = PICTURE_SIZE
    try_set(view, UseColorPaletteForBackground=0)
    try_set(view, Background=[1.0, 1.0, 1.0], OrientationAxesVisibility=1)
    _, model_display = show_model(parts['model.vtu'], view)
    show_paths(parts['readout.vtp'], view)
    stations, _ = show_stations(parts['stations.vtp'], view)
    flagged, _ = show_flagged(stations, view)
    count, exceeding = show_caption(view, stations, flagged)
    place_camera(view, model_display, stations)
    Render(view)
    SaveScreenshot(picture, view, ImageResolution=PICTURE_SIZE)
    print('view_results.py: %d stations, %d with utilization > 1; picture %s' % (count, exceeding, picture))


main()
)PY";
}

}  // namespace toehold
