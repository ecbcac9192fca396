# Process lifetimes (issue 12): no kernel or agent JVM may outlive the process that started it, whatever
# the signal, even while a cell spins in a tight loop. Kernels are started by Debian's jupyter_client
# (which sets JPY_PARENT_PID, as for ipykernel's parent poller); the runner is `loopledger run`.
# Input (stdin JSON): {"jupyter_path", "java", "class_path", "dir", "give_up_s", "reference"}.
# Output: per scenario the seconds from the signal until each process had ended (null: still alive when
# we gave up, after which it is killed so nothing is left behind).
import json, os, signal, subprocess, sys, time, traceback
inp = json.load(sys.stdin)
os.environ["JUPYTER_PATH"] = inp["jupyter_path"]
from jupyter_client.manager import KernelManager
GIVE_UP = inp["give_up_s"]
out = {}

def stat(pid):
    try:
        with open("/proc/%d/stat" % pid) as f:
            s = f.read()
        rest = s[s.rindex(")") + 2:].split()
        return rest[0], int(rest[1])  # state, ppid
    except (FileNotFoundError, ProcessLookupError, ValueError):
        return None, None

def alive(pid):
    state, _ = stat(pid)
    return state is not None and state not in ("Z", "X")

def children(pid):
    found = []
    for d in os.listdir("/proc"):
        if d.isdigit() and stat(int(d))[1] == pid:
            found.append(int(d))
    return found

def wait_for(cond, timeout, what):
    end = time.time() + timeout
    while time.time() < end:
        v = cond()
        if v:
            return v
        time.sleep(0.05)
    raise RuntimeError("timed out waiting for " + what)

def time_to_exit(pids, t0):
    """Seconds from t0 until each pid ended; None for those alive after GIVE_UP s (then SIGKILLed)."""
    res = {name: None for name in pids}
    while time.time() - t0 < GIVE_UP and any(res[n] is None for n in pids):
        for name, pid in pids.items():
            if res[name] is None and not alive(pid):
                res[name] = round(time.time() - t0, 3)
        time.sleep(0.02)
    for name, pid in pids.items():
        if res[name] is None:
            try:
                os.kill(pid, signal.SIGKILL)
            except ProcessLookupError:
                pass
    return res

def spin_code(marker):
    return 'java.nio.file.Files.writeString(java.nio.file.Path.of("%s"), "running");\nlong n = 0;\nwhile (true) { n++; }' % marker

def marker(name):
    p = os.path.join(inp["dir"], name + ".marker")
    if os.path.exists(p):
        os.remove(p)
    return p

def kill_kernel(sig, name):
    km = KernelManager(kernel_name="loopledger")
    km.start_kernel(stderr=subprocess.DEVNULL)
    kc = km.client()
    kc.start_channels()
    try:
        kc.wait_for_ready(timeout=120)
        kernel = km.provisioner.process.pid
        m = marker(name)
        kc.execute(spin_code(m))
        wait_for(lambda: os.path.exists(m), 120, "the cell to start")
        agent = wait_for(lambda: children(kernel), 10, "the agent JVM")[0]
        time.sleep(0.5)
        t0 = time.time()
        os.kill(kernel, sig)
        return time_to_exit({"kernel": kernel, "agent": agent}, t0)
    finally:
        kc.stop_channels()
        try:
            km.provisioner.process.wait()
        except Exception:
            pass
        km.cleanup_resources()

PARENT = r'''
import json, os, sys, time
os.environ["JUPYTER_PATH"] = sys.argv[1]
from jupyter_client.manager import KernelManager
import subprocess
km = KernelManager(kernel_name=sys.argv[2])
km.start_kernel(stderr=subprocess.DEVNULL)
kc = km.client()
kc.start_channels()
kc.wait_for_ready(timeout=120)
kc.execute(sys.argv[3])
print(km.provisioner.process.pid, flush=True)
time.sleep(3600)
'''

def kill_parent(kernel_name, code, name, with_agent):
    m = marker(name)
    parent = subprocess.Popen([sys.executable, "-c", PARENT, inp["jupyter_path"], kernel_name, code % {"marker": m}],
                              stdout=subprocess.PIPE, stderr=subprocess.DEVNULL, text=True)
    try:
        kernel = int(parent.stdout.readline())
        wait_for(lambda: os.path.exists(m), 120, "the cell to start")
        pids = {"kernel": kernel}
        if with_agent:
            pids["agent"] = wait_for(lambda: children(kernel), 10, "the agent JVM")[0]
        time.sleep(0.5)
        t0 = time.time()
        parent.kill()
        parent.wait()
        return time_to_exit(pids, t0)
    finally:
        if parent.poll() is None:
            parent.kill()

def kill_runner(sig, name):
    m = marker(name)
    nb = os.path.join(inp["dir"], name + ".ipynb")
    with open(nb, "w") as f:
        json.dump({"cells": [{"cell_type": "code", "execution_count": None, "metadata": {}, "outputs": [],
                              "source": spin_code(m)}],
                   "metadata": {"kernelspec": {"name": "loopledger", "display_name": "Java (Loopledger)", "language": "java"},
                                "language_info": {"name": "java"}},
                   "nbformat": 4, "nbformat_minor": 4}, f)
    runner = subprocess.Popen([inp["java"], "-cp", inp["class_path"], "org.loopledger.cli.Main", "run", nb,
                               "-o", os.path.join(inp["dir"], name + ".out.ipynb")],
                              stdin=subprocess.DEVNULL, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)  # as from a shell
    try:
        wait_for(lambda: os.path.exists(m) or runner.poll() is not None, 180, "the cell to start")
        if runner.poll() is not None:
            raise RuntimeError("the runner ended before the cell ran: exit %d" % runner.returncode)
        agent = wait_for(lambda: children(runner.pid), 10, "the agent JVM")[0]
        time.sleep(0.5)
        t0 = time.time()
        os.kill(runner.pid, sig)
        runner.wait()
        return time_to_exit({"runner": runner.pid, "agent": agent}, t0)
    finally:
        if runner.poll() is None:
            runner.kill()

def step(name, fn):
    try:
        out[name] = fn()
    except Exception:
        out[name] = {"exception": traceback.format_exc()}

step("kernel_sigkill", lambda: kill_kernel(signal.SIGKILL, "kernel_sigkill"))
step("kernel_sigterm", lambda: kill_kernel(signal.SIGTERM, "kernel_sigterm"))
step("parent_sigkill", lambda: kill_parent("loopledger", spin_code("%(marker)s"), "parent_sigkill", True))
step("runner_sigterm", lambda: kill_runner(signal.SIGTERM, "runner_sigterm"))
step("runner_sigkill", lambda: kill_runner(signal.SIGKILL, "runner_sigkill"))
if inp["reference"]:
    # ipykernel under the same parent kill, for comparison (its parent poller checks once a second)
    step("ipykernel_parent_sigkill", lambda: kill_parent("python3", "open(%(marker)r, 'w').write('running')\nwhile True: pass",
                                                         "ipykernel_parent_sigkill", False))
print(json.dumps(out))
