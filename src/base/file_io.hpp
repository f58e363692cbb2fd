// file_io: reading model files and writing outputs without ever leaving a
// partial file behind.
#pragma once

#include <string>
#include <string_view>

namespace firn {

/// Reads a whole file into `text`; on failure returns false and sets `error`
/// to a plain sentence naming the file.
bool read_file(const std::string& path, std::string& text, std::string& error);

/// A file written through a temporary file in the same folder and renamed into
/// place by commit(), so readers see the old file or the whole new one, never
/// a partial one. Without a successful commit() the temporary file is removed.
class AtomicFile {
  public:
    AtomicFile() = default;
    AtomicFile(const AtomicFile&) = delete;
    AtomicFile& operator=(const AtomicFile&) = delete;
    ~AtomicFile();

    bool open(const std::string& path, std::string& error);
    /// Appends; errors are remembered and reported by commit().
    void write(std::string_view data);
    bool commit(std::string& error);

  private:
    std::string path_, temp_;
    int fd_ = -1;
    int write_errno_ = 0;
};

/// Writes `content` to `path` atomically (see AtomicFile).
bool write_file_atomically(const std::string& path, const std::string& content, std::string& error);

}  // namespace firn
