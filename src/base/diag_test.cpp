// Tests of diagnostics rendering and "did you mean".
#include <catch2/catch.hpp>

#include "base/diag.hpp"

using namespace firn;

TEST_CASE("a diagnostic shows file, line, column, the line and a caret under the place") {
    SourceMap sources;
    FileId f = sources.add("frame.firn", "node A at x = 0 ft\nnode B at x = 12, y = 0 ft\n");
    Diagnostics d;
    d.error(SourceRange{f, sources.position(f, 33), sources.position(f, 35)}, "expected a length");
    CHECK(render(d, sources) ==
          "frame.firn:2:15: error: expected a length\n"
          "    node B at x = 12, y = 0 ft\n"
          "                  ^~\n");
}

TEST_CASE("diagnostics are sorted by position whatever the order they were reported in") {
    SourceMap sources;
    FileId f = sources.add("m", "a\nb\nc\n");
    Diagnostics d;
    d.error(SourceRange{f, sources.position(f, 4), sources.position(f, 5)}, "third");
    d.warning(SourceRange{f, sources.position(f, 0), sources.position(f, 1)}, "first");
    d.error(SourceRange{f, sources.position(f, 2), sources.position(f, 3)}, "second");
    CHECK(render(d, sources) ==
          "m:1:1: warning: first\n    a\n    ^\n"
          "m:2:1: error: second\n    b\n    ^\n"
          "m:3:1: error: third\n    c\n    ^\n");
    CHECK(d.error_count() == 2);
}

TEST_CASE("a very long line is shown as a window around the caret") {
    SourceMap sources;
    std::string line(5000, 'x');
    FileId f = sources.add("m", line);
    Diagnostics d;
    d.error(SourceRange{f, sources.position(f, 2500), sources.position(f, 2501)}, "here");
    std::string out = render(d, sources);
    CHECK(out.size() < 400);
    CHECK(out.find("m:1:2501: error: here\n    ...") == 0);
}

TEST_CASE("control characters in a quoted line are shown as '?'") {
    SourceMap sources;
    FileId f = sources.add("m", std::string("ab\x01\x1b"
                                            "c"));
    Diagnostics d;
    d.error(SourceRange{f, sources.position(f, 0), sources.position(f, 1)}, "bad");
    CHECK(render(d, sources) == "m:1:1: error: bad\n    ab??c\n    ^\n");
}

TEST_CASE("did you mean picks the closest name, and nothing when none is close") {
    std::vector<std::string> names{"B1", "B2", "girder", "column"};
    CHECK(did_you_mean("girdr", names) == "; did you mean 'girder'?");
    CHECK(did_you_mean("colunm", names) == "; did you mean 'column'?");
    CHECK(did_you_mean("zzzzzz", names).empty());
    CHECK(did_you_mean(std::string(1000, 'a'), names).empty());
}
