#!/bin/sh
# Runs one browser test (report.mjs or serve.mjs) against the apograph
# binary in headless Debian chromium, through puppeteer-core. Exits 77
# (ctest: skipped) with the reason when node, chromium or the driver is
# missing; a browser is never downloaded.
#   usage: run.sh TEST.mjs APOGRAPH_BINARY ARTIFACT_DIR
set -eu
here=$(cd "$(dirname "$0")" && pwd)
test_file=$1 apograph=$2 artifacts=$3
chromium=${CHROMIUM:-/usr/bin/chromium}
# CI sets APOGRAPH_REQUIRE_BROWSER so that a missing piece fails instead.
skip() {
  if [ -n "${APOGRAPH_REQUIRE_BROWSER:-}" ]; then echo "FAILED (APOGRAPH_REQUIRE_BROWSER): $1"; exit 1; fi
  echo "SKIPPED: $1"; exit 77
}
command -v node >/dev/null 2>&1 || skip "node is not installed (Debian: apt-get install nodejs npm)"
[ -x "$chromium" ] || skip "no chromium at $chromium (Debian: apt-get install chromium; or set CHROMIUM)"
[ -d "$here/node_modules/puppeteer-core" ] ||
  skip "the driver is not installed (cd tests/browser && PUPPETEER_SKIP_DOWNLOAD=1 npm ci)"
mkdir -p "$artifacts"
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cd "$work"
CHROMIUM="$chromium" APOGRAPH="$apograph" ARTIFACTS="$artifacts" node "$here/$test_file"
