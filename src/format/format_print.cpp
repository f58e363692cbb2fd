// format_print: statements and loads as atoms, the tokens of the canonical
// layout. Spacing is decided here; where lines break is format_layout's work.
//
// Names, numbers, units, titles and paths are printed as the author spelled
// them; keywords are printed from the tree, except where the tree does not say
// which spelling was used (`roller` / `roller free x`, a moment's sense) or
// keeps no words (a case's kind): those are read back from the source.
#include <fmt/format.h>
#include <algorithm>
#include <cctype>

#include "base/units.hpp"
#include "format/format_printer.hpp"

namespace firn::format_detail {
namespace {

using syntax::Expr;

/// True if `name` reads as a unit up to its end or first '.' (`ft`, `in4`, `ft.x`):
/// after a number with a unit and '*' or '/' on one line, it would join that
/// unit (the grammar's unit_atom).
bool reads_as_unit(std::string_view name) {
    std::size_t letters = 0;
    while (letters < name.size() && std::isalpha(static_cast<unsigned char>(name[letters])))
        ++letters;
    if (letters == 0 || find_unit(name.substr(0, letters)) == nullptr)
        return false;
    std::size_t end = letters;
    while (end < name.size() && std::isdigit(static_cast<unsigned char>(name[end])))
        ++end;
    return end == name.size() || name[end] == '.';
}

/// True if the last token of `e` is a number with a unit.
bool ends_with_unit(const Expr& e) {
    switch (e.kind) {
        case Expr::Kind::number:
            return !e.unit.empty();
        case Expr::Kind::negate:
        case Expr::Kind::add:
        case Expr::Kind::subtract:
        case Expr::Kind::multiply:
        case Expr::Kind::divide:
        case Expr::Kind::power:
            return ends_with_unit(*e.rhs);
        default:
            return false;
    }
}

/// True for + - * /: a chain of them nests to the left without limit (`a + b + c`
/// is `(a + b) + c`), so these are walked with loops, never recursion.
bool is_chain(const Expr& e) {
    return e.kind == Expr::Kind::add || e.kind == Expr::Kind::subtract ||
           e.kind == Expr::Kind::multiply || e.kind == Expr::Kind::divide;
}

/// The operand `e` starts with, after going down its chain of + - * /.
const Expr& leftmost(const Expr& e) {
    const Expr* p = &e;
    while (is_chain(*p))
        p = p->lhs.get();
    return *p;
}

/// True if the first token of `e` is a name that starts like a unit.
bool starts_with_unit_name(const Expr& e) {
    const Expr& first = leftmost(e);
    switch (first.kind) {
        case Expr::Kind::constant:
        case Expr::Kind::call:
            return reads_as_unit(first.literal);
        case Expr::Kind::power:
            return starts_with_unit_name(*first.lhs);
        default:
            return false;
    }
}

/// The chain of + - * / that `e` heads, innermost first.
std::vector<const Expr*> chain_of(const Expr& e) {
    std::vector<const Expr*> chain;
    for (const Expr* p = &e; is_chain(*p); p = p->lhs.get())
        chain.push_back(p);
    std::reverse(chain.begin(), chain.end());
    return chain;
}

char operator_of(Expr::Kind kind) {
    switch (kind) {
        case Expr::Kind::add:
            return '+';
        case Expr::Kind::subtract:
            return '-';
        case Expr::Kind::multiply:
            return '*';
        case Expr::Kind::divide:
            return '/';
        default:
            return '^';
    }
}

/// The structure of an expression, for the self-check: kinds, literals, units.
void describe(const Expr& e, std::string& out) {
    std::vector<const Expr*> chain = chain_of(e);
    for (auto it = chain.rbegin(); it != chain.rend(); ++it)
        out += fmt::format("[{}:", static_cast<int>((*it)->kind));
    const Expr& first = leftmost(e);
    out += fmt::format("[{}:{}", static_cast<int>(first.kind), first.literal);
    for (const syntax::UnitFactor& f : first.unit)
        out += fmt::format("{}{}^{}", f.divides ? '/' : '*', f.name, f.exponent);
    if (first.bad_unit)
        out += fmt::format("?{}", first.bad_unit->text);
    for (const Expr* operand : {first.lhs.get(), first.rhs.get()}) {
        if (operand != nullptr)
            describe(*operand, out);
    }
    for (const Expr& argument : first.args)
        describe(argument, out);
    out += ']';
    for (const Expr* link : chain) {
        describe(*link->rhs, out);
        out += ']';
    }
}

/// Builds the atoms of one statement or load.

}  // namespace

bool is_blank(char c) {
    return c == ' ' || c == '\t' || c == '\r' || c == '\n';
}

const char* direction_word(syntax::LoadDecl::Direction d) {
    using D = syntax::LoadDecl::Direction;
    switch (d) {
        case D::x:
            return "x";
        case D::y:
            return "y";
        case D::up:
            return "up";
        case D::down:
            return "down";
        case D::axial:
            return "axial";
        case D::transverse:
            return "transverse";
        case D::none:
            break;
    }
    return "";
}

void Printer::source_words(std::uint32_t begin, std::uint32_t end) {
    std::string_view text = text_of(begin, end);
    std::size_t i = 0;
    while (i < text.size()) {
        while (i < text.size() && is_blank(text[i]))
            ++i;
        std::size_t j = i;
        while (j < text.size() && !is_blank(text[j]))
            ++j;
        if (j > i)
            token(std::string(text.substr(i, j - i)), begin + static_cast<std::uint32_t>(i),
                  begin + static_cast<std::uint32_t>(j));
        i = j;
    }
}

/// The unit as written, without the spaces an author may put around '*' and '/'.
std::string Printer::unit_text(const std::vector<syntax::UnitFactor>& unit) const {
    std::string text;
    for (char c : text_of(unit.front().where.begin.offset, unit.back().where.end.offset)) {
        if (!is_blank(c))
            text += c;
    }
    return text;
}

/// A whole expression: printed, and its structure added to the signature.
void Printer::value(const Expr& e) {
    describe(e, signature_);
    expr(e);
}

/// A number and its unit, one atom: nothing can stand between them.
void Printer::quantity(const Expr& e) {
    std::string_view space = glue_unit_ ? "" : " ";
    glue_unit_ = false;
    std::string text = e.literal;
    if (!e.unit.empty())
        text = fmt::format("{}{}{}", e.literal, space, unit_text(e.unit));
    else if (e.bad_unit)
        text = fmt::format("{}{}{}", e.literal, space, e.bad_unit->text);
    token(std::move(text), e.where.begin.offset, e.where.end.offset);
}

/// `min(a, b)`: the '(' and ')' lie at known places, for comments inside.
void Printer::call(const Expr& e) {
    auto open = e.where.begin.offset + static_cast<std::uint32_t>(e.literal.size());
    token(e.literal, e.where.begin.offset, open);
    glue_next_ = true;
    token("(", open, open + 1);
    for (std::size_t i = 0; i < e.args.size(); ++i) {
        if (i > 0)
            glued(",");
        else
            glue_next_ = true;
        expr(e.args[i]);
    }
    glue_next_ = true;
    token(")", e.where.end.offset - 1, e.where.end.offset);
}

void Printer::expr(const Expr& e) {
    const std::uint32_t begin = e.where.begin.offset, end = e.where.end.offset;
    switch (e.kind) {
        case Expr::Kind::number:
            quantity(e);
            break;
        case Expr::Kind::constant:
            token(e.literal, begin, end);
            break;
        case Expr::Kind::call:
            call(e);
            break;
        case Expr::Kind::negate:
            token("-", begin, begin + 1);
            glue_next_ = true;
            expr(*e.rhs);
            break;
        case Expr::Kind::group: {
            // `(1/2) in`: the unit follows the ')', which is then not the last character.
            auto close =
                static_cast<std::uint32_t>(e.unit.empty() ? end - 1 : source_.rfind(')', end));
            token("(", begin, begin + 1);
            glue_next_ = true;
            expr(*e.rhs);
            glue_next_ = true;
            token(")", close, close + 1);
            if (!e.unit.empty())
                token(unit_text(e.unit), close + 1, end);
            break;
        }
        case Expr::Kind::power:
            power(e);
            break;
        default:
            chain(e);
    }
}

void Printer::chain(const Expr& e) {
    expr(leftmost(e));
    for (const Expr* link : chain_of(e)) {
        word(std::string(1, operator_of(link->kind)));
        // `2 kip *` and a constant named like a unit on the next line: on one line
        // they would read as the unit kip*ft, so the author's line break stays.
        bool joins = (link->kind == Expr::Kind::multiply || link->kind == Expr::Kind::divide) &&
                     ends_with_unit(*link->lhs) && starts_with_unit_name(*link->rhs);
        break_next_ = joins;
        expr(*link->rhs);
    }
}

void Printer::power(const Expr& e) {
    const Expr& lhs = *e.lhs;
    // `2 ft^2` would read as the unit ft^2: after a unit the caret stands apart.
    bool apart = lhs.kind == Expr::Kind::number && (!lhs.unit.empty() || lhs.bad_unit);
    // `2 ft^2x` is no unit, so `ft` is a bad one raised to `2x`: apart or with a
    // space in `2x`, `ft` would be a unit. It stays glued as written.
    bool stuck =
        lhs.kind == Expr::Kind::number && lhs.bad_unit && reads_as_unit(lhs.bad_unit->text);
    expr(lhs);
    glue_next_ = !apart || stuck;
    word("^");
    glue_next_ = !apart || stuck;
    glue_unit_ = stuck;
    expr(*e.rhs);
    glue_unit_ = false;
}

std::vector<Atom> statement_atoms(const syntax::Statement& statement, std::string_view source,
                                  std::string& signature) {
    Printer p(source, signature, statement.where.begin.offset);
    p.print(statement);
    return p.take();
}

std::vector<Atom> source_line_atoms(const SourceRange& where, std::string_view source,
                                    std::string& signature) {
    Printer p(source, signature, where.begin.offset);
    p.print_source_line(where);
    return p.take();
}

std::vector<Atom> cover_field_atoms(const syntax::CoverDecl::Field& field, std::string_view source,
                                    std::string& signature) {
    Printer p(source, signature, field.key.where.begin.offset);
    p.print_cover_field(field);
    return p.take();
}

std::vector<Atom> block_header_atoms(const syntax::Statement& statement, std::uint32_t brace,
                                     std::string_view source, std::string& signature) {
    Printer p(source, signature, statement.where.begin.offset);
    p.print_block_header(statement, brace);
    return p.take();
}

std::vector<Atom> load_atoms(const syntax::LoadDecl& load, const SourceRange& where,
                             std::string_view source, std::string& signature) {
    Printer p(source, signature, where.begin.offset);
    p.print_load(load, where);
    return p.take();
}

std::vector<Atom> setting_atoms(const syntax::Setting& setting, std::string_view source,
                                std::string& signature) {
    Printer p(source, signature, setting.key.where.begin.offset);
    p.print_setting(setting);
    return p.take();
}

}  // namespace firn::format_detail
