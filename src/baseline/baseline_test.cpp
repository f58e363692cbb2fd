// Tests of baselines: writing, reading back, comparing with tolerances.
#include <fmt/format.h>
#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "baseline/baseline.hpp"
#include "driver/driver.hpp"

namespace firn {
namespace {

/// A two-span continuous beam, pinned at A and on rollers at B and C, under a
/// uniform 1 kip/ft: a first span of 20 ft, the second ending at `second_end`.
std::string two_span(const char* second_end) {
    return std::string(
               "model \"Two-span roof beam\"\n"
               "use materials\n"
               "report units kip, ft\n"
               "grid x A = 0 ft, B = 20 ft, C = ") +
           second_end +
           "\n"
           "grid y roof = 0 ft\n"
           "section beam structural_steel, A = 10 in2, I = 500 in4\n"
           "beams along roof from A to C section beam\n"
           "support pinned at A.roof\n"
           "support roller at B.roof, C.roof\n"
           "case D dead {\n"
           "  uniform 1 kip/ft down on roof.*\n"
           "}\n";
}

Baseline baseline_of(const std::string& text) {
    Analysis a = analyse_text("two_span.firn", text);
    REQUIRE(a.ok);
    return make_baseline(a);
}

const BaselineValue* find(const Baseline& b, const std::string& key) {
    for (const BaselineValue& v : b.values) {
        if (v.key == key)
            return &v;
    }
    return nullptr;
}

const ValueChange* find(const Comparison& c, const std::string& key) {
    for (const ValueChange& v : c.changes) {
        if (v.key == key)
            return &v;
    }
    return nullptr;
}

}  // namespace

TEST_CASE("a two-span beam's baseline holds its moments and reactions", "[baseline]") {
    Baseline b = baseline_of(two_span("40 ft"));
    CHECK(b.title == "Two-span roof beam");
    CHECK(b.source == "two_span.firn");
    // Two equal spans, UDL: M_support = -wL^2/8 = -50 kip*ft; M+ = 9wL^2/128 = 28.125 kip*ft;
    // R = 3wL/8 = 7.5 kip and 10wL/8 = 25 kip [C: S20] (tests/SOURCES.md).
    const BaselineValue* m = find(b, "case D member roof.A.B moment_min");
    REQUIRE(m);
    CHECK(m->text == "-50.0000");
    CHECK(m->unit == "kip*ft");
    CHECK(find(b, "case D member roof.B.C moment_max")->value == Approx(28.125));
    CHECK(find(b, "case D reaction A.roof Ry")->value == Approx(7.5));
    CHECK(find(b, "case D reaction B.roof Ry")->value == Approx(25.0));
    // A pin carries no moment and a roller no Rx: those are not written (statics).
    CHECK_FALSE(find(b, "case D reaction A.roof M"));
    CHECK_FALSE(find(b, "case D reaction B.roof Rx"));
    // B's rotation is 0 by symmetry (statics); round-off never shows as -0 or 1e-17.
    CHECK(find(b, "case D node B.roof rotation")->text == "0");
}

TEST_CASE("lengthening one span moves both members' support moments by the three-moment equation",
          "[baseline]") {
    Baseline old = baseline_of(two_span("40 ft"));
    Baseline now = baseline_of(two_span("44 ft"));
    Comparison c = compare_baselines(old, now, default_tolerances());
    // Three-moment equation (Clapeyron), ends pinned, UDL w on spans L1, L2:
    // M_B = -w (L1^3 + L2^3) / (8 (L1 + L2)) = -(8000 + 13824) / 352 = -62 kip*ft [D];
    // with L1 = L2 = 20 ft it is -wL^2/8 = -50 kip*ft [C: S20]. Change: +24 % (larger hogging).
    for (const char* member : {"roof.A.B", "roof.B.C"}) {
        INFO(member);
        const ValueChange* v = find(c, fmt::format("case D member {} moment_min", member));
        REQUIRE(v);
        CHECK(v->old_value->value == Approx(-50.0));
        CHECK(v->new_value->value == Approx(-62.0));
        CHECK(v->percent == Approx(24.0));
    }
    // Span 1: R_A = w L1 / 2 - |M_B| / L1 = 10 - 62/20 = 6.9 kip; M+ = R_A^2 / (2w) = 23.805
    // kip*ft (statics). Span 2: R_C = 12 - 62/24 = 9.41667 kip; M+ = R_C^2 / 2w = 44.3368 kip*ft.
    CHECK(find(c, "case D reaction A.roof Ry")->new_value->value == Approx(6.9));
    CHECK(find(c, "case D member roof.A.B moment_max")->new_value->value == Approx(23.805));
    CHECK(find(c, "case D member roof.B.C moment_max")->new_value->value ==
          Approx(44.3368).epsilon(1e-5));
    // Ordered by significance, not percent: B's rotation (0 before, by symmetry: an
    // infinite percentage) no longer leads; the lengthened span's moment does, its member
    // the group of the largest change. In a group, forces and moments come first, each
    // part by significance.
    REQUIRE_FALSE(c.changes.empty());
    CHECK(c.changes.front().key == "case D member roof.B.C moment_max");
    auto design = [](const ValueChange& v) {
        return v.quantity_kind == "moment" || v.quantity_kind == "force";
    };
    for (std::size_t i = 1; i < c.changes.size(); ++i) {
        const ValueChange &a = c.changes[i - 1], &b = c.changes[i];
        if (a.key.substr(0, a.key.rfind(' ')) == b.key.substr(0, b.key.rfind(' ')) &&
            design(a) == design(b))
            CHECK(a.significance >= b.significance);
    }
    // Values that did not move are not listed: there is no axial force in either (statics).
    CHECK_FALSE(find(c, "case D member roof.A.B tension_max"));
}

TEST_CASE("a baseline holds the derived snow values by name", "[baseline]") {
    std::string text = two_span("40 ft") +
                       "use asce7_16\n"
                       "snow S {\n"
                       "  standard = asce7_16\n"
                       "  pg = 40 psf\n"
                       "  terrain = C\n"
                       "  exposure = partially\n"
                       "  thermal = cold_ventilated\n"
                       "  risk = II\n"
                       "}\n"
                       "roof main on roof.* {\n"
                       "  tributary = 20 ft\n"
                       "}\n";
    Baseline b = baseline_of(text);
    // pf = 0.7 Ce Ct Is pg = 0.7 x 1.0 x 1.1 x 1.0 x 40 psf = 30.8 psf [ASCE 7-16 Eq. 7.3-1;
    // Ce = 1.0 for terrain C, partially exposed, Table 7.3-1; Ct = 1.1 for a cold, ventilated
    // roof, Table 7.3-2; Is = 1.0 for risk category II, Table 1.5-2 (tables from memory)].
    const BaselineValue* pf = find(b, "snow S pf");
    REQUIRE(pf);
    CHECK(pf->value == Approx(30.8));
    CHECK(pf->unit == "psf");
    REQUIRE(find(b, "snow S Ct"));
    CHECK(find(b, "snow S Ct")->value == Approx(1.1));
    CHECK(find(b, "snow S Ct")->unit.empty());
    CHECK(find(b, "snow S pg")->value == Approx(40.0));
    // They come first, as the snow loads do in the report, and read back like any value.
    CHECK(b.values.front().key.starts_with("snow S "));
    std::string error;
    REQUIRE(read_baseline(baseline_text(b), "m.baseline", error));
    // pf is proportional to pg (Eq. 7.3-1): 40 -> 45 psf moves it by +12.5 %, to 34.65 psf.
    std::size_t at_pg = text.find("pg = 40 psf");
    Baseline more = baseline_of(text.replace(at_pg, 11, "pg = 45 psf"));
    Comparison c = compare_baselines(b, more, default_tolerances());
    const ValueChange* moved = find(c, "snow S pf");
    REQUIRE(moved);
    CHECK(moved->percent == Approx(12.5));
    CHECK(describe_changes(c, Listing{0, 0.0}).find("  pf  ") != std::string::npos);
}

TEST_CASE("a baseline reads back as it was written", "[baseline]") {
    Baseline b = baseline_of(two_span("44 ft"));
    b.title = "A \"quoted\" title with a back\\slash";
    std::string text = baseline_text(b);
    std::string error;
    std::optional<Baseline> back = read_baseline(text, "two_span.baseline", error);
    REQUIRE(back);
    CHECK(error.empty());
    CHECK(back->title == b.title);
    CHECK(back->source == b.source);
    CHECK(back->units == b.units);
    REQUIRE(back->values.size() == b.values.size());
    for (std::size_t i = 0; i < b.values.size(); ++i) {
        CHECK(back->values[i].key == b.values[i].key);
        CHECK(back->values[i].text == b.values[i].text);
        CHECK(back->values[i].value == b.values[i].value);
        CHECK(back->values[i].unit == b.values[i].unit);
    }
    CHECK(compare_baselines(*back, b, Tolerances{0.0, {}}).changes.empty());
    CHECK(baseline_text(*back) == text);
    // The caution travels with every baseline.
    CHECK(text.find("do not replace, the judgement of a licensed engineer") != std::string::npos);
}

TEST_CASE("bad baselines are errors naming the file and line", "[baseline]") {
    const std::string head = "firn baseline 1\nmodel \"m\"\nsource m.firn\n";
    auto error_for = [](const std::string& text) {
        std::string error;
        CHECK_FALSE(read_baseline(text, "m.baseline", error));
        return error;
    };
    CHECK(error_for("# comment\nfirn baseline 2\n") ==
          "m.baseline:2: error: written by a newer firn (format 2; this firn reads up to 1)");
    CHECK(error_for("model \"m\"\n") ==
          "m.baseline:1: error: not a firn baseline (its first line is not `firn baseline N`)");
    CHECK(error_for("") == "m.baseline: error: not a firn baseline (no `firn baseline N` line)");
    CHECK(error_for("firn baseline 1\nsource m.firn\n") ==
          "m.baseline: error: the `model` or `source` line is missing");
    CHECK(error_for(head + "case D member A moment_max 1 kip*ft\n") ==
          "m.baseline:4: error: expected `KEY = VALUE UNIT`");
    CHECK(error_for(head + "case D member A moment_max = x kip*ft\n") ==
          "m.baseline:4: error: expected a number and its unit after `=`, found 'x kip*ft'");
    CHECK(error_for(head + "case D member A moment_max = 1 furlong\n") ==
          "m.baseline:4: error: unknown unit 'furlong'");
    CHECK(error_for(head + "case D node A dx = 1 in\n\ncase D node A dx = 2 in\n") ==
          "m.baseline:6: error: 'case D node A dx' appears twice (first on line 4)");
    CHECK(baseline_format_of("# c\n\nfirn baseline 7\n") == 7);
    CHECK_FALSE(baseline_format_of("some other file\n"));
}

TEST_CASE("units of a baseline: products, quotients and powers of known units", "[baseline]") {
    double to_si = 0.0;
    Dimension d;
    // 1 kip = 4448.2216152605 N, 1 ft = 0.3048 m (exact definitions, tests/SOURCES.md).
    REQUIRE(parse_unit("kip*ft", to_si, d));
    CHECK(to_si == Approx(4448.2216152605 * 0.3048));
    CHECK(d == dim::moment);
    REQUIRE(parse_unit("kN/m^3", to_si, d));
    CHECK(to_si == Approx(1000.0));
    CHECK(d == dim::unit_weight);
    REQUIRE(parse_unit("in^4", to_si, d));
    CHECK(to_si == Approx(std::pow(0.0254, 4)));
    REQUIRE(parse_unit("", to_si, d));
    CHECK(d == dim::number);
    CHECK_FALSE(parse_unit("kip*", to_si, d));
    CHECK_FALSE(parse_unit("ft^x", to_si, d));
}

TEST_CASE("a value moves when it changes by more than both tolerances", "[baseline]") {
    auto one = [](const char* text, const char* unit) {
        Baseline b;
        b.values.push_back({"case D member A moment_max", text, std::stod(text), unit, "", 0});
        return b;
    };
    Tolerances t = default_tolerances();  // 0.01 % and 1 N*m
    CHECK(compare_baselines(one("100.000", "kN*m"), one("100.009", "kN*m"), t).changes.empty());
    CHECK(compare_baselines(one("100.000", "kN*m"), one("100.011", "kN*m"), t).moved());
    // Near zero the floor decides: 0.0009 kN*m = 0.9 N*m is within 1 N*m.
    CHECK_FALSE(compare_baselines(one("0", "kN*m"), one("0.0009", "kN*m"), t).moved());
    CHECK(compare_baselines(one("0", "kN*m"), one("0.0011", "kN*m"), t).moved());
    std::string error;
    REQUIRE(set_floor(t, "0.01", "kip*ft", error));
    // 0.01 kip*ft = 13.558 N*m (exact unit sizes): 0.012 kN*m now passes.
    CHECK_FALSE(compare_baselines(one("0", "kN*m"), one("0.012", "kN*m"), t).moved());
    CHECK_FALSE(set_floor(t, "0.01", "furlong", error));
    CHECK_FALSE(set_floor(t, "-1", "kN", error));
    // A baseline in other units compares in SI: 1 kip*ft = 1.35582 kN*m (exact unit sizes).
    Comparison c = compare_baselines(one("1.00000", "kip*ft"), one("1.35582", "kN*m"), t);
    CHECK_FALSE(c.moved());
    c = compare_baselines(one("1.00000", "kip*ft"), one("1.50000", "kN*m"), t);
    REQUIRE(c.changes.size() == 1);
    CHECK(c.changes[0].percent == Approx((1.5 / 1.3558179483314 - 1.0) * 100.0));
}

TEST_CASE("values added and removed are changes too, listed after those that moved", "[baseline]") {
    Baseline old = baseline_of(two_span("40 ft"));
    Baseline now = old;
    now.values.erase(now.values.begin());
    now.values.push_back({"case E node X dx", "1.00000", 1.0, "in", "", 0});
    now.values[3].value += 1.0;
    now.values[3].text = "changed";
    Comparison c = compare_baselines(old, now, default_tolerances());
    REQUIRE(c.changes.size() == 3);
    CHECK(c.changes[0].kind == ValueChange::Kind::moved);
    CHECK(c.changes[1].kind == ValueChange::Kind::added);
    CHECK(c.changes[2].kind == ValueChange::Kind::removed);
    CHECK(c.changes[2].key == old.values.front().key);
    std::string lines = describe_changes(c);
    CHECK(lines.find("added") != std::string::npos);
    CHECK(lines.find("removed") != std::string::npos);
}

TEST_CASE("baseline files sit beside their models", "[baseline]") {
    CHECK(baseline_path("models/frame 2.firn") == "models/frame 2.baseline");
    CHECK(baseline_path("model.txt") == "model.txt.baseline");
    CHECK(model_file_name("a/b/c.firn") == "c.firn");
}

}  // namespace firn

namespace firn {
namespace {

TEST_CASE("a member held to one row twice reads back from its baseline", "[baseline]") {
    // Found by the fuzz target: two `deflection` statements over the same member and row
    // wrote one key twice, so `firn baseline update` wrote a baseline `check` refused.
    std::string text = two_span("40 ft") +
                       "use ibc2018\n"
                       "deflection roof.* limit ibc2018.roof_no_ceiling\n"
                       "deflection roof.A.B limit ibc2018.roof_no_ceiling\n";
    Baseline b = baseline_of(text);
    // The D + L column of roof.A.B: the key is there (once).
    REQUIRE(find(b, "deflection ibc2018.roof_no_ceiling member roof.A.B D+L deflection"));
    std::string error;
    CHECK(read_baseline(baseline_text(b), "two_span.baseline", error).has_value());
    CHECK(error.empty());
}

}  // namespace
}  // namespace firn

namespace firn {
namespace {

/// A portal (A, B) with a lean-to bay B-C whose beam is hinged at both ends, the
/// lean-to bay ending at `c` (as tests/baseline/leanto/ holds it).
std::string portal_with_leanto(const char* c) {
    return fmt::format(
        "model \"Portal with lean-to\"\nuse materials\nreport units kip, ft\n"
        "grid x A = 0 ft, B = 40 ft, C = {}\ngrid y base = 0 ft, low = 12 ft, eave = 20 ft\n"
        "section post structural_steel, A = 9.12 in2, I = 110 in4\n"
        "section girder structural_steel, A = 11.8 in2, I = 510 in4\n"
        "section joist structural_steel, A = 5.0 in2, I = 150 in4\n"
        "columns on A, B from base to eave section post\n"
        "columns on C from base to low section post\n"
        "beams along eave from A to B section girder\n"
        "beams along low from B to C section joist hinge at B.low, C.low\n"
        "support fixed at A.base, B.base\nsupport pinned at C.base\n"
        "case D dead {{\n  uniform 0.6 kip/ft down on eave.A.B\n"
        "  uniform 0.4 kip/ft down on low.B.C\n}}\n"
        "case W wind {{\n  point 2 kip x at A.eave\n}}\n",
        c);
}

TEST_CASE("a widened lean-to bay lists the lean-to beam's moment first, small displacements last",
          "[baseline]") {
    Baseline old = baseline_of(portal_with_leanto("60 ft"));
    Baseline now = baseline_of(portal_with_leanto("64 ft"));
    Comparison c = compare_baselines(old, now, default_tolerances());
    REQUIRE(c.changes.size() == 12);
    // The lean-to beam is simply supported: M = w L^2 / 8 = 0.4 x 20^2 / 8 = 20 kip*ft,
    // then 0.4 x 24^2 / 8 = 28.8 kip*ft, +44 % (statics).
    const ValueChange& first = c.changes.front();
    CHECK(first.key == "case D member low.B.C moment_max");
    CHECK(first.percent == Approx(44.0).epsilon(1e-5));
    CHECK(first.quantity_kind == "moment");
    // Its significance is the 8.8 kip*ft change over the largest moment of either version.
    double largest = 0.0;
    for (const Baseline* b : {&old, &now}) {
        for (const BaselineValue& v : b->values)
            largest = v.unit == "kip*ft" ? std::max(largest, std::fabs(v.value)) : largest;
    }
    CHECK(largest > 28.8);  // the portal's moments are larger than the lean-to's
    CHECK(first.significance == Approx(8.8 / largest).epsilon(1e-5));
    // By raw percentage the lean-to's deflection (+107 %) and a 0.0004 in move of the
    // lean-to post's top (+20 %) would come first or beside it; by significance the
    // post-top move is below the noise floor.
    const ValueChange* post_top = nullptr;
    for (const ValueChange& v : c.changes) {
        if (v.key == "case D node C.low dy")
            post_top = &v;
    }
    REQUIRE(post_top);
    // Post C shortens by R L / (E A), R from 4 to 4.8 kip: +20 % (statics), to the six
    // significant digits a baseline keeps.
    CHECK(post_top->percent == Approx(20.0).epsilon(1e-3));
    CHECK(post_top->significance < 0.001);
    CHECK(c.significant == 7);
    std::string listed = describe_changes(c, Listing{3, 0.001});
    CHECK(listed.find("member low.B.C  moment_max") < listed.find("deflection_max"));
    CHECK(listed.find("... 4 more moved, less significant (--top 0 lists all)") !=
          std::string::npos);
    CHECK(listed.find("... 5 more moved by less than 0.1 % of their kind's largest") !=
          std::string::npos);
    CHECK(describe_changes(c, Listing{0, 0.0}).find("node C.low") != std::string::npos);
}

}  // namespace
}  // namespace firn
