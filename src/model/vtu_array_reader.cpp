#include "toehold/model/vtu_array_reader.hpp"

#include <algorithm>
#include <bit>
#include <cctype>
#include <cstring>
#include <fstream>
#include <map>

namespace toehold {
namespace {

// The XML header must end within this many bytes (a raw appended header is a few kB per array).
constexpr std::size_t kMaxHeaderBytes = std::size_t{16} << 20;
constexpr std::size_t kChunkBytes = std::size_t{64} << 10;

// One XML tag: <Name a="v" ...>, </Name> or <Name .../>.
struct Tag {
  std::string name;
  std::map<std::string, std::string> attributes;
  bool closing = false;
  bool self_closing = false;
};

// What the header says about one DataArray of the piece's PointData or CellData.
struct ArrayInfo {
  VtuArray array;  // name, where, components, tuples, component names; no values yet
  std::string type;
  std::string format;
  std::uint64_t offset = 0;
};

struct FileInfo {
  std::size_t header_bytes = 4;  // UInt32 or UInt64 byte-count header before each array's data
  bool swap = false;             // file byte order differs from this machine's
  std::int64_t points = -1, cells = -1;
  int pieces = 0;
  bool raw_appended = false;  // <AppendedData encoding="raw">
  std::vector<ArrayInfo> arrays;
};

// Where the first format="ascii" or format="binary" (inline data) appears from `from` on, npos if nowhere.
std::size_t first_inline_format(const std::string& text, std::size_t from) {
  std::size_t first = std::string::npos;
  for (const char* format : {"\"ascii\"", "\"binary\"", "'ascii'", "'binary'"})
    first = std::min(first, text.find(format, from));
  return first;
}

// The file's text up to and including the '_' that opens raw appended data, and that byte's end offset. nullopt
// when there is none within kMaxHeaderBytes, or when inline (ascii/base64) data shows up first.
std::optional<std::pair<std::string, std::uint64_t>> read_header(std::ifstream& in) {
  std::string text;
  std::size_t scanned = 0;
  while (text.size() < kMaxHeaderBytes) {
    const std::size_t old = text.size();
    text.resize(old + kChunkBytes);
    in.read(text.data() + old, static_cast<std::streamsize>(kChunkBytes));
    text.resize(old + static_cast<std::size_t>(in.gcount()));
    const std::size_t tag = text.find("<AppendedData", scanned);
    if (std::min(first_inline_format(text, scanned), tag) != tag) return std::nullopt;
    if (tag != std::string::npos) {
      const std::size_t close = text.find('>', tag);
      std::size_t p = close == std::string::npos ? close : close + 1;
      while (p < text.size() && std::isspace(static_cast<unsigned char>(text[p]))) ++p;
      if (p < text.size()) {
        if (text[p] != '_') return std::nullopt;
        text.resize(p + 1);
        return std::make_pair(text, static_cast<std::uint64_t>(p + 1));
      }
    }
    if (text.size() == old) return std::nullopt;  // end of file
    // Search on from the tag once it is seen (its '>' or the '_' is still to come), else with a small overlap.
    scanned = tag != std::string::npos ? tag : (text.size() > 16 ? text.size() - 16 : 0);
  }
  return std::nullopt;
}

// Replaces the five predefined XML entities; nullopt for any other '&' (character references and the like).
std::optional<std::string> unescape(const std::string& v) {
  static const std::pair<const char*, char> kEntities[] = {
      {"&lt;", '<'}, {"&gt;", '>'}, {"&amp;", '&'}, {"&quot;", '"'}, {"&apos;", '\''}};
  std::string out;
  for (std::size_t i = 0; i < v.size(); ++i) {
    if (v[i] != '&') {
      out += v[i];
      continue;
    }
    bool known = false;
    for (const auto& [entity, c] : kEntities)
      if (v.compare(i, std::strlen(entity), entity) == 0) {
        out += c;
        i += std::strlen(entity) - 1;
        known = true;
        break;
      }
    if (!known) return std::nullopt;
  }
  return out;
}

bool is_name_char(char c) {
  return std::isalnum(static_cast<unsigned char>(c)) || c == '_' || c == ':' || c == '-' || c == '.';
}

void skip_space(const std::string& s, std::size_t& p) {
  while (p < s.size() && std::isspace(static_cast<unsigned char>(s[p]))) ++p;
}

// Parses the attributes of a tag from `p` (after its name) to its '>'.
bool parse_attributes(const std::string& s, std::size_t& p, Tag& tag) {
  for (;;) {
    skip_space(s, p);
    if (p >= s.size()) return false;
    if (s[p] == '>') {
      ++p;
      return true;
    }
    if (s.compare(p, 2, "/>") == 0) {
      p += 2;
      tag.self_closing = true;
      return true;
    }
    const std::size_t start = p;
    while (p < s.size() && is_name_char(s[p])) ++p;
    std::string key = s.substr(start, p - start);
    skip_space(s, p);
    if (key.empty() || p >= s.size() || s[p] != '=') return false;
    ++p;
    skip_space(s, p);
    if (p >= s.size() || (s[p] != '"' && s[p] != '\'')) return false;
    const std::size_t end = s.find(s[p], p + 1);
    if (end == std::string::npos) return false;
    std::optional<std::string> value = unescape(s.substr(p + 1, end - p - 1));
    if (!value || !tag.attributes.emplace(std::move(key), std::move(*value)).second) return false;
    p = end + 1;
  }
}

// Every tag of `s` (declarations, comments and text skipped); nullopt when the markup is not well formed.
std::optional<std::vector<Tag>> parse_tags(const std::string& s) {
  std::vector<Tag> tags;
  std::size_t p = 0;
  while ((p = s.find('<', p)) != std::string::npos) {
    if (s.compare(p, 4, "<!--") == 0) {
      p = s.find("-->", p);
      if (p == std::string::npos) return std::nullopt;
      continue;
    }
    if (s.compare(p, 2, "<?") == 0 || s.compare(p, 2, "<!") == 0) {
      p = s.find('>', p);
      if (p == std::string::npos) return std::nullopt;
      continue;
    }
    Tag tag;
    ++p;
    if (p < s.size() && s[p] == '/') {
      tag.closing = true;
      ++p;
    }
    const std::size_t start = p;
    while (p < s.size() && is_name_char(s[p])) ++p;
    tag.name = s.substr(start, p - start);
    if (tag.name.empty() || !parse_attributes(s, p, tag)) return std::nullopt;
    tags.push_back(std::move(tag));
  }
  return tags;
}

std::string attribute(const Tag& tag, const std::string& key, const std::string& otherwise = "") {
  const auto found = tag.attributes.find(key);
  return found == tag.attributes.end() ? otherwise : found->second;
}

// A non-negative decimal integer, nothing else.
std::optional<std::uint64_t> to_count(const std::string& text) {
  if (text.empty() || text.size() > 18) return std::nullopt;
  std::uint64_t v = 0;
  for (char c : text) {
    if (!std::isdigit(static_cast<unsigned char>(c))) return std::nullopt;
    v = 10 * v + static_cast<std::uint64_t>(c - '0');
  }
  return v;
}

bool read_file_tag(const Tag& tag, FileInfo& info) {
  static const char* kVersions[] = {"0.1", "1.0", "2.0", "2.1", "2.2"};
  const std::string version = attribute(tag, "version", "0.1");
  const std::string order = attribute(tag, "byte_order", "LittleEndian");
  const std::string header = attribute(tag, "header_type", "UInt32");
  if (attribute(tag, "type") != "UnstructuredGrid" || !attribute(tag, "compressor").empty()) return false;
  if (std::none_of(std::begin(kVersions), std::end(kVersions), [&](const char* v) { return version == v; }))
    return false;
  if (order != "LittleEndian" && order != "BigEndian") return false;
  info.swap = (order == "LittleEndian") != (std::endian::native == std::endian::little);
  if (header != "UInt32" && header != "UInt64") return false;
  info.header_bytes = header == "UInt32" ? 4 : 8;
  return true;
}

bool read_piece_tag(const Tag& tag, FileInfo& info) {
  const auto points = to_count(attribute(tag, "NumberOfPoints")), cells = to_count(attribute(tag, "NumberOfCells"));
  if (!points || !cells) return false;
  info.points = static_cast<std::int64_t>(*points);
  info.cells = static_cast<std::int64_t>(*cells);
  return ++info.pieces == 1;
}

bool read_array_tag(const Tag& tag, Association where, FileInfo& info) {
  ArrayInfo a;
  a.array.name = attribute(tag, "Name");
  a.array.where = where;
  a.type = attribute(tag, "type");
  a.format = attribute(tag, "format");
  const auto comps = to_count(attribute(tag, "NumberOfComponents", "1"));
  const auto offset = to_count(attribute(tag, "offset", "0"));
  if (!comps || *comps < 1 || *comps > 1000 || !offset) return false;
  a.array.components = static_cast<int>(*comps);
  a.offset = *offset;
  for (int c = 0; c < a.array.components; ++c)
    a.array.component_names.push_back(attribute(tag, "ComponentName" + std::to_string(c)));
  info.arrays.push_back(std::move(a));
  return true;
}

// Walks the tags, keeping the element path, and fills `info`; false for anything unexpected.
bool describe(const std::vector<Tag>& tags, FileInfo& info) {
  std::vector<std::string> path;
  for (const Tag& tag : tags) {
    if (tag.closing) {
      if (path.empty() || path.back() != tag.name) return false;
      path.pop_back();
      continue;
    }
    const std::string parent = path.empty() ? "" : path.back();
    bool ok = true;
    if (tag.name == "VTKFile") ok = path.empty() && read_file_tag(tag, info);
    else if (tag.name == "Piece" && parent == "UnstructuredGrid") ok = read_piece_tag(tag, info);
    else if (tag.name == "DataArray" && (parent == "PointData" || parent == "CellData") && path.size() == 4)
      ok = read_array_tag(tag, parent == "PointData" ? Association::point : Association::cell, info);
    else if (tag.name == "AppendedData") info.raw_appended = path.size() == 1 && attribute(tag, "encoding") == "raw";
    if (!ok) return false;
    if (!tag.self_closing) path.push_back(tag.name);
  }
  return info.pieces == 1 && info.raw_appended;
}

// The one array called `name`, point data first; nullptr when there is none or the name is repeated there.
const ArrayInfo* find(const FileInfo& info, const std::string& name) {
  for (Association where : {Association::point, Association::cell}) {
    const ArrayInfo* found = nullptr;
    for (const ArrayInfo& a : info.arrays) {
      if (a.array.where != where || a.array.name != name) continue;
      if (found) return nullptr;
      found = &a;
    }
    if (found) return found;
  }
  return nullptr;
}

template <class T>
void swap_bytes(T* values, std::size_t n) {
  auto* bytes = reinterpret_cast<unsigned char*>(values);
  for (std::size_t i = 0; i < n; ++i) std::reverse(bytes + i * sizeof(T), bytes + (i + 1) * sizeof(T));
}

bool read_at(std::ifstream& in, std::uint64_t at, void* out, std::size_t bytes) {
  in.clear();
  in.seekg(static_cast<std::streamoff>(at));
  if (!in) return false;
  in.read(static_cast<char*>(out), static_cast<std::streamsize>(bytes));
  return in.gcount() == static_cast<std::streamsize>(bytes);
}

// Reads the values of `a` (raw appended data starting at byte `data_start`) into `values`.
template <class T>
bool read_values(std::ifstream& in, const FileInfo& info, std::uint64_t data_start, const ArrayInfo& a,
                 std::vector<T>& values) {
  unsigned char header[8] = {};
  if (!read_at(in, data_start + a.offset, header, info.header_bytes)) return false;
  if (info.swap) std::reverse(header, header + info.header_bytes);
  std::uint64_t bytes = 0;
  if (info.header_bytes == 4) {
    std::uint32_t b32 = 0;
    std::memcpy(&b32, header, 4);
    bytes = b32;
  } else {
    std::memcpy(&bytes, header, 8);
  }
  const std::size_t n = a.array.tuples * static_cast<std::size_t>(a.array.components);
  if (bytes != n * sizeof(T)) return false;
  values.resize(n);
  if (!read_at(in, data_start + a.offset + info.header_bytes, values.data(), n * sizeof(T))) return false;
  if (info.swap) swap_bytes(values.data(), n);
  return true;
}

std::optional<VtuArray> read_array(std::ifstream& in, const FileInfo& info, std::uint64_t data_start,
                                   const std::string& name) {
  const ArrayInfo* found = find(info, name);
  if (!found || found->format != "appended") return std::nullopt;
  ArrayInfo a = *found;
  a.array.tuples = static_cast<std::size_t>(a.array.where == Association::point ? info.points : info.cells);
  bool ok = false;
  if (a.type == "Float32") ok = read_values(in, info, data_start, a, a.array.f32);
  else if (a.type == "Float64") ok = read_values(in, info, data_start, a, a.array.f64);
  if (!ok) return std::nullopt;
  return std::move(a.array);
}

}  // namespace

std::optional<std::vector<VtuArray>> read_vtu_arrays(const std::string& path, const std::vector<std::string>& names,
                                                     std::int64_t points, std::int64_t cells) {
  std::ifstream in(path, std::ios::binary);
  if (!in) return std::nullopt;
  const auto header = read_header(in);
  if (!header) return std::nullopt;
  const auto tags = parse_tags(header->first);
  FileInfo info;
  if (!tags || !describe(*tags, info) || info.points != points || info.cells != cells) return std::nullopt;
  std::vector<VtuArray> out;
  for (const std::string& name : names) {
    std::optional<VtuArray> array = read_array(in, info, header->second, name);
    if (!array) return std::nullopt;
    out.push_back(std::move(*array));
  }
  return out;
}

StressArrayView stress_view(const VtuArray& array) {
  StressArrayView v{array.name, array.where, array.components, array.tuples, array.component_names, nullptr, nullptr};
  // An array of no tuples has neither pointer; nothing reads its values.
  if (!array.f32.empty()) v.f32 = array.f32.data();
  if (!array.f64.empty()) v.f64 = array.f64.data();
  return v;
}

}  // namespace toehold
