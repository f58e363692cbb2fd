// file_io: whole-file reads and atomic writes (POSIX).
#include "base/file_io.hpp"

#include <fcntl.h>
#include <fmt/format.h>
#include <sys/stat.h>
#include <unistd.h>
#include <cerrno>
#include <cstdio>
#include <cstring>

namespace firn {
namespace {

/// Models are text written by people; anything this large is not a model, and
/// refusing it keeps every source offset within 32 bits.
constexpr off_t kMebibyte = off_t{1024} * 1024;
constexpr off_t kMaxModelBytes = 64 * kMebibyte;

std::string reason() {
    return std::strerror(errno);
}

}  // namespace

bool read_file(const std::string& path, std::string& text, std::string& error) {
    int fd = ::open(path.c_str(), O_RDONLY | O_CLOEXEC);
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
        error = fmt::format("cannot read '{}': larger than {} MiB, too large for a model", path,
                            kMaxModelBytes / kMebibyte);
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

AtomicFile::~AtomicFile() {
    if (fd_ >= 0)
        ::close(fd_);
    if (!temp_.empty())
        ::unlink(temp_.c_str());
}

bool AtomicFile::open(const std::string& path, std::string& error) {
    path_ = path;
    temp_ = path + ".firn-XXXXXX";
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
    if (write_errno_ == 0 && ::fsync(fd_) != 0)
        write_errno_ = errno;
    if (::close(fd_) != 0 && write_errno_ == 0)
        write_errno_ = errno;
    fd_ = -1;
    // mkstemp creates the file 0600; give it the permissions of a normal new file.
    mode_t mask = ::umask(0);
    ::umask(mask);
    ::chmod(temp_.c_str(), 0666 & ~mask);
    if (write_errno_ == 0 && ::rename(temp_.c_str(), path_.c_str()) != 0)
        write_errno_ = errno;
    if (write_errno_ != 0) {
        error = fmt::format("cannot write '{}': {}", path_, std::strerror(write_errno_));
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
