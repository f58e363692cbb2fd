// file_io: reading model files and writing outputs without ever leaving a
// partial file behind.
#pragma once

#include <string>

namespace firn {

/// Reads a whole file into `text`; on failure returns false and sets `error`
/// to a plain sentence naming the file.
bool read_file(const std::string& path, std::string& text, std::string& error);

/// Writes `content` to `path` through a temporary file in the same folder and
/// a rename, so readers see the old file or the new one, never a partial one.
bool write_file_atomically(const std::string& path, const std::string& content, std::string& error);

}  // namespace firn
