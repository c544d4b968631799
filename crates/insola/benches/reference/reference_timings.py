"""Times the reference libraries on the rows of `benches/reference.rs`.

Prints one line per row: `name seconds_per_item`, the median of `--repeats` runs. The rows:
* star_100k: pvlib.solarposition.get_solarposition(method="nrel_numpy") for 100,000
  instants a minute apart at one place (per instant);
* daily_insolation/180x365 and /1800x3650: climlab.solar.insolation.daily_insolation on a
  latitude x day grid (per cell).
The place and dates are arbitrary inputs for timing only.
"""

import argparse
import statistics
import time
import warnings

import numpy as np
import pandas as pd

warnings.filterwarnings("ignore")
import pvlib  # noqa: E402
from climlab.solar.insolation import daily_insolation  # noqa: E402


def median_time(fn, repeats):
    fn()  # warm-up
    runs = []
    for _ in range(repeats):
        start = time.perf_counter()
        fn()
        runs.append(time.perf_counter() - start)
    return statistics.median(runs)


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--repeats", type=int, default=5)
    args = ap.parse_args()
    n = 100_000
    times = pd.date_range("2031-03-01", periods=n, freq="1min", tz="UTC")
    star = lambda: pvlib.solarposition.get_solarposition(
        times, 47.3, 8.5, method="nrel_numpy"
    )
    print(f"star_100k {median_time(star, args.repeats) / n:.6e}")
    for rows, days in [(180, 365), (1800, 3650)]:
        lat = -90.0 + (np.arange(rows) + 0.5) * 180.0 / rows
        day = np.arange(days) * 365.2422 / days
        grid = lambda: daily_insolation(lat, day)
        reps = args.repeats if rows < 1000 else max(1, args.repeats // 2)
        print(f"daily_insolation/{rows}x{days} {median_time(grid, reps) / (rows * days):.6e}")


if __name__ == "__main__":
    main()
