// The fast base64 stream of src/output/vtk_writing.cpp pinned to VTK's own vtkBase64OutputStream: the same bytes
// for random writes, the RFC 4648 test vectors, and whole .vtu/.vtp files byte-identical to what VTK's writers
// produce with their own stream in the same mode (inline binary, uncompressed, 64-bit headers).
#include "../../src/output/result_files.hpp"
#include "support/support.hpp"

#include <vtkBase64OutputStream.h>
#include <vtkCellArray.h>
#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkFieldData.h>
#include <vtkFloatArray.h>
#include <vtkIdTypeArray.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkOutputStream.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkPolyData.h>
#include <vtkSmartPointer.h>
#include <vtkVariant.h>
#include <vtkStringArray.h>
#include <vtkUnsignedCharArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLPolyDataWriter.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <gtest/gtest.h>

#include <cstddef>
#include <fstream>
#include <random>
#include <sstream>
#include <string>
#include <vector>

namespace toehold::test {
namespace {

// The text `stream` writes for `data` handed over in pieces of the given sizes, one StartWriting/EndWriting.
std::string encoded(vtkOutputStream* stream, const std::vector<unsigned char>& data,
                    const std::vector<std::size_t>& pieces) {
  std::ostringstream out;
  stream->SetStream(&out);
  EXPECT_EQ(stream->StartWriting(), 1);
  std::size_t at = 0;
  for (const std::size_t n : pieces) {
    EXPECT_EQ(stream->Write(data.data() + at, n), 1);
    at += n;
  }
  EXPECT_EQ(stream->EndWriting(), 1);
  stream->SetStream(nullptr);
  return out.str();
}

std::string fast_encoded(const std::string& text) {
  const std::vector<unsigned char> data(text.begin(), text.end());
  return encoded(detail::new_base64_stream(), data, {data.size()});
}

// `total` split into random pieces, small ones (0, 1, 2 bytes) frequent so the pending-byte path is exercised.
std::vector<std::size_t> random_pieces(std::size_t total, std::mt19937& rng) {
  std::vector<std::size_t> pieces;
  std::uniform_int_distribution<int> kind(0, 3);
  while (total > 0) {
    std::size_t n = kind(rng) == 0 ? std::uniform_int_distribution<std::size_t>(0, 2)(rng)
                                   : std::uniform_int_distribution<std::size_t>(1, 70000)(rng);
    n = std::min(n, total);
    pieces.push_back(n);
    total -= n;
  }
  return pieces;
}

std::vector<unsigned char> random_bytes(std::size_t n, std::mt19937& rng) {
  std::vector<unsigned char> bytes(n);
  std::uniform_int_distribution<int> byte(0, 255);
  for (auto& b : bytes) b = static_cast<unsigned char>(byte(rng));
  return bytes;
}

std::string file_text(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream text;
  text << in.rdbuf();
  return text.str();
}

// Field data of `n` random strings (empty ones and bytes beyond ASCII included) named `name`.
void add_random_strings(vtkFieldData* fields, const char* name, std::size_t n, std::mt19937& rng) {
  vtkNew<vtkStringArray> strings;
  strings->SetName(name);
  std::uniform_int_distribution<std::size_t> length(0, 90);
  std::uniform_int_distribution<int> ch(1, 255);
  for (std::size_t i = 0; i < n; ++i) {
    std::string s(length(rng), ' ');
    for (char& c : s) c = static_cast<char>(ch(rng));
    strings->InsertNextValue(s);
  }
  fields->AddArray(strings);
}

// An array `name` of `tuples` x `components` random values in [lo, hi] (in range of the array's value type).
template <class Array>
vtkSmartPointer<Array> random_array(const char* name, vtkIdType tuples, int components, double lo, double hi,
                                    std::mt19937& rng) {
  auto array = vtkSmartPointer<Array>::New();
  array->SetName(name);
  array->SetNumberOfComponents(components);
  array->SetNumberOfTuples(tuples);
  std::uniform_real_distribution<double> value(lo, hi);
  for (vtkIdType i = 0; i < tuples * components; ++i) array->SetVariantValue(i, vtkVariant(value(rng)));
  return array;
}

vtkSmartPointer<vtkPoints> random_points(vtkIdType n, std::mt19937& rng) {
  auto points = vtkSmartPointer<vtkPoints>::New();
  points->SetDataTypeToDouble();
  points->SetNumberOfPoints(n);
  std::uniform_real_distribution<double> x(-500.0, 500.0);
  for (vtkIdType i = 0; i < n; ++i) points->SetPoint(i, x(rng), x(rng), x(rng));
  return points;
}

// Random point, cell and field arrays of several types and widths on `data`.
void add_random_arrays(vtkDataSet* data, std::mt19937& rng) {
  const vtkIdType np = data->GetNumberOfPoints();
  const vtkIdType nc = data->GetNumberOfCells();
  data->GetPointData()->AddArray(random_array<vtkDoubleArray>("stress", np, 6, -900.0, 900.0, rng));
  data->GetPointData()->AddArray(random_array<vtkFloatArray>("displacement [mm]", np, 3, -2.0, 2.0, rng));
  data->GetPointData()->AddArray(random_array<vtkIntArray>("toe number", np, 1, -5.0, 50.0, rng));
  data->GetCellData()->AddArray(random_array<vtkUnsignedCharArray>("region", nc, 1, 0.0, 255.0, rng));
  data->GetCellData()->AddArray(random_array<vtkIdTypeArray>("element id", nc, 1, 0.0, 1.0e9, rng));
  std::uniform_int_distribution<std::size_t> lines(0, 40);
  add_random_strings(data->GetFieldData(), "toehold provenance", lines(rng), rng);
  add_random_strings(data->GetFieldData(), "load steps", lines(rng), rng);
}

// A random grid of `np` points with linear and quadratic tetrahedra on random nodes.
vtkSmartPointer<vtkUnstructuredGrid> random_grid(vtkIdType np, vtkIdType nc, std::mt19937& rng) {
  auto grid = vtkSmartPointer<vtkUnstructuredGrid>::New();
  grid->SetPoints(random_points(np, rng));
  std::uniform_int_distribution<vtkIdType> node(0, np - 1);
  std::bernoulli_distribution quadratic(0.5);
  for (vtkIdType c = 0; c < nc; ++c) {
    const bool q = quadratic(rng);
    std::vector<vtkIdType> ids(q ? 10 : 4);
    for (auto& id : ids) id = node(rng);
    grid->InsertNextCell(q ? VTK_QUADRATIC_TETRA : VTK_TETRA, static_cast<vtkIdType>(ids.size()), ids.data());
  }
  add_random_arrays(grid, rng);
  return grid;
}

// A random polydata of `np` points with vertices and (from two points on) a polyline through all of them.
vtkSmartPointer<vtkPolyData> random_polydata(vtkIdType np, std::mt19937& rng) {
  auto poly = vtkSmartPointer<vtkPolyData>::New();
  poly->SetPoints(random_points(np, rng));
  vtkNew<vtkCellArray> verts;
  for (vtkIdType i = 0; i < np; ++i) verts->InsertNextCell(1, &i);
  poly->SetVerts(verts);
  vtkNew<vtkCellArray> lines;
  std::vector<vtkIdType> ids(static_cast<std::size_t>(np));
  for (vtkIdType i = 0; i < np; ++i) ids[static_cast<std::size_t>(i)] = i;
  if (np >= 2) lines->InsertNextCell(np, ids.data());  // a polyline needs two points
  poly->SetLines(lines);
  add_random_arrays(poly, rng);
  return poly;
}

// Writes `data` with VTK's writer and its own base64 stream in the mode write_xml uses.
template <class Writer>
void write_plain(vtkDataObject* data, const std::string& path) {
  vtkNew<Writer> writer;
  writer->SetInputDataObject(data);
  writer->SetFileName(path.c_str());
  writer->SetDataModeToBinary();
  writer->SetCompressorTypeToNone();
  writer->SetHeaderTypeToUInt64();
  ASSERT_EQ(writer->Write(), 1);
}

template <class Writer>
void expect_same_file(vtkDataObject* data, const TempDir& dir, const std::string& name) {
  const std::string fast = dir.file("fast-" + name);
  const std::string plain = dir.file("plain-" + name);
  vtkNew<Writer> writer;
  detail::write_xml(writer, data, fast);
  write_plain<Writer>(data, plain);
  const std::string fast_text = file_text(fast);
  EXPECT_GT(fast_text.size(), 0u);
  EXPECT_TRUE(fast_text == file_text(plain)) << name << " differs from VTK's own writer";
}

}  // namespace

// RFC 4648 sec. 10 test vectors, from memory [M].
TEST(Base64Stream, EncodesRfc4648TestVectors) {
  EXPECT_EQ(fast_encoded(""), "");
  EXPECT_EQ(fast_encoded("f"), "Zg==");
  EXPECT_EQ(fast_encoded("fo"), "Zm8=");
  EXPECT_EQ(fast_encoded("foo"), "Zm9v");
  EXPECT_EQ(fast_encoded("foob"), "Zm9vYg==");
  EXPECT_EQ(fast_encoded("fooba"), "Zm9vYmE=");
  EXPECT_EQ(fast_encoded("foobar"), "Zm9vYmFy");
}

TEST(Base64Stream, SameBytesAsVtkStreamForRandomPieces) {
  std::mt19937 rng(20261202);
  std::uniform_int_distribution<std::size_t> total(0, 200000);
  for (int trial = 0; trial < 300; ++trial) {
    const std::size_t n = trial < 20 ? static_cast<std::size_t>(trial) : total(rng);
    const std::vector<unsigned char> data = random_bytes(n, rng);
    const std::vector<std::size_t> pieces = random_pieces(n, rng);
    vtkNew<vtkBase64OutputStream> vtk_stream;
    const std::string expected = encoded(vtk_stream, data, pieces);
    ASSERT_EQ(encoded(detail::new_base64_stream(), data, pieces), expected) << "trial " << trial << ", " << n << " bytes";
  }
}

TEST(Base64Stream, SameBytesAsVtkStreamOverSeveralWritingSessions) {
  std::mt19937 rng(7);
  auto fast = detail::new_base64_stream();
  vtkNew<vtkBase64OutputStream> vtk_stream;
  std::ostringstream fast_out;
  std::ostringstream vtk_out;
  fast->SetStream(&fast_out);
  vtk_stream->SetStream(&vtk_out);
  for (std::size_t session = 0; session < 50; ++session) {
    const std::vector<unsigned char> data = random_bytes(session * 37 % 11 + session, rng);
    for (vtkOutputStream* s : {static_cast<vtkOutputStream*>(fast), static_cast<vtkOutputStream*>(vtk_stream)}) {
      s->StartWriting();
      s->Write(data.data(), data.size());
      s->EndWriting();
      *s->GetStream() << '|';  // the writer's own text between two arrays
    }
  }
  EXPECT_EQ(fast_out.str(), vtk_out.str());
}

TEST(ResultXmlWriting, SameFileAsVtkWriterForRandomGrids) {
  std::mt19937 rng(11);
  TempDir dir;
  const vtkIdType sizes[][2] = {{4, 1}, {5, 2}, {97, 31}, {1000, 700}, {7001, 5003}};
  for (const auto& size : sizes) {
    auto grid = random_grid(size[0], size[1], rng);
    expect_same_file<vtkXMLUnstructuredGridWriter>(grid, dir, "grid-" + std::to_string(size[0]) + ".vtu");
  }
}

TEST(ResultXmlWriting, SameFileAsVtkWriterForRandomPolyData) {
  std::mt19937 rng(13);
  TempDir dir;
  for (const vtkIdType n : {1, 2, 3, 64, 2049, 9001}) {
    auto poly = random_polydata(n, rng);
    expect_same_file<vtkXMLPolyDataWriter>(poly, dir, "poly-" + std::to_string(n) + ".vtp");
  }
}

}  // namespace toehold::test
