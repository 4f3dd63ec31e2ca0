// Writing VTK XML files for the results: binary appended, uncompressed, with VTK's messages captured so a
// failure becomes one toehold::Error and nothing is printed.
#include "result_files.hpp"

#include "toehold/common/error.hpp"

#include <vtkDataObject.h>
#include <vtkFieldData.h>
#include <vtkNew.h>
#include <vtkObjectFactory.h>
#include <vtkOutputWindow.h>
#include <vtkSmartPointer.h>
#include <vtkStringArray.h>
#include <vtkXMLWriter.h>

namespace toehold::detail {
namespace {

// Keeps the first error VTK reports and swallows everything else.
class ErrorKeeper : public vtkOutputWindow {
public:
  static ErrorKeeper* New();
  vtkTypeMacro(ErrorKeeper, vtkOutputWindow)
  void DisplayText(const char*) override {}
  void DisplayErrorText(const char* text) override {
    if (first.empty() && text) first = text;
  }
  void DisplayWarningText(const char*) override {}
  void DisplayGenericWarningText(const char*) override {}
  void DisplayDebugText(const char*) override {}
  std::string first;
};
vtkStandardNewMacro(ErrorKeeper);

// Installs an ErrorKeeper for its lifetime.
class KeepErrors {
public:
  KeepErrors() : previous_(vtkOutputWindow::GetInstance()), keeper_(vtkSmartPointer<ErrorKeeper>::New()) {
    vtkOutputWindow::SetInstance(keeper_);
  }
  ~KeepErrors() { vtkOutputWindow::SetInstance(previous_); }
  KeepErrors(const KeepErrors&) = delete;
  KeepErrors& operator=(const KeepErrors&) = delete;
  // The last line of VTK's first message (the text after the source location), "" when there was none.
  std::string error() const {
    std::string text = keeper_->first;
    while (!text.empty() && (text.back() == '\n' || text.back() == ' ')) text.pop_back();
    const auto object_end = text.rfind("): ");
    if (object_end != std::string::npos) text = text.substr(object_end + 3);
    return text;
  }

private:
  vtkSmartPointer<vtkOutputWindow> previous_;
  vtkSmartPointer<ErrorKeeper> keeper_;
};

}  // namespace

std::string vtk_safe_name(std::string name) {
  for (char& ch : name) {
    switch (ch) {
      case '"': ch = '\''; break;
      case '<': ch = '('; break;
      case '>': ch = ')'; break;
      case '&': ch = '+'; break;
      default: break;
    }
  }
  return name;
}

void add_field_strings(vtkDataObject* data, const std::string& name, const std::vector<std::string>& lines) {
  vtkNew<vtkStringArray> array;
  array->SetName(vtk_safe_name(name).c_str());
  array->SetNumberOfValues(static_cast<vtkIdType>(lines.size()));
  for (std::size_t i = 0; i < lines.size(); ++i) array->SetValue(static_cast<vtkIdType>(i), lines[i]);
  if (!data->GetFieldData()) data->SetFieldData(vtkSmartPointer<vtkFieldData>::New());
  data->GetFieldData()->AddArray(array);
}

void write_xml(vtkXMLWriter* writer, vtkDataObject* data, const std::string& path) {
  KeepErrors keep;
  writer->SetInputDataObject(data);
  writer->SetFileName(path.c_str());
  // Inline binary (base64 per array), not appended: VTK 9.1 writes string field data (the provenance) into appended
  // data at wrong offsets, which VTK 9.1 reads past but ParaView 5.11 refuses as not well-formed XML (seen here).
  writer->SetDataModeToBinary();
  writer->SetCompressorTypeToNone();
  writer->SetHeaderTypeToUInt64();
  const int ok = writer->Write();
  const std::string why = keep.error();
  if (ok != 1 || !why.empty())
    throw Error("cannot write result file '" + path + "'" + (why.empty() ? "" : ": " + why) +
                "; check that the output folder is writable and the disk has space");
}

}  // namespace toehold::detail
