#!/usr/bin/env bash
# Same input + seed + iteration budget => same routes. Runs sa and tabu on shared benchmark files and the demo job
# with iteration budgets that reach every phase (ejection-pool opening, the fleet phase with route elimination and
# its closing squeeze on r101 cut to 21 vehicles, the held-fleet distance phase with string ruins, sa's cold polish)
# and keeps each run's routes.csv.
#
#   tests/reproduce.sh record DIR [ANNEAL...]   run every case, routes into DIR/<case>/routes.csv
#   tests/reproduce.sh compare DIR1 DIR2       cmp every case's routes.csv; exit 1 on any difference
#
# ANNEAL defaults to the Release build of this checkout (built first). To check a change: record with the build
# before it (e.g. `dotnet /tmp/anneal-before/anneal.dll`), record again after, compare the two folders.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
bench="${ANNEAL_BENCHMARKS:-$root/../shared/benchmarks}"

cases() {
    # name | solver | iterations | objective | input
    local sa=2000000 tabu=10000
    for solver in sa tabu; do
        local n=$sa; [ "$solver" = tabu ] && n=$tabu
        echo "$solver-r101-distance $solver $n distance $bench/solomon/r101.txt"
        echo "$solver-r101-vtd $solver $n vehicles-then-distance $bench/solomon/r101.txt"
        echo "$solver-c201-distance $solver $n distance $bench/solomon/c201.txt"
        echo "$solver-c201-vtd $solver $n vehicles-then-distance $bench/solomon/c201.txt"
        echo "$solver-rc105-distance $solver $n distance $bench/solomon/rc105.txt"
        echo "$solver-rc105-vtd $solver $n vehicles-then-distance $bench/solomon/rc105.txt"
        echo "$solver-r1_2_1-distance $solver $n distance $bench/homberger/r1_2_1.txt"
        echo "$solver-r1_2_1-vtd $solver $n vehicles-then-distance $bench/homberger/r1_2_1.txt"
        echo "$solver-r101x21-vtd $solver $n vehicles-then-distance @r101x21"
        echo "$solver-marl-valley-cost $solver $n cost $root/instances/marl-valley"
    done
}

record() {
    local out="$1"; shift
    local -a anneal
    if [ $# -gt 0 ]; then
        anneal=("$@")
    else
        dotnet build "$root/src/Anneal.Cli" -c Release -v quiet -nologo >/dev/null
        anneal=(dotnet "$root/src/Anneal.Cli/bin/Release/net10.0/anneal.dll")
    fi

    [ -f "$bench/solomon/r101.txt" ] || { echo "benchmarks not found at $bench (set ANNEAL_BENCHMARKS)" >&2; exit 2; }
    mkdir -p "$out"
    # r101 with 21 vehicles instead of 25: cheapest insertion cannot serve it on the hard windows, so the run goes
    # through route elimination rather than opening with the ejection pool. Made in the output folder, never in the repo.
    sed '5s/^\( *\)[0-9]\+/\121/' "$bench/solomon/r101.txt" > "$out/r101x21.txt"
    while read -r name solver iterations objective input; do
        [ "$input" = "@r101x21" ] && input="$out/r101x21.txt"
        rm -rf "${out:?}/$name"
        "${anneal[@]}" solve "$input" --solvers "$solver" --iterations "$iterations" --seed 1 --time 100000 \
            --objective "$objective" --out "$out/$name" --quiet > "$out/$name.txt" || [ $? -eq 3 ]
        echo "$name: $(grep -m1 "^  $solver " "$out/$name.txt" | tr -s ' ')"
    done < <(cases)
}

compare() {
    local a="$1" b="$2" different=0
    while read -r name _; do
        if cmp -s "$a/$name/routes.csv" "$b/$name/routes.csv"; then
            echo "same       $name"
        else
            echo "DIFFERENT  $name"
            different=1
        fi
    done < <(cases)
    exit "$different"
}

case "${1:-}" in
    record) shift; record "$@" ;;
    compare) shift; compare "$@" ;;
    *) sed -n '2,12p' "$0" >&2; exit 2 ;;
esac
