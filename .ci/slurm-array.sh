#!/usr/bin/env bash
# Runs cloudwind's sharded sweep as a 4-task Slurm job array on a throw-away
# single-node Slurm cluster on this machine, merges the shards and compares
# them byte for byte with the single-process sweep.
#
#   .ci/slurm-array.sh PATH/TO/cloudwind
#
# Installs Debian's slurm-wlm and munge if they are missing, starts its own
# munged, slurmctld and slurmd (private key, socket, ports, config, state and
# logs in a temp dir; nothing under /etc is written), and stops them again on
# exit.
#
# Exit status:
#   0  merged shards are byte-identical to the single-process sweep
#   1  they differ, or a shard job failed
#   2  usage error (no such binary)
#   3  "slurm unavailable: REASON": Slurm cannot run on this machine (install
#      failed, a daemon would not start, or a trivial probe job did not run);
#      CI may fall back to a scheduler-free shard test.
#
# Environment (optional):
#   CW_SLURM_KEEP=1          keep the temp dir (configs, logs, outputs)
#   CW_SLURM_JOB_TIMEOUT=N   seconds to wait for the job array (default 600)
set -euo pipefail

export PATH="/usr/local/sbin:/usr/local/bin:/usr/sbin:/usr/bin:/sbin:/bin:$PATH"
export LC_ALL=C

say() { printf 'slurm-array: %s\n' "$*" >&2; }
die() { say "error: $*"; exit 1; }

# ---- arguments -----------------------------------------------------------
if [ $# -ne 1 ]; then
  echo "usage: $0 PATH/TO/cloudwind" >&2
  exit 2
fi
if [ ! -f "$1" ] || [ ! -x "$1" ]; then
  echo "slurm-array: $1: not an executable file" >&2
  exit 2
fi
BIN=$(realpath -- "$1")
if [ "$(id -u)" != 0 ]; then
  # SlurmUser=root, apt-get and a private munged: this needs root.
  echo "slurm unavailable: $0 must run as root (it runs as uid $(id -u))"
  exit 3
fi

# Keep the caller's Slurm environment (e.g. when run inside a job) out of it.
while IFS= read -r v; do unset "$v"; done < <(compgen -e | grep '^SLURM_' || true)

start_time=$(date +%s)
elapsed() { echo "$(( $(date +%s) - start_time ))s"; }

WORK=""
PID_MUNGED="" PID_CTLD="" PID_SLURMD=""
POLICY_RC_CREATED=""
UNAVAILABLE_EXIT=3

# ---- cleanup ---------------------------------------------------------------
stop_pid() { # PID NAME: TERM, wait up to 10 s, then KILL
  local pid=$1 name=$2 _
  [ -n "$pid" ] || return 0
  kill -0 "$pid" 2>/dev/null || return 0
  kill -TERM "$pid" 2>/dev/null || true
  for _ in $(seq 1 100); do
    kill -0 "$pid" 2>/dev/null || { wait "$pid" 2>/dev/null || true; return 0; }
    sleep 0.1
  done
  say "$name ($pid) did not stop on TERM; killing it"
  kill -KILL "$pid" 2>/dev/null || true
  wait "$pid" 2>/dev/null || true
}

# shellcheck disable=SC2317  # reached through the EXIT trap
cleanup() {
  local rc=$?
  set +e
  trap - EXIT INT TERM HUP
  if [ -n "$POLICY_RC_CREATED" ]; then rm -f /usr/sbin/policy-rc.d; fi
  if [ -n "$PID_CTLD" ] && kill -0 "$PID_CTLD" 2>/dev/null; then
    # End whatever is still queued or running on our cluster, so no
    # slurmstepd outlives slurmd.
    scancel --quiet --user=root >/dev/null 2>&1
    local _
    for _ in $(seq 1 50); do
      [ -z "$(squeue -h -o %i 2>/dev/null)" ] && break
      sleep 0.2
    done
  fi
  stop_pid "$PID_SLURMD" slurmd
  stop_pid "$PID_CTLD" slurmctld
  stop_pid "$PID_MUNGED" munged
  if [ -n "$WORK" ] && [ -d "$WORK" ]; then
    if [ "${CW_SLURM_KEEP:-}" = 1 ]; then
      say "kept $WORK"
    else
      rm -rf -- "$WORK"
    fi
  fi
  say "done in $(elapsed), exit $rc"
  exit "$rc"
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM
trap 'exit 129' HUP

# ---- "slurm unavailable" ---------------------------------------------------
show_logs() {
  local f
  for f in "$WORK"/log/*.log; do
    [ -s "$f" ] || continue
    echo "----- $f (last 40 lines)" >&2
    tail -n 40 "$f" >&2
  done
}
# Errors every start logs here that are harmless: no PMIx library (slurmd
# loads every MPI plugin), no saved state on a fresh StateSaveLocation, no
# hwloc topology cache.
HARMLESS='pmix|MPI: Cannot create context|state file|NOTE: Trying backup|xcpuinfo_hwloc_topo_load'
log_reason() { # LOG: its first fatal line, else its last telling error line, else its last line
  local f=$1 line
  [ -s "$f" ] || { echo "no log output"; return; }
  line=$(grep -m1 -iE 'fatal' "$f" || true)
  [ -n "$line" ] || line=$(grep -iE 'error' "$f" | grep -vE "$HARMLESS" | tail -n 1 || true)
  [ -n "$line" ] || line=$(tail -n 1 "$f")
  echo "$line"
}
unavailable() {
  [ -n "$WORK" ] && show_logs
  echo "slurm unavailable: $*"
  exit "$UNAVAILABLE_EXIT"
}

# ---- 1. packages -------------------------------------------------------------
have_all() {
  command -v slurmctld >/dev/null && command -v slurmd >/dev/null &&
    command -v sbatch >/dev/null && command -v sinfo >/dev/null &&
    command -v munged >/dev/null && command -v munge >/dev/null
}
if ! have_all; then
  say "installing slurm-wlm and munge ($(elapsed))"
  # Keep the packages' init scripts from starting system daemons (which would
  # outlive this script); Debian's standard policy-rc.d mechanism.
  if [ ! -e /usr/sbin/policy-rc.d ]; then
    printf '#!/bin/sh\nexit 101\n' > /usr/sbin/policy-rc.d
    chmod 755 /usr/sbin/policy-rc.d
    POLICY_RC_CREATED=1
  fi
  apt_log=$(mktemp)
  # Wait for another apt/dpkg run rather than fail on its lock.
  lock=(-o DPkg::Lock::Timeout=300)
  if ! { apt-get "${lock[@]}" update -qq &&
         DEBIAN_FRONTEND=noninteractive apt-get "${lock[@]}" install -y -qq slurm-wlm munge; } >"$apt_log" 2>&1; then
    tail -n 20 "$apt_log" >&2
    reason=$(grep -E '^E:' "$apt_log" | head -n 1 || true)
    rm -f "$apt_log"
    unavailable "apt-get could not install slurm-wlm munge: ${reason:-see output above}"
  fi
  rm -f "$apt_log"
  if [ -n "$POLICY_RC_CREATED" ]; then rm -f /usr/sbin/policy-rc.d; POLICY_RC_CREATED=""; fi
  have_all || unavailable "slurm-wlm/munge installed but slurmctld, slurmd, sbatch, sinfo or munged is missing"
  say "installed ($(elapsed))"
fi
say "$(slurmctld -V 2>&1 | head -n 1), $(munged --version 2>&1 | head -n 1)"

# ---- 2. munge, config, daemons -------------------------------------------------
WORK=$(mktemp -d /tmp/cw-slurm.XXXXXX)
chmod 755 "$WORK"
mkdir -p "$WORK"/{munge,munge-key,state,spool,log,out}
chmod 755 "$WORK/munge"    # the socket: reachable by every user
chmod 700 "$WORK/munge-key"
OUT="$WORK/out"

# munged, private to this run: own key, socket, pid, log and seed files.
KEY="$WORK/munge-key/munge.key"
SOCK="$WORK/munge/munge.socket"
if command -v mungekey >/dev/null; then
  mungekey --create --keyfile="$KEY" >/dev/null 2>&1 || true
fi
[ -s "$KEY" ] || dd if=/dev/urandom of="$KEY" bs=1 count=1024 status=none
chmod 400 "$KEY"
start_munged() { # [--force]: start munged in the foreground (its log on stderr), wait until it answers
  munged --foreground --key-file="$KEY" --socket="$SOCK" \
    --pid-file="$WORK/munge-key/munged.pid" --seed-file="$WORK/munge-key/munged.seed" \
    "$@" >>"$WORK/log/munged.log" 2>&1 &
  PID_MUNGED=$!
  local _
  for _ in $(seq 1 100); do
    kill -0 "$PID_MUNGED" 2>/dev/null || { wait "$PID_MUNGED" 2>/dev/null || true; PID_MUNGED=""; return 1; }
    if [ -S "$SOCK" ] && munge -n -S "$SOCK" 2>/dev/null | unmunge -S "$SOCK" >/dev/null 2>&1; then
      return 0
    fi
    sleep 0.1
  done
  return 1
}
# As root munged runs as it is; should one of its permission checks refuse
# this private setup, --force overrides them.
if ! start_munged; then
  say "munged refused to start ($(log_reason "$WORK/log/munged.log")); retrying with --force"
  stop_pid "$PID_MUNGED" munged
  start_munged --force || unavailable "munged did not start: $(log_reason "$WORK/log/munged.log")"
fi
say "munged up ($(elapsed))"

# Two free TCP ports for slurmctld and slurmd (6817/6818 unless taken).
port_in_use() {
  local hex
  hex=$(printf '%04X' "$1")
  awk -v h=":$hex" 'FNR > 1 && $4 == "0A" && substr($2, length($2) - 4) == h { f = 1 } END { exit !f }' \
    /proc/net/tcp /proc/net/tcp6 2>/dev/null
}
CTLD_PORT=6817
while port_in_use "$CTLD_PORT" || port_in_use $((CTLD_PORT + 1)); do
  CTLD_PORT=$((CTLD_PORT + 2))
  [ "$CTLD_PORT" -lt 7817 ] || unavailable "no free TCP port pair between 6817 and 7817"
done
SLURMD_PORT=$((CTLD_PORT + 1))

NODE=$(hostname -s)
# The node's CPUs and memory as slurmd detects them ("NodeName=... CPUs=...
# RealMemory=..."), without its NodeName and UpTime fields.
hw=$(SLURM_CONF=/nonexistent slurmd -C 2>/dev/null | head -n 1 || true)
case "$hw" in
  NodeName=*CPUs=*) ;;
  *) unavailable "slurmd -C did not report the hardware: $(SLURM_CONF=/nonexistent slurmd -C 2>&1 | head -n 3 | tr '\n' ' ')";;
esac
hw=$(echo "$hw" | tr ' ' '\n' | grep -vE '^(NodeName|UpTime)=|^$' | paste -sd ' ')

CONF="$WORK/slurm.conf"
cat >"$CONF" <<EOF
# Single-node Slurm for cloudwind's CI ($0), generated $(date -u +%FT%TZ)
ClusterName=cwci
SlurmctldHost=$NODE(127.0.0.1)
SlurmctldPort=$CTLD_PORT
SlurmdPort=$SLURMD_PORT
SlurmUser=root
SlurmdUser=root
AuthType=auth/munge
CredType=cred/munge
AuthInfo=socket=$SOCK
StateSaveLocation=$WORK/state
SlurmdSpoolDir=$WORK/spool
SlurmctldPidFile=$WORK/slurmctld.pid
SlurmdPidFile=$WORK/slurmd.pid
SlurmctldLogFile=$WORK/log/slurmctld.log
SlurmdLogFile=$WORK/log/slurmd.log
SlurmctldDebug=info
SlurmdDebug=info
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
JobAcctGatherType=jobacct_gather/none
AccountingStorageType=accounting_storage/none
JobCompType=jobcomp/none
SelectType=select/cons_tres
SelectTypeParameters=CR_Core
SchedulerType=sched/backfill
# Schedule as soon as a job is submitted or ends (default: at most every 2 s).
SchedulerParameters=sched_min_interval=0,batch_sched_delay=0
MpiDefault=none
ReturnToService=2
MailProg=/bin/true
MinJobAge=300
SlurmctldTimeout=30
SlurmdTimeout=30
NodeName=$NODE NodeAddr=127.0.0.1 NodeHostname=$NODE $hw State=UNKNOWN
PartitionName=ci Nodes=$NODE Default=YES MaxTime=INFINITE State=UP
EOF
export SLURM_CONF="$CONF"

slurmctld -D -f "$CONF" >>"$WORK/log/slurmctld.out" 2>&1 &
PID_CTLD=$!
slurmd -D -f "$CONF" -N "$NODE" >>"$WORK/log/slurmd.out" 2>&1 &
PID_SLURMD=$!

daemon_reason() { # NAME: the failed daemon's log line
  local n=$1 f
  f="$WORK/log/$n.log"
  [ -s "$f" ] || f="$WORK/log/$n.out"
  echo "$n: $(log_reason "$f")"
}
for f in slurmctld slurmd; do touch "$WORK/log/$f.log"; done
deadline=$(( $(date +%s) + 60 ))
state=""
while :; do
  kill -0 "$PID_CTLD" 2>/dev/null || unavailable "slurmctld exited: $(daemon_reason slurmctld)"
  kill -0 "$PID_SLURMD" 2>/dev/null || unavailable "slurmd exited: $(daemon_reason slurmd)"
  state=$(sinfo -h -n "$NODE" -o %T 2>/dev/null | head -n 1 || true)
  [ "$state" = idle ] && break
  if [ "$(date +%s)" -ge "$deadline" ]; then
    why=$(scontrol show node "$NODE" 2>/dev/null | grep -o 'Reason=.*' || true)
    unavailable "node $NODE not idle after 60 s (state '${state:-no answer from slurmctld}'${why:+, $why}); $(daemon_reason slurmd); $(daemon_reason slurmctld)"
  fi
  sleep 0.25
done
say "node $NODE idle ($(elapsed)): $hw"

# ---- job helpers ---------------------------------------------------------------
wait_job() { # JOBID TIMEOUT: wait until the job (all array tasks) left the queue
  local id=$1 limit=$2 end
  end=$(( $(date +%s) + limit ))
  local out
  while :; do
    # Gone from the queue, or purged already ("Invalid job id"): done. No
    # answer from slurmctld: ask again.
    if out=$(squeue -h -j "$id" -t PD,R,CF,CG,S,RQ,RS,RH,RD,SO,SI -o %i 2>&1); then
      [ -z "$out" ] && return 0
    else
      case "$out" in *"Invalid job id"*) return 0;; esac
    fi
    kill -0 "$PID_CTLD" 2>/dev/null || return 2
    kill -0 "$PID_SLURMD" 2>/dev/null || return 2
    [ "$(date +%s)" -lt "$end" ] || return 1
    sleep 0.25
  done
}
job_states() { # JOBID: one "ID STATE exit=CODE reason=REASON" line per (array) task
  scontrol -o show job "$1" 2>/dev/null | awk '
    { id = st = ex = re = ""; arr = task = ""
      for (i = 1; i <= NF; i++) {
        split($i, kv, "=")
        if (kv[1] == "JobId") id = kv[2]
        else if (kv[1] == "ArrayJobId") arr = kv[2]
        else if (kv[1] == "ArrayTaskId") task = kv[2]
        else if (kv[1] == "JobState") st = kv[2]
        else if (kv[1] == "ExitCode") ex = kv[2]
        else if (kv[1] == "Reason") re = kv[2]
      }
      if (id == "") next
      if (arr != "" && task != "") id = arr "_" task
      print id, st, "exit=" ex, "reason=" re }' | sort -V
}

# A trivial probe first: if Slurm cannot run even `true`, that is Slurm's
# failure, not cloudwind's.
probe=$(sbatch --parsable --job-name=probe --chdir="$OUT" --output="$OUT/probe.out" \
  --wrap 'true' 2>&1) || unavailable "sbatch refused a trivial job: $probe"
probe=${probe%%;*}
rc=0; wait_job "$probe" 60 || rc=$?
case $rc in
  1) unavailable "probe job $probe did not finish in 60 s: $(squeue -h -j "$probe" -o '%T %r' 2>/dev/null); $(daemon_reason slurmd)";;
  2) unavailable "a daemon died during the probe job: $(daemon_reason slurmd); $(daemon_reason slurmctld)";;
esac
st=$(job_states "$probe")
case "$st" in
  *" COMPLETED exit=0:0"*) ;;
  *) unavailable "probe job $probe did not complete (${st:-no record}); $(daemon_reason slurmd)";;
esac
say "probe job ran ($(elapsed))"

# ---- 3. the job array ------------------------------------------------------------
SCRIPT="$WORK/shard.sbatch"
cat >"$SCRIPT" <<'EOF'
#!/bin/bash
set -euo pipefail
k=$SLURM_ARRAY_TASK_ID
"$CW_BIN" sweep --chi log:10:1e4:40 --radius log:0.1:1e3:50 --format csv \
  --shard "${SLURM_ARRAY_TASK_ID}/4" -o "$CW_OUT/grid-${k}.csv"
EOF
chmod 755 "$SCRIPT"
export CW_BIN="$BIN" CW_OUT="$OUT"
job=$(sbatch --parsable --array=0-3 --job-name=cw-shard --ntasks=1 --cpus-per-task=1 \
  --chdir="$OUT" --output="$OUT/slurm-%A_%a.out" "$SCRIPT" 2>&1) ||
  die "sbatch refused the job array: $job"
job=${job%%;*}
say "submitted job array $job ($(elapsed))"
rc=0; wait_job "$job" "${CW_SLURM_JOB_TIMEOUT:-600}" || rc=$?
case $rc in
  1) show_logs; die "job array $job not finished after ${CW_SLURM_JOB_TIMEOUT:-600} s";;
  2) unavailable "a daemon died while job array $job ran: $(daemon_reason slurmd); $(daemon_reason slurmctld)";;
esac
states=$(job_states "$job")
echo "$states" | sed 's/^/slurm-array:   task /' >&2
ntasks=$(echo "$states" | grep -c ' COMPLETED exit=0:0' || true)
if [ "$ntasks" -ne 4 ]; then
  for f in "$OUT"/slurm-*.out; do
    [ -e "$f" ] || continue
    echo "----- $f" >&2; cat "$f" >&2
  done
  die "job array $job: $ntasks of 4 tasks completed with exit 0"
fi
for k in 0 1 2 3; do
  [ -s "$OUT/grid-$k.csv" ] || die "task $k completed but wrote no $OUT/grid-$k.csv"
done
say "4 shards done ($(elapsed))"

# ---- 4. merge and compare ----------------------------------------------------------
{ head -n 1 "$OUT/grid-0.csv"; for k in 0 1 2 3; do tail -n +2 "$OUT/grid-$k.csv"; done; } > "$OUT/merged.csv"
"$BIN" sweep --chi log:10:1e4:40 --radius log:0.1:1e3:50 --format csv -o "$OUT/single.csv"
if cmp -s "$OUT/merged.csv" "$OUT/single.csv"; then
  say "merged shards == single-process sweep ($(wc -l < "$OUT/single.csv") lines, $(wc -c < "$OUT/single.csv") bytes)"
  exit 0
fi
say "MISMATCH: the merged shards differ from the single-process sweep"
for k in 0 1 2 3; do say "  grid-$k.csv: $(wc -l < "$OUT/grid-$k.csv") lines"; done
say "  merged.csv: $(wc -l < "$OUT/merged.csv") lines, single.csv: $(wc -l < "$OUT/single.csv") lines"
cmp "$OUT/merged.csv" "$OUT/single.csv" >&2 || true
diff "$OUT/merged.csv" "$OUT/single.csv" 2>&1 | head -n 12 | cut -c 1-160 >&2 || true
exit 1
