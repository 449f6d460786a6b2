#!/usr/bin/env python3
# SPDX-FileCopyrightText: 2026 The Trabeate developers
# SPDX-License-Identifier: GPL-3.0-or-later
#
# The headless command: exit codes, messages on bad input, the table's cautions, and the JSON
# contract (docs/cli.md), with the statics of every load case checked from the file itself.
#
# Usage: test-cli.py PATH-TO-trabeate-cli   (tests/data is found beside this script)

import glob
import json
import math
import os
import re
import subprocess
import sys
import unittest
import xml.etree.ElementTree as ET

CLI = None
DATA = os.path.join(os.path.dirname(os.path.abspath(__file__)), 'data')

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

    def test_usage_errors(self):
        for args in [(), ('frobnicate',), ('check',), ('check', 'a', 'b'),
                     ('check', '--bogus', data('cli-pass.trabeate'))]:
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


if __name__ == '__main__':
    if len(sys.argv) < 2:
        sys.exit('usage: test-cli.py PATH-TO-trabeate-cli')
    CLI = sys.argv.pop(1)
    unittest.main(verbosity=2)
