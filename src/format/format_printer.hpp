// format_printer: the Printer that builds the atoms of one statement or load,
// shared by format_print.cpp (tokens and expressions) and format_statements.cpp
// (one print per statement). Private to the format stage.
#pragma once

#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

#include "format/format_internal.hpp"

namespace firn::format_detail {

/// True for a space, a tab or a line break.
bool is_blank(char c);

class Printer {
  public:
    Printer(std::string_view source, std::string& signature, std::uint32_t start)
        : source_(source), signature_(signature), last_end_(start) {}

    std::vector<Atom> take() { return std::move(atoms_); }

    void print(const syntax::Statement& s);
    void print_block_header(const syntax::Statement& s, std::uint32_t brace);
    void print_load(const syntax::LoadDecl& load, const SourceRange& where);
    void print_setting(const syntax::Setting& setting);
    void print_cover_field(const syntax::CoverDecl::Field& field);
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

    void value(const syntax::Expr& e);
    void expr(const syntax::Expr& e);
    void chain(const syntax::Expr& e);
    void quantity(const syntax::Expr& e);
    void call(const syntax::Expr& e);
    void power(const syntax::Expr& e);
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
    void print(const syntax::GeometryTolerance& g);
    void print(const syntax::UnjoinedDecl& u);
    void print(const syntax::CoverDecl&);
    void expect_bound(const syntax::ExpectDecl& e);
    void because(const SourceRange& reason);
    void properties(const std::vector<syntax::Property>& props, bool started);
    void options(const syntax::MemberOptions& o);
    void generator(const char* keyword, const char* preposition,
                   const std::vector<syntax::LineRange>& ranges, const syntax::Name& from,
                   const syntax::Name& to, const syntax::MemberOptions& o);
};

/// The keyword of a load's direction.
const char* direction_word(syntax::LoadDecl::Direction d);

}  // namespace firn::format_detail
