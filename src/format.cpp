// format: the file's structure (statements, case blocks, comments between them,
// blank lines) and the self-checks that stop a wrong layout from being written.
#include "format.hpp"

#include <fmt/format.h>
#include <optional>
#include <span>

#include "format_internal.hpp"
#include "parse.hpp"

namespace firn {
namespace {

using namespace format_detail;

/// A statement or load of one level (the file or a case block) with its
/// comments, or a comment on a line of its own.
struct Item {
    SourceRange where;
    const syntax::Statement* statement = nullptr;
    std::size_t load = 0;  ///< index in the block, when neither of the others is set
    std::optional<Remark> own;
    std::vector<Remark> inside;
    std::optional<Remark> trailing;
};

/// The items of one level, and the comment after a block's '{' on its line.
struct Level {
    std::vector<Item> items;
    std::optional<Remark> after_opener;
};

/// Sorts `remarks` among the code of one level: inside a statement, trailing
/// the code that ends on its line, or on its own line. `opener_line` is the
/// line of a block's '{' (0 for the file).
Level gather(std::vector<Item> code, std::span<const Remark> remarks, std::uint32_t opener_line) {
    Level level;
    std::uint32_t code_line = opener_line;  // the line the last code ended on, while it may
                                            // still take a trailing comment; 0 when not
    std::size_t r = 0;
    auto loose = [&](const Remark& remark) {
        if (code_line != 0 && remark.line() == code_line) {
            (level.items.empty() ? level.after_opener : level.items.back().trailing) = remark;
        } else {
            Item item;
            item.where = remark.comment->where;
            item.own = remark;
            level.items.push_back(std::move(item));
        }
        code_line = 0;
    };
    for (Item& c : code) {
        while (r < remarks.size() && remarks[r].offset() < c.where.begin.offset)
            loose(remarks[r++]);
        while (r < remarks.size() && remarks[r].offset() < c.where.end.offset)
            c.inside.push_back(remarks[r++]);
        code_line = c.where.end.line;
        level.items.push_back(std::move(c));
    }
    while (r < remarks.size())
        loose(remarks[r++]);
    return level;
}

/// True if code comes before the comment on its line (a UTF-8 byte order mark does not count).
bool after_code(const SourceMap& sources, const syntax::Comment& c) {
    std::string_view line = sources.line_text(c.where.file, c.where.begin.line);
    line = line.substr(0, c.where.begin.column - 1);
    if (c.where.begin.line == 1 && line.starts_with("\xEF\xBB\xBF"))
        line.remove_prefix(3);
    return line.find_first_not_of(" \t") != std::string_view::npos;
}

/// Prints a whole tree as lines.
class FilePrinter {
  public:
    FilePrinter(const SourceMap& sources, const syntax::Tree& tree, std::string& signature)
        : source_(sources.file(tree.file).text), signature_(signature) {
        for (const syntax::Comment& c : tree.comments)
            remarks_.push_back(Remark{&c, after_code(sources, c)});
    }

    std::string print(const syntax::Tree& tree) {
        std::vector<Item> code;
        for (const syntax::Statement& s : tree.statements) {
            Item item;
            item.where = s.where;
            item.statement = &s;
            code.push_back(std::move(item));
        }
        emit_level(gather(std::move(code), remarks_, 0), 0, nullptr);
        align_trailing_comments(lines_);
        return render_lines(lines_);
    }

  private:
    std::string_view source_;
    std::string& signature_;
    std::vector<Remark> remarks_;
    std::vector<Line> lines_;

    void emit_level(const Level& level, std::size_t indent, const syntax::CaseDecl* block) {
        for (std::size_t k = 0; k < level.items.size(); ++k) {
            const Item& item = level.items[k];
            // The author's blank lines between two items become one.
            if (k > 0 && item.where.begin.line > level.items[k - 1].where.end.line + 1)
                lines_.push_back(Line{});
            if (item.own) {
                Line own;
                own.comment = comment_text(*item.own->comment);
                own.indent = indent;
                own.own_comment = true;
                lines_.push_back(std::move(own));
                continue;
            }
            if (block != nullptr)
                emit_load(*block, item, indent);
            else
                emit_statement(item);
            if (item.trailing)
                lines_.back().comment = comment_text(*item.trailing->comment);
        }
    }

    void emit_atoms(std::vector<Atom> atoms, const std::vector<Remark>& inside,
                    std::size_t indent) {
        attach_comments(atoms, inside);
        lay_out(atoms, indent, lines_);
    }

    void emit_statement(const Item& item) {
        if (const auto* block = std::get_if<syntax::CaseDecl>(&item.statement->node)) {
            emit_case(*block, item);
            return;
        }
        emit_atoms(statement_atoms(*item.statement, source_, signature_), item.inside, 0);
    }

    void emit_load(const syntax::CaseDecl& block, const Item& item, std::size_t indent) {
        emit_atoms(load_atoms(block.loads[item.load], item.where, source_, signature_), item.inside,
                   indent);
    }

    /// `case NAME KIND {`, the loads indented by two, `}`.
    void emit_case(const syntax::CaseDecl& block, const Item& item) {
        // Only the kind's words stand between the name and the '{'.
        auto brace = static_cast<std::uint32_t>(source_.find('{', block.name.where.end.offset));
        std::vector<Item> loads;
        for (std::size_t i = 0; i < block.loads.size(); ++i) {
            Item load;
            load.where = block.load_where[i];
            load.load = i;
            loads.push_back(std::move(load));
        }
        // The header cannot break, so the '{' is on the line of `case`.
        Level level = gather(std::move(loads), item.inside, item.where.begin.line);
        emit_atoms(case_header_atoms(block, brace, source_, signature_), {}, 0);
        if (level.after_opener)
            lines_.back().comment = comment_text(*level.after_opener->comment);
        emit_level(level, 2, &block);
        Line close;
        close.code = "}";
        lines_.push_back(std::move(close));
    }
};

/// The text without whitespace and ';': what formatting must never change.
std::string tokens_of(std::string_view text) {
    if (text.starts_with("\xEF\xBB\xBF"))
        text.remove_prefix(3);
    std::string out;
    for (char c : text) {
        if (c != ' ' && c != '\t' && c != '\r' && c != '\n' && c != '\v' && c != '\f' && c != ';')
            out += c;
    }
    return out;
}

/// Parses the formatted text again: it must parse, keep every token, mean the
/// same and format to itself.
void check_layout(const std::string& name, std::string_view original, const std::string& text,
                  const std::string& signature) {
    SourceMap sources;
    FileId id = sources.add(name, text);
    Diagnostics diagnostics;
    syntax::Tree tree = parse(sources, id, diagnostics);
    auto fail = [&name](std::string_view what) {
        throw FormatterError(fmt::format(
            "formatting {} failed its own check ({}); the file was left as it is", name, what));
    };
    if (diagnostics.has_errors())
        fail("the formatted text does not parse:\n" + render(diagnostics, sources));
    if (tokens_of(original) != tokens_of(text))
        fail("the formatted text differs in more than whitespace");
    std::string again_signature;
    std::string again = FilePrinter(sources, tree, again_signature).print(tree);
    if (again_signature != signature)
        fail("the formatted text parses to a different model");
    if (again != text)
        fail("formatting the formatted text changes it");
}

}  // namespace

std::optional<std::string> format_source(const SourceMap& sources, FileId file,
                                         Diagnostics& diagnostics) {
    std::size_t errors_before = diagnostics.error_count();
    syntax::Tree tree = parse(sources, file, diagnostics);
    if (diagnostics.error_count() > errors_before)
        return std::nullopt;
    std::string signature;
    std::string text = FilePrinter(sources, tree, signature).print(tree);
    check_layout(sources.file(file).name, sources.file(file).text, text, signature);
    return text;
}

}  // namespace firn
