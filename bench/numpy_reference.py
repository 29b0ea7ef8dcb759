"""The reference point of qdpanel's spectra benchmark: the same 8-probe x 8-channel evaluation written the way a
scientist would write it with numpy, timed the way bench/suites/spectra.ts times the library.

One evaluation:
  - 8 emission lines, each a Gaussian in photon energy (FWHM 0.09 eV) times the Jacobian hc/lambda^2, on a 1 nm grid
    from 300 to 1000 nm, each scaled to unit area;
  - 8 bandpass transmissions, 24 nm wide, centred on the peaks, each the product of two logistic edges of scale 1.5 nm;
  - the collected matrix C[c, p] = sum over the grid of T_c * em_p;
  - the spillover matrix against each probe's strongest channel;
  - the 2-norm condition number of C with unit-norm columns;
  - the sample's light per channel: the 405 nm line leaking through each filter (scatter level x T_c(405 nm)) and the
    water Raman band under the line (a Gaussian in wavenumber, 3400 cm^-1 below the line, FWHM 400 cm^-1, scaled by
    (nu_s / nu_ref)^4 and to unit area) collected by each filter, and each probe's signal-to-background.

Prints one line: "numpy evaluate 8x8 median <us> us (min <us>, max <us>)", the median over 15 batches of 200 calls of
the mean time per call, after 200 calls to warm up.

With --paired it warms up, prints "ready", then for every line read from stdin runs one batch of 200 calls and prints
the mean microseconds per call: bench/suites/spectra.ts interleaves these batches with its own, so that both sides of
each pair run on the same (shared, drifting) machine.

Needs python3 with numpy (Debian: python3-numpy).
"""
import sys
import time

import numpy as np

HC_EV_NM = 1239.841984  # h c in eV nm (CODATA 2018)
FWHM_PER_SIGMA = 2.0 * np.sqrt(2.0 * np.log(2.0))
GRID_NM = np.arange(300.0, 1001.0, 1.0)
PEAKS_NM = np.array([490.0, 525.0, 565.0, 605.0, 640.0, 680.0, 715.0, 665.0])
LINE_FWHM_EV = 0.09
BAND_WIDTH_NM = 24.0
EDGE_SCALE_NM = 1.5
LINE_NM = 405.0
SCATTER_LEVEL = 1e10
RAMAN_SHIFT_CM1 = 3400.0  # O-H stretch of liquid water (approximate; see docs/science.md)
RAMAN_FWHM_CM1 = 400.0
RAMAN_LEVEL = 0.1


def emission_lines():
    energy = HC_EV_NM / GRID_NM
    sigma = LINE_FWHM_EV / FWHM_PER_SIGMA
    centre = HC_EV_NM / PEAKS_NM
    shape = np.exp(-0.5 * ((energy[None, :] - centre[:, None]) / sigma) ** 2) * (HC_EV_NM / GRID_NM**2)[None, :]
    return shape / shape.sum(axis=1, keepdims=True)


def bandpasses():
    rise = PEAKS_NM - BAND_WIDTH_NM / 2
    fall = PEAKS_NM + BAND_WIDTH_NM / 2
    up = 1.0 / (1.0 + np.exp(-(GRID_NM[None, :] - rise[:, None]) / EDGE_SCALE_NM))
    down = 1.0 / (1.0 + np.exp((GRID_NM[None, :] - fall[:, None]) / EDGE_SCALE_NM))
    return up * down


def water_raman():
    nu_line = 1e7 / LINE_NM
    nu = 1e7 / GRID_NM
    sigma = RAMAN_FWHM_CM1 / FWHM_PER_SIGMA
    band = np.exp(-0.5 * ((nu - (nu_line - RAMAN_SHIFT_CM1)) / sigma) ** 2) * (1e7 / GRID_NM**2)
    scale = ((nu_line - RAMAN_SHIFT_CM1) / (1e7 / LINE_NM - RAMAN_SHIFT_CM1)) ** 4
    return RAMAN_LEVEL * scale * band / band.sum()


def evaluate():
    filters = bandpasses()
    collected = filters @ emission_lines().T
    primary = collected.argmax(axis=0)
    own = collected[primary, np.arange(collected.shape[1])]
    spillover = collected / own
    kappa = np.linalg.cond(collected / np.linalg.norm(collected, axis=0))
    line_index = int(LINE_NM - GRID_NM[0])
    background = SCATTER_LEVEL * filters[:, line_index] + filters @ water_raman()
    signal_to_background = own / background[primary]
    return spillover, kappa, signal_to_background


def batch_mean_seconds(calls=200):
    start = time.perf_counter()
    for _ in range(calls):
        evaluate()
    return (time.perf_counter() - start) / calls


def serve_batches():
    print("ready", flush=True)
    for _ in sys.stdin:
        print(f"{batch_mean_seconds() * 1e6:.3f}", flush=True)


def main():
    for _ in range(200):
        evaluate()
    if "--paired" in sys.argv:
        serve_batches()
        return
    means = [batch_mean_seconds() for _ in range(15)]
    us = np.array(means) * 1e6
    print(f"numpy evaluate 8x8 median {np.median(us):.1f} us (min {us.min():.1f}, max {us.max():.1f})")


if __name__ == "__main__":
    main()
