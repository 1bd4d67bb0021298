#!/bin/sh
# Times `walden check` over 100,000 step lines: 50 Markdown pages of 2,000
# steps each, generated from six kinds of step with varied temperatures and
# label chains (every fifth step uses the product of the one before).
# Usage: sh testdata/check/time-100k.sh   (from the repository root;
# WALDEN_BIN=path times that binary instead of building one)
set -e
dir=$(mktemp -d)
trap 'rm -rf "$dir"' EXIT
if [ -n "$WALDEN_BIN" ]; then cp "$WALDEN_BIN" "$dir/walden"; else go build -o "$dir/walden" .; fi
for f in $(seq 1 50); do
  awk -v f="$f" 'BEGIN {
    k[0] = "C[C@H](Br)CCc1ccccc1 + NaN3 (1.5 eq), DMF, %d °C"
    k[1] = "C[C@H](O)CCc1ccccc1 + TsCl (1.2 eq) + pyridine, DCM, 0 °C to rt, %d h"
    k[2] = "CC(C)(Br)CCc1ccccc1 + KOtBu, THF, %d °C"
    k[3] = "CCCCBr + NaI, acetone, %d °C"
    k[4] = "BrCc1ccccc1 + OCCc1ccccc1 + NaH, THF, 0 °C, %d h"
    k[5] = "CCCCCl + NaCN, DMSO, %d °C -> CCCCC#N"
    print "# Page " f "\n"
    for (i = 0; i < 2000; i++) {
      if (i % 20 == 0) { if (i > 0) print "```\n\nProse.\n"; print "```reaction" }
      line = sprintf(k[i % 6], 20 + (i * 7 + f) % 97)
      if (i % 5 == 3) line = "s" i ": " line
      if (i % 5 == 4) line = sprintf("@s%d + NaN3, DMF, %d °C", i - 1, 20 + (i + f) % 89)
      print line
    }
    print "```"
  }' > "$dir/page$f.md"
done
echo "steps: $(cat "$dir"/page*.md | grep -c -v -e '^```' -e '^#' -e '^Prose' -e '^$')"
/usr/bin/time -v "$dir/walden" check --quiet --format json "$dir" > /dev/null 2> "$dir/time.txt" || true
grep -E 'Elapsed|Maximum resident|User time|System time|Minor' "$dir/time.txt"
