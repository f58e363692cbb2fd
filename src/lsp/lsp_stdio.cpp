// lsp_stdio: the server on file descriptors 0 and 1. A stream buffer of our own
// reads the descriptor, so that "is more input waiting?" (the debounce) can ask
// poll() instead of blocking.
#include <poll.h>
#include <unistd.h>
#include <array>
#include <cerrno>
#include <iostream>
#include <streambuf>

#include "lsp/lsp.hpp"

namespace firn {
namespace {

class DescriptorInput : public std::streambuf {
  public:
    explicit DescriptorInput(int fd) : fd_(fd) {}

  protected:
    int_type underflow() override {
        if (gptr() < egptr())
            return traits_type::to_int_type(*gptr());
        ssize_t n = 0;
        do {
            n = ::read(fd_, buffer_.data(), buffer_.size());
        } while (n < 0 && errno == EINTR);
        if (n <= 0)
            return traits_type::eof();
        setg(buffer_.data(), buffer_.data(), buffer_.data() + n);
        return traits_type::to_int_type(*gptr());
    }

    /// Bytes readable now: those buffered, or 1 when the descriptor has more.
    std::streamsize showmanyc() override {
        pollfd p{fd_, POLLIN, 0};
        return ::poll(&p, 1, 0) > 0 && (p.revents & POLLIN) != 0 ? 1 : 0;
    }

  private:
    int fd_;
    std::array<char, 1 << 16> buffer_{};
};

}  // namespace

int serve_language_on_stdio(const ImportOptions& library) {
    DescriptorInput input(STDIN_FILENO);
    std::istream in(&input);
    std::ios::sync_with_stdio(false);
    return serve_language(in, std::cout, library);
}

}  // namespace firn
