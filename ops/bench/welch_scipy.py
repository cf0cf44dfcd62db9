#!/usr/bin/env python3
"""Reference runs of scipy for the spectrum library.

Two uses:

  bench IN_F32 OUT_F64 FS NPERSEG NOVERLAP RUNS
      Reads interleaved little-endian float32 I/Q samples, times
      scipy.signal.welch(x, fs, window='hann', nperseg=NPERSEG, noverlap=NOVERLAP,
                         return_onesided=False, scaling='density')
      (median of RUNS), writes the fft-shifted density as little-endian float64 to OUT_F64
      and prints one JSON line with the timings and versions.

  fixtures WELCH_JSON TRACE_JSON
      Writes the test fixtures: Welch estimates of a small fixed input for several windows,
      scalings and detrend settings, window samples and ENBW, and peak / prominence /
      percentile values of a synthetic trace. Every number comes from scipy or numpy.
"""
import json
import platform
import statistics
import sys
import time

import numpy as np
import scipy
import scipy.signal as signal


def bench(in_path, out_path, fs, nperseg, noverlap, runs):
    raw = np.fromfile(in_path, dtype='<f4')
    x = raw.view(np.complex64)
    times = []
    f = p = None
    for _ in range(runs):
        t0 = time.perf_counter()
        f, p = signal.welch(x, fs, window='hann', nperseg=nperseg, noverlap=noverlap,
                            return_onesided=False, scaling='density')
        times.append(time.perf_counter() - t0)
    np.fft.fftshift(p).astype('<f8').tofile(out_path)
    print(json.dumps({
        'medianS': statistics.median(times),
        'timesS': times,
        'scipy': scipy.__version__,
        'numpy': np.__version__,
        'python': platform.python_version(),
        'dtype': str(p.dtype),
        'call': f"scipy.signal.welch(x, {fs}, window='hann', nperseg={nperseg}, noverlap={noverlap}, "
                "return_onesided=False, scaling='density')",
    }))


def welch_fixture():
    rng = np.random.default_rng(20261201)
    n = 512
    fs = 2.0e6
    t = np.arange(n)
    # A tone off the bin grid, a weaker tone, a DC offset and noise: every term matters.
    x = (0.6 * np.exp(2j * np.pi * 0.1234 * t) + 0.05 * np.exp(-2j * np.pi * 0.31 * t)
         + (0.02 - 0.01j) + 0.03 * (rng.standard_normal(n) + 1j * rng.standard_normal(n)))
    cases = []
    specs = [
        ('hann', 'hann', 64, 32, 'density', 'constant'),
        ('hann', 'hann', 64, 32, 'spectrum', False),
        ('blackman-harris', 'blackmanharris', 128, 96, 'density', False),
        ('rectangular', 'boxcar', 32, 0, 'density', 'constant'),
        ('flattop', 'flattop', 64, 32, 'spectrum', 'constant'),
    ]
    for ours, theirs, nperseg, noverlap, scaling, detrend in specs:
        f, p = signal.welch(x, fs, window=theirs, nperseg=nperseg, noverlap=noverlap,
                            return_onesided=False, scaling=scaling, detrend=detrend)
        call = (f"scipy.signal.welch(x, fs={fs}, window='{theirs}', nperseg={nperseg}, "
                f"noverlap={noverlap}, return_onesided=False, scaling='{scaling}', "
                f"detrend={detrend!r})")
        cases.append({
            'window': ours,
            'segmentLength': nperseg,
            'overlapFraction': noverlap / nperseg,
            'scaling': scaling,
            'detrend': 'mean' if detrend == 'constant' else 'none',
            'call': call,
            'freqHzShifted': np.fft.fftshift(f).tolist(),
            'psdLinearShifted': np.fft.fftshift(p).tolist(),
        })
    windows = []
    for ours, theirs in [('hann', 'hann'), ('rectangular', 'boxcar'),
                         ('blackman-harris', 'blackmanharris'), ('flattop', 'flattop')]:
        w16 = signal.get_window(theirs, 16)
        w4096 = signal.get_window(theirs, 4096)
        windows.append({
            'window': ours,
            'call': f"scipy.signal.get_window('{theirs}', N) (periodic, fftbins=True)",
            'samples16': w16.tolist(),
            'enbwBins4096': float(4096 * np.sum(w4096 ** 2) / np.sum(w4096) ** 2),
        })
    return {
        'provenance': {
            'generator': 'ops/bench/welch_scipy.py fixtures',
            'scipy': scipy.__version__,
            'numpy': np.__version__,
            'python': platform.python_version(),
            'input': 'x = 0.6·exp(2πj·0.1234·n) + 0.05·exp(−2πj·0.31·n) + (0.02 − 0.01j) + 0.03·(N(0,1) + jN(0,1)), '
                     'n = 0…511, numpy default_rng(20261201); complex128 throughout',
            'frequencies': 'scipy returns fftfreq order; stored here fft-shifted (ascending). '
                           'The library adds the centre frequency, so compare freq − centre.',
        },
        'sampleRateHz': fs,
        'iqInterleaved': np.column_stack([x.real, x.imag]).ravel().tolist(),
        'cases': cases,
        'windows': windows,
    }


def trace_fixture():
    rng = np.random.default_rng(7)
    n = 801
    freq_hz = 100.0e6 + np.arange(n) * 25.0e3
    noise_dbm = -100.0 + 2.0 * rng.standard_normal(n)
    bumps = [(100.0e6 + 5.0e6, 400e3, -40.0), (100.0e6 + 12.5e6, 150e3, -62.0),
             (100.0e6 + 13.0e6, 100e3, -70.0)]
    mw = 10 ** (noise_dbm / 10)
    for f0, sigma, peak in bumps:
        mw = mw + 10 ** (peak / 10) * np.exp(-((freq_hz - f0) ** 2) / (2 * sigma ** 2))
    level_dbm = np.round(10 * np.log10(mw), 6)
    # A plateau, to check the flat-top rule.
    level_dbm[700:703] = -80.0
    level_dbm[699] = -85.0
    level_dbm[703] = -85.0
    peaks, _ = signal.find_peaks(level_dbm)
    prominences, left_bases, right_bases = signal.peak_prominences(level_dbm, peaks)
    return {
        'provenance': {
            'generator': 'ops/bench/welch_scipy.py fixtures',
            'scipy': scipy.__version__,
            'numpy': np.__version__,
            'calls': ['scipy.signal.find_peaks(levelDbm)',
                      'scipy.signal.peak_prominences(levelDbm, peaks)',
                      "numpy.percentile(levelDbm, q) (method 'linear')"],
        },
        'freqHz': freq_hz.tolist(),
        'levelDbm': level_dbm.tolist(),
        'peakIndices': peaks.tolist(),
        'prominencesDb': prominences.tolist(),
        'leftBases': left_bases.tolist(),
        'rightBases': right_bases.tolist(),
        'percentiles': {str(q): float(np.percentile(level_dbm, q)) for q in (10, 50, 90)},
    }


def main(argv):
    if len(argv) >= 7 and argv[0] == 'bench':
        bench(argv[1], argv[2], float(argv[3]), int(argv[4]), int(argv[5]), int(argv[6]))
    elif len(argv) == 3 and argv[0] == 'fixtures':
        with open(argv[1], 'w') as fh:
            json.dump(welch_fixture(), fh, indent=1)
            fh.write('\n')
        with open(argv[2], 'w') as fh:
            json.dump(trace_fixture(), fh, indent=1)
            fh.write('\n')
    else:
        sys.stderr.write(__doc__)
        sys.exit(2)


if __name__ == '__main__':
    main(sys.argv[1:])
