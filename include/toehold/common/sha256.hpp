// SHA-256 message digests (FIPS 180-4 sec. 6.2), for the provenance of input files: a running hash fed in pieces,
// and helpers for a whole string or file. Digests are written as 64 lowercase hexadecimal digits.
#pragma once

#include <array>
#include <cstdint>
#include <string>
#include <string_view>

namespace toehold {

class Sha256 {
public:
  Sha256();
  // Appends `data` (any bytes) to the message.
  void update(std::string_view data);
  // Ends the message and returns its digest, 32 bytes. The object then starts a new, empty message.
  std::array<std::uint8_t, 32> finish();
  // finish() as 64 lowercase hexadecimal digits.
  std::string finish_hex();

private:
  void compress(const std::uint8_t* block);  // one 64-byte block

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
