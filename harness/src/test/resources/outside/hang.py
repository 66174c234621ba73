# Test helper: starts a child that sleeps, records both process ids, then sleeps itself.
import subprocess, sys, time
child = subprocess.Popen([sys.executable, "-c", "import time; time.sleep(120)"])
with open(sys.argv[1], "w") as f:
    f.write(f"{child.pid} ", )
    import os
    f.write(f"{os.getpid()}\n")
time.sleep(120)
