//! The periodic map climate: surface temperature per cell and step, statistics, and queries at
//! any latitude and longitude.

use std::f64::consts::FRAC_PI_2;

use serde::{Deserialize, Serialize};

use super::forcing::ForcingMode;
use super::grid::MapGrid;
use super::model::MapEnergyBalanceModel;
use super::resample::CellSurface;
use crate::climate::{AnnualForcing, ClimateSpec, DiurnalResponse};
use crate::error::{QueryError, check_arg};

/// Checks a time of year (finite) and a mean solar day (positive, finite), seconds: the
/// arguments every instant-of-the-day query takes.
pub(crate) fn check_year_and_day(year_fraction: f64, solar_day_s: f64) -> Result<(), QueryError> {
    check_arg(
        "year_fraction",
        year_fraction,
        f64::MIN,
        f64::MAX,
        "a finite number",
    )?;
    check_arg(
        "solar_day_s",
        solar_day_s,
        f64::MIN_POSITIVE,
        f64::MAX,
        "greater than 0, finite",
    )?;
    Ok(())
}

/// The day-night layer added to a fast rotator's daily-mean cycle at one time of year.
pub(crate) struct DiurnalLayer {
    response: DiurnalResponse,
    /// The star's flux at the planet's distance then, W m⁻².
    flux_w_m2: f64,
}

/// Statistics of one cell's surface temperature over the periodic year.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct CellStats {
    /// Annual mean, °C.
    pub mean_c: f64,
    /// Coldest step of the year, °C.
    pub min_c: f64,
    /// Warmest step of the year, °C.
    pub max_c: f64,
    /// Fraction of the year the surface is ice (0–1; 1 under an ice sheet).
    pub ice_fraction_of_year: f64,
}

/// Area statistics of one part of the surface (land or sea).
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct AreaSummary {
    /// Fraction of the planet's area (0–1).
    pub area_fraction: f64,
    /// Area-weighted annual mean, °C (NaN when the area is zero).
    pub mean_c: f64,
    /// Area-weighted mean of each cell's coldest step, °C.
    pub mean_min_c: f64,
    /// Area-weighted mean of each cell's warmest step, °C.
    pub mean_max_c: f64,
    /// Coldest cell's coldest step, °C.
    pub coldest_c: f64,
    /// Warmest cell's warmest step, °C.
    pub warmest_c: f64,
    /// Largest seasonal range (warmest minus coldest step) of any cell, K.
    pub largest_range_k: f64,
}

/// Land and sea apart.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct LandSeaSummary {
    /// Cells weighted by their land fraction.
    pub land: AreaSummary,
    /// Cells weighted by their sea fraction.
    pub sea: AreaSummary,
}

/// The periodic (equilibrium) seasonal cycle of the map model.
#[derive(Debug, Clone, PartialEq)]
pub struct MapClimate {
    pub(crate) spec: ClimateSpec,
    pub(crate) grid: MapGrid,
    pub(crate) surface: CellSurface,
    pub(crate) mode: ForcingMode,
    pub(crate) annual: Option<AnnualForcing>,
    pub(crate) steps: usize,
    pub(crate) year_s: f64,
    /// Surface temperature, °C, `steps × cells` (single precision: the cycle of a 256 × 128
    /// grid at 180 steps is 24 MB).
    pub(crate) temps_c: Vec<f32>,
    pub(crate) stats: Vec<CellStats>,
    pub(crate) years: u32,
    pub(crate) residual_k: f64,
    pub(crate) converged: bool,
    pub(crate) ice_free_albedo: Vec<f64>,
}

impl MapClimate {
    pub(crate) fn from_year(
        model: &MapEnergyBalanceModel,
        temps_c: Vec<f32>,
        years: u32,
        residual_k: f64,
        converged: bool,
    ) -> Self {
        let n = model.grid().len();
        let steps = model.steps_per_year();
        let spec = model.spec();
        let sheet = &model.surface().ice_sheet_fraction;
        let mut stats = vec![
            CellStats {
                mean_c: 0.0,
                min_c: f64::INFINITY,
                max_c: f64::NEG_INFINITY,
                ice_fraction_of_year: 0.0,
            };
            n
        ];
        for k in 0..steps {
            for (s, &t) in stats.iter_mut().zip(&temps_c[k * n..(k + 1) * n]) {
                let t = f64::from(t);
                s.mean_c += t;
                s.min_c = s.min_c.min(t);
                s.max_c = s.max_c.max(t);
                if spec.ice_enabled && t < spec.ice_temperature_c {
                    s.ice_fraction_of_year += 1.0;
                }
            }
        }
        for (s, &f) in stats.iter_mut().zip(sheet) {
            s.mean_c /= steps as f64;
            s.ice_fraction_of_year = if f >= 0.5 {
                1.0
            } else {
                s.ice_fraction_of_year / steps as f64
            };
        }
        MapClimate {
            spec: spec.clone(),
            grid: model.grid().clone(),
            surface: model.surface().clone(),
            mode: model.forcing().mode(),
            annual: model.forcing().annual().cloned(),
            steps,
            year_s: model.forcing().year_s(),
            temps_c,
            stats,
            years,
            residual_k,
            converged,
            ice_free_albedo: model.ice_free_albedo(),
        }
    }

    /// The grid.
    pub fn grid(&self) -> &MapGrid {
        &self.grid
    }

    /// The surface on the grid.
    pub fn surface(&self) -> &CellSurface {
        &self.surface
    }

    /// The spec the cycle was computed with.
    pub fn spec(&self) -> &ClimateSpec {
        &self.spec
    }

    /// How the sunlight was applied.
    pub fn forcing_mode(&self) -> ForcingMode {
        self.mode
    }

    /// Stored steps per year.
    pub fn steps(&self) -> usize {
        self.steps
    }

    /// Length of the year, s.
    pub fn year_s(&self) -> f64 {
        self.year_s
    }

    /// Model years run until the cycle repeated within the tolerance.
    pub fn years_to_equilibrium(&self) -> u32 {
        self.years
    }

    /// Largest change of any cell over the last year run, K.
    pub fn residual_k(&self) -> f64 {
        self.residual_k
    }

    /// Whether the residual fell below the tolerance.
    pub fn converged(&self) -> bool {
        self.converged
    }

    /// Statistics per cell, in grid order.
    pub fn cell_stats(&self) -> &[CellStats] {
        &self.stats
    }

    /// Surface temperatures of every cell at step `k` (year fraction `k / steps`; wraps), °C.
    pub fn temperatures_c(&self, k: usize) -> &[f32] {
        let n = self.grid.len();
        let k = k % self.steps;
        &self.temps_c[k * n..(k + 1) * n]
    }

    /// Area-weighted global annual-mean surface temperature, °C.
    pub fn global_mean_c(&self) -> f64 {
        self.stats.iter().map(|s| s.mean_c).sum::<f64>() / self.stats.len() as f64
    }

    /// Corner cells and weights of the bilinear interpolation at a place.
    fn corners(&self, lat_rad: f64, lon_rad: f64) -> [(usize, f64); 4] {
        let (r0, r1, wr) = self.grid.rows().interpolation_x(lat_rad.sin());
        let (c0, c1, wc) = self.grid.lon_interpolation(lon_rad);
        let cols = self.grid.columns();
        [
            (r0 * cols + c0, (1.0 - wr) * (1.0 - wc)),
            (r0 * cols + c1, (1.0 - wr) * wc),
            (r1 * cols + c0, wr * (1.0 - wc)),
            (r1 * cols + c1, wr * wc),
        ]
    }

    fn check_place(lat_rad: f64, lon_rad: f64) -> Result<(), QueryError> {
        check_arg("lat_rad", lat_rad, -FRAC_PI_2, FRAC_PI_2, "-π/2 to π/2")?;
        check_arg("lon_rad", lon_rad, f64::MIN, f64::MAX, "a finite number")?;
        Ok(())
    }

    /// A per-cell value at a place, bilinear in `sin φ` and longitude between cell centres.
    pub fn interpolate(&self, per_cell: impl Fn(usize) -> f64, lat_rad: f64, lon_rad: f64) -> f64 {
        self.corners(lat_rad, lon_rad)
            .iter()
            .map(|&(c, w)| w * per_cell(c))
            .sum()
    }

    /// Surface temperature at latitude `lat_rad`, east longitude `lon_rad` and `year_fraction`
    /// (wraps), °C: bilinear in space, linear in time between steps. A daily mean on a fast
    /// rotator (see [`Self::local_temperature_c`] for the hour of the day).
    pub fn temperature_c(
        &self,
        lat_rad: f64,
        lon_rad: f64,
        year_fraction: f64,
    ) -> Result<f64, QueryError> {
        Self::check_place(lat_rad, lon_rad)?;
        check_arg(
            "year_fraction",
            year_fraction,
            f64::MIN,
            f64::MAX,
            "a finite number",
        )?;
        let (k0, k1, wt) = crate::climate::periodic_index(year_fraction, self.steps);
        let (a, b) = (self.temperatures_c(k0), self.temperatures_c(k1));
        Ok(self.interpolate(
            |c| (1.0 - wt) * f64::from(a[c]) + wt * f64::from(b[c]),
            lat_rad,
            lon_rad,
        ))
    }

    /// Annual-mean surface temperature at a place, °C.
    pub fn annual_mean_c(&self, lat_rad: f64, lon_rad: f64) -> Result<f64, QueryError> {
        Self::check_place(lat_rad, lon_rad)?;
        Ok(self.interpolate(|c| self.stats[c].mean_c, lat_rad, lon_rad))
    }

    /// Coldest surface temperature of the year at a place, °C.
    pub fn annual_min_c(&self, lat_rad: f64, lon_rad: f64) -> Result<f64, QueryError> {
        Self::check_place(lat_rad, lon_rad)?;
        Ok(self.interpolate(|c| self.stats[c].min_c, lat_rad, lon_rad))
    }

    /// Warmest surface temperature of the year at a place, °C.
    pub fn annual_max_c(&self, lat_rad: f64, lon_rad: f64) -> Result<f64, QueryError> {
        Self::check_place(lat_rad, lon_rad)?;
        Ok(self.interpolate(|c| self.stats[c].max_c, lat_rad, lon_rad))
    }

    /// Land fraction at a place (0–1), bilinear.
    pub fn land_fraction_at(&self, lat_rad: f64, lon_rad: f64) -> f64 {
        self.interpolate(|c| self.surface.land_fraction[c], lat_rad, lon_rad)
    }

    /// Temperature at a place and instant of the day, °C: [`Self::temperature_c`] plus, on a
    /// fast rotator (daily-mean forcing), the zonal model's day-night deviation of a thin
    /// surface layer at the star's local hour angle `hour_angle_rad` (0 at local noon) for a
    /// mean solar day of `solar_day_s`. Where the model resolves the day itself (slow rotators,
    /// locked worlds) the deviation is already in the cycle and none is added.
    pub fn local_temperature_c(
        &self,
        lat_rad: f64,
        lon_rad: f64,
        year_fraction: f64,
        hour_angle_rad: f64,
        solar_day_s: f64,
    ) -> Result<f64, QueryError> {
        let t = self.temperature_c(lat_rad, lon_rad, year_fraction)?;
        check_arg(
            "hour_angle_rad",
            hour_angle_rad,
            f64::MIN,
            f64::MAX,
            "a finite number",
        )?;
        check_year_and_day(year_fraction, solar_day_s)?;
        let Some(layer) = self.diurnal_layer(year_fraction, solar_day_s) else {
            return Ok(t);
        };
        let (sp, cp) = lat_rad.sin_cos();
        Ok(self.with_diurnal_layer(&layer, t, sp, cp, lat_rad, lon_rad, hour_angle_rad))
    }

    /// The day-night layer of a fast rotator at `year_fraction` for a mean solar day of
    /// `solar_day_s` (the same for every place); `None` where the model resolves the day.
    pub(crate) fn diurnal_layer(
        &self,
        year_fraction: f64,
        solar_day_s: f64,
    ) -> Option<DiurnalLayer> {
        let (ForcingMode::DailyMean, Some(annual)) = (self.mode, &self.annual) else {
            return None;
        };
        let s = annual.sample_at(year_fraction);
        let spec = &self.spec;
        let kappa = spec.diurnal_kappa(solar_day_s);
        Some(DiurnalLayer {
            response: DiurnalResponse::new(
                s.declination_rad,
                spec.diurnal_damping_w_m2_per_k,
                kappa,
            ),
            flux_w_m2: annual.s0_w_m2 / (s.distance_factor * s.distance_factor),
        })
    }

    /// `t_c` (the cycle's temperature at the place) plus the day-night layer's deviation at
    /// local hour angle `hour_angle_rad`; `sp`, `cp` are the latitude's sine and cosine.
    #[allow(clippy::too_many_arguments)]
    pub(crate) fn with_diurnal_layer(
        &self,
        layer: &DiurnalLayer,
        t_c: f64,
        sp: f64,
        cp: f64,
        lat_rad: f64,
        lon_rad: f64,
        hour_angle_rad: f64,
    ) -> f64 {
        let spec = &self.spec;
        let iced = spec.ice_enabled && t_c < spec.ice_temperature_c;
        let coalbedo = if iced {
            1.0 - spec.ice_albedo
        } else {
            1.0 - self.interpolate(|c| self.ice_free_albedo[c], lat_rad, lon_rad)
        };
        (t_c + layer
            .response
            .deviation_k(sp, cp, hour_angle_rad, coalbedo * layer.flux_w_m2))
        .max(-273.15)
    }

    /// Land and sea statistics apart (area-weighted by each cell's land and sea fractions).
    pub fn land_sea_summary(&self) -> LandSeaSummary {
        let part = |weight: &dyn Fn(usize) -> f64| {
            let n = self.stats.len();
            let mut s = AreaSummary {
                area_fraction: 0.0,
                mean_c: 0.0,
                mean_min_c: 0.0,
                mean_max_c: 0.0,
                coldest_c: f64::INFINITY,
                warmest_c: f64::NEG_INFINITY,
                largest_range_k: 0.0,
            };
            let mut w_sum = 0.0;
            for c in 0..n {
                let w = weight(c);
                if w <= 0.0 {
                    continue;
                }
                let st = self.stats[c];
                w_sum += w;
                s.mean_c += w * st.mean_c;
                s.mean_min_c += w * st.min_c;
                s.mean_max_c += w * st.max_c;
                if w >= 0.5 {
                    s.coldest_c = s.coldest_c.min(st.min_c);
                    s.warmest_c = s.warmest_c.max(st.max_c);
                    s.largest_range_k = s.largest_range_k.max(st.max_c - st.min_c);
                }
            }
            s.area_fraction = w_sum / n as f64;
            for v in [&mut s.mean_c, &mut s.mean_min_c, &mut s.mean_max_c] {
                *v = if w_sum > 0.0 { *v / w_sum } else { f64::NAN };
            }
            if !s.coldest_c.is_finite() {
                s.coldest_c = f64::NAN;
                s.warmest_c = f64::NAN;
            }
            s
        };
        let land = &self.surface.land_fraction;
        LandSeaSummary {
            land: part(&|c| land[c]),
            sea: part(&|c| 1.0 - land[c]),
        }
    }
}
