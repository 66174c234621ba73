# Test helper: writes a valid graph file over variables the data do not have.
import json, sys
with open(sys.argv[1], "w") as f:
    json.dump({"variables": ["P", "Q"], "edges": [{"between": ["P", "Q"], "marks": ["tail", "arrow"]}]}, f)
