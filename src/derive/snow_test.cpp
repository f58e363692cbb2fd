// Tests of the snow provisions (ASCE 7-16 Chapter 7). Every expected value is
// worked out by hand from the clause named beside it; values of the standard's
// tables that were entered from memory are marked so (see stdlib/asce7_16.firn).
#include <fmt/format.h>
#include <catch2/catch.hpp>
#include <cmath>
#include <fstream>
#include <iterator>
#include <map>

#include "derive/snow.hpp"
#include "driver/driver.hpp"
#include "report/report.hpp"
#include "testing/test_text.hpp"

using namespace firn;
using firn::testing::first_message;

namespace {

constexpr double kPsf = 4.4482216152605 / (0.3048 * 0.3048);  // exact: lbf / ft^2 in Pa
constexpr double kFt = 0.3048;
constexpr double kDeg = 3.14159265358979323846 / 180.0;

/// A three-bay frame with flat roof beams, tributary 20 ft, and the given
/// snow settings (one per line).
std::string flat_frame(const std::string& snow, const std::string& roof_extra = "") {
    return fmt::format(
        "model \"snow\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
        "grid x A..D spacing 24 ft\ngrid y base = 0 ft, eave = 16 ft\n"
        "section post structural_steel, A = 9.12 in2, I = 110 in4\n"
        "section girder structural_steel, A = 11.8 in2, I = 510 in4\n"
        "columns on A..D from base to eave section post\n"
        "beams along eave from A to D section girder\nsupport fixed at base\n"
        "snow S {{\n  standard = asce7_16\n{}}}\n"
        "roof main on eave.* {{\n  tributary = 20 ft\n{}}}\n",
        snow, roof_extra);
}

const char* const kSite =
    "  pg = 40 psf\n  terrain = C\n  exposure = partially\n  thermal = unheated\n  risk = II\n";

Analysis analysed(const std::string& text, const ImportOptions& options = {}) {
    Analysis a = analyse_text("input", text, nullptr, options);
    INFO(render(a.diagnostics, a.sources));
    REQUIRE(a.ok);
    return a;
}

/// The snow case named `name`, or nullptr.
const LoadCase* find_case(const Model& m, const std::string& name) {
    for (const LoadCase& lc : m.cases) {
        if (lc.name == name)
            return &lc;
    }
    return nullptr;
}

/// The uniform pressure of a snow case on a member, from its line load / 20 ft.
double pressure_on(const Model& m, const std::string& c, std::size_t load = 0) {
    const LoadCase* lc = find_case(m, c);
    REQUIRE(lc != nullptr);
    REQUIRE(lc->distributed.size() > load);
    return lc->distributed[load].w_start / (20 * kFt);
}

bool trace_has(const Analysis& a, const std::string& text) {
    for (const TraceStep& t : a.derivation.snow_trace) {
        if (trace_text(t, a.model.units).find(text) != std::string::npos)
            return true;
    }
    return false;
}

}  // namespace

TEST_CASE("snow: pf = 0.7 Ce Ct Is pg") {
    // ASCE 7-16 Eq. 7.3-1 with Ce = 1.0 (terrain C, partially exposed, Table 7.3-1,
    // from memory), Ct = 1.2 (unheated, Table 7.3-2), Is = 1.0 (risk II, Table 1.5-2,
    // from memory): pf = 0.7 x 1.0 x 1.2 x 1.0 x 40 psf = 33.6 psf. Flat roof: Cs = 1
    // (Sec. 7.4), so the balanced load is ps = pf.
    Analysis a = analysed(flat_frame(kSite));
    CHECK(pressure_on(a.model, "S.balanced") == Approx(33.6 * kPsf).epsilon(1e-12));
    CHECK(trace_has(a,
                    "pf = 0.7 Ce Ct Is pg = 0.7 x 1.00 x 1.20 x 1.00 x 40.0 psf = "
                    "33.6 psf"));
    // Every member of the roof takes it, on its horizontal projection.
    REQUIRE(find_case(a.model, "S.balanced")->distributed.size() == 3);
    CHECK(find_case(a.model, "S.balanced")->distributed[2].projected);
}

TEST_CASE("snow: the factors follow terrain, exposure, thermal condition and risk") {
    // Table 7.3-1 (from memory): D fully exposed Ce = 0.8; Table 7.3-2: freezer
    // Ct = 1.3; Table 1.5-2 (from memory): risk IV Is = 1.2.
    // pf = 0.7 x 0.8 x 1.3 x 1.2 x 30 psf = 26.208 psf.
    Analysis a = analysed(flat_frame(
        "  pg = 30 psf\n  terrain = D\n  exposure = fully\n  thermal = freezer\n  risk = IV\n"));
    CHECK(pressure_on(a.model, "S.balanced") == Approx(26.208 * kPsf).epsilon(1e-12));
}

TEST_CASE("snow: a factor given instead of its table carries its reason into the trace") {
    // Eq. 7.3-1 with Ct = 1.1 given: 0.7 x 1.0 x 1.1 x 1.0 x 40 psf = 30.8 psf.
    Analysis a = analysed(
        flat_frame(std::string(kSite) + "  Ct = 1.1 because \"kept just above freezing\"\n"));
    CHECK(pressure_on(a.model, "S.balanced") == Approx(30.8 * kPsf).epsilon(1e-12));
    CHECK(trace_has(a,
                    "Ct = 1.10, given instead of Table 7.3-2: \"kept just above "
                    "freezing\""));
}

TEST_CASE("snow: pm is Is pg up to 20 psf and 20 Is above, as a case of its own") {
    // ASCE 7-16 Sec. 7.3.4 (from memory), risk III so Is = 1.1 (Table 1.5-2, from memory).
    auto site = [](const char* pg) {
        return fmt::format(
            "  pg = {}\n  terrain = C\n  exposure = partially\n"
            "  thermal = heated\n  risk = III\n",
            pg);
    };
    Analysis low = analysed(flat_frame(site("15 psf")));
    CHECK(pressure_on(low.model, "S.minimum") == Approx(1.1 * 15 * kPsf).epsilon(1e-12));
    Analysis high = analysed(flat_frame(site("40 psf")));
    CHECK(pressure_on(high.model, "S.minimum") == Approx(1.1 * 20 * kPsf).epsilon(1e-12));
    // Never a floor on pf: the balanced case keeps pf = 0.7 x 1.0 x 1.0 x 1.1 x 15 = 11.55 psf
    // (plus the rain-on-snow surcharge, which applies at pg = 15 psf: Sec. 7.10, 5 psf).
    CHECK(pressure_on(low.model, "S.balanced") == Approx((11.55 + 5.0) * kPsf).epsilon(1e-12));
}

TEST_CASE("snow: rain-on-snow applies for 0 < pg <= 20 psf on roofs flatter than W/50") {
    // ASCE 7-16 Sec. 7.10 (from memory). Flat roof, W = 72 ft: 0 deg < 72/50 = 1.44 deg.
    // pf = 0.7 x 1.0 x 1.0 x 1.0 x 20 psf = 14 psf; balanced 14 + 5 = 19 psf.
    const char* site20 =
        "  pg = 20 psf\n  terrain = C\n  exposure = partially\n  thermal = heated\n  risk = II\n";
    Analysis a = analysed(flat_frame(site20));
    CHECK(pressure_on(a.model, "S.balanced") == Approx(19.0 * kPsf).epsilon(1e-12));
    // pg = 25 psf is above 20 psf: no surcharge, pf = 0.7 x 25 = 17.5 psf.
    Analysis b = analysed(flat_frame(
        "  pg = 25 psf\n  terrain = C\n  exposure = partially\n  thermal = heated\n  risk = II\n"));
    CHECK(pressure_on(b.model, "S.balanced") == Approx(17.5 * kPsf).epsilon(1e-12));
    CHECK(trace_has(b,
                    "rain-on-snow surcharge not required: pg = 25.0 psf is above "
                    "20.0 psf"));
}

TEST_CASE("snow: rain-on-snow does not apply to a roof steeper than W/50") {
    // A 4:12 gable, eave to ridge W = 24 ft: slope 18.43 deg is not below 24/50 = 0.48 deg.
    std::string text =
        "model \"gable\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
        "grid x A..C spacing 24 ft\ngrid y base = 0 ft, eave = 16 ft, ridge = 24 ft\n"
        "section s structural_steel, A = 11.8 in2, I = 510 in4\n"
        "columns on A, C from base to eave section s\n"
        "rafters gable from A.eave to B.ridge to C.eave section s\nsupport pinned at base\n"
        "snow S {\n  standard = asce7_16\n  pg = 15 psf\n  terrain = C\n  exposure = partially\n"
        "  thermal = heated\n  risk = II\n}\nroof main on gable.* {\n  tributary = 20 ft\n}\n";
    Analysis a = analysed(text);
    CHECK(trace_has(a,
                    "rain-on-snow surcharge not required: slope 18.43 deg is not below "
                    "W/50.000 ft = 24.000 ft / 50.000 ft = 0.48 deg"));
    // Warm roof, other surface: Cs = 1 up to 30 deg (Fig. 7.4-1a, from memory), so
    // ps = pf = 0.7 x 15 = 10.5 psf. Slope 18.43 deg >= 15 deg: no minimum case (Sec. 7.3.4).
    CHECK(pressure_on(a.model, "S.balanced") == Approx(10.5 * kPsf).epsilon(1e-12));
    CHECK(find_case(a.model, "S.minimum") == nullptr);
}

TEST_CASE("snow: Cs on all six curves of Fig. 7.4-1, at, below and above each knee") {
    // ASCE 7-16 Sec. 7.4: Cs = 1 up to the knee, then 1 - (t - knee)/(70 - knee).
    // Knees: warm 5 (slippery, checked) / 30 (other); cold ventilated 10 (slippery,
    // checked) / 37.5; cold 15 / 45 (the unchecked ones from memory). Hand values.
    Analysis a = analysed(flat_frame(kSite));
    const SnowTables& t = a.model.snow->tables;
    struct Row {
        double Ct;
        bool slippery;
        double knee;
    };
    for (Row row : {Row{1.0, true, 5}, Row{1.0, false, 30}, Row{1.1, true, 10},
                    Row{1.1, false, 37.5}, Row{1.2, true, 15}, Row{1.2, false, 45}}) {
        INFO("Ct " << row.Ct << (row.slippery ? " slippery" : " other"));
        CHECK(roof_slope_factor(t, row.Ct, row.slippery, (row.knee - 1) * kDeg) == 1.0);
        CHECK(roof_slope_factor(t, row.Ct, row.slippery, row.knee * kDeg) == Approx(1.0));
        double above = row.knee + 10;
        CHECK(roof_slope_factor(t, row.Ct, row.slippery, above * kDeg) ==
              Approx(1.0 - 10.0 / (70.0 - row.knee)).epsilon(1e-12));
        CHECK(roof_slope_factor(t, row.Ct, row.slippery, 70 * kDeg) == 0.0);
    }
    // Spot values at 4:12 (18.43 deg), hand computed: warm slippery 1 - 13.43/65 = 0.793;
    // cold ventilated slippery 1 - 8.43/60 = 0.859; cold slippery 1 - 3.43/55 = 0.938.
    double four12 = std::atan(4.0 / 12.0);
    CHECK(roof_slope_factor(t, 1.0, true, four12) == Approx(0.7932).epsilon(1e-3));
    CHECK(roof_slope_factor(t, 1.1, true, four12) == Approx(0.8595).epsilon(1e-3));
    CHECK(roof_slope_factor(t, 1.3, true, four12) == Approx(0.9376).epsilon(1e-3));
    // Freezers (Ct 1.3) use the cold curve, greenhouses (Ct 0.85) the warm one.
    CHECK(roof_slope_factor(t, 0.85, false, 31 * kDeg) == Approx(1.0 - 1.0 / 40.0));
}

TEST_CASE("snow: a warm slippery roof needs its insulation for the slippery curve") {
    // ASCE 7-16 Sec. 7.4.1 (from memory): R >= 30 unventilated. A 6:12 gable (26.57 deg),
    // warm (Ct = 1.0): with R-19 it takes the curve for other surfaces (knee 30: Cs = 1);
    // with R-38 the slippery curve: Cs = 1 - (26.57 - 5)/65 = 0.668.
    auto model = [](const char* insulation) {
        return fmt::format(
            "model \"gable\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
            "grid x A..C spacing 24 ft\ngrid y base = 0 ft, eave = 16 ft, ridge = 28 ft\n"
            "section s structural_steel, A = 11.8 in2, I = 510 in4\n"
            "columns on A, C from base to eave section s\n"
            "rafters gable from A.eave to B.ridge to C.eave section s\nsupport pinned at base\n"
            "snow S {{\n  standard = asce7_16\n  pg = 30 psf\n  terrain = C\n"
            "  exposure = partially\n  thermal = heated\n  risk = II\n}}\n"
            "roof main on gable.* {{\n  tributary = 20 ft\n  surface = slippery\n"
            "  insulation = {}\n}}\n",
            insulation);
    };
    double pf = 0.7 * 30;  // Eq. 7.3-1, all factors 1.0
    Analysis poor = analysed(model("19"));
    CHECK(pressure_on(poor.model, "S.balanced") == Approx(pf * kPsf).epsilon(1e-12));
    Analysis good = analysed(model("38"));
    double cs = 1.0 - (std::atan(0.5) / kDeg - 5.0) / 65.0;
    CHECK(cs == Approx(0.668).epsilon(1e-3));
    CHECK(pressure_on(good.model, "S.balanced") == Approx(cs * pf * kPsf).epsilon(1e-12));
}

TEST_CASE("snow: an amendment file changes a library value without a rebuild") {
    // ASCE 7-16 Sec. 7.3.4 with the pg limit amended from 20 to 30 psf: for pg = 25 psf
    // and Is = 1.0, pm = Is pg = 25 psf instead of 20 Is = 20 psf.
    ImportOptions options;
    options.read = [](const std::string& path, std::string& text, std::string& error) {
        if (path != "county.firn") {
            error = "cannot read";
            return false;
        }
        text = "amend asce7_16.pm.pg_limit = 30 psf because \"county amendment 7\"\n";
        return true;
    };
    std::string site =
        "  pg = 25 psf\n  terrain = C\n  exposure = partially\n  thermal = heated\n  risk = II\n";
    Analysis plain = analysed(flat_frame(site));
    CHECK(pressure_on(plain.model, "S.minimum") == Approx(20 * kPsf).epsilon(1e-12));
    Analysis amended = analysed("use \"county.firn\"\n" + flat_frame(site), options);
    CHECK(pressure_on(amended.model, "S.minimum") == Approx(25 * kPsf).epsilon(1e-12));
    CHECK(trace_has(amended,
                    "amended: asce7_16.pm.pg_limit = 30.0 psf because \"county "
                    "amendment 7\""));
}

TEST_CASE("snow: SI input gives the same loads as US customary") {
    // 1.915 kPa is 40.0 psf to 0.01 %; exact conversion keeps pf proportional.
    Analysis si = analysed(
        flat_frame("  pg = 1.915 kPa\n  terrain = C\n  exposure = partially\n  thermal = unheated\n"
                   "  risk = II\n"));
    CHECK(pressure_on(si.model, "S.balanced") == Approx(0.7 * 1.2 * 1915.0).epsilon(1e-12));
}

TEST_CASE("snow: the drift formula takes SI values through its own units exactly") {
    // ASCE 7-16 Fig. 7.6-1: hd = 0.43 lu^(1/3) (pg + 10)^(1/4) - 1.5 in ft and psf. For
    // lu = 20 m = 65.6168 ft and pg = 2.0 kPa = 41.7709 psf (1 ft = 0.3048 m and
    // 1 lbf = 4.4482216152605 N, both exact by definition): hd = 3.15223 ft = 0.960801 m.
    Analysis a = analysed(flat_frame(kSite));
    CHECK(drift_height(a.model.snow->tables, 2000.0, 20.0) == Approx(0.960801).epsilon(1e-6));
}

TEST_CASE("snow: balanced snow on a simple span gives wL^2/8") {
    // Statics, common practice: a simply supported beam under uniform w has
    // M_mid = wL^2/8 and reactions wL/2. w = pf x 20 ft with pf = 33.6 psf (above).
    std::string text =
        "model \"beam\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
        "grid x A..B spacing 30 ft\ngrid y top = 0 ft\n"
        "section s structural_steel, A = 11.8 in2, I = 510 in4\n"
        "beams along top from A to B section s\n"
        "support pinned at A.top\nsupport roller at B.top\n"
        "snow S {\n  standard = asce7_16\n" +
        std::string(kSite) + "}\nroof main on top.A.B {\n  tributary = 20 ft\n}\n";
    Analysis a = analysed(text);
    double w = 33.6 * kPsf * 20 * kFt;
    double L = 30 * kFt;
    std::size_t c = 0;
    while (a.model.cases[c].name != "S.balanced")
        ++c;
    const MemberSummary& s = a.results.cases[c].members[0];
    CHECK(s.moment_max.value == Approx(w * L * L / 8).epsilon(1e-9));
    CHECK(s.moment_max.position == Approx(L / 2).epsilon(1e-9));
    CHECK(a.results.cases[c].reactions[0][1] == Approx(w * L / 2).epsilon(1e-9));
}

TEST_CASE("snow: bad site and roof data get located errors") {
    CHECK(first_message(flat_frame("  pg = -5 psf\n  terrain = C\n  exposure = partially\n"
                                   "  thermal = unheated\n  risk = II\n")) ==
          "input:14:8: error: the ground snow load pg cannot be negative");
    CHECK(
        first_message(flat_frame("  pg = 40 psf\n  terrain = above_tree_line\n"
                                 "  exposure = sheltered\n  thermal = unheated\n  risk = II\n")) ==
        "input:16:14: error: exposure 'sheltered' is not allowed for terrain 'above_tree_line' "
        "(ASCE 7-16 Table 7.3-1)");
    CHECK(first_message(flat_frame(std::string(kSite) + "  Ce = 0.9\n")) ==
          "input:19:3: error: an overridden Ce needs its reason: Ce = ... because \"the local "
          "amendment or ruling\"");
    CHECK(first_message(flat_frame("  pg = 40 psf\n  terrain = E\n  exposure = partially\n"
                                   "  thermal = unheated\n  risk = II\n")) ==
          "input:15:13: error: terrain is one of B, C, D, above_tree_line, alaska_treeless; "
          "found 'E'");
}

TEST_CASE("snow: density and drift height for several lu and pg") {
    // ASCE 7-16 Eq. 7.7-1: gamma = 0.13 pg + 14 <= 30 pcf. Fig. 7.6-1: hd = 0.43 lu^(1/3)
    // (pg + 10)^(1/4) - 1.5 (ft, psf), lu at least 20 ft (from memory). Hand values.
    Analysis a = analysed(flat_frame(kSite));
    const SnowTables& t = a.model.snow->tables;
    constexpr double kPcf = 4.4482216152605 / (kFt * kFt * kFt);
    CHECK(snow_density(t, 40 * kPsf) == Approx(19.2 * kPcf).epsilon(1e-12));
    CHECK(snow_density(t, 150 * kPsf) == Approx(30.0 * kPcf).epsilon(1e-12));  // 33.5 capped
    struct Row {
        double lu_ft, pg_psf, hd_ft;
    };
    // 0.43 x 30^(1/3) x 50^(1/4) - 1.5 = 2.0529; 0.43 x 100^(1/3) x 40^(1/4) - 1.5 = 3.5194;
    // 0.43 x 20^(1/3) x 30^(1/4) - 1.5 = 1.2317 (lu = 10 ft is taken as 20 ft).
    for (Row row : {Row{30, 40, 2.0529}, Row{100, 30, 3.5194}, Row{10, 20, 1.2317}}) {
        INFO("lu " << row.lu_ft << " ft, pg " << row.pg_psf << " psf");
        CHECK(drift_height(t, row.pg_psf * kPsf, row.lu_ft * kFt) / kFt ==
              Approx(row.hd_ft).epsilon(1e-4));
    }
}

namespace {

/// A 4:12 gable of two rafters, eave to ridge `half` ft each side.
std::string gable(int half, const char* rafters) {
    return fmt::format(
        "model \"gable\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
        "grid x A..C spacing {} ft\ngrid y base = 0 ft, eave = 16 ft, ridge = 16 ft + {} ft / 3\n"
        "section s structural_steel, A = 11.8 in2, I = 510 in4\n"
        "columns on A, C from base to eave section s\n"
        "rafters gable from A.eave to B.ridge to C.eave section s\nsupport pinned at base\n"
        "snow S {{\n  standard = asce7_16\n  pg = 40 psf\n  terrain = C\n  exposure = partially\n"
        "  thermal = heated\n  risk = II\n}}\nroof main on gable.* {{\n  tributary = 20 ft\n"
        "  rafter_spans = {}\n}}\n",
        half, half, rafters);
}

}  // namespace

TEST_CASE("snow: unbalanced gable load by the general rule, wind from each side") {
    // ASCE 7-16 Sec. 7.6.1, Fig. 7.6-2 (from memory): W = 30 ft, 4:12 so S = 3.
    // pf = 0.7 x 40 = 28 psf = ps (Cs = 1 below 30 deg, Fig. 7.4-1a). Windward 0.3 ps = 8.4
    // psf. Leeward ps plus hd gamma / sqrt(S) = 2.0529 x 19.2 / sqrt(3) = 22.757 psf over
    // 8 hd sqrt(S) / 3 = 9.482 ft from the ridge (hd with lu = W = 30 ft, pg = 40 psf).
    Analysis a = analysed(gable(30, "continuous"));
    const LoadCase* left = find_case(a.model, "S.unbalanced.wind_from_left");
    REQUIRE(left != nullptr);
    REQUIRE(left->distributed.size() == 3);
    // gable.A.B is windward, gable.B.C leeward: its surcharge starts at the ridge (its start).
    CHECK(left->distributed[0].w_start / (20 * kFt) == Approx(8.4 * kPsf).epsilon(1e-12));
    CHECK(left->distributed[1].w_start / (20 * kFt) == Approx(28 * kPsf).epsilon(1e-12));
    CHECK(left->distributed[2].w_start / (20 * kFt) == Approx(22.757 * kPsf).epsilon(1e-4));
    CHECK(left->distributed[2].start == 0.0);
    CHECK(left->distributed[2].end / kFt == Approx(9.482).epsilon(1e-4));
    // Wind from the right: the mirror image, the surcharge ends at the ridge (gable.A.B's end).
    const LoadCase* right = find_case(a.model, "S.unbalanced.wind_from_right");
    REQUIRE(right != nullptr);
    REQUIRE(right->distributed.size() == 3);
    CHECK(right->distributed[1].start / kFt == Approx(30 - 9.482).epsilon(1e-4));
    CHECK(right->distributed[1].end / kFt == Approx(30).epsilon(1e-12));
    CHECK(right->distributed[2].w_start / (20 * kFt) == Approx(8.4 * kPsf).epsilon(1e-12));
}

TEST_CASE("snow: unbalanced gable load with W <= 20 ft and simply supported rafters") {
    // ASCE 7-16 Sec. 7.6.1 (from memory): windward 0, leeward uniform Is pg = 40 psf.
    Analysis a = analysed(gable(18, "simple"));
    const LoadCase* left = find_case(a.model, "S.unbalanced.wind_from_left");
    REQUIRE(left != nullptr);
    REQUIRE(left->distributed.size() == 1);
    CHECK(a.model.members[at(left->distributed[0].member)].name == "gable.B.C");
    CHECK(left->distributed[0].w_start / (20 * kFt) == Approx(40 * kPsf).epsilon(1e-12));
    // With continuous rafters the general rule applies even for W <= 20 ft.
    Analysis c = analysed(gable(18, "continuous"));
    CHECK(find_case(c.model, "S.unbalanced.wind_from_left")->distributed.size() == 3);
}

TEST_CASE("snow: no unbalanced load on a flat roof or below 1/2 on 12") {
    Analysis a = analysed(flat_frame(kSite));
    CHECK(find_case(a.model, "S.unbalanced.wind_from_left") == nullptr);
    CHECK(trace_has(a, "unbalanced load not required: roof main is not a hip or gable roof"));
}

namespace {

/// The flat frame (3 bays of 24 ft, pg = 40 psf, heated: pf = ps = 28 psf) with
/// settings for its roof's ends.
std::string stepped(const std::string& edges) {
    return flat_frame(
        "  pg = 40 psf\n  terrain = C\n  exposure = partially\n  thermal = heated\n  risk = II\n",
        edges);
}

/// The drift part of a drift case: its loads after the balanced ones (3 members).
std::vector<DistributedLoad> drift_part(const Model& m, const std::string& name) {
    const LoadCase* lc = find_case(m, name);
    REQUIRE(lc != nullptr);
    REQUIRE(lc->distributed.size() > 3);
    return {lc->distributed.begin() + 3, lc->distributed.end()};
}

}  // namespace

TEST_CASE("snow: a leeward step drift with hd <= hc") {
    // ASCE 7-16 Sec. 7.7.1 (from memory), Eq. 7.7-1, Fig. 7.6-1. gamma = 19.2 pcf;
    // hb = 28 / 19.2 = 1.4583 ft; hc = 8 - 1.4583 = 6.5417 ft. Leeward hd (lu = 60 ft)
    // = 0.43 x 60^(1/3) x 50^(1/4) - 1.5 = 2.9764 ft; windward 0.75 hd (lu = 72 ft)
    // = 0.75 x 3.2571 = 2.4428 ft: leeward governs. w = 4 hd = 11.906 ft; pd = hd gamma
    // = 57.147 psf, a triangle from the wall (x = 0) on eave.A.B.
    Analysis a = analysed(stepped("  step_left = 8 ft\n  step_left_upper_length = 60 ft\n"));
    auto drift = drift_part(a.model, "S.drift.main.step_left");
    REQUIRE(drift.size() == 1);
    CHECK(a.model.members[at(drift[0].member)].name == "eave.A.B");
    CHECK(drift[0].start == 0.0);
    CHECK(drift[0].end / kFt == Approx(4 * 2.9764).epsilon(1e-4));
    CHECK(drift[0].w_start / (20 * kFt) == Approx(2.9764 * 19.2 * kPsf).epsilon(1e-4));
    CHECK(drift[0].w_end == Approx(0.0).margin(1e-9));
    // Equilibrium of the whole case (statics): balanced 28 psf x 72 ft x 20 ft plus the
    // triangle's area 0.5 x pd x w x 20 ft, all carried by the supports.
    std::size_t c = 0;
    while (a.model.cases[c].name != "S.drift.main.step_left")
        ++c;
    double total = (28 * 72 + 0.5 * 2.9764 * 19.2 * 4 * 2.9764) * 20 * 4.4482216152605;
    CHECK(a.results.cases[c].equilibrium.reactions[1] == Approx(total).epsilon(1e-4));
}

TEST_CASE("snow: a step drift higher than the clear height is cut to hc and widened") {
    // Sec. 7.7.1 (from memory): step 3 ft, hc = 3 - 1.4583 = 1.5417 ft < hd = 2.9764 ft,
    // so w = 4 hd^2 / hc = 22.985 ft, at most 8 hc = 12.333 ft; the height is hc,
    // pd = 1.5417 x 19.2 = 29.6 psf.
    Analysis a = analysed(stepped("  step_left = 3 ft\n  step_left_upper_length = 60 ft\n"));
    auto drift = drift_part(a.model, "S.drift.main.step_left");
    REQUIRE(drift.size() == 1);
    CHECK(drift[0].end / kFt == Approx(8 * 1.54167).epsilon(1e-4));
    CHECK(drift[0].w_start / (20 * kFt) == Approx(1.54167 * 19.2 * kPsf).epsilon(1e-4));
}

TEST_CASE("snow: the windward drift governs below a short upper roof") {
    // Sec. 7.7.1 (from memory): upper roof 20 ft gives leeward hd = 0.43 x 20^(1/3) x
    // 50^(1/4) - 1.5 = 1.6040 ft; windward 0.75 x 3.2571 = 2.4428 ft governs. The drift
    // at the right end runs leftwards from x = 72 ft over w = 9.771 ft on eave.C.D.
    Analysis a = analysed(stepped("  step_right = 10 ft\n  step_right_upper_length = 20 ft\n"));
    CHECK(trace_has(a, "the windward governs"));
    auto drift = drift_part(a.model, "S.drift.main.step_right");
    REQUIRE(drift.size() == 1);
    CHECK(a.model.members[at(drift[0].member)].name == "eave.C.D");
    CHECK(drift[0].end / kFt == Approx(24).epsilon(1e-12));
    CHECK(drift[0].start / kFt == Approx(24 - 4 * 2.4428).epsilon(1e-4));
    CHECK(drift[0].w_end / (20 * kFt) == Approx(2.4428 * 19.2 * kPsf).epsilon(1e-4));
}

TEST_CASE("snow: a parapet drift, and one cut where it crosses a member end") {
    // Sec. 7.8 (from memory): 0.75 hd with lu = the roof's length (72 ft) = 2.4428 ft;
    // parapet 6 ft: hc = 4.5417 ft >= hd, w = 9.771 ft: on eave.A.B only.
    Analysis a = analysed(stepped("  parapet_left = 6 ft\n"));
    auto drift = drift_part(a.model, "S.drift.main.parapet_left");
    REQUIRE(drift.size() == 1);
    // A high step: leeward hd with lu = 400 ft = 0.43 x 400^(1/3) x 50^(1/4) - 1.5 = 6.9249
    // ft, w = 27.700 ft: the triangle crosses from eave.A.B (0..24 ft) onto eave.B.C, where
    // it runs from pd (1 - 24/25.124) to 0 over 3.700 ft.
    Analysis b = analysed(stepped("  step_left = 20 ft\n  step_left_upper_length = 400 ft\n"));
    auto wide = drift_part(b.model, "S.drift.main.step_left");
    REQUIRE(wide.size() == 2);
    double pd = 6.9249 * 19.2 * kPsf * 20 * kFt;
    CHECK(wide[0].w_end == Approx(pd * (1 - 24 / 27.6996)).epsilon(1e-3));
    CHECK(wide[1].w_start == Approx(pd * (1 - 24 / 27.6996)).epsilon(1e-3));
    CHECK(wide[1].end / kFt == Approx(27.6996 - 24).epsilon(1e-3));
}

TEST_CASE("snow: a leeward drift from an adjacent higher structure beyond a gap") {
    // ASCE 7-16 Sec. 7.7.2 (from memory): h = 10 ft, s = 6 ft < 20 ft and < 6h. Leeward hd
    // with lu = the higher roof's 60 ft = 2.9764 ft (Fig. 7.6-1, as in the step test), at
    // most (6h - s)/6 = 9 ft; width min(6 hd, 6h - s) = min(17.858, 54) = 17.858 ft.
    // Windward 0.75 hd (lu = 72 ft) = 2.4427 ft (Sec. 7.7.1) is lower: leeward governs.
    Analysis a = analysed(stepped(
        "  adjacent_left = 10 ft\n  adjacent_left_gap = 6 ft\n  adjacent_left_length = 60 ft\n"));
    CHECK(trace_has(a, "the leeward governs"));
    auto drift = drift_part(a.model, "S.drift.main.adjacent_left");
    REQUIRE(drift.size() == 1);
    CHECK(a.model.members[at(drift[0].member)].name == "eave.A.B");
    CHECK(drift[0].start == 0.0);
    CHECK(drift[0].end / kFt == Approx(6 * 2.9764).epsilon(1e-4));
    CHECK(drift[0].w_start / (20 * kFt) == Approx(2.9764 * 19.2 * kPsf).epsilon(1e-4));
}

TEST_CASE("snow: a drift from an adjacent structure limited by the gap, and none beyond 20 ft") {
    // Sec. 7.7.2 (from memory): h = 3 ft, s = 4 ft: height min(2.9764, (18 - 4)/6 = 2.3333)
    // = 2.3333 ft, width min(17.858, 14) = 14 ft. Windward 0.75 hd = 2.4427 ft exceeds
    // hc = 3 - 1.4583 = 1.5417 ft, so it is cut to hc (Sec. 7.7.1): leeward governs.
    Analysis a = analysed(stepped(
        "  adjacent_right = 3 ft\n  adjacent_right_gap = 4 ft\n  adjacent_right_length = 60 ft\n"));
    auto drift = drift_part(a.model, "S.drift.main.adjacent_right");
    REQUIRE(drift.size() == 1);
    CHECK(a.model.members[at(drift[0].member)].name == "eave.C.D");
    CHECK(drift[0].start / kFt == Approx(24 - 14).epsilon(1e-9));
    CHECK(drift[0].w_end / (20 * kFt) == Approx(2.33333 * 19.2 * kPsf).epsilon(1e-5));
    // s = 25 ft is not below 20 ft: no drift case.
    Analysis far =
        analysed(stepped("  adjacent_right = 30 ft\n  adjacent_right_gap = 25 ft\n  "
                         "adjacent_right_length = 60 ft\n"));
    CHECK(find_case(far.model, "S.drift.main.adjacent_right") == nullptr);
    CHECK(trace_has(far, "is not below both"));
}

TEST_CASE("snow: drifts at both faces of a roof projection, and none on a face under 15 ft") {
    // ASCE 7-16 Sec. 7.8 (from memory): faces at 30 and 38 ft on the 72 ft roof; lu = the
    // longer side, max(30, 34) = 34 ft; 0.75 hd = 0.75 (0.43 x 34^(1/3) x 50^(1/4) - 1.5)
    // = 1.6532 ft <= hc = 5 - 1.4583 ft; w = 4 x 1.6532 = 6.6128 ft; pd = 31.742 psf over
    // the 18 ft face (less than the 20 ft tributary width).
    std::string text = stepped("") +
                       "projection unit on main {\n  left_face = 30 ft\n  width = 8 ft\n"
                       "  face_length = 18 ft\n  height = 5 ft\n}\n";
    Analysis a = analysed(text);
    double pd = 1.65321 * 19.2 * kPsf * 18 * kFt;
    // Left face: from x = 30 ft leftwards, across the member end at B (x = 24 ft).
    auto left = drift_part(a.model, "S.drift.unit.left");
    REQUIRE(left.size() == 2);
    CHECK(a.model.members[at(left[0].member)].name == "eave.A.B");
    CHECK(left[0].start / kFt == Approx(24 - 0.61284).epsilon(1e-4));
    CHECK(left[0].w_end == Approx(pd * 0.61284 / 6.61284).epsilon(1e-4));
    CHECK(a.model.members[at(left[1].member)].name == "eave.B.C");
    CHECK(left[1].end / kFt == Approx(6).epsilon(1e-9));
    CHECK(left[1].w_end == Approx(pd).epsilon(1e-5));
    // Right face: from x = 38 ft rightwards, on eave.B.C from 14 ft to 20.613 ft.
    auto right = drift_part(a.model, "S.drift.unit.right");
    REQUIRE(right.size() == 1);
    CHECK(right[0].start / kFt == Approx(14).epsilon(1e-9));
    CHECK(right[0].end / kFt == Approx(20.61284).epsilon(1e-5));
    CHECK(right[0].w_start == Approx(pd).epsilon(1e-5));
    // A 12 ft face is shorter than 15 ft: no drift on it.
    std::string short_face = stepped("") +
                             "projection unit on main {\n  left_face = 30 ft\n  width = 8 ft\n"
                             "  face_length = 12 ft\n  height = 5 ft\n}\n";
    Analysis b = analysed(short_face);
    CHECK(find_case(b.model, "S.drift.unit.left") == nullptr);
    CHECK(trace_has(b, "shorter than 15.000 ft"));
}

TEST_CASE("snow: the tributary width from the plan grid") {
    // Common practice: an interior frame carries half of each bay beside it, an end frame
    // half of its one bay plus the roof's overhang beyond it. Plan lines 1..5 at 20, 30,
    // 30, 25 ft. Frame 2: (20 + 30) / 2 = 25 ft; frame 5: 25 / 2 + 1.5 = 14 ft.
    auto frame = [](const char* settings) {
        std::string text = flat_frame(kSite, "");
        text.replace(text.find("  tributary = 20 ft\n"), 20, settings);
        return "grid plan 1..5 spacing 20 ft, 30 ft, 30 ft, 25 ft\n" + text;
    };
    double pf = 33.6 * kPsf;  // as in the first test
    Analysis interior = analysed(frame("  frame = 2\n"));
    const LoadCase* lc = find_case(interior.model, "S.balanced");
    REQUIRE(lc != nullptr);
    CHECK(lc->distributed[0].w_start == Approx(pf * 25 * kFt).epsilon(1e-12));
    CHECK(trace_has(interior,
                    "tributary width of the frame on plan line 2 = half of each "
                    "bay beside it = (20.000 ft + 30.000 ft) / 2 = 25.000 ft"));
    Analysis end = analysed(frame("  frame = 5\n  overhang = 1.5 ft\n"));
    CHECK(find_case(end.model, "S.balanced")->distributed[0].w_start ==
          Approx(pf * 14 * kFt).epsilon(1e-12));
    CHECK(first_message(frame("  frame = 3\n  overhang = 1.5 ft\n")) ==
          "input:23:3: error: plan line '3' is not an end frame; an overhang beyond the end "
          "frames does not reach it");
    CHECK(first_message(frame("  frame = 7\n")) ==
          "input:22:11: error: unknown plan line '7'; the plan lines are 1, 2, 3, 4, 5");
}

namespace {

const char* const kWarmSite =
    "snow S {\n  standard = asce7_16\n  pg = 40 psf\n  terrain = C\n  exposure = partially\n"
    "  thermal = heated\n  risk = II\n}\n";

/// A flat roof that overhangs its first column by 2 ft (member eave.A.B).
std::string overhanging(const char* roof_extra) {
    return fmt::format(
        "model \"eaves\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
        "grid x A..E spacing 2 ft, 24 ft, 24 ft, 24 ft\ngrid y base = 0 ft, eave = 16 ft\n"
        "section s structural_steel, A = 11.8 in2, I = 510 in4\n"
        "columns on B..E from base to eave section s\n"
        "beams along eave from A to E section s\nsupport fixed at base\n{}"
        "roof main on eave.* {{\n  tributary = 20 ft\n{}}}\n",
        kWarmSite, roof_extra);
}

/// A monoslope upper roof (6:12, run 20 ft) whose eave stands above the left end of a
/// flat lower roof `lower` ft wide.
std::string sliding(int lower) {
    return fmt::format(
        "model \"sliding\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
        "grid x A = 0 ft, B = 20 ft, C = 20 ft + {} ft\n"
        "grid y base = 0 ft, low = 12 ft, mid = 20 ft, top = 30 ft\n"
        "section s structural_steel, A = 11.8 in2, I = 510 in4\n"
        "columns on A from base to top section s\ncolumns on B from base to mid section s\n"
        "columns on C from base to low section s\n"
        "rafters slope from A.top to B.mid section s\nbeams along low from B to C section s\n"
        "support fixed at base\n{}roof upper on slope.* {{\n  tributary = 20 ft\n}}\n"
        "roof lower on low.* {{\n  tributary = 20 ft\n  sliding_from_left = upper\n}}\n",
        lower, kWarmSite);
}

}  // namespace

TEST_CASE("snow: an ice dam load on the eave overhang of a poorly insulated warm roof") {
    // ASCE 7-16 Sec. 7.4.5 (from memory): 2 pf = 2 x 28 psf = 56 psf on the overhang only,
    // for a warm (heated) roof with R-19 < R-30, unventilated; none with R-30.
    Analysis a = analysed(overhanging("  insulation = 19\n"));
    const LoadCase* ice = find_case(a.model, "S.ice_dam");
    REQUIRE(ice != nullptr);
    REQUIRE(ice->distributed.size() == 1);
    CHECK(a.model.members[at(ice->distributed[0].member)].name == "eave.A.B");
    CHECK(ice->distributed[0].w_start / (20 * kFt) == Approx(56 * kPsf).epsilon(1e-12));
    Analysis b = analysed(overhanging("  insulation = 30\n"));
    CHECK(find_case(b.model, "S.ice_dam") == nullptr);
    CHECK(trace_has(b, "ice dam load not required: insulation R 30 is at least 30"));
}

TEST_CASE("snow: sliding snow from an upper roof, and onto a narrow lower roof") {
    // ASCE 7-16 Sec. 7.9 (from memory): the 6:12 upper roof (26.57 deg > 2 on 12, a
    // non-slippery surface) slides 0.4 pf W = 0.4 x 28 psf x 20 ft = 224 lb/ft of eave,
    // over 15 ft: 14.933 psf on the lower roof from its left end, on top of the balanced load.
    Analysis a = analysed(sliding(30));
    const LoadCase* lc = find_case(a.model, "S.sliding.lower.left");
    REQUIRE(lc != nullptr);
    const DistributedLoad& slide = lc->distributed.back();
    CHECK(a.model.members[at(slide.member)].name == "low.B.C");
    CHECK(slide.start == 0.0);
    CHECK(slide.end / kFt == Approx(15).epsilon(1e-12));
    CHECK(slide.w_start / (20 * kFt) == Approx(224.0 / 15 * kPsf).epsilon(1e-12));
    // A lower roof 10 ft wide keeps the intensity over its width (the load is cut).
    Analysis n = analysed(sliding(10));
    const DistributedLoad& narrow = find_case(n.model, "S.sliding.lower.left")->distributed.back();
    CHECK(narrow.end / kFt == Approx(10).epsilon(1e-12));
    CHECK(narrow.w_start / (20 * kFt) == Approx(224.0 / 15 * kPsf).epsilon(1e-12));
}

TEST_CASE("snow: the edition and its clauses come from the library, not from the code") {
    // The library module under another name and edition: the same numbers (so pf =
    // 0.7 x 1.0 x 1.2 x 1.0 x 40 psf = 33.6 psf, ASCE 7-16 Eq. 7.3-1), cited by the
    // names the module gives.
    std::ifstream in(std::string(FIRN_SOURCE_DIR) + "/stdlib/asce7_16.firn", std::ios::binary);
    std::string library((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
    auto renamed = [](std::string text) {
        for (auto [from, to] : {std::pair<std::string, std::string>{"asce7_16", "county_rules"},
                                {"\"ASCE 7-16\"", "\"County rules 2030\""},
                                {"\"Eq. 7.3-1\"", "\"Rule 3.1\""}}) {
            for (std::size_t at = text.find(from); at != std::string::npos;
                 at = text.find(from, at + to.size()))
                text.replace(at, from.size(), to);
        }
        return text;
    };
    ImportOptions options;
    options.read = [&](const std::string& path, std::string& text, std::string& error) {
        if (path != "county_rules.firn") {
            error = "cannot read";
            return false;
        }
        text = renamed(library);
        return true;
    };
    std::string model = flat_frame(kSite);
    model.replace(model.find("use asce7_16"), 12, "use \"county_rules.firn\"");
    model.replace(model.find("standard = asce7_16"), 19, "standard = county_rules");
    Analysis a = analysed(model, options);
    CHECK(pressure_on(a.model, "S.balanced") == Approx(33.6 * kPsf).epsilon(1e-12));
    CHECK(trace_text(a.derivation.snow_trace.front(), a.model.units) ==
          "Snow data S: County rules 2030, Chapter 7");
    bool cited = false;
    for (const TraceStep& t : a.derivation.snow_trace)
        cited = cited || t.clause == "County rules 2030 Rule 3.1";
    CHECK(cited);
}

TEST_CASE("snow: a roof member at or above the slope of Cs = 0 is a wall, not a roof") {
    // ASCE 7-16 Fig. 7.4-1: every Cs curve reaches 0 at 70 degrees; a surface that steep
    // holds no roof snow, so listing it in a roof is a modelling slip.
    auto rafter = [](const char* rise) {
        return fmt::format(
            "model \"snow\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
            "node base at x = 0 ft, y = 0 ft\nnode ridge at x = 10 ft, y = {}\n"
            "section girder structural_steel, A = 11.8 in2, I = 510 in4\n"
            "member R1 from base to ridge section girder\nsupport fixed at base\n"
            "snow S {{\n  standard = asce7_16\n{}}}\nroof main on R1 {{\n  tributary = 20 ft\n}}\n",
            rise, kSite);
    };
    // atan(27/10) = 69.68 deg: a very steep roof, still on the curve (Cs = 0.009).
    Analysis steep = analysed(rafter("27 ft"));
    CHECK(trace_has(steep, "Cs = 1 - (slope - knee)"));
    // atan(28/10) = 70.35 deg, and a vertical member.
    CHECK(first_message(rafter("28 ft")) ==
          "input:18:14: error: member 'R1' of roof 'main' slopes 70.3 deg: from 70 deg on a "
          "surface holds no snow (ASCE 7-16 Fig. 7.4-1a: Cs = 0), so it is a wall, not a roof; "
          "list only the roof's sloped and flat members");
}
