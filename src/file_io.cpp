// file_io: whole-file reads and atomic writes (POSIX).
#include "file_io.hpp"

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <fcntl.h>
#include <fmt/format.h>
#include <sys/stat.h>
#include <unistd.h>

namespace firn {
namespace {

/// Models are text written by people; anything this large is not a model, and
/// refusing it keeps every source offset within 32 bits.
constexpr off_t kMaxModelBytes = 64 * 1024 * 1024;

std::string reason() { return std::strerror(errno); }

bool write_all(int fd, const std::string& content) {
    std::size_t done = 0;
    while (done < content.size()) {
        ssize_t n = ::write(fd, content.data() + done, content.size() - done);
        if (n < 0) {
            if (errno == EINTR) continue;
            return false;
        }
        done += static_cast<std::size_t>(n);
    }
    return true;
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
                            kMaxModelBytes / (1024 * 1024));
        ::close(fd);
        return false;
    }
    text.resize(static_cast<std::size_t>(info.st_size));
    std::size_t done = 0;
    while (done < text.size()) {
        ssize_t n = ::read(fd, text.data() + done, text.size() - done);
        if (n < 0 && errno == EINTR) continue;
        if (n <= 0) break;
        done += static_cast<std::size_t>(n);
    }
    ::close(fd);
    text.resize(done);
    return true;
}

bool write_file_atomically(const std::string& path, const std::string& content, std::string& error) {
    std::string temp = path + ".firn-XXXXXX";
    int fd = ::mkstemp(temp.data());
    if (fd < 0) {
        error = fmt::format("cannot write '{}': {}", path, reason());
        return false;
    }
    bool ok = write_all(fd, content) && ::fsync(fd) == 0;
    std::string why = ok ? std::string() : reason();
    ok = (::close(fd) == 0) && ok;
    // mkstemp creates the file 0600; give it the permissions of a normal new file.
    mode_t mask = ::umask(0);
    ::umask(mask);
    ::chmod(temp.c_str(), 0666 & ~mask);
    if (ok && ::rename(temp.c_str(), path.c_str()) == 0) return true;
    if (why.empty()) why = reason();
    ::unlink(temp.c_str());
    error = fmt::format("cannot write '{}': {}", path, why);
    return false;
}

}  // namespace firn
