#!/usr/bin/env bash
# Starts or stops a single-node Slurm cluster on this machine, for checking the sweep's job-array
# path against a real scheduler (as root; Debian's slurmctld slurmd slurm-client munge installed).
#   tools/slurm-cluster.sh start DIR   # state, logs and pid files under DIR
#   tools/slurm-cluster.sh stop DIR    # stops only the daemons this script started
set -euo pipefail
cmd=${1:?start or stop}
dir=$(realpath -m "${2:?state folder}")
conf=/etc/slurm/slurm.conf
case "$cmd" in
  start)
    if pgrep -x slurmctld >/dev/null || pgrep -x slurmd >/dev/null; then
      echo "Slurm daemons are already running on this machine; not starting another cluster" >&2; exit 1
    fi
    pgrep -x munged >/dev/null && touch "$dir.munge-was-running" || true
    mkdir -p "$dir/spool" "$dir/state" "$dir/log" /etc/slurm /run/munge /var/lib/munge /var/log/munge
    chmod 755 "$dir" "$(dirname "$dir")"
    [ -f /etc/munge/munge.key ] || { mkdir -p /etc/munge; dd if=/dev/urandom of=/etc/munge/munge.key bs=1 count=1024 status=none; }
    chown -R munge:munge /etc/munge /run/munge /var/lib/munge /var/log/munge 2>/dev/null || true
    chmod 400 /etc/munge/munge.key
    if [ -f "$conf" ] && ! grep -q "evanesce single-node check" "$conf"; then
      echo "refusing to overwrite an existing $conf that this script did not write" >&2; exit 1
    fi
    host=$(hostname)
    cat > "$conf" <<CONF
# evanesce single-node check: written by tools/slurm-cluster.sh
ClusterName=evanesce-check
SlurmctldHost=$host
AuthType=auth/munge
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
SelectType=select/cons_tres
SchedulerType=sched/backfill
SlurmUser=root
SlurmdUser=root
StateSaveLocation=$dir/state
SlurmdSpoolDir=$dir/spool
SlurmctldPidFile=$dir/slurmctld.pid
SlurmdPidFile=$dir/slurmd.pid
SlurmctldLogFile=$dir/log/slurmctld.log
SlurmdLogFile=$dir/log/slurmd.log
ReturnToService=2
MpiDefault=none
NodeName=$host CPUs=$(nproc) State=UNKNOWN
PartitionName=check Nodes=$host Default=YES MaxTime=INFINITE State=UP
CONF
    sudo_munge() { if id munge >/dev/null 2>&1; then su -s /bin/sh munge -c "$1"; else sh -c "$1"; fi; }
    started() { [ -s "$dir/$1.pid" ] || pgrep -n -x "$1" > "$dir/$1.pid"; }
    sudo_munge "/usr/sbin/munged --pid-file=$dir/munged.pid" || /usr/sbin/munged --force --pid-file="$dir/munged.pid"
    sleep 1; started munged
    /usr/sbin/slurmctld; sleep 1; started slurmctld
    /usr/sbin/slurmd; sleep 1; started slurmd
    for _ in $(seq 60); do
      if sinfo -h -o '%t' 2>/dev/null | grep -qE 'idle|mix|alloc'; then exit 0; fi
      sleep 1
    done
    echo "the cluster did not come up; see $dir/log" >&2; exit 1
    ;;
  stop)
    for p in slurmd slurmctld munged; do
      [ -f "$dir/$p.pid" ] && kill "$(cat "$dir/$p.pid")" 2>/dev/null || true
    done
    # start refuses to run beside other Slurm daemons, so any left are ours; munged only if it was not running before
    pkill -x slurmd 2>/dev/null || true
    pkill -x slurmctld 2>/dev/null || true
    [ -e "$dir.munge-was-running" ] || pkill -x munged 2>/dev/null || true
    if [ -f "$conf" ] && grep -q "evanesce single-node check" "$conf"; then rm -f "$conf"; fi
    ;;
  *) echo "usage: $0 start|stop DIR" >&2; exit 2 ;;
esac
