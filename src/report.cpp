// report: the text report. Fixed column widths (names as wide as the model's
// longest name, numbers 12 wide) so that a change to one value changes one
// line, and fixed decimals per unit so that output is the same on every run.
#include "report.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <fmt/format.h>

#include "number_format.hpp"

namespace firn {

const char* const kCaution =
    "These results support, and do not replace, the judgement of a licensed engineer. "
    "Local codes, amendments and the authority having jurisdiction govern.";

namespace {

constexpr std::size_t kNumberWidth = 12;

/// The model file as shown in reports: as given, but never an absolute path.
std::string shown_source(const std::string& name) {
    if (name.empty() || name.front() != '/') return name;
    return name.substr(name.find_last_of('/') + 1);
}

/// Appends "  " and a number right-aligned in the standard width.
void cell(std::string& out, double si_value, const DisplayUnit& unit) {
    std::array<char, kNumberBuffer> buffer;
    out += "  ";
    append_right(out, format_fixed(buffer.data(), unit.from_si(si_value), unit.decimals), kNumberWidth);
}

void name_cell(std::string& out, std::string_view name, std::size_t width) {
    out += "  ";
    append_left(out, name, width);
}

void header_cell(std::string& out, std::string_view title, const DisplayUnit& unit) {
    out += "  ";
    append_right(out, fmt::format("{} [{}]", title, unit.name), kNumberWidth);
}

void end_row(std::string& out) {
    while (!out.empty() && out.back() == ' ') out.pop_back();
    out += '\n';
}

template <typename T>
std::size_t name_width(const std::vector<T>& items, std::string_view header) {
    std::size_t w = header.size();
    for (const T& item : items) w = std::max(w, item.name.size());
    return w;
}

// ---------------------------------------------------------------- header

void write_header(std::string& out, const Model& model) {
    out += "firn report: plane frame, linear static analysis\n";
    out += fmt::format("Model:  {}\n", model.title.empty() ? "(untitled)" : model.title);
    out += fmt::format("Source: {}\n\n", shown_source(model.source_name));
    out += "Caution: ";
    out += kCaution;
    out += "\n\n";
    const DisplayUnits& u = model.units;
    out += fmt::format("Units: force {}, length {}, moment {}, displacement {}, rotation {}\n\n",
                       u.force.name, u.length.name, u.moment.name, u.displacement.name, u.rotation.name);
    out +=
        "Sign conventions\n"
        "  Global axes: x to the right, y up; moments and rotations counterclockwise positive.\n"
        "  Member axes: local x runs from the start node to the end node; local y is local x\n"
        "    turned 90 degrees counterclockwise. Positions are measured along local x.\n"
        "  N  axial force, tension positive.\n"
        "  M  bending moment, positive when the member's local -y face is in tension\n"
        "     (sagging, for a member drawn from left to right).\n"
        "  V  shear force, V = dM/dx.\n"
        "  Reactions are the forces the supports apply to the structure, in global axes.\n"
        "  Deflection is the displacement along local y from the chord through the member's\n"
        "    displaced ends.\n\n";
}

// ---------------------------------------------------------------- model echo

const char* shape_name(Section::Shape shape) {
    switch (shape) {
        case Section::Shape::given:
            return "given";
        case Section::Shape::rectangle:
            return "rectangle";
        case Section::Shape::ishape:
            return "ishape";
    }
    return "given";
}

void write_nodes(std::string& out, const Model& model) {
    std::size_t w = name_width(model.nodes, "node");
    std::vector<const Support*> support(model.nodes.size(), nullptr);
    for (const Support& s : model.supports) support[at(s.node)] = &s;
    out += "Nodes\n";
    name_cell(out, "node", w);
    header_cell(out, "x", model.units.length);
    header_cell(out, "y", model.units.length);
    out += "  support";
    end_row(out);
    for (std::size_t i = 0; i < model.nodes.size(); ++i) {
        const Node& n = model.nodes[i];
        name_cell(out, n.name, w);
        cell(out, n.x, model.units.length);
        cell(out, n.y, model.units.length);
        if (support[i] != nullptr) out += "  " + std::string(support_kind_name(support[i]->kind));
        end_row(out);
    }
    out += '\n';
}

void write_springs(std::string& out, const Model& model) {
    bool any = std::any_of(model.supports.begin(), model.supports.end(),
                           [](const Support& s) { return s.kind == Support::Kind::spring; });
    if (!any) return;
    std::size_t w = name_width(model.nodes, "node");
    out += "Spring supports (fixed: rigid; blank: free)\n";
    name_cell(out, "node", w);
    header_cell(out, "kx", model.units.stiffness);
    header_cell(out, "ky", model.units.stiffness);
    header_cell(out, "kr", model.units.rotational_stiffness);
    end_row(out);
    for (const Support& s : model.supports) {
        if (s.kind != Support::Kind::spring) continue;
        name_cell(out, model.nodes[at(s.node)].name, w);
        for (std::size_t d = 0; d < 3; ++d) {
            const Restraint& r = s.restraint[d];
            const DisplayUnit& unit = d == dof_rotation ? model.units.rotational_stiffness : model.units.stiffness;
            if (r.kind == Restraint::Kind::spring) {
                cell(out, r.stiffness, unit);
            } else {
                out += "  ";
                append_right(out, r.kind == Restraint::Kind::fixed ? "fixed" : "", kNumberWidth);
            }
        }
        end_row(out);
    }
    out += '\n';
}

void write_members(std::string& out, const Model& model) {
    std::size_t w = name_width(model.members, "member");
    std::size_t wn = name_width(model.nodes, "start");
    std::size_t ws = name_width(model.sections, "section");
    out += "Members\n";
    name_cell(out, "member", w);
    name_cell(out, "start", wn);
    name_cell(out, "end", wn);
    name_cell(out, "section", ws);
    header_cell(out, "length", model.units.length);
    out += "  hinges";
    end_row(out);
    for (const Member& m : model.members) {
        const Node& a = model.nodes[at(m.start)];
        const Node& b = model.nodes[at(m.end)];
        name_cell(out, m.name, w);
        name_cell(out, a.name, wn);
        name_cell(out, b.name, wn);
        name_cell(out, model.sections[at(m.section)].name, ws);
        cell(out, std::hypot(b.x - a.x, b.y - a.y), model.units.length);
        if (m.hinge_start || m.hinge_end) {
            out += m.hinge_start && m.hinge_end ? "  both ends" : m.hinge_start ? "  start" : "  end";
        }
        end_row(out);
    }
    out += '\n';
}

void write_sections(std::string& out, const Model& model) {
    std::size_t w = name_width(model.sections, "section");
    std::size_t wm = name_width(model.materials, "material");
    const DisplayUnits& u = model.units;
    out += "Sections\n";
    name_cell(out, "section", w);
    name_cell(out, "material", wm);
    name_cell(out, "shape", 9);
    header_cell(out, "A", u.area);
    header_cell(out, "I", u.inertia);
    header_cell(out, "E", u.modulus);
    header_cell(out, "density", u.unit_weight);
    end_row(out);
    for (const Section& s : model.sections) {
        const Material& m = model.materials[at(s.material)];
        name_cell(out, s.name, w);
        name_cell(out, m.name, wm);
        name_cell(out, shape_name(s.shape), 9);
        cell(out, s.area, u.area);
        cell(out, s.inertia, u.inertia);
        cell(out, m.elastic_modulus, u.modulus);
        cell(out, m.unit_weight, u.unit_weight);
        end_row(out);
    }
    out += '\n';
}

void write_case_list(std::string& out, const Model& model) {
    std::size_t w = name_width(model.cases, "case");
    out += "Load cases\n";
    name_cell(out, "case", w);
    out += "  kind";
    end_row(out);
    for (const LoadCase& lc : model.cases) {
        name_cell(out, lc.name, w);
        out += "  ";
        out += case_kind_name(lc.kind);
        end_row(out);
    }
    out += '\n';
}

// ---------------------------------------------------------------- one case

void write_equilibrium(std::string& out, const Model& model, const Equilibrium& e) {
    const DisplayUnits& u = model.units;
    out += "Equilibrium (sums over the structure; M about the origin)\n";
    name_cell(out, "", 13);
    header_cell(out, "Fx", u.force);
    header_cell(out, "Fy", u.force);
    header_cell(out, "M", u.moment);
    end_row(out);
    auto row = [&](const char* label, const std::array<double, 3>& v) {
        name_cell(out, label, 13);
        cell(out, v[0], u.force);
        cell(out, v[1], u.force);
        cell(out, v[2], u.moment);
        end_row(out);
    };
    row("applied", e.applied);
    row("reactions", e.reactions);
    row("residual", {e.applied[0] + e.reactions[0], e.applied[1] + e.reactions[1],
                     e.applied[2] + e.reactions[2]});
    out += '\n';
}

void write_reactions(std::string& out, const Model& model, const CaseResults& r) {
    if (model.supports.empty()) return;
    std::size_t w = name_width(model.nodes, "node");
    const DisplayUnits& u = model.units;
    out += "Reactions\n";
    name_cell(out, "node", w);
    header_cell(out, "Rx", u.force);
    header_cell(out, "Ry", u.force);
    header_cell(out, "M", u.moment);
    end_row(out);
    for (std::size_t i = 0; i < model.supports.size(); ++i) {
        name_cell(out, model.nodes[at(model.supports[i].node)].name, w);
        cell(out, r.reactions[i][0], u.force);
        cell(out, r.reactions[i][1], u.force);
        cell(out, r.reactions[i][2], u.moment);
        end_row(out);
    }
    out += '\n';
}

void write_displacements(std::string& out, const Model& model, const Results& results, const CaseResults& r) {
    std::size_t w = name_width(model.nodes, "node");
    const DisplayUnits& u = model.units;
    out += "Node displacements (rotation 'free': every member is hinged at the node)\n";
    name_cell(out, "node", w);
    header_cell(out, "dx", u.displacement);
    header_cell(out, "dy", u.displacement);
    header_cell(out, "rotation", u.rotation);
    end_row(out);
    for (std::size_t i = 0; i < model.nodes.size(); ++i) {
        name_cell(out, model.nodes[i].name, w);
        cell(out, r.displacements[i][0], u.displacement);
        cell(out, r.displacements[i][1], u.displacement);
        if (!results.rotation_free.empty() && results.rotation_free[i]) {
            out += "  ";
            append_right(out, "free", kNumberWidth);
        } else {
            cell(out, r.displacements[i][2], u.rotation);
        }
        end_row(out);
    }
    out += '\n';
}

void write_end_forces(std::string& out, const Model& model, const CaseResults& r) {
    std::size_t w = name_width(model.members, "member");
    const DisplayUnits& u = model.units;
    out += "Member end forces (internal N, V, M just inside each end)\n";
    name_cell(out, "member", w);
    for (const char* end : {"start", "end"}) {
        header_cell(out, fmt::format("N {}", end), u.force);
        header_cell(out, fmt::format("V {}", end), u.force);
        header_cell(out, fmt::format("M {}", end), u.moment);
    }
    end_row(out);
    for (std::size_t i = 0; i < model.members.size(); ++i) {
        const MemberSummary& s = r.members[i];
        name_cell(out, model.members[i].name, w);
        for (const auto* v : {&s.start, &s.end}) {
            cell(out, (*v)[0], u.force);
            cell(out, (*v)[1], u.force);
            cell(out, (*v)[2], u.moment);
        }
        end_row(out);
    }
    out += '\n';
}

/// "value at position" columns of the extremes table.
void extreme_cell(std::string& out, const Extreme& e, const DisplayUnit& unit, const DisplayUnit& length) {
    cell(out, e.value, unit);
    cell(out, e.position, length);
}

void write_extremes(std::string& out, const Model& model, const CaseResults& r) {
    std::size_t w = name_width(model.members, "member");
    const DisplayUnits& u = model.units;
    out += "Member extremes (each value, then its position from the start node)\n";
    name_cell(out, "member", w);
    const std::array<std::pair<const char*, const DisplayUnit*>, 6> columns{{
        {"M+", &u.moment}, {"M-", &u.moment}, {"V", &u.force},
        {"N tension", &u.force}, {"N compr.", &u.force}, {"deflection", &u.displacement}}};
    for (const auto& [title, unit] : columns) {
        header_cell(out, title, *unit);
        header_cell(out, "at", u.length);
    }
    end_row(out);
    for (std::size_t i = 0; i < model.members.size(); ++i) {
        const MemberSummary& s = r.members[i];
        name_cell(out, model.members[i].name, w);
        extreme_cell(out, s.moment_max, u.moment, u.length);
        extreme_cell(out, s.moment_min, u.moment, u.length);
        extreme_cell(out, s.shear_max, u.force, u.length);
        extreme_cell(out, s.axial_max, u.force, u.length);
        extreme_cell(out, s.axial_min, u.force, u.length);
        extreme_cell(out, s.deflection_max, u.displacement, u.length);
        end_row(out);
    }
    out += '\n';
}

void write_stations(std::string& out, const Model& model, const Stations& stations, std::size_t c) {
    std::size_t w = name_width(model.members, "member");
    const DisplayUnits& u = model.units;
    out += "Member stations\n";
    name_cell(out, "member", w);
    header_cell(out, "x", u.length);
    header_cell(out, "N", u.force);
    header_cell(out, "V", u.force);
    header_cell(out, "M", u.moment);
    header_cell(out, "deflection", u.displacement);
    end_row(out);
    for (std::size_t m = 0; m < model.members.size(); ++m) {
        const Station* s = stations.of(c, m);
        for (std::size_t k = 0; k < stations.per_member; ++k) {
            name_cell(out, k == 0 ? std::string_view(model.members[m].name) : "", w);
            cell(out, s[k].position, u.length);
            cell(out, s[k].axial, u.force);
            cell(out, s[k].shear, u.force);
            cell(out, s[k].moment, u.moment);
            cell(out, s[k].deflection, u.displacement);
            end_row(out);
        }
    }
    out += '\n';
}

void write_case(std::string& out, const Model& model, const Results& results, std::size_t c,
                const ReportOptions& options) {
    const LoadCase& lc = model.cases[c];
    const CaseResults& r = results.cases[c];
    out += fmt::format("== Load case {} ({}) ==\n\n", lc.name, case_kind_name(lc.kind));
    write_equilibrium(out, model, r.equilibrium);
    write_reactions(out, model, r);
    write_displacements(out, model, results, r);
    write_end_forces(out, model, r);
    write_extremes(out, model, r);
    if (options.stations != nullptr) write_stations(out, model, *options.stations, c);
}

}  // namespace

std::string text_report(const Model& model, const Results& results, const ReportOptions& options) {
    std::string out;
    out.reserve(4096 + results.cases.size() * (model.nodes.size() * 60 + model.members.size() * 300));
    write_header(out, model);
    out += "== Model ==\n\n";
    write_nodes(out, model);
    write_springs(out, model);
    write_members(out, model);
    write_sections(out, model);
    write_case_list(out, model);
    for (std::size_t c = 0; c < model.cases.size(); ++c) write_case(out, model, results, c, options);
    return out;
}

}  // namespace firn
