#!/usr/bin/env python3
"""Greenhouse vents: a tiny example environment for the HybridRL child-process bridge.

An invented scenario of our own: the air in a small greenhouse drifts towards the outside
temperature, which follows a daily cycle plus noise. Each step (one simulated 10-minute interval)
the controller chooses 0 = close the vents, 1 = open the vents, 2 = run the heater. The reward is
minus the distance from 22 degrees C (scaled); leaving the 10..34 degrees C band damages the plants
and ends the episode (terminal); the episode is cut after `max_steps` steps (truncated).

Speaks the line-delimited JSON protocol of PROTOCOL.md on stdin/stdout; only standard library.
Options for testing the bridge's failure handling:
  --die-after-steps N   exit with code 3 when step N+1 is requested (a crash mid-episode)
  --stderr-noise        write a chatter line to stderr on every message
"""
import json
import math
import random
import sys

TARGET = 22.0


class Greenhouse:
    def __init__(self, max_steps):
        self.max_steps = max_steps
        self.rng = random.Random(0)
        self.inside = TARGET
        self.step_count = 0

    def outside(self):
        hour = (self.step_count / 6.0) % 24.0
        return 15.0 + 8.0 * math.sin((hour - 9.0) / 24.0 * 2.0 * math.pi)

    def observation(self):
        hour = (self.step_count / 6.0) % 24.0
        return [(self.inside - TARGET) / 10.0, (self.outside() - TARGET) / 10.0, hour / 24.0]

    def reset(self, seed):
        self.rng = random.Random(seed)
        self.step_count = 0
        self.inside = TARGET + self.rng.uniform(-3.0, 3.0)
        return self.observation()

    def step(self, action):
        leak = 0.25 if action == 1 else 0.05
        heat = 1.5 if action == 2 else 0.0
        sun = 1.0 if 8.0 <= (self.step_count / 6.0) % 24.0 <= 17.0 else 0.0
        self.inside += leak * (self.outside() - self.inside) + heat + sun + self.rng.gauss(0.0, 0.3)
        self.step_count += 1
        reward = -abs(self.inside - TARGET) / 10.0
        terminal = not (10.0 <= self.inside <= 34.0)
        truncated = (not terminal) and self.step_count >= self.max_steps
        return self.observation(), reward, terminal, truncated


def send(message):
    sys.stdout.write(json.dumps(message) + "\n")
    sys.stdout.flush()


def main(argv):
    die_after = None
    noise = False
    i = 1
    while i < len(argv):
        if argv[i] == "--die-after-steps":
            die_after = int(argv[i + 1])
            i += 2
        elif argv[i] == "--stderr-noise":
            noise = True
            i += 1
        else:
            sys.stderr.write("unknown option %s\n" % argv[i])
            return 2
    env = None
    steps = 0
    for line in sys.stdin:
        line = line.strip()
        if not line:
            continue
        message = json.loads(line)
        op = message.get("op")
        if noise:
            sys.stderr.write("greenhouse: received %s\n" % op)
            sys.stderr.flush()
        if op == "hello":
            params = message.get("parameters", {})
            env = Greenhouse(int(params.get("max_steps", "144")))
            send({"name": "greenhouse-vents", "observation_size": 3, "action_count": 3,
                  "deterministic": True, "binary_observation": False})
        elif op == "reset":
            steps = 0
            send({"observation": env.reset(int(message["seed"]))})
        elif op == "step":
            if die_after is not None and steps >= die_after:
                sys.stderr.write("greenhouse: simulated sensor failure, exiting\n")
                sys.stderr.flush()
                return 3
            action = int(message["action"])
            if action not in (0, 1, 2):
                send({"error": "action must be 0, 1 or 2, got %d" % action})
                continue
            steps += 1
            obs, reward, terminal, truncated = env.step(action)
            send({"observation": obs, "reward": reward, "terminal": terminal, "truncated": truncated})
        elif op == "close":
            return 0
        else:
            send({"error": "unknown op %r" % op})
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
