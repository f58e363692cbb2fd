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
#include "format/format_internal.hpp"

namespace firn::format_detail {
namespace {

using syntax::Expr;

bool is_blank(char c) {
    return c == ' ' || c == '\t' || c == '\r' || c == '\n';
}

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

/// Builds the atoms of one statement or load.
class Printer {
  public:
    Printer(std::string_view source, std::string& signature, std::uint32_t start)
        : source_(source), signature_(signature), last_end_(start) {}

    std::vector<Atom> take() { return std::move(atoms_); }

    void print(const syntax::Statement& s);
    void print_block_header(const syntax::Statement& s, std::uint32_t brace);
    void print_load(const syntax::LoadDecl& load, const SourceRange& where);
    void print_setting(const syntax::Setting& setting);
    /// A block line of tokens as written (a combination or an arrangement rule).
    void print_source_line(const SourceRange& where) {
        signature_ += "\n line:";
        for (char c : text_of(where.begin.offset, where.end.offset)) {
            if (!is_blank(c))
                signature_ += c;
        }
        source_words(where.begin.offset, where.end.offset);
    }

  private:
    std::string_view source_;
    std::string& signature_;
    std::vector<Atom> atoms_;
    std::uint32_t last_end_;   ///< end of the last token whose place is known
    SourceRange where_;        ///< the statement being printed
    std::uint32_t brace_ = 0;  ///< the '{' of the block whose header is printed
    bool glue_next_ = false;
    bool break_next_ = false;
    bool glue_unit_ = false;  ///< the next number stands glued to its unit
    int list_next_ = -1;
    bool first_next_ = false;
    int lists_ = 0;

    void push(std::string text, std::uint32_t src) {
        Atom a;
        a.text = std::move(text);
        a.src = src;
        a.space_before = !glue_next_ && !atoms_.empty();
        a.forced_break = break_next_;
        a.list = list_next_;
        a.first_item = first_next_;
        atoms_.push_back(std::move(a));
        glue_next_ = break_next_ = first_next_ = false;
        list_next_ = -1;
    }
    /// A keyword or punctuation: its place is taken as the end of the token before.
    void word(std::string text) { push(std::move(text), last_end_); }
    void glued(std::string text) {
        glue_next_ = true;
        word(std::move(text));
    }
    void token(std::string text, std::uint32_t begin, std::uint32_t end) {
        push(std::move(text), begin);
        last_end_ = end;
    }
    void name(const syntax::Name& n) { token(n.text, n.where.begin.offset, n.where.end.offset); }
    std::string_view text_of(std::uint32_t begin, std::uint32_t end) const {
        return source_.substr(begin, end - begin);
    }
    /// The keywords written between two offsets, as the source has them.
    void source_words(std::uint32_t begin, std::uint32_t end);

    int open_list() { return lists_++; }
    void item(int list, std::size_t index) {
        if (index > 0)
            glued(",");
        list_next_ = list;
        first_next_ = index == 0;
    }
    template <typename T, typename F>
    void list(const std::vector<T>& items, F each) {
        int id = open_list();
        for (std::size_t i = 0; i < items.size(); ++i) {
            item(id, i);
            each(items[i]);
        }
    }
    void names(const std::vector<syntax::Name>& items) {
        list(items, [this](const syntax::Name& n) { name(n); });
    }

    void value(const Expr& e);
    void expr(const Expr& e);
    void chain(const Expr& e);
    void quantity(const Expr& e);
    void call(const Expr& e);
    void power(const Expr& e);
    std::string unit_text(const std::vector<syntax::UnitFactor>& unit) const;

    void print(const syntax::ModelTitle&);
    void print(const syntax::ReportUnits& r);
    void print(const syntax::Grid& g);
    void print(const syntax::LetDecl& l);
    void print(const syntax::UseDecl& u);
    void print(const syntax::NodeDecl& n);
    void print(const syntax::MaterialDecl& m);
    void print(const syntax::SectionDecl& s);
    void print(const syntax::MemberDecl& m);
    void print(const syntax::ColumnsDecl& c);
    void print(const syntax::BeamsDecl& b);
    void print(const syntax::RaftersDecl& r);
    void print(const syntax::GroupDecl& g);
    void print(const syntax::SupportDecl& s);
    void print(const syntax::AmendDecl& a);
    // A block's header, up to its '{'; format.cpp lays out its lines one by one.
    void print(const syntax::CaseDecl& c);
    void print(const syntax::SnowDecl& s);
    void print(const syntax::RoofDecl& r);
    void print(const syntax::CombinationsDecl& c);
    void print(const syntax::CombineDecl& c);
    void print(const syntax::PatternDecl& p);
    void print(const syntax::ArrangeDecl& a);
    void print(const syntax::DeflectionDecl& d);
    void print(const syntax::ExpectDecl& e);
    void expect_bound(const syntax::ExpectDecl& e);
    void because(const SourceRange& reason);
    void properties(const std::vector<syntax::Property>& props, bool started);
    void options(const syntax::MemberOptions& o);
    void generator(const char* keyword, const char* preposition,
                   const std::vector<syntax::LineRange>& ranges, const syntax::Name& from,
                   const syntax::Name& to, const syntax::MemberOptions& o);
};

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
        case Expr::Kind::group:
            token("(", begin, begin + 1);
            glue_next_ = true;
            expr(*e.rhs);
            glue_next_ = true;
            token(")", end - 1, end);
            break;
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

void Printer::print(const syntax::Statement& s) {
    where_ = s.where;
    signature_ += fmt::format("\n{}:", s.node.index());
    std::visit([this](const auto& node) { print(node); }, s.node);
}

void Printer::print(const syntax::ModelTitle&) {
    word("model");
    std::uint32_t quote = where_.begin.offset;
    while (quote < where_.end.offset && source_[quote] != '"')
        ++quote;
    token(std::string(text_of(quote, where_.end.offset)), quote, where_.end.offset);
}

void Printer::print(const syntax::ReportUnits& r) {
    word("report");
    word("units");
    list(r.items, [this](const syntax::ReportUnits::Item& i) {
        if (i.role)
            name(*i.role);
        token(unit_text(i.unit), i.unit.front().where.begin.offset, i.where.end.offset);
        signature_ += fmt::format("{},", unit_text(i.unit));
    });
}

void Printer::print(const syntax::Grid& g) {
    word("grid");
    word(g.plan ? "plan" : g.axis == syntax::Axis::x ? "x" : "y");
    if (g.run) {
        name(g.run->first);
        glued("..");
        glue_next_ = true;
        name(g.run->last);
        word("spacing");
        list(g.run->spacings, [this](const Expr& e) { value(e); });
        if (g.run->start) {
            word("from");
            value(*g.run->start);
        }
        return;
    }
    list(g.lines, [this](const syntax::Grid::Line& l) {
        name(l.name);
        word("=");
        value(l.at);
    });
}

void Printer::print(const syntax::LetDecl& l) {
    word("let");
    name(l.name);
    word("=");
    if (!l.text) {
        value(l.value);
        return;
    }
    signature_ += " text";
    const SourceRange& t = l.text_where;  // as written, escapes and all
    token(std::string(text_of(t.begin.offset, t.end.offset)), t.begin.offset, t.end.offset);
}

void Printer::print(const syntax::UseDecl& u) {
    word("use");
    if (u.outside)
        word("outside");
    if (u.module) {
        name(*u.module);
        return;
    }
    token(std::string(text_of(u.path_where.begin.offset, u.path_where.end.offset)),
          u.path_where.begin.offset, u.path_where.end.offset);
}

void Printer::print(const syntax::NodeDecl& n) {
    word("node");
    name(n.name);
    word("at");
    list(n.coordinates, [this](const syntax::NodeDecl::Coordinate& c) {
        if (c.grid_line) {
            name(*c.grid_line);
            return;
        }
        std::uint32_t at = c.where.begin.offset;
        token(*c.axis == syntax::Axis::x ? "x" : "y", at, at + 1);
        word("=");
        value(*c.value);
    });
}

void Printer::properties(const std::vector<syntax::Property>& props, bool started) {
    int id = open_list();
    for (std::size_t i = 0; i < props.size(); ++i) {
        if (i > 0 || !started)
            item(id, i);
        name(props[i].key);
        word("=");
        value(props[i].value);
    }
}

void Printer::print(const syntax::MaterialDecl& m) {
    word("material");
    name(m.name);
    properties(m.properties, false);
}

void Printer::print(const syntax::SectionDecl& s) {
    word("section");
    name(s.name);
    name(s.material);
    glued(",");
    if (s.shape == syntax::SectionDecl::Shape::given) {
        properties(s.properties, false);
        return;
    }
    // The shape word begins the first item of the property list.
    list_next_ = lists_;
    first_next_ = true;
    token(s.shape == syntax::SectionDecl::Shape::rectangle ? "rectangle" : "ishape",
          s.shape_where.begin.offset, s.shape_where.end.offset);
    properties(s.properties, true);
}

void Printer::options(const syntax::MemberOptions& o) {
    word("section");
    name(o.section);
    if (!o.hinges.empty()) {
        word("hinge");
        word("at");
        names(o.hinges);
    }
    if (!o.tags.empty()) {
        word("tag");
        names(o.tags);
    }
}

void Printer::print(const syntax::MemberDecl& m) {
    word("member");
    name(m.name);
    word("from");
    name(m.start);
    word("to");
    name(m.end);
    options(m.options);
}

/// `columns on LINES from A to B OPTIONS` and `beams along LEVELS from A to B OPTIONS`.
void Printer::generator(const char* keyword, const char* preposition,
                        const std::vector<syntax::LineRange>& ranges, const syntax::Name& from,
                        const syntax::Name& to, const syntax::MemberOptions& o) {
    word(keyword);
    word(preposition);
    list(ranges, [this](const syntax::LineRange& r) {
        name(r.first);
        if (r.last) {
            glued("..");
            glue_next_ = true;
            name(*r.last);
        }
    });
    word("from");
    name(from);
    word("to");
    name(to);
    options(o);
}

void Printer::print(const syntax::ColumnsDecl& c) {
    generator("columns", "on", c.lines, c.from, c.to, c.options);
}

void Printer::print(const syntax::BeamsDecl& b) {
    generator("beams", "along", b.levels, b.from, b.to, b.options);
}

void Printer::print(const syntax::RaftersDecl& r) {
    word("rafters");
    name(r.run);
    for (std::size_t i = 0; i < r.points.size(); ++i) {
        word(i == 0 ? "from" : "to");
        name(r.points[i]);
    }
    options(r.options);
}

void Printer::print(const syntax::GroupDecl& g) {
    word("group");
    name(g.name);
    word("=");
    names(g.members);
}

void Printer::print(const syntax::SupportDecl& s) {
    // `roller` and `roller free x` make the same tree: the words come from the source.
    source_words(where_.begin.offset, s.nodes.front().where.begin.offset);
    names(s.nodes);
    list(s.springs, [this](const syntax::SupportDecl::Spring& spring) {
        name(spring.direction);
        word("=");
        if (spring.stiffness)
            value(*spring.stiffness);
        else
            word("fixed");
    });
}

void Printer::print_block_header(const syntax::Statement& s, std::uint32_t brace) {
    brace_ = brace;
    print(s);
    token("{", brace, brace + 1);
}

void Printer::print(const syntax::CaseDecl& c) {
    word("case");
    name(c.name);
    source_words(c.name.where.end.offset, brace_);  // the kind: one word, or `roof live`
}

void Printer::print(const syntax::SnowDecl& s) {
    word("snow");
    name(s.name);
}

void Printer::print(const syntax::RoofDecl& r) {
    word(r.projection ? "projection" : "roof");
    name(r.name);
    word("on");
    names(r.members);
}

/// `because "reason"`: the string exactly as written, escapes and all.
void Printer::because(const SourceRange& reason) {
    signature_ += " because";
    word("because");
    token(std::string(text_of(reason.begin.offset, reason.end.offset)), reason.begin.offset,
          reason.end.offset);
}

void Printer::print_setting(const syntax::Setting& setting) {
    signature_ += "\n setting:";
    name(setting.key);
    word("=");
    value(setting.value);
    if (setting.reason)
        because(setting.reason_where);
}

void Printer::print(const syntax::CombinationsDecl& c) {
    word("combinations");
    name(c.name);
}

void Printer::print(const syntax::CombineDecl& c) {
    word("combine");
    names(c.sets);
}

void Printer::print(const syntax::PatternDecl& p) {
    word("pattern");
    name(p.name);
}

void Printer::print(const syntax::ArrangeDecl& a) {
    word("arrange");
    name(a.load_case);
    word("on");
    names(a.members);
    word("by");
    name(a.rule);
}

void Printer::print(const syntax::DeflectionDecl& d) {
    word("deflection");
    names(d.members);
    word("limit");
    name(d.row);
}

void Printer::print(const syntax::ExpectDecl& e) {
    word("expect");
    name(e.quantity);
    if (!e.component.text.empty())
        name(e.component);
    if (e.quantity.text == "snow") {
        names(e.places);
    } else {
        word(e.component.text.empty() && e.quantity.text != "rotation" ? "of" : "at");
        names(e.places);
    }
    if (e.source) {
        word("under");
        name(*e.source);
    }
    expect_bound(e);
    if (e.reason)
        because(e.reason_where);
}

void Printer::expect_bound(const syntax::ExpectDecl& e) {
    signature_ += " " + e.relation;
    if (e.relation == "between") {
        word("between");
        value(e.value);
        word("and");
        value(*e.high);
    } else {
        word(e.relation);
        value(e.value);
    }
    if (e.tolerance) {
        word("within");
        value(*e.tolerance);
        if (e.tolerance_percent)
            word("%");
    }
}

void Printer::print(const syntax::AmendDecl& a) {
    word("amend");
    name(a.name);
    word("=");
    value(a.value);
    because(a.reason_where);
}

void Printer::print_load(const syntax::LoadDecl& load, const SourceRange& where) {
    using F = syntax::LoadDecl::Form;
    where_ = where;
    signature_ += fmt::format("\n load {}:", static_cast<int>(load.form));
    if (load.form == F::self_weight) {
        word("self");
        word("weight");
        if (!load.targets.empty()) {
            word("on");
            names(load.targets);
        }
        return;
    }
    static constexpr const char* kForms[] = {"uniform", "linear", "point", "moment"};
    word(kForms[static_cast<int>(load.form)]);
    value(*load.value);
    if (load.form == F::linear) {
        word("to");
        value(*load.end_value);
    }
    if (load.form == F::moment) {
        // A moment's sense may be left out or written `counterclockwise`: both read
        // the same in the tree, so the words come from the source.
        source_words(load.value->where.end.offset, load.targets.front().where.begin.offset);
    } else {
        word(direction_word(load.direction));
        if (load.projected)
            word("projected");
        word(load.on_members ? "on" : "at");
    }
    names(load.targets);
    if (load.from) {
        word("from");
        value(*load.from);
        word("to");
        value(*load.to);
    }
    if (load.at && load.on_members) {
        word("at");
        value(*load.at);
    }
}

}  // namespace

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
