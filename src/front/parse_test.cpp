// Tests of the parser: the tree it builds and its syntax errors, asserted by
// exact message, line and column.
#include <fmt/format.h>
#include <catch2/catch.hpp>
#include <tao/pegtl/contrib/analyze.hpp>

#include "front/front.hpp"
#include "grammar/errors.hpp"
#include "grammar/grammar.hpp"
#include "testing/test_text.hpp"

using namespace firn;
using firn::testing::first_message;
using firn::testing::messages_for;

namespace {

syntax::Tree parse_text(const std::string& text, Diagnostics& d, SourceMap& sources) {
    FileId f = sources.add("input", text);
    return parse(sources, f, d);
}

}  // namespace

TEST_CASE("the grammar has no rules that can loop without consuming input") {
    CHECK(tao::pegtl::analyze<grammar::file>() == 0);
}

TEST_CASE("every keyword of keywords.hpp is matched by the grammar's reserved rule") {
    for (std::string_view word : grammar::keywords) {
        tao::pegtl::memory_input in(word.data(), word.size(), "keyword");
        bool whole = tao::pegtl::parse<tao::pegtl::seq<grammar::reserved, tao::pegtl::eof>>(in);
        INFO(word);
        CHECK(whole);
    }
}

TEST_CASE("statements, positions and comments are recorded") {
    SourceMap sources;
    Diagnostics d;
    auto tree = parse_text(
        "# heading\nmodel \"A \\\"quoted\\\" title\"\n\nnode N1 at x = 1 ft, y = 2 ft  # end\n", d,
        sources);
    REQUIRE_FALSE(d.has_errors());
    REQUIRE(tree.statements.size() == 2);
    CHECK(std::get<syntax::ModelTitle>(tree.statements[0].node).title == "A \"quoted\" title");
    const auto& node = std::get<syntax::NodeDecl>(tree.statements[1].node);
    CHECK(node.name.text == "N1");
    CHECK(node.name.where.begin.line == 4);
    CHECK(node.name.where.begin.column == 6);
    REQUIRE(node.coordinates.size() == 2);
    CHECK(node.coordinates[1].value->value == 2.0);
    CHECK(node.coordinates[1].value->unit[0].name == "ft");
    REQUIRE(tree.comments.size() == 2);
    CHECK(tree.comments[1].text == "# end");
}

TEST_CASE("units attach to numbers; arithmetic keeps precedence and parentheses") {
    SourceMap sources;
    Diagnostics d;
    auto tree = parse_text(
        "case D dead { uniform 20 psf * (10 ft + 2 ft) - 1 kip-ft/ft^2 * 3 ft down on B1 }\n", d,
        sources);
    REQUIRE_FALSE(d.has_errors());
    const auto& c = std::get<syntax::CaseDecl>(tree.statements[0].node);
    const syntax::Expr& e = *c.loads[0].value;
    REQUIRE(e.kind == syntax::Expr::Kind::subtract);
    CHECK(e.lhs->kind == syntax::Expr::Kind::multiply);
    CHECK(e.lhs->rhs->kind == syntax::Expr::Kind::group);
    const syntax::Expr& kipft = *e.rhs->lhs;
    REQUIRE(kipft.unit.size() == 3);
    CHECK(kipft.unit[0].name == "kip");
    CHECK(kipft.unit[1].name == "ft");
    CHECK(kipft.unit[2].divides);
    CHECK(kipft.unit[2].exponent == 2);
}

TEST_CASE("syntax errors: exact message, line and column") {
    using Catch::Matchers::Equals;
    CHECK(first_message("model \"no end\n") ==
          "input:1:14: error: expected '\"' to close the text on this line, found the end of the "
          "line");
    CHECK(first_message("nod N1 at x = 0 ft, y = 0 ft\n") ==
          "input:1:1: error: expected a statement (model, use, let, report, grid, node, material, "
          "section, member, columns, beams, rafters, group, support, case, snow, roof, projection, "
          "amend, combinations, combine, pattern, arrange, deflection, expect, geometry, "
          "unjoined or cover), "
          "found 'nod'; did you mean 'node'?");
    CHECK(first_message("node N2 at x = 0 ft y = 3 ft\n") ==
          "input:1:21: error: expected the end of the statement (a new line or ';'), found 'y' (a "
          "reserved word)");
    CHECK(first_message("node model at x = 3 ft, y = 0 ft\n") ==
          "input:1:6: error: expected a node name, found 'model' (a reserved word)");
    CHECK(first_message("member M1 from N1 to N2 sectoin beam\n") ==
          "input:1:25: error: expected 'section' and a section name, found 'sectoin'; did you mean "
          "'section'?");
    CHECK(first_message("case D deadd {\n}\n") ==
          "input:1:8: error: expected the kind of load case (dead, live, roof live, snow, wind or "
          "other), found "
          "'deadd'; did you mean 'dead'?");
    CHECK(first_message("case D dead {\n  uniform 3 kip/ft dwn on B1\n}\n") ==
          "input:2:20: error: expected a direction (x, y, up, down, axial or transverse), found "
          "'dwn'; did you "
          "mean 'down'?");
    CHECK(first_message("case D dead {\n  uniform 3 kip/ft down on B1 from 3 ft\n}\n") ==
          "input:2:40: error: expected 'to', found the end of the line");
    CHECK(first_message("grid x A = 0 ft,\n") ==
          "input:2:1: error: expected a grid line such as A = 0 ft, found the end of the file");
    CHECK(first_message("node N at x = (1 ft, y = 0 ft\n") ==
          "input:1:20: error: expected ')' to close the '(', found ','");
    CHECK(first_message("node N at x = 2 *\n") ==
          "input:2:1: error: expected a number such as 12 ft, or '(', found the end of the file");
    CHECK(first_message("support hinged at N1\n") ==
          "input:1:9: error: expected a support type (fixed, pinned, roller or spring), found "
          "'hinged'; "
          "did you mean 'pinned'?");
}

TEST_CASE("an unclosed case block is reported once, at its '{' or where it runs into a statement") {
    CHECK(messages_for("case L live {\n  uniform 3 kip/ft down on M1\n") ==
          "input:1:13: error: this case block is never closed: expected '}' before the end of the "
          "file\n"
          "    case L live {\n"
          "                ^\n");
    CHECK(messages_for("case L live {\n  uniform 3 kip/ft down on M1\ngrid x A = 3 ft\n")
              .find("never closed") == std::string::npos);
    CHECK(first_message("case L live {\n  uniform 3 kip/ft down on M1\ngrid x A = 3 ft\n") ==
          "input:3:1: error: expected a load (uniform, linear, point, moment or self weight) or "
          "'}', found "
          "'grid' (a reserved word) (is the '}' of the case block opened at line 1 missing?)");
}

TEST_CASE("an unclosed block before an `expect` line gets the missing '}' hint") {
    // `expect` is a contextual keyword, so it is found as a word, not a reserved one.
    CHECK(messages_for("case L live {\n  uniform 3 kip/ft down on M1\nexpect moment of M1 <= 10 "
                       "kip*ft\n") ==
          "input:3:1: error: expected a load (uniform, linear, point, moment or self weight) or "
          "'}', found 'expect' (is the '}' of the case block opened at line 1 missing?)\n"
          "    expect moment of M1 <= 10 kip*ft\n"
          "    ^~~~~~\n");
}

TEST_CASE("the words that start a statement are the ones the unknown-statement message lists") {
    std::string_view listed = grammar::errors::message<grammar::unknown_statement>;
    auto named = [&](std::string_view word) {
        for (std::string_view sep : {"(", ", ", " or "}) {
            std::size_t at = listed.find(fmt::format("{}{}", sep, word));
            std::size_t after = at + sep.size() + word.size();
            if (at != std::string_view::npos &&
                (listed[after] == ',' || listed[after] == ' ' || listed[after] == ')'))
                return true;
        }
        return false;
    };
    std::vector<std::string_view> words(grammar::keywords.begin(), grammar::keywords.end());
    words.insert(words.end(), grammar::contextual_keywords.begin(),
                 grammar::contextual_keywords.end());
    for (std::string_view word : words) {
        tao::pegtl::memory_input in(word.data(), word.size(), "word");
        bool starts =
            tao::pegtl::parse<tao::pegtl::seq<grammar::statement_start, tao::pegtl::eof>>(in);
        INFO(word);
        CHECK(starts == named(word));
    }
}

TEST_CASE("the parser recovers at the next statement and reports every independent error") {
    std::string all = messages_for(
        "nod N1 at x = 0 ft\n"
        "node N2 at x = 0 ft y = 3 ft\n"
        "case D deadd {\n"
        "  uniform 3 kip/ft down on M1\n"
        "}\n"
        "case L live {\n"
        "  frob 3\n"
        "  uniform 3 kip/ft dwn on M1\n"
        "}\n"
        "member M1 from N1 to N2 sectoin beam\n");
    std::vector<std::string> heads;
    for (std::size_t at = 0; (at = all.find("input:", at)) != std::string::npos; ++at) {
        heads.push_back(all.substr(at, all.find(':', all.find(':', at + 6) + 1) - at));
    }
    CHECK(heads == std::vector<std::string>{"input:1:1", "input:2:21", "input:3:8", "input:7:3",
                                            "input:8:20", "input:10:25"});
}
