// Finding the first NaN or infinite value in a long run of floats or doubles (stress arrays of a million points,
// hot-spot histories of a million rows): blocks are tested on their exponent bits without a branch per value,
// which the compiler vectorizes, and only a block with a bad value is searched.
#pragma once

#include <algorithm>
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstring>
#include <limits>

namespace toehold {
namespace detail {

// IEEE 754 binary32/binary64: a value is NaN or infinite exactly when all its exponent bits are set.
template <class T>
struct ExponentBits;
template <>
struct ExponentBits<float> {
  using Word = std::uint32_t;
  static constexpr Word mask = 0x7f800000u;
};
template <>
struct ExponentBits<double> {
  using Word = std::uint64_t;
  static constexpr Word mask = 0x7ff0000000000000u;
};

// True when one of p[begin, end) is NaN or infinite.
template <class T>
bool any_non_finite(const T* p, std::size_t begin, std::size_t end) {
  using Bits = ExponentBits<T>;
  static_assert(sizeof(typename Bits::Word) == sizeof(T) && std::numeric_limits<T>::is_iec559);
  typename Bits::Word bad = 0;
  for (std::size_t j = begin; j < end; ++j) {
    typename Bits::Word w;
    std::memcpy(&w, p + j, sizeof w);
    bad |= static_cast<typename Bits::Word>((w & Bits::mask) == Bits::mask);
  }
  return bad != 0;
}

}  // namespace detail

// Index of the first non-finite of the n values at p (float or double), n when all are finite.
template <class T>
std::size_t first_non_finite(const T* p, std::size_t n) {
  constexpr std::size_t kBlock = 4096;
  for (std::size_t start = 0; start < n; start += kBlock) {
    const std::size_t end = std::min(n, start + kBlock);
    if (!detail::any_non_finite(p, start, end)) continue;
    for (std::size_t j = start; j < end; ++j)
      if (!std::isfinite(p[j])) return j;
  }
  return n;
}

}  // namespace toehold
