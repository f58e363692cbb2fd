// element: the Euler-Bernoulli plane frame member.
//
// Shape functions in xi = x / L: axial 1 - xi and xi; transverse (Hermite)
// 1 - 3xi^2 + 2xi^3, L(xi - 2xi^2 + xi^3), 3xi^2 - 2xi^3 and L(-xi^2 + xi^3).
// Loads are integrated against them exactly, and released end rotations are
// removed by static condensation, so a hinged member needs no extra node.
#include "analyse/element.hpp"

#include <cassert>

namespace firn {

ElementProperties element_properties(const Model& model, MemberId member) {
    const Member& m = model.members[at(member)];
    const Section& s = model.sections[at(m.section)];
    double e = model.materials[at(s.material)].elastic_modulus;
    return ElementProperties{member_geometry(model, member).length, e * s.area, e * s.inertia,
                             m.hinge_start, m.hinge_end};
}

namespace {

constexpr std::size_t theta1 = 2, theta2 = 5;

/// The distinct entries of the stiffness with both end rotations held:
/// EA/L, 12EI/L^3, 6EI/L^2, 4EI/L and 2EI/L.
struct StiffnessTerms {
    double axial, a, b, c, d;
};

StiffnessTerms stiffness_terms(const ElementProperties& e) {
    double l = e.length, i = e.bending_rigidity / l;
    return StiffnessTerms{e.axial_rigidity / l, 12.0 * i / (l * l), 6.0 * i / l, 4.0 * i, 2.0 * i};
}

ElementMatrix full_stiffness(const ElementProperties& e) {
    auto [axial, a, b, c, d] = stiffness_terms(e);
    return ElementMatrix{{{axial, 0.0, 0.0, -axial, 0.0, 0.0},
                          {0.0, a, b, 0.0, -a, b},
                          {0.0, b, c, 0.0, -b, d},
                          {-axial, 0.0, 0.0, axial, 0.0, 0.0},
                          {0.0, -a, -b, 0.0, a, -b},
                          {0.0, b, d, 0.0, -b, c}}};
}

/// full_stiffness(e) times d, written out to skip the zeros: the result
/// stage does this for every member in every case.
ElementVector full_stiffness_times(const StiffnessTerms& k, const ElementVector& d) {
    double stretch = k.axial * (d[0] - d[3]);
    double drift = d[1] - d[4];
    double shear = k.a * drift + k.b * (d[2] + d[5]);
    return ElementVector{stretch,  shear,  k.b * drift + k.c * d[2] + k.d * d[5],
                         -stretch, -shear, k.b * drift + k.d * d[2] + k.c * d[5]};
}

void add_force_at(double l, double x, double qx, double qy, ElementVector& f) {
    double xi = x / l, xi2 = xi * xi, xi3 = xi2 * xi;
    f[0] += qx * (1.0 - xi);
    f[3] += qx * xi;
    f[1] += qy * (1.0 - 3.0 * xi2 + 2.0 * xi3);
    f[2] += qy * l * (xi - 2.0 * xi2 + xi3);
    f[4] += qy * (3.0 * xi2 - 2.0 * xi3);
    f[5] += qy * l * (xi3 - xi2);
}

/// Adds the work-equivalent end values of a counterclockwise moment at x: it
/// works through the slope, so it meets the shape functions' derivatives.
void add_moment_at(double l, double x, double mz, ElementVector& f) {
    double xi = x / l, xi2 = xi * xi;
    f[1] += mz * 6.0 * (xi2 - xi) / l;
    f[2] += mz * (1.0 - 4.0 * xi + 3.0 * xi2);
    f[4] += mz * 6.0 * (xi - xi2) / l;
    f[5] += mz * (3.0 * xi2 - 2.0 * xi);
}

/// Three-point Gauss-Legendre is exact up to degree 5; a linear load times a
/// cubic shape function is degree 4.
void add_distributed(double l, const LocalDistributed& q, ElementVector& f) {
    constexpr double node = 0.77459666924148337704;  // sqrt(3/5)
    constexpr std::array<double, 3> xs{-node, 0.0, node};
    constexpr std::array<double, 3> ws{5.0 / 9.0, 8.0 / 9.0, 5.0 / 9.0};
    double half = 0.5 * (q.b - q.a), mid = 0.5 * (q.a + q.b);
    for (std::size_t i = 0; i < 3; ++i) {
        double w = ws[i] * half, t = 0.5 * (1.0 + xs[i]);
        double qx = q.qx_a + (q.qx_b - q.qx_a) * t, qy = q.qy_a + (q.qy_b - q.qy_a) * t;
        add_force_at(l, mid + half * xs[i], w * qx, w * qy, f);
    }
}

}  // namespace

namespace {

/// Eliminates the end rotation r from k (and f, if given) by static
/// condensation: that rotation takes whatever value makes its moment vanish.
void condense(std::size_t r, ElementMatrix& k, ElementVector* f) {
    double pivot = k[r][r];
    for (std::size_t i = 0; i < 6; ++i) {
        if (i == r || k[i][r] == 0.0)
            continue;
        double ratio = k[i][r] / pivot;
        for (std::size_t j = 0; j < 6; ++j)
            k[i][j] -= ratio * k[r][j];
        if (f)
            (*f)[i] -= ratio * (*f)[r];
    }
    for (std::size_t j = 0; j < 6; ++j)
        k[r][j] = k[j][r] = 0.0;
    if (f)
        (*f)[r] = 0.0;
}

}  // namespace

void condense_released(const ElementProperties& e, ElementMatrix& k, ElementVector* f) {
    if (e.hinge_start)
        condense(theta1, k, f);
    if (e.hinge_end)
        condense(theta2, k, f);
}

/// Adds the work-equivalent end values of local forces (qx, qy) acting at x.
ElementMatrix local_stiffness(const ElementProperties& e) {
    ElementMatrix k = full_stiffness(e);
    if (e.hinge_start && e.hinge_end) {
        // A bar hinged at both ends has no transverse stiffness at all. Condensing
        // both rotations leaves round-off there instead of zero, which hid the
        // mechanism of pin-ended bars in a straight line; write the exact bar.
        double axial = k[0][0];
        k = ElementMatrix{};
        k[0][0] = k[3][3] = axial;
        k[0][3] = k[3][0] = -axial;
        return k;
    }
    condense_released(e, k, nullptr);
    return k;
}

ElementVector consistent_loads(const ElementProperties& e, std::span<const LocalDistributed> spread,
                               std::span<const LocalPoint> points) {
    ElementVector f{};
    for (const LocalDistributed& q : spread)
        add_distributed(e.length, q, f);
    for (const LocalPoint& p : points) {
        add_force_at(e.length, p.a, p.px, p.py, f);
        if (p.mz != 0.0)
            add_moment_at(e.length, p.a, p.mz, f);
    }
    return f;
}

ElementVector condensed_loads(const ElementProperties& e, const ElementVector& consistent) {
    ElementVector f = consistent;
    if (!e.hinge_start && !e.hinge_end)
        return f;
    ElementMatrix k = full_stiffness(e);
    condense_released(e, k, &f);
    return f;
}

ElementVector with_released_rotations(const ElementProperties& e, const ElementVector& d,
                                      const ElementVector& consistent) {
    ElementVector out = d;
    if (!e.hinge_start && !e.hinge_end)
        return out;
    StiffnessTerms k = stiffness_terms(e);
    if (e.hinge_start)
        out[theta1] = 0.0;
    if (e.hinge_end)
        out[theta2] = 0.0;
    // The released moments must vanish: k_rr theta_r = f_r - k_rc d_c, where
    // k_rr is [4EI/L 2EI/L; 2EI/L 4EI/L] for both, or its diagonal for one.
    ElementVector held = full_stiffness_times(k, out);
    double r1 = consistent[theta1] - held[theta1], r2 = consistent[theta2] - held[theta2];
    if (e.hinge_start && e.hinge_end) {
        double det = k.c * k.c - k.d * k.d;
        out[theta1] = (k.c * r1 - k.d * r2) / det;
        out[theta2] = (k.c * r2 - k.d * r1) / det;
    } else if (e.hinge_start) {
        out[theta1] = r1 / k.c;
    } else {
        out[theta2] = r2 / k.c;
    }
    return out;
}

ElementVector local_end_forces(const ElementProperties& e, const ElementVector& d,
                               const ElementVector& consistent) {
    ElementVector f =
        full_stiffness_times(stiffness_terms(e), with_released_rotations(e, d, consistent));
    for (std::size_t i = 0; i < 6; ++i)
        f[i] -= consistent[i];
    return f;
}

ElementVector to_local(const ElementVector& global, const MemberGeometry& g) {
    ElementVector out;
    for (std::size_t n = 0; n < 6; n += 3) {
        out[n] = g.c * global[n] + g.s * global[n + 1];
        out[n + 1] = -g.s * global[n] + g.c * global[n + 1];
        out[n + 2] = global[n + 2];
    }
    return out;
}

ElementVector to_global(const ElementVector& local, const MemberGeometry& g) {
    ElementVector out;
    for (std::size_t n = 0; n < 6; n += 3) {
        out[n] = g.c * local[n] - g.s * local[n + 1];
        out[n + 1] = g.s * local[n] + g.c * local[n + 1];
        out[n + 2] = local[n + 2];
    }
    return out;
}

ElementMatrix to_global(const ElementMatrix& local, const MemberGeometry& g) {
    // T^T k T: rotate every column (T^T k), then every row of the result.
    ElementMatrix half{}, out{};
    for (std::size_t j = 0; j < 6; ++j) {
        ElementVector column;
        for (std::size_t i = 0; i < 6; ++i)
            column[i] = local[i][j];
        ElementVector rotated = to_global(column, g);
        for (std::size_t i = 0; i < 6; ++i)
            half[i][j] = rotated[i];
    }
    for (std::size_t i = 0; i < 6; ++i)
        out[i] = to_global(half[i], g);
    return out;
}

}  // namespace firn
