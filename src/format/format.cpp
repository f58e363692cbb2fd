// format: the file's structure (statements, case blocks, comments between them,
// blank lines) and the self-checks that stop a wrong layout from being written.
#include "format/format.hpp"

#include <fmt/format.h>
#include <algorithm>
#include <functional>
#include <optional>
#include <span>

#include "format/format_internal.hpp"
#include "front/front.hpp"

namespace firn {
namespace {

using namespace format_detail;

/// A statement, or a line of a block (a load or a setting), with its
/// comments; or a comment on a line of its own.
struct Item {
    SourceRange where;
    const syntax::Statement* statement = nullptr;
    std::size_t line = 0;  ///< index in the block, when neither of the others is set
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

/// The lines inside a block statement (`case`, `snow`, `roof`): where each
/// stands in the source, and its atoms.
struct BlockLines {
    /// The header's last name: only words and spaces stand between it and the '{'.
    const syntax::Name* before_brace = nullptr;
    std::vector<SourceRange> where;
    std::function<std::vector<Atom>(std::size_t)> atoms;
};

/// A setting runs from its key to its value, or to its reason when it has one.
SourceRange setting_where(const syntax::Setting& s) {
    SourceRange where = s.key.where;
    where.end = s.reason ? s.reason_where.end : s.value.where.end;
    return where;
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

    void emit_level(const Level& level, std::size_t indent, const BlockLines* block) {
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
                emit_atoms(block->atoms(item.line), item.inside, indent);
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
        if (std::optional<BlockLines> block = block_lines(*item.statement)) {
            emit_block(item, *block);
            return;
        }
        emit_atoms(statement_atoms(*item.statement, source_, signature_), item.inside, 0);
    }

    /// The lines of a case, snow or roof block; nullopt for any other statement.
    std::optional<BlockLines> block_lines(const syntax::Statement& s) {
        if (const auto* c = std::get_if<syntax::CaseDecl>(&s.node)) {
            return BlockLines{&c->name, c->load_where, [this, c](std::size_t i) {
                                  return load_atoms(c->loads[i], c->load_where[i], source_,
                                                    signature_);
                              }};
        }
        if (const auto* snow = std::get_if<syntax::SnowDecl>(&s.node))
            return settings_block(snow->name, snow->settings);
        if (const auto* roof = std::get_if<syntax::RoofDecl>(&s.node))
            return settings_block(roof->members.back(), roof->settings);
        if (const auto* combine = std::get_if<syntax::CombineDecl>(&s.node)) {
            // `combine S` and `combine S { }` are both complete; an empty block is kept.
            std::size_t brace = source_.find('{', combine->sets.back().where.end.offset);
            if (combine->settings.empty() &&
                (brace == std::string_view::npos || brace >= s.where.end.offset))
                return std::nullopt;
            return settings_block(combine->sets.back(), combine->settings);
        }
        if (const auto* cover = std::get_if<syntax::CoverDecl>(&s.node)) {
            BlockLines block{&cover->keyword, {}, [this, cover](std::size_t i) {
                                 return cover_field_atoms(cover->fields[i], source_, signature_);
                             }};
            for (const syntax::CoverDecl::Field& field : cover->fields)
                block.where.push_back(
                    {field.key.where.file, field.key.where.begin, field.text_where.end});
            return block;
        }
        if (const auto* set = std::get_if<syntax::CombinationsDecl>(&s.node))
            return source_lines_block(set->name, set->line_where);
        if (const auto* rule = std::get_if<syntax::PatternDecl>(&s.node)) {
            std::vector<SourceRange> where;
            for (const syntax::PatternDecl::Line& line : rule->lines)
                where.push_back(line.where);
            return source_lines_block(rule->name, std::move(where));
        }
        return std::nullopt;
    }

    BlockLines source_lines_block(const syntax::Name& before_brace,
                                  std::vector<SourceRange> where) {
        BlockLines block{&before_brace, std::move(where), {}};
        block.atoms = [this, list = block.where](std::size_t i) {
            return source_line_atoms(list[i], source_, signature_);
        };
        return block;
    }

    BlockLines settings_block(const syntax::Name& before_brace,
                              const std::vector<syntax::Setting>& settings) {
        BlockLines block{&before_brace, {}, [this, list = &settings](std::size_t i) {
                             return setting_atoms((*list)[i], source_, signature_);
                         }};
        for (const syntax::Setting& s : settings)
            block.where.push_back(setting_where(s));
        return block;
    }

    /// The header up to '{', the block's lines indented by two, `}`.
    void emit_block(const Item& item, const BlockLines& block) {
        const SourceRange& last = block.before_brace->where;
        auto brace = static_cast<std::uint32_t>(source_.find('{', last.end.offset));
        // Comments before the '{' (after a comma of the roof's members) are the header's.
        auto split = std::partition_point(item.inside.begin(), item.inside.end(),
                                          [brace](const Remark& r) { return r.offset() < brace; });
        std::vector<Item> lines;
        for (std::size_t i = 0; i < block.where.size(); ++i) {
            Item line;
            line.where = block.where[i];
            line.line = i;
            lines.push_back(std::move(line));
        }
        emit_atoms(block_header_atoms(*item.statement, brace, source_, signature_),
                   std::vector<Remark>(item.inside.begin(), split), 0);
        // Only spaces stand between the header's last name and the '{': they share a line.
        Level level = gather(std::move(lines), std::span(split, item.inside.end()), last.end.line);
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
