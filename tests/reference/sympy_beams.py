# SPDX-FileCopyrightText: 2026 The Trabeate developers
# SPDX-License-Identifier: GPL-3.0-or-later
"""Symbolic check of the beam engine.

For a fixed set of random beams (mixed supports, fixed ends, overhangs, cantilevers, 2-4 spans;
point, uniform, linearly varying and moment loads, some exactly at supports and at the ends,
some as combinations of load sets) this script builds the exact solution independently of
the engine:

  q(x), upward + : reactions R_i <x - s_i>^-1, support couples -C_i <x - s_i>^-2 (C
  counter-clockwise +), loads -P <x - a>^-1, clockwise couples m <x - a>^-2, and the
  distributed loads as steps and ramps <x - a>^0, <x - a>^1;
  V = int q, M = int V, EI theta = int M + C1, EI v = int EI theta + C2 (v upward);

with the unknown reactions, couples and C1, C2 fixed by V(L+) = M(L+) = 0 (the ends are free
beyond the member; left of 0 every singularity term is zero already), v = 0 at every support
and theta = 0 at every fixed support, solved exactly in rationals. It then compares the
reactions and V, M, theta and the deflection (down +) at every break point, left and right,
and at other points with what beam-dump prints, and the extremes over the member and over a
part of it (values, and that each reported location attains its value), each to 1e-9 of the
largest magnitude of that quantity on the beam. A few mechanisms must be refused as unstable.

Usage: sympy_beams.py <path of beam-dump>. Exits non-zero on any mismatch.
"""

import random
import subprocess
import sys
from fractions import Fraction

import sympy as sp

X = sp.Symbol("x", real=True)
TOL = 1e-9
N_BEAMS = 30
PREC = 40  # digits for evaluating the roots of quartics


def dec(value):
    """Exact decimal text of a rational whose decimal expansion ends (the positions are
    binary fractions as well, so the engine reads them exactly)."""
    fr = Fraction(value)
    d = fr.denominator
    for p in (2, 5):
        while d % p == 0:
            d //= p
    if d != 1:
        raise ValueError("no finite decimal for %s" % fr)
    sign = "-" if fr < 0 else ""
    fr = abs(fr)
    whole = fr.numerator // fr.denominator
    rest = fr - whole
    digits = ""
    while rest:
        rest *= 10
        d = rest.numerator // rest.denominator
        digits += str(d)
        rest -= d
    return sign + str(whole) + ("." + digits if digits else "")


def sf(a, n):
    return sp.SingularityFunction(X, a, n)


def sf_value(x0, side, a, n):
    """<x0 - a>^n taken from one side: left or right limit, or 'mid' (x0 symbolic, a piece
    of the member that starts at or after every a counted)."""
    if n < 0:
        return sp.Integer(0)
    if side == "left":
        inside = x0 > a
    else:
        inside = x0 >= a
    if not inside:
        return sp.Integer(0)
    return sp.Integer(1) if n == 0 else (x0 - a) ** n


def at(expr, x0, side):
    """The value of a singularity-function expression at x0 from one side."""
    return sp.expand(expr.replace(
        sp.SingularityFunction,
        lambda var, a, n: sf_value(sp.Rational(x0), side, a, n)).subs(X, sp.Rational(x0)))


def on_piece(expr, x_lo):
    """The polynomial that expr is on the open piece starting at x_lo."""
    def piece(var, a, n):
        if n < 0 or a > x_lo:
            return sp.Integer(0)
        return sp.Integer(1) if n == 0 else (X - a) ** n
    return sp.expand(expr.replace(sp.SingularityFunction, piece))


class Beam:
    def __init__(self, name, L, E, I, supports, cases, factors=None):
        self.name = name
        self.L = Fraction(L)
        self.E = E          # decimal text
        self.I = I          # decimal text
        self.supports = supports      # [(x, type)]
        self.cases = cases            # [[load tuples]]
        self.factors = factors        # None or [Fraction]

    def text(self, evals, ranges):
        out = ["beam %s %s %s" % (dec(self.L), self.E, self.I)]
        for x, t in self.supports:
            out.append("support %s %s" % (dec(x), t))
        for i, case in enumerate(self.cases):
            if i > 0:
                out.append("case")
            for ld in case:
                kind = ld[0]
                out.append(kind + " " + " ".join(dec(v) for v in ld[1:]))
        if self.factors:
            out.append("factors " + " ".join(dec(f) for f in self.factors))
        for x in evals:
            out.append("eval %s" % dec(x))
        for a, b in ranges:
            out.append("extremes %s %s" % (dec(a), dec(b)))
        return "\n".join(out) + "\n"

    def combined_loads(self):
        factors = self.factors or [Fraction(1)]
        loads = []
        for f, case in zip(factors, self.cases):
            for ld in case:
                kind = ld[0]
                if kind in ("point", "moment"):
                    loads.append((kind, ld[1], ld[2] * f))
                elif kind == "uniform":
                    loads.append((kind, ld[1], ld[2], ld[3] * f))
                else:
                    loads.append((kind, ld[1], ld[2], ld[3] * f, ld[4] * f))
        return loads


def exact_solution(beam):
    """V, M, EI theta, EI v as singularity expressions, the reactions, the break points."""
    Q = lambda v: sp.Rational(Fraction(v).numerator, Fraction(v).denominator)
    L = Q(beam.L)
    sup = {}
    for x, t in beam.supports:
        x = Q(x)
        rank = {"roller": 0, "pin": 1, "fixed": 2}[t]
        sup[x] = max(sup.get(x, rank), rank)
    xs = sorted(sup)
    R = [sp.Symbol("R%d" % i) for i in range(len(xs))]
    C = {i: sp.Symbol("Ms%d" % i) for i, s in enumerate(xs) if sup[s] == 2}
    C1, C2 = sp.symbols("K1 K2")

    q = sp.Integer(0)
    breaks = {sp.Integer(0), L}
    for i, s in enumerate(xs):
        q += R[i] * sf(s, -1)
        if i in C:
            q += -C[i] * sf(s, -2)
        breaks.add(s)
    for ld in beam.combined_loads():
        kind = ld[0]
        a = Q(ld[1])
        breaks.add(a)
        if kind == "point":
            q += -Q(ld[2]) * sf(a, -1)
        elif kind == "moment":
            q += Q(ld[2]) * sf(a, -2)
        elif kind == "uniform":
            b, w = Q(ld[2]), Q(ld[3])
            breaks.add(b)
            if b > a:
                q += -w * (sf(a, 0) - sf(b, 0))
        else:
            b, w1, w2 = Q(ld[2]), Q(ld[3]), Q(ld[4])
            breaks.add(b)
            if b > a:
                k = (w2 - w1) / (b - a)
                q += -(w1 * sf(a, 0) + k * sf(a, 1) - w2 * sf(b, 0) - k * sf(b, 1))

    V = sp.integrate(q, X)
    M = sp.integrate(V, X)
    EIt = sp.integrate(M, X) + C1
    EIv = sp.integrate(EIt, X) + C2

    eqs = [at(V, L, "right"), at(M, L, "right")]
    for i, s in enumerate(xs):
        eqs.append(at(EIv, s, "right"))
        if i in C:
            eqs.append(at(EIt, s, "right"))
    unknowns = R + list(C.values()) + [C1, C2]
    sol = sp.solve(eqs, unknowns, dict=True)
    if len(sol) != 1 or len(sol[0]) != len(unknowns):
        raise RuntimeError("no unique solution for " + beam.name)
    sol = sol[0]
    reactions = [(s, sol[R[i]], sol[C[i]] if i in C else sp.Integer(0))
                 for i, s in enumerate(xs)]
    subs = lambda e: e.subs(sol)
    return {
        "V": subs(V), "M": subs(M), "EIt": subs(EIt), "EIv": subs(EIv),
        "reactions": reactions, "breaks": sorted(breaks), "L": L,
        "EI": sp.Rational(beam.E) * sp.Rational(beam.I),
    }


def values_at(sol, x0, side):
    EI = sol["EI"]
    return (at(sol["V"], x0, side), at(sol["M"], x0, side),
            at(sol["EIt"], x0, side) / EI, -at(sol["EIv"], x0, side) / EI)


def extremes(sol, a, b):
    """Exact extremes over [a, b] the engine's way: inward values at a and b, both sides at
    breaks inside, and the real roots of the derivative inside each piece."""
    a, b = sp.Rational(a), sp.Rational(b)
    EI = sol["EI"]
    cand = {"V": [], "M": [], "defl": []}
    pts = [a] + [p for p in sol["breaks"] if a < p < b] + [b]
    for lo, hi in zip(pts[:-1], pts[1:]):
        for x0, side in ((lo, "right"), (hi, "left")):
            Vv, Mv, _, dv = values_at(sol, x0, side)
            cand["V"].append(Vv)
            cand["M"].append(Mv)
            cand["defl"].append(dv)
        Vp = on_piece(sol["V"], lo)
        Mp = on_piece(sol["M"], lo)
        Tp = on_piece(sol["EIt"], lo)
        Dp = -on_piece(sol["EIv"], lo) / EI
        for poly_expr, target, value_expr in ((sp.diff(Vp, X), "V", Vp), (Vp, "M", Mp),
                                              (Tp, "defl", Dp)):
            poly = sp.Poly(poly_expr, X)
            if poly.is_zero or poly.degree() < 1:
                continue
            for r in sp.real_roots(poly):
                rv = sp.N(r, PREC)
                if lo < rv < hi:
                    cand[target].append(sp.N(value_expr.subs(X, r), PREC))
    return {
        "V_max": max(cand["V"]), "V_min": min(cand["V"]),
        "M_max": max(cand["M"]), "M_min": min(cand["M"]),
        "down": max(max(cand["defl"]), 0), "up": max(-min(cand["defl"]), 0),
    }


def make_beams(rng):
    beams = []
    kinds = ["simple", "overhang-left", "overhang-right", "overhang-both", "cantilever-left",
             "cantilever-right", "cantilever-inner", "propped", "fixed-fixed", "continuous",
             "continuous", "continuous"]
    materials = [("200e9", "0.000345"), ("200e9", "0.0000212"), ("11e9", "0.000098"),
                 ("29e9", "0.00125")]
    for n in range(N_BEAMS):
        kind = kinds[n % len(kinds)]
        L = Fraction(rng.randint(16, 120), 4)          # 4 to 30 m
        grid = lambda lo, hi: Fraction(rng.randint(int(lo * 16), int(hi * 16)), 16)
        t2 = lambda: rng.choice(["pin", "roller"])
        if kind == "simple":
            sups = [(Fraction(0), "pin"), (L, "roller")]
        elif kind == "overhang-left":
            sups = [(grid(L / 8, L / 3), "pin"), (L, "roller")]
        elif kind == "overhang-right":
            sups = [(Fraction(0), "pin"), (grid(2 * L / 3, 7 * L / 8), t2())]
        elif kind == "overhang-both":
            sups = [(grid(L / 10, L / 4), t2()), (grid(3 * L / 4, 9 * L / 10), t2())]
        elif kind == "cantilever-left":
            sups = [(Fraction(0), "fixed")]
        elif kind == "cantilever-right":
            sups = [(L, "fixed")]
        elif kind == "cantilever-inner":
            sups = [(grid(L / 4, 3 * L / 4), "fixed")]
        elif kind == "propped":
            if rng.random() < 0.5:
                sups = [(Fraction(0), "fixed"), (grid(3 * L / 4, L), t2())]
            else:
                sups = [(grid(0, L / 4), t2()), (L, "fixed")]
        elif kind == "fixed-fixed":
            sups = [(Fraction(0), "fixed"), (L, "fixed")]
        else:
            n_spans = rng.randint(2, 4)
            lo = grid(0, L / 6) if rng.random() < 0.5 else Fraction(0)
            hi = grid(5 * L / 6, L) if rng.random() < 0.5 else L
            cuts = sorted({grid(lo + (hi - lo) * i / n_spans - (hi - lo) / (4 * n_spans),
                                lo + (hi - lo) * i / n_spans + (hi - lo) / (4 * n_spans))
                           for i in range(1, n_spans)})
            xs = [lo] + cuts + [hi]
            sups = [(x, t2()) for x in xs]
            if lo == 0 and rng.random() < 0.4:
                sups[0] = (lo, "fixed")
            if hi == L and rng.random() < 0.4:
                sups[-1] = (hi, "fixed")
            if rng.random() < 0.3:
                i = rng.randint(1, len(sups) - 2)
                sups[i] = (sups[i][0], "fixed")

        def position():
            r = rng.random()
            if r < 0.2:
                return rng.choice(sups)[0]          # exactly at a support
            if r < 0.3:
                return rng.choice([Fraction(0), L])  # exactly at an end
            return grid(0, L)

        def load():
            kind = rng.choice(["point", "point", "uniform", "linear", "moment"])
            if kind == "point":
                return ("point", position(), Fraction(rng.randint(-20, 60) * 1000))
            if kind == "moment":
                return ("moment", position(), Fraction(rng.choice([-1, 1]) * rng.randint(5, 50) * 1000))
            a, b = sorted((position(), position()))
            if a == b:
                b = L if a < L else Fraction(0)
                a, b = sorted((a, b))
            if kind == "uniform":
                return ("uniform", a, b, Fraction(rng.randint(-5, 20) * 1000))
            return ("linear", a, b, Fraction(rng.randint(-5, 20) * 1000),
                    Fraction(rng.randint(-5, 20) * 1000))

        n_cases = 1 if n % 3 else rng.randint(2, 3)
        cases = [[load() for _ in range(rng.randint(3, 7))] for _ in range(n_cases)]
        factors = None
        if n_cases > 1:
            factors = [Fraction(rng.choice([9, 10, 12, 16, 5, 0])) / 10 for _ in range(n_cases)]
            if all(f == 0 for f in factors):
                factors[0] = Fraction(12, 10)
        E, I = materials[n % len(materials)]
        beams.append(Beam("beam %d (%s)" % (n + 1, kind), L, E, I, sups, cases, factors))
    return beams


def run_dump(dump, text):
    proc = subprocess.run([dump], input=text, capture_output=True, text=True)
    if proc.returncode not in (0, 3):
        raise RuntimeError("beam-dump failed (%d): %s" % (proc.returncode, proc.stderr))
    return proc.stdout.splitlines()


def check_beam(dump, beam, rng):
    sol = exact_solution(beam)
    L = sol["L"]
    # every break point, the middle of every piece, a few points anywhere
    pts = set(Fraction(int(p.p), int(p.q)) for p in sol["breaks"])
    brk = sorted(pts)
    for lo, hi in zip(brk[:-1], brk[1:]):
        pts.add((lo + hi) / 2)
    for _ in range(12):
        pts.add(Fraction(rng.randint(0, int(beam.L * 1024)), 1024))
    evals = sorted(pts)
    # the whole member, and a part of it between two break points inside
    ranges = [(Fraction(0), beam.L)]
    if len(brk) > 3:
        i = rng.randint(1, len(brk) - 3)
        ranges.append((brk[i], brk[rng.randint(i + 1, len(brk) - 2)]))

    lines = run_dump(dump, beam.text(evals, ranges))
    if lines and lines[0].startswith("error"):
        return ["engine refused it: " + lines[0]]

    got_r = [list(map(float, l.split()[1:])) for l in lines if l.startswith("reaction")]
    got_v = {}
    for l in lines:
        if l.startswith("value"):
            f = l.split()
            got_v[(Fraction(f[1]), f[2])] = list(map(float, f[3:]))
    got_e = [list(map(float, l.split()[1:])) for l in lines if l.startswith("extremes")]

    exact = {}
    for x0 in evals:
        for side in ("left", "right"):
            if (x0 == 0 and side == "left") or (x0 == beam.L and side == "right"):
                exact[(x0, side)] = (sp.Integer(0), sp.Integer(0)) + values_at(sol, x0, "right" if x0 == 0 else "left")[2:]
            else:
                exact[(x0, side)] = values_at(sol, x0, side)

    names = ("V", "M", "theta", "deflection")
    scale = [max(abs(float(v[i])) for v in exact.values()) or 1.0 for i in range(4)]
    errors = []

    if len(got_r) != len(sol["reactions"]):
        errors.append("%d reactions, expected %d" % (len(got_r), len(sol["reactions"])))
    else:
        rs = max(abs(float(r[1])) for r in sol["reactions"]) or 1.0
        ms = max(scale[1], max(abs(float(r[2])) for r in sol["reactions"]))
        for (x0, f, c), g in zip(sol["reactions"], got_r):
            if abs(g[0] - float(x0)) > 0 or abs(g[1] - float(f)) > TOL * rs or \
               abs(g[2] - float(c)) > TOL * ms:
                errors.append("reaction at %s: got %r %r, exact %s %s" % (x0, g[1], g[2], f, c))

    for key, ex in exact.items():
        g = got_v.get(key)
        if g is None:
            errors.append("no value at %s %s" % key)
            continue
        for i in range(4):
            if abs(g[i] - float(ex[i])) > TOL * scale[i]:
                errors.append("%s at x = %s (%s): got %r, exact %s" %
                              (names[i], float(key[0]), key[1], g[i], float(ex[i])))

    for (a, b), g in zip(ranges, got_e):
        ex = extremes(sol, a, b)
        pairs = (("V_max", g[2], g[3], 0), ("V_min", g[4], g[5], 0), ("M_max", g[6], g[7], 1),
                 ("M_min", g[8], g[9], 1), ("down", g[10], g[11], 3), ("up", g[12], g[13], 3))
        for name, val, xat, qi in pairs:
            if abs(val - float(ex[name])) > TOL * scale[qi]:
                errors.append("%s over [%s, %s]: got %r, exact %s" % (name, float(a), float(b),
                                                                       val, float(ex[name])))
                continue
            if val == 0 and name in ("down", "up"):
                continue
            # the reported location must attain the value (from one side or the other)
            xr = sp.Rational(repr(xat))
            if xr < a or xr > b:
                errors.append("%s over [%s, %s] located outside it, at %r" % (name, float(a), float(b), xat))
                continue
            sign = -1 if name == "up" else 1
            attained = []
            for side in ("left", "right"):
                if (xr == a and side == "left" and a < b) or (xr == b and side == "right" and a < b):
                    continue
                if (xr == 0 and side == "left") or (xr == L and side == "right"):
                    continue
                attained.append(sign * float(values_at(sol, xr, side)[qi]))
            if not any(abs(v - val) <= TOL * scale[qi] for v in attained):
                errors.append("%s over [%s, %s] = %r is not attained at its x = %r (%r)" %
                              (name, float(a), float(b), val, xat, attained))
    return errors


def check_unstable(dump):
    cases = [
        ("no support", "beam 6 200e9 0.0001\npoint 3 1000\n"),
        ("a single pin", "beam 6 200e9 0.0001\nsupport 2 pin\npoint 3 1000\n"),
        ("a single roller", "beam 6 200e9 0.0001\nsupport 6 roller\n"),
        ("two pins at one point", "beam 6 200e9 0.0001\nsupport 3 pin\nsupport 3 roller\n"),
    ]
    errors = []
    for name, text in cases:
        lines = run_dump(dump, text)
        if not lines or not lines[0].startswith("error unstable"):
            errors.append("%s: not refused as unstable: %r" % (name, lines[:1]))
    return errors


def main():
    if len(sys.argv) != 2:
        print("usage: sympy_beams.py <path of beam-dump>", file=sys.stderr)
        return 2
    dump = sys.argv[1]
    rng = random.Random(20260317)
    passed = failed = 0
    for beam in make_beams(rng):
        try:
            errors = check_beam(dump, beam, rng)
        except Exception as exc:  # a crash of the check is a failure, not a pass
            errors = ["check raised %r" % exc]
        if errors:
            failed += 1
            print("FAIL %s" % beam.name)
            for e in errors[:12]:
                print("    " + e)
            if len(errors) > 12:
                print("    ... and %d more" % (len(errors) - 12))
        else:
            passed += 1
            print("ok   %s" % beam.name)
    errors = check_unstable(dump)
    if errors:
        failed += 1
        print("FAIL mechanisms")
        for e in errors:
            print("    " + e)
    else:
        passed += 1
        print("ok   mechanisms refused as unstable")
    print("%d passed, %d failed" % (passed, failed))
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main())
