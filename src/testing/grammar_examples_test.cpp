// Every example in grammar/REFERENCE.md and every model in examples/ parses.
#include <algorithm>
#include <catch2/catch.hpp>
#include <cctype>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "front/front.hpp"
#include "grammar/keywords.hpp"
#include "ir/syntax.hpp"

using namespace firn;

namespace {

std::string read(const std::filesystem::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::stringstream ss;
    ss << in.rdbuf();
    return ss.str();
}

/// The ```firn blocks of a markdown file.
std::vector<std::string> firn_blocks(const std::string& markdown) {
    std::vector<std::string> blocks;
    std::size_t at = 0;
    while ((at = markdown.find("```firn\n", at)) != std::string::npos) {
        at += 8;
        std::size_t end = markdown.find("```", at);
        blocks.push_back(markdown.substr(at, end - at));
        at = end + 3;
    }
    return blocks;
}

std::string parse_errors(const std::string& name, const std::string& text) {
    SourceMap sources;
    Diagnostics d;
    parse(sources, sources.add(name, text), d);
    return render(d, sources);
}

}  // namespace

TEST_CASE("every example in grammar/REFERENCE.md parses") {
    auto blocks =
        firn_blocks(read(std::filesystem::path(FIRN_SOURCE_DIR) / "grammar" / "REFERENCE.md"));
    CHECK(blocks.size() >= 12);
    for (std::size_t i = 0; i < blocks.size(); ++i) {
        INFO("example " << i + 1 << ":\n" << blocks[i]);
        CHECK(parse_errors("example", blocks[i]).empty());
    }
}

namespace {

/// True if `word` appears in `text` as a whole word.
bool has_word(const std::string& text, std::string_view word) {
    auto word_char = [](char c) { return std::isalnum(static_cast<unsigned char>(c)) || c == '_'; };
    for (std::size_t at = text.find(word); at != std::string::npos; at = text.find(word, at + 1)) {
        bool starts = at == 0 || !word_char(text[at - 1]);
        bool ends = at + word.size() == text.size() || !word_char(text[at + word.size()]);
        if (starts && ends)
            return true;
    }
    return false;
}

}  // namespace

TEST_CASE("the reference's examples use every keyword, function and operator") {
    auto blocks =
        firn_blocks(read(std::filesystem::path(FIRN_SOURCE_DIR) / "grammar" / "REFERENCE.md"));
    std::string all;
    for (const std::string& b : blocks)
        all += b;
    std::vector<std::string_view> words(grammar::keywords.begin(), grammar::keywords.end());
    words.insert(words.end(), grammar::contextual_keywords.begin(),
                 grammar::contextual_keywords.end());
    words.insert(words.end(), syntax::functions.begin(), syntax::functions.end());
    for (std::string_view w : words) {
        INFO("no example in grammar/REFERENCE.md uses '" << w << "'");
        CHECK(has_word(all, w));
    }
    for (std::string_view op : {"..", "^", "*", "/", "+", "-", "(", ";", "\"", "="}) {
        INFO("no example in grammar/REFERENCE.md uses '" << op << "'");
        CHECK(all.find(op) != std::string::npos);
    }
}

TEST_CASE("every model in examples/ parses") {
    std::size_t count = 0;
    for (const auto& entry :
         std::filesystem::directory_iterator(std::filesystem::path(FIRN_SOURCE_DIR) / "examples")) {
        if (entry.path().extension() != ".firn")
            continue;
        ++count;
        INFO(entry.path().filename().string());
        CHECK(parse_errors(entry.path().filename().string(), read(entry.path())).empty());
    }
    CHECK(count >= 2);
}

namespace {

/// The words in backticks in `text` between `begin` and the first `end` after it
/// (`a b c` or `a`, `b`).
std::vector<std::string> words_between(const std::string& text, const std::string& begin,
                                       const std::string& end) {
    std::size_t from = text.find(begin);
    REQUIRE(from != std::string::npos);
    from += begin.size();
    std::string span = text.substr(from, text.find(end, from) - from);
    std::vector<std::string> words;
    std::string word;
    bool quoted = false;
    for (char c : span) {
        quoted = c == '`' ? !quoted : quoted;
        if (quoted && (std::isalpha(static_cast<unsigned char>(c)) != 0 || c == '_')) {
            word += c;
        } else if (!word.empty()) {
            words.push_back(word);
            word.clear();
        }
    }
    if (!word.empty())
        words.push_back(word);
    std::sort(words.begin(), words.end());
    return words;
}

template <typename List>
std::vector<std::string> sorted_words(const List& list) {
    std::vector<std::string> words(list.begin(), list.end());
    std::sort(words.begin(), words.end());
    return words;
}

}  // namespace

TEST_CASE("the reference lists exactly the grammar's reserved and contextual words") {
    std::string reference =
        read(std::filesystem::path(FIRN_SOURCE_DIR) / "grammar" / "REFERENCE.md");
    CHECK(words_between(reference, "(the list is `grammar/keywords.hpp`):\n", "`.\n") ==
          sorted_words(grammar::keywords));
    std::vector<std::string> contextual = words_between(
        reference, "names elsewhere (`grammar/keywords.hpp`, `contextual_keywords`):", ".\n");
    contextual.push_back("roof");  // the sentence before explains it
    std::sort(contextual.begin(), contextual.end());
    CHECK(contextual == sorted_words(grammar::contextual_keywords));
}
