#!/usr/bin/env bash
# Starts or stops a single-node Slurm cluster on this machine, for checking the sweep's job-array
# path against a real scheduler (as root; Debian's slurmctld slurmd slurm-client munge installed).
#   tools/slurm-cluster.sh start DIR   # state, logs and pid files under DIR
#   tools/slurm-cluster.sh stop DIR    # stops only the daemons this script started, by the pids in DIR
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
    # every daemon started here writes its pid file under DIR; stop kills exactly those processes
    mkdir -p "$dir/run"
    if [ -e "$dir.munge-was-running" ]; then
      :  # use the machine's own munged; it is not ours to stop
    elif id munge >/dev/null 2>&1; then
      chown munge "$dir/run"
      su -s /bin/sh munge -c "/usr/sbin/munged --pid-file=$dir/run/munged.pid" || /usr/sbin/munged --force --pid-file="$dir/run/munged.pid"
    else
      /usr/sbin/munged --force --pid-file="$dir/run/munged.pid"
    fi
    /usr/sbin/slurmctld
    /usr/sbin/slurmd
    for p in slurmctld slurmd $([ -e "$dir.munge-was-running" ] || echo munged); do
      f="$dir/$p.pid"; [ "$p" = munged ] && f="$dir/run/munged.pid"
      for _ in $(seq 20); do [ -s "$f" ] && break; sleep 0.5; done
      [ -s "$f" ] || { echo "$p wrote no pid file ($f); stopping what did start" >&2; "$0" stop "$dir"; exit 1; }
    done
    for _ in $(seq 60); do
      if sinfo -h -o '%t' 2>/dev/null | grep -qE 'idle|mix|alloc'; then exit 0; fi
      sleep 1
    done
    echo "the cluster did not come up; see $dir/log" >&2; exit 1
    ;;
  stop)
    # by process id from the pid files only, and only while that id still runs the program named
    # (a pid file left by a crashed daemon may name a process that has reused the id)
    stop_pid() {
      local name=$1 file=$2 pid
      [ -s "$file" ] || return 0
      pid=$(tr -dc '0-9' < "$file")
      if [ -n "$pid" ] && [ "$(cat "/proc/$pid/comm" 2>/dev/null)" = "$name" ]; then
        kill "$pid" 2>/dev/null || true
        for _ in $(seq 20); do kill -0 "$pid" 2>/dev/null || break; sleep 0.5; done
        if kill -0 "$pid" 2>/dev/null && [ "$(cat "/proc/$pid/comm" 2>/dev/null)" = "$name" ]; then
          kill -9 "$pid" 2>/dev/null || true
        fi
      fi
      rm -f "$file"
    }
    stop_pid slurmd "$dir/slurmd.pid"
    stop_pid slurmctld "$dir/slurmctld.pid"
    stop_pid munged "$dir/run/munged.pid"
    rm -f "$dir.munge-was-running"
    if [ -f "$conf" ] && grep -q "evanesce single-node check" "$conf"; then rm -f "$conf"; fi
    ;;
  *) echo "usage: $0 start|stop DIR" >&2; exit 2 ;;
esac
