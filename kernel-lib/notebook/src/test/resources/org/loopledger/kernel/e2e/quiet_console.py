# Starts the kernel through Debian's jupyter_client with its standard error captured (what a Jupyter server
# shows in its console) and the kernel log file set; runs one cell and shuts down. Input: {"jupyter_path", "log"}.
import json, os, sys
inp = json.load(sys.stdin)
os.environ["JUPYTER_PATH"] = inp["jupyter_path"]
os.environ["LOOPLEDGER_KERNEL_LOG"] = inp["log"]
from jupyter_client.manager import KernelManager
km = KernelManager(kernel_name="loopledger")
err_path, out_path = inp["log"] + ".stderr", inp["log"] + ".stdout"
with open(err_path, "wb") as err, open(out_path, "wb") as out:
    km.start_kernel(stderr=err, stdout=out)
kc = km.client()
kc.start_channels()
result = {}
try:
    kc.wait_for_ready(timeout=90)
    result["reply"] = kc.execute("1 + 1", reply=True, timeout=60)["content"]["status"]
finally:
    kc.stop_channels()
    km.shutdown_kernel(now=False)
result["stderr"] = open(err_path, encoding="utf-8", errors="replace").read()
result["stdout"] = open(out_path, encoding="utf-8", errors="replace").read()
print(json.dumps(result))
