//! Sunlight on every model cell at every model step.
//!
//! Three forms, chosen from the world's spin by [`MapForcing::from_planet`]:
//!
//! * **Daily mean** (fast rotators, the solar day shorter than [`SLOW_DAY_STEPS`] model steps):
//!   the Berger (1978) daily mean per latitude row, the zonal model's own table
//!   ([`BandInsolation`]), the same in every column. The day-night swing is added at query
//!   time by the zonal model's day-night layer.
//! * **Instantaneous** (slow rotators, a solar day of at least [`SLOW_DAY_STEPS`] steps): the
//!   top-of-atmosphere flux `S/ρ² · max(0, sin φ sin δ + cos φ cos δ cos H)` at each step,
//!   with the hour angle `H` of each column, so the model resolves the day. For the forcing to
//!   repeat every year the model fits a whole number of solar days into the year (the nearest,
//!   at least one): a day stretched by at most half a day per year.
//! * **Locked** (a tidally locked world): the same instantaneous flux with the star's real hour
//!   angle, which stays nearly fixed in each column (it wanders only with the equation of time
//!   of an eccentric orbit), so the flux is `S cos z` with `z` the angle from the substellar
//!   point, zero on the night side.
//!
//! On a world whose ring casts a shadow ([`Planet::daily_mean_needs_quadrature`]) the daily
//! mean is the quadrature under the ring ([`Planet::ring_band_insolation`]) and the two
//! instantaneous forms multiply each cell's flux by the ring's transmission there
//! ([`crate::rings`]).
//!
//! On a world with a shining companion every form sums the stars: the daily mean adds each
//! star's table ([`Planet::star_band_tables`]); the two instantaneous forms keep each star's
//! declination, flux and hour angle per step (from [`Planet::star_instant_of`], the core's
//! per-star sky) and add each star's `F cos z`, each dimmed by the ring along its own ray.
//! As in the zonal model ([`Planet::equilibrate_climate`]), the stars' eclipses of each other,
//! a few hours long, are left out of the forcing. A dark companion (luminosity 0) adds nothing
//! and is skipped, so such a world is forced exactly as its one-star twin.

use std::f64::consts::TAU;

use super::grid::MapGrid;
use crate::Planet;
use crate::climate::{AnnualForcing, BandInsolation, insolation_weighted_cos_zenith};
use crate::error::{SpecError, check_range};

/// A solar day of at least this many model steps is resolved step by step (instantaneous
/// forcing) rather than averaged (common practice, no source: eight samples per cycle resolve
/// a clipped cosine to a few per cent of its mean).
pub const SLOW_DAY_STEPS: f64 = 8.0;

/// How sunlight is applied (see the module docs).
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum ForcingMode {
    /// Daily-mean insolation per latitude row.
    DailyMean,
    /// Instantaneous insolation, the day resolved; `solar_days_per_year` whole model days fit
    /// the year.
    Instantaneous {
        /// Whole solar days per model year (at least 1).
        solar_days_per_year: u32,
    },
    /// A tidally locked world: the star nearly fixed in each column's sky.
    Locked,
}

/// The star's geometry at one model step, for instantaneous forcing.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct StepSun {
    sin_decl: f64,
    cos_decl: f64,
    /// Flux at the planet `S0/ρ²`, W m⁻².
    flux_w_m2: f64,
    /// Geometric hour angle of the star at longitude 0 (sidereal angle − right ascension),
    /// radians; longitude `λ` sees `h0 + λ`.
    h0_rad: f64,
}

/// Sunlight per cell and step (see the module docs).
#[derive(Debug, Clone)]
pub struct MapForcing {
    mode: ForcingMode,
    steps: usize,
    year_s: f64,
    /// Daily-mean table (daily-mean mode).
    daily: Option<BandInsolation>,
    /// Star geometry per step and shining star (instantaneous and locked modes), step-major:
    /// star `j` of step `k` at `k * stars + j`, the primary first.
    suns: Vec<StepSun>,
    /// Shining stars per step in `suns` (1 on a one-star world).
    stars: usize,
    /// The orbit's declination and distance samples, for the day-night layer of queries.
    annual: Option<AnnualForcing>,
    /// The ring, for the instantaneous forms (`None` without a shadow-casting ring).
    ring: Option<crate::rings::shadow::RingGeometry>,
}

impl MapForcing {
    /// Daily-mean forcing from the orbit samples, the zonal model's table on the grid's rows.
    pub fn daily_mean(
        forcing: &AnnualForcing,
        grid: &MapGrid,
        steps: usize,
    ) -> Result<Self, SpecError> {
        let daily = BandInsolation::from_forcing(forcing, grid.rows(), steps)?;
        Ok(MapForcing {
            mode: ForcingMode::DailyMean,
            steps,
            year_s: forcing.year_s,
            daily: Some(daily),
            suns: Vec::new(),
            stars: 1,
            annual: Some(forcing.clone()),
            ring: None,
        })
    }

    /// Daily-mean forcing from a prepared table on the grid's rows (idealised forcings, such as
    /// the Legendre forms of analytic checks). Without the star's path the sky albedo law is
    /// unavailable.
    pub fn from_table(table: BandInsolation, grid: &MapGrid) -> Result<Self, SpecError> {
        if table.bands() != grid.row_count() {
            return Err(SpecError::inconsistent(
                "forcing.insolation",
                format!(
                    "the table has {} bands, the grid {} rows",
                    table.bands(),
                    grid.row_count()
                ),
            ));
        }
        Ok(MapForcing {
            mode: ForcingMode::DailyMean,
            steps: table.steps(),
            year_s: table.year_s(),
            daily: Some(table),
            suns: Vec::new(),
            stars: 1,
            annual: None,
            ring: None,
        })
    }

    /// The forcing of `planet` with `steps` model steps per year, its form chosen from the spin
    /// (see the module docs).
    pub fn from_planet(planet: &Planet, grid: &MapGrid, steps: usize) -> Result<Self, SpecError> {
        check_range("climate.steps_per_year", steps as f64, 8.0, 100_000.0)?;
        let year_s = planet.year_s();
        let dt = year_s / steps as f64;
        let annual = planet.annual_forcing(steps);
        let locked = planet.spin().is_tidally_locked();
        let day_s = planet.day_s();
        if !locked && day_s < SLOW_DAY_STEPS * dt {
            if planet.daily_mean_needs_quadrature() {
                // Under a ring (see `crate::rings::daily_mean`) or two suns (each star's table,
                // summed): the day-night layer keeps the primary's path. Slow rotators and
                // locked worlds sum the stars step by step below.
                let daily = planet.star_band_tables(&annual, grid.rows(), steps)?;
                let mut forcing = Self::daily_mean(&annual, grid, steps)?;
                forcing.daily = Some(daily);
                return Ok(forcing);
            }
            return Self::daily_mean(&annual, grid, steps);
        }
        let sense = if planet.is_retrograde() { -1.0 } else { 1.0 };
        let mode;
        let h_mean_0;
        let days = if locked {
            mode = ForcingMode::Locked;
            h_mean_0 = 0.0;
            0.0
        } else {
            let n = (year_s / day_s).round().max(1.0);
            mode = ForcingMode::Instantaneous {
                solar_days_per_year: n as u32,
            };
            let i0 = planet.star_instant(0.0);
            h_mean_0 = i0.sidereal_angle_rad - i0.star_mean_longitude_rad;
            n
        };
        // Every shining star (a dark companion adds no light), the primary first: each star's
        // own instant from the core's per-star sky. The stars' eclipses of each other are left
        // out, as in the zonal model's summed forcing.
        let shining: Vec<usize> = planet.shining_stars().collect();
        let stars = shining.len();
        let suns: Vec<StepSun> = (0..steps)
            .flat_map(|k| shining.iter().map(move |&j| (k, j)))
            .filter_map(|(k, j)| {
                let t = k as f64 * dt;
                let i = planet.star_instant_of(j, t)?;
                let h0_rad = if locked {
                    i.sidereal_angle_rad - i.right_ascension_rad
                } else {
                    // The mean sun's hour angle on the stretched day, plus the star's offset
                    // from the mean sun (the equation of time; for a companion its offset in
                    // right ascension too), so only the day length changes.
                    h_mean_0
                        + sense * TAU * days * k as f64 / steps as f64
                        + (i.star_mean_longitude_rad - i.right_ascension_rad)
                };
                Some(StepSun {
                    sin_decl: i.sin_declination,
                    cos_decl: i.cos_declination,
                    flux_w_m2: i.toa_flux_w_m2,
                    h0_rad,
                })
            })
            .collect();
        // `shining_stars` names only stars the world has, so no instant is missing and the
        // step-major layout holds.
        debug_assert_eq!(suns.len(), steps * stars);
        Ok(MapForcing {
            mode,
            steps,
            year_s,
            daily: None,
            suns,
            stars,
            annual: Some(annual),
            ring: planet.ring_geometry(),
        })
    }

    /// The form of the forcing.
    pub fn mode(&self) -> ForcingMode {
        self.mode
    }

    /// Model steps per year.
    pub fn steps(&self) -> usize {
        self.steps
    }

    /// Length of the year, s.
    pub fn year_s(&self) -> f64 {
        self.year_s
    }

    /// The daily-mean table, in daily-mean mode.
    pub fn daily_table(&self) -> Option<&BandInsolation> {
        self.daily.as_ref()
    }

    /// The orbit samples (declination and distance over the year).
    pub fn annual(&self) -> Option<&AnnualForcing> {
        self.annual.as_ref()
    }

    /// Writes the insolation of every cell at year fraction `k / steps`, W m⁻², into `out`
    /// (`grid.len()` values). `cos_lon`, `sin_lon` are the column centres' cosines and sines,
    /// `scratch` one value per column.
    pub(crate) fn fill(
        &self,
        k: usize,
        grid: &MapGrid,
        cos_lon: &[f64],
        sin_lon: &[f64],
        scratch: &mut [f64],
        out: &mut [f64],
    ) {
        let cols = grid.columns();
        let k = k % self.steps;
        if let Some(daily) = &self.daily {
            for (row, q) in out.chunks_exact_mut(cols).zip(daily.row(k)) {
                row.fill(*q);
            }
            return;
        }
        for j in 0..self.stars {
            self.fill_star(k, j, grid, cos_lon, sin_lon, scratch, out, true, j > 0);
        }
    }

    /// Star `j`'s part of the instantaneous insolation at step `k`, W m⁻², written into `out`
    /// (or added to it with `add`): `F max(0, cos z)`, times the ring's transmission along
    /// that star's ray when `apply_ring`.
    #[allow(clippy::too_many_arguments)]
    fn fill_star(
        &self,
        k: usize,
        j: usize,
        grid: &MapGrid,
        cos_lon: &[f64],
        sin_lon: &[f64],
        scratch: &mut [f64],
        out: &mut [f64],
        apply_ring: bool,
        add: bool,
    ) {
        let cols = grid.columns();
        let s = self.suns[k * self.stars + j];
        let (sh, ch) = s.h0_rad.sin_cos();
        for ((c, &cl), &sl) in scratch.iter_mut().zip(cos_lon).zip(sin_lon) {
            *c = ch * cl - sh * sl;
        }
        for (row, &lat) in out
            .chunks_exact_mut(cols)
            .zip(grid.rows().lat_centres_rad())
        {
            let (sp, cp) = lat.sin_cos();
            let (a, b) = (s.flux_w_m2 * sp * s.sin_decl, s.flux_w_m2 * cp * s.cos_decl);
            // The star in the rotating frame: h0 = θ − α is the geometric hour angle at
            // longitude 0, so the star stands at longitude −h0.
            let star = glam::DVec3::new(s.cos_decl * ch, -s.cos_decl * sh, s.sin_decl);
            let ring = self.ring.as_ref().filter(|_| apply_ring);
            for (((q, &c), &cl), &sl) in
                row.iter_mut().zip(scratch.iter()).zip(cos_lon).zip(sin_lon)
            {
                let mut v = (a + b * c).max(0.0);
                if let Some(ring) = ring
                    && v > 0.0
                {
                    let n = glam::DVec3::new(cp * cl, cp * sl, sp);
                    v *= ring.shadow(n, star).transmission;
                }
                if add { *q += v } else { *q = v }
            }
        }
    }

    /// Insolation of every cell at year fraction `k / steps`, W m⁻² (allocates; for checks
    /// and tools).
    pub fn insolation_w_m2(&self, k: usize, grid: &MapGrid) -> Vec<f64> {
        let (cos_lon, sin_lon) = lon_trig(grid);
        let mut scratch = vec![0.0; grid.columns()];
        let mut out = vec![0.0; grid.len()];
        self.fill(k, grid, &cos_lon, &sin_lon, &mut scratch, &mut out);
        out
    }

    /// Annual-mean insolation per cell, W m⁻², and the insolation-weighted mean cosine of the
    /// solar zenith angle per cell (0–1), which the sky albedo law takes.
    pub(crate) fn annual_mean_and_cos_zenith(&self, grid: &MapGrid) -> (Vec<f64>, Vec<f64>) {
        let n = grid.len();
        let cols = grid.columns();
        if let Some(daily) = &self.daily {
            let mean = daily.mean_per_band();
            let mu_rows: Vec<f64> = match (&self.annual, daily.mean_cos_zenith()) {
                (_, Some(m)) => m.to_vec(),
                (Some(a), None) => {
                    let days: Vec<(f64, f64)> = a
                        .samples
                        .iter()
                        .map(|s| (s.declination_rad, s.distance_factor))
                        .collect();
                    grid.rows()
                        .lat_centres_rad()
                        .iter()
                        .map(|&l| insolation_weighted_cos_zenith(l, &days))
                        .collect()
                }
                (None, None) => vec![0.0; grid.row_count()],
            };
            let spread = |v: &[f64]| -> Vec<f64> {
                v.iter()
                    .flat_map(|&x| std::iter::repeat_n(x, cols))
                    .collect()
            };
            return (spread(&mean), spread(&mu_rows));
        }
        let (cos_lon, sin_lon) = lon_trig(grid);
        let mut scratch = vec![0.0; cols];
        let mut q = vec![0.0; n];
        let (mut sum_q, mut sum_qmu) = (vec![0.0; n], vec![0.0; n]);
        let mut clear = if self.ring.is_some() {
            vec![0.0; n]
        } else {
            Vec::new()
        };
        // Star by star: each star's μ is its own clear flux over its own flux at the planet,
        // weighted by the sunlight it gives (the sum over stars of Q_j μ_j over the sum of Q_j).
        for k in 0..self.steps {
            for j in 0..self.stars {
                let flux = self.suns[k * self.stars + j].flux_w_m2;
                if flux <= 0.0 {
                    continue;
                }
                self.fill_star(
                    k,
                    j,
                    grid,
                    &cos_lon,
                    &sin_lon,
                    &mut scratch,
                    &mut q,
                    true,
                    false,
                );
                if self.ring.is_some() {
                    // μ from the clear flux; the weight is the sunlight under the ring.
                    self.fill_star(
                        k,
                        j,
                        grid,
                        &cos_lon,
                        &sin_lon,
                        &mut scratch,
                        &mut clear,
                        false,
                        false,
                    );
                    for (((sq, sqm), &qk), &ck) in
                        sum_q.iter_mut().zip(sum_qmu.iter_mut()).zip(&q).zip(&clear)
                    {
                        *sq += qk;
                        *sqm += qk * ck / flux;
                    }
                    continue;
                }
                for ((sq, sqm), &qk) in sum_q.iter_mut().zip(sum_qmu.iter_mut()).zip(&q) {
                    *sq += qk;
                    // μ = Q / (S/ρ²): the weight Q is the sunlight itself.
                    *sqm += qk * qk / flux;
                }
            }
        }
        let mean = sum_q.iter().map(|s| s / self.steps as f64).collect();
        let mu = sum_q
            .iter()
            .zip(&sum_qmu)
            .map(|(&s, &m)| {
                if s > 0.0 {
                    (m / s).clamp(0.0, 1.0)
                } else {
                    0.0
                }
            })
            .collect();
        (mean, mu)
    }
}

/// Cosines and sines of the column centres' longitudes.
pub(crate) fn lon_trig(grid: &MapGrid) -> (Vec<f64>, Vec<f64>) {
    grid.lon_centres_rad()
        .iter()
        .map(|l| (l.cos(), l.sin()))
        .unzip()
}
