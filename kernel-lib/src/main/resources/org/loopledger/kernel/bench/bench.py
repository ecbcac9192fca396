# Kernel latency through jupyter_client (Jupyter messaging specification 5.3): cold start to the first
# "1+1" result, then the median round trip (execute_request to status idle) of a trivial cell.
# Input JSON: {"jupyter_path": ..., "kernels": [[name, trivial_code], ...], "rounds": N}
import json, os, sys, time
inp = json.load(sys.stdin)
os.environ["JUPYTER_PATH"] = inp["jupyter_path"]
from jupyter_client.manager import KernelManager

def roundtrip(kc, code):
    msg_id = kc.execute(code)
    while True:
        m = kc.get_iopub_msg(timeout=120)
        if m["parent_header"].get("msg_id") == msg_id and m["msg_type"] == "status" and m["content"]["execution_state"] == "idle":
            break
    while True:
        r = kc.get_shell_msg(timeout=120)
        if r["parent_header"].get("msg_id") == msg_id:
            return r

res = {}
for name, code in inp["kernels"]:
    t0 = time.time()
    km = KernelManager(kernel_name=name)
    km.start_kernel()
    kc = km.client()
    kc.start_channels()
    kc.wait_for_ready(timeout=120)
    roundtrip(kc, code)
    cold = time.time() - t0
    times = []
    for i in range(inp["rounds"]):
        t = time.perf_counter()
        roundtrip(kc, code)
        times.append((time.perf_counter() - t) * 1000)
    times.sort()
    kc.stop_channels()
    km.shutdown_kernel(now=True)
    res[name] = {"cold_start_s": cold, "median_ms": times[len(times) // 2], "p90_ms": times[int(len(times) * 0.9)], "min_ms": times[0]}
print(json.dumps(res))
