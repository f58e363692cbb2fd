// draw_output: the drawings' folder and its list of files.
#include "draw/draw.hpp"

#include <fmt/format.h>
#include <filesystem>
#include <set>
#include <sstream>
#include <system_error>

#include "base/file_io.hpp"

namespace firn {
namespace fs = std::filesystem;
namespace {

constexpr const char* kManifestHeader =
    "# Files written by firn draw. firn replaces or removes only the files listed here.\n";

/// A path firn itself would write: a plain relative path of names, no "..".
bool is_own_path(const std::string& path) {
    if (path.empty() || path.front() == '/' || path.front() == '#')
        return false;
    std::stringstream parts(path);
    std::string part;
    while (std::getline(parts, part, '/')) {
        if (part.empty() || part == "." || part == "..")
            return false;
    }
    return true;
}

std::vector<std::string> read_manifest(const fs::path& folder) {
    std::string text, error;
    std::vector<std::string> paths;
    if (!read_file((folder / kDrawingsManifest).string(), text, error))
        return paths;
    std::stringstream lines(text);
    std::string line;
    while (std::getline(lines, line)) {
        if (is_own_path(line))
            paths.push_back(line);
    }
    return paths;
}

/// Checks the folder may be written and creates it when missing.
bool prepare_folder(const fs::path& folder, bool force, bool& has_manifest, std::string& error) {
    std::error_code ec;
    fs::file_status status = fs::status(folder, ec);
    if (!fs::exists(status)) {
        fs::create_directories(folder, ec);
        if (ec) {
            error = fmt::format("cannot create folder '{}': {}", folder.string(), ec.message());
            return false;
        }
        return true;
    }
    if (!fs::is_directory(status)) {
        error = fmt::format("'{}' exists and is not a folder", folder.string());
        return false;
    }
    has_manifest = fs::exists(folder / kDrawingsManifest, ec);
    bool empty = fs::is_empty(folder, ec);
    if (ec) {
        error = fmt::format("cannot read folder '{}': {}", folder.string(), ec.message());
        return false;
    }
    if (!empty && !has_manifest && !force) {
        error = fmt::format(
            "folder '{}' holds files that firn draw did not write; choose another folder, or "
            "use --force to write into it (only the files firn names are then replaced)",
            folder.string());
        return false;
    }
    return true;
}

bool write_one(const fs::path& folder, const OutputFile& file, std::string& error) {
    fs::path target = folder / file.path;
    std::error_code ec;
    fs::create_directories(target.parent_path(), ec);
    if (ec) {
        error = fmt::format("cannot create folder '{}': {}", target.parent_path().string(),
                            ec.message());
        return false;
    }
    if (fs::is_directory(target, ec)) {
        error =
            fmt::format("cannot write '{}': a folder of that name is in the way", target.string());
        return false;
    }
    return write_file_atomically(target.string(), file.content, error);
}

}  // namespace

bool write_drawings(const std::string& folder_name, const std::vector<OutputFile>& files,
                    bool force, std::string& error) {
    fs::path folder(folder_name);
    bool has_manifest = false;
    if (!prepare_folder(folder, force, has_manifest, error))
        return false;
    std::vector<std::string> earlier;
    if (has_manifest)
        earlier = read_manifest(folder);
    // The list first names every file this run may leave, so a run that fails half way
    // still leaves a folder the next run knows as its own.
    std::set<std::string> mine(earlier.begin(), earlier.end());
    for (const OutputFile& f : files)
        mine.insert(f.path);
    std::string during = kManifestHeader;
    for (const std::string& path : mine)
        during += path + "\n";
    if (!write_file_atomically((folder / kDrawingsManifest).string(), during, error))
        return false;
    std::set<std::string> now;
    std::string manifest = kManifestHeader;
    for (const OutputFile& f : files) {
        if (!write_one(folder, f, error))
            return false;
        now.insert(f.path);
        manifest += f.path + "\n";
    }
    // Sheets of an earlier run that this run does not draw (a renamed case, say).
    for (const std::string& old : earlier) {
        if (now.count(old) != 0)
            continue;
        std::error_code ec;
        fs::path stale = folder / old;
        if (fs::is_regular_file(fs::symlink_status(stale, ec)))
            fs::remove(stale, ec);
        fs::path parent = stale.parent_path();
        if (parent != folder && fs::is_empty(parent, ec))
            fs::remove(parent, ec);
    }
    return write_file_atomically((folder / kDrawingsManifest).string(), manifest, error);
}

}  // namespace firn
