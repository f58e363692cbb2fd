// Tests of the local member loads derived from a model's load cases. The
// expected components follow from resolving forces along and across a
// member (trigonometry, statics).
#include <catch2/catch.hpp>
#include <cmath>

#include "derive/derive.hpp"
#include "testing/test_model_builder.hpp"

namespace firn {
namespace {

using testing::exactly;
using testing::ModelBuilder;

/// A rafter rising 3 in 4 (cos = 0.8, sin = 0.6), 5 m long, and a column.
struct Frame {
    ModelBuilder b;
    MemberId rafter{}, column{};
    NodeId low{}, high{};
    Frame() {
        SectionId s = b.section(b.material(200e9, 77e3), 0.02, 1e-4);
        low = b.node("A", 0.0, 0.0);
        high = b.node("B", 4.0, 3.0);
        NodeId top = b.node("C", 0.0, 5.0);
        rafter = b.member("AB", low, high, s);
        column = b.member("AC", low, top, s);
    }
};

TEST_CASE("a load per horizontal projection on a sloped member", "[loads]") {
    Frame f;
    CaseId c = f.b.load_case("snow");
    f.b.spread(c, f.rafter, LoadDirection::down, 1.0, 3.0, 2e3, 4e3, true);
    Diagnostics d;
    LoadSet set = derive_loads(f.b.model, d);
    auto on = set.cases[0].distributed_on(f.rafter);
    REQUIRE(on.size() == 1);
    const LocalDistributed& q = on[0];
    // w per horizontal length acts on cos(a) of horizontal run per unit member
    // length; down resolves to -sin(a) along and -cos(a) across the member;
    // horizontal positions stretch by 1/cos(a) along it (trigonometry).
    CHECK(q.a == exactly(1.0 / 0.8));
    CHECK(q.b == exactly(3.0 / 0.8));
    CHECK(q.qy_a == exactly(-2e3 * 0.8 * 0.8));
    CHECK(q.qy_b == exactly(-4e3 * 0.8 * 0.8));
    CHECK(q.qx_a == exactly(-2e3 * 0.8 * 0.6));
    // The total vertical load is still the average intensity times the run (statics).
    double vertical =
        0.5 * (q.qy_a + q.qy_b) * (q.b - q.a) * 0.8 + 0.5 * (q.qx_a + q.qx_b) * (q.b - q.a) * 0.6;
    CHECK(vertical == exactly(-3e3 * 2.0));
    CHECK(set.cases[0].distributed_on(f.column).empty());
}

TEST_CASE("global, local and self-weight loads", "[loads]") {
    Frame f;
    CaseId c = f.b.load_case("mixed");
    f.b.point(c, f.rafter, LoadDirection::global_x, 2.0, 1e3);
    f.b.point(c, f.rafter, LoadDirection::transverse, 1.0, 5e2);
    f.b.moment(c, f.column, 2.5, 7e2);
    f.b.loads(c).self_weight.push_back({{f.column}, false, f.b.place()});
    f.b.nodal(c, f.high, 1.0, 2.0, 3.0);
    f.b.nodal(c, f.high, 1.0, 0.0, 0.0);
    Diagnostics d;
    LoadSet set = derive_loads(f.b.model, d);
    const CaseLoads& cl = set.cases[0];
    auto points = cl.points_on(f.rafter);
    REQUIRE(points.size() == 2);
    // Global x on a member at angle a: cos(a) along, -sin(a) across (trigonometry).
    CHECK(points[0].px == exactly(1e3 * 0.8));
    CHECK(points[0].py == exactly(-1e3 * 0.6));
    CHECK(points[1].py == exactly(5e2));
    REQUIRE(cl.points_on(f.column).size() == 1);
    CHECK(cl.points_on(f.column)[0].mz == 7e2);
    // Self weight: unit weight times area, down; on a column that is all axial.
    auto weight = cl.distributed_on(f.column);
    REQUIRE(weight.size() == 1);
    CHECK(weight[0].qx_a == exactly(-77e3 * 0.02));
    CHECK(weight[0].qy_a == exactly(0.0, 1.0));
    CHECK(weight[0].b == exactly(5.0));
    CHECK(cl.distributed_on(f.rafter).empty());
    // Nodal loads at one node add up.
    CHECK(cl.nodal[at(f.high) * 3 + dof_x] == 2.0);
    CHECK(cl.nodal[at(f.high) * 3 + dof_rotation] == 3.0);
}

TEST_CASE("a projected load on a vertical member is a warning", "[loads]") {
    Frame f;
    CaseId c = f.b.load_case("snow");
    f.b.spread(c, f.column, LoadDirection::down, 0.0, 1.0, 1e3, 1e3, true);
    Diagnostics d;
    LoadSet set = derive_loads(f.b.model, d);
    CHECK(d.error_count() == 0);
    REQUIRE(d.all().size() == 1);
    CHECK(d.all()[0].severity == Severity::warning);
    CHECK(set.cases[0].distributed_on(f.column).empty());
}

}  // namespace
}  // namespace firn
