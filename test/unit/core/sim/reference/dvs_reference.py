"""Reference event-camera pixel for Gazeloom's pixel-model test.

dvs_events is the reference model of REFERENCES.md section 6 (an ideal pixel in log
intensity, reference reset to ref +/- C per event, crossing times linear in log intensity
between samples, refractory crossings dropped while the reference still moves), after
Gallego et al. (2020), "Event-based Vision: A Survey", IEEE TPAMI, eq. 1. It runs on a
waveform that crosses many times per sample in both directions, with unequal ON and OFF
thresholds and a refractory period. Run with /usr/bin/python3 (numpy); it prints JSON,
which is also kept beside it as dvs_reference.json.
"""
import json
import numpy as np


def dvs_events(t, I, C_on=0.2, C_off=0.2, refractory=0.0):
    L = np.log(I); ref = L[0]; ev = []; last = -np.inf
    for k in range(1, len(t)):
        while True:
            d = L[k] - ref
            if d >= C_on: target = ref + C_on; p = +1
            elif d <= -C_off: target = ref - C_off; p = -1
            else: break
            tc = t[k-1] + (target - L[k-1]) / (L[k] - L[k-1]) * (t[k] - t[k-1]) if L[k] != L[k-1] else t[k]
            tc = max(tc, t[k-1])
            if tc - last >= refractory: ev.append((tc, p)); last = tc
            ref = target
    return ev


# 10 ms samples: several crossings per sample, some inside the refractory period. The samples are listed so that the test
# feeds the model exactly the same numbers.
t = np.arange(0, 61) * 0.01
I = 100.0 * np.exp(1.1 * np.sin(2 * np.pi * 3 * t) + 0.6 * np.sin(2 * np.pi * 17 * t))
events = dvs_events(t, I, C_on=0.2, C_off=0.25, refractory=0.003)
print(json.dumps({
    "source": "dvs_reference.py (numpy %s)" % np.__version__,
    "C_on": 0.2, "C_off": 0.25, "refractory_s": 0.003,
    "t_s": t.tolist(), "intensity": I.tolist(),
    "events": [[float(a), int(p)] for a, p in events],
}))
