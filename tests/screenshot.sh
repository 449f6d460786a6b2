#!/usr/bin/env bash
# SPDX-FileCopyrightText: 2026 The Trabeate developers
# SPDX-License-Identifier: GPL-3.0-or-later
#
# Regenerates docs/screenshots/ from the GUI test's screenshot case: the editor on the demo
# floor, a girder picked, each page of the side panel, in the light and the dark style.
# Usage: tests/screenshot.sh [builddir]   (default: build; it must be built)
set -euo pipefail
top=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
builddir=$(cd "${1:-$top/build}" && pwd)
out="$top/docs/screenshots"
mkdir -p "$out"

xvfb=(); [ -n "${DISPLAY:-}${WAYLAND_DISPLAY:-}" ] || xvfb=(xvfb-run -a -s "-screen 0 1600x1000x24")

# The demo in a home folder of its own, so that the window's subtitle reads ~/Projects.
home=$(mktemp -d)
trap 'rm -rf "$home"' EXIT
mkdir -p "$home/Projects"
cp "$top/data/examples/demo-floor.trabeate" "$home/Projects/"

shot() {
  local name=$1 page=$2 dark=$3
  env HOME="$home" XDG_DATA_HOME="$home/.local/share" XDG_CACHE_HOME="$home/.cache" \
      XDG_CONFIG_HOME="$home/.config" TRB_SCREENSHOT_FILE="$home/Projects/demo-floor.trabeate" \
      G_TEST_SRCDIR="$top/tests" G_TEST_BUILDDIR="$builddir/tests" \
      GSETTINGS_BACKEND=memory GSETTINGS_SCHEMA_DIR="$builddir/data" GSK_RENDERER=cairo \
      GTK_A11Y=none NO_AT_BRIDGE=1 LC_ALL=C.UTF-8 \
      TRB_SCREENSHOT="$out/$name.png" TRB_SCREENSHOT_PAGE="$page" \
      ${dark:+TRB_SCREENSHOT_DARK=1} \
      "${xvfb[@]}" "$builddir/src/app/test-app" -q -p /trb/app/screenshot
  echo "$out/$name.png"
}

shot editor member ""
shot editor-diagrams diagrams ""
shot editor-sections sections ""
shot editor-dark member 1
