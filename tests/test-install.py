#!/usr/bin/env python3
# SPDX-FileCopyrightText: 2026 The Trabeate developers
# SPDX-License-Identifier: GPL-3.0-or-later
#
# What a desktop finds of Trabeate (docs/installing.md):
#
#   test-install.py install MESON BUILDDIR
#       `meson install --destdir` into a temporary folder; every file where a desktop looks
#       for it; the installed desktop file, metainfo, schema and MIME type valid; the
#       installed command run on the installed demo (and in Spanish, from the installed
#       catalog).
#   test-install.py schema GSCHEMA SRCDIR
#       every key of the settings schema has a summary, a description and a default, and the
#       editor reads it.
#   test-install.py mime MIME-XML DESKTOP SRCDIR
#       the MIME type: well-formed, *.trabeate and the root element <trabeate-project> (the
#       one the RELAX NG schema and the examples have), named by the desktop file, compiled by
#       update-mime-database.

import configparser
import glob
import json
import os
import re
import shutil
import subprocess
import sys
import tempfile
import unittest
import xml.etree.ElementTree as ET

APP_ID = 'org.trabeate.Trabeate'
MIME_TYPE = 'application/x-trabeate-project'
MIME_NS = '{http://www.freedesktop.org/standards/shared-mime-info}'
ARGS = []


def tool(name):
    path = shutil.which(name)
    if path is None:
        raise unittest.SkipTest(name + ' is not installed (build-aux/packages.txt)')
    return path


def run(cmd, env=None, check=True):
    p = subprocess.run(cmd, capture_output=True, text=True, env=env, timeout=240)
    # update-mime-database reports a bad rule on stderr and still exits 0
    if check and (p.returncode != 0 or re.search(r'\bError\b', p.stderr)):
        raise AssertionError('%s: exit %d\n%s%s' % (' '.join(cmd), p.returncode, p.stdout,
                                                     p.stderr))
    return p


def members_of(path):
    """The member ids of a project file, in its order."""
    return [m.get('id') for m in ET.parse(path).getroot().iter('member')]


def glob_types(mime_dir):
    """update-mime-database's globs2: pattern -> type."""
    out = {}
    with open(os.path.join(mime_dir, 'globs2'), encoding='utf-8') as f:
        for line in f:
            if line.startswith('#'):
                continue
            weight, mtype, pattern = line.strip().split(':')[:3]
            out[pattern] = mtype
    return out


class Install(unittest.TestCase):

    @classmethod
    def setUpClass(cls):
        meson, builddir = ARGS
        cls.builddir = os.path.abspath(builddir)
        cls.destdir = tempfile.mkdtemp(prefix='trabeate-install-')
        with open(os.path.join(cls.builddir, 'meson-info', 'intro-buildoptions.json')) as f:
            options = {o['name']: o['value'] for o in json.load(f)}
        prefix = options['prefix']

        def where(option):
            value = options[option]
            path = value if os.path.isabs(value) else os.path.join(prefix, value)
            return cls.destdir + path

        cls.bindir = where('bindir')
        cls.datadir = where('datadir')
        cls.localedir = where('localedir')
        # DESTDIR: nothing outside the temporary folder, and the post-install cache updates
        # (gnome.post_install) skip themselves
        run([meson, 'install', '-C', cls.builddir, '--no-rebuild', '--quiet',
             '--destdir', cls.destdir])

    @classmethod
    def tearDownClass(cls):
        shutil.rmtree(cls.destdir)

    def data(self, *parts):
        return os.path.join(self.datadir, *parts)

    def assert_file(self, path):
        self.assertTrue(os.path.isfile(path), path + ' is installed')
        self.assertGreater(os.path.getsize(path), 0, path)

    def test_programs(self):
        for name in ('trabeate-cli', 'trabeate'):
            path = os.path.join(self.bindir, name)
            self.assert_file(path)
            self.assertTrue(os.access(path, os.X_OK), path)

    def test_files_where_a_desktop_looks(self):
        for parts in (('applications', APP_ID + '.desktop'),
                      ('metainfo', APP_ID + '.metainfo.xml'),
                      ('glib-2.0', 'schemas', APP_ID + '.gschema.xml'),
                      ('mime', 'packages', APP_ID + '.xml'),
                      ('icons', 'hicolor', 'scalable', 'apps', APP_ID + '.svg'),
                      ('icons', 'hicolor', 'symbolic', 'apps', APP_ID + '-symbolic.svg'),
                      ('trabeate', 'examples', 'demo-floor.trabeate'),
                      ('trabeate', 'examples', 'demo-beams.trabeate'),
                      ('trabeate', 'examples', 'overhang-beam.trabeate'),
                      ('doc', 'trabeate', 'user-guide.md'),
                      ('doc', 'trabeate', 'file-format.md'),
                      ('doc', 'trabeate', 'design-methods.md'),
                      ('doc', 'trabeate', 'cli.md'),
                      ('doc', 'trabeate', 'installing.md'),
                      ('doc', 'trabeate', 'screenshots', 'editor.png')):
            self.assert_file(self.data(*parts))
        self.assert_file(os.path.join(self.localedir, 'es', 'LC_MESSAGES', 'trabeate.mo'))

    def test_help_links(self):
        """The installed help's links to its own pages and pictures resolve."""
        docs = self.data('doc', 'trabeate')
        for page in glob.glob(os.path.join(docs, '*.md')):
            with open(page, encoding='utf-8') as f:
                text = f.read()
            for target in re.findall(r'\]\(([^)#:\s]+\.(?:md|png))\)', text):
                self.assertTrue(os.path.isfile(os.path.join(docs, target)),
                                '%s links to %s' % (os.path.basename(page), target))

    def test_desktop_file(self):
        path = self.data('applications', APP_ID + '.desktop')
        run([tool('desktop-file-validate'), path])
        entry = configparser.ConfigParser(interpolation=None, strict=False)
        entry.optionxform = str
        entry.read(path, encoding='utf-8')
        d = entry['Desktop Entry']
        self.assertEqual(d['Icon'], APP_ID)
        self.assertIn(MIME_TYPE, d['MimeType'].split(';'))
        self.assertTrue(d['Exec'].startswith('trabeate '))
        # the Spanish catalog merged in
        self.assertEqual(d['Comment[es]'],
                         'Trazar, cargar, dimensionar y comprobar la estructura de un entrepiso')
        # update-desktop-database finds the desktop file for the project's type
        apps = tempfile.mkdtemp(prefix='trabeate-apps-')
        try:
            shutil.copy(path, apps)
            run([tool('update-desktop-database'), apps])
            with open(os.path.join(apps, 'mimeinfo.cache'), encoding='utf-8') as f:
                self.assertIn('%s=%s.desktop;' % (MIME_TYPE, APP_ID), f.read())
        finally:
            shutil.rmtree(apps)

    def test_metainfo(self):
        path = self.data('metainfo', APP_ID + '.metainfo.xml')
        run([tool('appstreamcli'), 'validate', '--no-net', path])
        root = ET.parse(path).getroot()
        self.assertEqual(root.findtext('id'), APP_ID)
        self.assertEqual(root.find('launchable').text, APP_ID + '.desktop')
        langs = {e.get('{http://www.w3.org/XML/1998/namespace}lang')
                 for e in root.iter('summary')}
        self.assertIn('es', langs)

    def test_schema(self):
        schemas = self.data('glib-2.0', 'schemas')
        out = tempfile.mkdtemp(prefix='trabeate-schemas-')
        try:
            run([tool('glib-compile-schemas'), '--strict', '--targetdir', out, schemas])
            p = run([tool('gsettings'), 'list-keys', APP_ID],
                    env=dict(os.environ, GSETTINGS_SCHEMA_DIR=out))
            self.assertIn('unit-system', p.stdout.split())
        finally:
            shutil.rmtree(out)

    def test_mime_type(self):
        mime = tempfile.mkdtemp(prefix='trabeate-mime-')
        try:
            os.makedirs(os.path.join(mime, 'packages'))
            shutil.copy(self.data('mime', 'packages', APP_ID + '.xml'),
                        os.path.join(mime, 'packages'))
            run([tool('update-mime-database'), mime])
            self.assertEqual(glob_types(mime).get('*.trabeate'), MIME_TYPE)
        finally:
            shutil.rmtree(mime)

    def test_installed_command_on_installed_demo(self):
        cli = os.path.join(self.bindir, 'trabeate-cli')
        demo = self.data('trabeate', 'examples', 'demo-floor.trabeate')
        env = {k: v for k, v in os.environ.items() if k not in ('LANGUAGE', 'LANG')}
        env['LC_ALL'] = 'C.UTF-8'
        p = run([cli, 'check', demo], env=env, check=False)
        # exit 0: every member of the demo floor passes (its own comment says so)
        self.assertEqual(p.returncode, 0, p.stderr)
        summary = p.stdout.split('\nSummary\n', 1)[1].split('\n\n', 1)[0]
        rows = [line.split()[0] for line in summary.splitlines()[1:]]
        self.assertEqual(rows, members_of(demo))
        self.assertIn('CAUTION: Results are for design or review by a licensed engineer',
                      p.stdout)

        # Spanish, from the installed catalog (DESTDIR moved it from where the program looks)
        env.update(LANGUAGE='es', TRABEATE_LOCALEDIR=self.localedir)
        p = run([cli, 'check', demo], env=env, check=False)
        self.assertEqual(p.returncode, 0, p.stderr)
        self.assertIn('\nResumen\n', p.stdout)


class Schema(unittest.TestCase):

    def test_keys(self):
        gschema, srcdir = ARGS
        root = ET.parse(gschema).getroot()
        schemas = root.findall('schema')
        self.assertEqual([s.get('id') for s in schemas], [APP_ID])
        self.assertEqual(schemas[0].get('path'), '/org/trabeate/Trabeate/')
        self.assertEqual(root.get('gettext-domain'), 'trabeate')
        keys = schemas[0].findall('key')
        self.assertGreater(len(keys), 0)
        app = ''
        for path in glob.glob(os.path.join(srcdir, 'src', 'app', '*.c')):
            with open(path, encoding='utf-8') as f:
                app += f.read()
        for key in keys:
            name = key.get('name')
            for part in ('summary', 'description', 'default'):
                text = key.findtext(part)
                self.assertTrue(text is not None and text.strip(), '%s: <%s>' % (name, part))
            # the editor reads it: g_settings_get_*/g_settings_bind* name it
            self.assertIn('"%s"' % name, app, name + ' is read by src/app')

    def test_compiles_strict(self):
        gschema, srcdir = ARGS
        run([tool('glib-compile-schemas'), '--strict', '--dry-run',
             os.path.dirname(os.path.abspath(gschema))])


class Mime(unittest.TestCase):

    def test_type(self):
        mime_xml, desktop, srcdir = ARGS
        run([tool('xmllint'), '--noout', mime_xml])
        types = ET.parse(mime_xml).getroot().findall(MIME_NS + 'mime-type')
        self.assertEqual([t.get('type') for t in types], [MIME_TYPE])
        t = types[0]
        self.assertEqual([g.get('pattern') for g in t.findall(MIME_NS + 'glob')], ['*.trabeate'])
        roots = [r.get('localName') for r in t.findall(MIME_NS + 'root-XML')]
        self.assertEqual(roots, ['trabeate-project'])
        self.assertEqual(t.find(MIME_NS + 'sub-class-of').get('type'), 'application/xml')

        # the element the loader's RELAX NG schema starts with, and every example's root
        rng = ET.parse(os.path.join(srcdir, 'data', 'trabeate-project.rng')).getroot()
        ns = '{http://relaxng.org/ns/structure/1.0}'
        start = rng.find(ns + 'start')
        first = start.find('.//' + ns + 'element')
        if first is None:
            ref = start.find('.//' + ns + 'ref').get('name')
            define = [d for d in rng.iter(ns + 'define') if d.get('name') == ref][0]
            first = define.find('.//' + ns + 'element')
        self.assertEqual(first.get('name'), 'trabeate-project')
        for example in glob.glob(os.path.join(srcdir, 'data', 'examples', '*.trabeate')):
            self.assertEqual(ET.parse(example).getroot().tag, 'trabeate-project', example)

        # the desktop file opens it
        entry = configparser.ConfigParser(interpolation=None, strict=False)
        entry.optionxform = str
        entry.read(desktop, encoding='utf-8')
        self.assertIn(MIME_TYPE, entry['Desktop Entry']['MimeType'].split(';'))

    def test_compiles(self):
        mime_xml, desktop, srcdir = ARGS
        mime = tempfile.mkdtemp(prefix='trabeate-mime-')
        try:
            os.makedirs(os.path.join(mime, 'packages'))
            shutil.copy(mime_xml, os.path.join(mime, 'packages', APP_ID + '.xml'))
            run([tool('update-mime-database'), mime])
            self.assertEqual(glob_types(mime).get('*.trabeate'), MIME_TYPE)
            # the root element is what tells a .xml project apart
            with open(os.path.join(mime, 'XMLnamespaces'), encoding='utf-8') as f:
                self.assertIn(' trabeate-project ' + MIME_TYPE, f.read())
            # the comment, translated into Spanish by the merge from po/
            tree = ET.parse(os.path.join(mime, 'application', 'x-trabeate-project.xml'))
            comments = {c.get('{http://www.w3.org/XML/1998/namespace}lang'): c.text
                        for c in tree.getroot().findall(MIME_NS + 'comment')}
            self.assertEqual(comments[None], 'Trabeate floor framing project')
            self.assertEqual(comments['es'], 'Proyecto de estructura de entrepiso de Trabeate')
        finally:
            shutil.rmtree(mime)


def main():
    global ARGS
    suites = {'install': Install, 'schema': Schema, 'mime': Mime}
    if len(sys.argv) < 2 or sys.argv[1] not in suites:
        sys.exit('usage: test-install.py install|schema|mime ARGS... (see the head of the file)')
    ARGS = sys.argv[2:]
    result = unittest.TextTestRunner(stream=sys.stdout, verbosity=2).run(
        unittest.defaultTestLoader.loadTestsFromTestCase(suites[sys.argv[1]]))
    sys.exit(0 if result.wasSuccessful() else 1)


if __name__ == '__main__':
    main()
