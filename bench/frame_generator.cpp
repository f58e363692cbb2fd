// frame_generator: writes the model of a large rectangular frame as text,
// in the language a user would write (one statement per entity).
#include "frame_generator.hpp"

#include <fmt/format.h>

namespace firn::bench {
namespace {

std::string node(std::size_t line, std::size_t level) {
    return fmt::format("N{}_{}", line, level);
}

/// A comma-separated list, broken after every 20 items as a person would.
template <typename NameOf>
void write_list(std::string& out, std::size_t count, NameOf name_of) {
    for (std::size_t i = 0; i < count; ++i) {
        if (i > 0)
            out += i % 20 == 0 ? ",\n    " : ", ";
        out += name_of(i);
    }
}

void write_grid(std::string& out, std::size_t bays, std::size_t storeys) {
    out += "grid x ";
    write_list(out, bays + 1, [](std::size_t i) { return fmt::format("X{} = {} ft", i, 24 * i); });
    out += "\ngrid y ";
    write_list(out, storeys + 1,
               [](std::size_t j) { return fmt::format("Y{} = {} ft", j, 12 * j); });
    out += "\n\n";
}

void write_structure(std::string& out, std::size_t bays, std::size_t storeys) {
    for (std::size_t j = 0; j <= storeys; ++j) {
        for (std::size_t i = 0; i <= bays; ++i)
            out += fmt::format("node {} at X{}, Y{}\n", node(i, j), i, j);
    }
    out +=
        "material steel E = 29000 ksi, density = 490 pcf\n"
        "section col steel, A = 14.1 in2, I = 272 in4\n"
        "section beam steel, A = 11.8 in2, I = 510 in4\n";
    for (std::size_t j = 0; j < storeys; ++j) {
        for (std::size_t i = 0; i <= bays; ++i) {
            out += fmt::format("member C{}_{} from {} to {} section col\n", i, j, node(i, j),
                               node(i, j + 1));
        }
        for (std::size_t i = 0; i < bays; ++i) {
            out += fmt::format("member B{}_{} from {} to {} section beam\n", i, j + 1,
                               node(i, j + 1), node(i + 1, j + 1));
        }
    }
    out += "support fixed at ";
    write_list(out, bays + 1, [](std::size_t i) { return node(i, 0); });
    out += "\n\n";
}

void write_cases(std::string& out, std::size_t bays, std::size_t storeys, std::size_t cases) {
    for (std::size_t k = 0; k < cases; ++k) {
        std::size_t level = k % storeys + 1;
        out += fmt::format("case K{} other {{\n", k);
        if (k == 0)
            out += "  self weight\n";
        out += fmt::format("  uniform {} kip/ft down on ", 1.0 + 0.01 * static_cast<double>(k));
        write_list(out, bays, [level](std::size_t i) { return fmt::format("B{}_{}", i, level); });
        out += fmt::format("\n  point {} kip x at ", 0.5 + 0.01 * static_cast<double>(k));
        write_list(out, storeys, [](std::size_t j) { return node(0, j + 1); });
        out += "\n}\n";
    }
}

std::string level(std::size_t j) {
    return fmt::format("L{}", j);
}

/// The frame's grid, sections, generated columns and beams and fixed bases.
std::string generated_structure(std::size_t bays, std::size_t storeys) {
    return fmt::format(
        "grid x 1..{} spacing 24 ft\ngrid y L0..L{} spacing 12 ft\n"
        "material steel E = 29000 ksi, density = 490 pcf\n"
        "section col steel, A = 14.1 in2, I = 272 in4\n"
        "section beam steel, A = 11.8 in2, I = 510 in4\n"
        "columns on 1..{} from L0 to L{} section col\n"
        "beams along L1..L{} from 1 to {} section beam\n"
        "support fixed at L0\n\n",
        bays + 1, storeys, bays + 1, storeys, storeys, bays + 1);
}

}  // namespace

std::string generated_frame(std::size_t bays, std::size_t storeys, std::size_t cases) {
    std::string out = fmt::format(
        "# Generated with generators: {} bays x {} storeys, {} load cases\n"
        "model \"Bench frame {}x{}\"\nreport units kip, ft\n\n",
        bays, storeys, cases, bays, storeys);
    out += generated_structure(bays, storeys);
    for (std::size_t k = 0; k < cases; ++k) {
        out += fmt::format("case K{} other {{\n", k);
        if (k == 0)
            out += "  self weight\n";
        out += fmt::format("  uniform {} kip/ft down on {}.*\n",
                           1.0 + 0.01 * static_cast<double>(k), level(k % storeys + 1));
        out += fmt::format("  point {} kip x at ", 0.5 + 0.01 * static_cast<double>(k));
        write_list(out, storeys, [](std::size_t j) { return fmt::format("1.{}", level(j + 1)); });
        out += "\n}\n";
    }
    return out;
}

std::string rectangular_frame(std::size_t bays, std::size_t storeys, std::size_t cases) {
    std::string out = fmt::format(
        "# Generated: {} bays x {} storeys, {} load cases\n"
        "model \"Bench frame {}x{}\"\nreport units kip, ft\n\n",
        bays, storeys, cases, bays, storeys);
    write_grid(out, bays, storeys);
    write_structure(out, bays, storeys);
    write_cases(out, bays, storeys, cases);
    return out;
}

std::string snow_frame(std::size_t bays, std::size_t storeys) {
    std::string out = fmt::format(
        "# Generated: {} bays x {} storeys under dead, live and ASCE 7-16 snow loads\n"
        "model \"Bench snow frame {}x{}\"\nuse asce7_16\nreport units kip, ft\n\n",
        bays, storeys, bays, storeys);
    out += generated_structure(bays, storeys);
    out += fmt::format(
        "case D dead {{\n  self weight\n  uniform 0.5 kip/ft down on L*.*\n}}\n"
        "case L live {{\n  uniform 1.25 kip/ft down on L*.*\n}}\n"
        "snow S {{\n  standard = asce7_16\n  pg = 40 psf\n  terrain = C\n"
        "  exposure = partially\n  thermal = heated\n  risk = II\n}}\n"
        "roof main on {}.* {{\n  tributary = 25 ft\n}}\n"
        "combine asce7_16.strength\n",
        level(storeys));
    return out;
}

}  // namespace firn::bench
