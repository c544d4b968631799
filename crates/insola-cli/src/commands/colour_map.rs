//! Colour ramps and scales of the charts, and round tick values.

/// An RGB colour, 8 bits per channel.
pub type Colour = [u8; 3];

/// A colour ramp: stops at positions 0–1, linear interpolation between them.
#[derive(Debug, Clone, Copy)]
pub struct Ramp(pub &'static [(f64, Colour)]);

/// Sunlight: night-dark violet through rose and amber to pale straw. Lightness rises
/// monotonically along the ramp, so it reads in order even in grey.
pub const SUNLIGHT: Ramp = Ramp(&[
    (0.0, [18, 14, 34]),
    (0.22, [62, 40, 108]),
    (0.45, [150, 56, 104]),
    (0.68, [218, 112, 62]),
    (0.86, [244, 184, 84]),
    (1.0, [252, 243, 200]),
]);

/// Daylight: deep night blue through dusk blue and grey-teal to pale daylight yellow.
/// Lightness rises monotonically.
pub const DAYLIGHT: Ramp = Ramp(&[
    (0.0, [10, 14, 44]),
    (0.3, [38, 66, 132]),
    (0.55, [84, 138, 170]),
    (0.8, [182, 204, 170]),
    (1.0, [250, 240, 170]),
]);

/// Below freezing: dark indigo to pale ice blue (read at 0 = coldest, 1 = just below 0 °C).
pub const FROST: Ramp = Ramp(&[
    (0.0, [30, 16, 72]),
    (0.35, [44, 70, 160]),
    (0.7, [92, 150, 212]),
    (1.0, [200, 230, 244]),
]);

/// Above freezing: pale cream through ochre and brick red to dark maroon (0 = just above
/// 0 °C, 1 = hottest).
pub const WARMTH: Ramp = Ramp(&[
    (0.0, [246, 236, 188]),
    (0.3, [232, 178, 92]),
    (0.6, [206, 96, 52]),
    (0.85, [150, 34, 40]),
    (1.0, [80, 12, 32]),
]);

/// Growing season: bare tan through olive to deep green (0 = no growing days, 1 = all year).
/// Lightness falls monotonically, so more growth reads darker.
pub const GROWTH: Ramp = Ramp(&[
    (0.0, [238, 230, 206]),
    (0.3, [198, 204, 136]),
    (0.6, [112, 160, 84]),
    (0.85, [46, 108, 58]),
    (1.0, [18, 62, 40]),
]);

/// Colours of the thermal zones, warmest first (as `ThermalZone::ALL`): warm sand, pale
/// green-grey, steel blue, white-blue ice.
pub const ZONE_COLOURS: [Colour; 4] = [
    [230, 170, 92],
    [176, 196, 150],
    [104, 134, 176],
    [228, 240, 250],
];

impl Ramp {
    /// The colour at `t` (clamped to 0–1; NaN gives the start colour).
    pub fn at(&self, t: f64) -> Colour {
        let t = if t.is_nan() { 0.0 } else { t.clamp(0.0, 1.0) };
        let stops = self.0;
        for w in stops.windows(2) {
            let ((t0, c0), (t1, c1)) = (w[0], w[1]);
            if t <= t1 {
                let u = if t1 > t0 { (t - t0) / (t1 - t0) } else { 0.0 };
                let mix =
                    |a: u8, b: u8| (f64::from(a) + u * (f64::from(b) - f64::from(a))).round() as u8;
                return [mix(c0[0], c1[0]), mix(c0[1], c1[1]), mix(c0[2], c1[2])];
            }
        }
        stops[stops.len() - 1].1
    }
}

/// How values map to colours.
#[derive(Debug, Clone, Copy)]
pub enum Scale {
    /// One ramp from `lo` to `hi`.
    Linear {
        /// Ramp.
        ramp: Ramp,
        /// Value at the ramp start.
        lo: f64,
        /// Value at the ramp end.
        hi: f64,
    },
    /// Two ramps meeting at `mid` (0 °C), `below` under it and `above` over it, each stretched
    /// over the larger of `mid - lo` and `hi - mid` so a degree is the same step on both sides.
    Split {
        /// Ramp below `mid`.
        below: Ramp,
        /// Ramp above `mid`.
        above: Ramp,
        /// Lowest value.
        lo: f64,
        /// Meeting value.
        mid: f64,
        /// Highest value.
        hi: f64,
    },
}

impl Scale {
    /// Colour of a value.
    pub fn colour(&self, v: f64) -> Colour {
        match *self {
            Scale::Linear { ramp, lo, hi } => ramp.at((v - lo) / (hi - lo)),
            Scale::Split {
                below,
                above,
                lo,
                mid,
                hi,
            } => {
                // Same colour change per unit on both sides: the ramps span the larger side.
                let span = (mid - lo).max(hi - mid);
                if v < mid {
                    below.at(1.0 + (v - mid) / span)
                } else {
                    above.at((v - mid) / span)
                }
            }
        }
    }

    /// Value range shown, `(lo, hi)`.
    pub fn range(&self) -> (f64, f64) {
        match *self {
            Scale::Linear { lo, hi, .. } | Scale::Split { lo, hi, .. } => (lo, hi),
        }
    }
}

/// Tick values covering `lo..=hi` at a "nice" step (1, 2 or 5 × 10ⁿ), about `target` of them.
pub fn nice_ticks(lo: f64, hi: f64, target: usize) -> Vec<f64> {
    if hi <= lo || !lo.is_finite() || !hi.is_finite() {
        return vec![lo];
    }
    let raw = (hi - lo) / target.max(1) as f64;
    let mag = 10f64.powf(raw.log10().floor());
    let step = [1.0, 2.0, 5.0, 10.0]
        .iter()
        .map(|m| m * mag)
        .find(|s| *s >= raw)
        .unwrap_or(10.0 * mag);
    let first = (lo / step).ceil() as i64;
    let last = (hi / step).floor() as i64;
    (first..=last).map(|k| k as f64 * step).collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ramps_hit_their_ends_and_stay_in_order() {
        assert_eq!(SUNLIGHT.at(0.0), [18, 14, 34]);
        assert_eq!(SUNLIGHT.at(1.0), [252, 243, 200]);
        assert_eq!(SUNLIGHT.at(f64::NAN), [18, 14, 34]);
        // Lightness (a simple luma) rises along the sequential ramps.
        for ramp in [SUNLIGHT, DAYLIGHT, FROST] {
            let luma = |c: Colour| 0.3 * c[0] as f64 + 0.59 * c[1] as f64 + 0.11 * c[2] as f64;
            let mut last = -1.0;
            for i in 0..=50 {
                let l = luma(ramp.at(i as f64 / 50.0));
                assert!(l >= last - 0.5, "{i}");
                last = l;
            }
        }
    }

    #[test]
    fn ticks_are_round_numbers() {
        assert_eq!(nice_ticks(0.0, 24.0, 6), vec![0.0, 5.0, 10.0, 15.0, 20.0]);
        assert_eq!(
            nice_ticks(-38.0, 41.0, 8),
            vec![-30.0, -20.0, -10.0, 0.0, 10.0, 20.0, 30.0, 40.0]
        );
        assert_eq!(nice_ticks(3.0, 3.0, 5), vec![3.0]);
    }
}
