#!/usr/bin/env bash
# Writes the command line's outputs on every sample project into a folder,
# so a restructuring can be checked to change no result:
#
#   scripts/cli-snapshot.sh /tmp/before      # on the old commit
#   scripts/cli-snapshot.sh /tmp/after       # on the new one
#   diff -r /tmp/before /tmp/after
#
# It runs the release binary (built if needed). Every sample, every variant:
# eval (table and JSON), freeze --json, sweep --csv, solve --json, and one
# batch file built from all the variants.
set -uo pipefail
out=${1:?usage: scripts/cli-snapshot.sh OUT_DIR}
cd "$(dirname "$0")/.."
cargo build --release -q -p colligo || exit 1
bin=target/release/colligo
mkdir -p "$out"
run() { # name, args...
    local name=$1; shift
    "$bin" "$@" >"$out/$name.out" 2>"$out/$name.err"
    echo "exit $?" >>"$out/$name.err"
}
for f in samples/*.ron; do
    s=$(basename "$f" .ron)
    grep -oP '^            name: "\K[^"]+' "$f" | while read -r v; do
        k="$s.$(echo "$v" | tr ' /' '__')"
        run "$k.eval" eval "$f" --variant "$v"
        run "$k.eval-json" eval "$f" --variant "$v" --json
        run "$k.eval-json-4C" eval "$f" --variant "$v" --json --temperature 4C --pressure 1600m --storage -25C
        for m in ideal norrish ross zsr pitzer; do
            run "$k.eval-json-$m" eval "$f" --variant "$v" --json --model "$m"
        done
        run "$k.freeze" freeze "$f" --variant "$v" --json --from -0.5 --to -40 --step 0.5
        run "$k.freeze-table" freeze "$f" --variant "$v"
        run "$k.sweep" sweep "$f" --variant "$v" --ingredient sucrose --from 0g --to 300g --steps 30 --csv
        run "$k.sweep-json" sweep "$f" --variant "$v" --ingredient water --from 100g --to 900g --steps 8 --json
        run "$k.sweep-tsv" sweep "$f" --variant "$v" --ingredient glycerol --to 100g --steps 10
        run "$k.solve" solve "$f" --variant "$v" --ingredient glycerol --target water_activity=0.80 --json
        run "$k.solve-fp" solve "$f" --variant "$v" --ingredient sodium_chloride --target freezing_point_c=-8 --json
        run "$k.solve-ice" solve "$f" --variant "$v" --ingredient sucrose --target "ice_fraction_of_water@-18C=0.6"
    done
done
# A batch file from fixed mixes (every column an ingredient id in grams).
cat >"$out/batch-input.csv" <<'CSV'
name,water,sucrose,glucose,sodium_chloride,glycerol,potassium_chloride,ethanol,lactose,calcium_chloride
syrup,100,150,,,,,,,
brine,100,,,20,,,,,
mixed,100,40,10,5,10,3,,5,
spirit,100,10,,,,,15,,
cacl2,100,,,,,,,,30
empty,,,,,,,,,
"quoted, name",50,50,,,,,,,
CSV
run batch-aw batch "$out/batch-input.csv"
run batch-all batch "$out/batch-input.csv" --properties water_activity,erh_percent,vapor_pressure_pa,relative_lowering,freezing_point_c,boiling_point_c,ice_fraction_of_water,osmolality_mosmol_per_kg,osmotic_pressure_mpa,water_percent,soluble_solids_percent,temperature_c,storage_temperature_c
run batch-fast batch "$out/batch-input.csv" --properties water_activity,erh_percent,vapor_pressure_pa,osmolality_mosmol_per_kg,soluble_solids_percent --temperature 40C --model zsr
for m in auto ideal norrish ross zsr pitzer; do run "batch-$m" batch "$out/batch-input.csv" --model "$m" --properties water_activity,freezing_point_c; done
run mix-eval eval --mix "water=100g, sucrose=50g, sodium_chloride=2g" --json
run mix-freeze freeze --mix "water=900g, sodium_chloride=100g" --from -1 --to -30 --step 1 --json
run mix-solve solve --mix "water=100g, sucrose=30g" --ingredient glycerol --target erh_percent=85
run err-unknown eval --mix "sucrse=1g, water=10g"
run err-solve solve --mix "water=100g" --ingredient sucrose --target water_activity=0.1
echo "wrote $(ls "$out" | wc -l) files to $out"
