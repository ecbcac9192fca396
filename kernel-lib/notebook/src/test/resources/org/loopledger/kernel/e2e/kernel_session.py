# End-to-end steps against the Loopledger kernel through Debian's jupyter_client, following the
# Jupyter messaging specification, version 5.3. Input (stdin JSON): {"jupyter_path": ...}.
# Output: one JSON object, one entry per step (an "exception" entry if a step failed).
import json, os, sys, time, traceback
inp = json.load(sys.stdin)
os.environ["JUPYTER_PATH"] = inp["jupyter_path"]
from jupyter_client.manager import KernelManager
from jupyter_client.session import Session
import zmq

out = {}
km = KernelManager(kernel_name="loopledger")
t0 = time.time()
km.start_kernel()
kc = km.client()
kc.start_channels()

def reply_for(msg_id, timeout, channel):
    while True:
        m = channel(timeout=timeout)
        if m["parent_header"].get("msg_id") == msg_id:
            return m

def iopub_until_idle(msg_id, timeout=60):
    msgs = []
    while True:
        m = kc.get_iopub_msg(timeout=timeout)
        if m["parent_header"].get("msg_id") != msg_id:
            continue
        sent = m["header"].get("date")
        sent = sent.timestamp() if hasattr(sent, "timestamp") else time.time()
        msgs.append({"type": m["msg_type"], "content": m["content"], "t": sent})
        if m["msg_type"] == "status" and m["content"]["execution_state"] == "idle":
            return msgs

def run(code, timeout=60, before_reply=None, **kw):
    msg_id = kc.execute(code, **kw)
    if before_reply:
        before_reply()
    reply = reply_for(msg_id, timeout, kc.get_shell_msg)
    return {"reply": reply["content"], "iopub": iopub_until_idle(msg_id, timeout)}

def step(name, fn):
    try:
        out[name] = fn()
    except Exception:
        out[name] = {"exception": traceback.format_exc()}

try:
    kc.wait_for_ready(timeout=90)
    out["ready_seconds"] = time.time() - t0
    step("kernel_info", lambda: kc.kernel_info(reply=True, timeout=30)["content"])
    step("one_plus_one", lambda: run("1+1"))
    step("silent", lambda: run("int silentVar = 3;", silent=True))
    step("after_silent", lambda: run("silentVar * 2"))
    step("no_history", lambda: run("7", store_history=False))
    step("stream", lambda: run('for (int i = 0; i < 4; i++) { System.out.println("tick " + i); Thread.sleep(250); }'))
    step("error", lambda: run("int a = 1;\nint b = a / 0;"))
    step("compile_error", lambda: run("int c = 2;\nint d = nope + c;"))
    step("display", lambda: run('display(markdown("**hi** <b>x</b>"));\n42'))
    step("define", lambda: run('String greeting = "hello";'))
    step("complete", lambda: kc.complete("greeting.toUpp", 14, reply=True, timeout=30)["content"])
    step("inspect", lambda: kc.inspect("Math.max(", 9, reply=True, timeout=30)["content"])
    step("is_complete_open", lambda: reply_for(kc.is_complete("void f() {"), 30, kc.get_shell_msg)["content"])
    step("is_complete_done", lambda: reply_for(kc.is_complete("int x = 1;"), 30, kc.get_shell_msg)["content"])
    step("comm_info", lambda: kc.comm_info(reply=True, timeout=30)["content"])

    def interrupt():
        def later():
            time.sleep(1.5)
            out["interrupt_sent_at"] = time.time()
            km.interrupt_kernel()
        r = run("long n = 0;\nwhile (true) { n++; }", before_reply=later)
        r["reply_at"] = time.time()
        return r
    step("interrupt", interrupt)
    step("after_interrupt", lambda: run("1 + 2"))

    def forged():
        info = km.get_connection_info()
        ctx = zmq.Context()
        sock = ctx.socket(zmq.DEALER)
        sock.connect("%s://%s:%d" % (info["transport"], info["ip"], info["shell_port"]))
        ids = []
        for key in (b"not-the-key", b""):
            s = Session(key=key, username="intruder")
            msg = s.msg("execute_request", content={"code": 'System.out.println("forged")', "silent": False,
                                                   "store_history": True, "user_expressions": {}, "allow_stdin": False})
            ids.append(msg["header"]["msg_id"])
            s.send(sock, msg)
        sock.send_multipart([b"garbage", b"frames"])
        sock.send_multipart([b"<IDS|MSG>", b"deadbeef", b"{", b"{}", b"{}", b"{}"])
        seen = []
        end = time.time() + 2.0
        while time.time() < end:
            try:
                m = kc.get_iopub_msg(timeout=0.2)
                if m["parent_header"].get("msg_id") in ids:
                    seen.append(m["msg_type"])
            except Exception:
                pass
        got_reply = sock.poll(500)
        sock.close(0)
        ctx.term()
        return {"iopub_for_forged": seen, "forged_reply": bool(got_reply),
                "still_answers": kc.kernel_info(reply=True, timeout=30)["content"]["status"]}
    step("forged", forged)

    def megabytes():
        r = run('for (int i = 0; i < 40000; i++) System.out.println("line " + i + " of a long printout ..................");', timeout=120)
        texts = [m["content"]["text"] for m in r["iopub"] if m["type"] == "stream"]
        return {"reply": r["reply"], "stream_messages": len(texts), "chars": sum(len(t) for t in texts),
                "last_line": "".join(texts).rstrip("\n").split("\n")[-1]}
    step("megabytes", megabytes)
    step("system_exit", lambda: run("int beforeExit = 1;\nSystem.exit(3);", timeout=120))
    step("after_exit", lambda: run("2 + 2"))

    def restart():
        km.restart_kernel(now=False)
        kc.wait_for_ready(timeout=90)
        return run("40 + 2")
    step("restart", restart)

    def latency():
        times = []
        for i in range(20):
            t = time.time()
            run("1 + 1")
            times.append((time.time() - t) * 1000)
        times.sort()
        return {"median_ms": times[len(times) // 2], "min_ms": times[0]}
    step("latency", latency)
finally:
    kc.stop_channels()
    t = time.time()
    km.shutdown_kernel(now=False)
    out["shutdown_seconds"] = time.time() - t
    out["alive_after_shutdown"] = km.is_alive()
print(json.dumps(out))
