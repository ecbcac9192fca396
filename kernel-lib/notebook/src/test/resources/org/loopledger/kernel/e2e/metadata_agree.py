# The same notebook executed twice: by Debian's `jupyter nbconvert --to notebook --execute` on our kernel and by
# `loopledger run`; reports both metadata and the kernelspec jupyter_client finds (what JupyterLab writes as
# metadata.kernelspec on saving). Input JSON: {"jupyter_path", "dir", "loopledger": [argv...]}.
import json, os, subprocess, sys
inp = json.load(sys.stdin)
env = dict(os.environ, JUPYTER_PATH=inp["jupyter_path"])
os.environ["JUPYTER_PATH"] = inp["jupyter_path"]
import nbformat
from nbformat.v4 import new_notebook, new_code_cell
from jupyter_client.kernelspec import KernelSpecManager
# Stale metadata as older Loopledger versions wrote it: both runs must replace it with the kernel's own.
nb = new_notebook(cells=[new_code_cell("int k = 6;\nk * 7")],
                  metadata={"kernelspec": {"name": "loopledger", "display_name": "Java (Loopledger)", "language": "java"},
                            "language_info": {"name": "java", "file_extension": ".jshell", "version": "17"}})
src = os.path.join(inp["dir"], "meta.ipynb")
nbformat.write(nb, src)
result = {}
p = subprocess.run(["/usr/bin/jupyter", "nbconvert", "--to", "notebook", "--execute", "--ExecutePreprocessor.timeout=120",
                    "--output", "meta.nbconvert.ipynb", src], env=env, capture_output=True, text=True, timeout=300)
result["nbconvert"] = {"returncode": p.returncode, "stderr": p.stderr[-3000:]}
if p.returncode == 0:
    result["nbconvert"]["metadata"] = nbformat.read(os.path.join(inp["dir"], "meta.nbconvert.ipynb"), as_version=4).metadata
p = subprocess.run(inp["loopledger"] + ["run", src, "-o", os.path.join(inp["dir"], "meta.run.ipynb")], env=env,
                   capture_output=True, text=True, timeout=300, cwd=inp["dir"])
result["run"] = {"returncode": p.returncode, "stderr": p.stderr[-3000:]}
if p.returncode == 0:
    result["run"]["metadata"] = nbformat.read(os.path.join(inp["dir"], "meta.run.ipynb"), as_version=4).metadata
spec = KernelSpecManager().get_kernel_spec("loopledger")
result["kernelspec"] = {"name": "loopledger", "display_name": spec.display_name, "language": spec.language}
print(json.dumps(result))
