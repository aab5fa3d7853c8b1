#!/usr/bin/env python3
"""Realistic benchmark line lists from real 160-character records (the same construction as the Java test support
JitteredSamples): the records of SAMPLE files whose position lies in [LOW, HIGH] are cycled until COUNT records,
each copy's position moved by a uniform random offset of at most +-JITTER cm-1 (seeded), written sorted.

    python3 tools/jitter-sample.py OUT COUNT LOW HIGH JITTER SAMPLE [SAMPLE ...]
"""
import random
import sys


def main():
    out, count, lo, hi, jitter = sys.argv[1], int(sys.argv[2]), float(sys.argv[3]), float(sys.argv[4]), float(sys.argv[5])
    records = []
    for path in sys.argv[6:]:
        with open(path, encoding='latin-1') as f:
            for line in f:
                line = line.rstrip('\n')
                if len(line) >= 160 and lo <= float(line[3:15]) <= hi:
                    records.append(line[:160])
    if not records:
        sys.exit('no record within the window')
    rng = random.Random(1)
    rows = []
    for k in range(count):
        r = records[k % len(records)]
        nu = max(float(r[3:15]) + rng.uniform(-jitter, jitter), 1e-6)
        rows.append((nu, r[:3] + '%12.6f' % nu + r[15:]))
    rows.sort(key=lambda t: t[0])
    with open(out, 'w', encoding='latin-1') as f:
        for _, r in rows:
            f.write(r + '\n')
    print(f'{count} records from {len(records)} sample records in {lo}-{hi} cm-1 -> {out}')


if __name__ == '__main__':
    main()
