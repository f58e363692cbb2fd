// solve: assembly, one sparse LDL^T factorization, stability check and a
// blocked forward/backward sweep that solves every load case at once.
#include "analyse/analyse.hpp"

#include <fmt/format.h>
#include <Eigen/Core>
#include <Eigen/SparseCholesky>
#include <Eigen/SparseCore>
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdint>
#include <limits>
#include <optional>
#include <string>

#include "analyse/element.hpp"
#include "base/parallel.hpp"

namespace firn {
namespace {

using Clock = std::chrono::steady_clock;
using SparseMatrix = Eigen::SparseMatrix<double, Eigen::ColMajor, int>;
/// Equations are already numbered in a fill-reducing order (node_order), so
/// the factor keeps them as they are.
using Factor = Eigen::SimplicialLDLT<SparseMatrix, Eigen::Lower, Eigen::NaturalOrdering<int>>;
using Block = Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, Eigen::RowMajor>;

constexpr std::int64_t no_equation = -1;

double seconds_since(Clock::time_point start) {
    return std::chrono::duration<double>(Clock::now() - start).count();
}

/// A pivot this much smaller than its diagonal has lost about eight of the sixteen
/// digits: the factor is looked at more closely, and the conditioning reported.
/// Well-conditioned frames stay far above it, so the common path does no more.
constexpr double kSuspiciousPivot = 1e-8;

/// In the unit copy of the frame (every member and spring of unit stiffness, see
/// unit_members), a pivot this much smaller than its diagonal is a lost rank: there
/// only geometry and releases are left, and a mechanism leaves round-off (~1e-16)
/// while a stable frame keeps pivots many orders larger, whatever its real stiffnesses.
constexpr double kMechanismPivot = 1e-11;

/// Past this condition estimate fewer than two of the sixteen digits would be left: the
/// results would mean nothing, so the frame is refused though it is stable.
constexpr double kUnsolvableCondition = 1e14;

/// A solve of a badly conditioned frame is kept when its componentwise backward error
/// (see backward_error) is below this: round-off gives about 1e-15.
constexpr double kBackwardErrorTolerance = 1e-10;

/// A displacement past this fraction of the frame's size is beyond what a linear
/// (first-order, small-displacement) analysis describes (common practice).
constexpr double kLargeDisplacement = 1.0 / 50.0;

/// The restraint of every node and direction (resolve allows one support per node).
std::vector<std::array<Restraint, 3>> node_restraints(const Model& model) {
    std::vector<std::array<Restraint, 3>> out(model.nodes.size());
    for (const Support& s : model.supports)
        out[at(s.node)] = s.restraint;
    return out;
}

/// Equation numbers of the node freedoms, node by node in elimination order;
/// removed ones get `no_equation`.
struct DofMap {
    std::vector<std::int64_t> equation;  ///< 3 per node
    std::vector<std::size_t> freedom;    ///< node * 3 + Dof of each equation
    std::vector<char> rotation_free;     ///< per node
};

/// Whether some member end is rigidly joined to each node (else its rotation
/// has no stiffness from the members).
std::vector<char> rigidly_joined(const Model& model) {
    std::vector<char> joined(model.nodes.size(), 0);
    for (const Member& m : model.members) {
        if (!m.hinge_start)
            joined[at(m.start)] = 1;
        if (!m.hinge_end)
            joined[at(m.end)] = 1;
    }
    return joined;
}

/// The nodes in a fill-reducing elimination order: approximate minimum
/// degree on the graph of nodes joined by members. Ordering the 3x3 node
/// blocks rather than single freedoms keeps each node's freedoms together
/// and, on a 100 x 100 bay frame, more than halves the factorization time.
std::vector<std::size_t> node_order(const Model& model) {
    auto count = static_cast<Eigen::Index>(model.nodes.size());
    std::vector<Eigen::Triplet<double, int>> links;
    links.reserve(model.members.size() * 2 + model.nodes.size());
    for (const Member& m : model.members) {
        auto a = static_cast<int>(at(m.start)), b = static_cast<int>(at(m.end));
        links.emplace_back(a, b, 1.0);
        links.emplace_back(b, a, 1.0);
    }
    for (int i = 0; i < static_cast<int>(count); ++i)
        links.emplace_back(i, i, 1.0);
    SparseMatrix graph(count, count);
    graph.setFromTriplets(links.begin(), links.end());
    Eigen::PermutationMatrix<Eigen::Dynamic, Eigen::Dynamic, int> order;  // position -> node
    Eigen::AMDOrdering<int>()(graph, order);
    std::vector<std::size_t> nodes(model.nodes.size());
    for (std::size_t k = 0; k < nodes.size(); ++k) {
        nodes[k] = static_cast<std::size_t>(order.indices()[static_cast<Eigen::Index>(k)]);
    }
    return nodes;
}

DofMap number_equations(const Model& model,
                        const std::vector<std::array<Restraint, 3>>& restraints) {
    DofMap map;
    std::vector<char> joined = rigidly_joined(model);
    map.equation.assign(model.nodes.size() * 3, no_equation);
    map.rotation_free.assign(model.nodes.size(), 0);
    for (std::size_t n : node_order(model)) {
        for (std::size_t d = 0; d < 3; ++d) {
            const Restraint& r = restraints[n][d];
            if (r.kind == Restraint::Kind::fixed)
                continue;
            bool spring = r.kind == Restraint::Kind::spring && r.stiffness > 0.0;
            if (d == dof_rotation && !joined[n] && !spring) {
                map.rotation_free[n] = 1;  // held at 0: nothing can turn it
                continue;
            }
            map.equation[n * 3 + d] = static_cast<std::int64_t>(map.freedom.size());
            map.freedom.push_back(n * 3 + d);
        }
    }
    return map;
}

/// What the assembly and the load vectors need of each member.
struct MemberData {
    ElementProperties properties;
    MemberGeometry geometry;
    std::array<std::int64_t, 6> equation{};
};

std::vector<MemberData> member_data(const Model& model, const DofMap& map) {
    std::vector<MemberData> out(model.members.size());
    for (std::size_t i = 0; i < model.members.size(); ++i) {
        MemberId id = make_id<MemberId>(i);
        const Member& m = model.members[i];
        out[i].properties = element_properties(model, id);
        out[i].geometry = member_geometry(model, id);
        for (std::size_t d = 0; d < 3; ++d) {
            out[i].equation[d] = map.equation[at(m.start) * 3 + d];
            out[i].equation[3 + d] = map.equation[at(m.end) * 3 + d];
        }
    }
    return out;
}

/// Members need positive, finite rigidities; anything else cannot be solved.
bool check_members(const Model& model, const std::vector<MemberData>& members,
                   Diagnostics& diagnostics) {
    bool ok = true;
    for (std::size_t i = 0; i < members.size(); ++i) {
        const ElementProperties& e = members[i].properties;
        bool good = std::isfinite(e.axial_rigidity) && std::isfinite(e.bending_rigidity) &&
                    e.axial_rigidity > 0.0 && e.bending_rigidity > 0.0;
        if (good)
            continue;
        diagnostics.error(model.members[i].where,
                          fmt::format("member '{}' has no stiffness: E*A and E*I must be positive",
                                      model.members[i].name));
        ok = false;
    }
    return ok;
}

/// The assembled stiffness (lower triangle) and its diagonal.
struct Stiffness {
    SparseMatrix lower;
    Eigen::VectorXd diagonal;
};

Stiffness assemble_stiffness(const std::vector<MemberData>& members, const DofMap& map,
                             const std::vector<std::array<Restraint, 3>>& restraints) {
    auto n = static_cast<Eigen::Index>(map.freedom.size());
    std::vector<Eigen::Triplet<double, int>> triplets;
    triplets.reserve(members.size() * 21 + map.freedom.size());
    Stiffness k{SparseMatrix(n, n), Eigen::VectorXd::Zero(n)};
    auto add = [&](std::int64_t row, std::int64_t col, double v) {
        if (row < col)
            std::swap(row, col);
        triplets.emplace_back(static_cast<int>(row), static_cast<int>(col), v);
        if (row == col)
            k.diagonal[row] += v;
    };
    for (const MemberData& m : members) {
        ElementMatrix km = to_global(local_stiffness(m.properties), m.geometry);
        for (std::size_t i = 0; i < 6; ++i) {
            for (std::size_t j = 0; j <= i; ++j) {
                if (m.equation[i] == no_equation || m.equation[j] == no_equation)
                    continue;
                if (km[i][j] != 0.0)
                    add(m.equation[i], m.equation[j], km[i][j]);
            }
        }
    }
    for (std::size_t e = 0; e < map.freedom.size(); ++e) {
        std::size_t f = map.freedom[e];
        const Restraint& r = restraints[f / 3][f % 3];
        if (r.kind == Restraint::Kind::spring)
            add(static_cast<std::int64_t>(e), static_cast<std::int64_t>(e), r.stiffness);
    }
    k.lower.setFromTriplets(triplets.begin(), triplets.end());
    return k;
}

const char* movement_words(std::size_t dof) {
    switch (dof) {
        case dof_x:
            return "move in x";
        case dof_y:
            return "move in y";
        default:
            return "rotate";
    }
}

/// Freedoms nothing resists at all: a node left loose in some direction.
bool report_loose_freedoms(const Model& model, const DofMap& map, const Stiffness& k,
                           Diagnostics& diagnostics) {
    std::size_t reported = 0;
    for (std::size_t e = 0; e < map.freedom.size(); ++e) {
        if (k.diagonal[static_cast<Eigen::Index>(e)] > 0.0)
            continue;
        if (++reported > 5)
            break;  // one loose node is usually the whole story
        std::size_t f = map.freedom[e];
        const Node& node = model.nodes[f / 3];
        diagnostics.error(node.where,
                          fmt::format("the structure is unstable: node '{}' is free to {} "
                                      "(nothing restrains it in that direction)",
                                      node.name, movement_words(f % 3)));
    }
    return reported == 0;
}

/// Where each equation sits in the factor. With the natural ordering used
/// here that is the equation itself, but going through the factor's
/// permutation keeps the sweeps right should the ordering change.
std::vector<Eigen::Index> factor_positions(const Factor& factor, Eigen::Index n) {
    std::vector<Eigen::Index> position(static_cast<std::size_t>(n));
    const auto& p = factor.permutationP();
    for (Eigen::Index i = 0; i < n; ++i) {
        position[static_cast<std::size_t>(i)] = p.size() > 0 ? p.indices()[i] : i;
    }
    return position;
}

/// The pivots of a factor against the diagonal they came from.
struct PivotScan {
    Eigen::Index first_below = -1;  ///< the first pivot below the limit asked for, or -1
    double least_ratio = 1.0;       ///< the smallest pivot / diagonal (<= 0: lost)
    bool usable = false;            ///< the factor finished and every pivot is positive
};

PivotScan scan_pivots(const Factor& factor, const Stiffness& k,
                      const std::vector<Eigen::Index>& position, double limit) {
    PivotScan scan;
    if (factor.info() != Eigen::Success)
        return scan;
    Eigen::VectorXd permuted_diagonal(k.diagonal.size());
    for (std::size_t i = 0; i < position.size(); ++i)
        permuted_diagonal[position[i]] = k.diagonal[static_cast<Eigen::Index>(i)];
    const Eigen::VectorXd d = factor.vectorD();
    scan.usable = true;
    for (Eigen::Index i = 0; i < d.size(); ++i) {
        double ratio = std::isfinite(d[i]) ? d[i] / permuted_diagonal[i] : -1.0;
        if (!(ratio > 0.0))
            scan.usable = false;
        if (!(ratio > limit) && scan.first_below < 0)
            scan.first_below = i;
        scan.least_ratio = std::min(scan.least_ratio, ratio);
    }
    return scan;
}

/// The mechanism behind a zero pivot `bad`: the null vector of the leading
/// block of the permuted stiffness, z = [-L11^-T l21; 1] (later freedoms held).
std::vector<double> mechanism_mode(const Factor& factor, Eigen::Index bad) {
    const SparseMatrix& l = factor.matrixL().nestedExpression();
    const int* outer = l.outerIndexPtr();
    const int* inner = l.innerIndexPtr();
    const double* value = l.valuePtr();
    std::vector<double> z(static_cast<std::size_t>(bad) + 1, 0.0);
    z.back() = 1.0;
    for (Eigen::Index j = bad; j-- > 0;) {
        double sum = 0.0;
        for (int p = outer[j]; p < outer[j + 1] && inner[p] <= bad; ++p) {
            sum += value[p] * z[static_cast<std::size_t>(inner[p])];
        }
        z[static_cast<std::size_t>(j)] = -sum;
    }
    return z;
}

/// The equation that moves most in the mode. A translation is named when the
/// mode has any to speak of (a sway reads better as "moves in x" than as the
/// rotation of a base); rotations count as the movement they cause at a
/// typical member length, so the two can be compared.
std::size_t most_moving_equation(const std::vector<double>& z,
                                 const std::vector<Eigen::Index>& position, const DofMap& map,
                                 double typical_length) {
    std::array<std::size_t, 2> best{0, 0};  // translation, rotation
    std::array<double, 2> largest{-1.0, -1.0};
    for (std::size_t e = 0; e < position.size(); ++e) {
        auto p = static_cast<std::size_t>(position[e]);
        if (p >= z.size())
            continue;
        std::size_t kind = map.freedom[e] % 3 == dof_rotation ? 1 : 0;
        double size = std::abs(z[p]) * (kind == 1 ? typical_length : 1.0);
        if (size > largest[kind] * (1.0 + 1e-9)) {  // ties go to the node declared first
            largest[kind] = size;
            best[kind] = e;
        }
    }
    return largest[0] > 1e-3 * largest[1] ? best[0] : best[1];
}

double typical_member_length(const std::vector<MemberData>& members) {
    double sum = 0.0;
    for (const MemberData& m : members)
        sum += m.geometry.length;
    return members.empty() ? 1.0 : sum / static_cast<double>(members.size());
}

/// What the factor's checks read of the frame.
struct SolveInputs {
    const Model& model;
    const DofMap& map;
    const std::vector<MemberData>& members;
    const std::vector<std::array<Restraint, 3>>& restraints;
};

/// The frame with every member and spring of unit stiffness: EA/L = 12EI/L^3 = 1 N/m and
/// springs 1 N/m (rotations: the typical member length squared, in N*m/rad). Whether a
/// frame is a mechanism depends only on its geometry, releases and restraints, never on
/// how stiff its parts are, so this copy answers it without the real stiffness ratios.
std::vector<MemberData> unit_members(const std::vector<MemberData>& members) {
    std::vector<MemberData> unit = members;
    for (MemberData& m : unit) {
        double l = m.properties.length;
        m.properties.axial_rigidity = l;
        m.properties.bending_rigidity = l * l * l / 12.0;
    }
    return unit;
}

std::vector<std::array<Restraint, 3>> unit_restraints(
    const std::vector<std::array<Restraint, 3>>& restraints, double typical_length) {
    std::vector<std::array<Restraint, 3>> unit = restraints;
    for (auto& node : unit) {
        for (std::size_t d = 0; d < 3; ++d) {
            if (node[d].kind == Restraint::Kind::spring && node[d].stiffness > 0.0)
                node[d].stiffness = d == dof_rotation ? typical_length * typical_length : 1.0;
        }
    }
    return unit;
}

/// Factors `k`; when Eigen stops at an exactly zero pivot, a tiny diagonal shift lets
/// the factor finish so that the mode can be read.
void factor_even_if_singular(const Stiffness& k, Factor& factor) {
    factor.compute(k.lower);
    if (factor.info() == Eigen::Success)
        return;
    factor.setShift(1e-13 * k.diagonal.minCoeff());
    factor.compute(k.lower);
}

/// The equation that moves most in the frame's mechanism, if it has one.
std::optional<std::size_t> mechanism_equation(const SolveInputs& in) {
    double typical = typical_member_length(in.members);
    Stiffness unit = assemble_stiffness(unit_members(in.members), in.map,
                                        unit_restraints(in.restraints, typical));
    Factor factor;
    factor_even_if_singular(unit, factor);
    std::vector<Eigen::Index> position = factor_positions(factor, unit.diagonal.size());
    PivotScan scan = scan_pivots(factor, unit, position, kMechanismPivot);
    if (factor.info() != Eigen::Success)
        return 0;  // not even a shift helps: say it of the first freedom
    if (scan.first_below < 0)
        return std::nullopt;
    std::vector<double> z = mechanism_mode(factor, scan.first_below);
    return most_moving_equation(z, position, in.map, typical);
}

/// The stiffest and the softest part of the frame: a member by the larger of EA/L and
/// 12EI/L^3 (EA/L for a bar hinged at both ends), a spring by its stiffness.
struct StiffnessRange {
    std::string stiffest, softest;
    SourceRange soft_where;  ///< where the softest part is written
    double high = 0.0, low = std::numeric_limits<double>::infinity();
};

StiffnessRange stiffness_range(const SolveInputs& in) {
    StiffnessRange range;
    auto consider = [&](const std::string& what, double k, const SourceRange& where) {
        if (k > range.high) {
            range.high = k;
            range.stiffest = what;
        }
        if (k < range.low) {
            range.low = k;
            range.softest = what;
            range.soft_where = where;
        }
    };
    for (std::size_t i = 0; i < in.members.size(); ++i) {
        const ElementProperties& e = in.members[i].properties;
        double l = e.length, bend = 12.0 * e.bending_rigidity / (l * l * l);
        bool bar = e.hinge_start && e.hinge_end;
        consider(fmt::format("member '{}'", in.model.members[i].name),
                 bar ? e.axial_rigidity / l : std::max(e.axial_rigidity / l, bend),
                 in.model.members[i].where);
    }
    double l = typical_member_length(in.members);
    for (const Support& sp : in.model.supports) {
        for (std::size_t d = 0; d < 3; ++d) {
            const Restraint& r = sp.restraint[d];
            if (r.kind == Restraint::Kind::spring && r.stiffness > 0.0) {
                // A rotational spring compares with members as the force it gives at a
                // typical member length.
                consider(fmt::format("the spring at node '{}'", in.model.nodes[at(sp.node)].name),
                         d == dof_rotation ? r.stiffness / (l * l) : r.stiffness, sp.where);
            }
        }
    }
    return range;
}

std::string conditioning_words(const StiffnessRange& range, double least_ratio) {
    double estimate =
        least_ratio > 0.0 ? 1.0 / least_ratio : std::numeric_limits<double>::infinity();
    std::string text =
        std::isfinite(estimate)
            ? fmt::format(
                  "the stiffness matrix is badly conditioned (estimate {:.1e}: about {:.0f} "
                  "of the 16 digits are lost)",
                  estimate, std::log10(estimate))
            : std::string("the stiffness matrix is too badly conditioned to factor");
    if (range.low > 0.0 && range.high / range.low > 1e6)
        text += fmt::format("; {} is {:.1e} times as stiff as {}", range.stiffest,
                            range.high / range.low, range.softest);
    return text;
}

/// Factors k. A frame that is a mechanism is refused, naming the node and direction that
/// move most in it; a stable frame that is badly conditioned is solved with a warning
/// that names the stiffness ratio behind it (the solve's residual is checked later).
bool factor_stiffness(const SolveInputs& in, const Stiffness& k, Factor& factor,
                      bool& ill_conditioned, Diagnostics& diagnostics) {
    factor.compute(k.lower);
    std::vector<Eigen::Index> position = factor_positions(factor, k.diagonal.size());
    PivotScan scan = scan_pivots(factor, k, position, kSuspiciousPivot);
    if (scan.usable && scan.first_below < 0)
        return true;
    if (std::optional<std::size_t> equation = mechanism_equation(in)) {
        std::size_t f = in.map.freedom[*equation];
        const Node& node = in.model.nodes[f / 3];
        diagnostics.error(node.where,
                          fmt::format("the structure is unstable: node '{}' is free to {} "
                                      "(its members and supports form a mechanism)",
                                      node.name, movement_words(f % 3)));
        return false;
    }
    // Point at the softest part: usually the one to look at (a spring, a slender member).
    StiffnessRange range = stiffness_range(in);
    SourceRange where = range.soft_where;
    if (!scan.usable || scan.least_ratio < 1.0 / kUnsolvableCondition) {
        diagnostics.error(where, conditioning_words(range, scan.least_ratio) +
                                     "; the frame is stable but cannot be solved in double "
                                     "precision: make the stiffnesses less far apart");
        return false;
    }
    ill_conditioned = true;
    diagnostics.warning(where, conditioning_words(range, scan.least_ratio) +
                                   "; the frame is stable and was solved; the results keep fewer "
                                   "digits than usual");
    return true;
}

/// Adds the condensed equivalent loads of member i in cases [first, last) to
/// its rows of the load block. Cases run innermost, so each row is written
/// left to right: the block is row-major.
void add_member_loads(const LoadSet& loads, const MemberData& m, std::size_t i,
                      const std::vector<Eigen::Index>& position, std::size_t first,
                      std::size_t last, Block& b) {
    for (std::size_t c = first; c < last; ++c) {
        const CaseLoads& cl = loads.cases[c];
        auto spread = cl.distributed_on(make_id<MemberId>(i));
        auto points = cl.points_on(make_id<MemberId>(i));
        if (spread.empty() && points.empty())
            continue;
        ElementVector f =
            to_global(condensed_loads(m.properties, consistent_loads(m.properties, spread, points)),
                      m.geometry);
        auto column = static_cast<Eigen::Index>(c - first);
        for (std::size_t j = 0; j < 6; ++j) {
            if (m.equation[j] != no_equation)
                b(position[static_cast<std::size_t>(m.equation[j])], column) += f[j];
        }
    }
}

/// Load vectors of cases [first, last), one column each, rows in factor order:
/// nodal loads plus the condensed equivalent loads of the members.
Block load_block(const LoadSet& loads, const DofMap& map, const std::vector<MemberData>& members,
                 const std::vector<Eigen::Index>& position, std::size_t first, std::size_t last) {
    auto n = static_cast<Eigen::Index>(position.size());
    Block b(n, static_cast<Eigen::Index>(last - first));
    for (std::size_t e = 0; e < map.freedom.size(); ++e) {
        double* row = b.row(position[e]).data();
        for (std::size_t c = first; c < last; ++c)
            row[c - first] = loads.cases[c].nodal[map.freedom[e]];
    }
    for (std::size_t i = 0; i < members.size(); ++i)
        add_member_loads(loads, members[i], i, position, first, last, b);
    return b;
}

/// Solves L D L^T x = b for every column of b at once: one pass over the
/// factor, each step a row operation across all cases.
void solve_in_place(const Factor& factor, Block& x) {
    const SparseMatrix& l = factor.matrixL().nestedExpression();
    const Eigen::VectorXd d = factor.vectorD();
    const int* outer = l.outerIndexPtr();
    const int* inner = l.innerIndexPtr();
    const double* value = l.valuePtr();
    const Eigen::Index n = x.rows(), width = x.cols();
    double* data = x.data();
    auto row = [&](Eigen::Index i) { return data + i * width; };
    for (Eigen::Index j = 0; j < n; ++j) {
        const double* xj = row(j);
        for (int p = outer[j]; p < outer[j + 1]; ++p) {
            double* xi = row(inner[p]);
            for (Eigen::Index c = 0; c < width; ++c)
                xi[c] -= value[p] * xj[c];
        }
    }
    for (Eigen::Index j = 0; j < n; ++j) {
        double* xj = row(j);
        for (Eigen::Index c = 0; c < width; ++c)
            xj[c] /= d[j];
    }
    for (Eigen::Index j = n; j-- > 0;) {
        double* xj = row(j);
        for (int p = outer[j]; p < outer[j + 1]; ++p) {
            const double* xi = row(inner[p]);
            for (Eigen::Index c = 0; c < width; ++c)
                xj[c] -= value[p] * xi[c];
        }
    }
}

/// Builds, solves and stores the cases [first, last) into the solution.
/// Builds, solves and stores the cases [first, last) into the solution.
/// Returns the seconds spent building their load vectors.
double solve_cases(const LoadSet& loads, const DofMap& map, const std::vector<MemberData>& members,
                   const Factor& factor, const std::vector<Eigen::Index>& position,
                   std::size_t first, std::size_t last, Solution& out) {
    Clock::time_point start = Clock::now();
    Block x = load_block(loads, map, members, position, first, last);
    double building = seconds_since(start);
    solve_in_place(factor, x);
    // Row by row again: each row of x holds one freedom in every case.
    std::size_t stride = out.node_count * 3;
    for (std::size_t e = 0; e < map.freedom.size(); ++e) {
        const double* row = x.row(position[e]).data();
        double* u = out.displacements.data() + first * stride + map.freedom[e];
        for (std::size_t c = 0; c < last - first; ++c)
            u[c * stride] = row[c];
    }
    return building;
}

/// Every case on the one factor, in groups of cases, one group per thread.
/// Returns the longest time a group spent building its load vectors.
double solve_all_cases(const LoadSet& loads, const DofMap& map,
                       const std::vector<MemberData>& members, const Factor& factor,
                       Solution& out) {
    auto n = static_cast<Eigen::Index>(map.freedom.size());
    std::vector<Eigen::Index> position = factor_positions(factor, n);
    std::vector<double> building(out.case_count, 0.0);  // at each group's first case
    for_each_chunk(out.case_count, [&](std::size_t first, std::size_t last) {
        building[first] = solve_cases(loads, map, members, factor, position, first, last, out);
    });
    return building.empty() ? 0.0 : *std::max_element(building.begin(), building.end());
}

/// A moment applied where every member is hinged and nothing holds the
/// rotation has nothing to resist it.
bool report_unresisted_moments(const Model& model, const DofMap& map, Diagnostics& diagnostics) {
    bool ok = true;
    for (const LoadCase& lc : model.cases) {
        for (const NodalLoad& load : lc.nodal) {
            if (load.moment == 0.0 || !map.rotation_free[at(load.node)])
                continue;
            diagnostics.error(
                load.where,
                fmt::format(
                    "the structure is unstable: node '{}' is free to rotate under this moment "
                    "(every member is hinged there and no support holds its rotation)",
                    model.nodes[at(load.node)].name));
            ok = false;
        }
    }
    return ok;
}

/// The componentwise backward error of the solve, max over equations and cases of
/// |K u - f| / (|K| |u| + |f|) (Oettli and Prager): how far the loads would have to move
/// for u to be exact. A sound factor leaves round-off (~1e-15) whatever the conditioning;
/// a factor broken by lost digits leaves far more.
double backward_error(const LoadSet& loads, const SolveInputs& in, const Stiffness& k,
                      const std::vector<Eigen::Index>& position, const Solution& out) {
    auto n = static_cast<Eigen::Index>(in.map.freedom.size());
    auto cases = static_cast<Eigen::Index>(out.case_count);
    Block f = load_block(loads, in.map, in.members, position, 0, out.case_count);
    Eigen::MatrixXd u(n, cases);
    std::size_t stride = out.node_count * 3;
    for (Eigen::Index e = 0; e < n; ++e) {
        for (Eigen::Index c = 0; c < cases; ++c)
            u(e, c) = out.displacements[static_cast<std::size_t>(c) * stride +
                                        in.map.freedom[static_cast<std::size_t>(e)]];
    }
    SparseMatrix magnitude = k.lower.cwiseAbs();
    Eigen::MatrixXd ku = k.lower.selfadjointView<Eigen::Lower>() * u;
    Eigen::MatrixXd scale = magnitude.selfadjointView<Eigen::Lower>() * u.cwiseAbs();
    double worst = 0.0;
    for (Eigen::Index e = 0; e < n; ++e) {
        for (Eigen::Index c = 0; c < cases; ++c) {
            double load = f(position[static_cast<std::size_t>(e)], c);
            double bound = scale(e, c) + std::abs(load);
            if (bound > 0.0)
                worst = std::max(worst, std::abs(ku(e, c) - load) / bound);
        }
    }
    return worst;
}

/// Warns of the case that moves a node farthest beyond kLargeDisplacement of the frame's size.
void warn_large_displacements(const Model& model, const Solution& s, Diagnostics& diagnostics) {
    if (model.nodes.empty())
        return;
    auto [xlo, xhi] = std::minmax_element(model.nodes.begin(), model.nodes.end(),
                                          [](const Node& a, const Node& b) { return a.x < b.x; });
    auto [ylo, yhi] = std::minmax_element(model.nodes.begin(), model.nodes.end(),
                                          [](const Node& a, const Node& b) { return a.y < b.y; });
    double size = std::max(xhi->x - xlo->x, yhi->y - ylo->y);
    // Squared lengths over the raw [case][node][dof] array: this runs on every solve.
    double limit = kLargeDisplacement * size, worst = limit * limit;
    std::size_t worst_case = 0, worst_node = 0;
    bool found = false;
    const double* u = s.displacements.data();
    for (std::size_t c = 0; c < s.case_count; ++c) {
        for (std::size_t n = 0; n < s.node_count; ++n, u += 3) {
            double move = u[dof_x] * u[dof_x] + u[dof_y] * u[dof_y];
            if (move > worst) {
                worst = move;
                worst_case = c;
                worst_node = n;
                found = true;
            }
        }
    }
    if (!found)
        return;
    diagnostics.warning(
        model.cases[worst_case].where,
        fmt::format("load case '{}' moves node '{}' by {:.3g} m, more than 1/{:g} of the frame's "
                    "size ({:.3g} m): a linear analysis no longer describes it; check the "
                    "supports, springs and stiffnesses",
                    model.cases[worst_case].name, model.nodes[worst_node].name, std::sqrt(worst),
                    1.0 / kLargeDisplacement, size));
}

/// A badly conditioned frame's solution is kept only if it satisfies its equations.
bool residual_acceptable(const LoadSet& loads, const SolveInputs& in, const Stiffness& k,
                         const Factor& factor, const Solution& out, Diagnostics& diagnostics) {
    std::vector<Eigen::Index> position =
        factor_positions(factor, static_cast<Eigen::Index>(in.map.freedom.size()));
    double residual = backward_error(loads, in, k, position, out);
    if (residual <= kBackwardErrorTolerance)
        return true;
    SourceRange where = in.model.members.empty() ? SourceRange{} : in.model.members[0].where;
    diagnostics.error(where, fmt::format("the solution of this badly conditioned frame does not "
                                         "satisfy its equations (backward error {:.1e}); make "
                                         "the stiffnesses less far apart",
                                         residual));
    return false;
}

bool all_finite(const Model& model, const Solution& s, Diagnostics& diagnostics) {
    for (std::size_t c = 0; c < s.case_count; ++c) {
        const double* u = s.displacements.data() + c * s.node_count * 3;
        if (std::all_of(u, u + s.node_count * 3, [](double v) { return std::isfinite(v); }))
            continue;
        diagnostics.error(
            model.cases[c].where,
            fmt::format("load case '{}' gives displacements that are not finite numbers; "
                        "check its load values",
                        model.cases[c].name));
        return false;
    }
    return true;
}

}  // namespace

Solution solve(const Model& model, const LoadSet& loads, Diagnostics& diagnostics,
               SolveTimings* timings) {
    Clock::time_point start = Clock::now();
    Solution out;
    out.node_count = model.nodes.size();
    out.case_count = loads.cases.size();
    out.displacements.assign(out.node_count * 3 * out.case_count, 0.0);
    std::vector<std::array<Restraint, 3>> restraints = node_restraints(model);
    DofMap map = number_equations(model, restraints);
    out.rotation_free = map.rotation_free;
    std::vector<MemberData> members = member_data(model, map);
    if (!check_members(model, members, diagnostics))
        return out;
    if (!report_unresisted_moments(model, map, diagnostics))
        return out;
    Stiffness k = assemble_stiffness(members, map, restraints);
    if (!report_loose_freedoms(model, map, k, diagnostics))
        return out;
    if (timings)
        timings->assemble = seconds_since(start);

    start = Clock::now();
    Factor factor;
    SolveInputs in{model, map, members, restraints};
    bool ill_conditioned = false;
    if (!map.freedom.empty() && !factor_stiffness(in, k, factor, ill_conditioned, diagnostics))
        return out;
    if (timings)
        timings->factor = seconds_since(start);

    start = Clock::now();
    double building = map.freedom.empty() ? 0.0 : solve_all_cases(loads, map, members, factor, out);
    out.ok = all_finite(model, out, diagnostics) &&
             (!ill_conditioned || residual_acceptable(loads, in, k, factor, out, diagnostics));
    if (!out.ok)
        std::fill(out.displacements.begin(), out.displacements.end(), 0.0);
    else
        warn_large_displacements(model, out, diagnostics);
    if (timings) {  // building the load vectors counts as assembly
        timings->assemble += building;
        timings->solve = seconds_since(start) - building;
    }
    return out;
}

}  // namespace firn
