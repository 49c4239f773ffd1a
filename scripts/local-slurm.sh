#!/usr/bin/env bash
# Single-node Slurm for tests and CI, from Debian's packages.
#   scripts/local-slurm.sh start    install if missing, configure, start munged/slurmctld/slurmd, wait for an idle node
#   scripts/local-slurm.sh stop     stop only the daemons this script started (by their PID files)
#   scripts/local-slurm.sh status   show daemon PIDs and sinfo
# State, spool, logs and PID files live under $HYBRIDRL_SLURM_DIR (default /tmp/hybridrl-slurm).
# The configuration is written to $HYBRIDRL_SLURM_DIR/slurm.conf and installed as /etc/slurm/slurm.conf
# (the path Slurm's clients read by default) unless that file exists and was not written by this script;
# then export SLURM_CONF=$HYBRIDRL_SLURM_DIR/slurm.conf before using sbatch/squeue.
# Needs root (installs packages, runs the daemons as root). Idempotent: start when running is a no-op.
set -euo pipefail

DIR="${HYBRIDRL_SLURM_DIR:-/tmp/hybridrl-slurm}"
CONF="$DIR/slurm.conf"
MARKER="# written by hybridrl scripts/local-slurm.sh"
MUNGE_PID="$DIR/munged.pid"
CTLD_PID="$DIR/slurmctld.pid"
SLURMD_PID="$DIR/slurmd.pid"

log() { echo "local-slurm: $*" >&2; }

alive() { # alive PIDFILE -> 0 when the file names a live process
  [[ -s "$1" ]] && kill -0 "$(cat "$1")" 2>/dev/null
}

install_packages() {
  if command -v slurmctld >/dev/null && command -v slurmd >/dev/null && command -v sbatch >/dev/null && command -v munged >/dev/null; then
    return
  fi
  log "installing munge and Slurm from Debian's packages"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq --no-install-recommends munge slurmctld slurmd slurm-client >/dev/null
}

write_config() {
  mkdir -p "$DIR/state" "$DIR/spool" "$DIR/log"
  local node_line mem
  # `slurmd -C` prints this host's NodeName/CPUs/... line; keep RealMemory a bit below the total.
  node_line="$(slurmd -C | head -n1)"
  mem="$(sed -n 's/.*RealMemory=\([0-9]*\).*/\1/p' <<<"$node_line")"
  if [[ -n "$mem" ]]; then
    node_line="$(sed "s/RealMemory=[0-9]*/RealMemory=$(( mem * 9 / 10 ))/" <<<"$node_line")"
  fi
  local node_name
  node_name="$(sed -n 's/^NodeName=\([^ ]*\).*/\1/p' <<<"$node_line")"
  cat > "$CONF.tmp" <<CONF
$MARKER
ClusterName=hybridrl-local
SlurmctldHost=$node_name
SlurmUser=root
SlurmdUser=root
AuthType=auth/munge
ProctrackType=proctrack/pgid
TaskPlugin=task/none
SelectType=select/cons_tres
SelectTypeParameters=CR_Core
AccountingStorageType=accounting_storage/none
JobAcctGatherType=jobacct_gather/none
JobCompType=jobcomp/none
MailProg=/bin/true
CommunicationParameters=NoCtldInAddrAny,NoInAddrAny
JobRequeue=1
ReturnToService=2
MpiDefault=none
StateSaveLocation=$DIR/state
SlurmdSpoolDir=$DIR/spool
SlurmctldPidFile=$CTLD_PID
SlurmdPidFile=$SLURMD_PID
SlurmctldLogFile=$DIR/log/slurmctld.log
SlurmdLogFile=$DIR/log/slurmd.log
SlurmctldDebug=info
SlurmdDebug=info
$node_line State=UNKNOWN
PartitionName=debug Nodes=$node_name Default=YES MaxTime=INFINITE State=UP
CONF
  mv "$CONF.tmp" "$CONF"
  mkdir -p /etc/slurm
  if [[ ! -e /etc/slurm/slurm.conf ]] || grep -qF "$MARKER" /etc/slurm/slurm.conf; then
    cp "$CONF" /etc/slurm/slurm.conf.tmp && mv /etc/slurm/slurm.conf.tmp /etc/slurm/slurm.conf
  else
    log "/etc/slurm/slurm.conf exists and is not ours: export SLURM_CONF=$CONF"
  fi
}

start_munge() {
  if alive "$MUNGE_PID"; then return; fi
  if pgrep -x munged >/dev/null 2>&1; then
    log "a munged not started by this script is running; using it"
    return
  fi
  [[ -s /etc/munge/munge.key ]] || mungekey --create --keyfile=/etc/munge/munge.key
  chown munge:munge /etc/munge/munge.key; chmod 0400 /etc/munge/munge.key
  mkdir -p /run/munge /var/lib/munge /var/log/munge
  chown munge:munge /run/munge /var/lib/munge /var/log/munge
  chmod 0755 /run/munge
  touch "$MUNGE_PID" "$DIR/log/munged.log"; chown munge:munge "$MUNGE_PID" "$DIR/log/munged.log"
  # munged forks; --pid-file makes it record the daemon's PID for stop.
  su -s /bin/sh munge -c "munged --pid-file=$MUNGE_PID --log-file=$DIR/log/munged.log"
}

wait_idle() {
  local node="$1"
  for _ in $(seq 1 120); do
    local state
    state="$(sinfo -h -n "$node" -o '%t' 2>/dev/null | head -n1 || true)"
    case "$state" in
      idle|mix|alloc) log "node $node is $state"; return 0 ;;
    esac
    sleep 0.5
  done
  log "node $node did not become idle; see $DIR/log/"
  return 1
}

cmd_start() {
  if [[ $EUID -ne 0 ]]; then log "must run as root"; exit 1; fi
  mkdir -p "$DIR" "$DIR/log"
  install_packages
  if alive "$CTLD_PID" && alive "$SLURMD_PID"; then
    log "already running"
  else
    write_config
    start_munge
    alive "$CTLD_PID" || slurmctld -f "$CONF"
    alive "$SLURMD_PID" || slurmd -f "$CONF"
  fi
  local node
  node="$(sed -n 's/^SlurmctldHost=//p' "$CONF")"
  wait_idle "$node"
  log "config $CONF; logs in $DIR/log/ (slurmctld.log, slurmd.log, munged.log)"
}

stop_pidfile() {
  local name="$1" file="$2"
  if alive "$file"; then
    local pid; pid="$(cat "$file")"
    kill "$pid"
    for _ in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    if kill -0 "$pid" 2>/dev/null; then kill -9 "$pid" 2>/dev/null || true; fi
    log "stopped $name (pid $pid)"
  fi
  rm -f "$file"
}

cmd_stop() {
  stop_pidfile slurmd "$SLURMD_PID"
  stop_pidfile slurmctld "$CTLD_PID"
  stop_pidfile munged "$MUNGE_PID"
}

cmd_status() {
  local rc=0
  for pair in "munged:$MUNGE_PID" "slurmctld:$CTLD_PID" "slurmd:$SLURMD_PID"; do
    local name="${pair%%:*}" file="${pair#*:}"
    if alive "$file"; then echo "$name running (pid $(cat "$file"))"; else echo "$name stopped"; rc=1; fi
  done
  if [[ $rc -eq 0 ]]; then sinfo || rc=1; fi
  echo "logs: $DIR/log/"
  return $rc
}

case "${1:-}" in
  start) cmd_start ;;
  stop) cmd_stop ;;
  status) cmd_status ;;
  *) echo "usage: $0 start|stop|status" >&2; exit 2 ;;
esac
