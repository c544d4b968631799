//! The two-dimensional seasonal energy balance model and its split implicit time step.
//!
//! On the unit sphere in `x = sin φ` and longitude `λ` (North, Mengel & Short 1983, J. Geophys.
//! Res. 88, 6576: the zonal model of North 1975 resolved in longitude, land and sea differing by
//! heat capacity):
//!
//! ```text
//! C(x,λ) ∂T/∂t = Q(x,λ,t)·a(x,λ,T) − (A + B·T) + D [∂x((1 − x²) ∂x T) + ∂λλ T / (1 − x²)]
//! ```
//!
//! `T` is the sea-level temperature of each cell; the surface of a cell whose land stands at
//! `z` metres is `Γ·z` colder (`Γ` the lapse rate), and that surface temperature decides ice
//! (so mountains hold snow), while the column emits by `T` (outgoing longwave radiation leaves
//! from high in the air, not from the ground). Heat capacity: `C = f·C_land + (1 − f)·C_ocean`
//! with `f` the cell's land fraction; co-albedo as in the zonal model (the same ice-free law and
//! ice step), an ice sheet always at the ice albedo; outgoing longwave the zonal model's
//! `A + B·T` with its gray-body limb.
//!
//! Discretisation: finite volumes on cells of equal area (rows of the zonal model's grid,
//! equal columns). The flux between rows is the zonal model's, `D (1 − x_e²) ΔT/Δx²`; between
//! columns `D ΔT / ((1 − x_j²) Δλ²)` at the row centre. Both are symmetric, so the operator
//! conserves energy exactly (the sum of its tendency over the sphere is zero).
//!
//! # Solver
//!
//! The cost is the implicit diffusion: near the poles the east–west coupling is thousands of
//! times the land heat capacity per step, so an explicit step would need thousands of substeps.
//! A full implicit solve (a conjugate-gradient iteration) costs tens of sweeps per step. The
//! split step used here — the Douglas alternating-direction implicit scheme in delta form
//! (Douglas & Gunn 1964, Numer. Math. 6, 428) — costs two line solves per step:
//!
//! ```text
//! R  = Δt [ (Lx + Lλ − B) Tⁿ + Q a(Tⁿ) − A − limb(Tⁿ) ]
//! (C + Δt (B + S − Lx)) δ* = R          tridiagonal along every column
//! (C − Δt Lλ) δ = C δ*                  cyclic tridiagonal along every row
//! Tⁿ⁺¹ = Tⁿ + δ
//! ```
//!
//! (`S` the slope of the gray-body limb where it acts.) It is unconditionally stable, and a
//! steady state is a fixed point exactly (δ = 0 ⇔ R = 0), so the split changes only the
//! transient, by a term of order `Δt²·Lx·Lλ·∂T/∂t`. With a map uniform in longitude `Lλ T = 0`,
//! the row step is the identity and the step is the zonal model's backward Euler step: a
//! uniform map reproduces the zonal model to rounding. Every matrix is factorised once at set-up
//! (the column systems again on a step where a cell reaches the gray-body limb).

// Grid loops index several arrays by the same cell or row number, as the stencil is written.
#![allow(clippy::needless_range_loop)]

use super::error::MapClimateError;
use super::forcing::{ForcingMode, MapForcing, lon_trig};
use super::grid::MapGrid;
use super::resample::CellSurface;
use super::solver::{ColumnSystems, CyclicRows};
use crate::climate::{
    BandInsolation, ClimateSpec, EnergyBalanceModel, IceFreeAlbedo, WATER_DENSITY_KG_M3,
    WATER_SPECIFIC_HEAT_J_KG_K, band_ice_free_albedo,
};
use crate::error::SpecError;

/// Absolute zero, °C.
const ABSOLUTE_ZERO_C: f64 = -273.15;

/// Smallest cell heat capacity the split step takes, J m⁻² K⁻¹ (about a metre of air; the
/// split needs `C > 0`). Smaller values, including the zonal model's allowed zero, are raised
/// to it.
pub const MIN_HEAT_CAPACITY_J_M2_K: f64 = 1e4;

/// The map model set up for one spec, grid, surface and forcing.
#[derive(Debug, Clone)]
pub struct MapEnergyBalanceModel {
    pub(crate) spec: ClimateSpec,
    pub(crate) grid: MapGrid,
    pub(crate) surface: CellSurface,
    pub(crate) forcing: MapForcing,
    /// The zonal model on the same rows, for its longwave law (linear plus gray-body limb) and
    /// ice test, so both models share them exactly.
    pub(crate) longwave: EnergyBalanceModel,
    pub(crate) dt_s: f64,
    /// Heat capacity per cell, J m⁻² K⁻¹.
    pub(crate) heat_capacity: Vec<f64>,
    /// Ice-free co-albedo per cell.
    coalbedo_free: Vec<f64>,
    coalbedo_ice: f64,
    /// Surface cooling by elevation per cell, K (`Γ·z`).
    pub(crate) lapse_k: Vec<f64>,
    /// Row-edge conductances `D (1 − x_e²)/Δx²` (rows + 1, zero at the poles), W m⁻² K⁻¹.
    kx: Vec<f64>,
    /// Column conductance per row `D / ((1 − x²) Δλ²)`, W m⁻² K⁻¹.
    klon: Vec<f64>,
    columns: ColumnSystems,
    rows: CyclicRows,
    cos_lon: Vec<f64>,
    sin_lon: Vec<f64>,
    /// Annual-mean insolation per cell, W m⁻².
    pub(crate) mean_insolation: Vec<f64>,
}

/// Buffers for one step (no allocation while stepping).
#[derive(Debug, Clone)]
pub struct MapWorkspace {
    q: Vec<f64>,
    r: Vec<f64>,
    slope: Vec<f64>,
    diag: Vec<f64>,
    lon: Vec<f64>,
    limb_columns: Option<ColumnSystems>,
}

impl MapEnergyBalanceModel {
    /// Sets up the model. `spec` supplies every parameter except the land fraction and the
    /// grid size (the surface and `grid` give those); errors name `climate.*` fields or the
    /// surface.
    pub fn new(
        spec: &ClimateSpec,
        grid: &MapGrid,
        surface: CellSurface,
        forcing: MapForcing,
    ) -> Result<Self, MapClimateError> {
        spec.validate("climate")?;
        let n = grid.len();
        for (what, v) in [
            ("land_fraction", &surface.land_fraction),
            ("ice_sheet_fraction", &surface.ice_sheet_fraction),
            ("elevation_m", &surface.elevation_m),
        ] {
            if v.len() != n {
                return Err(super::SurfaceMapError::WrongLength {
                    what,
                    got: v.len(),
                    expected: n,
                    width: grid.columns(),
                    height: grid.row_count(),
                }
                .into());
            }
        }
        let rows = grid.row_count();
        let cols = grid.columns();
        let steps = forcing.steps();
        let dt_s = forcing.year_s() / steps as f64;
        // The zonal model on the same rows: its longwave law and, in daily-mean mode, its
        // ice-free albedo from the same table.
        let (longwave, free_rows) = match forcing.daily_table() {
            Some(table) => {
                let zonal_spec = ClimateSpec {
                    bands: rows,
                    steps_per_year: steps,
                    ..spec.clone()
                };
                let m = EnergyBalanceModel::new(&zonal_spec, table.clone())?;
                let free = band_ice_free_albedo(&zonal_spec, grid.rows(), table)?;
                (m, Some(free))
            }
            None => {
                let zonal_spec = ClimateSpec {
                    bands: rows,
                    steps_per_year: steps,
                    ice_free_albedo: IceFreeAlbedo::legendre(0.3, 0.0),
                    ..spec.clone()
                };
                let table =
                    BandInsolation::from_fn(grid.rows(), steps, forcing.year_s(), |_, _| 0.0)?;
                (EnergyBalanceModel::new(&zonal_spec, table)?, None)
            }
        };
        let (mean_insolation, mu) = forcing.annual_mean_and_cos_zenith(grid);
        let xs = grid.rows().x_centres();
        let coalbedo_free: Vec<f64> = (0..n)
            .map(|c| {
                let j = c / cols;
                let albedo = match &free_rows {
                    Some(f) => f[j],
                    None => spec.ice_free_albedo.albedo(xs[j], mu[c], spec.ice_albedo),
                };
                1.0 - albedo
            })
            .collect();
        if matches!(spec.ice_free_albedo, IceFreeAlbedo::FromSky { .. })
            && forcing.annual().is_none()
        {
            return Err(SpecError::inconsistent(
                "climate.atmosphere_albedo",
                "the sky albedo law needs the star's path; give albedo_a0 and albedo_a2 instead",
            )
            .into());
        }
        let ocean = WATER_DENSITY_KG_M3 * WATER_SPECIFIC_HEAT_J_KG_K * spec.mixed_layer_depth_m;
        let heat_capacity: Vec<f64> = surface
            .land_fraction
            .iter()
            .map(|&f| {
                ((1.0 - f) * ocean + f * spec.land_heat_capacity_j_m2_per_k)
                    .max(MIN_HEAT_CAPACITY_J_M2_K)
            })
            .collect();
        let lapse_k = surface
            .elevation_m
            .iter()
            .map(|z| spec.lapse_rate_k_per_km * z / 1000.0)
            .collect();
        let d = spec.diffusion_w_m2_per_k;
        let dx = grid.rows().dx();
        let edges = grid.rows().x_edges();
        let kx: Vec<f64> = (0..=rows)
            .map(|e| {
                if e == 0 || e == rows {
                    0.0
                } else {
                    d * (1.0 - edges[e] * edges[e]) / (dx * dx)
                }
            })
            .collect();
        let dl = grid.dlon_rad();
        let klon: Vec<f64> = xs.iter().map(|x| d / ((1.0 - x * x) * dl * dl)).collect();
        let b = spec.olr_b_w_m2_per_k;
        let column_diag: Vec<f64> = (0..n)
            .map(|c| {
                let j = c / cols;
                heat_capacity[c] + dt_s * (b + kx[j] + kx[j + 1])
            })
            .collect();
        let columns = ColumnSystems::factorise(
            cols,
            &kx.iter().map(|k| dt_s * k).collect::<Vec<_>>(),
            &column_diag,
        );
        let row_diag: Vec<f64> = (0..n)
            .map(|c| heat_capacity[c] + 2.0 * dt_s * klon[c / cols])
            .collect();
        let row_e: Vec<f64> = klon.iter().map(|k| dt_s * k).collect();
        let rows_sys = CyclicRows::factorise(cols, &row_e, &row_diag);
        let (cos_lon, sin_lon) = lon_trig(grid);
        Ok(MapEnergyBalanceModel {
            spec: spec.clone(),
            grid: grid.clone(),
            surface,
            forcing,
            longwave,
            dt_s,
            heat_capacity,
            coalbedo_free,
            coalbedo_ice: 1.0 - spec.ice_albedo,
            lapse_k,
            kx,
            klon,
            columns,
            rows: rows_sys,
            cos_lon,
            sin_lon,
            mean_insolation,
        })
    }

    /// The grid.
    pub fn grid(&self) -> &MapGrid {
        &self.grid
    }

    /// The spec.
    pub fn spec(&self) -> &ClimateSpec {
        &self.spec
    }

    /// The surface on the grid.
    pub fn surface(&self) -> &CellSurface {
        &self.surface
    }

    /// The forcing.
    pub fn forcing(&self) -> &MapForcing {
        &self.forcing
    }

    /// Model steps per year.
    pub fn steps_per_year(&self) -> usize {
        self.forcing.steps()
    }

    /// Step length, s.
    pub fn dt_s(&self) -> f64 {
        self.dt_s
    }

    /// Heat capacity of each cell, J m⁻² K⁻¹.
    pub fn heat_capacity_j_m2_per_k(&self) -> &[f64] {
        &self.heat_capacity
    }

    /// Ice-free albedo of each cell as the model uses it.
    pub fn ice_free_albedo(&self) -> Vec<f64> {
        self.coalbedo_free.iter().map(|c| 1.0 - c).collect()
    }

    /// Buffers for [`Self::step`].
    pub fn workspace(&self) -> MapWorkspace {
        let n = self.grid.len();
        MapWorkspace {
            q: vec![0.0; n],
            r: vec![0.0; n],
            slope: vec![0.0; n],
            diag: vec![0.0; n],
            lon: vec![0.0; self.grid.columns()],
            limb_columns: None,
        }
    }

    /// Whether the surface of cell `c` is ice at sea-level temperature `t_c` (°C).
    #[inline]
    pub(crate) fn is_ice(&self, c: usize, t_c: f64) -> bool {
        self.longwave.is_ice(t_c - self.lapse_k[c])
    }

    /// Co-albedo of cell `c` at sea-level temperature `t_c`, °C.
    #[inline]
    fn coalbedo(&self, c: usize, t_c: f64) -> f64 {
        let sheet = self.surface.ice_sheet_fraction[c];
        let open = if self.is_ice(c, t_c) {
            self.coalbedo_ice
        } else {
            self.coalbedo_free[c]
        };
        (1.0 - sheet) * open + sheet * self.coalbedo_ice
    }

    /// Diffusive tendency `(Lx + Lλ) T` per cell, W m⁻², into `out`.
    pub fn diffusion_tendency(&self, temps_c: &[f64], out: &mut [f64]) {
        let cols = self.grid.columns();
        let rows = self.grid.row_count();
        for j in 0..rows {
            let (ks, kn, kl) = (self.kx[j], self.kx[j + 1], self.klon[j]);
            for i in 0..cols {
                let c = j * cols + i;
                let t = temps_c[c];
                let west = temps_c[j * cols + (i + cols - 1) % cols];
                let east = temps_c[j * cols + (i + 1) % cols];
                let mut div = kl * (west + east - 2.0 * t);
                if j > 0 {
                    div += ks * (temps_c[c - cols] - t);
                }
                if j + 1 < rows {
                    div += kn * (temps_c[c + cols] - t);
                }
                out[c] = div;
            }
        }
    }

    /// Advances `temps_c` (sea-level temperature per cell, °C) by step `k`, to year fraction
    /// `(k + 1)/steps`, with the sunlight at that time. Allocates nothing (but on a step where a
    /// cell first reaches the gray-body limb).
    pub fn step(&self, k: usize, temps_c: &mut [f64], ws: &mut MapWorkspace) {
        let insolation = &mut ws.q;
        self.forcing.fill(
            k + 1,
            &self.grid,
            &self.cos_lon,
            &self.sin_lon,
            &mut ws.lon,
            insolation,
        );
        self.step_with(temps_c, ws, self.dt_s, None);
    }

    /// One split step of length `dt` with the sunlight already in `ws.q`. `pseudo_capacity`
    /// replaces every cell's heat capacity (for the steady-state iteration).
    pub(crate) fn step_with(
        &self,
        temps_c: &mut [f64],
        ws: &mut MapWorkspace,
        dt: f64,
        pseudo_capacity: Option<f64>,
    ) {
        let a = self.spec.olr_a_w_m2;
        let b = self.spec.olr_b_w_m2_per_k;
        self.diffusion_tendency(temps_c, &mut ws.r);
        let mut limb = false;
        for c in 0..temps_c.len() {
            let t = temps_c[c];
            let mut f = ws.r[c] - a - b * t + ws.q[c] * self.coalbedo(c, t);
            if self.longwave.on_limb(t) {
                let (extra, slope) = self.longwave.limb_emission_w_m2(t);
                f -= extra;
                ws.slope[c] = slope;
                limb = true;
            } else {
                ws.slope[c] = 0.0;
            }
            ws.r[c] = dt * f;
        }
        let standard = pseudo_capacity.is_none() && dt == self.dt_s;
        if standard && !limb {
            self.columns.solve(&mut ws.r);
        } else {
            let kx: Vec<f64> = self.kx.iter().map(|k| dt * k).collect();
            let cols = self.grid.columns();
            for c in 0..temps_c.len() {
                let j = c / cols;
                let cap = pseudo_capacity.unwrap_or(self.heat_capacity[c]);
                ws.diag[c] = cap + dt * (b + ws.slope[c] + self.kx[j] + self.kx[j + 1]);
            }
            match &mut ws.limb_columns {
                Some(s) => s.refactorise(&kx, &ws.diag),
                None => ws.limb_columns = Some(ColumnSystems::factorise(cols, &kx, &ws.diag)),
            }
            if let Some(s) = &ws.limb_columns {
                s.solve(&mut ws.r);
            }
        }
        match pseudo_capacity {
            None if standard => {
                for (r, &cap) in ws.r.iter_mut().zip(&self.heat_capacity) {
                    *r *= cap;
                }
                self.rows.solve(&mut ws.r);
            }
            _ => {
                let cols = self.grid.columns();
                let n = temps_c.len();
                let diag: Vec<f64> = (0..n)
                    .map(|c| {
                        pseudo_capacity.unwrap_or(self.heat_capacity[c])
                            + 2.0 * dt * self.klon[c / cols]
                    })
                    .collect();
                for c in 0..n {
                    ws.r[c] *= pseudo_capacity.unwrap_or(self.heat_capacity[c]);
                }
                let e: Vec<f64> = self.klon.iter().map(|k| dt * k).collect();
                CyclicRows::factorise(cols, &e, &diag).solve(&mut ws.r);
            }
        }
        for (t, d) in temps_c.iter_mut().zip(&ws.r) {
            *t = (*t + d).max(ABSOLUTE_ZERO_C);
        }
    }

    /// Largest diagonal coupling of the operator, W m⁻² K⁻¹ (for the steady iteration's
    /// pseudo steps).
    pub(crate) fn max_coupling(&self) -> f64 {
        let kx = self.kx.iter().copied().fold(0.0, f64::max);
        let kl = self.klon.iter().copied().fold(0.0, f64::max);
        4.0 * kx.max(kl) + self.spec.olr_b_w_m2_per_k
    }

    /// Whether the forcing resolves the day (instantaneous or locked).
    pub fn resolves_the_day(&self) -> bool {
        !matches!(self.forcing.mode(), ForcingMode::DailyMean)
    }
}

impl MapWorkspace {
    /// Sets the sunlight of the next step directly (the steady iteration's annual mean).
    pub(crate) fn set_insolation(&mut self, q: &[f64]) {
        self.q.copy_from_slice(q);
    }
}
