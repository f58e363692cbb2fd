// output: writing to standard output with the cause of a failed write kept, so that
// main can say why a report was lost (a full disk, a closed pipe).
#include <cerrno>
#include <cstdio>

#include "cli/commands.hpp"

namespace firn {
namespace {

int first_error = 0;

}  // namespace

void write_stdout(std::string_view text) {
    if (text.empty())
        return;
    if (std::fwrite(text.data(), 1, text.size(), stdout) != text.size() && first_error == 0)
        first_error = errno != 0 ? errno : EIO;
}

int stdout_error() {
    return first_error;
}

}  // namespace firn
