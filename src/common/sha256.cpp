// SHA-256 after FIPS 180-4 (2015): constants sec. 4.2.2, initial hash sec. 5.3.3, padding sec. 5.1.1, hash
// computation sec. 6.2.2. Read in the source [S]. Two compressions of the same sec. 6.2.2: portable C++, and the x86
// SHA extensions (Intel SHA extensions white paper, 2013: SHA256RNDS2 does two rounds on the state held as ABEF and
// CDGH, SHA256MSG1/MSG2 the message schedule), chosen once at run time.
#include "toehold/common/sha256.hpp"

#include "toehold/common/error.hpp"

#include <algorithm>
#include <cstring>
#include <fstream>
#include <vector>

#if defined(__x86_64__)
#include <immintrin.h>
#endif

namespace toehold {
namespace {

alignas(16) constexpr std::array<std::uint32_t, 64> kRound{
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

constexpr std::size_t kBlockBytes = 64;

constexpr std::uint32_t rotr(std::uint32_t x, int n) { return (x >> n) | (x << (32 - n)); }
constexpr std::uint32_t big_sigma0(std::uint32_t x) { return rotr(x, 2) ^ rotr(x, 13) ^ rotr(x, 22); }
constexpr std::uint32_t big_sigma1(std::uint32_t x) { return rotr(x, 6) ^ rotr(x, 11) ^ rotr(x, 25); }
constexpr std::uint32_t small_sigma0(std::uint32_t x) { return rotr(x, 7) ^ rotr(x, 18) ^ (x >> 3); }
constexpr std::uint32_t small_sigma1(std::uint32_t x) { return rotr(x, 17) ^ rotr(x, 19) ^ (x >> 10); }
// Ch and Maj of sec. 4.1.2 in equivalent forms with one operation fewer: Ch picks y where x is set and z elsewhere;
// Maj is set where at least two of x, y, z are.
constexpr std::uint32_t choose(std::uint32_t x, std::uint32_t y, std::uint32_t z) { return z ^ (x & (y ^ z)); }
constexpr std::uint32_t majority(std::uint32_t x, std::uint32_t y, std::uint32_t z) {
  return (x & y) | (z & (x | y));
}

std::uint32_t load_big_endian(const std::uint8_t* p) {
  return static_cast<std::uint32_t>(p[0]) << 24 | static_cast<std::uint32_t>(p[1]) << 16 |
         static_cast<std::uint32_t>(p[2]) << 8 | static_cast<std::uint32_t>(p[3]);
}

// K_t + W_t for t = 0..63 of one block: the message schedule of sec. 6.2.2 step 1, words read big-endian.
std::array<std::uint32_t, 64> scheduled_sums(const std::uint8_t* block) {
  std::array<std::uint32_t, 64> w;
  for (int t = 0; t < 16; ++t) w[t] = load_big_endian(block + 4 * t);
  for (int t = 16; t < 64; ++t) w[t] = small_sigma1(w[t - 2]) + w[t - 7] + small_sigma0(w[t - 15]) + w[t - 16];
  for (int t = 0; t < 64; ++t) w[t] += kRound[t];
  return w;
}

// One round of sec. 6.2.2 step 3 on the working variables a..h. Instead of shifting the eight values, the caller
// renames them: afterwards `h` holds the new a and `d` the new e. `kw` = K_t + W_t.
inline void sha_round(std::uint32_t a, std::uint32_t b, std::uint32_t c, std::uint32_t& d, std::uint32_t e,
                  std::uint32_t f, std::uint32_t g, std::uint32_t& h, std::uint32_t kw) {
  const std::uint32_t t1 = h + big_sigma1(e) + choose(e, f, g) + kw;
  d += t1;
  h = t1 + big_sigma0(a) + majority(a, b, c);
}

void compress_block_portable(std::array<std::uint32_t, 8>& state, const std::uint8_t* block) {
  const std::array<std::uint32_t, 64> kw = scheduled_sums(block);
  std::uint32_t a = state[0], b = state[1], c = state[2], d = state[3];
  std::uint32_t e = state[4], f = state[5], g = state[6], h = state[7];
  for (int t = 0; t < 64; t += 8) {  // eight rounds bring the names back to where they started
    sha_round(a, b, c, d, e, f, g, h, kw[t]);
    sha_round(h, a, b, c, d, e, f, g, kw[t + 1]);
    sha_round(g, h, a, b, c, d, e, f, kw[t + 2]);
    sha_round(f, g, h, a, b, c, d, e, kw[t + 3]);
    sha_round(e, f, g, h, a, b, c, d, kw[t + 4]);
    sha_round(d, e, f, g, h, a, b, c, kw[t + 5]);
    sha_round(c, d, e, f, g, h, a, b, kw[t + 6]);
    sha_round(b, c, d, e, f, g, h, a, kw[t + 7]);
  }
  state[0] += a, state[1] += b, state[2] += c, state[3] += d;
  state[4] += e, state[5] += f, state[6] += g, state[7] += h;
}

#if defined(__x86_64__)

// Message words W_4g..W_4g+3 of group g >= 4 from the four previous groups, held in the ring `m` (slot g % 4 holds
// group g - 4 on entry, group g on return): W_t = sigma1(W_t-2) + W_t-7 + sigma0(W_t-15) + W_t-16 (sec. 6.2.2).
__attribute__((target("sha,sse4.1"))) inline void next_message_group(__m128i* m, int g) {
  const __m128i older = _mm_sha256msg1_epu32(m[g & 3], m[(g + 1) & 3]);         // W_t-16 + sigma0(W_t-15)
  const __m128i with_t7 = _mm_add_epi32(older, _mm_alignr_epi8(m[(g + 3) & 3], m[(g + 2) & 3], 4));  // + W_t-7
  m[g & 3] = _mm_sha256msg2_epu32(with_t7, m[(g + 3) & 3]);                      // + sigma1(W_t-2)
}

// Sixty-four rounds on one block; `abef` and `cdgh` are the working variables in the order SHA256RNDS2 wants.
__attribute__((target("sha,sse4.1"))) inline void rounds_sha_ni(__m128i& abef, __m128i& cdgh,
                                                                 const std::uint8_t* block) {
  const __m128i byte_swap = _mm_set_epi64x(0x0c0d0e0f08090a0bLL, 0x0405060700010203LL);  // big-endian words
  __m128i m[4];
#pragma GCC unroll 16
  for (int g = 0; g < 16; ++g) {
    if (g < 4)
      m[g] = _mm_shuffle_epi8(_mm_loadu_si128(reinterpret_cast<const __m128i*>(block + 16 * g)), byte_swap);
    else
      next_message_group(m, g);
    const __m128i kw = _mm_add_epi32(m[g & 3], _mm_load_si128(reinterpret_cast<const __m128i*>(&kRound[4 * g])));
    cdgh = _mm_sha256rnds2_epu32(cdgh, abef, kw);                          // rounds 4g, 4g + 1
    abef = _mm_sha256rnds2_epu32(abef, cdgh, _mm_shuffle_epi32(kw, 0x0e));  // rounds 4g + 2, 4g + 3
  }
}

__attribute__((target("sha,sse4.1"))) void compress_sha_ni(std::array<std::uint32_t, 8>& h,
                                                           const std::uint8_t* blocks, std::size_t count) {
  // H0..H3 and H4..H7 (lane 0 first) rearranged into ABEF and CDGH (lane 3 first).
  const __m128i dcba = _mm_loadu_si128(reinterpret_cast<const __m128i*>(h.data()));
  const __m128i hgfe = _mm_loadu_si128(reinterpret_cast<const __m128i*>(h.data() + 4));
  const __m128i cdab = _mm_shuffle_epi32(dcba, 0xb1);
  const __m128i efgh = _mm_shuffle_epi32(hgfe, 0x1b);
  __m128i abef = _mm_alignr_epi8(cdab, efgh, 8);
  __m128i cdgh = _mm_blend_epi16(efgh, cdab, 0xf0);
  for (std::size_t i = 0; i < count; ++i) {
    const __m128i abef_in = abef, cdgh_in = cdgh;
    rounds_sha_ni(abef, cdgh, blocks + kBlockBytes * i);
    abef = _mm_add_epi32(abef, abef_in);
    cdgh = _mm_add_epi32(cdgh, cdgh_in);
  }
  const __m128i feba = _mm_shuffle_epi32(abef, 0x1b);
  const __m128i dchg = _mm_shuffle_epi32(cdgh, 0xb1);
  _mm_storeu_si128(reinterpret_cast<__m128i*>(h.data()), _mm_blend_epi16(feba, dchg, 0xf0));
  _mm_storeu_si128(reinterpret_cast<__m128i*>(h.data() + 4), _mm_alignr_epi8(dchg, feba, 8));
}

bool cpu_has_sha_ni() {
  __builtin_cpu_init();
  return __builtin_cpu_supports("sha") && __builtin_cpu_supports("sse4.1");
}

#endif

detail::Sha256Compress fastest_compress() {
  static const detail::Sha256Compress chosen =
      detail::sha256_compress_sha_ni() ? detail::sha256_compress_sha_ni() : &detail::sha256_compress_portable;
  return chosen;
}

}  // namespace

namespace detail {

void sha256_compress_portable(std::array<std::uint32_t, 8>& h, const std::uint8_t* blocks, std::size_t count) {
  for (std::size_t i = 0; i < count; ++i) compress_block_portable(h, blocks + kBlockBytes * i);
}

Sha256Compress sha256_compress_sha_ni() {
#if defined(__x86_64__)
  static const bool available = cpu_has_sha_ni();
  return available ? &compress_sha_ni : nullptr;
#else
  return nullptr;
#endif
}

}  // namespace detail

Sha256::Sha256() : Sha256(fastest_compress()) {}

Sha256::Sha256(detail::Sha256Compress compress) : compress_(compress), h_(kInitial) {}

void Sha256::restart() {
  h_ = kInitial;
  buffered_ = 0;
  length_ = 0;
}

void Sha256::update(std::string_view data) {
  length_ += data.size();
  const auto* bytes = reinterpret_cast<const std::uint8_t*>(data.data());
  std::size_t left = data.size();
  if (buffered_ > 0) {  // top up the partial block first
    const std::size_t take = std::min(left, kBlockBytes - buffered_);
    std::memcpy(buffer_.data() + buffered_, bytes, take);
    buffered_ += take;
    bytes += take;
    left -= take;
    if (buffered_ < kBlockBytes) return;
    compress_(h_, buffer_.data(), 1);
    buffered_ = 0;
  }
  const std::size_t whole = left / kBlockBytes;  // straight from the caller's bytes, no copy
  if (whole > 0) compress_(h_, bytes, whole);
  bytes += whole * kBlockBytes;
  left -= whole * kBlockBytes;
  if (left > 0) std::memcpy(buffer_.data(), bytes, left);
  buffered_ = left;
}

std::array<std::uint8_t, 32> Sha256::finish() {
  const std::uint64_t bits = length_ * 8;
  // Padding (sec. 5.1.1): a one bit, zeros up to 56 bytes mod 64, then the length in bits, big-endian.
  buffer_[buffered_++] = 0x80;
  if (buffered_ > kBlockBytes - 8) {
    std::fill(buffer_.begin() + static_cast<std::ptrdiff_t>(buffered_), buffer_.end(), std::uint8_t{0});
    compress_(h_, buffer_.data(), 1);
    buffered_ = 0;
  }
  std::fill(buffer_.begin() + static_cast<std::ptrdiff_t>(buffered_), buffer_.end() - 8, std::uint8_t{0});
  for (int i = 0; i < 8; ++i) buffer_[56 + i] = static_cast<std::uint8_t>((bits >> (56 - 8 * i)) & 0xff);
  compress_(h_, buffer_.data(), 1);
  std::array<std::uint8_t, 32> digest{};
  for (int i = 0; i < 8; ++i)
    for (int k = 0; k < 4; ++k) digest[4 * i + k] = static_cast<std::uint8_t>((h_[i] >> (24 - 8 * k)) & 0xff);
  restart();
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
  std::vector<char> chunk(std::size_t{1} << 20);  // 1 MiB, reused for every read
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
