#!/usr/bin/env python3
"""Independent reference for Gazeloom's seeded shuffle, written from the published algorithms.

- Seeding: SplitMix32 (constants 0x9e3779b9, 0x85ebca6b, 0xc2b2ae35) gives the four state words.
- Generator: xoshiro128** 1.1, Blackman and Vigna (2018), https://prng.di.unimi.it/xoshiro128starstar.c
- Integer in [0, n): draw 32-bit words until one is below 2^32 - (2^32 mod n), take it mod n.
- Shuffle: Durstenfeld, R. (1964), "Algorithm 235: Random permutation", CACM 7(7):420:
  for i = n-1 down to 1, swap a[i] with a[j], j uniform in 0..i.
Also prints chi-square critical values from scipy.stats.chi2 for the uniformity tests.

Run: /usr/bin/python3 test/unit/core/study/reference/shuffle-reference.py > test/unit/core/study/reference/shuffle-reference.json
"""
import json

M = 0xFFFFFFFF


def splitmix32_states(seed):
    z = seed & M
    out = []
    for _ in range(4):
        z = (z + 0x9E3779B9) & M
        r = z
        r = ((r ^ (r >> 16)) * 0x85EBCA6B) & M
        r = ((r ^ (r >> 13)) * 0xC2B2AE35) & M
        out.append((r ^ (r >> 16)) & M)
    return out


def rotl(x, k):
    return ((x << k) | (x >> (32 - k))) & M


class Xoshiro128StarStar:
    def __init__(self, seed):
        self.s = splitmix32_states(seed)

    def next_u32(self):
        s = self.s
        result = (rotl((s[1] * 5) & M, 7) * 9) & M
        t = (s[1] << 9) & M
        s[2] ^= s[0]
        s[3] ^= s[1]
        s[1] ^= s[2]
        s[0] ^= s[3]
        s[2] ^= t
        s[3] = rotl(s[3], 11)
        return result

    def next_int(self, n):
        limit = 2**32 - (2**32 % n)
        r = self.next_u32()
        while r >= limit:
            r = self.next_u32()
        return r % n


def shuffle(n, seed):
    a = list(range(n))
    g = Xoshiro128StarStar(seed)
    for i in range(n - 1, 0, -1):
        j = g.next_int(i + 1)
        a[i], a[j] = a[j], a[i]
    return a


CASES = [(n, seed) for n in (2, 5, 8, 12, 30) for seed in (0, 1, 2, 42, 4294967295)]

if __name__ == "__main__":
    result = {"shuffles": [{"n": n, "seed": seed, "order": shuffle(n, seed)} for n, seed in CASES]}
    try:
        from scipy.stats import chi2

        result["chi2_upper_0_001"] = {str(df): float(chi2.ppf(0.999, df)) for df in (7, 23)}
    except ImportError:
        pass
    print(json.dumps(result))
