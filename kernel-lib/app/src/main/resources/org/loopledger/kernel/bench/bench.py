# Kernel benchmarks through jupyter_client (Jupyter messaging specification 5.3), every kernel in the same run,
# interleaved: in each of cold_rounds rounds every kernel is started (order alternating between rounds) and
# timed to its first trivial result, then trivial round trips (execute_request to status idle) alternate
# between the running kernels; medians over all rounds. Once, in the last round: output throughput (seconds
# from execute_request to status idle for a large print and a large display, with the characters received);
# long cells (seconds per cell of N statements).
# Then settled_rounds rounds that start both kernels, leave them idle for idle_s seconds (a user reading the
# notebook before the first cell) and alternate N trivial cells between them, first cell included.
# Input JSON: {"jupyter_path": ..., "cold_rounds": R, "rounds": N (trivial cells per kernel and round),
#              "settled_rounds": S, "idle_s": I,
#              "kernels": [{"name", "trivial", "throughput": {label: code}, "cells": {N: code}}, ...]}
import json, os, sys, time
inp = json.load(sys.stdin)
os.environ["JUPYTER_PATH"] = inp["jupyter_path"]
from jupyter_client.manager import KernelManager

def roundtrip(kc, code, timeout=600):
    """Runs code; returns (seconds to idle, characters of stream text and display data received)."""
    t = time.perf_counter()
    msg_id = kc.execute(code)
    chars = 0
    while True:
        m = kc.get_iopub_msg(timeout=timeout)
        if m["parent_header"].get("msg_id") != msg_id:
            continue
        if m["msg_type"] == "stream":
            chars += len(m["content"]["text"])
        elif m["msg_type"] in ("display_data", "execute_result"):
            chars += sum(len(v) for v in m["content"]["data"].values() if isinstance(v, str))
        elif m["msg_type"] == "status" and m["content"]["execution_state"] == "idle":
            break
    seconds = time.perf_counter() - t
    while True:
        r = kc.get_shell_msg(timeout=timeout)
        if r["parent_header"].get("msg_id") == msg_id:
            if r["content"]["status"] != "ok":
                raise RuntimeError("benchmark cell failed: %s" % r["content"].get("evalue"))
            return seconds, chars

def start(name):
    """Starts a kernel; returns (manager, client, seconds from the start to the first trivial result)."""
    t0 = time.perf_counter()
    km = KernelManager(kernel_name=name)
    km.start_kernel()
    kc = km.client()
    kc.start_channels()
    kc.wait_for_ready(timeout=120)
    roundtrip(kc, trivial[name])
    return km, kc, time.perf_counter() - t0

def start_idle(name):
    """Starts a kernel and waits until it answers kernel_info; runs no cell."""
    km = KernelManager(kernel_name=name)
    km.start_kernel()
    kc = km.client()
    kc.start_channels()
    kc.wait_for_ready(timeout=120)
    return km, kc

def stop(km, kc):
    kc.stop_channels()
    km.shutdown_kernel(now=True)

def median(xs):
    xs = sorted(xs)
    n = len(xs)
    return xs[n // 2] if n % 2 else (xs[n // 2 - 1] + xs[n // 2]) / 2

kernels = inp["kernels"]
names = [k["name"] for k in kernels]
trivial = {k["name"]: k["trivial"] for k in kernels}
# jupyter_client's one-time start-up (imports, kernelspec and provisioner discovery, the first ZMQ context)
# is paid here once, by a kernel that is not measured, so it counts against neither kernel
km, kc, _ = start(names[0])
stop(km, kc)

cold = {n: [] for n in names}
trips = {n: [] for n in names}
res = {n: {} for n in names}
for rnd in range(inp["cold_rounds"]):
    order = names if rnd % 2 == 0 else names[::-1]
    running = {}
    for n in order:
        km, kc, s = start(n)
        cold[n].append(s)
        running[n] = (km, kc)
    # trivial round trips interleaved one by one, so a busy moment of the shared machine hits both kernels
    for i in range(inp["rounds"]):
        for n in (order if i % 2 == 0 else order[::-1]):
            trips[n].append(roundtrip(running[n][1], trivial[n])[0] * 1000)
    if rnd == inp["cold_rounds"] - 1:
        for k in kernels:
            kc = running[k["name"]][1]
            for label, code in k.get("throughput", {}).items():
                s, chars = roundtrip(kc, code)
                res[k["name"]][label] = {"seconds": s, "chars": chars}
            for n, code in k.get("cells", {}).items():
                s, _ = roundtrip(kc, code)
                res[k["name"]].setdefault("cells", {})[n] = s
    for n in order:
        stop(*running[n])

settled = {n: [] for n in names}
for rnd in range(inp.get("settled_rounds", 0)):
    order = names if rnd % 2 == 0 else names[::-1]
    running = {n: start_idle(n) for n in order}
    time.sleep(inp["idle_s"])
    for i in range(inp["rounds"]):
        for n in (order if i % 2 == 0 else order[::-1]):
            settled[n].append(roundtrip(running[n][1], trivial[n])[0] * 1000)
    for n in order:
        stop(*running[n])

for n in names:
    if settled[n]:
        res[n].update({"settled_median_ms": median(settled[n]), "settled_samples": len(settled[n])})
    t = sorted(trips[n])
    res[n].update({"cold_start_s": median(cold[n]), "cold_starts_s": cold[n], "median_ms": median(t),
                   "p90_ms": t[int(len(t) * 0.9)], "min_ms": t[0], "samples": len(t)})
print(json.dumps(res))
