#include <catch2/catch.hpp>

#include "base/name_pattern.hpp"

namespace firn {
namespace {

TEST_CASE("name patterns", "[base]") {
    CHECK(name_matches("S.*", "S.balanced"));
    CHECK(name_matches("*", ""));
    CHECK(name_matches("a*b*c", "axxbyyc"));
    CHECK_FALSE(name_matches("a*b", "axxc"));
    CHECK_FALSE(name_matches("D", "DL"));
    CHECK(name_matches("D", "D"));
    CHECK(name_matches("eave.*.left", "eave.A.B.left"));
    CHECK_FALSE(name_matches("eave.*", "roof.A.B"));
}

}  // namespace
}  // namespace firn
