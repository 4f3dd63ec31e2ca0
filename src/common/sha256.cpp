// SHA-256 after FIPS 180-4 (2015): constants sec. 4.2.2, initial hash sec. 5.3.3, padding sec. 5.1.1, hash
// computation sec. 6.2.2. Read in the source [S].
#include "toehold/common/sha256.hpp"

#include "toehold/common/error.hpp"

#include <cstring>
#include <fstream>

namespace toehold {
namespace {

constexpr std::array<std::uint32_t, 64> kRound{
    0x428a2f98, 0x71374491, 0xb5c0fbcf, 0xe9b5dba5, 0x3956c25b, 0x59f111f1, 0x923f82a4, 0xab1c5ed5,
    0xd807aa98, 0x12835b01, 0x243185be, 0x550c7dc3, 0x72be5d74, 0x80deb1fe, 0x9bdc06a7, 0xc19bf174,
    0xe49b69c1, 0xefbe4786, 0x0fc19dc6, 0x240ca1cc, 0x2de92c6f, 0x4a7484aa, 0x5cb0a9dc, 0x76f988da,
    0x983e5152, 0xa831c66d, 0xb00327c8, 0xbf597fc7, 0xc6e00bf3, 0xd5a79147, 0x06ca6351, 0x14292967,
    0x27b70a85, 0x2e1b2138, 0x4d2c6dfc, 0x53380d13, 0x650a7354, 0x766a0abb, 0x81c2c92e, 0x92722c85,
    0xa2bfe8a1, 0xa81a664b, 0xc24b8b70, 0xc76c51a3, 0xd192e819, 0xd6990624, 0xf40e3585, 0x106aa070,
    0x19a4c116, 0x1e376c08, 0x2748774c, 0x34b0bcb5, 0x391c0cb3, 0x4ed8aa4a, 0x5b9cca4f, 0x682e6ff3,
    0x748f82ee, 0x78a5636f, 0x84c87814, 0x8cc70208, 0x90befffa, 0xa4506ceb, 0xbef9a3f7, 0xc67178f2};

constexpr std::array<std::uint32_t, 8> kInitial{0x6a09e667, 0xbb67ae85, 0x3c6ef372, 0xa54ff53a,
                                                0x510e527f, 0x9b05688c, 0x1f83d9ab, 0x5be0cd19};

constexpr std::uint32_t rotr(std::uint32_t x, int n) { return (x >> n) | (x << (32 - n)); }
constexpr std::uint32_t big_sigma0(std::uint32_t x) { return rotr(x, 2) ^ rotr(x, 13) ^ rotr(x, 22); }
constexpr std::uint32_t big_sigma1(std::uint32_t x) { return rotr(x, 6) ^ rotr(x, 11) ^ rotr(x, 25); }
constexpr std::uint32_t small_sigma0(std::uint32_t x) { return rotr(x, 7) ^ rotr(x, 18) ^ (x >> 3); }
constexpr std::uint32_t small_sigma1(std::uint32_t x) { return rotr(x, 17) ^ rotr(x, 19) ^ (x >> 10); }
constexpr std::uint32_t choose(std::uint32_t x, std::uint32_t y, std::uint32_t z) { return (x & y) ^ (~x & z); }
constexpr std::uint32_t majority(std::uint32_t x, std::uint32_t y, std::uint32_t z) {
  return (x & y) ^ (x & z) ^ (y & z);
}

// The message schedule W_0..W_63 of one block (sec. 6.2.2 step 1), words read big-endian.
std::array<std::uint32_t, 64> schedule(const std::uint8_t* block) {
  std::array<std::uint32_t, 64> w{};
  for (int t = 0; t < 16; ++t)
    w[t] = static_cast<std::uint32_t>(block[4 * t]) << 24 | static_cast<std::uint32_t>(block[4 * t + 1]) << 16 |
           static_cast<std::uint32_t>(block[4 * t + 2]) << 8 | static_cast<std::uint32_t>(block[4 * t + 3]);
  for (int t = 16; t < 64; ++t) w[t] = small_sigma1(w[t - 2]) + w[t - 7] + small_sigma0(w[t - 15]) + w[t - 16];
  return w;
}

}  // namespace

Sha256::Sha256() : h_(kInitial) {}

void Sha256::compress(const std::uint8_t* block) {
  const std::array<std::uint32_t, 64> w = schedule(block);
  std::array<std::uint32_t, 8> v = h_;  // a, b, c, d, e, f, g, h
  for (int t = 0; t < 64; ++t) {
    const std::uint32_t t1 = v[7] + big_sigma1(v[4]) + choose(v[4], v[5], v[6]) + kRound[t] + w[t];
    const std::uint32_t t2 = big_sigma0(v[0]) + majority(v[0], v[1], v[2]);
    v = {t1 + t2, v[0], v[1], v[2], v[3] + t1, v[4], v[5], v[6]};
  }
  for (int i = 0; i < 8; ++i) h_[i] += v[i];
}

void Sha256::update(std::string_view data) {
  length_ += data.size();
  const auto* bytes = reinterpret_cast<const std::uint8_t*>(data.data());
  std::size_t left = data.size();
  while (left > 0) {
    const std::size_t take = std::min(left, buffer_.size() - buffered_);
    std::memcpy(buffer_.data() + buffered_, bytes, take);
    buffered_ += take;
    bytes += take;
    left -= take;
    if (buffered_ == buffer_.size()) {
      compress(buffer_.data());
      buffered_ = 0;
    }
  }
}

std::array<std::uint8_t, 32> Sha256::finish() {
  const std::uint64_t bits = length_ * 8;
  // Padding (sec. 5.1.1): a one bit, zeros up to 56 bytes mod 64, then the length in bits, big-endian.
  std::string pad(1, '\x80');
  pad.append((buffered_ < 56 ? 55 - buffered_ : 119 - buffered_), '\0');
  for (int i = 7; i >= 0; --i) pad += static_cast<char>((bits >> (8 * i)) & 0xff);
  update(pad);
  std::array<std::uint8_t, 32> digest{};
  for (int i = 0; i < 8; ++i)
    for (int k = 0; k < 4; ++k) digest[4 * i + k] = static_cast<std::uint8_t>((h_[i] >> (24 - 8 * k)) & 0xff);
  *this = Sha256();
  return digest;
}

std::string Sha256::finish_hex() {
  static constexpr char kDigits[] = "0123456789abcdef";
  std::string out;
  for (std::uint8_t byte : finish()) {
    out += kDigits[byte >> 4];
    out += kDigits[byte & 0xf];
  }
  return out;
}

std::string sha256_hex(std::string_view data) {
  Sha256 hash;
  hash.update(data);
  return hash.finish_hex();
}

FileDigest sha256_file(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw Error("cannot open file '" + path + "' to compute its SHA-256; check that it exists and is readable");
  Sha256 hash;
  FileDigest out;
  std::string chunk(1 << 16, '\0');
  while (in) {
    in.read(chunk.data(), static_cast<std::streamsize>(chunk.size()));
    const auto got = static_cast<std::size_t>(in.gcount());
    hash.update(std::string_view(chunk.data(), got));
    out.size_bytes += got;
  }
  if (in.bad()) throw Error("cannot read file '" + path + "' to compute its SHA-256; check the file and the disk");
  out.sha256 = hash.finish_hex();
  return out;
}

}  // namespace toehold
