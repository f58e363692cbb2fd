// Tests of the drawings' folder: nothing the user wrote is lost or overwritten
// unless they ask (--force), and stale sheets of an earlier run are removed.
#include <unistd.h>
#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>

#include "base/file_io.hpp"
#include "draw/draw.hpp"

namespace firn {
namespace {
namespace fs = std::filesystem;

struct TempFolder {
    fs::path path;
    TempFolder() {
        path = fs::temp_directory_path() /
               ("firn-draw-test-" + std::to_string(::getpid()) + "-" + std::to_string(counter()++));
        fs::remove_all(path);
    }
    ~TempFolder() {
        std::error_code ec;
        fs::remove_all(path, ec);
    }
    static int& counter() {
        static int n = 0;
        return n;
    }
};

std::string contents(const fs::path& p) {
    std::string text, error;
    return read_file(p.string(), text, error) ? text : "(missing)";
}

TEST_CASE("drawings go into a new folder with a list of what firn wrote", "[draw]") {
    TempFolder t;
    std::string error;
    fs::path folder = t.path / "out";
    REQUIRE(
        write_drawings(folder.string(), {{"frame.svg", "F"}, {"loads/D.svg", "L"}}, false, error));
    CHECK(contents(folder / "frame.svg") == "F");
    CHECK(contents(folder / "loads/D.svg") == "L");
    std::string list = contents(folder / kDrawingsManifest);
    CHECK(list.find("\nframe.svg\nloads/D.svg\n") != std::string::npos);
}

TEST_CASE("a folder with files firn did not write is refused unless forced", "[draw]") {
    TempFolder t;
    fs::create_directories(t.path);
    std::ofstream(t.path / "notes.txt") << "mine";
    std::ofstream(t.path / "frame.svg") << "my own drawing";
    std::string error;
    CHECK_FALSE(write_drawings(t.path.string(), {{"frame.svg", "F"}}, false, error));
    CHECK(error.find("holds files that firn draw did not write") != std::string::npos);
    CHECK(contents(t.path / "frame.svg") == "my own drawing");
    // Asked to: only the files firn names are replaced.
    REQUIRE(write_drawings(t.path.string(), {{"frame.svg", "F"}}, true, error));
    CHECK(contents(t.path / "frame.svg") == "F");
    CHECK(contents(t.path / "notes.txt") == "mine");
}

TEST_CASE("a second run replaces its own files and removes the sheets it no longer draws",
          "[draw]") {
    TempFolder t;
    std::string error;
    REQUIRE(write_drawings(t.path.string(), {{"frame.svg", "1"}, {"loads/Old.svg", "old"}}, false,
                           error));
    std::ofstream(t.path / "loads" / "mine.svg") << "mine";
    REQUIRE(write_drawings(t.path.string(), {{"frame.svg", "2"}, {"loads/New.svg", "new"}}, false,
                           error));
    CHECK(contents(t.path / "frame.svg") == "2");
    CHECK_FALSE(fs::exists(t.path / "loads" / "Old.svg"));
    CHECK(contents(t.path / "loads" / "New.svg") == "new");
    CHECK(contents(t.path / "loads" / "mine.svg") == "mine");
}

TEST_CASE("a run that fails half way leaves a folder the next run takes as its own", "[draw]") {
    TempFolder t;
    std::string error;
    // The third file cannot be written: a folder the second made stands in its way.
    CHECK_FALSE(write_drawings(t.path.string(), {{"a.svg", "A"}, {"sub/b.svg", "B"}, {"sub", "C"}},
                               false, error));
    CHECK(error.find("a folder of that name is in the way") != std::string::npos);
    REQUIRE(write_drawings(t.path.string(), {{"a.svg", "A2"}}, false, error));
    CHECK(contents(t.path / "a.svg") == "A2");
    CHECK_FALSE(fs::exists(t.path / "sub" / "b.svg"));
}

TEST_CASE("a list naming paths outside the folder removes nothing there", "[draw]") {
    TempFolder t;
    fs::create_directories(t.path / "out");
    std::ofstream(t.path / "keep.txt") << "keep";
    std::ofstream(t.path / "out" / kDrawingsManifest) << "# list\n../keep.txt\n/etc/hostname\n";
    std::string error;
    REQUIRE(write_drawings((t.path / "out").string(), {{"frame.svg", "F"}}, false, error));
    CHECK(contents(t.path / "keep.txt") == "keep");
}

TEST_CASE("a path that is not a folder gives a clear error", "[draw]") {
    TempFolder t;
    fs::create_directories(t.path);
    std::ofstream(t.path / "file") << "x";
    std::string error;
    CHECK_FALSE(write_drawings((t.path / "file").string(), {{"frame.svg", "F"}}, false, error));
    CHECK(error.find("exists and is not a folder") != std::string::npos);
}

}  // namespace
}  // namespace firn
