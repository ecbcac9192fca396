# Jupyter conventions of the Loopledger kernel, checked through Debian's jupyter_client against the
# messaging specification 5.3 and ipykernel's behaviour. Input (stdin JSON): {"jupyter_path": ...}.
# Output: one JSON object, one entry per step (an "exception" entry if a step failed).
import json, os, sys, time, traceback
inp = json.load(sys.stdin)
os.environ["JUPYTER_PATH"] = inp["jupyter_path"]
from jupyter_client.manager import KernelManager

out = {}
km = KernelManager(kernel_name="loopledger")
km.start_kernel()
kc = km.client()
kc.start_channels()

def reply_for(msg_id, timeout=60):
    while True:
        m = kc.get_shell_msg(timeout=timeout)
        if m["parent_header"].get("msg_id") == msg_id:
            return m

def iopub_until_idle(msg_id, timeout=60):
    msgs = []
    while True:
        m = kc.get_iopub_msg(timeout=timeout)
        if m["parent_header"].get("msg_id") != msg_id:
            continue
        msgs.append({"type": m["msg_type"], "content": m["content"]})
        if m["msg_type"] == "status" and m["content"]["execution_state"] == "idle":
            return msgs

def run(code, **kw):
    msg_id = kc.execute(code, **kw)
    reply = reply_for(msg_id)
    return {"reply": reply["content"], "iopub": iopub_until_idle(msg_id)}

def step(name, fn):
    try:
        out[name] = fn()
    except Exception:
        out[name] = {"exception": traceback.format_exc()}

def json_mime():
    r = run("display(BodePlot.create().add(\"lag\", Frf.ofModel(TransferFunction.continuous(new double[] {100}, new double[] {1, 100}), "
            "FrequencyGrid.logSpacedRadPerS(1, 1000, 50))).figure());")
    shown = [m["content"] for m in r["iopub"] if m["type"] == "display_data"]
    value = shown[0]["data"]["application/vnd.loopledger.plot-data+json"]
    return {"python_type": type(value).__name__, "value": value, "reply": r["reply"]}

def stop_on_error():
    run("int sideEffect = 0;")
    # three requests sent without waiting (as Run All does); the first fails
    ids = [kc.execute("int boom = 1 / 0;"), kc.execute("sideEffect += 1;"), kc.execute("sideEffect += 10;")]
    replies = [reply_for(i)["content"] for i in ids]
    for i in ids:
        iopub_until_idle(i)
    after = run("sideEffect")
    return {"statuses": [r["status"] for r in replies], "after": after}

def stdin_refused():
    return run("new java.util.Scanner(System.in).nextLine()", allow_stdin=False)

def stdin_answered():
    # messaging spec 5.3, "Messages on the stdin ROUTER/DEALER channel": the kernel asks with input_request,
    # the front-end answers with input_reply; jupyter_client's kc.input() sends that reply
    msg_id = kc.execute("new java.util.Scanner(System.in).nextLine()", allow_stdin=True)
    req = kc.get_stdin_msg(timeout=60)
    kc.input("hello axis")
    reply = reply_for(msg_id)
    return {"request": {"type": req["msg_type"], "content": req["content"], "parent_msg_id": req["parent_header"].get("msg_id")},
            "msg_id": msg_id, "reply": reply["content"], "iopub": iopub_until_idle(msg_id)}

def stdin_interrupted():
    # an interrupt while the kernel waits for input_reply ends the cell; the kernel keeps serving
    msg_id = kc.execute("new java.util.Scanner(System.in).nextLine()", allow_stdin=True)
    req = kc.get_stdin_msg(timeout=60)
    km.interrupt_kernel()
    reply = reply_for(msg_id)
    iopub_until_idle(msg_id)
    after = run("40 + 2")
    return {"request_type": req["msg_type"], "reply": reply["content"], "after": after}

def stdin_shutdown():
    # a shutdown_request while the kernel waits for input_reply ends the kernel process by itself
    # (polled for up to 30 s, far beyond the 50 ms stdin poll; jupyter_client would kill it after 5 s)
    kc.execute("new java.util.Scanner(System.in).nextLine()", allow_stdin=True)
    req = kc.get_stdin_msg(timeout=60)
    kc.shutdown()
    ended = False
    for i in range(300):
        if not km.is_alive():
            ended = True
            break
        time.sleep(0.1)
    return {"request_type": req["msg_type"], "ended_by_itself": ended}

try:
    kc.wait_for_ready(timeout=90)
    step("json_mime", json_mime)
    step("stop_on_error", stop_on_error)
    step("stdin_refused", stdin_refused)
    step("stdin_answered", stdin_answered)
    step("stdin_interrupted", stdin_interrupted)
    step("stdin_shutdown", stdin_shutdown)  # last: it ends the kernel
finally:
    try:
        kc.stop_channels()
        km.shutdown_kernel(now=False)
    except Exception:
        pass
print(json.dumps(out))
