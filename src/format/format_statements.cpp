// format_statements: one print per statement and load of the language, in the
// order of the syntax tree's statement kinds.
#include <fmt/format.h>
#include <algorithm>

#include "format/format_printer.hpp"

namespace firn::format_detail {

using syntax::Expr;

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
    if (c.by_case) {
        word("by");
        word("case");
    }
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

void Printer::print(const syntax::GeometryTolerance& g) {
    word("geometry");
    word("tolerance");
    value(g.value);
}

void Printer::print(const syntax::UnjoinedDecl& u) {
    word("unjoined");
    names(u.nodes);
    word("on");
    names(u.members);
}

void Printer::print(const syntax::CoverDecl&) {
    word("cover");
}

/// `key = "text"`: the text exactly as written, escapes and all.
void Printer::print_cover_field(const syntax::CoverDecl::Field& field) {
    signature_ += "\n cover field:";
    name(field.key);
    word("=");
    const SourceRange& t = field.text_where;
    token(std::string(text_of(t.begin.offset, t.end.offset)), t.begin.offset, t.end.offset);
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

}  // namespace firn::format_detail
