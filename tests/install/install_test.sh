#!/bin/sh
# Installs the build into a temporary prefix, moves the prefix (so that no
# path of the build or source tree can serve), and runs the installed program
# from an empty folder: its data folder, demo, manual page and completion.
# usage: install_test.sh BUILD_DIR
set -eu
build=$1
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cmake --install "$build" --prefix "$work/first" >/dev/null
mv "$work/first" "$work/moved"
prefix=$work/moved
mkdir "$work/empty"
cd "$work/empty"
unset APOGRAPH_DATA APOGRAPH_SCRIPTS
fail() { echo "install test: $*" >&2; exit 1; }

"$prefix/bin/apograph" --version | grep -qx "data folder: $prefix/share/apograph (APOGRAPH_DATA to change it)" ||
  fail "the installed program does not use its own data folder: $("$prefix/bin/apograph" --version)"
"$prefix/bin/apograph" -V | grep -q '^apograph ' || fail "-V does not print the version"
test -f "$prefix/share/apograph/scripts/hindu-arabic.script" || fail "numeral scripts not installed"
test -f "$prefix/share/apograph/catalog/parameters.tsv" || fail "catalog not installed"

status=0
"$prefix/bin/apograph" demo --output demo-out >demo.log 2>&1 || status=$?
[ "$status" -le 1 ] || { cat demo.log >&2; fail "demo exited $status"; }
test -f demo-out/edition.sqlite || fail "demo wrote no database"

# The HTTP library is loaded by `serve` alone (src/serve/http_module.hpp):
# the program itself must not need it, and the installed serve must find
# its module under lib/apograph.
if command -v ldd >/dev/null && ldd "$prefix/bin/apograph" | grep -q httplib; then
  fail "the program loads the HTTP library at start-up"
fi
if [ -f "$build/apograph-http.so" ]; then
  test -f "$prefix/lib/apograph/apograph-http.so" || fail "HTTP module not installed"
  "$prefix/bin/apograph" serve --db demo-out/edition.sqlite >serve.log 2>&1 &
  pid=$!
  i=0
  while [ "$i" -lt 100 ] && ! grep -q "review page at" serve.log; do sleep 0.1; i=$((i + 1)); done
  kill "$pid" 2>/dev/null || true
  wait "$pid" 2>/dev/null || true
  grep -q "review page at http://127.0.0.1:" serve.log ||
    { cat serve.log >&2; fail "the installed serve did not start"; }
fi

man_page=$prefix/share/man/man1/apograph.1
head -n 1 "$man_page" | grep -q '^\.TH APOGRAPH 1' || fail "no manual page"
for c in $("$prefix/bin/apograph" --help | sed -n 's/^  \([a-z][a-z]*\)  .*/\1/p'); do
  grep -q "^\.SS $c\$" "$man_page" || fail "the manual page lacks the command $c"
done

completion=$prefix/share/bash-completion/completions/apograph
if command -v bash >/dev/null; then
  got=$(bash -c ". '$completion'; COMP_WORDS=(apograph imp); COMP_CWORD=1; _apograph; echo \"\${COMPREPLY[*]}\"")
  [ "$got" = import ] || fail "completing 'apograph imp' gave '$got'"
  got=$(bash -c ". '$completion'; COMP_WORDS=(apograph fit --mo); COMP_CWORD=2; _apograph; echo \"\${COMPREPLY[*]}\"")
  [ "$got" = --model ] || fail "completing 'apograph fit --mo' gave '$got'"
fi
echo "install test: passed"
