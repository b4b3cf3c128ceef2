#!/usr/bin/env bash
# scripts/slurm_sweep with a stand-in scheduler: three shards as array tasks, then the collect
# step, give the summary of the six-variant test study (five ok, the invalid one recorded).
set -euo pipefail
source_dir=$1 turnfield=$2
out=$(mktemp -d)/sweep
trap 'rm -rf "$(dirname "$out")"' EXIT
SBATCH="$source_dir/tests/scripts/standin_sbatch" TURNFIELD="$turnfield" \
  "$source_dir/scripts/slurm_sweep" "$source_dir/tests/data/sweep/six_variants.toml" "$out" 3 1
summary=$out/sweep_summary.csv
[[ -f $summary ]] || { echo "FAIL: no $summary"; cat "$out"/slurm_logs/*; exit 1; }
ok=$(grep -c ',ok,' "$summary")
invalid=$(grep -c ',invalid,' "$summary")
for i in 1 2 3; do grep -q "shard $i/3 finished" "$out/slurm_logs/shard_$i.log" || { echo "FAIL: shard $i did not run"; exit 1; }; done
[[ $ok == 5 && $invalid == 1 ]] || { echo "FAIL: $ok ok and $invalid invalid rows, expected 5 and 1"; cat "$summary"; exit 1; }
bash "$source_dir/scripts/check_report" "$out/report.html"
echo "slurm_sweep: 3 shards and collect gave 5 ok rows and 1 invalid row"
