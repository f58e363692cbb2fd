// parse: runs the grammar over one file with the actions that build its tree.
// The actions are in parse_actions.hpp (lexical rules, expressions, the generic
// actions) and parse_statement_actions.hpp (statements, blocks, loads); the
// draft they fill is parse_builder.hpp's `Builder`; the messages of syntax
// errors and the recovery after them are parse_recovery.cpp's.
#include "front/front.hpp"

#include <fmt/format.h>
#include <utility>

#include "front/parse_builder.hpp"
#include "front/parse_statement_actions.hpp"
#include "grammar/errors.hpp"
#include "grammar/grammar.hpp"

namespace firn {

syntax::Tree parse(const SourceMap& sources, FileId file, Diagnostics& diagnostics) {
    namespace pegtl = tao::pegtl;
    const SourceFile& source = sources.file(file);
    parsing::Builder b(sources, file, diagnostics);
    pegtl::memory_input<pegtl::tracking_mode::lazy, pegtl::eol::lf_crlf> in(
        source.text.data(), source.text.data() + source.text.size(), source.name);
    try {
        pegtl::parse<grammar::file, parsing::action, grammar::control>(in, b);
    } catch (const parsing::TooManyErrors&) {
        diagnostics.error_without_place(fmt::format(
            "{}: too many syntax errors; the rest of the file was not read", source.name));
    }
    return std::move(b.tree);
}

}  // namespace firn
