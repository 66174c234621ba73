#!/usr/bin/env python3
"""Example Touchstone adapter in Python (standard library only).

Touchstone runs this script as an external command learner (see docs/outside-learners.md):

    python3 correlation_skeleton.py --data DATA.csv --output GRAPH.json --seed N --threshold T \
        [--kinds KINDS.csv] [--knowledge KNOWLEDGE.json]

It reads the data set (CSV, header row of variable names, empty cell = missing), joins every
pair of variables whose absolute Pearson correlation over the rows complete for that pair
exceeds the threshold (discrete columns, as the kinds file says, by their category codes;
pairs the knowledge forbids in both directions are never joined), and writes the result as a CPDAG of undirected edges in Touchstone's
graph JSON shape. It is a stand-in for YOUR method: replace `learn` with your own search
and keep the reading and writing as they are.
"""
import argparse
import csv
import json
import math
import random
import sys


def read_kinds(path):
    """The kind of each column ('continuous' or 'discrete') from a kinds file: header column,kind."""
    if not path:
        return {}
    with open(path, newline="", encoding="utf-8") as f:
        rows = list(csv.reader(f))
    return {name: kind for name, kind in rows[1:]}


def read_knowledge(path):
    """Pairs (from, to) the knowledge forbids; the file also has 'required' and 'tiers'."""
    if not path:
        return set()
    with open(path, encoding="utf-8") as f:
        k = json.load(f)
    return {(a, b) for a, b in k.get("forbidden", [])}


def read_data(path, kinds):
    with open(path, newline="", encoding="utf-8") as f:
        rows = list(csv.reader(f))
    names, body = rows[0], rows[1:]
    columns = [[] for _ in names]
    codes = [{} for _ in names]
    for line_no, row in enumerate(body, start=2):
        if len(row) != len(names):
            sys.exit(f"{path}:{line_no}: expected {len(names)} cells, found {len(row)}")
        for j, cell in enumerate(row):
            if cell == "":
                columns[j].append(None)
            elif kinds.get(names[j]) == "discrete":
                columns[j].append(float(codes[j].setdefault(cell, len(codes[j]))))
            else:
                columns[j].append(float(cell))
    return names, columns


def correlation(x, y):
    pairs = [(a, b) for a, b in zip(x, y) if a is not None and b is not None]
    n = len(pairs)
    if n < 3:
        return 0.0
    mx = sum(a for a, _ in pairs) / n
    my = sum(b for _, b in pairs) / n
    sxy = sum((a - mx) * (b - my) for a, b in pairs)
    sxx = sum((a - mx) ** 2 for a, _ in pairs)
    syy = sum((b - my) ** 2 for _, b in pairs)
    return 0.0 if sxx == 0 or syy == 0 else sxy / math.sqrt(sxx * syy)


def learn(names, columns, threshold, forbidden, rng):
    """Your method goes here. Return a list of edges (a, b, mark_at_a, mark_at_b)."""
    edges = []
    for i in range(len(names)):
        for j in range(i + 1, len(names)):
            if (names[i], names[j]) in forbidden and (names[j], names[i]) in forbidden:
                continue
            if abs(correlation(columns[i], columns[j])) > threshold:
                edges.append((names[i], names[j], "tail", "tail"))
    return edges


def main():
    p = argparse.ArgumentParser()
    p.add_argument("--data", required=True)
    p.add_argument("--output", required=True)
    p.add_argument("--seed", type=int, default=0)
    p.add_argument("--threshold", type=float, default=0.3)
    p.add_argument("--kinds", default=None)
    p.add_argument("--knowledge", default=None)
    a = p.parse_args()
    rng = random.Random(a.seed)  # use this for any randomness, so runs are reproducible
    names, columns = read_data(a.data, read_kinds(a.kinds))
    edges = learn(names, columns, a.threshold, read_knowledge(a.knowledge), rng)
    graph = {"variables": names,
             "edges": [{"between": [x, y], "marks": [mx, my]} for x, y, mx, my in edges]}
    with open(a.output, "w", encoding="utf-8") as f:
        json.dump(graph, f)


if __name__ == "__main__":
    main()
