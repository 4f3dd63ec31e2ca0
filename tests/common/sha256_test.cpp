// SHA-256 against the NIST example messages (FIPS 180-2 appendix B / NIST "SHA256.pdf" examples, digests quoted
// from memory [M] and cross-checked with coreutils sha256sum), fed whole and in pieces.
#include "support/support.hpp"
#include "toehold/common/error.hpp"
#include "toehold/common/sha256.hpp"

#include <fstream>
#include <string>

namespace toehold::test {
namespace {

// FIPS 180-2 appendix B.1, one-block message "abc" [M].
constexpr const char* kAbcDigest = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";
// FIPS 180-2 appendix B.2, the 448-bit two-block message [M].
constexpr const char* kTwoBlockMessage = "abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq";
constexpr const char* kTwoBlockDigest = "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1";

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
  EXPECT_EQ(sha256_hex(std::string(1000000, 'a')), "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0");
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
