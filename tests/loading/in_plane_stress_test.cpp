// The fast in-plane hot-spot evaluation agrees with the hot-spot definitions on random tensors and frames, and
// the in-plane components combine linearly.
#include "toehold/loading/in_plane_stress.hpp"
#include "support/support.hpp"

#include <random>

namespace toehold {
namespace {

ToeFrame random_frame(std::mt19937& rng) {
  std::normal_distribution<double> g;
  const Vec3 t(g(rng), g(rng), g(rng)), n(g(rng), g(rng), g(rng));
  return make_toe_frame(t, n, n.cross(t), "test");
}

Tensor random_tensor(std::mt19937& rng) {
  std::uniform_real_distribution<double> u(-200, 200);
  Tensor s;
  s << u(rng), u(rng), u(rng), 0, u(rng), u(rng), 0, 0, u(rng);
  s(1, 0) = s(0, 1), s(2, 0) = s(0, 2), s(2, 1) = s(1, 2);
  return s;
}

TEST(InPlaneStress, ScalarEqualsTheHotSpotDefinitionsOnRandomTensors) {
  std::mt19937 rng(7);
  for (HotSpotDefinition d : {HotSpotDefinition::perpendicular, HotSpotDefinition::principal,
                              HotSpotDefinition::effective}) {
    for (double window : {60.0, 30.0}) {
      DefinitionOptions options;
      options.window_deg = window;
      options.alpha = 0.8;
      const HotSpotScalar scalar(d, options);
      for (int i = 0; i < 500; ++i) {
        const ToeFrame frame = random_frame(rng);
        const Tensor s = random_tensor(rng);
        const HotSpotValue expected = evaluate(d, s, frame, options);
        bool valid = true;
        const double value = scalar(in_plane(s, frame), &valid);
        EXPECT_EQ(valid, expected.valid);
        EXPECT_CLOSE(value, expected.value, 1e-9);
        // The reduced tensor gives the same value as the full one.
        EXPECT_CLOSE(evaluate(d, tensor_of(in_plane(s, frame), frame), frame, options).value, expected.value, 1e-9);
      }
    }
  }
}

TEST(InPlaneStress, ComponentsAreLinearInTheTensor) {
  std::mt19937 rng(3);
  const ToeFrame frame = random_frame(rng);
  const Tensor a = random_tensor(rng), b = random_tensor(rng);
  InPlaneStress sum = 0.7 * in_plane(a, frame);
  sum += -1.3 * in_plane(b, frame);
  const InPlaneStress direct = in_plane(0.7 * a - 1.3 * b, frame);
  EXPECT_CLOSE(sum.rr, direct.rr, 1e-12);
  EXPECT_CLOSE(sum.tt, direct.tt, 1e-12);
  EXPECT_CLOSE(sum.rt, direct.rt, 1e-12);
}

}  // namespace
}  // namespace toehold
