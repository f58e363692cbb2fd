// lsp_test: the language server driven in process through string streams, where
// every message is waiting at once, so the debounce is exact: one check for all of
// them. The session over pipes is tests/lsp/lsp_client.cpp.
#include <catch2/catch.hpp>
#include <sstream>

#include "lsp/lsp.hpp"
#include "lsp/lsp_internal.hpp"

namespace firn::lsp {
namespace {

// A one-bay shed, an invented scenario.
const char* const kShed = R"(model "Shed"
report units kip, ft
grid x A..B spacing 20 ft
grid y base = 0 ft, eave = 10 ft
material steel E = 29000 ksi
section girder steel, A = 10 in2, I = 100 in4
columns on A..B from base to eave section girder
beams along eave from A to B section girder
support fixed at base
group top = eave.A.B
case D dead {
  uniform 1 kip/ft down on eave.*
}
)";

const char* const kUri = "file:///models/shed.firn";

std::string framed(const Json& message) {
    std::string body = message.dump();
    return "Content-Length: " + std::to_string(body.size()) + "\r\n\r\n" + body;
}

std::string request(int id, const std::string& method, const Json& params) {
    return framed({{"jsonrpc", "2.0"}, {"id", id}, {"method", method}, {"params", params}});
}

std::string notification(const std::string& method, const Json& params) {
    return framed({{"jsonrpc", "2.0"}, {"method", method}, {"params", params}});
}

std::string initialize() {
    return request(1, "initialize", Json::object()) + notification("initialized", Json::object());
}

std::string open(const std::string& text) {
    return notification("textDocument/didOpen",
                        {{"textDocument", {{"uri", kUri}, {"version", 1}, {"text", text}}}});
}

std::string change(const std::string& text) {
    return notification("textDocument/didChange",
                        {{"textDocument", {{"uri", kUri}, {"version", 2}}},
                         {"contentChanges", Json::array({{{"text", text}}})}});
}

Json at(int line, int character) {
    return {{"textDocument", {{"uri", kUri}}},
            {"position", {{"line", line}, {"character", character}}}};
}

struct Session {
    int status = 0;
    std::vector<Json> messages;

    std::vector<Json> published() const {
        std::vector<Json> out;
        for (const Json& m : messages) {
            if (m.value("method", "") == "textDocument/publishDiagnostics")
                out.push_back(m["params"]["diagnostics"]);
        }
        return out;
    }
    Json reply(int id) const {
        for (const Json& m : messages) {
            if (m.contains("id") && m["id"] == id)
                return m;
        }
        return nullptr;
    }
};

Session run(const std::string& input) {
    std::istringstream in(input);
    std::ostringstream out;
    Session s;
    s.status = serve_language(in, out);
    std::istringstream replies(out.str());
    std::string body;
    while (read_message(replies, body) == ReadStatus::message)
        s.messages.push_back(Json::parse(body));
    return s;
}

std::string shed_with(const std::string& from, const std::string& to) {
    std::string text = kShed;
    text.replace(text.find(from), from.size(), to);
    return text;
}

}  // namespace

TEST_CASE("lsp: positions count UTF-16 code units, not bytes") {
    // a, space, e-acute (2 bytes, 1 unit), space, G clef (4 bytes, 2 units), space, x
    std::string text = "a \xc3\xa9 \xf0\x9d\x84\x9e x\nsecond\r\nthird";
    LineIndex lines(text);
    CHECK(lines.position(10).line == 0);
    CHECK(lines.position(10).character == 7);
    CHECK(lines.offset({0, 7}) == 10);
    CHECK(lines.offset({0, 99}) == 11);  // past the end: the line's end
    CHECK(lines.position(13).line == 1);
    CHECK(lines.position(13).character == 1);
    CHECK(lines.offset({1, 99}) == 18);  // before the "\r\n"
    CHECK(lines.offset({9, 0}) == text.size());
}

TEST_CASE("lsp: file URIs are decoded and encoded") {
    CHECK(path_of_uri("file:///a/b%20c.firn") == "/a/b c.firn");
    CHECK(uri_of_path("/a/b c.firn") == "file:///a/b%20c.firn");
    CHECK(path_of_uri("file:///bad%2") == "/bad%2");
}

TEST_CASE("lsp: changes waiting together are checked once, with the last text") {
    Session s = run(initialize() + open(kShed) + change(kShed) +
                    change(shed_with("section girder\nsupport", "section girdr\nsupport")));
    REQUIRE(s.published().size() == 1);
    Json d = s.published()[0];
    REQUIRE(d.size() == 1);
    CHECK(d[0]["message"] == "unknown section 'girdr'; did you mean 'girder'?");
    CHECK(d[0]["range"]["start"] == Json({{"line", 7}, {"character", 37}}));
    CHECK(s.status == 1);  // the input ended without shutdown and exit
}

TEST_CASE("lsp: hovers give a member's section, length and nodes in the model's units") {
    Session s = run(initialize() + open(kShed) + request(2, "textDocument/hover", at(9, 14)) +
                    request(3, "textDocument/hover", at(2, 7)) +
                    request(4, "textDocument/hover", at(0, 2)));
    // Member eave.A.B runs from A (x = 0) to B (x = 20 ft): 20 ft long.
    CHECK(s.reply(2)["result"]["contents"]["value"] ==
          "member eave.A.B: section girder, length 20.000 ft, from node A.eave to node B.eave");
    CHECK(s.reply(3)["result"]["contents"]["value"] == "column line A at x = 0.000 ft");
    CHECK(s.reply(4)["result"].is_null());  // a keyword
}

TEST_CASE("lsp: the outline, completions and definitions come from the model") {
    Session s = run(initialize() + open(kShed) +
                    request(2, "textDocument/documentSymbol", {{"textDocument", {{"uri", kUri}}}}) +
                    request(3, "textDocument/completion", at(7, 40)) +
                    request(4, "textDocument/definition", at(9, 13)));
    std::vector<std::string> names;
    Json symbols = s.reply(2)["result"];
    for (const Json& symbol : symbols)
        names.push_back(symbol["name"]);
    CHECK(names == std::vector<std::string>{"A.base.eave", "B.base.eave", "eave.A.B", "D", "top"});
    // "beams ... section gi|rder": what starts with "gi".
    Json items = s.reply(3)["result"]["items"];
    REQUIRE(items.size() == 1);
    CHECK(items[0]["label"] == "girder");
    // A member made by `beams along eave` is defined where that statement names its level.
    CHECK(s.reply(4)["result"]["range"]["start"] == Json({{"line", 7}, {"character", 12}}));
}

TEST_CASE("lsp: bad messages get protocol errors and the session goes on") {
    Session s = run(request(2, "textDocument/hover", at(0, 0)) + initialize() +
                    "Content-Length: 5\r\n\r\n{oops" + request(3, "no/such", Json::object()) +
                    framed({{"jsonrpc", "1.0"}, {"id", 4}, {"method", "shutdown"}}) +
                    notification("no/such", Json::object()) + request(5, "shutdown", nullptr) +
                    request(6, "textDocument/hover", at(0, 0)) + notification("exit", nullptr));
    CHECK(s.reply(2)["error"]["code"] == -32002);  // before initialize
    CHECK(s.reply(3)["error"]["code"] == -32601);
    CHECK(s.reply(4)["error"]["code"] == -32600);
    CHECK(s.reply(5)["result"].is_null());
    CHECK(s.reply(6)["error"]["code"] == -32600);  // after shutdown
    std::size_t parse_errors = 0;
    for (const Json& m : s.messages)
        parse_errors += m.contains("error") && m["error"]["code"] == -32700 ? 1U : 0U;
    CHECK(parse_errors == 1);
    CHECK(s.messages.size() == 7);  // six replies and the parse error; notifications get none
    CHECK(s.status == 0);
}

TEST_CASE("lsp: a message cut short ends the session without a reply") {
    Session s = run(initialize() + "Content-Length: 100\r\n\r\n{\"jsonrpc\"");
    CHECK(s.messages.size() == 1);
    CHECK(s.status == 1);
    CHECK(run(initialize() + notification("exit", nullptr)).status == 1);  // no shutdown
}

}  // namespace firn::lsp
