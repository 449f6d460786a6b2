#!/usr/bin/env python3
# SPDX-FileCopyrightText: 2026 The Trabeate developers
# SPDX-License-Identifier: GPL-3.0-or-later
#
# Translations and locales (docs/translating.md):
#
#   test-i18n.py catalogs SRCDIR
#       po/POTFILES.in sorted and complete, every catalog of po/LINGUAS complete and clean
#       (msgfmt --check --statistics: no untranslated or fuzzy message, against a template made
#       from today's sources), and the words core prints that the command and the sheets
#       translate by their text (cautions, check names, ...) still in the template.
#   test-i18n.py cli CLI LOCALEDIR
#       the command in Spanish: `check` and `--help` show translated text, the numbers and the
#       JSON stay as they are.
#   test-i18n.py numbers CLI TEST-LOCALE
#       under a locale whose decimal mark is a comma (generated with localedef when the system
#       has none): tests/test-locale.c saves and reloads the examples, and the command's
#       table, JSON and CSV are those of the C locale.

import glob
import os
import re
import shutil
import subprocess
import sys
import tempfile
import unittest

SRCDIR = None
CLI = None
LOCALEDIR = None
TEST_LOCALE = None

# The xgettext arguments of meson's i18n.gettext(preset: 'glib') (mesonbuild/modules/i18n.py),
# so that the template made here is the one `ninja trabeate-pot` makes.
XGETTEXT_GLIB = [
    '--from-code=UTF-8', '--add-comments',
    '--keyword=_', '--keyword=N_', '--keyword=C_:1c,2', '--keyword=NC_:1c,2',
    '--keyword=g_dcgettext:2', '--keyword=g_dngettext:2,3', '--keyword=g_dpgettext2:2c,3',
    '--flag=N_:1:pass-c-format', '--flag=C_:2:pass-c-format', '--flag=NC_:2:pass-c-format',
    '--flag=g_dngettext:2:pass-c-format', '--flag=g_strdup_printf:1:c-format',
    '--flag=g_string_printf:2:c-format', '--flag=g_string_append_printf:2:c-format',
    '--flag=g_error_new:3:c-format', '--flag=g_set_error:4:c-format',
    '--flag=g_markup_printf_escaped:1:c-format', '--flag=g_log:3:c-format',
    '--flag=g_print:1:c-format', '--flag=g_printerr:1:c-format', '--flag=g_printf:1:c-format',
    '--flag=g_fprintf:2:c-format', '--flag=g_sprintf:2:c-format',
    '--flag=g_snprintf:3:c-format',
]

MARKS_C = re.compile(r'\b(?:_|N_|C_|NC_|ngettext|g_dpgettext2)\s*\(')
MARKS_UI = re.compile(r'translatable="yes"')


def read(*parts):
    with open(os.path.join(SRCDIR, *parts), encoding='utf-8') as f:
        return f.read()


def listed(name):
    """The lines of a po/ list, without comments and blank lines."""
    return [l.strip() for l in read('po', name).splitlines()
            if l.strip() and not l.startswith('#')]


def c_strings(text):
    """The C string literals of text, adjacent ones joined, escapes undone."""
    text = text.replace('\\\n', ' ')
    out = []
    for m in re.finditer(r'"((?:[^"\\\n]|\\.)*)"(?:\s*"((?:[^"\\\n]|\\.)*)")*', text):
        pieces = re.findall(r'"((?:[^"\\\n]|\\.)*)"', m.group(0))
        out.append(unescape(''.join(pieces)))
    return out


def unescape(s):
    return s.encode('utf-8').decode('unicode_escape').encode('latin-1').decode('utf-8')


def po_msgids(path):
    """(msgctxt, msgid) of every message of a .po or .pot file but the header."""
    text = subprocess.run(['msgcat', '--no-wrap', path], capture_output=True, check=True,
                          text=True).stdout
    ids = set()
    fields = {}
    key = None
    for line in text.splitlines() + ['']:
        m = re.match(r'(msgctxt|msgid|msgid_plural|msgstr(?:\[\d\])?) "(.*)"$', line)
        if m:
            key = m.group(1)
            fields[key] = unescape(m.group(2))
        elif line.startswith('"') and key is not None:
            fields[key] += unescape(line[1:-1])
        elif not line.strip():
            if fields.get('msgid'):
                ids.add((fields.get('msgctxt'), fields['msgid']))
            fields = {}
            key = None
    return ids


def make_template(directory):
    pot = os.path.join(directory, 'trabeate.pot')
    subprocess.run(['xgettext', '--directory=' + SRCDIR, '--output=' + pot,
                    '--files-from=' + os.path.join(SRCDIR, 'po', 'POTFILES.in')]
                   + XGETTEXT_GLIB, check=True, capture_output=True)
    return pot


def statistics(po):
    """msgfmt --check --statistics: (translated, fuzzy, untranslated)."""
    p = subprocess.run(['msgfmt', '--check', '--check-accelerators=_', '--statistics',
                        '--output-file=/dev/null', po], capture_output=True, text=True)
    if p.returncode != 0:
        raise AssertionError('msgfmt --check %s:\n%s' % (po, p.stderr))
    counts = {}
    for n, what in re.findall(r'(\d+) (translated|fuzzy|untranslated)', p.stderr):
        counts[what] = int(n)
    return counts.get('translated', 0), counts.get('fuzzy', 0), counts.get('untranslated', 0)


class Catalogs(unittest.TestCase):

    @classmethod
    def setUpClass(cls):
        cls.tmp = tempfile.mkdtemp(prefix='trabeate-i18n-')
        cls.pot = make_template(cls.tmp)
        cls.template = po_msgids(cls.pot)

    @classmethod
    def tearDownClass(cls):
        shutil.rmtree(cls.tmp)

    def test_potfiles_sorted_and_present(self):
        files = listed('POTFILES.in')
        self.assertEqual(files, sorted(files), 'po/POTFILES.in is sorted (LC_ALL=C)')
        for f in files:
            self.assertTrue(os.path.isfile(os.path.join(SRCDIR, f)), f + ' exists')

    def test_potfiles_complete(self):
        """Every source of the command, the drawing layer and the editor that marks text, and
        the data files, is in po/POTFILES.in."""
        files = set(listed('POTFILES.in'))
        sources = []
        for pattern in ('src/cli/*.c', 'src/render/*.c', 'src/app/*.c', 'ui/*.ui', 'ui/*/*.ui'):
            sources += glob.glob(os.path.join(SRCDIR, pattern))
        missing = []
        for path in sources:
            rel = os.path.relpath(path, SRCDIR)
            with open(path, encoding='utf-8') as f:
                text = f.read()
            marked = MARKS_UI.search(text) if rel.endswith('.ui') else MARKS_C.search(text)
            if marked and rel not in files:
                missing.append(rel)
        for data in ('data/org.trabeate.Trabeate.desktop.in.in',
                     'data/org.trabeate.Trabeate.metainfo.xml.in.in',
                     'data/org.trabeate.Trabeate.gschema.xml',
                     'data/org.trabeate.Trabeate.mime.xml'):
            if data not in files:
                missing.append(data)
        self.assertEqual(missing, [], 'add to po/POTFILES.in')

    def test_linguas(self):
        langs = listed('LINGUAS')
        self.assertEqual(langs, sorted(langs))
        self.assertIn('es', langs)
        for lang in langs:
            self.assertTrue(os.path.isfile(os.path.join(SRCDIR, 'po', lang + '.po')), lang)

    def test_catalogs_clean(self):
        """Each catalog as committed: valid, every message translated, none fuzzy."""
        for lang in listed('LINGUAS'):
            po = os.path.join(SRCDIR, 'po', lang + '.po')
            translated, fuzzy, untranslated = statistics(po)
            self.assertGreater(translated, 0, lang)
            self.assertEqual((fuzzy, untranslated), (0, 0), lang + '.po: fuzzy, untranslated')

    def test_catalogs_cover_the_sources(self):
        """Each catalog merged with a template of today's sources: nothing new is left
        untranslated (a message added to the code needs its translation: docs/translating.md)."""
        for lang in listed('LINGUAS'):
            merged = os.path.join(self.tmp, lang + '.po')
            subprocess.run(['msgmerge', '--quiet', '--no-fuzzy-matching', '--output-file=' +
                            merged, os.path.join(SRCDIR, 'po', lang + '.po'), self.pot],
                           check=True)
            translated, fuzzy, untranslated = statistics(merged)
            new = sorted(m for c, m in self.template - po_msgids(
                os.path.join(SRCDIR, 'po', lang + '.po')))
            self.assertEqual((fuzzy, untranslated), (0, 0),
                             '%s.po lacks %d messages of the sources: %s'
                             % (lang, len(new), new[:10]))
            self.assertEqual(translated, len(self.template))

    def test_template_has_the_desktop_files(self):
        """The desktop file, metainfo, schema and MIME comment reach the template."""
        ids = {m for c, m in self.template}
        for text in ('Floor Framing Design', 'Unit system of new projects',
                     'Trabeate floor framing project',
                     'Lay out, load, size and check the framing of a floor'):
            self.assertIn(text, ids)

    def test_core_words_in_template(self):
        """What core prints and the command and sheets translate by its text: the cautions,
        the check names, the titles of the sets of combinations, and the file's words for
        roles, materials, supports and statuses."""
        ids = self.template
        cautions = c_strings(read('src', 'core', 'trb-cautions.h'))
        self.assertEqual(len(cautions), 4)
        for text in cautions:
            self.assertIn((None, text), ids)

        design = ''.join(read('src', 'core', f) for f in
                         ('trb-design.c', 'trb-design-allowable.c', 'trb-design-steel.c',
                          'trb-design-wood.c'))
        names = set(re.findall(r'trb_check_set \(&?\w+,\s*"([^"]+)"', design))
        names |= set(re.findall(r'check_deflection_one \([^;"]*"([^"]+)"', design))
        self.assertIn('Flexure', names)
        for name in names:
            self.assertIn((None, name), ids)

        combos = read('src', 'core', 'trb-combos.c')
        body = re.search(r'\ntrb_combo_set_title \(.*?\n}\n', combos, re.S).group(0)
        titles = re.findall(r'return "([^"]+)";', body)
        self.assertGreaterEqual(len(titles), 5)
        for title in titles:
            self.assertIn((None, title), ids)

        model = read('src', 'core', 'trb-model.c')
        for ctx, array in (('role', 'role_names'), ('material', 'material_names'),
                           ('support', 'support_names')):
            words = re.findall(r'"([^"]+)"', re.search(array + r'\[\] = \{([^}]*)\}',
                                                      model).group(1))
            self.assertTrue(words, array)
            for w in words:
                self.assertIn((ctx, w), ids)
        solve = read('src', 'core', 'trb-solve.c')
        words = re.findall(r'"([^"]+)"', re.search(r'status_names\[\] = \{([^}]*)\}',
                                                  solve).group(1))
        self.assertEqual(len(words), 6)
        for w in words:
            self.assertIn(('status', w), ids)


def run(args, env):
    e = {k: v for k, v in os.environ.items()
         if not k.startswith('LC_') and k not in ('LANG', 'LANGUAGE')}
    e.update(env)
    p = subprocess.run([CLI] + args, capture_output=True, env=e, timeout=120)
    return p.returncode, p.stdout.decode('utf-8'), p.stderr.decode('utf-8')


def example(name):
    return os.path.join(SRCDIR, 'data', 'examples', name)


class Spanish(unittest.TestCase):
    """C.UTF-8 and LANGUAGE=es: no locale to generate, and the messages are Spanish."""

    ES = None
    EN = None

    @classmethod
    def setUpClass(cls):
        cls.ES = {'LC_ALL': 'C.UTF-8', 'LANGUAGE': 'es', 'TRABEATE_LOCALEDIR': LOCALEDIR}
        cls.EN = {'LC_ALL': 'C.UTF-8', 'TRABEATE_LOCALEDIR': LOCALEDIR}

    def test_catalog_built(self):
        self.assertTrue(os.path.isfile(os.path.join(LOCALEDIR, 'es', 'LC_MESSAGES',
                                                    'trabeate.mo')))

    def test_check_table(self):
        rc, es, _ = run(['check', example('demo-beams.trabeate')], self.ES)
        rc_en, en, _ = run(['check', example('demo-beams.trabeate')], self.EN)
        self.assertEqual(rc, rc_en)
        self.assertEqual(rc, 1)   # H1 fails in the demo (see its comment)
        # the heading, the cautions, a member's lines, statuses, a check name, the summary
        for text in ('comprobación de', 'ADVERTENCIA: Los resultados son para el diseño',
                     'No se comprueba:', 'Elemento M1 (línea 11): acero, sección W12X26',
                     'Estado: cumple', 'Estado: NO CUMPLE', 'Reacciones, hacia arriba +',
                     'Envolvente de las combinaciones ASD', 'Flexión', 'Deflexión viva',
                     '\nResumen\n', 'Secciones que cumplen, la más ligera primero'):
            self.assertIn(text, es)
        self.assertNotIn('CAUTION', es)
        self.assertIn('CAUTION: Results are for design', en)
        # the numbers are the English table's, with their points
        self.assertEqual(re.findall(r'-?\d+\.\d+', es), re.findall(r'-?\d+\.\d+', en))

    def test_floor_tables(self):
        rc, es, _ = run(['check', example('demo-floor.trabeate')], self.ES)
        self.assertEqual(rc, 0)
        for text in ('Cargas en columnas, planta Mezzanine', 'Cargas en muros, planta',
                     'Totales, planta Mezzanine', 'viga principal de (0\'-0", 16\'-0")',
                     'Las columnas y los muros se muestran con las cargas que reciben'):
            self.assertIn(text, es)

    def test_help(self):
        rc, out, _ = run(['--help'], self.ES)
        self.assertEqual(rc, 0)
        for text in ('Uso:', 'Órdenes:', 'Opciones:', 'trabeate-cli check ARCHIVO [--json]',
                     '--no-shortcuts', 'Estado de salida:'):
            self.assertIn(text, out)
        rc, out, _ = run(['report', '--help'], self.ES)
        self.assertEqual(rc, 0)
        self.assertIn('Escribe el informe impreso', out)

    def test_errors(self):
        rc, _, err = run(['frobnicate'], self.ES)
        self.assertEqual(rc, 2)
        self.assertIn('orden desconocida «frobnicate»', err)
        rc, _, err = run(['check', '--member', 'NOPE', example('demo-floor.trabeate')], self.ES)
        self.assertEqual(rc, 2)
        self.assertIn('no hay ningún elemento con id «NOPE»', err)

    def test_schedule(self):
        rc, es, _ = run(['schedule', example('demo-floor.trabeate')], self.ES)
        self.assertEqual(rc, 0)
        self.assertIn('cuadro de', es)
        self.assertIn('marca', es)
        self.assertIn('viga principal', es)
        # CSV is for programs: the same in every language
        _, csv_es, _ = run(['schedule', '--csv', example('demo-floor.trabeate')], self.ES)
        _, csv_en, _ = run(['schedule', '--csv', example('demo-floor.trabeate')], self.EN)
        self.assertEqual(csv_es, csv_en)
        self.assertTrue(csv_es.startswith('mark,floor,role,material,section,'))

    def test_json_untranslated(self):
        _, es, _ = run(['check', '--json', example('demo-floor.trabeate')], self.ES)
        _, en, _ = run(['check', '--json', example('demo-floor.trabeate')], self.EN)
        self.assertEqual(es, en)


def comma_locale(tmp):
    """A locale with a decimal comma: an installed one, or one generated into tmp (LOCPATH)."""
    have = subprocess.run(['locale', '-a'], capture_output=True, text=True).stdout.split()
    for name, alias in (('es_ES.UTF-8', 'es_ES.utf8'), ('de_DE.UTF-8', 'de_DE.utf8')):
        if alias in have or name in have:
            return name, {}
    localedef = shutil.which('localedef')
    if localedef is None:
        raise AssertionError('no comma locale and no localedef (libc-bin)')
    for name, source in (('es_ES.UTF-8', 'es_ES'), ('de_DE.UTF-8', 'de_DE')):
        p = subprocess.run([localedef, '-i', source, '-f', 'UTF-8', os.path.join(tmp, name)],
                           capture_output=True, text=True)
        if os.path.isfile(os.path.join(tmp, name, 'LC_NUMERIC')):
            return name, {'LOCPATH': tmp}
    raise AssertionError('localedef could not make es_ES.UTF-8 or de_DE.UTF-8 (install the '
                         'locales package, build-aux/packages.txt): ' + p.stderr)


class Numbers(unittest.TestCase):

    @classmethod
    def setUpClass(cls):
        cls.tmp = tempfile.mkdtemp(prefix='trabeate-locale-')
        cls.locale, cls.extra = comma_locale(cls.tmp)

    @classmethod
    def tearDownClass(cls):
        shutil.rmtree(cls.tmp)

    def env(self, **more):
        e = {'LC_ALL': self.locale}
        e.update(self.extra)
        e.update(more)
        return e

    def test_locale_has_comma(self):
        p = subprocess.run(['/usr/bin/python3', '-c',
                            'import locale; locale.setlocale(locale.LC_ALL, ""); '
                            'print(locale.localeconv()["decimal_point"])'],
                           env=dict(os.environ, **self.env()), capture_output=True, text=True)
        self.assertEqual(p.stdout.strip(), ',', p.stderr)

    def test_project_file(self):
        """tests/test-locale.c: the examples saved and reloaded under the comma locale."""
        e = dict(os.environ)
        e.pop('LANGUAGE', None)
        e.update(self.env())
        p = subprocess.run([TEST_LOCALE], env=e, capture_output=True, text=True, timeout=120)
        sys.stdout.write(p.stdout)
        sys.stderr.write(p.stderr)
        self.assertEqual(p.returncode, 0)

    def test_command_output(self):
        """The table (in English, the catalog left out), the JSON and the CSV are the C
        locale's: the decimal mark is a point in every output."""
        for name in ('demo-beams.trabeate', 'demo-floor.trabeate'):
            for args in (['check'], ['check', '--json'], ['schedule'], ['schedule', '--csv']):
                here = run(args + [example(name)], self.env(TRABEATE_LOCALEDIR=self.tmp))
                c = run(args + [example(name)], {'LC_ALL': 'C.UTF-8',
                                                  'TRABEATE_LOCALEDIR': self.tmp})
                self.assertEqual(here, c, ' '.join(args) + ' ' + name)

    def test_spanish_locale(self):
        """LC_ALL=es_ES.UTF-8 alone (no LANGUAGE): Spanish words, numbers with a point."""
        if not self.locale.startswith('es'):
            self.skipTest('the comma locale is ' + self.locale)
        _, out, _ = run(['check', example('demo-beams.trabeate')],
                        self.env(TRABEATE_LOCALEDIR=LOCALEDIR))
        _, c, _ = run(['check', example('demo-beams.trabeate')],
                      {'LC_ALL': 'C.UTF-8', 'TRABEATE_LOCALEDIR': LOCALEDIR})
        self.assertIn('\nResumen\n', out)
        self.assertNotIn('\nSummary\n', out)
        numbers = re.findall(r'-?\d+\.\d+', out)
        self.assertGreater(len(numbers), 50)
        self.assertEqual(numbers, re.findall(r'-?\d+\.\d+', c))
        self.assertEqual(re.findall(r'\d,\d{2}\b', out), [])


def main():
    global SRCDIR, CLI, LOCALEDIR, TEST_LOCALE
    if len(sys.argv) < 3:
        sys.exit(__doc__ if __doc__ else 'usage: see the head of this file')
    what = sys.argv[1]
    SRCDIR = os.path.abspath(os.path.join(os.path.dirname(os.path.abspath(__file__)), '..'))
    if what == 'catalogs':
        SRCDIR = os.path.abspath(sys.argv[2])
        suite = Catalogs
    elif what == 'cli':
        CLI, LOCALEDIR = sys.argv[2], os.path.abspath(sys.argv[3])
        suite = Spanish
    elif what == 'numbers':
        CLI, TEST_LOCALE = sys.argv[2], sys.argv[3]
        LOCALEDIR = os.path.abspath(sys.argv[4])
        suite = Numbers
    else:
        sys.exit('unknown check ' + what)
    result = unittest.TextTestRunner(stream=sys.stdout, verbosity=2).run(
        unittest.defaultTestLoader.loadTestsFromTestCase(suite))
    sys.exit(0 if result.wasSuccessful() else 1)


if __name__ == '__main__':
    main()
