#!/usr/bin/env python3
# SPDX-FileCopyrightText: 2026 The Trabeate developers
# SPDX-License-Identifier: GPL-3.0-or-later
#
# The printed report read back: page counts, every member's mark, section and ratio as the CLI
# writes them, column loads worked by hand, the cautions on every page, no blank page, the
# revision clouds of --since, SVG that parses, PNG of the size asked for, and usage errors.
# pdfinfo, pdftotext and pdftoppm come from poppler-utils.
#
# Usage: test-report.py PATH-TO-trabeate-cli   (tests/data and data/examples are found from
# this script's folder)

import json
import os
import re
import shutil
import struct
import subprocess
import sys
import tempfile
import unittest
import xml.etree.ElementTree as ET

CLI = None
HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.join(HERE, 'data')
DEMO = os.path.join(HERE, '..', 'data', 'examples', 'demo-beams.trabeate')
V1 = os.path.join(DATA, 'render-floor-v1.trabeate')
V2 = os.path.join(DATA, 'render-floor-v2.trabeate')

CAUTION = ('Results are for design or review by a licensed engineer; local building codes '
           'govern.')


def run(*args):
    p = subprocess.run([CLI] + list(args), capture_output=True, timeout=120)
    return p.returncode, p.stdout.decode('utf-8'), p.stderr.decode('utf-8')


def tool(name):
    path = shutil.which(name)
    if path is None:
        raise AssertionError(name + ' (poppler-utils) is not installed')
    return path


def pdf_pages(pdf):
    out = subprocess.run([tool('pdfinfo'), pdf], capture_output=True, check=True).stdout
    return int(re.search(rb'^Pages:\s+(\d+)', out, re.M).group(1))


def pdf_text(pdf, page=None, layout=False):
    args = [tool('pdftotext'), '-enc', 'UTF-8']
    args += ['-layout'] if layout else ['-raw']
    if page is not None:
        args += ['-f', str(page), '-l', str(page)]
    args += [pdf, '-']
    return subprocess.run(args, capture_output=True, check=True).stdout.decode('utf-8')


def squeeze(text):
    return ' '.join(text.split())


def summary_rows(table):
    """The CLI table's Summary: mark, section, status, ratio, governing, as printed."""
    rows = []
    part = table.split('\nSummary\n', 1)[1]
    for line in part.splitlines()[1:]:
        if line.strip() == '' or line.startswith('CAUTION'):
            break
        m = re.match(r'  (\S+)\s+(\S+)\s+(passes|FAILS|UNSTABLE|UNSUPPORTED|not designed|'
                     r'ERROR)\s+(\S+)\s+(.*)$', line)
        assert m, line
        rows.append(m.groups())
    return rows


def member_blocks(table):
    """The CLI table's block of each member, by mark."""
    blocks = {}
    for block in table.split('\nMember ')[1:]:
        blocks[block.split(' ', 1)[0]] = block
    return blocks


def read_pgm(path):
    with open(path, 'rb') as f:
        data = f.read()
    m = re.match(rb'P5\s+(\d+)\s+(\d+)\s+(\d+)\s', data)
    w, h = int(m.group(1)), int(m.group(2))
    return w, h, data[m.end():]


class Report(unittest.TestCase):
    def setUp(self):
        self.tmp = tempfile.mkdtemp(prefix='trb-report-')

    def tearDown(self):
        shutil.rmtree(self.tmp)

    def out(self, name):
        return os.path.join(self.tmp, name)

    def test_demo_pages_and_numbers(self):
        pdf = self.out('demo.pdf')
        code, stdout, stderr = run('report', DEMO, '-o', pdf)
        self.assertEqual(code, 0, stderr)
        # a summary, the plan sheet (the demo has no floor), two pages for each of its five
        # members, and the schedule
        self.assertEqual(pdf_pages(pdf), 1 + 1 + 2 * 5 + 1)
        self.assertIn('13 pages', stdout)

        code, table, _ = run('check', DEMO)
        self.assertIn(code, (0, 1))
        code, js, _ = run('check', DEMO, '--json')
        members = {m['id']: m for m in json.loads(js)['members']}
        text = squeeze(pdf_text(pdf))
        rows = summary_rows(table)
        self.assertEqual(len(rows), 5)
        for mark, section, status, ratio, governing in rows:
            # the table's ratio is the JSON's, rounded to three decimals
            self.assertEqual(ratio, '%.3f' % members[mark]['ratio'])
            self.assertIn('Member ' + mark, text)
            # the schedule's row: mark, section, ..., status, ratio, governing, as the CLI
            self.assertRegex(text, r'\b%s\b.*\b%s\b' % (re.escape(mark), re.escape(section)))
            self.assertIn('%s %s %s' % (status, ratio, governing), text)

        # each member's sheets carry the extremes exactly as the table prints them
        blocks = member_blocks(table)
        for mark, block in blocks.items():
            # the sheet's title in the title block names the member
            pages = [i for i in range(1, pdf_pages(pdf) + 1)
                     if re.search(r'SHEET Member %s\b' % re.escape(mark),
                                  squeeze(pdf_text(pdf, i)))]
            self.assertEqual(len(pages), 2, mark)
            sheet = squeeze(pdf_text(pdf, pages[0]) + pdf_text(pdf, pages[1]))
            for label in ('shear max', 'moment max (+)'):
                m = re.search(r'    %s\s+(.+?)\s+at (\S+)' % re.escape(label), block)
                self.assertIsNotNone(m, (mark, label))
                self.assertIn(m.group(1), sheet, (mark, label))
            # and its reactions per case
            for m in re.finditer(r'^    (D|L|Lr|S)\s+(.+)$', block, re.M):
                for value in re.findall(r'-?\d+\.\d+ kip', m.group(2)):
                    self.assertIn(value, sheet, (mark, m.group(1)))

    def test_demo_floor(self):
        # the demo the run script prints: every mark, section, status and ratio of the CLI's
        # summary in the schedule, and the CLI's column loads in the column table
        demo = os.path.join(HERE, '..', 'data', 'examples', 'demo-floor.trabeate')
        pdf = self.out('demo-floor.pdf')
        code, stdout, stderr = run('report', demo, '-o', pdf)
        self.assertEqual(code, 0, stderr)
        code, table, _ = run('check', demo)
        rows = summary_rows(table)
        n = pdf_pages(pdf)
        titles = [re.search(r'SHEET (.+?) (?:ENGINEER|DATE|REVISION|PAGE)',
                            squeeze(pdf_text(pdf, i))).group(1) for i in range(1, n + 1)]
        n_schedule = titles.count('Schedule')
        self.assertGreaterEqual(n_schedule, 1)
        # a summary, one plan (one floor), two pages a member, the schedule
        self.assertEqual(n, 1 + 1 + 2 * len(rows) + n_schedule)
        schedule = squeeze(''.join(pdf_text(pdf, i) for i in range(1, n + 1)
                                   if titles[i - 1] == 'Schedule'))
        for mark, section, status, ratio, governing in rows:
            self.assertEqual(titles.count('Member ' + mark), 2, mark)
            self.assertRegex(schedule, r'\b%s\b.*?\b%s\b.*?%s %s %s' %
                             (re.escape(mark), re.escape(section), re.escape(status),
                              re.escape(ratio), re.escape(governing)))
        columns = re.findall(r'^  (\S+)\s+\(.*?\)\s+(-?\d+\.\d+ kip)\s+(-?\d+\.\d+ kip)',
                             table, re.M)
        self.assertGreater(len(columns), 0)
        layout = ''.join(pdf_text(pdf, i, layout=True) for i in range(1, n + 1)
                         if titles[i - 1] == 'Schedule')
        for mark, d, l in columns:
            self.assertRegex(layout, r'(?m)^\s*%s\s.*%s\s+%s' % (re.escape(mark), re.escape(d),
                                                                  re.escape(l)))

    def test_caution_on_every_page(self):
        pdf = self.out('demo.pdf')
        self.assertEqual(run('report', DEMO, '-o', pdf)[0], 0)
        for page in range(1, pdf_pages(pdf) + 1):
            text = squeeze(pdf_text(pdf, page))
            self.assertIn(CAUTION, text, page)
            self.assertIn('Not checked: connections and hangers', text, page)

    def test_no_blank_page(self):
        pdf = self.out('floor.pdf')
        self.assertEqual(run('report', V1, '-o', pdf)[0], 0)
        n = pdf_pages(pdf)
        subprocess.run([tool('pdftoppm'), '-r', '36', '-gray', pdf, self.out('page')],
                       check=True)
        pgms = sorted(f for f in os.listdir(self.tmp) if f.endswith('.pgm'))
        self.assertEqual(len(pgms), n)
        for name in pgms:
            w, h, pixels = read_pgm(self.out(name))
            # inside the border and above the title block (36 pt margins, a 66 pt title
            # block, at 36 dpi half a pixel a point): what the sheet itself holds
            x0, x1 = 25, w - 25
            y0, y1 = 25, h - 25 - 36
            ink = sum(1 for y in range(y0, y1) for x in range(x0, x1)
                      if pixels[y * w + x] < 160)
            self.assertGreater(ink / float((x1 - x0) * (y1 - y0)), 0.002, name)

    def test_floor_plan_and_column_loads(self):
        pdf = self.out('floor.pdf')
        self.assertEqual(run('report', V1, '-o', pdf)[0], 0)
        plan = squeeze(pdf_text(pdf, 2))
        self.assertIn('FRAMING PLAN: Level 2', plan)
        code, table, _ = run('check', V1)
        for mark, section, status, ratio, governing in summary_rows(table):
            if mark.startswith('B'):
                continue   # standalone beams are not on the plan
            self.assertIn(mark, plan)
            self.assertIn(ratio, plan)
        # Column C1 carries half of girder G1, which carries one end of each of the nine
        # joists. Each joist: 12 ft span, a 2 ft strip (joists at 2 ft; the load's edge 1 ft
        # beyond the outer ones). D: 12 psf x 2 ft x 12 ft / 2 = 144 lb an end; L: 40 psf,
        # 480 lb. The nine sit symmetrically on the 20 ft girder, so each column takes half:
        # D 9 x 144 / 2 = 648 lb, L 9 x 480 / 2 = 2160 lb (statics; self-weight excluded in
        # the file). Printed to two decimals of a kip, as the CLI prints forces.
        schedule = pdf_text(pdf, pdf_pages(pdf), layout=True)
        row = [l for l in schedule.splitlines() if re.match(r'\s*C1\s', l)]
        self.assertEqual(len(row), 1, schedule)
        self.assertRegex(row[0], r'0\.65 kip\s+2\.16 kip\s+0\.00 kip\s+0\.00 kip\s+2\.81 kip')
        for c in ('C2', 'C3', 'C4'):
            self.assertRegex(schedule, r'%s\s.*0\.65 kip\s+2\.16 kip' % c)
        # the same strings as the CLI's own column table
        cli = dict((m.group(1), m.group(2).split('kip')[:2])
                   for m in re.finditer(r'^  (C\d)\s+\(.*?\)\s+(.*)$', table, re.M))
        self.assertEqual(sorted(cli), ['C1', 'C2', 'C3', 'C4'])
        for c, (d, l) in cli.items():
            self.assertRegex(schedule, r'%s\s.*%s kip\s+%s kip' % (c, re.escape(d.strip()),
                                                                  re.escape(l.strip())))
        # and the plan shows them beside the columns
        self.assertIn('D 0.65 kip', plan)
        self.assertIn('L 2.16 kip', plan)

    def test_since_clouds(self):
        pdf = self.out('since.pdf')
        code, stdout, stderr = run('report', V2, '--since', V1, '-o', pdf)
        self.assertEqual(code, 0, stderr)
        # the members whose section, status or loads changed (the files' header says how)
        self.assertIn('Clouded (changed since %s): B1 B3 G1 G2 J2 J5' % V1, stdout)
        plan = squeeze(pdf_text(pdf, 2))
        self.assertIn('Revision clouds, changed since render-floor-v1.trabeate: G1, G2, J2, J5',
                      plan)
        changes = pdf_text(pdf, 3, layout=True)
        self.assertIn('Changes since render-floor-v1.trabeate', changes)
        listed = re.findall(r'^\s*([A-Z]\d+)\s+(?:Level 2|-)\s+(\S.*?)\s{2,}', changes, re.M)
        self.assertEqual([m for m, _ in listed], ['B1', 'B3', 'G1', 'G2', 'J2', 'J5', 'B2'])
        self.assertEqual(dict(listed)['J5'], 'status, loads')
        self.assertEqual(dict(listed)['B2'], 'removed')
        # a version against itself has nothing to ring
        code, stdout, _ = run('report', V1, '--since', V1, '-o', self.out('same.pdf'))
        self.assertIn('Clouded (changed since %s): none' % V1, stdout)

    def test_svg_parses(self):
        svg = self.out('plan.svg')
        code, _, stderr = run('plan', V1, '-o', svg, '--width', '800', '--height', '600')
        self.assertEqual(code, 0, stderr)
        root = ET.parse(svg).getroot()
        self.assertEqual(root.tag, '{http://www.w3.org/2000/svg}svg')
        self.assertEqual(root.get('width'), '800pt')
        # a report as SVG: a file a page, each one parsing
        base = self.out('report.svg')
        code, stdout, stderr = run('report', DEMO, '-o', base, '--sheets', 'summary,schedule')
        self.assertEqual(code, 0, stderr)
        self.assertIn('2 pages', stdout)
        for name in (base, self.out('report-2.svg')):
            self.assertEqual(ET.parse(name).getroot().tag, '{http://www.w3.org/2000/svg}svg')

    def test_png_size(self):
        png = self.out('plan.png')
        code, _, stderr = run('plan', V1, '-o', png, '--width', '640', '--height', '480')
        self.assertEqual(code, 0, stderr)
        with open(png, 'rb') as f:
            head = f.read(24)
        # PNG signature, then the IHDR chunk: width and height, big-endian (ISO/IEC 15948)
        self.assertEqual(head[:8], b'\x89PNG\r\n\x1a\n')
        self.assertEqual(struct.unpack('>II', head[16:24]), (640, 480))
        # a Letter page at 72 dpi is 612 x 792 pixels (8.5 x 11 in)
        page = self.out('page.png')
        code, _, stderr = run('report', DEMO, '-o', page, '--sheets', 'summary', '--dpi', '72')
        self.assertEqual(code, 0, stderr)
        with open(page, 'rb') as f:
            head = f.read(24)
        self.assertEqual(struct.unpack('>II', head[16:24]), (612, 792))

    def test_scale_and_paper(self):
        pdf = self.out('scaled.pdf')
        code, _, stderr = run('report', V1, '-o', pdf, '--sheets', 'plan', '--scale',
                              '1/8"=1\'-0"', '--paper', 'A3', '--landscape')
        self.assertEqual(code, 0, stderr)
        self.assertIn('Scale 1/8" = 1\'-0"', squeeze(pdf_text(pdf, 1)))
        # A3 landscape: 420 x 297 mm is 1190.55 x 841.89 points
        info = subprocess.run([tool('pdfinfo'), pdf], capture_output=True,
                              check=True).stdout.decode()
        self.assertRegex(info, r'Page size:\s+1190\.55 x 841\.89 pts')
        # at 1:10 the bay (about 28 ft with the grid lines) is too large for Letter: the
        # sheet says so and takes a scale that fits
        code, _, stderr = run('report', V1, '-o', pdf, '--sheets', 'plan', '--scale', '1:10')
        self.assertEqual(code, 0, stderr)
        self.assertIn('The plan does not fit at 1:10 on Letter portrait', squeeze(pdf_text(pdf)))

    def test_no_floor(self):
        pdf = self.out('plan.pdf')
        self.assertEqual(run('report', DEMO, '-o', pdf, '--sheets', 'plan')[0], 0)
        self.assertIn('This project has no floor', squeeze(pdf_text(pdf)))
        code, _, stderr = run('plan', DEMO, '-o', self.out('x.png'))
        self.assertEqual(code, 2)
        self.assertIn('no floor', stderr)

    def test_usage_errors(self):
        cases = [
            ['report', DEMO],
            ['report', DEMO, '-o', self.out('x.pdf'), '--paper', 'B5'],
            ['report', DEMO, '-o', self.out('x.pdf'), '--scale', 'large'],
            ['report', DEMO, '-o', self.out('x.pdf'), '--sheets', 'elevations'],
            ['report', DEMO, '-o', self.out('x.pdf'), '--member', 'NOPE'],
            ['report', DEMO, '-o', self.out('x.doc')],
            ['report', os.path.join(DATA, 'no-such-file.trabeate'), '-o', self.out('x.pdf')],
            ['plan', V1, '-o', self.out('x.png'), '--width', '2'],
            ['plan', V1, '-o', self.out('x.png'), '--floor', 'Roof'],
        ]
        for args in cases:
            code, _, stderr = run(*args)
            self.assertEqual(code, 2, args)
            self.assertNotEqual(stderr, '', args)
        code, stdout, _ = run('report', '--help')
        self.assertEqual(code, 0)
        self.assertIn('--since OLD', stdout)


if __name__ == '__main__':
    CLI = os.path.abspath(sys.argv.pop(1))
    unittest.main(verbosity=2)
