// Tests of the geometry checks (resolve_geometry.cpp): every message by its exact
// text, line and column, on the small base frame of test_text.hpp (B1 from N1 at
// 0 ft to N2 at 10 ft along y = 0, fixed at N1; extra lines start on line 9).
#include <catch2/catch.hpp>
#include <string>

#include "testing/test_text.hpp"

using firn::testing::kBaseModel;
using firn::testing::messages_for;

namespace {

std::string with(const std::string& extra) {
    return std::string(kBaseModel) + extra;
}

/// The first lines of the rendered diagnostics (notes and quoted source left out).
std::string heads(const std::string& text) {
    std::string all = messages_for(text), out;
    std::size_t at = 0;
    while (at < all.size()) {
        std::size_t end = all.find('\n', at);
        std::string line = all.substr(at, end - at);
        if (line.starts_with("input:") && line.find(": note: ") == std::string::npos)
            out += line + "\n";
        at = end == std::string::npos ? all.size() : end + 1;
    }
    return out;
}

}  // namespace

TEST_CASE("geometry: a node on a member's length is not joined to it") {
    std::string column =
        "node N3 at x = 4 ft, y = 0 ft\nnode N4 at x = 4 ft, y = 5 ft\n"
        "member C1 from N3 to N4 section beam\n"
        "member D1 from N4 to N2 section beam\n";
    CHECK(heads(with(column)) ==
          "input:9:6: error: node 'N3' lies on member 'B1' but is not one of its ends, so the "
          "two are not joined; split 'B1' at 'N3' (end a member there, or add a grid line "
          "through the node for the generator to split at), or write 'unjoined N3 on B1' if "
          "they pass without a connection\n");
    CHECK(heads(with(column + "unjoined N3 on B1\n")).empty());
}

TEST_CASE("geometry: an unjoined node must lie on the member's length") {
    CHECK(heads(with("unjoined N2 on B1\nnode N3 at x = 4 ft, y = 1 ft\n"
                     "member C1 from N3 to N2 section beam\nunjoined N3 on B1\n")) ==
          "input:9:10: error: node 'N2' is an end of member 'B1', so the two are joined; "
          "'unjoined' is for a node that passes a member along its length\n"
          "input:12:10: error: node 'N3' does not lie on member 'B1' (within the geometry "
          "tolerance, 0.0394 in), so there is no joint to leave out; remove it from "
          "'unjoined'\n");
}

TEST_CASE("geometry: a member repeated between the same two nodes") {
    CHECK(heads(with("member B2 from N2 to N1 section beam\n")) ==
          "input:9:8: error: member 'B2' joins the same two nodes as member 'B1' ('N2' and "
          "'N1'), so the frame would take its stiffness twice; remove one of them, or give one "
          "a section for both\n");
}

TEST_CASE("geometry: members along one line that overlap") {
    CHECK(heads(with("node N3 at x = 4 ft, y = 0 ft\nmember B2 from N3 to N2 section beam\n")) ==
          "input:10:8: error: members 'B2' and 'B1' lie along one line and overlap, so they are "
          "not joined where they share their length; end one where the other begins, or make "
          "them one member\n");
}

TEST_CASE("geometry: nodes within the tolerance that are two nodes") {
    // 0.5 mm = 0.019685 in and 1 mm = 0.03937 in (1 in = 25.4 mm exactly).
    CHECK(heads(with("node N3 at x = 10 ft + 0.5 mm, y = 0 ft\nnode N4 at x = 10 ft, y = 5 ft\n"
                     "member C1 from N3 to N4 section beam\n"
                     "member C2 from N4 to N2 section beam\n")) ==
          "input:9:6: warning: node 'N3' is 0.0197 in from node 'N2', within the geometry "
          "tolerance (0.0394 in), but they are two nodes, so members meeting there are not "
          "joined; use one node for both\n");
}

TEST_CASE("geometry: a member within the tolerance, and a tolerance of the model's own") {
    std::string stub = "node N3 at x = 10 ft, y = 0.5 mm\nmember S1 from N2 to N3 section beam\n";
    CHECK(heads(with(stub)) ==
          "input:10:8: error: member 'S1' is 0.0197 in long, within the geometry tolerance "
          "(0.0394 in), so its nodes 'N2' and 'N3' are one joint; join the members there at one "
          "node, or set a smaller 'geometry tolerance'\n");
    // With a tolerance below its length the member is accepted; the solver then says how
    // far apart its stiffness and its neighbour's lie (12EI/L^3 of 0.5 mm against 10 ft).
    CHECK(heads(with(stub + "geometry tolerance 0.1 mm\n")) ==
          "input:7:8: warning: the stiffness matrix is badly conditioned (estimate 1.9e+09: "
          "about 9 of the 16 digits are lost); member 'S1' is 1.9e+09 times as stiff as member "
          "'B1'; the frame is stable and was solved; the results keep fewer digits than usual\n");
    CHECK(heads(with("geometry tolerance 0.0001 mm\n")) ==
          "input:9:20: error: a geometry tolerance must be at least 0.001 mm, the precision to "
          "which firn places nodes\n");
}

TEST_CASE("geometry: parts of the frame that share no node") {
    std::string part =
        "node N3 at x = 20 ft, y = 0 ft\nnode N4 at x = 30 ft, y = 0 ft\n"
        "member B2 from N3 to N4 section beam\n";
    CHECK(heads(with(part)) ==
          "input:11:8: error: the part of the frame around node 'N3' (1 member, 'B2' first) "
          "shares no node with the rest and has no support, so nothing holds it up; join it to "
          "the rest at a node in common, or support it\n");
    CHECK(heads(with(part + "support fixed at N3\n")) ==
          "input:11:8: warning: the part of the frame around node 'N3' (1 member, 'B2' first) "
          "shares no node with the rest and stands on supports of its own, so it is analysed as "
          "a frame apart; if it should be joined to the rest, give them a node in common\n");
}
