// The standard library built into the binary is stdlib/*.firn as it is on disk:
// every module, under its file name, byte for byte, sorted by name.
#include <algorithm>
#include <catch2/catch.hpp>
#include <filesystem>
#include <set>
#include <string>

#include "base/file_io.hpp"
#include "front/stdlib_embedded.hpp"

using namespace firn;

namespace {

const StdlibModule* find_module(std::string_view name) {
    for (const StdlibModule& m : embedded_stdlib())
        if (m.name == name)
            return &m;
    return nullptr;
}

}  // namespace

TEST_CASE("stdlib: every stdlib/*.firn is embedded under its name, byte for byte") {
    std::set<std::string> on_disk;
    for (const auto& entry :
         std::filesystem::directory_iterator(std::filesystem::path(FIRN_SOURCE_DIR) / "stdlib")) {
        if (entry.path().extension() != ".firn")
            continue;
        std::string name = entry.path().stem().string();
        on_disk.insert(name);
        INFO("stdlib/" << entry.path().filename().string());
        const StdlibModule* module = find_module(name);
        REQUIRE(module != nullptr);
        std::string text, error;
        bool read = read_file(entry.path().string(), text, error);
        INFO(error);
        REQUIRE(read);
        CHECK(module->text.size() == text.size());
        CHECK(module->text == text);
    }
    CHECK_FALSE(on_disk.empty());
    // Nothing more is embedded than is on disk: a deleted module leaves the binary too.
    CHECK(embedded_stdlib().size() == on_disk.size());
}

TEST_CASE("stdlib: the embedded modules are sorted by name, each name once") {
    auto modules = embedded_stdlib();
    auto by_name = [](const StdlibModule& a, const StdlibModule& b) { return a.name < b.name; };
    CHECK(std::is_sorted(modules.begin(), modules.end(), by_name));
    CHECK(std::adjacent_find(modules.begin(), modules.end(), [](const auto& a, const auto& b) {
              return a.name == b.name;
          }) == modules.end());
}
