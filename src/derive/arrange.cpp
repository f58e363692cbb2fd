// arrange: spans of a run of members, the arrangements a pattern rule makes on
// them, and the load cases of `arrange` requests.
#include "derive/arrange.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>
#include <algorithm>

#include "derive/derive.hpp"

namespace firn {
namespace {

/// Nodes that hold the run up: a support, or a member that is not part of it.
std::vector<char> supporting_nodes(const Model& model, const std::vector<MemberId>& run) {
    std::vector<char> in_run(model.members.size(), 0);
    for (MemberId id : run)
        in_run[at(id)] = 1;
    std::vector<char> supporting(model.nodes.size(), 0);
    for (const Support& s : model.supports)
        supporting[at(s.node)] = 1;
    for (std::size_t i = 0; i < model.members.size(); ++i) {
        if (in_run[i])
            continue;
        supporting[at(model.members[i].start)] = 1;
        supporting[at(model.members[i].end)] = 1;
    }
    return supporting;
}

/// The part of a node's name before its level (`B.eave` -> `B`): spans are named
/// by the column lines they run between.
std::string short_name(const Node& node) {
    return node.name.substr(0, node.name.find('.'));
}

/// The run's nodes in order: its first member's outer end, then each member's far end.
std::vector<NodeId> run_nodes(const Model& model, const std::vector<MemberId>& run) {
    std::vector<NodeId> nodes;
    if (run.empty())
        return nodes;
    const Member& first = model.members[at(run.front())];
    NodeId n = first.start;
    if (run.size() > 1) {
        const Member& second = model.members[at(run[1])];
        if (first.start == second.start || first.start == second.end)
            n = first.end;
    }
    nodes.push_back(n);
    for (MemberId id : run) {
        const Member& m = model.members[at(id)];
        n = m.start == n ? m.end : m.start;
        nodes.push_back(n);
    }
    return nodes;
}

std::string span_list(const std::vector<Span>& spans, const std::vector<std::size_t>& which) {
    std::vector<std::string> names;
    names.reserve(which.size());
    for (std::size_t i : which)
        names.push_back(spans[i].name);
    return fmt::format("{}", fmt::join(names, ", "));
}

/// `1.0 on A-B; 0.5 on B-C, C-D`: the spans grouped by factor, largest first.
std::string describe(const std::vector<Span>& spans, const std::vector<double>& factors) {
    std::vector<double> distinct = factors;
    std::sort(distinct.begin(), distinct.end(), std::greater<>());
    distinct.erase(std::unique(distinct.begin(), distinct.end()), distinct.end());
    std::vector<std::string> parts;
    for (double f : distinct) {
        std::vector<std::size_t> which;
        for (std::size_t i = 0; i < factors.size(); ++i) {
            if (factors[i] == f)
                which.push_back(i);
        }
        parts.push_back(fmt::format("{:g} on {}", f, span_list(spans, which)));
    }
    return fmt::format("{}", fmt::join(parts, "; "));
}

/// The span sets one rule line selects: one set per arrangement it makes.
std::vector<std::vector<std::size_t>> selections(PatternRule::Selector selector, std::size_t n) {
    using S = PatternRule::Selector;
    std::vector<std::vector<std::size_t>> out;
    switch (selector) {
        case S::exterior:
            out.push_back({0});
            if (n > 1)
                out.push_back({n - 1});
            break;
        case S::adjacent_pair:
            for (std::size_t i = 0; i + 1 < n; ++i)
                out.push_back({i, i + 1});
            break;
        case S::each:
            for (std::size_t i = 0; i < n; ++i)
                out.push_back({i});
            break;
        case S::all: {
            std::vector<std::size_t> every(n);
            for (std::size_t i = 0; i < n; ++i)
                every[i] = i;
            out.push_back(std::move(every));
            break;
        }
    }
    return out;
}

/// `A_D` for the selected spans A-B, B-C, C-D (they are adjacent or single): a
/// name part that later statements can refer to.
std::string selection_name(const std::vector<Span>& spans, const std::vector<std::size_t>& which) {
    const std::string& first = spans[which.front()].name;
    const std::string& last = spans[which.back()].name;
    return fmt::format("{}_{}", first.substr(0, first.find('-')), last.substr(last.find('-') + 1));
}

}  // namespace

std::vector<Span> spans_of(const Model& model, const std::vector<MemberId>& run) {
    std::vector<NodeId> nodes = run_nodes(model, run);
    std::vector<char> supporting = supporting_nodes(model, run);
    std::vector<Span> spans;
    std::size_t start = 0;  // index into nodes where the current span begins
    for (std::size_t k = 1; k < nodes.size(); ++k) {
        bool last_node = k + 1 == nodes.size();
        if (!supporting[at(nodes[k])] && !last_node)
            continue;
        Span span;
        span.first = start;
        span.last = k - 1;
        span.cantilever = !supporting[at(nodes[start])] || !supporting[at(nodes[k])];
        span.name = fmt::format("{}-{}", short_name(model.nodes[at(nodes[start])]),
                                short_name(model.nodes[at(nodes[k])]));
        spans.push_back(std::move(span));
        start = k;
    }
    return spans;
}

std::vector<Arrangement> arrangements_of(const PatternRule& rule, const std::vector<Span>& spans) {
    std::vector<Arrangement> out;
    std::size_t n = spans.size();
    for (const PatternRule::Line& line : rule.lines) {
        for (const std::vector<std::size_t>& which : selections(line.selector, n)) {
            std::vector<double> factors(n, line.others);
            for (std::size_t i : which)
                factors[i] = line.factor;
            bool as_written =
                std::all_of(factors.begin(), factors.end(), [](double f) { return f == 1.0; });
            bool repeated = std::any_of(out.begin(), out.end(),
                                        [&](const Arrangement& a) { return a.factors == factors; });
            if (as_written || repeated)
                continue;
            out.push_back(
                Arrangement{fmt::format("{}.{}", line.label, selection_name(spans, which)), factors,
                            describe(spans, factors)});
        }
    }
    return out;
}

LoadCase arranged_case(const Model& model, const LoadCase& base, const std::vector<MemberId>& run,
                       const std::vector<Span>& spans, const Arrangement& arrangement,
                       std::string name) {
    std::vector<double> factor_of(model.members.size(), 1.0);
    for (std::size_t s = 0; s < spans.size(); ++s) {
        for (std::size_t i = spans[s].first; i <= spans[s].last; ++i)
            factor_of[at(run[i])] = arrangement.factors[s];
    }
    LoadCase lc = base;
    lc.name = std::move(name);
    lc.arrangement_of = base.arrangement_of.empty() ? base.name : base.arrangement_of;
    lc.description = arrangement.description;
    for (DistributedLoad& d : lc.distributed) {
        d.w_start *= factor_of[at(d.member)];
        d.w_end *= factor_of[at(d.member)];
    }
    for (PointLoad& p : lc.points)
        p.force *= factor_of[at(p.member)];
    for (PointMoment& p : lc.moments)
        p.moment *= factor_of[at(p.member)];
    return lc;
}

void arrange_cases(const Model& model, Derivation& derivation, Diagnostics& diagnostics) {
    for (const ArrangeRequest& request : model.arrangements) {
        const PatternRule& rule = model.patterns[request.rule];
        std::vector<Span> spans = spans_of(model, request.members);
        LoadCase base = model.cases[at(request.load_case)];
        TraceStep heading;
        heading.formula = fmt::format(
            "{} arranged by {} over the spans {}", base.name, rule.name,
            span_list(spans, selections(PatternRule::Selector::all, spans.size()).front()));
        heading.heading = true;
        derivation.arrangement_trace.push_back(std::move(heading));
        if (!base.self_weight.empty()) {
            diagnostics.warning(request.where,
                                fmt::format("the self weight in case '{}' is not arranged: it "
                                            "stays on every span",
                                            base.name));
        }
        for (const Arrangement& a : arrangements_of(rule, spans)) {
            std::string name = fmt::format("{}.{}", base.name, a.name);
            TraceStep step;
            step.formula = fmt::format("{}: {}", name, a.description);
            derivation.arrangement_trace.push_back(std::move(step));
            derivation.cases.push_back(arranged_case(model, base, request.members, spans, a, name));
        }
    }
}

}  // namespace firn
