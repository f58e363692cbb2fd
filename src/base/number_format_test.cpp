// Tests of fixed-precision number formatting.
#include <catch2/catch.hpp>

#include "base/number_format.hpp"

using namespace firn;

TEST_CASE("fixed decimals, rounding, and no negative zero") {
    std::string s;
    append_fixed(s, 3.14159, 3);
    CHECK(s == "3.142");
    s.clear();
    append_fixed(s, -0.0004, 3);
    CHECK(s == "0.000");
    s.clear();
    append_fixed(s, -0.0, 2);
    CHECK(s == "0.00");
    s.clear();
    append_fixed(s, -2.5, 0);
    CHECK(s == "-2");  // round half to even, as std::to_chars does
    s.clear();
    append_fixed(s, 1e20, 1);
    CHECK(s == "100000000000000000000.0");
}

TEST_CASE("round_to rounds and clears the sign of zero") {
    CHECK(round_to(12.34567, 2) == 12.35);
    CHECK(std::signbit(round_to(-0.0001, 3)) == false);
}

TEST_CASE("alignment pads and never truncates") {
    std::string s;
    append_right(s, "abc", 5);
    append_left(s, "de", 4);
    append_right(s, "toolong", 3);
    CHECK(s == "  abcde  toolong");
}
