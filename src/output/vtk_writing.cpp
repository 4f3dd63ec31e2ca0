// Writing VTK XML files for the results: inline binary (base64 per array), uncompressed, through a base64 stream
// that encodes whole blocks at a time, with VTK's messages captured so a failure becomes one toehold::Error.
#include "result_files.hpp"

#include "toehold/common/error.hpp"

#include <vtkDataObject.h>
#include <vtkFieldData.h>
#include <vtkNew.h>
#include <vtkObjectFactory.h>
#include <vtkOutputStream.h>
#include <vtkOutputWindow.h>
#include <vtkSmartPointer.h>
#include <vtkStringArray.h>
#include <vtkXMLWriter.h>

#include <algorithm>
#include <array>
#include <cstddef>

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

constexpr char kBase64Digits[] = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/";

// The four base64 characters of the bytes `in` (RFC 4648 alphabet, as vtkBase64Utilities); `count` (1, 2 or 3)
// bytes are real, the missing ones are zero and their characters become '=' padding.
void encode_group(const unsigned char* in, std::size_t count, char* out) {
  const unsigned b0 = in[0];
  const unsigned b1 = count > 1 ? in[1] : 0u;
  const unsigned b2 = count > 2 ? in[2] : 0u;
  out[0] = kBase64Digits[b0 >> 2];
  out[1] = kBase64Digits[((b0 & 0x03u) << 4) | (b1 >> 4)];
  out[2] = count > 1 ? kBase64Digits[((b1 & 0x0Fu) << 2) | (b2 >> 6)] : '=';
  out[3] = count > 2 ? kBase64Digits[b2 & 0x3Fu] : '=';
}

// Base64 output stream with the same bytes as vtkBase64OutputStream, which hands every 4 characters to
// std::ostream::write on its own; this one encodes into a buffer and writes it in pieces of kChunk characters.
// Each Write leaves at most 2 bytes pending (to be joined with the next Write or padded by EndWriting) and nothing
// buffered, so the writer may use the underlying stream between calls exactly as with VTK's stream.
class BlockBase64Stream : public vtkOutputStream {
public:
  static BlockBase64Stream* New();
  vtkTypeMacro(BlockBase64Stream, vtkOutputStream)

  int StartWriting() override {
    pending_length_ = 0;
    return vtkOutputStream::StartWriting();
  }
  int Write(void const* data, std::size_t length) override {
    const auto* in = static_cast<const unsigned char*>(data);
    const unsigned char* end = in + length;
    if (pending_length_ > 0) {
      while (pending_length_ < 3 && in != end) pending_[pending_length_++] = *in++;
      if (pending_length_ < 3) return 1;
      encode_group(pending_.data(), 3, out_.data());
      pending_length_ = 0;
      if (!WriteStream(out_.data(), 4)) return 0;
    }
    const std::size_t whole = static_cast<std::size_t>(end - in) / 3 * 3;
    if (!write_groups(in, whole)) return 0;
    for (in += whole; in != end; ++in) pending_[pending_length_++] = *in;
    return 1;
  }
  int EndWriting() override {
    if (pending_length_ == 0) return 1;
    encode_group(pending_.data(), pending_length_, out_.data());
    pending_length_ = 0;
    return WriteStream(out_.data(), 4);
  }

private:
  static constexpr std::size_t kChunk = 4 * 16384;  // characters per write to the stream, a multiple of 4

  // Encodes `length` bytes (a multiple of 3) and writes them.
  bool write_groups(const unsigned char* in, std::size_t length) {
    while (length > 0) {
      const std::size_t bytes = std::min(length, kChunk / 4 * 3);
      for (std::size_t i = 0; i < bytes; i += 3) encode_group(in + i, 3, out_.data() + i / 3 * 4);
      if (!WriteStream(out_.data(), bytes / 3 * 4)) return false;
      in += bytes;
      length -= bytes;
    }
    return true;
  }

  std::array<unsigned char, 3> pending_{};
  std::size_t pending_length_ = 0;
  std::array<char, kChunk> out_{};
};
vtkStandardNewMacro(BlockBase64Stream);

// Reaches vtkXMLWriter's protected SetDataStream for any writer: a pointer to a protected member may be formed in a
// derived class and then applied to the base (C++ [class.protected]); the class is never instantiated.
struct DataStreamAccess : vtkXMLWriter {
  static void set(vtkXMLWriter* writer, vtkOutputStream* stream) {
    (writer->*(&DataStreamAccess::SetDataStream))(stream);
  }
};

}  // namespace

vtkSmartPointer<vtkOutputStream> new_base64_stream() { return vtkSmartPointer<BlockBase64Stream>::New(); }

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
  // Inline binary (base64 per array), not raw appended: the ParaView 5.11 here (Debian's, on the system expat) stops
  // with "not well-formed" inside raw appended data of any file over a few kB, string arrays or not (a known
  // incompatibility of VTK 9.1-9.2's XML parser with newer expat releases); base64 text is plain XML to any parser.
  writer->SetDataModeToBinary();
  DataStreamAccess::set(writer, new_base64_stream());
  writer->SetCompressorTypeToNone();
  writer->SetHeaderTypeToUInt64();
  const int ok = writer->Write();
  const std::string why = keep.error();
  if (ok != 1 || !why.empty())
    throw Error("cannot write result file '" + path + "'" + (why.empty() ? "" : ": " + why) +
                "; check that the output folder is writable and the disk has space");
}

}  // namespace toehold::detail
