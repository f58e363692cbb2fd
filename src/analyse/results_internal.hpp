// results_internal: the exact member-function machinery of results.cpp, shared
// with combine.cpp (a combination's functions are built the same way from its
// combined loads). Not part of any stage's interface.
#pragma once

#include "ir/combinations.hpp"

#include <array>
#include <cstddef>
#include <span>
#include <vector>

#include "analyse/analyse.hpp"
#include "analyse/element.hpp"
#include "ir/load_set.hpp"
#include "ir/model.hpp"
#include "ir/results.hpp"

namespace firn {

/// Case-independent data of one member for the result loops.
struct MemberInfo {
    ElementProperties properties;
    MemberGeometry geometry;
    std::size_t start = 0, end = 0;  ///< node indices
};
MemberInfo member_info(const Model& model, MemberId id);
std::vector<MemberInfo> member_infos(const Model& model);

/// N, V, M and deflection at the end of a piece (before any jump there).
struct PieceEnd {
    double n, v, m, w;
};

/// Buffers one worker reuses for every member, so the member loop does not
/// allocate. `ends` holds each piece's end values: the summaries need them
/// and they fall out of building the next piece, so they are kept, not
/// evaluated again.
struct Scratch {
    std::vector<double> breaks;
    std::vector<FunctionPiece> pieces;
    std::vector<PieceEnd> ends;
};

/// Global end displacements of a member in one case, turned to local axes.
ElementVector local_displacements(const Solution& s, CaseId c, const MemberInfo& m);

/// The exact functions of one member, into scratch.pieces. `forces` are the
/// local end forces the nodes apply to the member.
void build_functions(const MemberInfo& m, std::span<const LocalDistributed> spread,
                     std::span<const LocalPoint> points, const ElementVector& forces, Scratch& s);

/// Candidates closer than this share of the member's largest value count as
/// equal: the first position along the member then wins, on any machine, and
/// rounding noise never shows up as a tiny extreme somewhere along the member.
constexpr double kTie = 1e-9;

/// The member summary of the functions in `functions`.
MemberSummary summarize(const Scratch& functions);

/// The functions of a member, as indices (ORDER FUNCTION).
enum Function : std::size_t { f_axial = 0, f_shear = 1, f_moment = 2, f_deflection = 3 };

/// The largest and the smallest value of each function (indexed by Function)
/// with its position, each 0 at position 0 when the function never goes above
/// (below) zero; the first position wins a tie.
struct FunctionExtremes {
    std::array<Extreme, 4> max, min;
    /// N, V, M where each extreme occurs, on its side of a jump (0 with no extreme).
    std::array<std::array<double, 3>, 4> max_with{}, min_with{};
};

/// The member summary and the signed extremes, from one pass over the functions.
MemberSummary summarize(const Scratch& functions, FunctionExtremes& extremes);

/// The greatest and least of each component of `of(k)` over the combinations, each
/// with the other components of its combination (first on ties, judged against each
/// component's largest magnitude). Shared by the superposed and second-order envelopes.
template <typename Of>
ComponentEnvelope component_envelope(std::size_t count, Of of) {
    ComponentEnvelope out;
    if (count == 0)
        return out;
    std::array<double, 3> tie{};
    for (std::size_t k = 0; k < count; ++k) {
        for (std::size_t d = 0; d < 3; ++d)
            tie[d] = std::max(tie[d], kTie * std::abs(of(k)[d]));
    }
    for (std::size_t d = 0; d < 3; ++d)
        out.max[d] = out.min[d] = Governing{of(0)[d], 0.0, 0, of(0)};
    for (std::size_t k = 1; k < count; ++k) {
        const std::array<double, 3>& v = of(k);
        for (std::size_t d = 0; d < 3; ++d) {
            if (v[d] > out.max[d].value + tie[d])
                out.max[d] = Governing{v[d], 0.0, k, v};
            if (v[d] < out.min[d].value - tie[d])
                out.min[d] = Governing{v[d], 0.0, k, v};
        }
    }
    return out;
}

}  // namespace firn
