// SHA-256 message digests (FIPS 180-4 sec. 6.2), for the provenance of input files: a running hash fed in pieces,
// and helpers for a whole string or file. Digests are written as 64 lowercase hexadecimal digits. On x86-64 CPUs
// with the SHA extensions the block compression runs on them; every other CPU uses the portable code.
#pragma once

#include <array>
#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>

namespace toehold {

namespace detail {

// Test hook, not for general use: a SHA-256 compression function (FIPS 180-4 sec. 6.2.2) applied to `count`
// consecutive 64-byte blocks starting at `blocks` (any alignment), updating the eight hash words `h` (H0..H7).
using Sha256Compress = void (*)(std::array<std::uint32_t, 8>& h, const std::uint8_t* blocks, std::size_t count);

// The portable compression, plain C++, on every CPU.
void sha256_compress_portable(std::array<std::uint32_t, 8>& h, const std::uint8_t* blocks, std::size_t count);

// The compression on the x86 SHA extensions, or nullptr when the build is not for x86-64 or this CPU lacks SHA or
// SSE4.1.
Sha256Compress sha256_compress_sha_ni();

}  // namespace detail

class Sha256 {
public:
  // Uses the fastest compression this CPU offers.
  Sha256();
  // Test hook: uses `compress` (one of the detail:: functions above) for every block.
  explicit Sha256(detail::Sha256Compress compress);
  // Appends `data` (any bytes) to the message.
  void update(std::string_view data);
  // Ends the message and returns its digest, 32 bytes. The object then starts a new, empty message.
  std::array<std::uint8_t, 32> finish();
  // finish() as 64 lowercase hexadecimal digits.
  std::string finish_hex();

private:
  void restart();

  detail::Sha256Compress compress_;
  std::array<std::uint32_t, 8> h_{};
  std::array<std::uint8_t, 64> buffer_{};
  std::size_t buffered_ = 0;   // bytes waiting in buffer_
  std::uint64_t length_ = 0;   // message length so far, bytes
};

// Digest of `data`, 64 lowercase hexadecimal digits.
std::string sha256_hex(std::string_view data);

// Size and digest of a file, read in binary.
struct FileDigest {
  std::uintmax_t size_bytes = 0;
  std::string sha256;  // 64 lowercase hexadecimal digits
};

// Reads the file at `path`. Throws Error naming the file when it cannot be opened or read.
FileDigest sha256_file(const std::string& path);

}  // namespace toehold
