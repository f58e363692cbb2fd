// stations: member functions evaluated at evenly spaced points.
#include "ir/stations.hpp"

#include "analyse/analyse.hpp"
#include "ir/results.hpp"

namespace firn {
namespace {

/// The piece holding x; at a break the piece that ends there (the value just
/// before a jump), and the first piece at the start node.
const FunctionPiece& piece_at(const MemberFunctions& f, double x) {
    for (const FunctionPiece& p : f.pieces) {
        if (x <= p.b)
            return p;
    }
    return f.pieces.back();
}

/// per_member stations of each member, from the functions functions_of(m) gives.
template <typename FunctionsOf>
std::vector<Station> member_stations(const Model& model, std::size_t per_member,
                                     FunctionsOf functions_of) {
    std::vector<Station> stations;
    stations.reserve(model.members.size() * per_member);
    for (std::size_t m = 0; m < model.members.size(); ++m) {
        MemberFunctions f = functions_of(make_id<MemberId>(m));
        double length = member_geometry(model, make_id<MemberId>(m)).length;
        for (std::size_t k = 0; k < per_member; ++k) {
            double x = per_member > 1
                           ? length * static_cast<double>(k) / static_cast<double>(per_member - 1)
                           : 0.0;
            const FunctionPiece& p = piece_at(f, x);
            double t = x - p.a;
            stations.push_back(Station{x, p.axial(t), p.shear(t), p.moment(t), p.deflection(t)});
        }
    }
    return stations;
}

}  // namespace

Stations compute_stations(const Model& model, const LoadSet& loads, const Solution& solution,
                          std::size_t per_member) {
    Stations out;
    out.per_member = per_member;
    out.cases.resize(model.cases.size());
    for (std::size_t c = 0; c < model.cases.size(); ++c) {
        out.cases[c] = member_stations(model, per_member, [&](MemberId m) {
            return member_functions(model, loads.cases[c], solution, make_id<CaseId>(c), m);
        });
    }
    return out;
}

Stations compute_combination_stations(const Model& model, const LoadSet& loads,
                                      const Solution& solution,
                                      std::span<const Combination> combinations,
                                      std::size_t per_member) {
    Stations out;
    out.per_member = per_member;
    out.cases.resize(combinations.size());
    for (std::size_t k = 0; k < combinations.size(); ++k) {
        out.cases[k] = member_stations(model, per_member, [&](MemberId m) {
            return combination_functions(model, loads, solution, combinations[k], m);
        });
    }
    return out;
}

}  // namespace firn
