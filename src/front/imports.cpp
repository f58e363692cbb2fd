// imports: depth-first loading of `use`d files and modules, with cycle and
// folder checks. Paths are joined and normalised lexically, so messages show
// them as the user wrote them (never made absolute).
#include "front/front.hpp"

#include <fmt/format.h>
#include <algorithm>
#include <filesystem>
#include <map>

#include "base/file_io.hpp"
#include "front/stdlib_embedded.hpp"

namespace firn {
namespace {

namespace fs = std::filesystem;

/// How deep `use` may nest: far beyond any model's library of shared parts, and
/// well within the stack (each level holds a parse in progress).
constexpr std::size_t kMaxUseDepth = 100;

/// The name messages give a built-in library module.
std::string builtin_name(const std::string& module) {
    return fmt::format("<stdlib>/{}.firn", module);
}

/// `path` made absolute, with symbolic links resolved where they exist.
fs::path absolute_path(const fs::path& path) {
    std::error_code ec;
    fs::path absolute = fs::absolute(path, ec);
    fs::path canonical = fs::weakly_canonical(absolute, ec);
    return ec ? absolute.lexically_normal() : canonical;
}

/// True if `path` lies in the folder tree of `root` (both compared as absolute
/// paths with symbolic links resolved where they exist).
bool inside(const fs::path& root, const fs::path& path) {
    fs::path a = absolute_path(root.empty() ? fs::path(".") : root);
    fs::path b = absolute_path(path);
    fs::path relative = b.lexically_relative(a);
    return !relative.empty() && *relative.begin() != "..";
}

class Loader {
  public:
    Loader(SourceMap& sources, Diagnostics& diagnostics, const ImportOptions& options)
        : sources_(sources), diagnostics_(diagnostics), options_(options) {}

    std::vector<syntax::Tree> run(FileId main) {
        const std::string& name = sources_.file(main).name;
        model_root_ = fs::path(name).lexically_normal().parent_path();
        visit(main, key_of(name), false);
        return std::move(trees_);
    }

  private:
    /// Parses `file` and, before it, everything it uses.
    void visit(FileId file, const std::string& key, bool library) {
        state_[key] = State::loading;
        chain_.emplace_back(sources_.file(file).name, key);
        syntax::Tree tree = parse(sources_, file, diagnostics_);
        for (const syntax::Statement& s : tree.statements) {
            if (const auto* use = std::get_if<syntax::UseDecl>(&s.node))
                follow(*use, file, library);
        }
        chain_.pop_back();
        state_[key] = State::loaded;
        trees_.push_back(std::move(tree));
    }

    void follow(const syntax::UseDecl& use, FileId from, bool from_library) {
        if (chain_.size() >= kMaxUseDepth) {
            diagnostics_.error(use.module ? use.module->where : use.path_where,
                               fmt::format("files are used more than {} deep here; a chain of "
                                           "'use' may be at most {} files long",
                                           kMaxUseDepth, kMaxUseDepth));
            return;
        }
        if (use.module) {
            load_module(*use.module);
            return;
        }
        if (from_library && !options_.stdlib_dir) {
            diagnostics_.error(use.path_where, "a built-in library module uses only other modules");
            return;
        }
        fs::path here = fs::path(sources_.file(from).name).parent_path();
        fs::path target = (here / use.path).lexically_normal();
        fs::path root = inside(model_root_, here) ? model_root_ : here;
        if (!use.outside && !from_library && !inside(root, target)) {
            diagnostics_.error(use.path_where,
                               fmt::format("'{}' is outside the model's folder; write "
                                           "'use outside \"{}\"' to use it anyway",
                                           target.string(), use.path));
            return;
        }
        load_file(target.string(), use.path_where, false);
    }

    void load_module(const syntax::Name& module) {
        if (options_.stdlib_dir) {
            fs::path path = (fs::path(*options_.stdlib_dir) / (module.text + ".firn"));
            load_file(path.lexically_normal().string(), module.where, true);
            return;
        }
        std::string key = builtin_name(module.text);
        if (!check_cycle(key, module.where))
            return;
        for (const StdlibModule& m : embedded_stdlib()) {
            if (m.name == module.text) {
                visit(sources_.add(key, std::string(m.text)), key, true);
                return;
            }
        }
        std::vector<std::string> names;
        for (const StdlibModule& m : embedded_stdlib())
            names.emplace_back(m.name);
        // A near miss is named alone; the whole list only helps when nothing is close.
        std::string hint = did_you_mean(module.text, names);
        if (hint.empty())
            hint = fmt::format("; the library has {}", fmt::join(names, ", "));
        diagnostics_.error(module.where,
                           fmt::format("unknown library module '{}'{}", module.text, hint));
    }

    void load_file(const std::string& path, SourceRange where, bool library) {
        std::string key = key_of(path);
        if (!check_cycle(key, where))
            return;
        std::string text, error;
        bool ok = options_.read ? options_.read(path, text, error) : read_file(path, text, error);
        if (!ok) {
            diagnostics_.error(where, error);
            return;
        }
        visit(sources_.add(path, std::move(text)), key, library);
    }

    /// What identifies a file however it is reached: its absolute path.
    static std::string key_of(const std::string& path) { return absolute_path(path).string(); }

    /// False if `key` is loaded (a file used twice loads once) or is being
    /// loaded (a cycle, reported with its chain).
    bool check_cycle(const std::string& key, SourceRange where) {
        auto it = state_.find(key);
        if (it == state_.end())
            return true;
        if (it->second == State::loading) {
            std::vector<std::string> names;
            bool started = false;
            for (const auto& [name, k] : chain_) {
                started = started || k == key;
                if (started)
                    names.push_back(name);
            }
            names.push_back(names.front());
            diagnostics_.error(where, fmt::format("the files use each other in a cycle: {}",
                                                  fmt::join(names, " -> ")));
        }
        return false;
    }

    enum class State { loading, loaded };
    SourceMap& sources_;
    Diagnostics& diagnostics_;
    const ImportOptions& options_;
    fs::path model_root_;
    std::map<std::string, State> state_;
    std::vector<std::pair<std::string, std::string>> chain_;  ///< names and keys being loaded
    std::vector<syntax::Tree> trees_;
};

}  // namespace

std::vector<syntax::Tree> load_model(SourceMap& sources, FileId main, Diagnostics& diagnostics,
                                     const ImportOptions& options) {
    return Loader(sources, diagnostics, options).run(main);
}

}  // namespace firn
