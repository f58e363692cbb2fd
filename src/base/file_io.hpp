// file_io: reading model files and writing outputs without ever leaving a
// partial file behind.
#pragma once

#include <string>
#include <string_view>

namespace firn {

/// Reads a whole file into `text`; on failure returns false and sets `error`
/// to a plain sentence naming the file. Only a regular file of at most the model
/// size limit is read: a FIFO, a device or a folder is refused without waiting.
bool read_file(const std::string& path, std::string& text, std::string& error);

/// Reads standard input to its end, refusing more than the model size limit
/// (`< /dev/zero` ends with an error, not with all memory used).
bool read_standard_input(std::string& text, std::string& error);

/// The files `a` and `b` name are one file (links followed); false if either is missing.
bool same_file(const std::string& a, const std::string& b);

/// A file written through a temporary file in the same folder and renamed into
/// place by commit(), so readers see the old file or the whole new one, never
/// a partial one. Without a successful commit() the temporary file is removed.
/// A link is followed, so the file it names is replaced and the link kept; a
/// FIFO or a device is written to directly, never replaced by a regular file.
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
    std::string shown_;        ///< the path as given, for messages
    std::string path_, temp_;  ///< temp_ empty: written directly (a FIFO or a device)
    int fd_ = -1;
    int write_errno_ = 0;
};

/// Writes `content` to `path` atomically (see AtomicFile).
bool write_file_atomically(const std::string& path, const std::string& content, std::string& error);

}  // namespace firn
