#include "toehold/common/error.hpp"
#include "toehold/hotspot/toe_frame.hpp"
#include "support/support.hpp"

namespace toehold {

TEST(ToeFrame, ReadoutPointsAwayFromTheWeld) {
  // Toe along x on the top surface (normal +z) of a plate lying on the -y side of the weld.
  const ToeFrame f = make_toe_frame({2.0, 0.0, 0.1}, {0.0, 0.0, 3.0}, {0.3, -1.0, 0.0}, "toe 1 station 4");
  EXPECT_CLOSE(f.normal.z(), 1.0, 1e-15);
  EXPECT_CLOSE(f.tangent.x(), 1.0, 1e-15);  // the normal component 0.1 is projected out, the sense kept
  EXPECT_CLOSE(f.tangent.z(), 0.0, 1e-15);
  EXPECT_CLOSE(f.readout.y(), -1.0, 1e-15);
  EXPECT_NO_THROW(check_toe_frame(f, "toe 1 station 4"));
}

TEST(ToeFrame, DegenerateDirectionsAreErrors) {
  try {
    make_toe_frame({0.0, 0.0, 1.0}, {0.0, 0.0, 1.0}, {0.0, 1.0, 0.0}, "toe 2 station 1");
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()),
              "toe 2 station 1: toe tangent is parallel to the surface normal; the toe must run along the surface");
  }
  EXPECT_THROW(make_toe_frame({1.0, 0.0, 0.0}, Vec3::Zero(), {0.0, 1.0, 0.0}, "t"), Error);
  EXPECT_THROW(make_toe_frame({1.0, 0.0, 0.0}, {0.0, 0.0, 1.0}, {1.0, 0.0, 0.0}, "t"), Error);
}

TEST(ToeFrame, CheckRejectsNonOrthonormalFrames) {
  ToeFrame f;
  f.readout = Vec3(0.0, 1.0, 0.1).normalized();
  try {
    check_toe_frame(f, "toe 3");
    FAIL();
  } catch (const Error& e) {
    EXPECT_EQ(std::string(e.what()),
              "toe 3: toe frame vectors are not mutually perpendicular; build the frame with make_toe_frame");
  }
  f.readout = Vec3(0.0, 2.0, 0.0);
  EXPECT_THROW(check_toe_frame(f, "toe 3"), Error);
}

}  // namespace toehold
