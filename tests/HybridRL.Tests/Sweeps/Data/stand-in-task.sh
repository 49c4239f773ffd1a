#!/bin/bash
# TEST FIXTURE ONLY: stands in for `hybridrl sweep task FILE` in the Slurm tests (SlurmArrayTests).
# Array index 0 waits for USR1 and exits 3 (interrupted after a "checkpoint") on its first run, 0 once requeued
# (SLURM_RESTART_COUNT set); every other index finishes at once. $1 is a folder for marker files.
marks="$1"
i="${SLURM_ARRAY_TASK_ID:?}"
echo "stand-in $i restart=${SLURM_RESTART_COUNT:-none} pid=$$"
if [ -n "${SLURM_RESTART_COUNT:-}" ]; then
  echo "stand-in $i resumed, finishing"
  touch "$marks/done-$i"
  exit 0
fi
if [ "$i" != "0" ]; then
  touch "$marks/done-$i"
  exit 0
fi
trap 'echo "stand-in $i got USR1, checkpointing"; touch "$marks/interrupted-$i"; exit 3' USR1
touch "$marks/waiting-$i"
for _ in $(seq 1 900); do sleep 0.1; done
echo "stand-in $i was never signalled"
exit 1
