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

/// A pivot this much smaller than its diagonal means the stiffness has lost
/// rank. Very stiff axial members (A = 1e6 I/h^2) give pivots around 1e-6 of
/// their diagonal, far above it; a mechanism leaves only round-off (~1e-16).
constexpr double pivot_tolerance = 1e-10;

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

/// The first pivot of the factor that shows lost rank, or -1 if none does.
Eigen::Index first_bad_pivot(const Factor& factor, const Stiffness& k,
                             const std::vector<Eigen::Index>& position) {
    Eigen::VectorXd permuted_diagonal(k.diagonal.size());
    for (std::size_t i = 0; i < position.size(); ++i) {
        permuted_diagonal[position[i]] = k.diagonal[static_cast<Eigen::Index>(i)];
    }
    const Eigen::VectorXd d = factor.vectorD();
    for (Eigen::Index i = 0; i < d.size(); ++i) {
        if (!(d[i] > pivot_tolerance * permuted_diagonal[i]) || !std::isfinite(d[i]))
            return i;
    }
    return -1;
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

/// Factors k and checks every pivot. On a lost rank, names the node and
/// direction that moves most in the mechanism and returns false.
bool factor_stiffness(const Model& model, const DofMap& map, const std::vector<MemberData>& members,
                      const Stiffness& k, Factor& factor, Diagnostics& diagnostics) {
    factor.compute(k.lower);
    std::vector<Eigen::Index> position = factor_positions(factor, k.diagonal.size());
    if (factor.info() == Eigen::Success && first_bad_pivot(factor, k, position) < 0)
        return true;
    if (factor.info() != Eigen::Success) {
        // Eigen stops at an exactly zero pivot, leaving the factor unfinished.
        // A tiny diagonal shift lets it finish so the mechanism can be read.
        factor.setShift(1e-13 * k.diagonal.minCoeff());
        factor.compute(k.lower);
    }
    Eigen::Index bad = first_bad_pivot(factor, k, position);
    std::size_t equation = 0;
    if (factor.info() == Eigen::Success && bad >= 0) {
        std::vector<double> z = mechanism_mode(factor, bad);
        equation = most_moving_equation(z, position, map, typical_member_length(members));
    } else if (bad >= 0) {
        auto it = std::find(position.begin(), position.end(), bad);
        equation = static_cast<std::size_t>(it - position.begin());
    }
    std::size_t f = map.freedom[equation];
    const Node& node = model.nodes[f / 3];
    diagnostics.error(node.where, fmt::format("the structure is unstable: node '{}' is free to {} "
                                              "(its members and supports form a mechanism)",
                                              node.name, movement_words(f % 3)));
    return false;
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
    if (!map.freedom.empty() && !factor_stiffness(model, map, members, k, factor, diagnostics))
        return out;
    if (timings)
        timings->factor = seconds_since(start);

    start = Clock::now();
    double building = map.freedom.empty() ? 0.0 : solve_all_cases(loads, map, members, factor, out);
    out.ok = all_finite(model, out, diagnostics);
    if (!out.ok)
        std::fill(out.displacements.begin(), out.displacements.end(), 0.0);
    if (timings) {  // building the load vectors counts as assembly
        timings->assemble += building;
        timings->solve = seconds_since(start) - building;
    }
    return out;
}

}  // namespace firn
