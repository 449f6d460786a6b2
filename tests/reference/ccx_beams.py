#!/usr/bin/env python3
# SPDX-FileCopyrightText: 2026 The Trabeate developers
# SPDX-License-Identifier: GPL-3.0-or-later
"""Outside check of the beam engine against CalculiX (ccx).

Usage:
  ccx_beams.py TRABEATE-CLI            generated beams: CLI --json against ccx (the meson test)
  ccx_beams.py --self-check            only the ccx model against closed-form beams
  ccx_beams.py --solve-list IN OUT     ccx on the beams described in IN (the benchmark's helper)

The CalculiX model of a beam
----------------------------
- A straight line of B32 elements (3-node quadratic beam elements) along the global x axis, the
  load acting in the x-y plane. ccx expands each B32 into a 20-node brick internally.
- Mesh: a target element length of L/300 (about 300 elements per beam), each interval between
  key points (ends, supports, load points and load ends) cut into equal elements, at least 5,
  so there is a node at every key point.
- Section: a square *BEAM SECTION, SECTION=RECT, of side h = (L/300)/2 (bricks of aspect 2
  along the beam: thinner ones lose accuracy in ccx's solver, 0.1-1 % at aspect 8), with an
  elastic modulus E' = EI / (h^4/12) so that E'I' equals the beam's EI, and Poisson's ratio 0.
  Shear deformation is then negligible: for a rectangle with nu = 0 it adds about
  0.6 (h/span)^2 to a cantilever's deflection, a few 1e-4 at most for the shortest spans here.
- Supports: every support holds DOF 2 (y) and 3 (z); the first also holds 1 (x) and 4 (torsion);
  a fixed support also holds 5 and 6 (rotations). Roller and pin are alike in a beam with no
  axial load.
- Loads: one model per load case, run on its own (with a *STEP per case in one model, ccx 2.20
  gave section forces up to several per cent off near supports and point loads in the second
  and later steps, while the first step of every model is as exact as the self-check shows).
  Point loads are nodal forces on DOF 2 and applied moments nodal moments on DOF 6 (sign
  flipped: ours are clockwise +, DOF 6 is counter-clockwise +); distributed loads are the
  consistent nodal forces of each element, integrated exactly with the element's quadratic
  shape functions (Simpson's rule is exact for a quadratic shape function times a linear
  load).
- Output read back: U (y) of every node from the .dat file (deflections); RF (y) of the support
  nodes from the .dat file, less the load applied at that node, gives the reaction force; the
  bending moment comes from the section forces (*EL FILE, SECTION FORCES) in the .frd file. ccx
  averages element values at nodes and fills mid-side nodes by interpolation, so only corner
  nodes are read, and at every key point the moment just left and just right of it is
  extrapolated (cubic, from the four corner nodes on that side: exact for the cubic M of a
  linear load), which keeps jumps at applied moments and the local disturbance at supports
  out of it. A fixed support's reaction moment is the jump of M across it. An extreme that
  falls between nodes (inside a span under a distributed load) is taken at the vertex of the
  parabola through the extreme node and its two neighbours.
- Where every reaction of a load case is zero (a cantilever loaded by a couple alone), the
  force scale is the largest moment over the beam's length.

Tolerances: reactions and extreme moments within 0.5 %, deflections within 1 %, each relative
to the largest magnitude of that quantity in the beam's load case.
"""

import argparse
import concurrent.futures
import json
import math
import os
import random
import resource
import shutil
import subprocess
import sys
import tempfile
import time
import xml.sax.saxutils

# Exact definitions of the US customary units (NIST SP 811, Appendix B).
FT = 0.3048          # m
INCH = 0.0254        # m
LBF = 4.4482216152605  # N
KIP = 1000.0 * LBF
KSI = KIP / INCH ** 2
SI_KN = 1000.0
SI_GPA = 1.0e9
SI_MM4 = 1.0e-12

TOL_FORCE = 0.005
TOL_MOMENT = 0.005
TOL_DEFL = 0.01

ELEMS_PER_BEAM = 300
MIN_ELEMS_PER_INTERVAL = 5
SEED = 20260314
N_BEAMS = 24


# ---------------------------------------------------------------------------------------------
# Beams: plain dictionaries in SI, with the text the project file shows for each quantity.
#   {"id", "length", "E", "I", "supports": [(x, type)], "loads": [load], "text": {...}}
#   load: {"case", "kind" ("point", "uniform", "linear", "moment"), "a", "b", "w1", "w2"}
#   (point: a = b = position, w1 = P; moment: w1 = m clockwise +; uniform: w1 = w2).
# ---------------------------------------------------------------------------------------------

class UnitSystem:
    def __init__(self, us):
        self.us = us
        if us:
            self.grid = 0.5 * FT     # positions on half-feet
            self.len_u, self.len_f = "ft", FT
            self.p_u, self.p_f = "kip", KIP
            self.w_u, self.w_f = "kip/ft", KIP / FT
            self.m_u, self.m_f = "kip*ft", KIP * FT
        else:
            self.grid = 0.1            # positions on 100 mm
            self.len_u, self.len_f = "m", 1.0
            self.p_u, self.p_f = "kN", SI_KN
            self.w_u, self.w_f = "kN/m", SI_KN
            self.m_u, self.m_f = "kN*m", SI_KN

    def length(self, n_grid):
        """A position n_grid grid steps from the left end: (text, metres)."""
        v = n_grid * self.grid / self.len_f
        v = round(v, 6)
        return "%s %s" % (fmt_num(v), self.len_u), v * self.len_f


def fmt_num(v):
    s = ("%.6f" % v).rstrip("0").rstrip(".")
    return s if s not in ("", "-0") else "0"


def make_beam(rng, index):
    """One random beam; the support layout cycles so that every kind appears."""
    us = index % 2 == 0
    u = UnitSystem(us)
    layouts = ["simple", "overhang-right", "overhang-left", "overhang-both", "cantilever-left",
               "cantilever-right", "propped", "fixed-fixed", "continuous", "continuous-overhang",
               "fixed-continuous", "continuous"]
    layout = layouts[index % len(layouts)]

    def span():
        # 8-30 ft or 2.5-9 m, on the grid
        return rng.randint(16, 60) if us else rng.randint(25, 90)

    def overhang():
        return rng.randint(3, 14) if us else rng.randint(8, 25)

    sup = []   # (grid position, type)
    if layout == "simple":
        s = span()
        sup = [(0, "pin"), (s, "roller")]
        n = s
    elif layout == "overhang-right":
        s, o = span(), overhang()
        sup = [(0, "pin"), (s, "roller")]
        n = s + o
    elif layout == "overhang-left":
        s, o = span(), overhang()
        sup = [(o, "pin"), (o + s, "roller")]
        n = o + s
    elif layout == "overhang-both":
        s, o1, o2 = span(), overhang(), overhang()
        sup = [(o1, "roller"), (o1 + s, "pin")]
        n = o1 + s + o2
    elif layout == "cantilever-left":
        n = overhang() + rng.randint(4, 20)
        sup = [(0, "fixed")]
    elif layout == "cantilever-right":
        n = overhang() + rng.randint(4, 20)
        sup = [(n, "fixed")]
    elif layout == "propped":
        s = span()
        sup = [(0, "fixed"), (s, "roller")] if rng.random() < 0.5 else [(0, "pin"), (s, "fixed")]
        n = s
    elif layout == "fixed-fixed":
        s = span()
        sup = [(0, "fixed"), (s, "fixed")]
        n = s
    elif layout in ("continuous", "continuous-overhang"):
        n_spans = rng.randint(2, 4)
        o1 = overhang() if layout == "continuous-overhang" and rng.random() < 0.7 else 0
        o2 = (overhang() if layout == "continuous-overhang" and (o1 == 0 or rng.random() < 0.5)
              else 0)
        x = o1
        sup = [(x, rng.choice(["pin", "roller"]))]
        for _ in range(n_spans):
            x += span()
            sup.append((x, rng.choice(["pin", "roller"])))
        n = x + o2
    elif layout == "fixed-continuous":
        n_spans = rng.randint(1, 3)
        x = 0
        sup = [(0, "fixed")]
        for _ in range(n_spans):
            x += span()
            sup.append((x, "roller"))
        o2 = overhang() if rng.random() < 0.5 else 0
        n = x + o2
    else:
        raise AssertionError(layout)

    length_text, length = u.length(n)
    if us:
        e_ksi = rng.choice([29000.0, 1600.0, 1800.0])
        i_in4 = float(rng.randint(20, 300) * 5)
        E, e_text = e_ksi * KSI, "%s ksi" % fmt_num(e_ksi)
        I, i_text = i_in4 * INCH ** 4, "%s in4" % fmt_num(i_in4)
    else:
        e_gpa = rng.choice([200.0, 12.0, 11.0])
        i_mm4 = rng.randint(10, 500) * 1.0e6
        E, e_text = e_gpa * SI_GPA, "%s GPa" % fmt_num(e_gpa)
        I, i_text = i_mm4 * SI_MM4, "%.4g mm4" % i_mm4

    # Key points stay either equal or at least 2 grid steps (1 ft, 200 mm) apart, so every
    # interval of the mesh holds several elements and the one-sided extrapolation has room.
    keys = {0, n} | {p for p, _ in sup}

    def free_pos(lo, hi, tries=200):
        for _ in range(tries):
            p = rng.randint(lo, hi)
            if all(p == k or abs(p - k) >= 2 for k in keys):
                return p
        return None

    cases = ["D", "L"] if rng.random() < 0.6 else ["D", "L", "Lr"]
    loads = []
    n_loads = rng.randint(2, 6)
    kinds = ["point", "uniform-full", "uniform-part", "linear", "moment"]
    for j in range(n_loads):
        case = cases[j % len(cases)] if j < len(cases) else rng.choice(cases)
        kind = kinds[(index + j) % len(kinds)] if j < 2 else rng.choice(kinds)
        if kind in ("point", "moment"):
            p = free_pos(0, n)
            if p is None:
                continue
            keys.add(p)
            if kind == "point":
                v = rng.randint(1, 40) * 0.5 if us else rng.randint(2, 80)
                loads.append({"case": case, "kind": "point", "a": p, "b": p, "v1": v, "v2": v})
            else:
                v = rng.randint(2, 60) * 0.5 if us else rng.randint(3, 80)
                v = v if rng.random() < 0.6 else -v
                loads.append({"case": case, "kind": "moment", "a": p, "b": p, "v1": v, "v2": v})
        elif kind == "uniform-full":
            v = rng.randint(1, 40) * 0.05 if us else rng.randint(1, 30) * 1.0
            loads.append({"case": case, "kind": "uniform", "a": 0, "b": n, "v1": v, "v2": v})
        else:
            a = free_pos(0, n - 2)
            if a is None:
                continue
            keys.add(a)
            b = free_pos(a + 2, n)
            if b is None:
                keys.discard(a)
                continue
            keys.add(b)
            v1 = rng.randint(1, 40) * 0.05 if us else rng.randint(1, 30) * 1.0
            if kind == "uniform-part":
                loads.append({"case": case, "kind": "uniform", "a": a, "b": b, "v1": v1, "v2": v1})
            else:
                v2 = rng.randint(0, 40) * 0.05 if us else rng.randint(0, 30) * 1.0
                loads.append({"case": case, "kind": "linear", "a": a, "b": b, "v1": v1, "v2": v2})

    beam = {"id": "B%d" % (index + 1), "layout": layout, "length": length, "E": E, "I": I,
            "supports": [], "loads": [], "xml": None}
    sup_xml = []
    for p, t in sup:
        text, x = u.length(p)
        beam["supports"].append((x, t))
        sup_xml.append('    <support at="%s" type="%s"/>' % (text, t))
    load_xml = []
    for ld in loads:
        at, a = u.length(ld["a"])
        bt, b = u.length(ld["b"])
        k = ld["kind"]
        if k == "point":
            w1 = ld["v1"] * u.p_f
            load_xml.append('    <load case="%s" type="point" at="%s" p="%s %s"/>'
                            % (ld["case"], at, fmt_num(ld["v1"]), u.p_u))
        elif k == "moment":
            w1 = ld["v1"] * u.m_f
            load_xml.append('    <load case="%s" type="moment" at="%s" m="%s %s"/>'
                            % (ld["case"], at, fmt_num(ld["v1"]), u.m_u))
        elif k == "uniform":
            w1 = ld["v1"] * u.w_f
            load_xml.append('    <load case="%s" type="uniform" from="%s" to="%s" w="%s %s"/>'
                            % (ld["case"], at, bt, fmt_num(ld["v1"]), u.w_u))
        else:
            w1 = ld["v1"] * u.w_f
            load_xml.append('    <load case="%s" type="linear" from="%s" to="%s" w1="%s %s" '
                            'w2="%s %s"/>' % (ld["case"], at, bt, fmt_num(ld["v1"]), u.w_u,
                                              fmt_num(ld["v2"]), u.w_u))
        factor = {"uniform": u.w_f, "linear": u.w_f, "point": u.p_f, "moment": u.m_f}[k]
        w2 = ld["v2"] * factor
        beam["loads"].append({"case": ld["case"], "kind": k, "a": a, "b": b, "w1": w1, "w2": w2})
    beam["xml"] = ('  <beam id="%s" length="%s" material="custom" section="custom" E="%s" '
                   'I="%s">\n' % (beam["id"], length_text, e_text, i_text)
                   + "\n".join(sup_xml + load_xml) + "\n  </beam>\n")
    return beam


def project_xml(beams):
    return ('<?xml version="1.0" encoding="UTF-8"?>\n<trabeate-project format="1">\n'
            + "".join(b["xml"] for b in beams) + "</trabeate-project>\n")


def beam_cases(beam):
    seen = []
    for ld in beam["loads"]:
        if ld["case"] not in seen:
            seen.append(ld["case"])
    return seen


# ---------------------------------------------------------------------------------------------
# The CalculiX model
# ---------------------------------------------------------------------------------------------

class CcxModel:
    """Mesh, input deck and result reading for one beam, one *STEP per load case."""

    def __init__(self, beam, cases):
        self.beam = beam
        self.cases = cases
        L = beam["length"]
        keys = {0.0, L}
        keys.update(x for x, _ in beam["supports"])
        for ld in beam["loads"]:
            if ld["case"] in cases:
                keys.add(ld["a"])
                keys.add(ld["b"])
        keys = sorted(keys)
        # merge key points closer than a rounding error (same position written two ways)
        merged = [keys[0]]
        for k in keys[1:]:
            if k - merged[-1] > 1e-9 * L:
                merged.append(k)
        merged[-1] = L
        self.keys = merged
        le_target = L / ELEMS_PER_BEAM
        xs = [0.0]
        self.key_index = {0.0: 0}        # key point -> index in corner list
        for a, b in zip(merged, merged[1:]):
            n = max(MIN_ELEMS_PER_INTERVAL, math.ceil((b - a) / le_target - 1e-9))
            for k in range(1, n + 1):
                xs.append(a + (b - a) * k / n if k < n else b)
            self.key_index[b] = len(xs) - 1
        self.corners = xs                # corner node i has ccx id 2 i + 1
        self.n_elems = len(xs) - 1
        self.h = le_target / 2.0
        self.E_model = beam["E"] * beam["I"] / (self.h ** 4 / 12.0)

    def corner_id(self, x):
        return 2 * self.key_index[self.key_of(x)] + 1

    def key_of(self, x):
        k = min(self.keys, key=lambda k: abs(k - x))
        assert abs(k - x) <= 1e-9 * self.beam["length"] + 1e-12
        return k

    def nodal_loads(self, case):
        """{node id: [Fy, Mz]} in ccx's axes (y up, Mz counter-clockwise)."""
        f = {}

        def add(node, dof, v):
            f.setdefault(node, [0.0, 0.0])[dof] += v

        xs = self.corners
        for ld in self.beam["loads"]:
            if ld["case"] != case:
                continue
            k = ld["kind"]
            if k == "point":
                add(self.corner_id(ld["a"]), 0, -ld["w1"])
            elif k == "moment":
                add(self.corner_id(ld["a"]), 1, -ld["w1"])
            else:
                a, b, w1, w2 = ld["a"], ld["b"], ld["w1"], ld["w2"]
                i0, i1 = self.key_index[self.key_of(a)], self.key_index[self.key_of(b)]

                def w(x):
                    return w1 + (w2 - w1) * (x - a) / (b - a) if b > a else w1

                for e in range(i0, i1):
                    x0, x2 = xs[e], xs[e + 1]
                    le = x2 - x0
                    # consistent loads of a quadratic element under a linear load (Simpson)
                    add(2 * e + 1, 0, -le / 6.0 * w(x0))
                    add(2 * e + 2, 0, -le * 2.0 / 3.0 * w(0.5 * (x0 + x2)))
                    add(2 * e + 3, 0, -le / 6.0 * w(x2))
        return f

    def deck(self):
        b = self.beam
        out = ["** beam %s: %d B32 elements, h = %.6g m" % (b["id"], self.n_elems, self.h),
               "*NODE, NSET=NALL"]
        xs = self.corners
        nid = 1
        for i, x in enumerate(xs):
            out.append("%d, %.15g, 0, 0" % (nid, x))
            nid += 1
            if i + 1 < len(xs):
                out.append("%d, %.15g, 0, 0" % (nid, 0.5 * (x + xs[i + 1])))
                nid += 1
        out.append("*ELEMENT, TYPE=B32, ELSET=EALL")
        for e in range(self.n_elems):
            out.append("%d, %d, %d, %d" % (e + 1, 2 * e + 1, 2 * e + 2, 2 * e + 3))
        out += ["*NSET, NSET=NSUP"]
        out += ["%d," % self.corner_id(x) for x, _ in b["supports"]]
        out += ["*MATERIAL, NAME=BEAM", "*ELASTIC", "%.15g, 0" % self.E_model,
                "*BEAM SECTION, ELSET=EALL, MATERIAL=BEAM, SECTION=RECT",
                "%.15g, %.15g" % (self.h, self.h), "0, 0, -1", "*BOUNDARY"]
        for k, (x, t) in enumerate(b["supports"]):
            dofs = [2, 3] + ([1, 4] if k == 0 else []) + ([5, 6] if t == "fixed" else [])
            for d in sorted(dofs):
                out.append("%d, %d, %d" % (self.corner_id(x), d, d))
        for case in self.cases:
            out += ["*STEP", "*STATIC", "*CLOAD, OP=NEW"]
            loads = self.nodal_loads(case)
            wrote = False
            for node in sorted(loads):
                fy, mz = loads[node]
                if fy != 0.0:
                    out.append("%d, 2, %.15g" % (node, fy))
                    wrote = True
                if mz != 0.0:
                    out.append("%d, 6, %.15g" % (node, mz))
                    wrote = True
            if not wrote:
                out.append("1, 2, 0")
            out += ["*NODE PRINT, NSET=NALL", "U", "*NODE PRINT, NSET=NSUP", "RF",
                    "*EL FILE, SECTION FORCES, OUTPUT=2D", "S", "*END STEP"]
        return "\n".join(out) + "\n"

    def read(self, workdir, name):
        """Per case: {"reactions": [(x, force, moment)], "M": [(x, M)], "defl": [(x, d)]}."""
        disp_blocks, force_blocks = [], []
        cur = None
        with open(os.path.join(workdir, name + ".dat")) as f:
            for line in f:
                if line.startswith(" displacements"):
                    cur = {}
                    disp_blocks.append(cur)
                    continue
                if line.startswith(" forces"):
                    cur = {}
                    force_blocks.append(cur)
                    continue
                p = line.split()
                if len(p) == 4 and cur is not None:
                    cur[int(p[0])] = tuple(float(v) for v in p[1:])
        stress_blocks = []
        cur = None
        with open(os.path.join(workdir, name + ".frd")) as f:
            for line in f:
                if line.startswith(" -4  STRESS"):
                    cur = {}
                    stress_blocks.append(cur)
                    continue
                if cur is not None:
                    if line.startswith(" -3"):
                        cur = None
                    elif line.startswith(" -1"):
                        n = int(line[3:13])
                        cur[n] = [float(line[13 + 12 * k:25 + 12 * k]) for k in range(6)]
        if not (len(disp_blocks) == len(force_blocks) == len(stress_blocks) == len(self.cases)):
            raise RuntimeError("ccx output has %d/%d/%d result blocks for %d load cases"
                               % (len(disp_blocks), len(force_blocks), len(stress_blocks),
                                  len(self.cases)))
        results = {}
        xs = self.corners
        for ci, case in enumerate(self.cases):
            U, RF, S = disp_blocks[ci], force_blocks[ci], stress_blocks[ci]
            loads = self.nodal_loads(case)
            # deflection, downward +, at every node (mid-side ones too)
            defl = []
            for i, x in enumerate(xs):
                defl.append((x, -U[2 * i + 1][1]))
                if i + 1 < len(xs):
                    defl.append((0.5 * (x + xs[i + 1]), -U[2 * i + 2][1]))
            # bending moment, sagging +: the section force in the 5th column is -M with the
            # section's 1-direction along -z (checked against closed forms by --self-check)
            m_corner = [-S[2 * i + 1][4] for i in range(len(xs))]
            key_set = set(self.key_index[k] for k in self.keys)

            def side(i, step):
                # cubic extrapolation to corner i from the four corners beyond it on one side
                f = [m_corner[i + k * step] for k in (1, 2, 3, 4)]
                return 4.0 * f[0] - 6.0 * f[1] + 4.0 * f[2] - f[3]

            # (x, M, side) in order: side is "L" or "R" for the values just left and right of
            # a key point, None elsewhere
            moments = []
            left_right = {}
            for i, x in enumerate(xs):
                if i in key_set:
                    ml = side(i, -1) if i > 0 else None
                    mr = side(i, +1) if i < len(xs) - 1 else None
                    left_right[i] = (ml, mr)
                    moments += [(x, v, sd) for v, sd in ((ml, "L"), (mr, "R")) if v is not None]
                else:
                    moments.append((x, m_corner[i], None))
            reactions = []
            for x, t in self.beam["supports"]:
                node = self.corner_id(x)
                applied = loads.get(node, [0.0, 0.0])[0]
                force = RF[node][1] - applied
                moment = 0.0
                if t == "fixed":
                    ml, mr = left_right[self.key_index[self.key_of(x)]]
                    ml = 0.0 if ml is None else ml
                    mr = 0.0 if mr is None else mr
                    # a counter-clockwise couple R on the beam makes M drop by R passing it,
                    # less any applied moment at the same point (which makes M rise by m)
                    m_applied = -loads.get(node, [0.0, 0.0])[1]
                    moment = ml - mr + m_applied
                reactions.append((x, force, moment))
            results[case] = {"reactions": reactions, "M": moments, "defl": defl}
        return results


def ccx_env():
    env = dict(os.environ)
    env["OMP_NUM_THREADS"] = "1"
    env["CCX_NPROC_EQUATION_SOLVER"] = "1"
    env["CCX_NPROC_RESULTS"] = "1"
    env["CCX_NPROC_STIFFNESS"] = "1"
    return env


def run_ccx(beam, cases, workdir):
    """Runs ccx on one beam, one model per load case; returns (results per case, (wall, cpu)
    seconds spent in ccx, largest number of elements)."""
    results, wall, cpu, n_elems = {}, 0.0, 0.0, 0
    for case in cases:
        model = CcxModel(beam, [case])
        name = "beam-" + case
        with open(os.path.join(workdir, name + ".inp"), "w") as f:
            f.write(model.deck())
        t0 = time.monotonic()
        u0 = resource.getrusage(resource.RUSAGE_CHILDREN)
        r = subprocess.run(["ccx", "-i", name], cwd=workdir, capture_output=True, text=True,
                           env=ccx_env())
        u1 = resource.getrusage(resource.RUSAGE_CHILDREN)
        wall += time.monotonic() - t0
        # children's CPU time: exact here when one ccx runs at a time (--solve-list)
        cpu += (u1.ru_utime - u0.ru_utime) + (u1.ru_stime - u0.ru_stime)
        if r.returncode != 0 or "*ERROR" in r.stdout:
            tail = "\n".join(l for l in r.stdout.splitlines() if "ERROR" in l)
            raise RuntimeError("ccx failed on %s, case %s: %s"
                               % (beam["id"], case, tail or r.stderr[-500:]))
        results.update(model.read(workdir, name))
        n_elems = max(n_elems, model.n_elems)
    return results, (wall, cpu), n_elems


def peak(points, sign, window):
    """The largest sign * value of (x, value, ...) points, refined by the parabola through the
    three points window(i) gives around the peak point i (None: no refinement) when its vertex
    lies between them."""
    i = max(range(len(points)), key=lambda k: sign * points[k][1])
    best = points[i][1]
    w = window(i)
    if w is not None and w[0] >= 0 and w[1] < len(points):
        (x0, f0), (x1, f1), (x2, f2) = [p[:2] for p in points[w[0]:w[1] + 1]]
        # Newton form of the parabola through the three points
        d01 = (f1 - f0) / (x1 - x0)
        d12 = (f2 - f1) / (x2 - x1)
        c = (d12 - d01) / (x2 - x0)
        if c != 0.0:
            xv = 0.5 * (x0 + x1) - d01 / (2.0 * c)
            if x0 < xv < x2:
                fv = f0 + d01 * (xv - x0) + c * (xv - x0) * (xv - x1)
                if sign * fv > sign * best:
                    best = fv
    return best


def extremes(res):
    m, d = res["M"], res["defl"]

    def m_window(i):
        # M is smooth between key points only: stay on the side of the key point
        side = m[i][2]
        return (i - 1, i + 1) if side is None else (i, i + 2) if side == "R" else (i - 2, i)

    def d_window(i):
        # the deflection is smooth everywhere
        return (i - 1, i + 1)

    return {"M_max": peak(m, +1, m_window), "M_min": peak(m, -1, m_window),
            "defl_down": max(0.0, peak(d, +1, d_window)),
            "defl_up": max(0.0, -peak(d, -1, d_window))}


# ---------------------------------------------------------------------------------------------
# The ccx model against closed-form beams (run first: a wrong model would void the comparison)
# ---------------------------------------------------------------------------------------------

def self_check(workdir):
    L, E, I = 6.0, 200.0e9, 1.0e-4     # EI = 2e7 N*m^2
    EI = E * I
    w, P, m = 10.0e3, 30.0e3, 40.0e3
    checks = []

    def beam(sup, loads):
        return {"id": "closed-form", "length": L, "E": E, "I": I, "supports": sup,
                "loads": [dict(ld, case="D") for ld in loads]}

    def uniform():
        return {"kind": "uniform", "a": 0.0, "b": L, "w1": w, "w2": w}

    # Closed forms: AISC Manual, 15th ed., Table 3-23 (from memory), cases as named.
    # Simple span, uniform load (case 1): R = wL/2 = 30 kN; M = wL^2/8 = 45 kN*m;
    # defl = 5wL^4/(384EI) = 5*10e3*1296/(384*2e7) = 8.4375 mm.
    r = run_ccx(beam([(0.0, "pin"), (L, "roller")], [uniform()]), ["D"], workdir)[0]["D"]
    e = extremes(r)
    checks += [("simple/uniform R", r["reactions"][0][1], w * L / 2),
               ("simple/uniform M", e["M_max"], w * L * L / 8),
               ("simple/uniform defl", e["defl_down"], 5 * w * L ** 4 / (384 * EI))]
    # Cantilever, point load at the free end (case 22): R = P; M = -PL = -180 kN*m;
    # support moment (counter-clockwise +) = PL; defl = PL^3/(3EI) = 30e3*216/(6e7) = 108 mm.
    r = run_ccx(beam([(0.0, "fixed")], [{"kind": "point", "a": L, "b": L, "w1": P, "w2": P}]),
                ["D"], workdir)[0]["D"]
    e = extremes(r)
    checks += [("cantilever/point R", r["reactions"][0][1], P),
               ("cantilever/point Rm", r["reactions"][0][2], P * L),
               ("cantilever/point M", e["M_min"], -P * L),
               ("cantilever/point defl", e["defl_down"], P * L ** 3 / (3 * EI))]
    # Fixed at both ends, uniform load (case 15): R = wL/2; M at the ends = -wL^2/12 = -30 kN*m,
    # at midspan wL^2/24 = 15 kN*m; defl = wL^4/(384EI) = 1.6875 mm; right support moment
    # (counter-clockwise +) = -wL^2/12.
    r = run_ccx(beam([(0.0, "fixed"), (L, "fixed")], [uniform()]), ["D"], workdir)[0]["D"]
    e = extremes(r)
    checks += [("fixed-fixed/uniform R", r["reactions"][1][1], w * L / 2),
               ("fixed-fixed/uniform Rm right", r["reactions"][1][2], -w * L * L / 12),
               ("fixed-fixed/uniform M-", e["M_min"], -w * L * L / 12),
               ("fixed-fixed/uniform M+", e["M_max"], w * L * L / 24),
               ("fixed-fixed/uniform defl", e["defl_down"], w * L ** 4 / (384 * EI))]
    # Propped cantilever (fixed left, roller right), uniform load (case 12): R_right = 3wL/8 =
    # 22.5 kN; R_left = 5wL/8 = 37.5 kN; M_fixed = -wL^2/8 = -45 kN*m; M+ = 9wL^2/128 =
    # 25.3125 kN*m. Deflection, from the roller end: y = w/(48EI) (L^3 x - 3 L x^3 + 2 x^4)
    # (same table); y' = 0 gives L^3 - 9 L x^2 + 8 x^3 = 0, x = L (1 + sqrt 33)/16, and
    # y(x) = (39 + 55 sqrt 33)/65536 wL^4/EI = wL^4/(184.6 EI) (the table rounds it to 185).
    xp = L * (1 + math.sqrt(33)) / 16
    d_propped = w / (48 * EI) * (L ** 3 * xp - 3 * L * xp ** 3 + 2 * xp ** 4)
    r = run_ccx(beam([(0.0, "fixed"), (L, "roller")], [uniform()]), ["D"], workdir)[0]["D"]
    e = extremes(r)
    checks += [("propped/uniform R right", r["reactions"][1][1], 3 * w * L / 8),
               ("propped/uniform R left", r["reactions"][0][1], 5 * w * L / 8),
               ("propped/uniform M-", e["M_min"], -w * L * L / 8),
               ("propped/uniform M+", e["M_max"], 9 * w * L * L / 128),
               ("propped/uniform defl", e["defl_down"], d_propped)]
    # Simple span, clockwise moment m at a = 2 m (statics, by hand): R_left = -m/L (down),
    # R_right = +m/L; M just left of a = -m a/L = -13.333 kN*m, just right = m (1 - a/L) =
    # 26.667 kN*m.
    a = 2.0
    r = run_ccx(beam([(0.0, "pin"), (L, "roller")],
                     [{"kind": "moment", "a": a, "b": a, "w1": m, "w2": m}]),
                ["D"], workdir)[0]["D"]
    e = extremes(r)
    checks += [("simple/moment R left", r["reactions"][0][1], -m / L),
               ("simple/moment M-", e["M_min"], -m * a / L),
               ("simple/moment M+", e["M_max"], m * (1 - a / L))]
    # Overhang, linear load from 0 at x = 0 to w at x = L over a pin at 0 and a roller at
    # 4.5 m (statics, by hand): total W = wL/2 = 30 kN at 2L/3 = 4 m, so R_right = 30*4/4.5 =
    # 26.667 kN and R_left = 3.333 kN.
    r = run_ccx(beam([(0.0, "pin"), (4.5, "roller")],
                     [{"kind": "linear", "a": 0.0, "b": L, "w1": 0.0, "w2": w}]),
                ["D"], workdir)[0]["D"]
    checks += [("overhang/linear R right", r["reactions"][1][1], 30.0e3 * 4.0 / 4.5),
               ("overhang/linear R left", r["reactions"][0][1], 30.0e3 - 30.0e3 * 4.0 / 4.5)]

    failed = 0
    for name, got, want in checks:
        tol = 0.001
        rel = abs(got - want) / abs(want)
        ok = rel <= tol
        failed += not ok
        print("self-check %-32s ccx %14.6g  closed form %14.6g  %8.4f %%  %s"
              % (name, got, want, 100 * rel, "ok" if ok else "FAILED"))
    return failed


# ---------------------------------------------------------------------------------------------
# The comparison
# ---------------------------------------------------------------------------------------------

def rel_err(got, want, scale):
    return abs(got - want) / scale if scale > 0 else abs(got - want)


def compare_case(ours, ref, beam):
    """Worst relative differences (force, moment, deflection) and a list of failures."""
    fails = []
    ext = extremes(ref)
    m_scale = max(abs(ext["M_max"]), abs(ext["M_min"]),
                  max([abs(r[2]) for r in ref["reactions"]] + [0.0]), 1e-9)
    rf_scale = max([abs(r[1]) for r in ref["reactions"]] + [m_scale / beam["length"]])
    d_scale = max(ext["defl_down"], ext["defl_up"], 1e-15)
    worst = {"force": 0.0, "moment": 0.0, "defl": 0.0}

    our_r = ours.get("reactions", [])
    if len(our_r) != len(ref["reactions"]):
        fails.append("%d reactions, ccx %d" % (len(our_r), len(ref["reactions"])))
    else:
        for o, (x, f, m) in zip(sorted(our_r, key=lambda r: r["x"]), ref["reactions"]):
            if abs(o["x"] - x) > 1e-6 * beam["length"]:
                fails.append("reaction at x = %.4f, ccx at %.4f" % (o["x"], x))
                continue
            e = rel_err(o["force"], f, rf_scale)
            worst["force"] = max(worst["force"], e)
            if e > TOL_FORCE:
                fails.append("R(%.3f) = %.6g N, ccx %.6g N" % (x, o["force"], f))
            e = rel_err(o.get("moment", 0.0), m, m_scale)
            worst["moment"] = max(worst["moment"], e)
            if e > TOL_MOMENT:
                fails.append("Rm(%.3f) = %.6g N*m, ccx %.6g N*m" % (x, o.get("moment", 0.0), m))
    for key, scale, tol, fam in (("M_max", m_scale, TOL_MOMENT, "moment"),
                                 ("M_min", m_scale, TOL_MOMENT, "moment"),
                                 ("defl_down", d_scale, TOL_DEFL, "defl"),
                                 ("defl_up", d_scale, TOL_DEFL, "defl")):
        if key not in ours:
            fails.append("no %s" % key)
            continue
        e = rel_err(ours[key], ext[key], scale)
        worst[fam] = max(worst[fam], e)
        if e > tol:
            fails.append("%s = %.6g, ccx %.6g" % (key, ours[key], ext[key]))
    return worst, fails


def coverage(beams):
    """One line saying what the generated beams hold."""
    kinds = {"point": 0, "uniform (whole)": 0, "uniform (part)": 0, "linear": 0, "moment": 0}
    spans = {}
    for b in beams:
        n = max(1, len(b["supports"]) - 1)
        spans[n] = spans.get(n, 0) + 1
        for ld in b["loads"]:
            k = ld["kind"]
            if k == "uniform":
                whole = ld["a"] == 0.0 and abs(ld["b"] - b["length"]) < 1e-9
                k = "uniform (whole)" if whole else "uniform (part)"
            kinds[k] += 1
    fixed = sum(any(t == "fixed" for _, t in b["supports"]) for b in beams)
    overhang = sum(b["supports"][0][0] > 0 or b["supports"][-1][0] < b["length"] for b in beams)
    return ("%d beams (seed %d): %s; %d with a fixed support, %d with an overhang or a free "
            "end; loads: %s" % (len(beams), SEED,
                                ", ".join("%d with %d span%s" % (spans[k], k, "s" * (k > 1))
                                          for k in sorted(spans)),
                                fixed, overhang,
                                ", ".join("%d %s" % (v, k) for k, v in kinds.items())))


def dry_run(workdir):
    """The generated beams through ccx alone: reactions against statics."""
    rng = random.Random(SEED)
    beams = [make_beam(rng, i) for i in range(N_BEAMS)]
    print(project_xml(beams))
    bad = 0
    for i, b in enumerate(beams):
        d = os.path.join(workdir, "dry-%02d" % i)
        os.mkdir(d)
        res, (sec, _), n_el = run_ccx(b, beam_cases(b), d)
        for case, r in res.items():
            # sum of loads and their moment about x = 0 (clockwise +)
            F = M = 0.0
            for ld in b["loads"]:
                if ld["case"] != case:
                    continue
                if ld["kind"] == "point":
                    F += ld["w1"]
                    M += ld["w1"] * ld["a"]
                elif ld["kind"] == "moment":
                    M += ld["w1"]
                else:
                    a, c, w1, w2 = ld["a"], ld["b"], ld["w1"], ld["w2"]
                    W = 0.5 * (w1 + w2) * (c - a)
                    xc = a + (c - a) * (w1 + 2 * w2) / (3 * (w1 + w2)) if w1 + w2 else a
                    F += W
                    M += W * xc
            RF = sum(f for _, f, _ in r["reactions"])
            # an upward force f at x turns the beam counter-clockwise by f x about x = 0, as
            # does a counter-clockwise reaction couple m
            RM = sum(f * x + m for x, f, m in r["reactions"])
            e = extremes(r)
            scale = max(abs(F), abs(M) / b["length"], max(abs(f) for _, f, _ in r["reactions"]))
            ok = (abs(RF - F) <= 1e-3 * scale
                  and abs(RM - M) <= 1e-3 * scale * b["length"])
            bad += not ok
            print("%s %-3s %-18s el %4d  %.2f s  sum R %12.6g (loads %12.6g)  "
                  "M %10.4g %10.4g  defl %9.3g %9.3g  %s"
                  % (b["id"], case, b["layout"], n_el, sec, RF, F, e["M_max"], e["M_min"],
                     e["defl_down"], e["defl_up"], "ok" if ok else "STATICS FAIL"))
    return 1 if bad else 0


def check_with_cli(cli, workdir, jobs):
    rng = random.Random(SEED)
    beams = [make_beam(rng, i) for i in range(N_BEAMS)]
    path = os.path.join(workdir, "beams.trabeate")
    with open(path, "w") as f:
        f.write(project_xml(beams))
    r = subprocess.run([cli, "check", path, "--json"], capture_output=True, text=True)
    try:
        doc = json.loads(r.stdout)
    except ValueError:
        print("trabeate-cli check --json gave no JSON (exit %d): %s"
              % (r.returncode, (r.stderr or r.stdout)[-800:]))
        return 0, len(beams)
    members = {m["id"]: m for m in doc.get("members", [])}
    print(coverage(beams))

    def solve(i):
        d = os.path.join(workdir, "ccx-%02d" % i)
        os.mkdir(d)
        b = beams[i]
        return run_ccx(b, beam_cases(b), d)

    with concurrent.futures.ThreadPoolExecutor(max_workers=jobs) as pool:
        futures = [pool.submit(solve, i) for i in range(len(beams))]
        ccx_results = []
        for fu in futures:
            try:
                ccx_results.append(fu.result())
            except Exception as ex:   # reported per beam below
                ccx_results.append(ex)

    passed = failed = 0
    worst_all = {"force": 0.0, "moment": 0.0, "defl": 0.0}
    print("%-5s %-20s %5s %3s %5s  %9s %9s %9s  %s" % ("beam", "layout", "spans", "ld",
                                                       "elems", "dR %", "dM %", "dDefl %",
                                                       "result"))
    for b, res in zip(beams, ccx_results):
        fails = []
        worst = {"force": 0.0, "moment": 0.0, "defl": 0.0}
        n_el = 0
        if isinstance(res, Exception):
            fails.append(str(res))
        else:
            ref, _, n_el = res
            m = members.get(b["id"])
            if m is None:
                fails.append("missing from the CLI's JSON")
            else:
                for case in beam_cases(b):
                    ours = m.get("cases", {}).get(case)
                    if ours is None:
                        fails.append("case %s missing" % case)
                        continue
                    w, f = compare_case(ours, ref[case], b)
                    fails += ["%s: %s" % (case, x) for x in f]
                    for k in worst:
                        worst[k] = max(worst[k], w[k])
        for k in worst:
            worst_all[k] = max(worst_all[k], worst[k])
        ok = not fails
        passed += ok
        failed += not ok
        print("%-5s %-20s %5d %3d %5d  %9.4f %9.4f %9.4f  %s"
              % (b["id"], b["layout"], len(b["supports"]) - 1 if len(b["supports"]) > 1 else 1,
                 len(b["loads"]), n_el, 100 * worst["force"], 100 * worst["moment"],
                 100 * worst["defl"], "ok" if ok else "FAILED: " + "; ".join(fails)))
    print("worst differences: reactions %.4f %%, moments %.4f %%, deflections %.4f %% "
          "(limits %.1f %%, %.1f %%, %.1f %%)"
          % (100 * worst_all["force"], 100 * worst_all["moment"], 100 * worst_all["defl"],
             100 * TOL_FORCE, 100 * TOL_MOMENT, 100 * TOL_DEFL))
    return passed, failed


# ---------------------------------------------------------------------------------------------
# The benchmark's helper: beams in a line format, ccx results back in a line format.
#   in:  "beam ID LENGTH E I"  "support X TYPE"  "load CASE KIND A B W1 W2"  (SI, one per line)
#   out: "beam ID WALL-SECONDS CPU-SECONDS ELEMS"  "case ID CASE M_MAX M_MIN DEFL_DOWN DEFL_UP"
#        "reaction ID CASE X FORCE MOMENT"
# ---------------------------------------------------------------------------------------------

def solve_list(inp, out, workdir):
    beams = []
    with open(inp) as f:
        for line in f:
            p = line.split()
            if not p:
                continue
            if p[0] == "beam":
                beams.append({"id": p[1], "length": float(p[2]), "E": float(p[3]),
                              "I": float(p[4]), "supports": [], "loads": []})
            elif p[0] == "support":
                beams[-1]["supports"].append((float(p[1]), p[2]))
            elif p[0] == "load":
                beams[-1]["loads"].append({"case": p[1], "kind": p[2], "a": float(p[3]),
                                           "b": float(p[4]), "w1": float(p[5]),
                                           "w2": float(p[6])})
    lines = []
    for i, b in enumerate(beams):
        d = os.path.join(workdir, "ccx-%04d" % i)
        os.mkdir(d)
        res, (wall, cpu), n_el = run_ccx(b, beam_cases(b), d)
        lines.append("beam %s %.9g %.9g %d" % (b["id"], wall, cpu, n_el))
        for case, r in res.items():
            e = extremes(r)
            lines.append("case %s %s %.15g %.15g %.15g %.15g"
                         % (b["id"], case, e["M_max"], e["M_min"], e["defl_down"], e["defl_up"]))
            for x, force, moment in r["reactions"]:
                lines.append("reaction %s %s %.15g %.15g %.15g"
                             % (b["id"], case, x, force, moment))
        shutil.rmtree(d)
    with open(out, "w") as f:
        f.write("\n".join(lines) + "\n")


def main():
    ap = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    ap.add_argument("cli", nargs="?", help="path to trabeate-cli")
    ap.add_argument("--self-check", action="store_true",
                    help="only check the ccx model against closed-form beams")
    ap.add_argument("--solve-list", nargs=2, metavar=("IN", "OUT"),
                    help="solve the beams listed in IN with ccx, write results to OUT")
    ap.add_argument("--dry-run", action="store_true",
                    help="no CLI: print the generated beams and check ccx's reactions by statics")
    ap.add_argument("--jobs", type=int, default=2, help="ccx runs at once (default 2)")
    ap.add_argument("--keep", action="store_true", help="keep the work directory")
    args = ap.parse_args()

    if shutil.which("ccx") is None:
        print("ccx (CalculiX) not found on PATH: install calculix-ccx")
        return 1
    workdir = tempfile.mkdtemp(prefix="trb-ccx-")
    try:
        if args.solve_list:
            solve_list(args.solve_list[0], args.solve_list[1], workdir)
            return 0
        t0 = time.monotonic()
        bad = self_check(workdir)
        if bad:
            print("the ccx model fails %d closed-form checks: not comparing" % bad)
            return 1
        if args.self_check:
            return 0
        if args.dry_run:
            return dry_run(workdir)
        if not args.cli:
            ap.error("give the path to trabeate-cli")
        passed, failed = check_with_cli(args.cli, workdir, args.jobs)
        print("took %.1f s" % (time.monotonic() - t0))
        print("%d passed, %d failed" % (passed, failed))
        return 0 if failed == 0 and passed > 0 else 1
    finally:
        if args.keep:
            print("work directory kept:", workdir)
        else:
            shutil.rmtree(workdir, ignore_errors=True)


if __name__ == "__main__":
    sys.exit(main())
