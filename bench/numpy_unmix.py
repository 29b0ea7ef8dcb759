"""The reference point of qdpanel's unmix benchmark: unmixing a whole image the way a scientist would with numpy and
scipy, on the very pixels bench/suites/unmix.ts unmixes (read from the raw float32 file the suite writes).

  - least squares, batched: A = pinv(M) @ Y over the whole pixel matrix (float64, as the library computes), and the
    per-pixel root-mean-square residual over channels; also np.linalg.lstsq(M, Y) on the whole matrix;
  - NNLS: scipy.optimize.nnls per pixel in a Python loop, timed on an evenly strided sample of pixels and scaled to
    the whole image (the loop's cost per pixel does not depend on the image size).

Usage: python3 bench/numpy_unmix.py <planes.f32> <channels> <pixels> <reference.json> <sample pixels>
Prints "ready scipy" (or "ready no-scipy"), then answers each line read from stdin:
  pinv  -> ms of one batched pinv @ Y with residuals     lstsq -> ms of one np.linalg.lstsq on the whole matrix
  nnls  -> ms for the whole image, scaled from the sample (or "skip" without scipy)
  mem   -> peak resident memory growth since the image was loaded, as a multiple of the image's float32 size

Needs python3 with numpy; scipy is optional (Debian: python3-numpy, python3-scipy).
"""
import json
import resource
import sys
import time

import numpy as np

try:
    from scipy.optimize import nnls
except ImportError:  # the NNLS reference is skipped, the least-squares ones still run
    nnls = None


def unmix_pinv(m, y):
    a = np.linalg.pinv(m) @ y
    residual = np.sqrt(np.mean((y - m @ a) ** 2, axis=0))
    return a, residual


def unmix_nnls_sample(m, y, sample):
    columns = y[:, sample].astype(np.float64)
    out = np.empty((m.shape[1], columns.shape[1]))
    for k in range(columns.shape[1]):
        out[:, k], _ = nnls(m, columns[:, k])
    return out


def timed_ms(fn):
    start = time.perf_counter()
    fn()
    return (time.perf_counter() - start) * 1e3


def main():
    path, channels, pixels, reference_path, sample_size = sys.argv[1:6]
    channels, pixels, sample_size = int(channels), int(pixels), int(sample_size)
    y = np.fromfile(path, dtype=np.float32).reshape(channels, pixels)
    with open(reference_path, encoding="utf8") as f:
        m = np.array(json.load(f), dtype=np.float64)
    sample = np.linspace(0, pixels - 1, sample_size).astype(np.int64)
    base_kib = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
    print("ready scipy" if nnls else "ready no-scipy", flush=True)
    for line in sys.stdin:
        command = line.strip()
        if command == "pinv":
            print(f"{timed_ms(lambda: unmix_pinv(m, y)):.3f}", flush=True)
        elif command == "lstsq":
            print(f"{timed_ms(lambda: np.linalg.lstsq(m, y, rcond=None)):.3f}", flush=True)
        elif command == "nnls":
            if nnls is None:
                print("skip", flush=True)
            else:
                print(f"{timed_ms(lambda: unmix_nnls_sample(m, y, sample)) * pixels / sample_size:.3f}", flush=True)
        elif command == "mem":
            peak_kib = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
            print(f"{(peak_kib - base_kib) * 1024 / y.nbytes:.3f}", flush=True)


if __name__ == "__main__":
    main()
