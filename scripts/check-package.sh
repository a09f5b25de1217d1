#!/usr/bin/env bash
# Builds the Debian package in a configured and built tree (default build/release), installs it
# with apt-get (root, or sudo) and checks the installed copy: finestra-cli --version and lines on an
# installed example, the Python module, the desktop file, the AppStream metainfo and the MIME type
# (a project recognised by its content, plain JSON left alone).
# Fails loudly on the first problem. Usage: scripts/check-package.sh [BUILD_DIR]
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
build="$(cd "${1:-$root/build/release}" && pwd)"
if [[ $(id -u) -eq 0 ]]; then sudo=(); else sudo=(sudo); fi
fail() { echo "check-package: $*" >&2; exit 1; }

version="$("$build/app/cli/finestra-cli" --version)"
(cd "$build" && cpack -G DEB)
deb=("$build"/finestra_"$version"_*.deb)
[[ -f "${deb[0]}" ]] || fail "no finestra_${version}_*.deb in $build"
dpkg-deb --info "${deb[0]}"
DEBIAN_FRONTEND=noninteractive "${sudo[@]}" apt-get install -y --reinstall "${deb[0]}"

cli=/usr/bin/finestra-cli
examples=/usr/share/finestra/examples
[[ "$("$cli" --version)" == "$version" ]] || fail "installed finestra-cli --version is not $version"
(cd /tmp && "$cli" lines "$examples/membrane-vector-magnet.json") > /tmp/finestra-installed-lines.txt
grep -Eq '^ +0 +[A-D][0-9]' /tmp/finestra-installed-lines.txt || fail "installed 'finestra-cli lines' printed no line table"
head -4 /tmp/finestra-installed-lines.txt
[[ -x /usr/bin/finestra ]] || fail "the desktop application /usr/bin/finestra is not installed"

desktop-file-validate /usr/share/applications/finestra.desktop
appstreamcli validate --no-net /usr/share/metainfo/org.finestra.Finestra.metainfo.xml
grep -q 'application/x-finestra-project+json' /usr/share/mime/types \
  || fail "the MIME database does not know application/x-finestra-project+json"
# Our projects are recognised by content, plain JSON stays JSON (gio: package libglib2.0-bin).
probe="$(mktemp -d)"
cp "$examples/membrane-vector-magnet.json" "$probe/project.json"
echo '{"plain": true}' >"$probe/plain.json"
mime_of() { gio info -a standard::content-type "$1" | sed -n 's/.*standard::content-type: //p'; }
[[ "$(mime_of "$probe/project.json")" == application/x-finestra-project+json ]] || fail "a project is not recognised"
[[ "$(mime_of "$probe/plain.json")" == application/json ]] || fail "plain JSON is claimed by Finestra"
rm -rf "$probe"
[[ -f /usr/share/icons/hicolor/scalable/apps/finestra.svg ]] || fail "application icon missing"

contents="$(dpkg-deb --contents "${deb[0]}")"
if grep -q 'dist-packages/finestra/' <<<"$contents"; then
  (cd /tmp && /usr/bin/python3 -c 'import finestra, sys; print("python module", finestra.__version__, finestra.__file__); sys.exit(finestra.__version__ != sys.argv[1])' "$version")
  (cd /tmp && /usr/bin/python3 "$examples/python_sweep_and_fit.py" /tmp/finestra-installed-example.png) | tail -3
fi
echo "check-package: $(basename "${deb[0]}") installed and checked"
