# Runs a small notebook on our kernel with Debian's `jupyter nbconvert --to notebook --execute` and
# validates the result with nbformat (nbformat v4 schema). Input JSON: {"jupyter_path", "dir"}.
import json, os, subprocess, sys
inp = json.load(sys.stdin)
env = dict(os.environ, JUPYTER_PATH=inp["jupyter_path"])
import nbformat
from nbformat.v4 import new_notebook, new_code_cell, new_markdown_cell
nb = new_notebook(cells=[
    new_markdown_cell("# Smoke"),
    new_code_cell('System.out.println("hello from java");'),
    new_code_cell("int k = 6;\nk * 7"),
    new_code_cell('display(markdown("**bold**"));'),
], metadata={"kernelspec": {"name": "loopledger", "display_name": "Java (Loopledger)", "language": "java"}})
src = os.path.join(inp["dir"], "smoke.ipynb")
nbformat.write(nb, src)
p = subprocess.run(["/usr/bin/jupyter", "nbconvert", "--to", "notebook", "--execute", "--ExecutePreprocessor.timeout=120",
                    "--output", "smoke.out.ipynb", src], env=env, capture_output=True, text=True, timeout=300)
result = {"returncode": p.returncode, "stderr": p.stderr[-3000:]}
if p.returncode == 0:
    out = nbformat.read(os.path.join(inp["dir"], "smoke.out.ipynb"), as_version=4)
    try:
        nbformat.validate(out)
        result["valid"] = True
    except Exception as e:
        result["valid"] = False
        result["validation_error"] = str(e)
    result["outputs"] = [c.get("outputs", []) for c in out.cells if c.cell_type == "code"]
print(json.dumps(result))
