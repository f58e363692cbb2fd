// format_layout: atoms as lines. A statement stays on one line unless it is
// wider than kLineWidth, when its lists break greedily after commas, each
// continuation aligned under the list's first item; a comment inside a
// statement always ends its line.
#include <fmt/format.h>
#include <algorithm>
#include <vector>

#include "format/format_internal.hpp"

namespace firn::format_detail {
namespace {

bool is_trailing_space(char c) {
    return c == ' ' || c == '\t' || c == '\v' || c == '\f' || c == '\r';
}

/// The line being built, and its width in columns.
struct LineBuilder {
    std::string text;
    std::size_t width = 0;
    bool has_code = false;

    void start(std::size_t column) {
        text.assign(column, ' ');
        width = column;
        has_code = false;
    }
    void add(std::string_view s) {
        text += s;
        width += width_of(s);
        has_code = true;
    }
};

/// Lays out one statement; the state of a single call of lay_out.
class Layout {
  public:
    Layout(const std::vector<Atom>& atoms, std::size_t indent, std::vector<Line>& out)
        : atoms_(atoms), indent_(indent), out_(out), columns_(count_lists(atoms)) {}

    void run() {
        line_.start(indent_);
        for (std::size_t i = 0; i < atoms_.size(); ++i) {
            if (i > 0)
                separate(i);
            const Atom& a = atoms_[i];
            if (a.list >= 0 && a.first_item)
                columns_[static_cast<std::size_t>(a.list)] = line_.width;
            line_.add(a.text);
        }
        flush();
    }

  private:
    const std::vector<Atom>& atoms_;
    std::size_t indent_;
    std::vector<Line>& out_;
    std::vector<std::size_t> columns_;  ///< where each list's first item stands (0: not yet)
    LineBuilder line_;
    std::string comment_;  ///< trailing comment of the line being built

    static std::size_t count_lists(const std::vector<Atom>& atoms) {
        int most = -1;
        for (const Atom& a : atoms)
            most = std::max(most, a.list);
        return most < 0 ? 0 : static_cast<std::size_t>(most) + 1;
    }

    static bool soft_break(const Atom& a) { return a.list >= 0 && !a.first_item; }
    bool hard_break(std::size_t i) const {
        return atoms_[i].forced_break || !atoms_[i - 1].comments.empty();
    }

    /// Where a line that continues at atom `i` starts: under its list's first
    /// item, or indented past the statement.
    std::size_t continuation(std::size_t i) const {
        const Atom& a = atoms_[i];
        if (a.list >= 0 && columns_[static_cast<std::size_t>(a.list)] > 0)
            return columns_[static_cast<std::size_t>(a.list)];
        return indent_ + kContinuationIndent;
    }

    /// Columns from atom `i` to the next place the line may break.
    std::size_t chunk_width(std::size_t i) const {
        std::size_t w = width_of(atoms_[i].text);
        for (std::size_t j = i + 1; j < atoms_.size() && !soft_break(atoms_[j]) && !hard_break(j);
             ++j) {
            w += (atoms_[j].space_before ? 1 : 0) + width_of(atoms_[j].text);
        }
        return w;
    }

    void separate(std::size_t i) {
        const Atom& a = atoms_[i];
        if (hard_break(i)) {
            for (const Remark& r : atoms_[i - 1].comments)
                place_comment(r, continuation(i));
            flush();
            line_.start(continuation(i));
        } else if (soft_break(a) && line_.width + 1 + chunk_width(i) > kLineWidth) {
            flush();
            line_.start(continuation(i));
        } else if (a.space_before) {
            line_.add(" ");
        }
    }

    void place_comment(const Remark& r, std::size_t column) {
        if (r.after_code && line_.has_code && comment_.empty()) {
            comment_ = comment_text(*r.comment);
            return;
        }
        flush();
        Line own;
        own.comment = comment_text(*r.comment);
        own.indent = column;
        own.own_comment = true;
        out_.push_back(std::move(own));
    }

    void flush() {
        if (line_.has_code) {
            Line l;
            l.code = std::move(line_.text);
            l.comment = std::move(comment_);
            out_.push_back(std::move(l));
        }
        line_.start(0);
        comment_.clear();
    }
};

}  // namespace

std::size_t width_of(std::string_view text) {
    return static_cast<std::size_t>(std::count_if(text.begin(), text.end(), [](char c) {
        return (static_cast<unsigned char>(c) & 0xC0) != 0x80;
    }));
}

std::string comment_text(const syntax::Comment& comment) {
    std::string text = comment.text;
    while (!text.empty() && is_trailing_space(text.back()))
        text.pop_back();
    return text;
}

void attach_comments(std::vector<Atom>& atoms, const std::vector<Remark>& inside) {
    std::size_t a = 0;
    for (const Remark& r : inside) {
        while (a + 1 < atoms.size() && atoms[a + 1].src < r.offset())
            ++a;
        atoms[a].comments.push_back(r);
    }
}

void lay_out(const std::vector<Atom>& atoms, std::size_t indent, std::vector<Line>& out) {
    Layout(atoms, indent, out).run();
}

void align_trailing_comments(std::vector<Line>& lines) {
    auto trailing = [](const Line& l) { return !l.own_comment && !l.comment.empty(); };
    for (std::size_t begin = 0; begin < lines.size();) {
        if (!trailing(lines[begin])) {
            ++begin;
            continue;
        }
        std::size_t end = begin, widest = 0;
        for (; end < lines.size() && trailing(lines[end]); ++end)
            widest = std::max(widest, width_of(lines[end].code));
        // Aligned comments start two columns after the widest code, unless that
        // is past the line width; then each stays two columns after its own code.
        bool align = widest + 2 < kLineWidth;
        for (std::size_t i = begin; i < end; ++i) {
            std::size_t pad = align ? widest - width_of(lines[i].code) + 2 : 2;
            lines[i].code += std::string(pad, ' ');
        }
        begin = end;
    }
}

std::string render_lines(const std::vector<Line>& lines) {
    std::string text;
    for (const Line& l : lines) {
        std::string line = l.own_comment ? fmt::format("{:{}}{}", "", l.indent, l.comment)
                                         : fmt::format("{}{}", l.code, l.comment);
        while (!line.empty() && is_trailing_space(line.back()))
            line.pop_back();
        text += line;
        text += '\n';
    }
    return text;
}

}  // namespace firn::format_detail
