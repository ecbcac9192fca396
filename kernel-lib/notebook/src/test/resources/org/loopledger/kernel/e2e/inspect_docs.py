# Shift-Tab inspection of Loopledger classes through Debian's jupyter_client (KernelClient.inspect,
# Jupyter messaging specification 5.3, inspect_request / inspect_reply). Input (stdin JSON):
# {"jupyter_path": ..., "setup": [code run first, ...], "cases": [[code, cursor_pos], ...]}. Output: one JSON object with each reply's content.
import json, os, sys, traceback
inp = json.load(sys.stdin)
os.environ["JUPYTER_PATH"] = inp["jupyter_path"]
from jupyter_client.manager import KernelManager

out = {"replies": []}
km = KernelManager(kernel_name="loopledger")
km.start_kernel()
kc = km.client()
kc.start_channels()
try:
    kc.wait_for_ready(timeout=90)
    for code in inp.get("setup", []):
        kc.execute_interactive(code, timeout=60)
    for code, pos in inp["cases"]:
        try:
            out["replies"].append(kc.inspect(code, pos, detail_level=0, reply=True, timeout=60)["content"])
        except Exception:
            out["replies"].append({"exception": traceback.format_exc()})
finally:
    kc.stop_channels()
    km.shutdown_kernel(now=True)
print(json.dumps(out))
