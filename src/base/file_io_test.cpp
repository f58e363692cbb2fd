// Tests of reading models and writing outputs atomically.
#include <unistd.h>
#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "base/file_io.hpp"

using namespace firn;
namespace fs = std::filesystem;

namespace {

/// A fresh, empty folder for one test, removed afterwards.
struct ScratchFolder {
    fs::path path;
    ScratchFolder() {
        path = fs::temp_directory_path() / ("firn-test-" + std::to_string(::getpid()));
        fs::remove_all(path);
        fs::create_directories(path);
    }
    ~ScratchFolder() { fs::remove_all(path); }
    std::size_t entries() const {
        return static_cast<std::size_t>(
            std::distance(fs::directory_iterator(path), fs::directory_iterator()));
    }
};

std::string contents(const fs::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::stringstream ss;
    ss << in.rdbuf();
    return ss.str();
}

}  // namespace

TEST_CASE("an atomic write replaces the file whole and leaves nothing else behind") {
    ScratchFolder dir;
    std::string target = (dir.path / "report.txt").string();
    std::string error;
    REQUIRE(write_file_atomically(target, "first\n", error));
    REQUIRE(write_file_atomically(target, "second\n", error));
    CHECK(contents(target) == "second\n");
    CHECK(dir.entries() == 1);
}

TEST_CASE("an atomic file that is never committed leaves the old file untouched") {
    ScratchFolder dir;
    std::string target = (dir.path / "report.txt").string();
    std::string error;
    REQUIRE(write_file_atomically(target, "kept\n", error));
    {
        AtomicFile file;
        REQUIRE(file.open(target, error));
        file.write("half a rep");
    }  // abandoned, as when a run fails part way
    CHECK(contents(target) == "kept\n");
    CHECK(dir.entries() == 1);
}

TEST_CASE("writing into a folder that does not exist fails with a plain message") {
    ScratchFolder dir;
    std::string target = (dir.path / "missing" / "report.txt").string();
    std::string error;
    CHECK_FALSE(write_file_atomically(target, "x", error));
    CHECK(error == "cannot write '" + target + "': No such file or directory");
    CHECK(dir.entries() == 0);
}

TEST_CASE("reading a missing file or a folder fails with a plain message") {
    ScratchFolder dir;
    std::string text, error;
    CHECK_FALSE(read_file((dir.path / "nope.firn").string(), text, error));
    CHECK(error ==
          "cannot read '" + (dir.path / "nope.firn").string() + "': No such file or directory");
    CHECK_FALSE(read_file(dir.path.string(), text, error));
    CHECK(error == "cannot read '" + dir.path.string() + "': not a regular file");
}
