// baseline_read: a baseline file back into values. Anything unexpected is an
// error naming the file and line, never a guess: a baseline that reads wrong
// would pass a check it should fail.
#include <fmt/format.h>
#include <charconv>
#include <cmath>
#include <unordered_map>

#include "baseline/baseline.hpp"

namespace firn {
namespace {

std::string_view trim(std::string_view s) {
    while (!s.empty() && (s.front() == ' ' || s.front() == '\t'))
        s.remove_prefix(1);
    while (!s.empty() && (s.back() == ' ' || s.back() == '\t' || s.back() == '\r'))
        s.remove_suffix(1);
    return s;
}

/// Splits at runs of spaces and tabs.
std::vector<std::string_view> words(std::string_view s) {
    std::vector<std::string_view> out;
    std::size_t i = 0;
    while (i < s.size()) {
        while (i < s.size() && (s[i] == ' ' || s[i] == '\t'))
            ++i;
        std::size_t start = i;
        while (i < s.size() && s[i] != ' ' && s[i] != '\t')
            ++i;
        if (i > start)
            out.push_back(s.substr(start, i - start));
    }
    return out;
}

bool read_number(std::string_view text, double& value) {
    const char* end = text.data() + text.size();
    auto [ptr, ec] = std::from_chars(text.data(), end, value);
    return ec == std::errc() && ptr == end && std::isfinite(value);
}

/// `KEY = VALUE [UNIT] [[NOTE]]`.
bool read_value_line(std::string_view line, BaselineValue& v, std::string& why) {
    std::size_t equals = line.find(" = ");
    if (equals == std::string_view::npos) {
        why = "expected `KEY = VALUE UNIT`";
        return false;
    }
    std::vector<std::string_view> key = words(line.substr(0, equals));
    if (key.size() < 3) {
        why = "a key has at least three words (`case D member AB moment_max`)";
        return false;
    }
    v.key = fmt::format("{}", fmt::join(key, " "));
    std::string_view rest = trim(line.substr(equals + 3));
    std::size_t bracket = rest.find('[');
    if (bracket != std::string_view::npos) {
        if (rest.back() != ']') {
            why = "a note in [ ] must end the line";
            return false;
        }
        v.note = std::string(trim(rest.substr(bracket + 1, rest.size() - bracket - 2)));
        rest = trim(rest.substr(0, bracket));
    }
    std::vector<std::string_view> value = words(rest);
    if (value.empty() || value.size() > 2 || !read_number(value[0], v.value)) {
        why = fmt::format("expected a number and its unit after `=`, found '{}'", rest);
        return false;
    }
    v.text = std::string(value[0]);
    v.unit = value.size() == 2 ? std::string(value[1]) : std::string();
    double to_si = 0.0;
    Dimension dimension;
    if (!parse_unit(v.unit, to_si, dimension)) {
        why = fmt::format("unknown unit '{}'", v.unit);
        return false;
    }
    return true;
}

/// A `model "TITLE"` line's title, with `\"` and `\\` unescaped.
bool read_title(std::string_view text, std::string& title) {
    if (text.size() < 2 || text.front() != '"' || text.back() != '"')
        return false;
    text = text.substr(1, text.size() - 2);
    for (std::size_t i = 0; i < text.size(); ++i) {
        if (text[i] == '\\' && i + 1 < text.size())
            ++i;
        title += text[i];
    }
    return true;
}

/// Reads the lines one by one; the header lines come first.
class Reader {
  public:
    Reader(const std::string& file, std::string& error) : file_(file), error_(error) {}

    bool line(std::size_t number, std::string_view text, Baseline& b) {
        text = trim(text);
        if (text.empty() || text.front() == '#')
            return true;
        if (!seen_format_)
            return format_line(number, text, b);
        if (text.starts_with("model "))
            return read_title(trim(text.substr(6)), b.title)
                       ? (seen_model_ = true)
                       : fail(number, "expected model \"TITLE\"");
        if (text.starts_with("source ")) {
            b.source = std::string(trim(text.substr(7)));
            return true;
        }
        if (text.starts_with("units ")) {
            b.units = std::string(trim(text.substr(6)));
            return true;
        }
        return value_line(number, text, b);
    }

    bool finish(const Baseline& b) {
        if (!seen_format_)
            return fail(0, "not a firn baseline (no `firn baseline N` line)");
        if (!seen_model_ || b.source.empty())
            return fail(0, "the `model` or `source` line is missing");
        return true;
    }

  private:
    bool format_line(std::size_t number, std::string_view text, Baseline& b) {
        std::vector<std::string_view> w = words(text);
        int format = 0;
        if (w.size() != 3 || w[0] != "firn" || w[1] != "baseline" ||
            std::from_chars(w[2].data(), w[2].data() + w[2].size(), format).ec != std::errc())
            return fail(number, "not a firn baseline (its first line is not `firn baseline N`)");
        if (format > kBaselineFormat) {
            return fail(number, fmt::format("written by a newer firn (format {}; this firn reads "
                                            "up to {})",
                                            format, kBaselineFormat));
        }
        if (format < 1)
            return fail(number, fmt::format("unknown baseline format {}", format));
        b.format = format;
        seen_format_ = true;
        return true;
    }

    bool value_line(std::size_t number, std::string_view text, Baseline& b) {
        BaselineValue v;
        std::string why;
        if (!read_value_line(text, v, why))
            return fail(number, why);
        v.line = number;
        auto [it, fresh] = first_line_.emplace(v.key, number);
        if (!fresh)
            return fail(number,
                        fmt::format("'{}' appears twice (first on line {})", v.key, it->second));
        b.values.push_back(std::move(v));
        return true;
    }

    bool fail(std::size_t number, std::string_view message) {
        error_ = number == 0 ? fmt::format("{}: error: {}", file_, message)
                             : fmt::format("{}:{}: error: {}", file_, number, message);
        return false;
    }

    const std::string& file_;
    std::string& error_;
    bool seen_format_ = false, seen_model_ = false;
    std::unordered_map<std::string, std::size_t> first_line_;  // looked up only, never listed
};

}  // namespace

std::optional<int> baseline_format_of(std::string_view text) {
    while (!text.empty()) {
        std::size_t end = text.find('\n');
        std::string_view line = trim(text.substr(0, end));
        text = end == std::string_view::npos ? std::string_view() : text.substr(end + 1);
        if (line.empty() || line.front() == '#')
            continue;
        std::vector<std::string_view> w = words(line);
        int format = 0;
        if (w.size() == 3 && w[0] == "firn" && w[1] == "baseline" &&
            std::from_chars(w[2].data(), w[2].data() + w[2].size(), format).ec == std::errc())
            return format;
        return std::nullopt;
    }
    return std::nullopt;
}

std::optional<Baseline> read_baseline(std::string_view text, const std::string& file,
                                      std::string& error) {
    Baseline b;
    Reader reader(file, error);
    std::size_t number = 0;
    while (!text.empty()) {
        std::size_t end = text.find('\n');
        ++number;
        if (!reader.line(number, text.substr(0, end), b))
            return std::nullopt;
        text = end == std::string_view::npos ? std::string_view() : text.substr(end + 1);
    }
    if (!reader.finish(b))
        return std::nullopt;
    return b;
}

}  // namespace firn
