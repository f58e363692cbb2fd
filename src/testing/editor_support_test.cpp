// The editor highlighters in editor-support/ know the words of the language: every
// keyword of grammar/keywords.hpp, every unit of unit_names() and every built-in
// function, and they mark as keywords only the language's keywords.
#include <fmt/format.h>
#include <catch2/catch.hpp>
#include <filesystem>
#include <map>
#include <nlohmann/json.hpp>
#include <regex>
#include <set>
#include <sstream>
#include <string>

#include "base/file_io.hpp"
#include "base/units.hpp"
#include "grammar/keywords.hpp"

namespace {

using Words = std::set<std::string>;

/// The words the highlighters colour, by kind.
struct Highlighted {
    Words keywords, units, functions;
};

std::filesystem::path support_path(const std::string& relative) {
    return std::filesystem::path(FIRN_SOURCE_DIR) / "editor-support" / relative;
}

std::string read_support_file(const std::string& relative) {
    std::string text, error;
    bool read = firn::read_file(support_path(relative).string(), text, error);
    INFO(error);
    REQUIRE(read);
    return text;
}

nlohmann::json read_support_json(const std::string& relative) {
    std::string text = read_support_file(relative);
    INFO("editor-support/" << relative << " is not valid JSON");
    REQUIRE(nlohmann::json::accept(text));
    return nlohmann::json::parse(text);
}

Words language_keywords() {
    Words words{firn::grammar::keywords.begin(), firn::grammar::keywords.end()};
    words.insert(firn::grammar::contextual_keywords.begin(),
                 firn::grammar::contextual_keywords.end());
    return words;
}

Words language_units() {
    std::vector<std::string> names = firn::unit_names();
    return {names.begin(), names.end()};
}

// The built-in functions of expressions.
Words language_functions() {
    return {"min", "max", "abs", "sqrt"};
}

/// The words of `wanted` that `have` lacks, joined by ", " ("" if none), so that a
/// failed check names them.
std::string words_not_in(const Words& wanted, const Words& have) {
    std::string missing;
    for (const std::string& w : wanted) {
        if (have.count(w) != 0)
            continue;
        if (!missing.empty())
            missing += ", ";
        missing += w;
    }
    return missing;
}

// ---------------------------------------------------------------- TextMate

/// The words of a pattern written `\b(?:w1|w2|...)\b`. Any other form fails: a
/// word-list scope must list whole words, nothing that a regex could widen.
Words alternation_words(const std::string& pattern) {
    static const std::regex form(R"(^\\b\(\?:(\w+(?:\|\w+)*)\)\\b$)");
    std::smatch m;
    INFO("pattern " << pattern << " is not of the form \\b(?:word|word|...)\\b");
    REQUIRE(std::regex_match(pattern, m, form));
    Words words;
    std::stringstream alternatives(m[1].str());
    for (std::string w; std::getline(alternatives, w, '|');)
        words.insert(w);
    return words;
}

bool starts_with(const std::string& s, std::string_view prefix) {
    return s.compare(0, prefix.size(), prefix) == 0;
}

/// The word list a TextMate scope name stands for, or nullptr for scopes that are
/// not word lists (operators, comments, strings, numbers, punctuation).
Words* word_list_of(const std::string& scope, Highlighted& h) {
    if (starts_with(scope, "keyword.operator."))
        return nullptr;
    if (starts_with(scope, "keyword."))
        return &h.keywords;
    if (starts_with(scope, "support.type.unit."))
        return &h.units;
    if (starts_with(scope, "support.function."))
        return &h.functions;
    return nullptr;
}

/// Collects the words of every rule, at any depth, whose scope is a word list.
void collect_textmate_words(const nlohmann::json& node, Highlighted& h) {
    if (node.is_array()) {
        for (const auto& child : node)
            collect_textmate_words(child, h);
        return;
    }
    if (!node.is_object())
        return;
    if (node.contains("name") && node["name"].is_string()) {
        std::string scope = node["name"].get<std::string>();
        if (Words* list = word_list_of(scope, h)) {
            INFO("rule " << scope << " has no `match` to read its words from");
            REQUIRE(node.contains("match"));
            Words words = alternation_words(node["match"].get<std::string>());
            list->insert(words.begin(), words.end());
        }
    }
    for (const auto& [key, child] : node.items())
        collect_textmate_words(child, h);
}

Highlighted textmate_words() {
    Highlighted h;
    collect_textmate_words(read_support_json("vscode/syntaxes/firn.tmLanguage.json"), h);
    return h;
}

// ---------------------------------------------------------------- Vim

std::vector<std::string> split_words(const std::string& line) {
    std::vector<std::string> tokens;
    std::istringstream in(line);
    for (std::string t; in >> t;)
        tokens.push_back(t);
    return tokens;
}

/// Arguments of `syn keyword` that are options, not words.
bool is_vim_option(const std::string& token) {
    static const Words options{"contained", "transparent", "skipwhite", "skipnl",
                               "skipempty", "conceal",     "display",   "fold"};
    return options.count(token) != 0 || token.find('=') != std::string::npos;
}

/// The words of each `syn keyword GROUP word...` line, by group.
std::map<std::string, Words> vim_keyword_groups(const std::string& text) {
    std::map<std::string, Words> groups;
    std::istringstream in(text);
    for (std::string line; std::getline(in, line);) {
        std::vector<std::string> t = split_words(line);
        if (t.size() < 3 || (t[0] != "syn" && t[0] != "syntax") || t[1] != "keyword")
            continue;
        for (std::size_t i = 3; i < t.size(); ++i)
            if (!is_vim_option(t[i]))
                groups[t[2]].insert(t[i]);
    }
    return groups;
}

Highlighted vim_words(const std::map<std::string, Words>& groups) {
    auto words_of = [&](const std::string& group) {
        auto it = groups.find(group);
        return it == groups.end() ? Words{} : it->second;
    };
    return {words_of("firnKeyword"), words_of("firnUnit"), words_of("firnFunction")};
}

/// Checks both directions for keywords (a highlighted word that is not a keyword
/// fails too), and that every unit and function is highlighted as one.
void check_words(const Highlighted& h) {
    {
        INFO("keywords of grammar/keywords.hpp that are not highlighted as keywords");
        CHECK(words_not_in(language_keywords(), h.keywords) == "");
    }
    {
        INFO("words highlighted as keywords that are not keywords of the language");
        CHECK(words_not_in(h.keywords, language_keywords()) == "");
    }
    {
        INFO("units of unit_names() that are not highlighted as units");
        CHECK(words_not_in(language_units(), h.units) == "");
    }
    {
        INFO("words highlighted as units that are not units of the language");
        CHECK(words_not_in(h.units, language_units()) == "");
    }
    {
        INFO("built-in functions that are not highlighted as functions");
        CHECK(words_not_in(language_functions(), h.functions) == "");
    }
}

}  // namespace

TEST_CASE("editor support: the VS Code extension's JSON files parse and agree") {
    nlohmann::json package = read_support_json("vscode/package.json");
    nlohmann::json config = read_support_json("vscode/language-configuration.json");
    nlohmann::json grammar = read_support_json("vscode/syntaxes/firn.tmLanguage.json");

    CHECK(package.at("name") == "firn");
    CHECK(package.at("version") == "0.1.0");
    const nlohmann::json& language = package.at("contributes").at("languages").at(0);
    CHECK(language.at("id") == "firn");
    CHECK(language.at("extensions") == nlohmann::json::array({".firn"}));
    const nlohmann::json& grammar_entry = package.at("contributes").at("grammars").at(0);
    CHECK(grammar_entry.at("language") == "firn");
    CHECK(grammar_entry.at("scopeName") == "source.firn");
    CHECK(grammar_entry.at("path") == "./syntaxes/firn.tmLanguage.json");
    CHECK(grammar.at("scopeName") == "source.firn");
    CHECK(config.at("comments").at("lineComment") == "#");
}

TEST_CASE("editor support: the VS Code extension starts 'firn lsp' from its path setting") {
    nlohmann::json package = read_support_json("vscode/package.json");
    std::string extension = read_support_file("vscode/extension.js");
    CHECK(package.at("main") == "./extension.js");
    CHECK(package.at("activationEvents") == nlohmann::json::array({"onLanguage:firn"}));
    const nlohmann::json& settings = package.at("contributes").at("configuration").at("properties");
    CHECK(settings.at("firn.languageServer.path").at("default") == "firn");
    CHECK(settings.at("firn.languageServer.enabled").at("default") == true);
    CHECK(package.at("dependencies").contains("vscode-languageclient"));
    CHECK(extension.find("getConfiguration('firn.languageServer')") != std::string::npos);
    CHECK(extension.find("settings.get('path', 'firn')") != std::string::npos);
    CHECK(extension.find("args: ['lsp']") != std::string::npos);
    CHECK(extension.find("language: 'firn'") != std::string::npos);
}

TEST_CASE("editor support: the word-list reader takes whole words only") {
    CHECK(alternation_words(R"(\b(?:at|attribute)\b)") == Words{"at", "attribute"});
    Highlighted h{{"attribute"}, {}, {}};
    CHECK(words_not_in({"at", "attribute"}, h.keywords) == "at");
    std::map<std::string, Words> groups = vim_keyword_groups(
        "syn keyword firnKeyword contained at nextgroup=firnUnit\n"
        "\" syn keyword firnKeyword down\n"
        "syntax keyword firnUnit kN\n");
    CHECK(groups["firnKeyword"] == Words{"at"});
    CHECK(groups["firnUnit"] == Words{"kN"});
}

TEST_CASE(
    "editor support: the TextMate grammar highlights exactly the keywords, and every unit "
    "and function") {
    check_words(textmate_words());
}

TEST_CASE(
    "editor support: the Vim syntax highlights exactly the keywords, and every unit and "
    "function") {
    std::string text = read_support_file("vim/syntax/firn.vim");
    std::map<std::string, Words> groups = vim_keyword_groups(text);
    check_words(vim_words(groups));
    // Every group of words is linked to a standard highlight group, or it shows uncoloured.
    for (const auto& [group, words] : groups) {
        INFO("syntax group " << group << " has no `hi def link` line");
        CHECK(text.find(fmt::format("hi def link {} ", group)) != std::string::npos);
    }
}

TEST_CASE("editor support: Vim recognizes *.firn files") {
    std::string text = read_support_file("vim/ftdetect/firn.vim");
    CHECK(text.find("au BufRead,BufNewFile *.firn set filetype=firn") != std::string::npos);
}
