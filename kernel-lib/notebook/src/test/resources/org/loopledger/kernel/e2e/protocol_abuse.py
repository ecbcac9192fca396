# Hostile but correctly signed traffic against the Loopledger kernel, checked through Debian's
# jupyter_client (Jupyter messaging specification 5.3, "The Wire Protocol"). Input (stdin JSON):
# {"jupyter_path": ..., "seed": N, "mutations": N, "oversize_bytes": N}. Output: one JSON object, one entry
# per step (an "exception" entry if a step failed). Seeded: the same seed sends the same messages.
import hashlib, hmac, json, os, random, sys, time, traceback, uuid
inp = json.load(sys.stdin)
os.environ["JUPYTER_PATH"] = inp["jupyter_path"]
from jupyter_client.manager import KernelManager
import zmq

out = {}
km = KernelManager(kernel_name="loopledger")
kernel_log = open(os.path.join(inp["jupyter_path"], "kernel-stderr.log"), "w")  # thousands of warnings: not into our pipe
km.start_kernel(stderr=kernel_log)
kc = km.client()
kc.start_channels()
info = km.get_connection_info()
key = info["key"] if isinstance(info["key"], bytes) else info["key"].encode()
ctx = zmq.Context()

def dealer(port_name):
    s = ctx.socket(zmq.DEALER)
    s.setsockopt(zmq.LINGER, 0)
    s.connect("%s://%s:%d" % (info["transport"], info["ip"], info[port_name]))
    return s

def sign(parts):
    h = hmac.new(key, digestmod=hashlib.sha256)
    for p in parts:
        h.update(p)
    return h.hexdigest().encode()

def header(msg_type):
    return {"msg_id": uuid.uuid4().hex, "msg_type": msg_type, "username": "abuser", "session": "abuse-session",
            "date": "2026-01-01T00:00:00.000000Z", "version": "5.3"}

def frames(h, content, parent=None, metadata=None, extra=()):
    parts = [json.dumps(x).encode() for x in (h, parent or {}, metadata or {}, content)]
    return [b"<IDS|MSG>", sign(parts)] + parts + list(extra)

def execute_content(code):
    return {"code": code, "silent": False, "store_history": True, "user_expressions": {}, "allow_stdin": False}

def replies(sock, wait):
    got = []
    end = time.time() + wait
    while True:
        left = end - time.time()
        if left <= 0 or not sock.poll(int(left * 1000)):
            return got
        msg = sock.recv_multipart()
        got.append(json.loads(msg[msg.index(b"<IDS|MSG>") + 5]))

def run(code, timeout=120):
    r = kc.execute_interactive(code, timeout=timeout, output_hook=lambda m: results.append(m))
    return r["content"]

results = []
def value(code, timeout=120):
    del results[:]
    reply = run(code, timeout)
    for m in results:
        if m["msg_type"] == "execute_result":
            return m["content"]["data"]["text/plain"]
    return {"no_result": reply}

def step(name, fn):
    try:
        out[name] = fn()
    except Exception:
        out[name] = {"exception": traceback.format_exc()}

def rss_kb(pid):
    with open("/proc/%d/status" % pid) as f:
        for line in f:
            if line.startswith("VmRSS:"):
                return int(line.split()[1])
    return -1

try:
    kc.wait_for_ready(timeout=120)
    kernel_pid = km.provisioner.process.pid
    step("counter", lambda: value("int counter = 0;\nint kept = 41;\ncounter"))

    def replay():
        s = dealer("shell_port")
        f = frames(header("execute_request"), execute_content("counter++;"))
        s.send_multipart(f)
        s.send_multipart(f)
        got = replies(s, 6.0)
        s.close()
        return {"replies": [g for g in got], "counter": value("counter")}
    step("replay", replay)

    def control_execute():
        msg_id = kc.execute("Thread.sleep(3000);")
        time.sleep(1.0)
        c = dealer("control_port")
        c.send_multipart(frames(header("execute_request"), execute_content("kept = 0;")))
        got = replies(c, 10.0)
        c.close()
        while True:
            m = kc.get_shell_msg(timeout=60)
            if m["parent_header"].get("msg_id") == msg_id:
                break
        return {"control_replies": got, "sleep_status": m["content"]["status"], "kept_plus_one": value("kept + 1")}
    step("control_execute", control_execute)

    def oversize():
        n = inp["oversize_bytes"]
        before = rss_kb(kernel_pid)
        s = dealer("shell_port")
        # signed, valid execute_request whose (unsigned) buffer frame is too large: must be dropped unread
        s.send_multipart(frames(header("execute_request"), execute_content("counter += 100;"), extra=[b"x" * n]))
        signed_replies = replies(s, 8.0)
        s.close()
        s = dealer("shell_port")
        s.send_multipart([b"<IDS|MSG>", b"", b"{" * n])  # one oversized unsigned frame
        s.send_multipart(frames(header("execute_request"), execute_content("counter += 1000;"),
                                extra=[b"y" * (n // 3)] * 3))  # several frames adding up above the limit
        more_replies = replies(s, 8.0)
        s.close()
        return {"signed_replies": signed_replies, "more_replies": more_replies, "counter": value("counter"),
                "rss_before_kb": before, "rss_after_kb": rss_kb(kernel_pid)}
    step("oversize", oversize)

    def fuzz():
        rnd = random.Random(inp["seed"])
        types = [None, {}, [], 1, "", "bogus_request", "kernel_info_request", "execute_request", "complete_request",
                 "inspect_request", "is_complete_request", "history_request", "comm_info_request", "interrupt_request",
                 "comm_open", "comm_msg", "execute_reply"]  # never shutdown_request: a signed one is legitimate
        junk = [None, {}, [], 0, -1, 2 ** 70, 1.5, "", "x", True, {"a": [1, {"b": None}]}, "\u00e9\u2603\ud83d\ude00"]
        codes = ["1+1", "", "int fuzzed = 1;", "nope(", "counter + 0", "\"s\"", "}"]
        sockets = {"shell": dealer("shell_port"), "control": dealer("control_port")}
        kinds = {}
        for i in range(inp["mutations"]):
            h = header(rnd.choice(types[5:]))
            content = {"code": rnd.choice(codes), "cursor_pos": rnd.randint(-3, 10), "silent": rnd.random() < 0.3,
                       "store_history": True, "detail_level": 0, "hist_access_type": "tail", "n": 3}
            parent, metadata, extra = {}, {}, []
            kind = rnd.randrange(9)
            kinds[kind] = kinds.get(kind, 0) + 1
            if kind == 0:
                h["msg_type"] = rnd.choice(types[:5])
            elif kind == 1:
                del h[rnd.choice(list(h))]
            elif kind == 2:
                h[rnd.choice(list(h))] = rnd.choice(junk)
            elif kind == 3:
                content[rnd.choice(list(content))] = rnd.choice(junk)
            elif kind == 4:
                del content[rnd.choice(list(content))]
            elif kind == 5:
                parent, metadata = rnd.choice(junk), rnd.choice(junk)
            elif kind == 6:
                extra = [os.urandom(rnd.randrange(30)) for _ in range(rnd.randrange(4))]
            f = frames(h, content, parent if isinstance(parent, dict) else {}, metadata if isinstance(metadata, dict) else {}, extra)
            if kind == 5:  # parent header and metadata that are not objects, signed
                parts = [f[2], json.dumps(parent).encode(), json.dumps(metadata).encode(), f[5]]
                f = [b"<IDS|MSG>", sign(parts)] + parts
            elif kind == 7:  # bad JSON or bytes in one part, signed
                parts = f[2:6]
                j = rnd.randrange(4)
                parts[j] = rnd.choice([parts[j][: rnd.randrange(len(parts[j]) + 1)], b"[" * 5000, os.urandom(12), b"null", b"\xff\xfe"])
                f = [b"<IDS|MSG>", sign(parts)] + parts
            elif kind == 8:  # wrong frame counts
                f = f[: rnd.randrange(1, len(f) + 1)] if rnd.random() < 0.7 else [os.urandom(5)] * rnd.randrange(1, 4) + f
            sock = sockets["control" if rnd.random() < 0.25 else "shell"]
            sock.send_multipart(f)
            if i % 50 == 49:
                for s in sockets.values():
                    replies(s, 0.05)
        for s in sockets.values():
            replies(s, 1.0)
            s.close()
        t = time.time()
        one_plus_one = value("1 + 1", timeout=120)
        control_info = kc.kernel_info(reply=True, timeout=30)["content"]["status"]
        control = dealer("control_port")
        control.send_multipart(frames(header("kernel_info_request"), {}))
        control_reply = replies(control, 30.0)
        control.close()
        return {"kinds": kinds, "one_plus_one": one_plus_one, "answer_seconds": time.time() - t,
                "kernel_info": control_info, "control_kernel_info": [r.get("status") for r in control_reply],
                "heartbeat": kc.hb_channel.is_beating(), "same_process": km.provisioner.process.pid == kernel_pid and km.is_alive(),
                "counter": value("counter")}
    step("fuzz", fuzz)
finally:
    kc.stop_channels()
    km.shutdown_kernel(now=True)
    ctx.destroy(linger=0)
    kernel_log.close()
    with open(kernel_log.name) as f:
        lines = f.read().splitlines()
    out["kernel_log_lines"] = len(lines)
    out["kernel_log_sample"] = sorted(set(l.split("] ", 1)[-1][:90] for l in lines))[:40]
print(json.dumps(out))
