// svg_xml_check: a small, strict XML well-formedness checker for the tests of
// the drawings and the HTML report (XML 1.0: one root element, tags nested
// and closed, attributes quoted and not repeated, only the five predefined
// entities and character references, comments and a DOCTYPE outside the root).
#pragma once

#include <cctype>
#include <set>
#include <string>
#include <string_view>
#include <vector>

namespace firn::testing {

class XmlChecker {
  public:
    /// Empty when `text` is well-formed; else what is wrong and at which offset.
    static std::string check(std::string_view text) {
        XmlChecker c(text);
        c.document();
        return c.error_;
    }

  private:
    explicit XmlChecker(std::string_view text) : s_(text) {}

    bool fail(const std::string& what) {
        if (error_.empty())
            error_ = what + " at offset " + std::to_string(i_);
        return false;
    }
    bool starts(std::string_view p) const { return s_.substr(i_, p.size()) == p; }
    void spaces() {
        while (i_ < s_.size() &&
               (s_[i_] == ' ' || s_[i_] == '\n' || s_[i_] == '\t' || s_[i_] == '\r'))
            ++i_;
    }
    static bool name_start(char c) {
        return std::isalpha(static_cast<unsigned char>(c)) || c == '_' || c == ':' ||
               static_cast<unsigned char>(c) >= 0x80;
    }
    static bool name_char(char c) {
        return name_start(c) || std::isdigit(static_cast<unsigned char>(c)) || c == '-' || c == '.';
    }
    bool name(std::string& out) {
        if (i_ >= s_.size() || !name_start(s_[i_]))
            return fail("expected a name");
        std::size_t start = i_;
        while (i_ < s_.size() && name_char(s_[i_]))
            ++i_;
        out = std::string(s_.substr(start, i_ - start));
        return true;
    }
    /// `&...;` at i_: one of the five entities or a character reference.
    bool reference() {
        std::size_t end = s_.find(';', i_);
        if (end == std::string_view::npos || end - i_ > 12)
            return fail("unterminated entity reference");
        std::string_view ref = s_.substr(i_ + 1, end - i_ - 1);
        static const std::set<std::string_view> kEntities{"amp", "lt", "gt", "quot", "apos"};
        bool ok = kEntities.count(ref) != 0;
        if (!ok && ref.size() > 1 && ref[0] == '#') {
            ok = true;
            bool hex = ref[1] == 'x';
            for (char c : ref.substr(hex ? 2 : 1))
                ok = ok && (hex ? std::isxdigit(static_cast<unsigned char>(c))
                                : std::isdigit(static_cast<unsigned char>(c)));
        }
        if (!ok)
            return fail("unknown entity &" + std::string(ref) + ";");
        i_ = end + 1;
        return true;
    }
    bool text_until_tag() {
        while (i_ < s_.size() && s_[i_] != '<') {
            if (s_[i_] == '&') {
                if (!reference())
                    return false;
            } else if (static_cast<unsigned char>(s_[i_]) < 0x20 && s_[i_] != '\n' &&
                       s_[i_] != '\t' && s_[i_] != '\r') {
                return fail("control character in text");
            } else if (starts("]]>")) {
                return fail("']]>' in text");
            } else {
                ++i_;
            }
        }
        return true;
    }
    bool skip_past(std::string_view end, const char* what) {
        std::size_t at = s_.find(end, i_);
        if (at == std::string_view::npos)
            return fail(std::string("unterminated ") + what);
        i_ = at + end.size();
        return true;
    }
    bool comment() {
        i_ += 4;
        std::size_t at = s_.find("--", i_);
        if (at == std::string_view::npos || s_.substr(at, 3) != "-->")
            return fail("bad comment");
        i_ = at + 3;
        return true;
    }
    bool attributes(bool& empty_element) {
        std::set<std::string> seen;
        for (;;) {
            std::size_t before = i_;
            spaces();
            if (starts("/>")) {
                i_ += 2;
                empty_element = true;
                return true;
            }
            if (starts(">")) {
                ++i_;
                return true;
            }
            if (i_ == before)
                return fail("expected a space before an attribute");
            std::string attribute;
            if (!name(attribute))
                return false;
            if (!seen.insert(attribute).second)
                return fail("attribute '" + attribute + "' repeated");
            spaces();
            if (!starts("="))
                return fail("expected '=' after " + attribute);
            ++i_;
            spaces();
            if (i_ >= s_.size() || (s_[i_] != '"' && s_[i_] != '\''))
                return fail("attribute value not quoted");
            char quote = s_[i_++];
            while (i_ < s_.size() && s_[i_] != quote) {
                if (s_[i_] == '<')
                    return fail("'<' in an attribute value");
                if (s_[i_] == '&') {
                    if (!reference())
                        return false;
                } else {
                    ++i_;
                }
            }
            if (i_ >= s_.size())
                return fail("unterminated attribute value");
            ++i_;
        }
    }
    bool misc() {  // comments, processing instructions and spaces outside the root
        for (;;) {
            spaces();
            if (starts("<!--")) {
                if (!comment())
                    return false;
            } else if (starts("<?")) {
                if (!skip_past("?>", "processing instruction"))
                    return false;
            } else {
                return true;
            }
        }
    }
    void document() {
        if (starts("<?xml") && !skip_past("?>", "XML declaration"))
            return;
        if (!misc())
            return;
        if (starts("<!DOCTYPE")) {
            if (!skip_past(">", "DOCTYPE") || !misc())
                return;
        }
        if (!starts("<")) {
            fail("expected the root element");
            return;
        }
        if (!element() || !misc())
            return;
        if (i_ != s_.size())
            fail("content after the root element");
    }
    bool element() {
        std::vector<std::string> open;
        do {
            if (starts("<!--")) {
                if (!comment())
                    return false;
            } else if (starts("<![CDATA[")) {
                if (!skip_past("]]>", "CDATA section"))
                    return false;
            } else if (starts("<?")) {
                if (!skip_past("?>", "processing instruction"))
                    return false;
            } else if (starts("</")) {
                i_ += 2;
                std::string tag;
                if (!name(tag))
                    return false;
                spaces();
                if (!starts(">"))
                    return fail("expected '>' closing </" + tag);
                ++i_;
                if (open.empty() || open.back() != tag)
                    return fail("</" + tag + "> closes " +
                                (open.empty() ? std::string("nothing") : "<" + open.back() + ">"));
                open.pop_back();
            } else if (starts("<")) {
                ++i_;
                std::string tag;
                if (!name(tag))
                    return false;
                bool empty_element = false;
                if (!attributes(empty_element))
                    return false;
                if (!empty_element)
                    open.push_back(tag);
            }
            if (open.empty())
                return true;
            if (!text_until_tag())
                return false;
        } while (i_ < s_.size());
        return fail("<" + open.back() + "> is never closed");
    }

    std::string_view s_;
    std::size_t i_ = 0;
    std::string error_;
};

}  // namespace firn::testing
