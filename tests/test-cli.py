#!/usr/bin/env python3
# SPDX-FileCopyrightText: 2026 The Trabeate developers
# SPDX-License-Identifier: GPL-3.0-or-later
#
# The headless command: exit codes, messages on bad input, the table's cautions, and the JSON
# contract (docs/cli.md), with the statics of every load case checked from the file itself.
#
# Usage: test-cli.py PATH-TO-trabeate-cli   (tests/data is found beside this script)

import csv
import glob
import io
import json
import math
import os
import re
import subprocess
import sys
import tempfile
import unittest
import xml.etree.ElementTree as ET

CLI = None
DATA = os.path.join(os.path.dirname(os.path.abspath(__file__)), 'data')
EXAMPLES = os.path.join(os.path.dirname(os.path.abspath(__file__)), '..', 'data', 'examples')

# Exact factors to SI (NIST SP 811 (2008) Appendix B: the foot is 0.3048 m and the pound-force
# 4.4482216152605 N, exactly).
FT = 0.3048
KIP = 4448.2216152605
LBF = 4.4482216152605
IN = 0.0254
UNITS = {
    'ft': FT,
    'kip': KIP,
    'kip/ft': KIP / FT,
    'lb/ft': LBF / FT,
    'kip*ft': KIP * FT,
}

CAUTION = ('Results are for design or review by a licensed engineer; local building codes '
           'govern.')
RESULT_KEYS = ['reactions', 'V_max', 'V_min', 'M_max', 'M_max_x', 'M_min', 'M_min_x',
               'defl_down', 'defl_down_x', 'defl_up', 'defl_up_x']


def quantity(text):
    """The few spellings the test files use; enough to redo their statics by hand."""
    m = re.fullmatch(r'\s*(-?[0-9.]+)\s*(\S+)\s*', text)
    assert m, text
    return float(m.group(1)) * UNITS[m.group(2)]


def run(*args, env=None):
    e = dict(os.environ)
    if env:
        e.update(env)
    p = subprocess.run([CLI] + list(args), capture_output=True, env=e, timeout=60)
    return p.returncode, p.stdout.decode('utf-8'), p.stderr.decode('utf-8')


def data(name):
    return os.path.join(DATA, name)


def applied(beam, case, length, self_weight):
    """Total downward force and its clockwise moment about x = 0 for one case."""
    force = 0.0
    moment = 0.0
    for load in beam.findall('load'):
        if load.get('case') != case:
            continue
        kind = load.get('type')
        if kind == 'point':
            a, p = quantity(load.get('at')), quantity(load.get('p'))
            force += p
            moment += p * a
        elif kind == 'uniform':
            a, b, w = quantity(load.get('from')), quantity(load.get('to')), quantity(load.get('w'))
            force += w * (b - a)
            moment += w * (b - a) * (a + b) / 2
        elif kind == 'linear':
            a, b = quantity(load.get('from')), quantity(load.get('to'))
            w1, w2 = quantity(load.get('w1')), quantity(load.get('w2'))
            # a rectangle of w1 and a triangle rising to w2 - w1 (centroid at 2/3 of b - a)
            f_rect, f_tri = w1 * (b - a), (w2 - w1) * (b - a) / 2
            force += f_rect + f_tri
            moment += f_rect * (a + b) / 2 + f_tri * (a + 2 * (b - a) / 3)
        elif kind == 'moment':
            moment += quantity(load.get('m'))
    if case == 'D' and self_weight > 0:
        force += self_weight * length
        moment += self_weight * length * length / 2
    return force, moment


class ExitCodes(unittest.TestCase):
    def test_version(self):
        code, out, err = run('--version')
        self.assertEqual(code, 0)
        self.assertRegex(out, r'^trabeate-cli [0-9]+\.[0-9]+\.[0-9]+\n$')

    def test_help(self):
        code, out, err = run('--help')
        self.assertEqual(code, 0)
        self.assertIn('trabeate-cli check FILE [--json] [--member ID]', out)
        self.assertIn('trabeate-cli schedule FILE [--csv] [--member ID]', out)

    def test_usage_errors(self):
        for args in [(), ('frobnicate',), ('check',), ('check', 'a', 'b'),
                     ('check', '--bogus', data('cli-pass.trabeate')), ('schedule',),
                     ('schedule', '--json', data('cli-pass.trabeate')),
                     ('check', '--csv', data('cli-pass.trabeate'))]:
            code, out, err = run(*args)
            self.assertEqual(code, 2, args)
            self.assertEqual(out, '', args)
            self.assertIn('Usage', err, args)

    def test_missing_file(self):
        code, out, err = run('check', data('no-such-file.trabeate'))
        self.assertEqual(code, 2)
        self.assertEqual(out, '')
        self.assertIn('no-such-file.trabeate', err)

    def test_pass(self):
        code, out, err = run('check', data('cli-pass.trabeate'))
        self.assertEqual(code, 0, out + err)
        self.assertEqual(err, '')
        # the caution opens and closes the table
        self.assertLess(out.index(CAUTION), out.index('Member SIMPLE'))
        self.assertGreater(out.rindex(CAUTION), out.rindex('Member OVERHANG'))
        self.assertIn('Not checked: connections', out)
        self.assertEqual(out.count('Status: passes'), 3)

    def test_fail(self):
        code, out, err = run('check', data('cli-fail.trabeate'))
        self.assertEqual(code, 1)
        self.assertIn('Status: FAILS', out)

    def test_unstable_and_unsupported(self):
        code, out, err = run('check', data('cli-unstable.trabeate'))
        self.assertEqual(code, 1)
        self.assertIn('UNSTABLE', out)
        self.assertIn('UNSUPPORTED', out)

    def test_not_designed(self):
        # checks the methods cannot make are never reported as passing
        code, out, err = run('check', data('cli-not-designed.trabeate'))
        self.assertEqual(code, 1)
        self.assertNotIn('passes', out)
        self.assertEqual(out.count('not designed -'), 2)

    def test_member(self):
        code, out, err = run('check', data('cli-pass.trabeate'), '--member', 'FIXED')
        self.assertEqual(code, 0)
        self.assertIn('Member FIXED', out)
        self.assertNotIn('Member SIMPLE', out)
        # one member of a file that fails as a whole can pass on its own, and the reverse
        code, out, err = run('check', '--member=ONE-PIN', data('cli-unstable.trabeate'))
        self.assertEqual(code, 1)
        code, out, err = run('check', data('cli-pass.trabeate'), '--member', 'NOPE', '--json')
        self.assertEqual(code, 2)
        self.assertEqual(out, '')
        self.assertIn('NOPE', err)

    def test_invalid_files(self):
        files = sorted(glob.glob(os.path.join(DATA, 'invalid', '*.trabeate')))
        self.assertGreaterEqual(len(files), 40)
        for path in files:
            with open(path, encoding='utf-8') as f:
                first = f.readline()
            m = re.match(r'<!-- expect: ([a-z-]+) line ([0-9]+): (.*) -->$', first)
            self.assertIsNotNone(m, path)
            for extra in ([], ['--json']):
                code, out, err = run('check', path, *extra)
                name = os.path.basename(path)
                self.assertEqual(code, 2, name)
                self.assertEqual(out, '', name)
                self.assertIn('%s:%s: ' % (name, m.group(2)), err, name)
                self.assertIn(m.group(3), err, name)


class Json(unittest.TestCase):
    @classmethod
    def setUpClass(cls):
        code, out, err = run('check', '--json', data('cli-pass.trabeate'))
        assert code == 0, err
        cls.text = out
        cls.doc = json.loads(out)
        cls.tree = ET.parse(data('cli-pass.trabeate')).getroot()

    def test_contract_keys(self):
        doc = self.doc
        self.assertEqual(doc['format'], 1)
        self.assertEqual(doc['units'], 'SI')
        for phrase in ['loads positive down', 'reaction forces positive up',
                       'counter-clockwise', 'M positive sagging']:
            self.assertIn(phrase, doc['unit_note'])
        self.assertIn(CAUTION, doc['caution'])
        self.assertEqual([m['id'] for m in doc['members']], ['SIMPLE', 'FIXED', 'OVERHANG'])
        for m in doc['members']:
            for key in ['id', 'status', 'cases', 'combinations', 'envelope', 'section',
                        'governing', 'ratio', 'checks', 'shortlist']:
                self.assertIn(key, m)
            self.assertEqual(m['status'], 'pass')
            results = list(m['cases'].values()) + list(m['combinations'].values())
            results.append(m['envelope'])
            for r in results:
                for key in RESULT_KEYS:
                    self.assertIn(key, r)
                for re_ in r['reactions']:
                    self.assertEqual(set(['x', 'force', 'moment']) - set(re_), set())
            for c in m['combinations'].values():
                self.assertRegex(c['equation'], r'^ASCE 7-16 Eq\. 2\.4-[0-9]$')

    def test_cases_present(self):
        members = {m['id']: m for m in self.doc['members']}
        self.assertEqual(sorted(members['SIMPLE']['cases']), ['D', 'L'])
        self.assertEqual(sorted(members['FIXED']['cases']), ['D', 'L', 'S'])
        self.assertEqual(sorted(members['OVERHANG']['cases']), ['D', 'L', 'Lr'])

    def test_statics_per_case(self):
        """Sum of reactions = applied load; sum of moments about x = 0 vanishes."""
        beams = {b.get('id'): b for b in self.tree.findall('beam')}
        for m in self.doc['members']:
            beam = beams[m['id']]
            for case, r in m['cases'].items():
                force, moment = applied(beam, case, m['length'], m['self_weight'])
                up = sum(re_['force'] for re_ in r['reactions'])
                # upward reactions turn counter-clockwise about x = 0, as do reaction couples;
                # downward loads and clockwise applied moments turn clockwise
                ccw = sum(re_['force'] * re_['x'] + re_['moment'] for re_ in r['reactions'])
                scale = max(abs(force), 1.0)
                self.assertAlmostEqual(up / scale, force / scale, delta=1e-9,
                                       msg='%s %s' % (m['id'], case))
                self.assertAlmostEqual(ccw / (scale * m['length']),
                                       moment / (scale * m['length']), delta=1e-9,
                                       msg='%s %s' % (m['id'], case))

    def test_self_weight(self):
        members = {m['id']: m for m in self.doc['members']}
        # weight="35 lb/ft" given: 35 x 4.4482216152605 N / 0.3048 m
        self.assertAlmostEqual(members['FIXED']['self_weight'], 35 * LBF / FT, delta=1e-9)
        # A = 10.3 in2 of steel at 490 lb/ft3 (common practice): 10.3 / 144 x 490 lb/ft
        self.assertAlmostEqual(members['SIMPLE']['self_weight'] / (LBF / FT),
                               10.3 / 144 * 490, delta=1e-9)

    def test_simple_span_values(self):
        # 20 ft simple span, D = L = 0.5 kip/ft plus self-weight w_s: the service D + L moment
        # is (1.0 + w_s) L^2 / 8 at midspan and the end shear (1.0 + w_s) L / 2 (AISC Manual
        # Table 3-23 case 1, from memory; ENGINEERING.md §8 item 1)
        m = self.doc['members'][0]
        w = 1.0 * KIP / FT + m['self_weight']
        L = 20 * FT
        env = m['envelope']
        self.assertAlmostEqual(env['M_max'] / (w * L * L / 8), 1.0, delta=1e-9)
        self.assertAlmostEqual(env['M_max_x'], L / 2, delta=1e-9)
        self.assertAlmostEqual(env['V_max'] / (w * L / 2), 1.0, delta=1e-9)
        self.assertEqual(env['governing']['M_max'], 'Service 1: D + L')
        self.assertGreater(env['M_max'], 0)  # sagging is positive

    def test_unstable_json(self):
        code, out, err = run('check', '--json', data('cli-unstable.trabeate'))
        self.assertEqual(code, 1)
        doc = json.loads(out)
        one_pin = doc['members'][0]
        self.assertEqual(one_pin['status'], 'unstable')
        self.assertTrue(one_pin['message'])
        self.assertEqual(doc['members'][1]['status'], 'unsupported')

    def test_repeatable_and_locale_free(self):
        code, again, err = run('check', '--json', data('cli-pass.trabeate'))
        self.assertEqual(again, self.text)
        # a comma-decimal locale, where one is installed, must not change a byte
        for loc in ['de_DE.UTF-8', 'fr_FR.UTF-8']:
            code, out, err = run('check', '--json', data('cli-pass.trabeate'),
                                 env={'LC_ALL': loc})
            self.assertEqual(out, self.text)

    def test_no_nan_tokens(self):
        self.assertIsNone(re.search(r'\b(NaN|Infinity|nan|inf)\b', self.text))


# ENGINEERING.md §8 item 2, by statics: girders 24 ft, beams 20 ft at 8 ft, D = L = 50 psf,
# self-weight excluded, two by two bays (40 x 48 ft), custom sections that are analysed only.
def takedown_floor(extra=''):
    out = ['<trabeate-project format="1"><settings self-weight="exclude"/><floor name="F">']
    for i in range(3):
        for j in range(3):
            out.append('<column id="C%d%d" x="%d ft" y="%d ft"/>' % (i, j, 20 * i, 24 * j))
    member = ('<member id="%s" role="%s" x1="%d ft" y1="%d ft" x2="%d ft" y2="%d ft" '
              'material="steel" section="custom" E="29000 ksi" I="510 in4" weight="0 plf"/>')
    for i in range(3):
        for j in range(2):
            out.append(member % ('G%d%d' % (i, j), 'girder', 20 * i, 24 * j, 20 * i,
                                 24 * (j + 1)))
    for i in range(2):
        for k in range(7):
            out.append(member % ('B%d%d' % (i, k), 'beam', 20 * i, 8 * k, 20 * (i + 1), 8 * k))
    for case in 'DL':
        out.append('<area-load case="%s" pressure="50 psf">' % case)
        for x, y in [(0, 0), (40, 0), (40, 48), (0, 48)]:
            out.append('<point x="%d ft" y="%d ft"/>' % (x, y))
        out.append('</area-load>')
    out.append(extra)
    out.append('</floor></trabeate-project>')
    return '\n'.join(out)


class Floors(unittest.TestCase):
    @classmethod
    def setUpClass(cls):
        cls.tmp = tempfile.TemporaryDirectory()
        cls.demo = os.path.join(EXAMPLES, 'demo-floor.trabeate')
        code, out, err = run('check', '--json', cls.demo)
        assert code in (0, 1), err
        cls.doc = json.loads(out)

    @classmethod
    def tearDownClass(cls):
        cls.tmp.cleanup()

    def write(self, name, text):
        path = os.path.join(self.tmp.name, name)
        with open(path, 'w', encoding='utf-8') as f:
            f.write(text)
        return path

    def test_takedown_by_hand(self):
        code, out, err = run('check', '--json', self.write('takedown.trabeate',
                                                          takedown_floor()))
        self.assertEqual(err, '')
        doc = json.loads(out)
        members = {m['id']: m for m in doc['members']}
        columns = {c['id']: c for c in doc['columns']}
        # beam strip 8 ft: w = 400 plf per case, R = 4.0 k D + 4.0 k L (§8 item 2)
        beam = members['B01']
        for b in beam['bearings']:
            self.assertEqual(b['on'], 'member')
            self.assertAlmostEqual(b['forces']['D'] / KIP, 4.0, delta=1e-9)
            self.assertAlmostEqual(b['forces']['L'] / KIP, 4.0, delta=1e-9)
        # interior girder: 16 k at the third points, M = 16 x 24 / 3 = 128 k-ft (D + L)
        girder = members['G10']
        self.assertAlmostEqual((girder['cases']['D']['M_max'] + girder['cases']['L']['M_max'])
                               / (KIP * FT), 128.0, delta=1e-6)
        # interior column: 2 x 16 + 2 x 8 = 48 k = 480 ft^2 x 0.100 ksf (§8 item 2)
        c = columns['C11']
        self.assertAlmostEqual((c['cases']['D'] + c['cases']['L']) / KIP, 48.0, delta=1e-6)
        self.assertIsNone(c['reduction'])
        # all nine: 40 x 48 ft x 0.100 ksf = 192 k
        self.assertAlmostEqual(sum(c['cases']['D'] + c['cases']['L']
                                   for c in doc['columns']) / KIP, 192.0, delta=1e-6)
        for case in 'DL':
            t = doc['totals'][case]
            self.assertAlmostEqual(t['applied'] / KIP, 96.0, delta=1e-6)
            self.assertAlmostEqual(t['reactions'] / KIP, 96.0, delta=1e-6)
            self.assertEqual(t['not_carried'], 0)

    def test_demo_contract(self):
        doc = self.doc
        for key in ['members', 'columns', 'walls', 'totals', 'unassigned']:
            self.assertIn(key, doc)
        self.assertEqual(doc['unassigned'], [])
        self.assertEqual(sorted(c['id'] for c in doc['columns']), ['A2', 'B2', 'C2'])
        for c in doc['columns']:
            self.assertEqual(set(c['cases']), {'D', 'L', 'Lr', 'S'})
            for key in ['x', 'y', 'floor', 'reduction', 'live_reduced']:
                self.assertIn(key, c)
        self.assertEqual([w['id'] for w in doc['walls']], ['W1'])
        for m in doc['members']:
            self.assertEqual(m['floor'], 'Mezzanine')
            self.assertIn(m['role'], ['girder', 'beam', 'joist'])
            self.assertEqual(len(m['bearings']), len(m['supports']))
            self.assertIn('live_reduction', m)

    def test_demo_equilibrium(self):
        """Applied = reactions + not carried, per case (statics); and what the members hand to
        each column and the wall is what the column and the wall report."""
        doc = self.doc
        for case, t in doc['totals'].items():
            scale = max(abs(t['applied']), 1.0)
            self.assertAlmostEqual((t['reactions'] + t['not_carried']) / scale,
                                   t['applied'] / scale, delta=1e-9, msg=case)
        on_column, on_wall = {}, {}
        for m in doc['members']:
            for b in m['bearings']:
                into = on_column if b['on'] == 'column' else on_wall if b['on'] == 'wall' \
                    else None
                if into is None:
                    continue
                for case, f in b['forces'].items():
                    into[(b['id'], case)] = into.get((b['id'], case), 0.0) + f
        for c in doc['columns']:
            for case, f in c['cases'].items():
                self.assertAlmostEqual(on_column.get((c['id'], case), 0.0), f,
                                       delta=1e-9 * max(abs(f), 1.0))
        for w in doc['walls']:
            for case, f in w['cases'].items():
                self.assertAlmostEqual(on_wall.get((w['id'], case), 0.0), f,
                                       delta=1e-9 * max(abs(f), 1.0))
                self.assertAlmostEqual(sum(p['force'] for p in w['loads'][case]), f,
                                       delta=1e-9 * max(abs(f), 1.0))

    def test_demo_cantilever_and_reduction(self):
        members = {m['id']: m for m in self.doc['members']}
        columns = {c['id']: c for c in self.doc['columns']}
        g2 = members['G2']
        self.assertGreater(g2['length'], 25 * FT)   # runs past C2 at 20 ft
        self.assertEqual([b['id'] for b in g2['bearings']], ['B2', 'C2'])
        edge = members['J42']
        self.assertEqual([b['id'] for b in edge['bearings']], ['W1', 'G2'])
        # the column with a cantilever over it: K_LL of a corner column with cantilever slabs
        # (ASCE 7-16 Table 4.7-1, from memory), and the reduced load never above the unreduced
        for c in columns.values():
            if c['reduction'] is not None:
                self.assertLessEqual(c['live_reduced'], c['cases']['L'] * (1 + 1e-12))
                self.assertGreaterEqual(c['reduction']['factor'], 0.5)
        self.assertEqual(columns['C2']['reduction']['k_ll'], 2)
        self.assertEqual(columns['B2']['reduction']['k_ll'], 4)

    def test_repeatable_without_shortcuts(self):
        """Identical members solved once and the sizing bounds change no byte; nor does a
        second run."""
        for name in ['demo-floor.trabeate', 'overhang-beam.trabeate', 'demo-beams.trabeate']:
            path = os.path.join(EXAMPLES, name)
            code1, a, err = run('check', '--json', path)
            code2, b, err = run('check', '--json', '--no-shortcuts', path)
            code3, c, err = run('check', '--json', path)
            self.assertEqual(code1, code2, name)
            self.assertEqual(a, b, name)
            self.assertEqual(a, c, name)
            _, ta, _ = run('schedule', '--csv', path)
            _, tb, _ = run('schedule', '--csv', '--no-shortcuts', path)
            self.assertEqual(ta, tb, name)

    def test_member_and_what_rests_on_it(self):
        code, out, err = run('check', '--json', '--member', 'G1', self.demo)
        doc = json.loads(out)
        ids = [m['id'] for m in doc['members']]
        self.assertIn('G1', ids)
        # the tail joists rest on the header, which rests on the trimmers, which rest on G1
        for mark in ['H1', 'T1', 'T4']:
            self.assertIn(mark, ids)
        self.assertNotIn('G2', ids)
        self.assertNotIn('J1', ids)       # on the wall and column A2, not on G1
        for m in doc['members']:
            if m['id'] != 'G1':
                on = {b['id'] for b in m['bearings']}
                self.assertTrue(on & set(ids), m['id'])
        self.assertEqual(sorted(c['id'] for c in doc['columns']), ['A2', 'B2'])
        code, table, err = run('check', '--member', 'T1', self.demo)
        self.assertIn('Member T1', table)
        self.assertNotIn('Member H1', table)
        self.assertIn(CAUTION, table)

    def test_table(self):
        code, out, err = run('check', self.demo)
        self.assertEqual(err, '')
        self.assertLess(out.index(CAUTION), out.index('Member G1'))
        self.assertGreater(out.rindex(CAUTION), out.index('Column loads'))
        self.assertIn('Columns and walls are shown with the loads they receive', out)
        self.assertIn('Wall loads, floor Mezzanine', out)
        self.assertIn('Totals, floor Mezzanine', out)
        self.assertRegex(out, r'at 0\'-0"\s+on wall W1 at ')

    def test_unassigned_and_unsupported(self):
        extra = ('<point-load case="L" p="3 kip" x="70 ft" y="70 ft" label="hoist"/>'
                 '<member id="X1" role="beam" x1="40 ft" y1="20 ft" x2="52 ft" y2="20 ft" '
                 'material="steel" section="W8X10"/>')
        path = self.write('unassigned.trabeate', takedown_floor(extra))
        code, out, err = run('check', path)
        self.assertEqual(code, 1)
        self.assertIn('WARNING: point load', out)
        self.assertIn('hoist', out)
        self.assertIn('UNSUPPORTED', out)
        code, out, err = run('check', '--json', path)
        doc = json.loads(out)
        self.assertEqual(len(doc['unassigned']), 1)
        u = doc['unassigned'][0]
        self.assertEqual((u['kind'], u['case'], u['label']), ('point', 'L', 'hoist'))
        self.assertAlmostEqual(u['force'] / KIP, 3.0, delta=1e-12)
        x1 = {m['id']: m for m in doc['members']}['X1']
        self.assertEqual(x1['status'], 'unsupported')
        self.assertIn('one support', x1['message'])

    def test_schedule(self):
        code, out, err = run('schedule', self.demo)
        self.assertEqual(err, '')
        self.assertIn(CAUTION, out)
        self.assertIn('Member schedule', out)
        self.assertIn('Column loads', out)
        code_csv, text, err = run('schedule', '--csv', self.demo)
        self.assertEqual(code_csv, code)
        member_part, column_part = text.split('\n\n')
        rows = list(csv.reader(io.StringIO(member_part)))
        head = rows[0]
        for col in ['mark', 'role', 'material', 'section', 'length (ft)', 'span (ft)', 'status',
                    'ratio', 'governing', 'R1 D (kip)', 'R2 L (kip)', 'live factor']:
            self.assertIn(col, head)
        self.assertEqual(len(rows) - 1, len(self.doc['members']))
        members = {m['id']: m for m in self.doc['members']}
        for row in rows[1:]:
            r = dict(zip(head, row))
            m = members[r['mark']]
            self.assertEqual(r['status'], m['status'])
            self.assertEqual(r['section'], m['section'])
            self.assertAlmostEqual(float(r['length (ft)']), m['length'] / FT, delta=0.006)
            # end reactions as analysed, in kip to the table's rounding (3 figures)
            r1 = m['cases']['D']['reactions'][0]['force'] / KIP
            self.assertAlmostEqual(float(r['R1 D (kip)']), r1, delta=max(abs(r1) * 0.006, 0.006))
        rows = list(csv.reader(io.StringIO(column_part)))
        head = rows[0]
        self.assertEqual(head[:5], ['column', 'floor', 'x (ft)', 'y (ft)', 'section'])
        self.assertIn('L reduced (kip)', head)
        columns = {c['id']: c for c in self.doc['columns']}
        for row in rows[1:]:
            r = dict(zip(head, row))
            c = columns[r['column']]
            self.assertAlmostEqual(float(r['D (kip)']), c['cases']['D'] / KIP,
                                   delta=max(c['cases']['D'] / KIP * 0.006, 0.006))
            self.assertAlmostEqual(float(r['L reduced (kip)']), c['live_reduced'] / KIP,
                                   delta=max(c['live_reduced'] / KIP * 0.006, 0.006))
        # the schedule of a file that fails exits as check does
        code, out, err = run('schedule', data('cli-fail.trabeate'))
        self.assertEqual(code, 1)
        code, out, err = run('schedule', '--csv', '--member', 'NOPE', self.demo)
        self.assertEqual(code, 2)
        self.assertEqual(out, '')


if __name__ == '__main__':
    if len(sys.argv) < 2:
        sys.exit('usage: test-cli.py PATH-TO-trabeate-cli')
    CLI = sys.argv.pop(1)
    unittest.main(verbosity=2)
