#!/usr/bin/env bash
# The checker shares no code with the prover: no include may leave checker/, and no source of
# checker/ may name a prover file. Also prints the checker's size, which we keep small.
set -u
root=$1
bad=$(grep -rnE '#include[[:space:]]*"' "$root/checker" | grep -E '\.\./|prover/|sweepcert' || true)
if [[ -n $bad ]]; then echo "checker includes code outside checker/:"; echo "$bad"; exit 1; fi
for inc in $(grep -rhoE '#include[[:space:]]*"[^"]+"' "$root/checker" | sed -E 's/.*"([^"]+)"/\1/' | sort -u); do
  if [[ ! -f $root/checker/$inc ]]; then echo "checker includes \"$inc\", which is not in checker/"; exit 1; fi
done
if grep -rnE '#include[[:space:]]*<gmp|GMP_LIBRARY|GMPXX' "$root/checker"; then
  echo "checker must not use GMP (Boost.Multiprecision only)"; exit 1
fi
echo "checker lines (non-blank): $(cat "$root"/checker/*.cpp "$root"/checker/*.hpp | grep -cv '^[[:space:]]*$')"
echo "checker is self-contained"
