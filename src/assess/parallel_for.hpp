// A small private helper (src/assess): splits an index range into contiguous chunks run on std::threads.
// Results do not depend on the number of threads as long as the body writes each index's result only from that
// index (no shared accumulation); an exception from a chunk is rethrown after all threads have joined, the one
// of the lowest chunk first, so errors are the same as in a serial loop.
#pragma once

#include <algorithm>
#include <cstddef>
#include <exception>
#include <thread>
#include <vector>

namespace toehold::detail {

// True on a thread that is running a parallel_for body: a nested parallel_for then runs serially.
inline bool& inside_parallel_for() {
  static thread_local bool inside = false;
  return inside;
}

// Threads to use: the hardware's (at least 1).
inline std::size_t worker_count() { return std::max<std::size_t>(1, std::thread::hardware_concurrency()); }

// Calls body(begin, end) on disjoint ranges covering [0, n), each at least min_chunk long (except when n is
// smaller), on up to worker_count() threads; the calling thread runs the first range. Returns when all are done.
// Inside another parallel_for's body it runs serially on the calling thread (no nested threads).
template <class Body>
void parallel_for(std::size_t n, std::size_t min_chunk, const Body& body) {
  const std::size_t chunks = std::clamp<std::size_t>(n / std::max<std::size_t>(min_chunk, 1), 1, worker_count());
  if (chunks == 1 || inside_parallel_for()) {
    body(std::size_t{0}, n);
    return;
  }
  std::vector<std::exception_ptr> errors(chunks);
  auto run = [&](std::size_t c) {
    const bool outer = inside_parallel_for();
    inside_parallel_for() = true;
    try {
      body(n * c / chunks, n * (c + 1) / chunks);
    } catch (...) {
      errors[c] = std::current_exception();
    }
    inside_parallel_for() = outer;
  };
  std::vector<std::thread> threads;
  threads.reserve(chunks - 1);
  std::size_t started = 1;
  try {
    for (; started < chunks; ++started) threads.emplace_back(run, started);
  } catch (...) {  // a thread could not be started: run the remaining chunks here
    for (std::size_t c = started; c < chunks; ++c) run(c);
  }
  run(0);
  for (std::thread& t : threads) t.join();
  for (const std::exception_ptr& e : errors)
    if (e) std::rethrow_exception(e);
}

}  // namespace toehold::detail
