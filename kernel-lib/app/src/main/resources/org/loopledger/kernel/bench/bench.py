# Kernel benchmarks through jupyter_client (Jupyter messaging specification 5.3), every kernel in the same run:
# cold start to the first trivial result; the median round trip (execute_request to status idle) of a
# trivial cell; output throughput (seconds from execute_request to status idle for a large print and a large
# display, with the characters received); long cells (seconds per cell of N statements).
# Input JSON: {"jupyter_path": ..., "rounds": N,
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

res = {}
for k in inp["kernels"]:
    name = k["name"]
    t0 = time.time()
    km = KernelManager(kernel_name=name)
    km.start_kernel()
    kc = km.client()
    kc.start_channels()
    kc.wait_for_ready(timeout=120)
    roundtrip(kc, k["trivial"])
    cold = time.time() - t0
    times = []
    for i in range(inp["rounds"]):
        times.append(roundtrip(kc, k["trivial"])[0] * 1000)
    times.sort()
    r = {"cold_start_s": cold, "median_ms": times[len(times) // 2], "p90_ms": times[int(len(times) * 0.9)], "min_ms": times[0]}
    for label, code in k.get("throughput", {}).items():
        s, chars = roundtrip(kc, code)
        r[label] = {"seconds": s, "chars": chars}
    for n, code in k.get("cells", {}).items():
        s, _ = roundtrip(kc, code)
        r.setdefault("cells", {})[n] = s
    kc.stop_channels()
    km.shutdown_kernel(now=True)
    res[name] = r
print(json.dumps(res))
