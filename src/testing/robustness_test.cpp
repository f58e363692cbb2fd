// Hostile and unusual input: never a crash, hang or wrong answer; always a
// located error or a correct result.
#include <fmt/format.h>
#include <catch2/catch.hpp>

#include "driver/driver.hpp"
#include "testing/test_text.hpp"

using namespace firn;
using firn::testing::first_message;
using firn::testing::kBaseModel;
using firn::testing::messages_for;

TEST_CASE("an empty file and a file of comments are models without members") {
    CHECK(first_message("") == "input:1:1: error: the model has no members");
    CHECK(first_message("# only a comment\n\n   # and another") ==
          "input:1:1: error: the model has no members");
}

TEST_CASE("Windows line endings and a UTF-8 byte order mark are accepted") {
    std::string text = "\xEF\xBB\xBF";
    for (char c : std::string(kBaseModel)) {
        if (c == '\n')
            text += '\r';
        text += c;
    }
    Analysis a = analyse_text("input", text);
    INFO(render(a.diagnostics, a.sources));
    CHECK(a.ok);
}

TEST_CASE("NaN and infinity are not numbers the language reads") {
    // Words in a value are names of constants; these are not defined.
    CHECK(first_message(std::string(kBaseModel) + "node N3 at x = nan, y = 0 ft\n") ==
          "input:9:16: error: unknown value 'nan'");
    CHECK(first_message(std::string(kBaseModel) + "node N3 at x = inf ft, y = 0 ft\n") ==
          "input:9:20: error: expected the end of the statement (a new line or ';'), found 'ft'");
}

TEST_CASE("a very long chain of terms is refused with a located error") {
    std::string chain = "1 ft";
    for (int i = 0; i < 200000; ++i)
        chain += " + 1 ft";
    // The 1000th "+" makes a tree 1001 levels deep; "let a = " takes 8 columns,
    // each term 7.
    CHECK(first_message(std::string(kBaseModel) + "let a = " + chain + "\n") ==
          "input:9:7006: error: this expression is too long (more than 1000 operations)");
    std::string inside = "(((((" + chain.substr(0, 4 + 7 * 299) + ")))))";
    CHECK(messages_for(std::string(kBaseModel) + "let a = " + inside + "\n").empty());
}

TEST_CASE("deep powers and calls are refused with a located error") {
    std::string powers;
    std::string calls;
    for (int i = 0; i < 50000; ++i) {
        powers += "2^";
        calls += "abs(";
    }
    CHECK(first_message(std::string(kBaseModel) + "let a = " + powers + "2\n") ==
          "input:9:210: error: expressions nest too deeply (more than 100 levels)");
    CHECK(first_message(std::string(kBaseModel) + "let a = " + calls + "2\n") ==
          "input:9:409: error: expressions nest too deeply (more than 100 levels)");
}

TEST_CASE("deep nesting is refused with a located error, not a stack overflow") {
    std::string deep(100000, '(');
    std::string text = std::string(kBaseModel) + "node N3 at x = " + deep + "1 ft, y = 0 ft\n";
    CHECK(first_message(text) ==
          "input:9:116: error: expressions nest too deeply (more than 100 levels)");
    std::string minus(100000, '-');
    CHECK(first_message(std::string(kBaseModel) + "node N3 at x = " + minus + "1 ft, y = 0 ft\n") ==
          "input:9:116: error: expressions nest too deeply (more than 100 levels)");
}

TEST_CASE("a very long line parses, and an error on it is shown in a window") {
    std::string list = "support fixed at N1";
    for (int i = 0; i < 20000; ++i)
        list += ", N1";
    std::string all = messages_for(std::string(kBaseModel) + list + "\n");
    CHECK(all.find("input:9:18: error: node 'N1' already has a support") == 0);
    CHECK(all.find("firn: 19901 more diagnostics not shown") != std::string::npos);
    CHECK(all.size() < 100000);
}

TEST_CASE("binary garbage gives errors, capped, and never a crash") {
    std::string garbage;
    for (int i = 0; i < 50000; ++i)
        garbage += static_cast<char>((i * 7919) % 256);
    std::string all = messages_for(garbage);
    CHECK(all.find("error:") != std::string::npos);
    CHECK(all.find("too many syntax errors") != std::string::npos);
}

TEST_CASE("a model with many independent errors stops after 50 syntax errors") {
    std::string text;
    for (int i = 0; i < 200; ++i)
        text += "nod N at x = 0 ft\n";
    std::string all = messages_for(text);
    std::size_t count = 0;
    for (std::size_t at = 0;
         (at = all.find(": error: expected a statement", at)) != std::string::npos; ++at)
        ++count;
    CHECK(count == 50);
    CHECK(
        all.find("firn: error: input: too many syntax errors; the rest of the file was not read") ==
        0);
}

TEST_CASE("huge and tiny numbers stay finite or are refused") {
    CHECK(first_message(
              std::string(kBaseModel) +
              "node N3 at x = 1e-400 ft, y = 5 ft\nmember B2 from N2 to N3 section beam\n") == "");
    CHECK(first_message(std::string(kBaseModel) + "material m E = 1e30 ksi\n") ==
          "input:9:16: error: this value is out of range (beyond 1e+15 in SI units)");
}

TEST_CASE("self weight on members whose section is unknown reports the section, not a crash") {
    // Found by the fuzzer: a member naming a missing section, in a model with no sections.
    CHECK(messages_for("node A at x = 0 ft, y = 0 ft\nnode B at x = 1 ft, y = 0 ft\n"
                       "member M from A to B section s\ncase D dead { self weight }\n") ==
          "input:3:30: error: unknown section 's'\n"
          "    member M from A to B section s\n"
          "                                 ^\n");
}

TEST_CASE("a title that is not UTF-8 is an error at the bad byte") {
    // Found by the fuzzer: such a title reached the JSON writer, which requires UTF-8.
    CHECK(first_message("model \"ab\xFD\"\n") == "input:1:10: error: a title must be UTF-8 text");
    CHECK(first_message("model \"caf\xC3\xA9 \xE2\x80\x94 frame\"\n") ==
          "input:1:1: error: the model has no members");
}

TEST_CASE("a unit's power beyond 100 is refused, never wrapped into another dimension") {
    // Dimensions keep their powers in 8 bits: ft^128 wrapped to ft^-128, and
    // 1 ft * 1 ft^128 * 1 ft^128 passed as a length. A power of -2147483648
    // under '/' overflowed an int.
    CHECK(first_message(std::string(kBaseModel) +
                        "node N3 at x = 1 ft * 1 ft^128 * 1 ft^128, y = 0 ft\n") ==
          "input:9:25: error: this unit's power is too high (beyond force or length to the "
          "power 100)");
    CHECK(first_message(std::string(kBaseModel) + "let a = 1 kip/ft^-2147483648\n") ==
          "input:9:15: error: this unit's power is too high (beyond force or length to the "
          "power 100)");
    // An exponent too large for an int is refused too, not read as a power of 1.
    CHECK(first_message(std::string(kBaseModel) + "let a = 3 ft^99999999999\n") ==
          "input:9:11: error: this unit's power is too high (beyond force or length to the "
          "power 100)");
    CHECK(first_message(std::string(kBaseModel) + "let a = 1 kcf^40\n") ==
          "input:9:11: error: this unit's power is too high (beyond force or length to the "
          "power 100)");
    CHECK(first_message(std::string(kBaseModel) + "let a = (1 ft^100) * (1 ft^100) / 1 ft^100\n") ==
          "input:9:9: error: cannot multiply a quantity of dimension length^100 and a quantity "
          "of dimension length^100: the result would be beyond force or length to the power 100");
    CHECK(messages_for(std::string(kBaseModel) + "let a = (1 ft^100) / (1 ft^99)\n"
                                                 "node N3 at x = a, y = 1 ft\n"
                                                 "member B2 from N2 to N3 section beam\n") == "");
}

TEST_CASE("groups nested deeper than 100 levels are refused, not a stack overflow") {
    std::string text = std::string(kBaseModel);
    for (int i = 0; i < 100000; ++i)
        text += fmt::format("group g{} = g{}\n", i, i + 1);
    text += "group g100000 = B1\ncase D dead { uniform 1 kip/ft down on g0 }\n";
    // g0 to g99 are being expanded when g99 names g100.
    CHECK(first_message(text) ==
          "input:108:13: error: groups nest too deeply (more than 100 levels)");
}

TEST_CASE("a group of every member of a large model, in many groups, takes linear time") {
    // Found by hand while fuzzing: each member added to a group was looked for
    // in the whole group, so 20 groups of 5000 members took half a minute.
    std::string text = std::string(kBaseModel) +
                       "grid x 1..5000 spacing 1 ft\ngrid y a = 10 ft, b = 11 ft\n"
                       "columns on 1..5000 from a to b section beam tag t\ngroup all = *, t\n";
    for (int i = 0; i < 200; ++i)
        text += fmt::format("group g{} = all, t, all\n", i);
    text += "case D dead { uniform 1 kip/ft down on g199 }\n";
    Analysis a = analyse_text("input", text + "support fixed at a\n");
    INFO(render(a.diagnostics, a.sources));
    REQUIRE(a.ok);
    CHECK(a.model.cases[0].distributed.size() == 5001);  // B1 and the columns, each once
}

TEST_CASE("generators cannot make more than 100000 members or 20000 grid lines") {
    // Found by hand while fuzzing: 150 bytes of runs and one generator asked
    // for 9 million members and ran out of time and memory.
    std::string grid =
        std::string(kBaseModel) + "grid x 1..10000 spacing 1 ft\ngrid y L1..L10000 spacing 1 ft\n";
    CHECK(first_message(grid + "columns on 1..10000 from L1 to L11 section beam\n") ==
          "input:11:12: error: these columns would bring the model to 100001 members; a model "
          "has at most 100000");
    CHECK(first_message(grid + "grid y M1..M2 spacing 1 ft from 1 in\n") ==
          "input:11:8: error: a model has at most 20000 grid lines");
}

TEST_CASE("rafters across thousands of column lines take linear time") {
    // Found by hand while fuzzing: each piece's ends were looked up among all
    // column lines, so two runs across 10000 lines took a minute.
    Analysis a = analyse_text("input", std::string(kBaseModel) +
                                           "grid x 1..10000 spacing 1 ft\n"
                                           "grid y a = 0 ft, b = 1 ft\n"
                                           "rafters r from 1.a to 10000.b section beam\n"
                                           "rafters q from 1.b to 10000.a section beam\n");
    CHECK(a.model.members.size() == 1 + 2 * 9999);
    CHECK(a.model.members.back().name == "q.9999.10000");
}

TEST_CASE("values naming values too deeply are refused, not a stack overflow") {
    // Found by hand while fuzzing: each value naming the next one nests the
    // evaluation; 30000 of them, or 30 of a thousand terms each, overflowed
    // the stack.
    std::string plain = std::string(kBaseModel);
    for (int i = 0; i < 100000; ++i)
        plain += fmt::format("let v{} = v{}\n", i, i + 1);
    plain += "let v100000 = 1 ft\n";
    // v0 is evaluated first; v1999 names v2000 at depth 2000.
    CHECK(first_message(plain) ==
          "input:2008:13: error: 'v2000' is too deep in a chain of values (more than 2000 "
          "levels of values and operations)");
    std::string terms;
    for (int i = 0; i < 999; ++i)
        terms += " + 0 ft";
    std::string chained = std::string(kBaseModel);
    for (int i = 0; i < 30; ++i)
        chained += fmt::format("let v{} = v{}{}\n", i, i + 1, terms);
    chained += "let v30 = 1 ft\n";
    // Each value's first term is 1000 levels down its own sum.
    CHECK(first_message(chained) ==
          "input:10:10: error: 'v2' is too deep in a chain of values (more than 2000 levels of "
          "values and operations)");
}
