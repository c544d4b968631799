//! Finding the periodic seasonal state: run whole years until one year repeats the last.
//!
//! Convergence rule: a year run from state `S` ends in state `S'`; the cycle is accepted when
//! `max over bands |S' − S| < tolerance_k` (default 0.01 K). For a fixed ice mask the backward
//! Euler step is a contraction in the max norm (its matrix is an M-matrix with row sums ≥
//! `C/Δt`), so a following year would differ from the stored one by at most that much at every
//! phase of the year. `years_to_equilibrium` counts the years run, the accepted one included.
//!
//! Speed-ups: the integration starts from the steady annual-mean solution (North 1975 in
//! discrete form), and after each year the two slowest modes of the linear problem — the global
//! mean and the first Legendre mode `x`, both exact eigenvectors of the discrete operator —
//! are jumped to their fixed point by a geometric (Aitken-type) extrapolation with their known
//! decay factors per year, `(C/Δt / (C/Δt + B + n(n+1)D))^steps`. With ice the jump is an
//! approximation, so it is only taken while the ice mask stops changing, and it is not taken
//! at all on a year that reached the radiative limb of the longwave law (whose decay is
//! faster); the stopping rule above is checked on a plain year, never on an extrapolated
//! state.

use thiserror::Error;

use super::cycle::{ClimateCycle, RunOutcome};
use super::ebm::EnergyBalanceModel;
use super::forcing::{AnnualForcing, BandInsolation};
use super::grid::ClimateGrid;
use super::spec::ClimateSpec;
use crate::error::SpecError;

/// An error from the climate solver.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum ClimateError {
    /// The spec or the forcing is invalid.
    #[error(transparent)]
    Spec(#[from] SpecError),
    /// No periodic state within `max_years` (e.g. the climate sits near an ice-albedo tipping
    /// point and flips between states). `last` is the final year run, usable as an estimate.
    #[error(
        "no periodic climate after {years} years: the last year changed by {residual_k:.4} K (tolerance {tolerance_k} K); the world may be near an ice tipping point"
    )]
    NotConverged {
        /// Years run.
        years: u32,
        /// Largest change of any band over the last year, K.
        residual_k: f64,
        /// The tolerance asked for, K.
        tolerance_k: f64,
        /// The last year run.
        last: Box<ClimateCycle>,
    },
}

/// Where the seasonal integration starts.
#[derive(Debug, Clone, PartialEq)]
pub enum Start {
    /// The steady state under annual-mean insolation (the default and the fastest). Where the
    /// ice-albedo feedback allows several climates, this finds the warmest (ice-free-start)
    /// one; use [`Start::Uniform`] or [`Start::Given`] with a cold start to look for ice caps
    /// or a snowball.
    SteadyAnnualMean,
    /// Every band at this temperature, °C (e.g. a very cold start to look for a snowball).
    Uniform(f64),
    /// One temperature per band, °C, south to north.
    Given(Vec<f64>),
}

/// The periodic seasonal climate of a world: validates, builds the model, starts from the
/// annual-mean steady state and runs years until periodic.
pub fn equilibrate(
    spec: &ClimateSpec,
    forcing: &AnnualForcing,
) -> Result<ClimateCycle, ClimateError> {
    let grid = ClimateGrid::new(spec.bands)?;
    spec.validate("climate")?;
    let insolation = BandInsolation::from_forcing(forcing, &grid, spec.steps_per_year)?;
    let model = EnergyBalanceModel::new(spec, insolation)?;
    equilibrate_model(&model, Some(forcing), &Start::SteadyAnnualMean)
}

/// [`equilibrate`] with a band table computed elsewhere (the daily mean under a ring,
/// [`crate::Planet::ring_band_insolation`]); `forcing` is still the orbit's, kept for the
/// day-night queries.
pub fn equilibrate_with_insolation(
    spec: &ClimateSpec,
    forcing: &AnnualForcing,
    insolation: BandInsolation,
) -> Result<ClimateCycle, ClimateError> {
    spec.validate("climate")?;
    let model = EnergyBalanceModel::new(spec, insolation)?;
    equilibrate_model(&model, Some(forcing), &Start::SteadyAnnualMean)
}

/// The periodic state of a prepared model from a chosen start. `forcing` is kept in the result
/// for day-night queries (without it the day-night deviation is zero).
pub fn equilibrate_model(
    model: &EnergyBalanceModel,
    forcing: Option<&AnnualForcing>,
    start: &Start,
) -> Result<ClimateCycle, ClimateError> {
    let spec = model.spec();
    let nb = model.grid().len();
    let steps = model.steps_per_year();
    let mut state = match start {
        Start::SteadyAnnualMean => model.steady_annual_mean(),
        Start::Uniform(t) => vec![crate::error::check_range("start_c", *t, -273.15, 1e4)?; nb],
        Start::Given(v) => {
            if v.len() != nb {
                return Err(SpecError::inconsistent(
                    "start_c",
                    format!("{} values given for {nb} bands", v.len()),
                )
                .into());
            }
            for (j, &t) in v.iter().enumerate() {
                crate::error::check_range(&format!("start_c[{j}]"), t, -273.15, 1e4)?;
            }
            v.clone()
        }
    };
    let mut trajectory = vec![0.0; steps * nb];
    let mut scratch = vec![0.0; nb];
    let mut delta = vec![0.0; nb];
    let decay = ModeDecay::new(model);
    let mut last_ice = usize::MAX;
    let mut residual = f64::INFINITY;
    let mut years_run = 0;
    for year in 1..=spec.max_years {
        model.run_year(&mut state, &mut trajectory, &mut scratch);
        years_run = year;
        residual = 0.0;
        for j in 0..nb {
            delta[j] = state[j] - trajectory[j];
            residual = f64::max(residual, delta[j].abs());
        }
        if !residual.is_finite() {
            break;
        }
        if residual < spec.tolerance_k {
            return Ok(ClimateCycle::from_year(
                spec,
                model.grid(),
                forcing,
                steps,
                trajectory,
                RunOutcome {
                    years: year,
                    residual_k: residual,
                    converged: true,
                },
                model.ice_free_albedo(),
            ));
        }
        let ice = trajectory.iter().filter(|&&t| model.is_ice(t)).count();
        // The decay factors are those of the linear law: a year that touched the radiative
        // limb decays faster than they say, so it is not jumped.
        let on_limb = trajectory.iter().any(|&t| model.on_limb(t));
        if ice == last_ice && !on_limb {
            decay.extrapolate(model.grid(), &delta, &mut state);
        }
        last_ice = ice;
    }
    let last = ClimateCycle::from_year(
        spec,
        model.grid(),
        forcing,
        steps,
        trajectory,
        RunOutcome {
            years: years_run,
            residual_k: residual,
            converged: false,
        },
        model.ice_free_albedo(),
    );
    Err(ClimateError::NotConverged {
        years: years_run,
        residual_k: residual,
        tolerance_k: spec.tolerance_k,
        last: Box::new(last),
    })
}

/// Per-year decay factors of the global-mean and first Legendre modes.
struct ModeDecay {
    /// `r/(1 − r)` for mode 0 and mode 1.
    gain: [f64; 2],
}

impl ModeDecay {
    fn new(model: &EnergyBalanceModel) -> Self {
        let c_dt = model.heat_capacity_j_m2_per_k() / model.dt_s();
        let s = model.spec();
        let steps = model.steps_per_year() as i32;
        let factor = |k: f64| {
            let r = (c_dt / (c_dt + s.olr_b_w_m2_per_k + k)).powi(steps);
            // Capped so a nearly undamped mode (huge heat capacity) cannot be thrown far away.
            (r / (1.0 - r)).min(1e3)
        };
        ModeDecay {
            gain: [factor(0.0), factor(2.0 * s.diffusion_w_m2_per_k)],
        }
    }

    /// `state += Σ_n gain_n · proj_n(delta) · P_n` for n = 0, 1 (area-weighted projections).
    fn extrapolate(&self, grid: &ClimateGrid, delta: &[f64], state: &mut [f64]) {
        let xs = grid.x_centres();
        let n = xs.len() as f64;
        let p0 = delta.iter().sum::<f64>() / n;
        let sxx: f64 = xs.iter().map(|x| x * x).sum();
        let p1 = xs.iter().zip(delta).map(|(x, d)| x * d).sum::<f64>() / sxx;
        for (t, x) in state.iter_mut().zip(xs) {
            *t += self.gain[0] * p0 + self.gain[1] * p1 * x;
        }
    }
}
