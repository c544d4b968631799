//! The seasonal forcing: the star's declination and distance over one orbit, and the daily-mean
//! insolation per latitude band and model step derived from it.

use serde::{Deserialize, Serialize};

use super::grid::ClimateGrid;
use crate::error::{SpecError, check_range, check_range_open_min};

/// One instant of the year as the climate model needs it.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct SeasonSample {
    /// Declination of the star seen from the planet, radians, in [−π/2, π/2].
    pub declination_rad: f64,
    /// Star–planet distance over the semi-major axis, `r / a` (dimensionless, > 0).
    pub distance_factor: f64,
}

/// The annual forcing: stellar flux at mean distance and `N` samples evenly spaced in time over
/// one orbit, the first at the start of the climate year (year fraction 0), sample `i` at year
/// fraction `i / N`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct AnnualForcing {
    /// Stellar flux at the mean distance `a`, W m⁻².
    pub s0_w_m2: f64,
    /// Length of the orbital year, s.
    pub year_s: f64,
    /// Samples evenly spaced in time over one orbit.
    pub samples: Vec<SeasonSample>,
}

impl AnnualForcing {
    /// Checks the forcing; errors name `forcing.s0_w_m2`, `forcing.samples[i].declination_rad`…
    pub fn validate(&self) -> Result<(), SpecError> {
        check_range_open_min("forcing.s0_w_m2", self.s0_w_m2, 0.0, 1e6)?;
        check_range_open_min("forcing.year_s", self.year_s, 0.0, 1e15)?;
        if self.samples.is_empty() {
            return Err(SpecError::inconsistent(
                "forcing.samples",
                "at least one sample is needed",
            ));
        }
        let half_pi = std::f64::consts::FRAC_PI_2;
        // The field names are formatted only for the sample at fault: a valid forcing is
        // checked without allocating.
        for (i, s) in self.samples.iter().enumerate() {
            let decl = s.declination_rad;
            if !(decl.is_finite() && (-half_pi..=half_pi).contains(&decl)) {
                let field = format!("forcing.samples[{i}].declination_rad");
                check_range(&field, decl, -half_pi, half_pi)?;
            }
            let rho = s.distance_factor;
            if !(rho.is_finite() && rho > 1e-3 && rho <= 1e3) {
                let field = format!("forcing.samples[{i}].distance_factor");
                check_range_open_min(&field, rho, 1e-3, 1e3)?;
            }
        }
        Ok(())
    }

    /// Declination (rad) and distance factor at `year_fraction` (any real; wrapped into [0, 1)),
    /// linearly interpolated between samples, periodic over the year.
    pub fn sample_at(&self, year_fraction: f64) -> SeasonSample {
        let n = self.samples.len();
        if n == 0 {
            return SeasonSample {
                declination_rad: 0.0,
                distance_factor: 1.0,
            };
        }
        let (i0, i1, w) = periodic_index(year_fraction, n);
        let (a, b) = (self.samples[i0], self.samples[i1]);
        SeasonSample {
            declination_rad: a.declination_rad + w * (b.declination_rad - a.declination_rad),
            distance_factor: a.distance_factor + w * (b.distance_factor - a.distance_factor),
        }
    }
}

/// `(i0, i1, w)` for linear interpolation at `year_fraction` in a periodic table of `n` entries
/// at fractions `i / n`.
pub(crate) fn periodic_index(year_fraction: f64, n: usize) -> (usize, usize, f64) {
    let f = if year_fraction.is_finite() {
        year_fraction.rem_euclid(1.0)
    } else {
        0.0
    };
    let s = f * n as f64;
    let i0 = (s.floor() as usize).min(n - 1);
    let w = (s - i0 as f64).clamp(0.0, 1.0);
    (i0, (i0 + 1) % n, w)
}

/// Daily-mean top-of-atmosphere insolation per model step and band, W m⁻², the table the energy
/// balance model steps through. Row `k` is the insolation at year fraction `k / steps`.
#[derive(Debug, Clone, PartialEq)]
pub struct BandInsolation {
    steps: usize,
    bands: usize,
    year_s: f64,
    w_m2: Vec<f64>,
    /// Insolation-weighted mean cosine of the solar zenith angle per band over the year, when
    /// the table comes from an orbit (`None` for idealised tables).
    mean_cos_zenith: Option<Vec<f64>>,
}

impl BandInsolation {
    /// Builds the table from the orbit forcing: declination and distance are interpolated
    /// linearly in time to each model step ([`AnnualForcing::sample_at`]), then the Berger (1978)
    /// daily mean is taken at each band centre, by the grid path (each latitude's and each
    /// step's sines and cosines once; see `band_table`).
    pub fn from_forcing(
        forcing: &AnnualForcing,
        grid: &ClimateGrid,
        steps: usize,
    ) -> Result<Self, SpecError> {
        forcing.validate()?;
        check_range("climate.steps_per_year", steps as f64, 1.0, 1e6)?;
        let days: Vec<(f64, f64)> = (0..steps)
            .map(|k| {
                let s = forcing.sample_at(k as f64 / steps as f64);
                (s.declination_rad, s.distance_factor)
            })
            .collect();
        let (w_m2, mean_cos_zenith) =
            super::band_table::band_table(forcing.s0_w_m2, grid.lat_centres_rad(), &days);
        Ok(BandInsolation {
            steps,
            bands: grid.len(),
            year_s: forcing.year_s,
            w_m2,
            mean_cos_zenith: Some(mean_cos_zenith),
        })
    }

    /// The table of several stars shining on one planet: the sum of each star's
    /// [`BandInsolation::from_forcing`] table (insolation adds), with each band's mean cosine
    /// of the zenith angle the insolation-weighted mean of the stars' (`Σ μ_k Q_k / Σ Q_k`, `Q_k`
    /// the band's yearly insolation from star `k`). One forcing gives exactly its own table.
    pub fn from_star_forcings(
        forcings: &[AnnualForcing],
        grid: &ClimateGrid,
        steps: usize,
    ) -> Result<Self, SpecError> {
        let Some((first, rest)) = forcings.split_first() else {
            return Err(SpecError::inconsistent(
                "forcing.samples",
                "at least one star's forcing is needed",
            ));
        };
        let mut table = Self::from_forcing(first, grid, steps)?;
        if rest.is_empty() {
            return Ok(table);
        }
        let mut weighted: Vec<f64> = Vec::new();
        let mut totals: Vec<f64> = Vec::new();
        let mut add_weights = |t: &BandInsolation| {
            let q = t.mean_per_band();
            let mu = t.mean_cos_zenith.clone().unwrap_or_default();
            weighted.resize(q.len(), 0.0);
            totals.resize(q.len(), 0.0);
            for j in 0..q.len() {
                weighted[j] += mu.get(j).copied().unwrap_or(0.0) * q[j];
                totals[j] += q[j];
            }
        };
        add_weights(&table);
        for forcing in rest {
            let other = Self::from_forcing(forcing, grid, steps)?;
            add_weights(&other);
            for (q, o) in table.w_m2.iter_mut().zip(&other.w_m2) {
                *q += o;
            }
        }
        table.mean_cos_zenith = Some(
            weighted
                .iter()
                .zip(&totals)
                .map(|(w, q)| {
                    if *q > 0.0 {
                        (w / q).clamp(0.0, 1.0)
                    } else {
                        0.0
                    }
                })
                .collect(),
        );
        Ok(table)
    }

    /// A table from a function `q(x, year_fraction)` in W m⁻², `x = sin φ` at band centres —
    /// for idealised forcings such as the Legendre forms used in analytic checks. Non-finite or
    /// negative values are an error naming `forcing.insolation`.
    pub fn from_fn(
        grid: &ClimateGrid,
        steps: usize,
        year_s: f64,
        q: impl Fn(f64, f64) -> f64,
    ) -> Result<Self, SpecError> {
        check_range("climate.steps_per_year", steps as f64, 1.0, 1e6)?;
        check_range_open_min("forcing.year_s", year_s, 0.0, 1e15)?;
        let mut w_m2 = Vec::with_capacity(steps * grid.len());
        for k in 0..steps {
            let f = k as f64 / steps as f64;
            for &x in grid.x_centres() {
                w_m2.push(check_range("forcing.insolation", q(x, f), 0.0, 1e7)?);
            }
        }
        Ok(BandInsolation {
            steps,
            bands: grid.len(),
            year_s,
            w_m2,
            mean_cos_zenith: None,
        })
    }

    /// The annual-mean Legendre form `Q(x) = S0/4 · (1 + s2·P2(x))`, constant in time
    /// (North 1975; climlab `P2Insolation`). `s2` must be within [−2, 1] so `Q ≥ 0`.
    pub fn annual_mean_p2(
        grid: &ClimateGrid,
        steps: usize,
        year_s: f64,
        s0_w_m2: f64,
        s2: f64,
    ) -> Result<Self, SpecError> {
        check_range_open_min("forcing.s0_w_m2", s0_w_m2, 0.0, 1e6)?;
        check_range("forcing.s2", s2, -2.0, 1.0)?;
        Self::from_fn(grid, steps, year_s, |x, _| {
            (s0_w_m2 / 4.0 * (1.0 + s2 * 0.5 * (3.0 * x * x - 1.0))).max(0.0)
        })
    }

    /// The same table with every band held at its annual mean (for annual-mean models).
    pub fn annual_mean(&self) -> Self {
        let mean = self.mean_per_band();
        let mut w_m2 = Vec::with_capacity(self.w_m2.len());
        for _ in 0..self.steps {
            w_m2.extend_from_slice(&mean);
        }
        BandInsolation {
            w_m2,
            ..self.clone()
        }
    }

    /// Annual mean insolation of each band, W m⁻².
    pub fn mean_per_band(&self) -> Vec<f64> {
        let mut mean = vec![0.0; self.bands];
        for k in 0..self.steps {
            for (m, q) in mean.iter_mut().zip(self.row(k)) {
                *m += q;
            }
        }
        mean.iter_mut().for_each(|m| *m /= self.steps as f64);
        mean
    }

    /// Insolation-weighted mean cosine of the solar zenith angle of each band over the year
    /// (0–1), for tables built from an orbit ([`BandInsolation::from_forcing`]); `None` for
    /// idealised tables, which carry no sky geometry.
    pub fn mean_cos_zenith(&self) -> Option<&[f64]> {
        self.mean_cos_zenith.as_deref()
    }

    /// Number of model steps per year.
    pub fn steps(&self) -> usize {
        self.steps
    }

    /// Number of bands.
    pub fn bands(&self) -> usize {
        self.bands
    }

    /// Length of the year, s.
    pub fn year_s(&self) -> f64 {
        self.year_s
    }

    /// Insolation of every band at step `k` (year fraction `k / steps`), W m⁻².
    pub fn row(&self, k: usize) -> &[f64] {
        &self.w_m2[k * self.bands..(k + 1) * self.bands]
    }
}

/// Test helper: the forcing of a Keplerian orbit (eccentricity `e`, obliquity, sun longitude
/// at perihelion `peri_deg`), `n` samples evenly in time starting at perihelion.
#[cfg(test)]
pub(crate) fn kepler_forcing(
    s0: f64,
    e: f64,
    obliquity_deg: f64,
    peri_deg: f64,
    year_s: f64,
    n: usize,
) -> AnnualForcing {
    use std::f64::consts::TAU;
    let eps = obliquity_deg.to_radians();
    let samples = (0..n)
        .map(|i| {
            let m = TAU * i as f64 / n as f64;
            // Kepler's equation M = E − e sin E by Newton's method.
            let mut ea = if e > 0.8 { std::f64::consts::PI } else { m };
            for _ in 0..30 {
                ea -= (ea - e * ea.sin() - m) / (1.0 - e * ea.cos());
            }
            let v = 2.0 * (((1.0 + e) / (1.0 - e)).sqrt() * (ea / 2.0).tan()).atan();
            let lambda = v + peri_deg.to_radians();
            SeasonSample {
                declination_rad: (eps.sin() * lambda.sin()).asin(),
                distance_factor: (1.0 - e * e) / (1.0 + e * v.cos()),
            }
        })
        .collect();
    AnnualForcing {
        s0_w_m2: s0,
        year_s,
        samples,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    const YEAR_S: f64 = 365.25 * 86400.0;

    #[test]
    fn area_mean_of_annual_mean_is_quarter_s0() {
        // climlab `tests/test_insolation.py`: global mean of the annual mean = S0/4 (±0.2 there),
        // with (e, ϖ, ε) = (0.017236, 281.37°, 23.446°) and S0 1365.2. The annual mean grows by
        // (1 − e²)^(−1/2) (Ward 1974, from memory), 1.00015 here.
        let grid = ClimateGrid::new(90).unwrap();
        let f = kepler_forcing(1365.2, 0.017236, 23.446, 281.37, YEAR_S, 365);
        let ins = BandInsolation::from_forcing(&f, &grid, 365).unwrap();
        let g = grid.global_mean(&ins.mean_per_band());
        assert!((g - 1365.2 / 4.0).abs() < 0.2, "{g}");
    }

    #[test]
    fn south_pole_maximum_near_climlab_value() {
        // climlab `tests/test_insolation.py`: max daily mean 562.0333 W m⁻² at the South Pole at
        // the December solstice. Our outermost band centre is at 81.6°S and the samples are daily,
        // so the check is loose: the pole value S0 sin ε / ρ² is approached from below.
        let grid = ClimateGrid::new(90).unwrap();
        let f = kepler_forcing(1365.2, 0.017236, 23.446, 281.37, YEAR_S, 365);
        let ins = BandInsolation::from_forcing(&f, &grid, 365).unwrap();
        let max = (0..365).map(|k| ins.row(k)[0]).fold(0.0, f64::max);
        assert!(max > 540.0 && max < 562.1, "{max}");
    }

    #[test]
    fn table_equals_the_per_cell_formulas() {
        // The grid path against the per-cell daily mean and weighted cosine it replaced.
        use super::super::albedo::insolation_weighted_cos_zenith;
        use crate::insolation::daily_mean_w_m2;
        for (e, eps, bands, steps) in [
            (0.017, 23.4, 90, 180),
            (0.3, 70.0, 36, 97),
            (0.0, 0.0, 8, 12),
        ] {
            let grid = ClimateGrid::new(bands).unwrap();
            let f = kepler_forcing(1361.0, e, eps, 100.0, YEAR_S, 365);
            let ins = BandInsolation::from_forcing(&f, &grid, steps).unwrap();
            let mut days = vec![];
            for k in 0..steps {
                let s = f.sample_at(k as f64 / steps as f64);
                days.push((s.declination_rad, s.distance_factor));
                for (j, &lat) in grid.lat_centres_rad().iter().enumerate() {
                    let want = daily_mean_w_m2(1361.0, lat, s.declination_rad, s.distance_factor);
                    assert!((ins.row(k)[j] - want).abs() <= 1e-12 * want.max(1.0));
                }
            }
            for (j, &lat) in grid.lat_centres_rad().iter().enumerate() {
                let want = insolation_weighted_cos_zenith(lat, &days);
                assert!((ins.mean_cos_zenith().unwrap()[j] - want).abs() <= 1e-12);
            }
        }
    }

    #[test]
    fn bad_forcing_names_the_sample() {
        let mut f = kepler_forcing(1361.0, 0.0, 23.0, 0.0, YEAR_S, 12);
        f.samples[3].distance_factor = f64::NAN;
        let err = f.validate().unwrap_err();
        assert_eq!(err.field(), Some("forcing.samples[3].distance_factor"));
        f.samples[3].distance_factor = 1.0;
        f.samples[5].declination_rad = 2.0;
        let err = f.validate().unwrap_err();
        assert_eq!(err.field(), Some("forcing.samples[5].declination_rad"));
        f.samples[5].declination_rad = 0.1;
        assert!(f.validate().is_ok());
        let empty = AnnualForcing {
            samples: vec![],
            ..f
        };
        assert!(empty.validate().is_err());
    }

    #[test]
    fn sample_interpolation_wraps() {
        let f = kepler_forcing(1361.0, 0.1, 30.0, 0.0, YEAR_S, 8);
        let a = f.sample_at(0.0);
        let b = f.sample_at(1.0);
        let c = f.sample_at(-3.0);
        assert_eq!(a, b);
        assert_eq!(a, c);
        assert_eq!(f.sample_at(f64::NAN), a);
    }
}
