// draw_output: writes the drawings into their folder without ever losing a
// file the user made: firn keeps a list of what it wrote (firn-drawings.txt)
// and replaces or removes only those files.
#pragma once

#include <string>
#include <vector>

namespace firn {

/// A file of the output, its path relative to the folder ('/' separated).
struct OutputFile {
    std::string path;
    std::string content;
};

/// The list of the files firn wrote, kept in the folder.
inline constexpr const char* kDrawingsManifest = "firn-drawings.txt";

/// Writes `files` into `folder` (created if missing), each atomically, then the
/// list. A folder that holds files but no list was not made by `firn draw`: it is
/// refused unless `force` (then only the files named here are replaced). Files
/// of an earlier run that this run does not write are removed. On failure
/// returns false with a sentence in `error`.
bool write_drawings(const std::string& folder, const std::vector<OutputFile>& files, bool force,
                    std::string& error);

}  // namespace firn
