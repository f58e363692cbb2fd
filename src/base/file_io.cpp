// file_io: whole-file reads and atomic writes (POSIX).
#include "base/file_io.hpp"

#include <fcntl.h>
#include <fmt/format.h>
#include <sys/stat.h>
#include <unistd.h>
#include <cerrno>
#include <chrono>
#include <cstdio>
#include <cstring>
#include <filesystem>

namespace firn {
namespace {

/// Models are text written by people; anything this large is not a model, and
/// refusing it keeps every source offset within 32 bits.
constexpr off_t kMebibyte = off_t{1024} * 1024;
constexpr off_t kMaxModelBytes = 64 * kMebibyte;

std::string reason() {
    return std::strerror(errno);
}

std::string too_large(const std::string& what) {
    return fmt::format("cannot read {}: larger than {} MiB, too large for a model", what,
                       kMaxModelBytes / kMebibyte);
}

/// The file a path names, its links followed (also a link to a file not yet made), so
/// that writing replaces that file and keeps the link.
std::string resolved(const std::string& path) {
    namespace fs = std::filesystem;
    fs::path p = path;
    std::error_code ec;
    for (int hops = 0; hops < 40 && fs::is_symlink(p, ec); ++hops) {
        fs::path target = fs::read_symlink(p, ec);
        if (ec)
            break;
        p = target.is_absolute() ? target : p.parent_path() / target;
    }
    return p.string();
}

/// Removes the temporary files a killed writer of `path` left (`NAME.firn-XXXXXX`
/// beside it), once they are a minute old, so a live writer's file is never taken.
void remove_orphans(const std::string& path) {
    namespace fs = std::filesystem;
    fs::path target(path);
    fs::path folder = target.parent_path().empty() ? fs::path(".") : target.parent_path();
    std::string prefix = target.filename().string() + ".firn-";
    std::error_code ec;
    auto now = fs::file_time_type::clock::now();
    for (const fs::directory_entry& e : fs::directory_iterator(folder, ec)) {
        std::string name = e.path().filename().string();
        bool orphan = name.size() == prefix.size() + 6 && name.rfind(prefix, 0) == 0 &&
                      e.is_regular_file(ec) &&
                      now - e.last_write_time(ec) > std::chrono::minutes(1);
        if (orphan)
            fs::remove(e.path(), ec);
    }
}

}  // namespace

bool read_file(const std::string& path, std::string& text, std::string& error) {
    // O_NONBLOCK: opening a FIFO with no writer must not wait; it is refused below.
    int fd = ::open(path.c_str(), O_RDONLY | O_CLOEXEC | O_NONBLOCK);
    if (fd < 0) {
        error = fmt::format("cannot read '{}': {}", path, reason());
        return false;
    }
    struct stat info {};
    if (::fstat(fd, &info) != 0 || !S_ISREG(info.st_mode)) {
        error = fmt::format("cannot read '{}': not a regular file", path);
        ::close(fd);
        return false;
    }
    if (info.st_size > kMaxModelBytes) {
        error = too_large(fmt::format("'{}'", path));
        ::close(fd);
        return false;
    }
    text.resize(static_cast<std::size_t>(info.st_size));
    std::size_t done = 0;
    while (done < text.size()) {
        ssize_t n = ::read(fd, text.data() + done, text.size() - done);
        if (n < 0 && errno == EINTR)
            continue;
        if (n <= 0)
            break;
        done += static_cast<std::size_t>(n);
    }
    ::close(fd);
    text.resize(done);
    return true;
}

bool read_standard_input(std::string& text, std::string& error) {
    char buffer[65536];
    for (;;) {
        ssize_t n = ::read(STDIN_FILENO, buffer, sizeof buffer);
        if (n < 0 && errno == EINTR)
            continue;
        if (n < 0) {
            error = fmt::format("cannot read standard input: {}", reason());
            return false;
        }
        if (n == 0)
            return true;
        if (text.size() + static_cast<std::size_t>(n) > static_cast<std::size_t>(kMaxModelBytes)) {
            error = too_large("standard input");
            return false;
        }
        text.append(buffer, static_cast<std::size_t>(n));
    }
}

bool same_file(const std::string& a, const std::string& b) {
    struct stat x {
    }, y{};
    return ::stat(a.c_str(), &x) == 0 && ::stat(b.c_str(), &y) == 0 && x.st_dev == y.st_dev &&
           x.st_ino == y.st_ino;
}

AtomicFile::~AtomicFile() {
    if (fd_ >= 0)
        ::close(fd_);
    if (!temp_.empty())
        ::unlink(temp_.c_str());
}

bool AtomicFile::open(const std::string& path, std::string& error) {
    shown_ = path;
    path_ = resolved(path);
    struct stat info {};
    if (::stat(path_.c_str(), &info) == 0 && !S_ISREG(info.st_mode)) {
        if (S_ISDIR(info.st_mode)) {
            error = fmt::format("cannot write '{}': it is a folder", path);
            return false;
        }
        // A FIFO or a device: write to it as it is; renaming over it would destroy it.
        fd_ = ::open(path_.c_str(), O_WRONLY | O_CLOEXEC);
        if (fd_ < 0)
            error = fmt::format("cannot write '{}': {}", path, reason());
        return fd_ >= 0;
    }
    remove_orphans(path_);
    temp_ = path_ + ".firn-XXXXXX";
    fd_ = ::mkstemp(temp_.data());
    if (fd_ < 0) {
        error = fmt::format("cannot write '{}': {}", path, reason());
        temp_.clear();
        return false;
    }
    return true;
}

void AtomicFile::write(std::string_view data) {
    if (write_errno_ != 0)
        return;
    std::size_t done = 0;
    while (done < data.size()) {
        ssize_t n = ::write(fd_, data.data() + done, data.size() - done);
        if (n < 0 && errno == EINTR)
            continue;
        if (n < 0) {
            write_errno_ = errno;
            return;
        }
        done += static_cast<std::size_t>(n);
    }
}

bool AtomicFile::commit(std::string& error) {
    bool direct = temp_.empty();
    if (write_errno_ == 0 && !direct && ::fsync(fd_) != 0)
        write_errno_ = errno;
    if (::close(fd_) != 0 && write_errno_ == 0)
        write_errno_ = errno;
    fd_ = -1;
    if (!direct) {
        // mkstemp creates the file 0600; give it the permissions of a normal new file.
        mode_t mask = ::umask(0);
        ::umask(mask);
        ::chmod(temp_.c_str(), 0666 & ~mask);
        if (write_errno_ == 0 && ::rename(temp_.c_str(), path_.c_str()) != 0)
            write_errno_ = errno;
    }
    if (write_errno_ != 0) {
        error = fmt::format("cannot write '{}': {}", shown_, std::strerror(write_errno_));
        return false;  // the destructor removes the temporary file
    }
    temp_.clear();
    return true;
}

bool write_file_atomically(const std::string& path, const std::string& content,
                           std::string& error) {
    AtomicFile file;
    if (!file.open(path, error))
        return false;
    file.write(content);
    return file.commit(error);
}

}  // namespace firn
