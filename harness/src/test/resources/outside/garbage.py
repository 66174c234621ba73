# Test helper: writes something that is not a graph.
import sys
with open(sys.argv[1], "w") as f:
    f.write("this is { not a graph")
