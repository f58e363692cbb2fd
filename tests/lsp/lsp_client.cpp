// lsp_client: a scripted editor for `firn lsp`. It starts the server with pipes,
// opens a model, edits it into an error and back, and checks the diagnostics it
// publishes, a hover, a definition and a formatting reply; then malformed
// messages and unknown methods, which must get protocol errors and leave the
// server answering; then the 100 x 100 generated frame, whose diagnostics pass it
// times (printed, never asserted: timings are not tests).
// Usage: lsp_client FIRN WORK_DIR
#include <fcntl.h>
#include <poll.h>
#include <sys/wait.h>
#include <unistd.h>
#include <algorithm>
#include <array>
#include <chrono>
#include <csignal>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <optional>
#include <string>
#include <vector>

#include "frame_generator.hpp"

namespace {

using Json = nlohmann::json;

int failures = 0;

void check(bool ok, const std::string& what) {
    std::printf("%s: %s\n", ok ? "ok" : "FAILED", what.c_str());
    if (!ok)
        ++failures;
}

/// The server process and the two pipes to it.
class Server {
  public:
    Server(const std::string& firn, const std::string& cache) {
        int to[2], from[2];
        if (::pipe(to) != 0 || ::pipe(from) != 0)
            throw std::runtime_error("pipe failed");
        pid_ = ::fork();
        if (pid_ == 0) {
            ::dup2(to[0], 0);
            ::dup2(from[1], 1);
            ::close(to[1]);
            ::close(from[0]);
            ::setenv("XDG_CACHE_HOME", cache.c_str(), 1);
            ::execl(firn.c_str(), firn.c_str(), "lsp", "--stdio", static_cast<char*>(nullptr));
            ::_exit(127);
        }
        ::close(to[0]);
        ::close(from[1]);
        in_ = to[1];
        out_ = from[0];
    }

    ~Server() {
        if (pid_ > 0) {
            ::kill(pid_, SIGKILL);
            ::waitpid(pid_, nullptr, 0);
        }
    }

    void send_raw(const std::string& body) {
        std::string framed = "Content-Length: " + std::to_string(body.size()) + "\r\n\r\n" + body;
        write_all(framed);
    }

    /// Writes while reading what the server sends meanwhile: a large message each way
    /// would otherwise fill both pipes and stop both processes.
    void write_all(const std::string& bytes) {
        std::size_t done = 0;
        while (done < bytes.size()) {
            std::array<pollfd, 2> p{pollfd{in_, POLLOUT, 0}, pollfd{out_, POLLIN, 0}};
            if (::poll(p.data(), p.size(), 60000) <= 0)
                throw std::runtime_error("the server stopped reading");
            if ((p[1].revents & POLLIN) != 0)
                read_some();
            if ((p[0].revents & (POLLERR | POLLHUP)) != 0)
                throw std::runtime_error("the server's input closed");
            if ((p[0].revents & POLLOUT) == 0)
                continue;
            ssize_t n =
                ::write(in_, bytes.data() + done, std::min<std::size_t>(bytes.size() - done, 4096));
            if (n <= 0)
                throw std::runtime_error("the server's input closed");
            done += static_cast<std::size_t>(n);
        }
    }

    bool read_some() {
        char chunk[65536];
        ssize_t n = ::read(out_, chunk, sizeof chunk);
        if (n <= 0)
            return false;
        buffer_.append(chunk, static_cast<std::size_t>(n));
        return true;
    }

    void send(const Json& message) { send_raw(message.dump()); }

    void request(int id, const std::string& method, const Json& params) {
        send({{"jsonrpc", "2.0"}, {"id", id}, {"method", method}, {"params", params}});
    }

    void notify(const std::string& method, const Json& params) {
        send({{"jsonrpc", "2.0"}, {"method", method}, {"params", params}});
    }

    /// The next message; none if the server sends nothing for 60 s or closes.
    std::optional<Json> next() {
        while (true) {
            std::size_t header_end = buffer_.find("\r\n\r\n");
            if (header_end != std::string::npos) {
                std::size_t length = std::stoul(buffer_.substr(16, header_end - 16));
                if (buffer_.size() >= header_end + 4 + length) {
                    std::string body = buffer_.substr(header_end + 4, length);
                    buffer_.erase(0, header_end + 4 + length);
                    return Json::parse(body);
                }
            }
            pollfd p{out_, POLLIN, 0};
            if (::poll(&p, 1, 60000) <= 0 || !read_some())
                return std::nullopt;
        }
    }

    /// The reply to request `id`; diagnostics published meanwhile are kept.
    Json reply(int id) {
        while (std::optional<Json> m = next()) {
            if (m->contains("id") && (*m)["id"] == id)
                return *m;
            published.push_back(*m);
        }
        throw std::runtime_error("no reply to request " + std::to_string(id));
    }

    /// The next diagnostics published for `uri` (kept ones first).
    Json diagnostics(const std::string& uri) {
        for (std::size_t i = 0; i < published.size(); ++i) {
            if (published[i].value("method", "") == "textDocument/publishDiagnostics" &&
                published[i]["params"]["uri"] == uri) {
                Json d = published[i]["params"]["diagnostics"];
                published.erase(published.begin() + static_cast<long>(i));
                return d;
            }
        }
        while (std::optional<Json> m = next()) {
            if (m->value("method", "") == "textDocument/publishDiagnostics" &&
                (*m)["params"]["uri"] == uri)
                return (*m)["params"]["diagnostics"];
            published.push_back(*m);
        }
        throw std::runtime_error("no diagnostics for " + uri);
    }

    /// The exit status once the server has ended by itself; -1 if it did not within 10 s.
    int wait_exit() {
        ::close(in_);
        for (int i = 0; i < 1000; ++i) {
            int status = 0;
            if (::waitpid(pid_, &status, WNOHANG) == pid_) {
                pid_ = -1;
                return WIFEXITED(status) ? WEXITSTATUS(status) : -1;
            }
            ::usleep(10000);
        }
        return -1;
    }

    std::vector<Json> published;

  private:
    pid_t pid_ = -1;
    int in_ = -1, out_ = -1;
    std::string buffer_;
};

// The model: a two-bay storage hut, an invented scenario.
const char* const kHut =
    R"(# A two-bay storage hut (an invented scenario for the language server test).
model "Storage hut"
use materials
use asce7_16
report units kip, ft, displacement in

let bay_width = 20 ft
let half = bay_width / 2

grid x A..C spacing 24 ft
grid y base = 0 ft, eave = 14 ft

section post structural_steel, A = 9.12 in2, I = 110 in4
section girder structural_steel, A = 11.8 in2, I = 510 in4

columns on A..C from base to eave section post
beams along eave from A to C section girder
support fixed at base

case D dead {
  self weight
  uniform 15 psf * bay_width down on eave.*
}

snow S {
  standard = asce7_16
  pg = 30 psf
  terrain = C
  exposure = partially
  thermal = heated
  risk = II
}

roof main on eave.* {
  tributary = bay_width
}

expect snow pf = 21 psf
)";

Json text_document(const std::string& uri) {
    return {{"uri", uri}};
}

Json at(const std::string& uri, int line, int character) {
    return {{"textDocument", text_document(uri)},
            {"position", {{"line", line}, {"character", character}}}};
}

void change(Server& s, const std::string& uri, int version, const std::string& text) {
    s.notify("textDocument/didChange", {{"textDocument", {{"uri", uri}, {"version", version}}},
                                        {"contentChanges", Json::array({{{"text", text}}})}});
}

std::string replaced(std::string text, const std::string& from, const std::string& to) {
    text.replace(text.find(from), from.size(), to);
    return text;
}

std::string hover_value(const Json& reply) {
    if (!reply.contains("result") || !reply["result"].is_object())
        return "";
    return reply["result"]["contents"]["value"].get<std::string>();
}

void initialize(Server& s) {
    s.request(1, "initialize", {{"processId", nullptr}, {"capabilities", Json::object()}});
    Json r = s.reply(1);
    check(r["result"]["capabilities"]["textDocumentSync"]["change"] == 1,
          "initialize: whole-text sync is announced");
    check(r["result"]["capabilities"]["hoverProvider"] == true, "initialize: hovers");
    s.notify("initialized", Json::object());
}

void edit_into_error_and_back(Server& s, const std::string& uri) {
    s.notify(
        "textDocument/didOpen",
        {{"textDocument", {{"uri", uri}, {"languageId", "firn"}, {"version", 1}, {"text", kHut}}}});
    check(s.diagnostics(uri).empty(), "open: the hut has no diagnostics");

    // Line 16 (0-based): "beams along eave from A to C section girder" -> "girdr".
    change(s, uri, 2, replaced(kHut, "section girder\n", "section girdr\n"));
    Json d = s.diagnostics(uri);
    check(d.size() == 1, "error: one diagnostic, got " + d.dump());
    if (d.size() == 1) {
        check(d[0]["severity"] == 1, "error: severity is error");
        check(d[0]["range"]["start"] == Json({{"line", 16}, {"character", 37}}) &&
                  d[0]["range"]["end"] == Json({{"line", 16}, {"character", 42}}),
              "error: range is the word girdr, got " + d[0]["range"].dump());
        std::string message = d[0]["message"];
        check(message.find("girdr") != std::string::npos &&
                  message.find("did you mean 'girder'?") != std::string::npos,
              "error: the compiler's message, got " + message);
    }
    change(s, uri, 3, kHut);
    check(s.diagnostics(uri).empty(), "back: the diagnostics are cleared");

    // A ground snow load above 1000 psf is the compiler's warning of a unit slip.
    change(s, uri, 4, replaced(kHut, "pg = 30 psf", "pg = 1200 psf"));
    Json w = s.diagnostics(uri);
    check(w.size() == 1 && w[0]["severity"] == 2 && w[0]["range"]["start"]["line"] == 26,
          "warning: published with its severity and line, got " + w.dump());
    change(s, uri, 5, kHut);
    check(s.diagnostics(uri).empty(), "back again: no warning");
}

void hovers_and_definitions(Server& s, const std::string& uri) {
    // "beams along eave from A to C section girder" makes eave.A.B; hover on "girder".
    s.request(10, "textDocument/hover", at(uri, 13, 10));
    check(hover_value(s.reply(10)) ==
              "section girder: material structural_steel, A = 11.800 "
              "in^2, I = 510.00 in^4",
          "hover: a section's area and inertia in the model's units");
    // `let half = bay_width / 2`: 20 ft / 2 = 10 ft.
    s.request(11, "textDocument/hover", at(uri, 7, 5));
    check(hover_value(s.reply(11)) == "value half = 10.000 ft", "hover: a value with its unit");
    // `expect snow pf = 21 psf`: pf = 0.7 Ce Ct Is pg (ASCE 7-16 Eq. 7.3-1) with Ce = 1.0
    // (Table 7.3-1, terrain C, partially exposed), Ct = 1.0 (Table 7.3-2, heated),
    // Is = 1.0 (Table 1.5-2, risk II): 0.7 x 30 psf = 21.0 psf.
    s.request(12, "textDocument/hover", at(uri, 37, 13));
    std::string pf = hover_value(s.reply(12));
    check(pf.starts_with("snow value pf = 21.0 psf\n") &&
              pf.find("ASCE 7-16 Eq. 7.3-1") != std::string::npos,
          "hover: pf with its value and clause, got " + pf);
    // The member `eave.A.B` named in no statement: hover on the roof's `eave.*`? No: on
    // `eave` of "beams along eave", a level.
    s.request(13, "textDocument/hover", at(uri, 16, 13));
    check(hover_value(s.reply(13)) == "level eave at y = 14.000 ft", "hover: a level");
    // Definition of `girder` where beams use it: its section statement, line 13.
    s.request(14, "textDocument/definition", at(uri, 16, 40));
    Json def = s.reply(14)["result"];
    check(def["uri"] == uri && def["range"]["start"] == Json({{"line", 13}, {"character", 8}}),
          "definition: the section statement, got " + def.dump());
    // Definition of the material `structural_steel`: its statement in the library module.
    s.request(16, "textDocument/definition", at(uri, 13, 20));
    Json steel = s.reply(16)["result"];
    check(steel.is_object() &&
              steel["uri"].get<std::string>().ends_with("/firn/library/materials.firn") &&
              steel["range"]["start"]["line"].get<int>() > 0,
          "definition: a library entry, got " + steel.dump());
    // Definition of `asce7_16` in `use asce7_16`: the library module, copied for the editor.
    s.request(15, "textDocument/definition", at(uri, 3, 6));
    Json lib = s.reply(15)["result"];
    check(lib.is_object() && lib["uri"].get<std::string>().ends_with("/firn/library/asce7_16.firn"),
          "definition: a library module, got " + lib.dump());
}

void formatting(Server& s, const std::string& uri) {
    change(s, uri, 4, replaced(kHut, "let half = bay_width / 2", "let   half=bay_width/2"));
    s.diagnostics(uri);
    s.request(20, "textDocument/formatting",
              {{"textDocument", text_document(uri)},
               {"options", {{"tabSize", 2}, {"insertSpaces", true}}}});
    Json edits = s.reply(20)["result"];
    check(edits.is_array() && edits.size() == 1 && edits[0]["newText"] == kHut,
          "formatting: one edit gives the canonical text back");
    change(s, uri, 5, kHut);
    s.diagnostics(uri);
}

void protocol_errors(Server& s, const std::string& uri) {
    s.send_raw("{\"jsonrpc\": \"2.0\", \"id\": 30, \"method\": ");
    Json parse = *s.next();
    check(parse["error"]["code"] == -32700 && parse["id"].is_null(), "bad JSON: ParseError");
    s.send_raw("[1, 2]");
    check((*s.next())["error"]["code"] == -32600, "a JSON array: InvalidRequest");
    s.send({{"jsonrpc", "2.0"}, {"id", 31}, {"method", 5}});
    check(s.reply(31)["error"]["code"] == -32600, "a method that is no text: InvalidRequest");
    s.request(32, "textDocument/rename", at(uri, 0, 0));
    check(s.reply(32)["error"]["code"] == -32601, "an unknown request: MethodNotFound");
    s.notify("firn/unknownNotification", Json::object());
    s.request(33, "textDocument/hover", {{"textDocument", text_document(uri)}});
    check(s.reply(33)["error"]["code"] == -32602, "a hover without a position: InvalidParams");
    s.write_all("Content-Type: nothing\r\n\r\n");
    check((*s.next())["error"]["code"] == -32700, "a header without a length: ParseError");
    s.request(34, "textDocument/hover", at(uri, 7, 5));
    check(hover_value(s.reply(34)) == "value half = 10.000 ft",
          "after the bad messages the server still answers (and sent nothing for the "
          "notification)");
}

void non_ascii(Server& s, const std::string& uri) {
    // "model \"Hütte 𝄞\" extra": ü is 2 bytes and 1 UTF-16 unit, 𝄞 4 bytes and 2 units, so
    // `extra` starts at byte 20 but at character 17.
    change(
        s, uri, 6,
        replaced(kHut, "model \"Storage hut\"", "model \"H\xc3\xbctte \xf0\x9d\x84\x9e\" extra"));
    Json d = s.diagnostics(uri);
    check(!d.empty() && d[0]["range"]["start"] == Json({{"line", 1}, {"character", 17}}),
          "non-ASCII: the range counts UTF-16 units, got " + (d.empty() ? "" : d[0].dump()));
    s.request(40, "textDocument/hover", at(uri, 7, 5));
    check(hover_value(s.reply(40)) == "value half = 10.000 ft",
          "non-ASCII: a value's hover while the model has a syntax error");
    change(s, uri, 7, kHut);
    s.diagnostics(uri);
}

double seconds_since(std::chrono::steady_clock::time_point start) {
    return std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
}

void large_frame(Server& s, const std::string& uri, const std::string& text, const char* what) {
    auto start = std::chrono::steady_clock::now();
    s.notify(
        "textDocument/didOpen",
        {{"textDocument", {{"uri", uri}, {"languageId", "firn"}, {"version", 1}, {"text", text}}}});
    Json d = s.diagnostics(uri);
    double open = seconds_since(start);
    check(d.empty(), std::string(what) + ": no diagnostics, got " + d.dump().substr(0, 300));
    // Three edits sent at once: the server reads the changes already waiting before it checks
    // again, so it publishes at most three times, the last for the last text. (How many
    // edits a pipe delivers at once depends on timing; the in-process test of lsp_test.cpp
    // counts the coalesced checks exactly.)
    start = std::chrono::steady_clock::now();
    std::string broken = replaced(text, "section beam", "section bem");
    change(s, uri, 2, text);
    change(s, uri, 3, broken);
    change(s, uri, 4, broken);
    s.request(50, "textDocument/hover", at(uri, 0, 0));
    s.reply(50);
    double edit = seconds_since(start);
    std::vector<Json> ours;
    for (const Json& m : s.published) {
        if (m.value("method", "") == "textDocument/publishDiagnostics" && m["params"]["uri"] == uri)
            ours.push_back(m["params"]["diagnostics"]);
    }
    std::erase_if(s.published, [&](const Json& m) { return m["params"]["uri"] == uri; });
    check(!ours.empty() && ours.size() <= 3,
          std::string(what) + ": three queued edits, at most three checks, got " +
              std::to_string(ours.size()));
    check(!ours.empty() && !ours.back().empty(),
          std::string(what) + ": the last check reports the misspelt section");
    std::printf("latency, %s: open and check %.3f s; three edits, %zu check(s), a hover %.3f s\n",
                what, open, ours.size(), edit);
    // One edit back to the valid text: a whole check, as on a keystroke that mends it.
    start = std::chrono::steady_clock::now();
    change(s, uri, 5, text);
    check(s.diagnostics(uri).empty(), std::string(what) + ": mended, no diagnostics");
    std::printf("latency, %s: one edit to a valid model, its check and publish %.3f s\n", what,
                seconds_since(start));
    s.notify("textDocument/didClose", {{"textDocument", text_document(uri)}});
    check(s.diagnostics(uri).empty(), std::string(what) + ": closing clears its diagnostics");
}

void shut_down(Server& s) {
    s.request(90, "shutdown", nullptr);
    check(s.reply(90)["result"].is_null(), "shutdown: a null result");
    s.notify("exit", nullptr);
    check(s.wait_exit() == 0, "exit after shutdown: status 0");
}

}  // namespace

int main(int argc, char** argv) {
    if (argc != 3) {
        std::fprintf(stderr, "usage: lsp_client FIRN WORK_DIR\n");
        return 2;
    }
    namespace fs = std::filesystem;
    fs::path work = fs::absolute(argv[2]);
    fs::create_directories(work);
    std::string uri = "file://" + (work / "hut.firn").string();
    try {
        Server s(argv[1], (work / "cache").string());
        initialize(s);
        edit_into_error_and_back(s, uri);
        hovers_and_definitions(s, uri);
        formatting(s, uri);
        protocol_errors(s, uri);
        non_ascii(s, uri);
        large_frame(s, "file://" + (work / "snow_frame.firn").string(),
                    firn::bench::snow_frame(100, 100), "100 x 100 snow frame");
        large_frame(s, "file://" + (work / "listed_frame.firn").string(),
                    firn::bench::rectangular_frame(100, 100, 10),
                    "100 x 100 frame, one statement per node and member");
        shut_down(s);
    } catch (const std::exception& e) {
        check(false, std::string("the session ended early: ") + e.what());
    }
    std::printf("%d failed\n", failures);
    return failures == 0 ? 0 : 1;
}
