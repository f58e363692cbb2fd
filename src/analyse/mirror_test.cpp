// Tests of the mirror map: which frames are symmetric about a vertical axis,
// which member and load case is the image of which, and that the analysed
// results of mirrored cases are mirrored (symmetry of a linear elastic
// structure, common practice). The frames are invented for the tests.
#include <fmt/format.h>
#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "driver/driver.hpp"
#include "ir/mirror.hpp"
#include "testing/test_model_builder.hpp"
#include "testing/test_text.hpp"

namespace firn {
using firn::testing::analysed;

namespace {

using testing::exactly;

/// A two-bay gable frame: columns on A, B, C (the middle one up to the ridge R),
/// rafters RL (eave to ridge) and RR (ridge to eave), fixed bases. `extra` adds
/// lines: load cases, or statements that spoil the symmetry.
std::string two_bay(const std::string& extra, const std::string& right_line = "C = 24 m",
                    const std::string& supports = "support fixed at base") {
    return fmt::format(
        "model \"two-bay gable\"\nreport units kN, m\n"
        "grid x A = 0 m, B = 12 m, {}\ngrid y base = 0 m, eave = 5 m\n"
        "node R at B, y = 10 m\n"  // rafters rise 5 m in 12 m: 13 m long
        "material steel E = 200 GPa\n"
        "section column steel, A = 8000 mm2, I = 1.2e8 mm4\n"
        "section rafter steel, A = 6000 mm2, I = 9e7 mm4\n"
        "member CA from A.base to A.eave section column\n"
        "member CB from B.base to R section column\n"
        "member CC from C.base to C.eave section column\n"
        "member RL from A.eave to R section rafter\n"
        "member RR from R to C.eave section rafter\n"
        "{}\n{}\n",
        right_line, supports, extra);
}

/// A three-bay flat-roofed frame of 8 m bays, written with generators: columns
/// A.base.eave ... D.base.eave, beams eave.A.B, eave.B.C, eave.C.D.
std::string three_bay(const std::string& cases) {
    return "model \"three-bay flat\"\nreport units kN, m\n"
           "grid x A..D spacing 8 m\ngrid y base = 0 m, eave = 4 m\n"
           "material steel E = 200 GPa\n"
           "section column steel, A = 8000 mm2, I = 1.2e8 mm4\n"
           "section beam steel, A = 6000 mm2, I = 2e8 mm4\n"
           "columns on A..D from base to eave section column\n"
           "beams along eave from A to D section beam\n"
           "support fixed at base\n" +
           cases;
}

template <typename Id, typename Entities>
Id named(const Entities& entities, const std::string& name) {
    auto it = std::find_if(entities.begin(), entities.end(),
                           [&](const auto& e) { return e.name == name; });
    REQUIRE(it != entities.end());
    return make_id<Id>(static_cast<std::size_t>(it - entities.begin()));
}

/// The mirror map of a frame that must be symmetric.
Mirror mirror_of(const Analysis& a) {
    Mirror m = find_mirror(a.model, a.loads);
    REQUIRE(m.symmetric);
    return m;
}

/// A member, the name of its image and whether the image runs the other way.
struct Image {
    const char* member;
    const char* image;
    bool reversed;
};

void check_images(const Analysis& a, const Mirror& m, std::initializer_list<Image> images) {
    for (const Image& i : images) {
        INFO(i.member);
        MemberId id = named<MemberId>(a.model.members, i.member);
        REQUIRE(m.member[at(id)].has_value());
        CHECK(a.model.members[at(*m.member[at(id)])].name == i.image);
        CHECK(m.member_reversed[at(id)] == i.reversed);
    }
}

/// The name of the case that mirrors case `name`, or "none".
std::string case_image(const Analysis& a, const Mirror& m, const std::string& name) {
    std::optional<CaseId> c = m.case_mirror[at(named<CaseId>(a.model.cases, name))];
    return c ? a.model.cases[at(*c)].name : "none";
}

/// Checks pairs of a case and the name of the case that mirrors it ("none").
void check_case_images(const Analysis& a, const Mirror& m,
                       std::initializer_list<std::pair<const char*, const char*>> pairs) {
    for (const auto& [name, image] : pairs) {
        INFO(name);
        CHECK(case_image(a, m, name) == image);
    }
}

/// `text` with its first `from` replaced by `to`.
std::string replaced(std::string text, const std::string& from, const std::string& to) {
    std::size_t where = text.find(from);
    REQUIRE(where != std::string::npos);
    return text.replace(where, from.size(), to);
}

/// Snow-like arrangements: on the left roof member, on the right one, on both.
std::string roof_cases(const std::string& left, const std::string& right) {
    return fmt::format(
        "case left snow {{ uniform 4 kN/m down projected on {0} }}\n"
        "case right snow {{ uniform 4 kN/m down projected on {1} }}\n"
        "case both snow {{ uniform 4 kN/m down projected on {0}, {1} }}\n",
        left, right);
}

/// Both test frames are 24 m wide with the roof cases of roof_cases: the left
/// and right arrangements mirror each other, the one on both mirrors itself.
void check_roof_cases(const Analysis& a, const Mirror& m) {
    CHECK(m.axis == 12.0);  // midway between x = 0 and x = 24 m (the definition)
    check_case_images(a, m, {{"left", "right"}, {"right", "left"}, {"both", "both"}});
}

}  // namespace

TEST_CASE("mirror: a two-bay gable frame and its roof cases", "[mirror]") {
    Analysis a = analysed(two_bay(roof_cases("RL", "RR")));
    Mirror m = mirror_of(a);
    check_roof_cases(a, m);
    check_images(a, m,
                 {{"CA", "CC", false},
                  {"CC", "CA", false},
                  {"CB", "CB", false},
                  {"RL", "RR", true},
                  {"RR", "RL", true}});
    CHECK(a.model.nodes[at(*m.node[at(named<NodeId>(a.model.nodes, "R"))])].name == "R");
}

TEST_CASE("mirror: a three-bay flat frame written with generators", "[mirror]") {
    Analysis a = analysed(three_bay(roof_cases("eave.A.B", "eave.C.D")));
    Mirror m = mirror_of(a);
    check_roof_cases(a, m);
    check_images(a, m,
                 {{"A.base.eave", "D.base.eave", false},
                  {"B.base.eave", "C.base.eave", false},
                  {"eave.A.B", "eave.C.D", true},
                  {"eave.B.C", "eave.B.C", true}});
}

TEST_CASE("mirror: loads are compared as functions, with the mirrored signs", "[mirror]") {
    // The same loads split, reordered or given on the image member; the rules
    // in mirror.hpp give the signs (flat beams eave.A.B and eave.C.D run left
    // to right, so each is the other's image run the other way; the columns
    // A.base.eave and D.base.eave both run upward, the same way).
    Analysis a = analysed(three_bay(
        "case whole other { uniform 3 kN/m down on eave.C.D }\n"
        "case split other { uniform 3 kN/m down on eave.A.B from 5 m to 8 m\n"
        "  uniform 3 kN/m down on eave.A.B from 0 m to 5 m }\n"
        "case ramp other { linear 0 kN/m to 6 kN/m down on eave.A.B }\n"
        "case ramp_image other { linear 6 kN/m to 0 kN/m down on eave.C.D }\n"
        "case ramp_same other { linear 0 kN/m to 6 kN/m down on eave.C.D }\n"
        "case turn other { moment 5 kN*m on eave.A.B at 2 m; uniform 1 kN/m axial on eave.A.B }\n"
        "case turn_image other { moment 5 kN*m clockwise on eave.C.D at 6 m\n"
        "  uniform -1 kN/m axial on eave.C.D }\n"
        "case across other { uniform 2 kN/m transverse on A.base.eave }\n"
        "case across_image other { uniform -2 kN/m transverse on D.base.eave }\n"
        "case middle other { point 7 kN down on eave.B.C at 3 m; point 7 kN down on eave.B.C at 5 "
        "m }\n"
        "case lopsided other { point 7 kN down on eave.B.C at 3 m }\n"));
    Mirror m = mirror_of(a);
    check_case_images(a, m,
                      {{"split", "whole"},
                       {"whole", "split"},
                       {"ramp", "ramp_image"},
                       {"ramp_same", "none"},
                       {"turn", "turn_image"},
                       {"turn_image", "turn"},
                       {"across", "across_image"},
                       {"middle", "middle"},
                       {"lopsided", "none"}});
}

TEST_CASE("mirror: a lateral load at one eave mirrors one at the other pointing back", "[mirror]") {
    Analysis a =
        analysed(two_bay("case west wind { point 10 kN x at A.eave; uniform 1 kN/m x on CA }\n"
                         "case east wind { point -10 kN x at C.eave; uniform -1 kN/m x on CC }\n"
                         "case pushed other { point 10 kN x at C.eave; uniform -1 kN/m x on CC }\n"
                         "case member_west other { point 3 kN x on CA at 2 m }\n"
                         "case member_east other { point -3 kN x on CC at 2 m }\n"));
    Mirror m = mirror_of(a);
    check_case_images(
        a, m,
        {{"west", "east"}, {"east", "west"}, {"pushed", "none"}, {"member_west", "member_east"}});
}

TEST_CASE("mirror: unbalanced snow with wind from the left mirrors wind from the right",
          "[mirror]") {
    // ASCE 7-16 Sec. 7.6.1 places the unbalanced load on the leeward side of the
    // ridge (from memory), so the two wind directions give each other's mirror image.
    Analysis a =
        analysed(two_bay("use asce7_16\n"
                         "snow S {\n  standard = asce7_16\n  pg = 30 psf\n  terrain = C\n"
                         "  exposure = partially\n  thermal = heated\n  risk = II\n}\n"
                         "roof main on RL, RR {\n  tributary = 6 m\n}\n"));
    Mirror m = mirror_of(a);
    check_case_images(a, m,
                      {{"S.balanced", "S.balanced"},
                       {"S.unbalanced.wind_from_left", "S.unbalanced.wind_from_right"},
                       {"S.unbalanced.wind_from_right", "S.unbalanced.wind_from_left"}});
}

namespace {

/// M, V, N and deflection of a member at s, from its exact functions.
std::array<double, 4> actions_at(const MemberFunctions& f, double s) {
    for (const FunctionPiece& p : f.pieces) {
        if (s >= p.a && s <= p.b) {
            double t = s - p.a;
            return {p.axial(t), p.shear(t), p.moment(t), p.deflection(t)};
        }
    }
    FAIL("no piece holds s");
    return {};
}

/// The largest |value| in rows of three (reactions, displacements), for tolerances.
double largest(const std::vector<std::array<double, 3>>& rows) {
    double scale = 0.0;
    for (const auto& row : rows)
        for (double v : row)
            scale = std::max(scale, std::abs(v));
    return scale;
}

/// Symmetry of a linear elastic structure (common practice): the reactions and
/// displacements of case d are the images of case c's (Rx, dx, M and rotation flip).
void check_mirrored_nodes(const Analysis& a, const Mirror& m, CaseId c, CaseId d) {
    const CaseResults& rc = a.results.cases[at(c)];
    const CaseResults& rd = a.results.cases[at(d)];
    double scale = largest(rc.reactions), drift = largest(rc.displacements);
    for (std::size_t n = 0; n < a.model.nodes.size(); ++n) {
        const auto& u = rc.displacements[n];
        const auto& v = rd.displacements[at(*m.node[n])];
        CHECK(v[0] == exactly(-u[0], drift));
        CHECK(v[1] == exactly(u[1], drift));
        CHECK(v[2] == exactly(-u[2], drift));
    }
    for (std::size_t i = 0; i < a.model.supports.size(); ++i) {
        NodeId image = *m.node[at(a.model.supports[i].node)];
        auto j = static_cast<std::size_t>(
            std::find_if(a.model.supports.begin(), a.model.supports.end(),
                         [&](const Support& s) { return s.node == image; }) -
            a.model.supports.begin());
        CHECK(rd.reactions[j][0] == exactly(-rc.reactions[i][0], scale));
        CHECK(rd.reactions[j][1] == exactly(rc.reactions[i][1], scale));
        CHECK(rd.reactions[j][2] == exactly(-rc.reactions[i][2], scale));
    }
}

/// Symmetry of a linear elastic structure (common practice): along each member's
/// image, case d's N is case c's, V flips, and M and the deflection are kept
/// where the image runs the other way and flip where it runs the same way (the
/// sign rules derived in mirror.cpp).
void check_mirrored_members(const Analysis& a, const Mirror& m, CaseId c, CaseId d) {
    double scale = largest(a.results.cases[at(c)].reactions);
    double drift = largest(a.results.cases[at(c)].displacements);
    for (std::size_t i = 0; i < a.model.members.size(); ++i) {
        MemberId mi = make_id<MemberId>(i), image = *m.member[i];
        bool reversed = m.member_reversed[i];
        double L = member_geometry(a.model, mi).length, sign = reversed ? 1.0 : -1.0;
        auto fc = member_functions(a.model, a.loads.cases[at(c)], a.solution, c, mi);
        auto fd = member_functions(a.model, a.loads.cases[at(d)], a.solution, d, image);
        for (double share : {0.0, 0.13, 0.41, 0.5, 0.77, 1.0}) {
            double s = share * L;
            auto x = actions_at(fc, s), y = actions_at(fd, reversed ? L - s : s);
            INFO(fmt::format("member {} at {}", a.model.members[i].name, s));
            CHECK(y[0] == exactly(x[0], scale));
            CHECK(y[1] == exactly(-x[1], scale));
            CHECK(y[2] == exactly(sign * x[2], scale));
            CHECK(y[3] == exactly(sign * x[3], drift));
        }
    }
}

}  // namespace

TEST_CASE("mirror: results of mirrored cases are mirrored", "[mirror]") {
    Analysis a = analysed(two_bay(
        roof_cases("RL", "RR") +
        "case west wind { point 10 kN x at A.eave; uniform 1 kN/m x on CA }\n"
        "case east wind { point -10 kN x at C.eave; uniform -1 kN/m x on CC }\n"
        "case ramp other { linear 1 kN/m to 5 kN/m transverse on RL from 2 m to 9 m\n"
        "  moment 4 kN*m on RL at 3 m; point 6 kN down on CA at 1 m }\n"
        "case ramp_image other { linear 5 kN/m to 1 kN/m transverse on RR from 4 m to 11 m\n"
        "  moment 4 kN*m clockwise on RR at 10 m; point 6 kN down on CC at 1 m }\n"));
    Mirror m = mirror_of(a);
    CHECK(case_image(a, m, "ramp") == "ramp_image");
    for (const char* name : {"left", "right", "both", "west", "east", "ramp"}) {
        CaseId c = named<CaseId>(a.model.cases, name);
        REQUIRE(m.case_mirror[at(c)].has_value());
        check_mirrored_nodes(a, m, c, *m.case_mirror[at(c)]);
        check_mirrored_members(a, m, c, *m.case_mirror[at(c)]);
    }
}

TEST_CASE("mirror: frames that are not their own mirror image", "[mirror]") {
    // Each variant of the symmetric two-bay frame spoils one thing.
    auto symmetric = [](const std::string& text) {
        Analysis a = analysed(text);
        return find_mirror(a.model, a.loads).symmetric;
    };
    CHECK(symmetric(two_bay("")));
    CHECK_FALSE(symmetric(two_bay("", "C = 25 m")));  // an unequal bay
    CHECK_FALSE(symmetric(
        two_bay("", "C = 24 m", "support fixed at A.base, B.base\nsupport pinned at C.base")));
    // Rollers: free in x at both ends mirror; free in x at one and in y at the other do not.
    CHECK(symmetric(
        two_bay("", "C = 24 m", "support pinned at B.base\nsupport roller at A.base, C.base")));
    CHECK_FALSE(symmetric(two_bay(
        "", "C = 24 m",
        "support pinned at B.base\nsupport roller at A.base\nsupport roller free y at C.base")));
    // Rotational springs: equal ones mirror, unequal ones do not.
    auto springs = [](const char* right) {
        return fmt::format(
            "support fixed at B.base\n"
            "support spring at A.base x = fixed, y = fixed, rotation = 5000 kN*m/rad\n"
            "support spring at C.base x = fixed, y = fixed, rotation = {} kN*m/rad",
            right);
    };
    CHECK(symmetric(two_bay("", "C = 24 m", springs("5000"))));
    CHECK_FALSE(symmetric(two_bay("", "C = 24 m", springs("5200"))));
    // A column of another section.
    std::string two_sections =
        replaced(two_bay(""), "section rafter steel",
                 "section column2 steel, A = 8000 mm2, I = 1.3e8 mm4\nsection rafter steel");
    CHECK_FALSE(
        symmetric(replaced(two_sections, "C.eave section column", "C.eave section column2")));
    // Hinges: at the ridge on both rafters mirror (RL's end is RR's start), and so
    // do hinges at both eaves; at the left eave and the ridge they do not.
    auto hinged = [](const std::string& left, const std::string& right) {
        std::string text =
            replaced(two_bay(""), "R section rafter", "R section rafter hinge at " + left);
        return replaced(text, "C.eave section rafter", "C.eave section rafter hinge at " + right);
    };
    CHECK(symmetric(hinged("R", "R")));
    CHECK(symmetric(hinged("A.eave", "C.eave")));
    CHECK_FALSE(symmetric(hinged("A.eave", "R")));
    // A node splitting the left rafter only.
    CHECK_FALSE(symmetric(replaced(two_bay(""), "member RL from A.eave to R section rafter",
                                   "node K at x = 6 m, y = 7.5 m\n"
                                   "member RL from A.eave to K section rafter\n"
                                   "member RK from K to R section rafter")));
}

}  // namespace firn
