// SHA-256 against the NIST example messages (FIPS 180-2 appendix B / NIST "SHA256.pdf" examples, digests quoted
// from memory [M] and cross-checked with coreutils sha256sum), fed whole and in pieces, through both compressions:
// the portable one and the x86 SHA-extension one (skipped where the CPU lacks it), which must agree everywhere.
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/common/sha256.hpp"

#include <fstream>
#include <random>
#include <string>
#include <vector>

namespace toehold::test {
namespace {

// FIPS 180-2 appendix B.1, one-block message "abc" [M].
constexpr const char* kAbcDigest = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";
// FIPS 180-2 appendix B.2, the 448-bit two-block message [M].
constexpr const char* kTwoBlockMessage = "abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq";
constexpr const char* kTwoBlockDigest = "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1";

// FIPS 180-2 appendix B.3: one million 'a' [M].
constexpr const char* kMillionADigest = "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0";
// NIST SHA-256 examples: the 896-bit message of the SHA-512 examples, hashed with SHA-256 [M], also sha256sum.
constexpr const char* kLongMessage =
    "abcdefghbcdefghicdefghijdefghijkefghijklfghijklmghijklmnhijklmnoijklmnopjklmnopqklmnopqrlmnopqrsmnopqrstnopqrstu";
constexpr const char* kLongDigest = "cf5b16a778af8380036ce59e7b0492370b249b11e8f07a51afac45037afee9d1";

std::string digest_with(detail::Sha256Compress compress, std::string_view message) {
  Sha256 hash(compress);
  hash.update(message);
  return hash.finish_hex();
}

// The message fed in pieces of 1..max_piece bytes drawn from `rng`.
std::string digest_in_pieces(detail::Sha256Compress compress, std::string_view message, std::size_t max_piece,
                             std::mt19937& rng) {
  std::uniform_int_distribution<std::size_t> piece(1, max_piece);
  Sha256 hash(compress);
  for (std::size_t at = 0; at < message.size();) {
    const std::size_t take = std::min(piece(rng), message.size() - at);
    hash.update(message.substr(at, take));
    at += take;
  }
  return hash.finish_hex();
}

std::string random_bytes(std::size_t n, std::mt19937& rng) {
  std::uniform_int_distribution<int> byte(0, 255);
  std::string out(n, '\0');
  for (char& ch : out) ch = static_cast<char>(byte(rng));
  return out;
}

// The portable compression, and the SHA-extension one where this CPU has it.
std::vector<detail::Sha256Compress> available_compressions() {
  std::vector<detail::Sha256Compress> out{&detail::sha256_compress_portable};
  if (detail::sha256_compress_sha_ni() != nullptr) out.push_back(detail::sha256_compress_sha_ni());
  return out;
}

// Every published example through one compression.
void expect_published_digests(detail::Sha256Compress compress) {
  EXPECT_EQ(digest_with(compress, "abc"), kAbcDigest);                                  // FIPS 180-2 B.1 [M]
  EXPECT_EQ(digest_with(compress, kTwoBlockMessage), kTwoBlockDigest);                  // FIPS 180-2 B.2 [M]
  EXPECT_EQ(digest_with(compress, std::string(1000000, 'a')), kMillionADigest);        // FIPS 180-2 B.3 [M]
  EXPECT_EQ(digest_with(compress, kLongMessage), kLongDigest);                          // NIST examples [M]
  EXPECT_EQ(digest_with(compress, ""), "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");  // [M]
  std::mt19937 rng(180);
  EXPECT_EQ(digest_in_pieces(compress, std::string(1000000, 'a'), 5000, rng), kMillionADigest);  // B.3 in pieces
}

TEST(Sha256, NistOneBlockMessageAbc) { EXPECT_EQ(sha256_hex("abc"), kAbcDigest); }

TEST(Sha256, NistTwoBlockMessage448Bits) {
  ASSERT_EQ(std::string(kTwoBlockMessage).size() * 8, 448u);
  EXPECT_EQ(sha256_hex(kTwoBlockMessage), kTwoBlockDigest);
}

TEST(Sha256, EmptyMessage) {
  // Digest of the empty message, NIST SHA-256 examples [M].
  EXPECT_EQ(sha256_hex(""), "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
}

TEST(Sha256, MillionLetterA) {
  // FIPS 180-2 appendix B.3: one million 'a' [M].
  EXPECT_EQ(sha256_hex(std::string(1000000, 'a')), kMillionADigest);
}

TEST(Sha256, Nist896BitMessage) { EXPECT_EQ(sha256_hex(kLongMessage), kLongDigest); }  // NIST examples [M]

TEST(Sha256, PortableCompressionGivesThePublishedDigests) {
  expect_published_digests(&detail::sha256_compress_portable);
}

TEST(Sha256, ShaExtensionCompressionGivesThePublishedDigests) {
  if (detail::sha256_compress_sha_ni() == nullptr) GTEST_SKIP() << "this CPU or build has no x86 SHA extensions";
  expect_published_digests(detail::sha256_compress_sha_ni());
}

TEST(Sha256, ShaExtensionAndPortableAgreeOnRandomMessagesInRandomPieces) {
  // Derived [D]: two implementations of the same FIPS 180-4 sec. 6.2.2 must give the same digest for any bytes.
  const detail::Sha256Compress fast = detail::sha256_compress_sha_ni();
  if (fast == nullptr) GTEST_SKIP() << "this CPU or build has no x86 SHA extensions";
  std::mt19937 rng(2026);
  std::uniform_int_distribution<std::size_t> length(0, 1000);
  for (int trial = 0; trial < 2000; ++trial) {
    const std::string message = random_bytes(length(rng), rng);
    const std::string whole = digest_with(&detail::sha256_compress_portable, message);
    EXPECT_EQ(digest_in_pieces(fast, message, 200, rng), whole) << "trial " << trial << ", " << message.size();
    EXPECT_EQ(digest_with(fast, message), whole) << "trial " << trial << ", " << message.size();
  }
}

TEST(Sha256, RandomPiecesGiveTheDigestOfTheWhole) {
  // Derived [D]: the digest depends on the bytes only, not on how update() was called or which compression ran.
  std::mt19937 rng(7);
  std::uniform_int_distribution<std::size_t> length(0, 1000);
  for (detail::Sha256Compress compress : available_compressions()) {
    for (int trial = 0; trial < 1000; ++trial) {
      const std::string message = random_bytes(length(rng), rng);
      EXPECT_EQ(digest_in_pieces(compress, message, 150, rng), sha256_hex(message)) << trial;
    }
  }
}

TEST(Sha256, ManyBlocksInOneCallEqualOneBlockAtATime) {
  // Derived [D]: update() hands whole runs of blocks to the compression at once; that must equal block by block.
  std::mt19937 rng(64);
  const std::string blocks = random_bytes(64 * 300, rng);
  const auto* bytes = reinterpret_cast<const std::uint8_t*>(blocks.data());
  for (detail::Sha256Compress compress : available_compressions()) {
    std::array<std::uint32_t, 8> at_once{1, 2, 3, 4, 5, 6, 7, 8}, one_by_one = at_once;
    compress(at_once, bytes + 1, 299);  // odd address: the caller's bytes need no alignment
    for (std::size_t i = 0; i < 299; ++i) compress(one_by_one, bytes + 1 + 64 * i, 1);
    EXPECT_EQ(at_once, one_by_one);
  }
}

TEST(Sha256, PiecesGiveTheSameDigestAsTheWhole) {
  const std::string message = kTwoBlockMessage;
  for (std::size_t cut = 0; cut <= message.size(); ++cut) {
    Sha256 hash;
    hash.update(message.substr(0, cut));
    hash.update(message.substr(cut));
    EXPECT_EQ(hash.finish_hex(), kTwoBlockDigest) << "cut at " << cut;
  }
}

TEST(Sha256, FinishStartsANewMessage) {
  Sha256 hash;
  hash.update("xyz");
  hash.finish();
  hash.update("abc");
  EXPECT_EQ(hash.finish_hex(), kAbcDigest);
}

TEST(Sha256, PaddingBoundaryLengths) {
  // 55, 56 and 64 bytes straddle the one-block padding limit; derived [D]: each must equal the digest of the same
  // bytes fed one at a time.
  for (std::size_t n : {55u, 56u, 63u, 64u, 65u, 119u, 120u}) {
    const std::string message(n, 'q');
    Sha256 hash;
    for (char ch : message) hash.update(std::string_view(&ch, 1));
    EXPECT_EQ(hash.finish_hex(), sha256_hex(message)) << n;
  }
}

TEST(Sha256, FileDigestAndSize) {
  TempDir dir;
  {
    std::ofstream out(dir.file("abc.txt"), std::ios::binary);
    out << "abc";
  }
  const FileDigest d = sha256_file(dir.file("abc.txt"));
  EXPECT_EQ(d.size_bytes, 3u);
  EXPECT_EQ(d.sha256, kAbcDigest);
}

TEST(Sha256, FileLargerThanOneReadGivesTheDigestOfItsBytes) {
  // Derived [D]: a file of 2.5 MiB + 13 bytes spans several 1 MiB reads; its digest is that of the same bytes.
  TempDir dir;
  std::mt19937 rng(11);
  const std::string bytes = random_bytes((std::size_t{5} << 19) + 13, rng);
  {
    std::ofstream out(dir.file("big.bin"), std::ios::binary);
    out << bytes;
  }
  const FileDigest d = sha256_file(dir.file("big.bin"));
  EXPECT_EQ(d.size_bytes, bytes.size());
  EXPECT_EQ(d.sha256, sha256_hex(bytes));
}

TEST(Sha256, MissingFileIsNamed) {
  try {
    sha256_file("/no/such/file.vtu");
    FAIL() << "expected Error";
  } catch (const Error& e) {
    EXPECT_STREQ(e.what(),
                 "cannot open file '/no/such/file.vtu' to compute its SHA-256; check that it exists and is readable");
  }
}

}  // namespace
}  // namespace toehold::test
