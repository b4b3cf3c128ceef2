#!/usr/bin/env bash
# scripts/slurm_sweep against a real Slurm: a one-node cluster (munged, slurmctld, slurmd) started on
# this machine inside a temporary folder, listening on 127.0.0.1 only.
#   1. The bundled 18-variant sweep as 3 array tasks and a collect job gives a summary byte-equal
#      to an unsharded local run's.
#   2. A node failure: one array task is cancelled while it runs; the collect job (afterany) still
#      runs and reports the missing variants; submitting the same command again into the same folder
#      redoes only what is missing and ends with the same byte-equal summary.
# Exits 77 (a skip for ctest) with the daemon's own message where Slurm or munge cannot run here.
#
#   tests/scripts/test_slurm_real.sh SOURCE_DIR TURNFIELD
set -euo pipefail
source_dir=$(cd "$1" && pwd) turnfield=$2
sweep_file=$source_dir/cases/sweeps/pump24_pitch_and_phases.toml
shards=3

# Every wait below ends by this deadline, well inside ctest's TIMEOUT: ctest kills with SIGKILL,
# which would leave the daemons running, so the test must end on its own first.
deadline=$((SECONDS + 220))
skip() { echo "SKIP: $*"; exit 77; }
fail() { echo "FAIL: $*"; exit 1; }

for tool in munged mungekey slurmctld slurmd sbatch squeue sinfo scancel; do
  command -v "$tool" >/dev/null || skip "$tool not found (scripts/setup installs munge and slurm-wlm)"
done
[[ $(id -u) == 0 ]] || skip "needs root: slurmd runs each job as the user who submitted it, which only root can"

tmp=$(mktemp -d)
# munged wants every folder above its socket searchable by all (clients must reach it) and none
# writable by others; the key itself is 0600.
chmod 711 "$tmp"
pids=()
stop_all() {
  # Jobs first (slurmd kills their processes), then the daemons in reverse order of starting.
  [[ -n ${SLURM_CONF:-} && ${#pids[@]} -ge 3 ]] && scancel --quiet --user=root 2>/dev/null || true
  for ((i = ${#pids[@]} - 1; i >= 0; i--)); do kill "${pids[i]}" 2>/dev/null || true; done
  for pid in "${pids[@]}"; do
    for _ in $(seq 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    kill -9 "$pid" 2>/dev/null || true
  done
  rm -rf "$tmp"
}
trap stop_all EXIT
trap 'exit 1' INT TERM HUP  # so that the EXIT trap runs when the test is stopped

# Two free TCP ports, so that a Slurm already on this machine (6817/6818) is left alone.
free_port() {
  local p
  for _ in $(seq 100); do
    p=$((20000 + RANDOM % 20000))
    ss -Hltn "sport = :$p" 2>/dev/null | grep -q . || { echo "$p"; return; }
  done
  skip "no free TCP port found"
}

# Waits up to $1 seconds (and not past the deadline) for the command after it to succeed.
wait_for() {
  local limit=$1; shift
  local end=$((SECONDS + limit < deadline ? SECONDS + limit : deadline))
  until "$@"; do ((SECONDS < end)) || return 1; sleep 0.2; done
}

# Starts a daemon, told to stay in the foreground, as a background job; $1 names it for messages.
start_daemon() {
  local name=$1; shift
  "$@" >"$tmp/$name.stderr" 2>&1 &
  pids+=($!)
}
# Skips with the daemon's own words if it has died.
alive_or_skip() {
  local name=$1 pid=$2 log=$3
  kill -0 "$pid" 2>/dev/null && return 0
  echo "$name died at start; its messages:"
  tail -n 20 "$tmp/$name.stderr" "$log" 2>/dev/null || true
  skip "$name cannot run on this machine (see above)"
}

# --- munge: a key and a daemon of our own ---
mkdir -m 711 "$tmp/munge"
mungekey --create --keyfile="$tmp/munge/munge.key" >"$tmp/mungekey.log" 2>&1 ||
  { cat "$tmp/mungekey.log"; skip "mungekey could not create a key"; }
socket=$tmp/munge/munge.socket
start_daemon munged munged --foreground --socket="$socket" \
  --key-file="$tmp/munge/munge.key" --pid-file="$tmp/munge/munged.pid" \
  --log-file="$tmp/munge/munged.log" --seed-file="$tmp/munge/munged.seed"
socket_or_dead() { [[ -S $socket ]] || ! kill -0 "${pids[0]}" 2>/dev/null; }
wait_for 10 socket_or_dead || true
alive_or_skip munged "${pids[0]}" "$tmp/munge/munged.log"
[[ -S $socket ]] || skip "munged made no socket in 10 s"

# --- slurm.conf: one node, this machine's CPUs, no cgroups, everything under $tmp ---
host=$(hostname -s)
cpus=$(nproc)
memory=$(slurmd -C 2>/dev/null | sed -n 's/.*RealMemory=\([0-9]*\).*/\1/p')
[[ -n $memory ]] || skip "slurmd -C reports no memory: $(slurmd -C 2>&1 | head -3)"
memory=$((memory * 9 / 10))  # under what slurmd sees, or the node would be drained as too small
mkdir -p "$tmp/state" "$tmp/spool" "$tmp/log"
ctld_port=$(free_port) slurmd_port=$(free_port)
[[ $ctld_port != "$slurmd_port" ]] || slurmd_port=$((ctld_port + 1))
export SLURM_CONF=$tmp/slurm.conf  # for the client commands, and the jobs' own
: >"$tmp/plugstack.conf"           # no SPANK plugins from /etc/slurm
cat >"$SLURM_CONF" <<EOF
ClusterName=turnfield-test
SlurmctldHost=$host(127.0.0.1)
SlurmctldPort=$ctld_port
SlurmdPort=$slurmd_port
# Bind to the host name's address (127.0.0.1 above), not to every interface.
CommunicationParameters=NoInAddrAny,NoCtldInAddrAny
SlurmUser=root
SlurmdUser=root
AuthType=auth/munge
CredType=cred/munge
AuthInfo=socket=$socket
MpiDefault=none
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
JobAcctGatherType=jobacct_gather/none
AccountingStorageType=accounting_storage/none
SelectType=select/cons_tres
SelectTypeParameters=CR_CPU
ReturnToService=2
PlugStackConfig=$tmp/plugstack.conf
StateSaveLocation=$tmp/state
SlurmdSpoolDir=$tmp/spool
MailProg=/bin/true
SlurmctldPidFile=$tmp/slurmctld.pid
SlurmdPidFile=$tmp/slurmd.pid
SlurmctldLogFile=$tmp/log/slurmctld.log
SlurmdLogFile=$tmp/log/slurmd.log
# A cancelled task is killed 2 s after its SIGTERM, not the default 30 s.
KillWait=2
# Finished jobs leave the controller's list soon; squeue shows pending and running ones anyway.
MinJobAge=10
NodeName=$host NodeAddr=127.0.0.1 CPUs=$cpus RealMemory=$memory State=UNKNOWN
PartitionName=test Nodes=$host Default=YES MaxTime=INFINITE State=UP
EOF

start_daemon slurmctld slurmctld -D -i -f "$SLURM_CONF"
sleep 1
alive_or_skip slurmctld "${pids[1]}" "$tmp/log/slurmctld.log"
start_daemon slurmd slurmd -D -f "$SLURM_CONF" -N "$host"
node_idle() { [[ $(sinfo -h -n "$host" -o %t 2>/dev/null) == idle ]]; }
if ! wait_for 60 node_idle; then
  alive_or_skip slurmctld "${pids[1]}" "$tmp/log/slurmctld.log"
  alive_or_skip slurmd "${pids[2]}" "$tmp/log/slurmd.log"
  tail -n 20 "$tmp/log/slurmctld.log" "$tmp/log/slurmd.log" 2>/dev/null || true
  skip "the node did not become idle in 60 s: $(sinfo -h -N -o '%N %t %E' 2>&1)"
fi
echo "one-node cluster up: $host, $cpus CPUs, ${memory} MB, controller on 127.0.0.1:$ctld_port"

# The reference: the same sweep, unsharded, in this process.
timeout 120 "$turnfield" sweep "$sweep_file" --out "$tmp/local" -j 2 >"$tmp/local.log" 2>&1 ||
  { cat "$tmp/local.log"; fail "the local sweep failed"; }
reference=$tmp/local/sweep_summary.csv

# Submits the sweep; prints the ids of the array and the collect job.
submit() {
  TURNFIELD="$turnfield" "$source_dir/scripts/slurm_sweep" "$sweep_file" "$1" "$shards" 1 -- --time=00:05:00 |
    tee -a "$tmp/submit.log" | sed -n 's/^submitted shards as array job \([0-9]*\) and the collect step as job \([0-9]*\)$/\1 \2/p'
}
queue_empty() { [[ -z $(squeue -h -o %i 2>/dev/null) ]]; }
wait_queue_empty() {
  wait_for "$1" queue_empty || { squeue; tail -n 20 "$tmp/log/slurmctld.log"; fail "jobs still queued after $1 s (or at the test's deadline)"; }
}
# Fails unless $1's summary is the reference's, byte for byte.
same_as_local() {
  local summary=$1/sweep_summary.csv
  [[ -f $summary ]] || { cat "$1"/slurm_logs/* 2>/dev/null; fail "no $summary"; }
  cmp "$reference" "$summary" || { diff "$reference" "$summary" || true; fail "$summary differs from the local run's"; }
}

# --- 1. A whole sweep ---
read -r array_id collect_id < <(submit "$tmp/cluster")
[[ -n ${collect_id:-} ]] || { cat "$tmp/submit.log"; fail "slurm_sweep printed no job ids"; }
wait_queue_empty 90
same_as_local "$tmp/cluster"
for i in $(seq "$shards"); do
  grep -q "shard $i/$shards finished" "$tmp/cluster/slurm_logs/shard_$i.log" || fail "shard $i did not finish"
done
echo "3 shards and collect (jobs $array_id, $collect_id) gave the local run's summary"

# --- 2. A task cancelled while it runs, then the same submission again ---
out=$tmp/failure
read -r array_id collect_id < <(submit "$out")
[[ -n ${collect_id:-} ]] || { cat "$tmp/submit.log"; fail "slurm_sweep printed no job ids"; }
# Cancel task 1 after its first variant, so that it leaves done, interrupted and unstarted ones.
first_done() { grep -q '^\[done 1,' "$out/slurm_logs/shard_1.log" 2>/dev/null; }
wait_for 60 first_done || fail "shard 1 finished no variant in 60 s"
[[ $(squeue -h -j "${array_id}_1" -o %T 2>/dev/null) == RUNNING ]] || fail "shard 1 was not running after its first variant"
scancel "${array_id}_1"
wait_queue_empty 90
grep -q "shard 1/$shards finished" "$out/slurm_logs/shard_1.log" && fail "shard 1 ended before it was cancelled"
missing=$(grep -c ',missing,' "$out/sweep_summary.csv" || true)
((missing > 0)) || { cat "$out/sweep_summary.csv"; fail "the collect job reported no missing variants after the cancel"; }
echo "task ${array_id}_1 cancelled: the collect job reported $missing missing variants"

kept=$(grep -c ' done already' < <("$turnfield" sweep "$sweep_file" --out "$out" --dry-run --shard 1/$shards) || true)
read -r array_id collect_id < <(submit "$out")
[[ -n ${collect_id:-} ]] || { cat "$tmp/submit.log"; fail "slurm_sweep printed no job ids"; }
wait_queue_empty 90
same_as_local "$out"
grep -q "; $kept done already" "$out/slurm_logs/shard_1.log" ||
  { cat "$out/slurm_logs/shard_1.log"; fail "the resubmitted shard 1 did not keep its $kept finished variants"; }
echo "resubmitted: shard 1 kept $kept variants, redid the rest, and the summary is the local run's"
