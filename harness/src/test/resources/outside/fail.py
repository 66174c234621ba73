# Test helper: complains and exits with status 3.
import sys
sys.stderr.write("something went wrong inside the method\n")
sys.exit(3)
