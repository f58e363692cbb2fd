// lsp_server: the session. Reads messages, keeps the open documents, answers
// requests and publishes each document's diagnostics once the editor has stopped
// sending changes (every change already waiting is read first: the debounce).
#include <fmt/format.h>
#include <sys/stat.h>
#include <cstdlib>
#include <filesystem>
#include <map>

#include "base/file_io.hpp"
#include "format/format.hpp"
#include "lsp/lsp.hpp"
#include "lsp/lsp_internal.hpp"

namespace firn::lsp {
namespace {

/// JSON-RPC and protocol error codes.
enum ErrorCode : int {
    parse_error = -32700,
    invalid_request = -32600,
    method_not_found = -32601,
    invalid_params = -32602,
    internal_error = -32603,
    server_not_initialized = -32002,
    request_failed = -32803,
};

/// A request that gets an error reply instead of a result.
struct ProtocolError {
    int code;
    std::string message;
};

struct Document {
    std::string path;
    std::string text;
    std::unique_ptr<CheckedModel> checked;
    bool stale = true;  ///< changed since it was last checked and published
};

const Json& field(const Json& object, const char* key) {
    if (!object.is_object() || !object.contains(key))
        throw ProtocolError{invalid_params, fmt::format("the parameters lack '{}'", key)};
    return object.at(key);
}

std::string string_field(const Json& object, const char* key) {
    const Json& value = field(object, key);
    if (!value.is_string())
        throw ProtocolError{invalid_params, fmt::format("'{}' must be a string", key)};
    return value.get<std::string>();
}

std::uint32_t count_field(const Json& object, const char* key) {
    const Json& value = field(object, key);
    if (!value.is_number_unsigned() || value.get<std::uint64_t>() > 0xFFFFFFFFu)
        throw ProtocolError{invalid_params, fmt::format("'{}' must be a count", key)};
    return value.get<std::uint32_t>();
}

TextPosition position_field(const Json& object, const char* key) {
    const Json& p = field(object, key);
    return {count_field(p, "line"), count_field(p, "character")};
}

std::string document_uri(const Json& params) {
    return string_field(field(params, "textDocument"), "uri");
}

Json capabilities() {
    return {
        {"textDocumentSync", {{"openClose", true}, {"change", 1}}},  // 1: the whole text
        {"hoverProvider", true},
        {"definitionProvider", true},
        {"documentSymbolProvider", true},
        {"documentFormattingProvider", true},
        {"completionProvider", {{"triggerCharacters", Json::array({"."})}}},
    };
}

/// The built-in library module `name` ("<stdlib>/materials.firn") as a read-only file
/// in the user's cache folder, so an editor can open it; none without a cache folder.
std::optional<std::string> library_copy(const SourceFile& module) {
    namespace fs = std::filesystem;
    const char* cache = std::getenv("XDG_CACHE_HOME");
    const char* home = std::getenv("HOME");
    fs::path root = cache != nullptr && *cache != '\0' ? fs::path(cache)
                    : home != nullptr && *home != '\0' ? fs::path(home) / ".cache"
                                                       : fs::path();
    if (root.empty())
        return std::nullopt;
    fs::path path = root / "firn" / "library" / fs::path(module.name).filename();
    std::error_code ec;
    fs::create_directories(path.parent_path(), ec);
    std::string old, error;
    if (!read_file(path.string(), old, error) || old != module.text) {
        if (!write_file_atomically(path.string(), module.text, error))
            return std::nullopt;
        ::chmod(path.c_str(), 0444);
    }
    return path.string();
}

class Server {
  public:
    Server(std::istream& in, std::ostream& out, ImportOptions library)
        : in_(in), out_(out), library_(std::move(library)) {}

    int run() {
        std::string body;
        while (!exited_) {
            ReadStatus status = read_message(in_, body);
            if (status == ReadStatus::end)
                break;
            if (status == ReadStatus::bad_header)
                send_error(nullptr, parse_error, "a message needs a Content-Length header");
            else
                handle(body);
            if (!input_waiting(in_))
                publish_stale();
        }
        return exited_ && shut_down_ ? 0 : 1;
    }

  private:
    void send(const Json& message) { write_message(out_, message); }

    void send_error(const Json& id, int code, const std::string& message) {
        send({{"jsonrpc", "2.0"}, {"id", id}, {"error", {{"code", code}, {"message", message}}}});
    }

    void handle(const std::string& body) {
        Json message = Json::parse(body, nullptr, false);
        if (message.is_discarded()) {
            send_error(nullptr, parse_error, "the message is not JSON");
            return;
        }
        bool has_id = message.is_object() && message.contains("id");
        Json id = has_id ? message["id"] : Json(nullptr);
        bool id_ok = !has_id || id.is_number_integer() || id.is_string();
        if (!message.is_object() || message.value("jsonrpc", Json()) != "2.0" ||
            !message.contains("method") || !message["method"].is_string() || !id_ok) {
            // A reply from the editor (it has no method) needs no answer.
            if (message.is_object() && has_id && !message.contains("method"))
                return;
            send_error(id_ok ? id : Json(nullptr), invalid_request,
                       "a request needs \"jsonrpc\": \"2.0\", a method name and a number or "
                       "text as its id");
            return;
        }
        std::string method = message["method"].get<std::string>();
        Json params = message.value("params", Json::object());
        if (has_id)
            request(id, method, params);
        else
            notification(method, params);
    }

    void request(const Json& id, const std::string& method, const Json& params) {
        try {
            send({{"jsonrpc", "2.0"}, {"id", id}, {"result", answer(method, params)}});
        } catch (const ProtocolError& e) {
            send_error(id, e.code, e.message);
        } catch (const Json::exception& e) {
            send_error(id, invalid_params, fmt::format("bad parameters: {}", e.what()));
        } catch (const std::exception& e) {
            send_error(id, internal_error,
                       fmt::format("internal error in firn (please report this): {}", e.what()));
        }
    }

    void notification(const std::string& method, const Json& params) {
        // Notifications never get a reply, not even an error.
        try {
            if (method == "exit")
                exited_ = true;
            else if (initialized_ && !shut_down_)
                document_notification(method, params);
        } catch (const ProtocolError&) {
        } catch (const Json::exception&) {
        }
    }

    Json answer(const std::string& method, const Json& params) {
        if (method == "initialize") {
            initialized_ = true;
            return {{"capabilities", capabilities()},
                    {"serverInfo", {{"name", "firn"}, {"version", "0.1.0"}}}};
        }
        if (!initialized_)
            throw ProtocolError{server_not_initialized, "send 'initialize' first"};
        if (shut_down_)
            throw ProtocolError{invalid_request, "the server has shut down; send 'exit'"};
        if (method == "shutdown") {
            shut_down_ = true;
            return nullptr;
        }
        if (method == "textDocument/hover")
            return hover(params);
        if (method == "textDocument/definition")
            return definition(params);
        if (method == "textDocument/documentSymbol")
            return symbols(params);
        if (method == "textDocument/formatting")
            return formatting(params);
        if (method == "textDocument/completion")
            return completion(params);
        throw ProtocolError{method_not_found, fmt::format("firn has no method '{}'", method)};
    }

    // ---- documents ----

    void document_notification(const std::string& method, const Json& params) {
        if (method == "textDocument/didOpen") {
            const Json& doc = field(params, "textDocument");
            std::string uri = string_field(doc, "uri");
            std::string path = path_of_uri(uri);
            documents_[uri] = Document{path, string_field(doc, "text"), nullptr, true};
            mark_stale(path);
        } else if (method == "textDocument/didChange") {
            auto found = documents_.find(document_uri(params));
            if (found == documents_.end())
                return;
            for (const Json& change : field(params, "contentChanges"))
                apply_change(found->second.text, change);
            mark_stale(found->second.path);
        } else if (method == "textDocument/didClose") {
            std::string uri = document_uri(params);
            auto found = documents_.find(uri);
            if (found == documents_.end())
                return;
            std::string path = found->second.path;
            documents_.erase(found);
            publish(uri, Json::array());
            // A model that used the editor's text of this file reads it from disk now.
            mark_stale(path);
        }
    }

    static void apply_change(std::string& text, const Json& change) {
        std::string replacement = string_field(change, "text");
        if (!change.contains("range")) {
            text = std::move(replacement);
            return;
        }
        LineIndex lines(text);
        std::uint32_t begin = lines.offset(position_field(change["range"], "start"));
        std::uint32_t end = lines.offset(position_field(change["range"], "end"));
        text.replace(begin, std::max(begin, end) - begin, replacement);
    }

    /// The document at `path` and every open model that uses it need a new check.
    void mark_stale(const std::string& path) {
        for (auto& [uri, doc] : documents_) {
            if (doc.path == path || doc.checked == nullptr || uses(*doc.checked, path))
                doc.stale = true;
        }
    }

    static bool uses(const CheckedModel& c, const std::string& path) {
        for (FileId f = 0; f < c.sources.count(); ++f) {
            if (c.sources.file(f).name == path)
                return true;
        }
        return false;
    }

    ImportOptions import_options() const {
        ImportOptions options = library_;
        // A used file open in the editor is read as the editor holds it, saved or not.
        options.read = [this](const std::string& path, std::string& text, std::string& error) {
            for (const auto& [uri, doc] : documents_) {
                if (doc.path == path) {
                    text = doc.text;
                    return true;
                }
            }
            return read_file(path, text, error);
        };
        return options;
    }

    /// The document's check, checked again (and published) if it changed.
    Document& checked(const std::string& uri) {
        auto found = documents_.find(uri);
        if (found == documents_.end())
            throw ProtocolError{invalid_params, fmt::format("'{}' is not open", uri)};
        Document& doc = found->second;
        if (doc.stale) {
            doc.stale = false;
            try {
                doc.checked = check_model(doc.path, doc.text, import_options(), doc.checked.get());
            } catch (const std::exception& e) {
                // A bug in a stage must not end the editor's session: say so where the
                // messages go, and answer from the text alone until the next change.
                doc.checked = std::make_unique<CheckedModel>();
                doc.checked->main = doc.checked->sources.add(doc.path, doc.text);
                doc.checked->diagnostics.error_without_place(
                    fmt::format("internal error in firn (please report this): {}", e.what()));
            }
            publish(uri, diagnostics_json(*doc.checked));
        }
        return doc;
    }

    void publish_stale() {
        std::vector<std::string> stale;
        for (const auto& [uri, doc] : documents_) {
            if (doc.stale)
                stale.push_back(uri);
        }
        for (const std::string& uri : stale)
            checked(uri);
    }

    void publish(const std::string& uri, Json diagnostics) {
        send({{"jsonrpc", "2.0"},
              {"method", "textDocument/publishDiagnostics"},
              {"params", {{"uri", uri}, {"diagnostics", std::move(diagnostics)}}}});
    }

    // ---- requests on a document ----

    std::uint32_t offset_in(const Document& doc, const Json& params) const {
        return LineIndex(doc.text).offset(position_field(params, "position"));
    }

    Json hover(const Json& params) {
        Document& doc = checked(document_uri(params));
        std::optional<std::string> text = hover_text(*doc.checked, offset_in(doc, params));
        if (!text)
            return nullptr;
        return {{"contents", {{"kind", "plaintext"}, {"value", *text}}}};
    }

    Json definition(const Json& params) {
        Document& doc = checked(document_uri(params));
        const CheckedModel& c = *doc.checked;
        std::optional<Definition> d = definition_at(c, offset_in(doc, params));
        if (!d)
            return nullptr;
        const SourceFile& file = c.sources.file(d->file);
        std::optional<std::string> path =
            file.name.starts_with("<") ? library_copy(file) : std::optional(file.name);
        if (!path)
            return nullptr;
        LineIndex lines(file.text);
        return {{"uri", uri_of_path(*path)},
                {"range", range_json(lines, d->where.begin.offset, d->where.end.offset)}};
    }

    Json symbols(const Json& params) {
        return document_symbols(*checked(document_uri(params)).checked);
    }

    Json completion(const Json& params) {
        Document& doc = checked(document_uri(params));
        std::uint32_t offset = offset_in(doc, params);
        std::uint32_t begin = 0;
        name_at(doc.text, offset, begin);
        std::string_view prefix = std::string_view(doc.text).substr(begin, offset - begin);
        return completion_items(doc.checked.get(), prefix);
    }

    Json formatting(const Json& params) {
        Document& doc = checked(document_uri(params));
        SourceMap sources;
        FileId file = sources.add(doc.path, doc.text);
        Diagnostics diagnostics;
        std::optional<std::string> text;
        try {
            text = format_source(sources, file, diagnostics);
        } catch (const FormatterError& e) {
            throw ProtocolError{request_failed,
                                fmt::format("the formatter refused its own layout (please "
                                            "report this): {}",
                                            e.what())};
        }
        if (!text)
            throw ProtocolError{request_failed,
                                "the model has syntax errors; it is formatted "
                                "once they are mended"};
        if (*text == doc.text)
            return Json::array();
        LineIndex lines(doc.text);
        Json edit{{"range", range_json(lines, 0, static_cast<std::uint32_t>(doc.text.size()))},
                  {"newText", *text}};
        return Json::array({edit});
    }

    std::istream& in_;
    std::ostream& out_;
    ImportOptions library_;
    std::map<std::string, Document> documents_;
    bool initialized_ = false;
    bool shut_down_ = false;
    bool exited_ = false;
};

}  // namespace
}  // namespace firn::lsp

namespace firn {

int serve_language(std::istream& in, std::ostream& out, const ImportOptions& library) {
    return lsp::Server(in, out, library).run();
}

}  // namespace firn
