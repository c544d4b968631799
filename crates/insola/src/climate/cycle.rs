//! The periodic seasonal climate: temperatures per step and band, lookups and statistics.

use serde::{Deserialize, Serialize};

use super::forcing::{AnnualForcing, periodic_index};
use super::grid::ClimateGrid;
use super::seasons::{BandPhase, harmonic_table};
use super::spec::ClimateSpec;

/// Statistics of one band over the periodic year.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct BandStats {
    /// Latitude of the band centre, radians.
    pub lat_rad: f64,
    /// Annual mean temperature, °C.
    pub mean_c: f64,
    /// Coldest temperature of the year, °C.
    pub min_c: f64,
    /// Warmest temperature of the year, °C.
    pub max_c: f64,
    /// Fraction of the year the band is below the ice temperature (0–1; 0 when ice is off).
    pub ice_fraction_of_year: f64,
}

/// Latitudes of the ice edge in each hemisphere, from the annual-mean temperature.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct IceEdges {
    /// Northern edge latitude, radians (≥ 0); `None` when the hemisphere is all ice or ice-free.
    pub north_lat_rad: Option<f64>,
    /// Southern edge latitude, radians (≤ 0); `None` when the hemisphere is all ice or ice-free.
    pub south_lat_rad: Option<f64>,
}

/// How the search for the periodic state ended.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct RunOutcome {
    pub(crate) years: u32,
    pub(crate) residual_k: f64,
    pub(crate) converged: bool,
}

/// The periodic (equilibrium) seasonal cycle of zonal-mean surface temperature.
///
/// `temperatures_c(k)[j]` is the temperature of band `j` at year fraction `k / steps`, °C.
#[derive(Debug, Clone, PartialEq)]
pub struct ClimateCycle {
    pub(crate) spec: ClimateSpec,
    pub(crate) grid: ClimateGrid,
    pub(crate) forcing: Option<AnnualForcing>,
    pub(crate) steps: usize,
    pub(crate) temps_c: Vec<f64>,
    pub(crate) years_to_equilibrium: u32,
    pub(crate) residual_k: f64,
    pub(crate) converged: bool,
    pub(crate) stats: Vec<BandStats>,
    pub(crate) phases: Vec<BandPhase>,
    /// Ice-free albedo of each band as the model used it (dimensionless).
    pub(crate) ice_free_albedo: Vec<f64>,
}

impl ClimateCycle {
    /// Builds the cycle and its statistics from a stored year (`steps × bands`, row-major).
    pub(crate) fn from_year(
        spec: &ClimateSpec,
        grid: &ClimateGrid,
        forcing: Option<&AnnualForcing>,
        steps: usize,
        temps_c: Vec<f64>,
        run: RunOutcome,
        ice_free_albedo: Vec<f64>,
    ) -> Self {
        let nb = grid.len();
        let ice = |t: f64| spec.ice_enabled && t < spec.ice_temperature_c;
        let mut column = vec![0.0; steps];
        let table = harmonic_table(steps);
        let mut stats = Vec::with_capacity(nb);
        let mut phases = Vec::with_capacity(nb);
        for j in 0..nb {
            for (k, c) in column.iter_mut().enumerate() {
                *c = temps_c[k * nb + j];
            }
            let mean_c = column.iter().sum::<f64>() / steps as f64;
            let min_c = column.iter().copied().fold(f64::INFINITY, f64::min);
            let max_c = column.iter().copied().fold(f64::NEG_INFINITY, f64::max);
            let ice_steps = column.iter().filter(|&&t| ice(t)).count();
            stats.push(BandStats {
                lat_rad: grid.lat_centres_rad()[j],
                mean_c,
                min_c,
                max_c,
                ice_fraction_of_year: ice_steps as f64 / steps as f64,
            });
            phases.push(BandPhase::from_column_with(&column, &table));
        }
        ClimateCycle {
            spec: spec.clone(),
            grid: grid.clone(),
            forcing: forcing.cloned(),
            steps,
            temps_c,
            years_to_equilibrium: run.years,
            residual_k: run.residual_k,
            converged: run.converged,
            stats,
            phases,
            ice_free_albedo,
        }
    }

    /// Ice-free albedo of each band, south to north (dimensionless), as the model used it:
    /// from the world's sky or from the explicit latitude law (see [`super::IceFreeAlbedo`]).
    pub fn ice_free_albedo(&self) -> &[f64] {
        &self.ice_free_albedo
    }

    /// Ice-free albedo at `sin(latitude) = x`, linear in `x` between band centres.
    pub fn ice_free_albedo_at_x(&self, x: f64) -> f64 {
        let (i0, i1, w) = self.grid.interpolation_x(x);
        ((1.0 - w) * self.ice_free_albedo[i0] + w * self.ice_free_albedo[i1]).clamp(0.0, 1.0)
    }

    /// Zonal-mean temperature at latitude `lat_rad` and `year_fraction` (wrapped into [0, 1)),
    /// °C, linear in time between steps and linear in `sin φ` between band centres.
    pub fn temperature_c(&self, lat_rad: f64, year_fraction: f64) -> f64 {
        let (k0, k1, wt) = periodic_index(year_fraction, self.steps);
        let (i0, i1, wx) = self.grid.interpolation(lat_rad);
        let nb = self.grid.len();
        let at = |k: usize| {
            let row = &self.temps_c[k * nb..(k + 1) * nb];
            (1.0 - wx) * row[i0] + wx * row[i1]
        };
        (1.0 - wt) * at(k0) + wt * at(k1)
    }

    /// Temperatures of every band at step `k` (year fraction `k / steps`), °C; `k` wraps.
    pub fn temperatures_c(&self, k: usize) -> &[f64] {
        let nb = self.grid.len();
        let k = k % self.steps;
        &self.temps_c[k * nb..(k + 1) * nb]
    }

    /// Number of stored steps per year.
    pub fn steps(&self) -> usize {
        self.steps
    }

    /// The latitude grid.
    pub fn grid(&self) -> &ClimateGrid {
        &self.grid
    }

    /// The spec the cycle was computed with.
    pub fn spec(&self) -> &ClimateSpec {
        &self.spec
    }

    /// The orbit forcing, when the cycle was computed from one.
    pub fn forcing(&self) -> Option<&AnnualForcing> {
        self.forcing.as_ref()
    }

    /// Statistics per band, south to north.
    pub fn band_stats(&self) -> &[BandStats] {
        &self.stats
    }

    /// Seasonal-cycle phase data per band (see [`BandPhase`]).
    pub fn band_phases(&self) -> &[BandPhase] {
        &self.phases
    }

    /// Model years run until the cycle repeated within the tolerance.
    pub fn years_to_equilibrium(&self) -> u32 {
        self.years_to_equilibrium
    }

    /// Largest change of any band over the last year run, K (the periodicity residual).
    pub fn residual_k(&self) -> f64 {
        self.residual_k
    }

    /// Whether the residual fell below the spec's tolerance.
    pub fn converged(&self) -> bool {
        self.converged
    }

    /// Area-weighted global annual-mean temperature, °C.
    pub fn global_mean_c(&self) -> f64 {
        self.stats.iter().map(|s| s.mean_c).sum::<f64>() / self.stats.len() as f64
    }

    /// Area-weighted global mean temperature at `year_fraction`, °C.
    pub fn global_mean_at_c(&self, year_fraction: f64) -> f64 {
        let (k0, k1, w) = periodic_index(year_fraction, self.steps);
        (1.0 - w) * self.grid.global_mean(self.temperatures_c(k0))
            + w * self.grid.global_mean(self.temperatures_c(k1))
    }

    /// Fraction of the planet's area and year that is ice covered (0–1).
    pub fn ice_area_fraction(&self) -> f64 {
        self.stats
            .iter()
            .map(|s| s.ice_fraction_of_year)
            .sum::<f64>()
            / self.stats.len() as f64
    }

    /// Ice-edge latitudes where the annual-mean temperature crosses the ice temperature,
    /// interpolated in `sin φ` between band centres. When a hemisphere has several crossings
    /// (an equatorial ice belt and polar caps), the one nearest the equator is reported.
    pub fn ice_edges(&self) -> IceEdges {
        if !self.spec.ice_enabled {
            return IceEdges {
                north_lat_rad: None,
                south_lat_rad: None,
            };
        }
        let n = self.stats.len();
        let north: Vec<usize> = (n / 2..n).collect();
        let south: Vec<usize> = (0..n.div_ceil(2)).rev().collect();
        IceEdges {
            north_lat_rad: self.edge_along(&north),
            south_lat_rad: self.edge_along(&south),
        }
    }

    fn edge_along(&self, order: &[usize]) -> Option<f64> {
        let t_ice = self.spec.ice_temperature_c;
        let xs = self.grid.x_centres();
        for pair in order.windows(2) {
            let (a, b) = (pair[0], pair[1]);
            let (ta, tb) = (self.stats[a].mean_c, self.stats[b].mean_c);
            if (ta < t_ice) != (tb < t_ice) {
                let w = ((t_ice - ta) / (tb - ta)).clamp(0.0, 1.0);
                return Some((xs[a] + w * (xs[b] - xs[a])).clamp(-1.0, 1.0).asin());
            }
        }
        None
    }
}
