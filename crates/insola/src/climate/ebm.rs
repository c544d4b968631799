//! The seasonal diffusive energy balance model and its implicit time step.
//!
//! `C ∂T/∂t = Q(x,t)·a(x,T) − (A + B·T) + D ∂/∂x[(1 − x²) ∂T/∂x]` on equal-area bands in
//! `x = sin φ` (North 1975; North, Cahalan & Coakley 1981), discretised by finite volumes: the
//! flux through a band edge `x_e` is `D (1 − x_e²)(T_right − T_left)/Δx`, zero at the poles, so
//! the scheme conserves energy exactly and `x` (the first Legendre mode) is an exact eigenvector
//! of the discrete operator with eigenvalue `−2D`, as in the continuous equation.
//!
//! Time step (backward Euler on diffusion and on `B·T`, absorbed sunlight and `A` explicit):
//! `(C/Δt + B − L)·Tⁿ⁺¹ = (C/Δt)·Tⁿ + Qⁿ⁺¹·a(Tⁿ) − A`. The co-albedo `a` is taken from the
//! previous step's temperature (semi-implicit ice albedo), so the matrix never changes: it is
//! factorised once and every step is one forward and one backward sweep. The scheme is stable
//! for any heat capacity (including zero) and any step length.

use super::albedo::IceFreeAlbedo;
use super::forcing::BandInsolation;
use super::grid::ClimateGrid;
use super::spec::ClimateSpec;
use crate::constants::STEFAN_BOLTZMANN_W_M2_K4;
use crate::error::SpecError;

/// A factorised symmetric-or-not tridiagonal matrix (Thomas algorithm).
///
/// Hand-written: it is twenty lines, and a general linear-algebra dependency would be far larger
/// than the need. The matrices here are strictly diagonally dominant, so no pivoting is needed.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Tridiagonal {
    /// Sub-diagonal `l[j]` multiplying `x[j−1]` in row `j` (`l[0]` unused).
    lower: Vec<f64>,
    /// Modified super-diagonal `c'[j]` from the forward sweep.
    c_prime: Vec<f64>,
    /// Reciprocal of the modified diagonal.
    inv_denom: Vec<f64>,
}

impl Tridiagonal {
    /// Factorises the matrix with sub-diagonal `lower`, diagonal `diag`, super-diagonal `upper`.
    pub(crate) fn factorise(lower: &[f64], diag: &[f64], upper: &[f64]) -> Self {
        let n = diag.len();
        let mut c_prime = vec![0.0; n];
        let mut inv_denom = vec![0.0; n];
        let mut prev_c = 0.0;
        for j in 0..n {
            let l = if j == 0 { 0.0 } else { lower[j] };
            let inv = 1.0 / (diag[j] - l * prev_c);
            inv_denom[j] = inv;
            c_prime[j] = if j + 1 < n { upper[j] * inv } else { 0.0 };
            prev_c = c_prime[j];
        }
        Tridiagonal {
            lower: lower.to_vec(),
            c_prime,
            inv_denom,
        }
    }

    /// Solves `M x = rhs` in place (`rhs` becomes `x`).
    pub(crate) fn solve_in_place(&self, rhs: &mut [f64]) {
        let n = rhs.len();
        let mut prev = 0.0;
        for ((r, l), inv) in rhs.iter_mut().zip(&self.lower).zip(&self.inv_denom) {
            let y = (*r - l * prev) * inv;
            *r = y;
            prev = y;
        }
        for j in (0..n.saturating_sub(1)).rev() {
            rhs[j] -= self.c_prime[j] * rhs[j + 1];
        }
    }
}

/// The energy balance model set up for one spec, grid and insolation table.
#[derive(Debug, Clone)]
pub struct EnergyBalanceModel {
    pub(crate) spec: ClimateSpec,
    pub(crate) grid: ClimateGrid,
    pub(crate) insolation: BandInsolation,
    /// Heat capacity, J m⁻² K⁻¹ (same in every band).
    pub(crate) heat_capacity: f64,
    /// Step length, s.
    pub(crate) dt_s: f64,
    /// Ice-free co-albedo `1 − α` per band (see [`IceFreeAlbedo`]).
    coalbedo_free: Vec<f64>,
    /// Ice co-albedo `1 − ice_albedo`.
    coalbedo_ice: f64,
    /// `(C/Δt + B − L)` factorised.
    step_matrix: Tridiagonal,
    /// `(B − L)` factorised, for the steady annual-mean state.
    steady_matrix: Tridiagonal,
    /// Off-diagonals and diagonals of the two systems, for rows made stiffer by the radiative
    /// limb (see [`EnergyBalanceModel::limb_emission_w_m2`]).
    lower: Vec<f64>,
    upper: Vec<f64>,
    diag_step: Vec<f64>,
    diag_steady: Vec<f64>,
    /// Emissivity of the gray-body limb, matched to `A + B·T` at [`LIMB_MATCH_C`].
    limb_emissivity: f64,
    /// Below this temperature, °C, the limb emits more than the linear law too (−∞ if never).
    limb_cold_c: f64,
}

/// Temperature, °C, up to which the linear longwave law `A + B·T` is used as it stands: the
/// Budyko-type fit is made over Earth's range of surface temperatures (about −50 to 40 °C;
/// common practice, no source). The gray-body limb is matched to it here.
pub const LIMB_MATCH_C: f64 = 60.0;

/// Absolute zero, °C.
const ABSOLUTE_ZERO_C: f64 = -273.15;

/// Ice-free albedo of each band under `spec`'s law. The sky law needs the zenith angles of a
/// table built from an orbit; an idealised table with it is an error naming
/// `climate.atmosphere_albedo`.
pub fn band_ice_free_albedo(
    spec: &ClimateSpec,
    grid: &ClimateGrid,
    insolation: &BandInsolation,
) -> Result<Vec<f64>, SpecError> {
    let xs = grid.x_centres();
    match (spec.ice_free_albedo, insolation.mean_cos_zenith()) {
        (IceFreeAlbedo::FromSky { .. }, None) => Err(SpecError::inconsistent(
            "climate.atmosphere_albedo",
            "the sky albedo law needs the star's path, which an idealised insolation table does not carry; give albedo_a0 and albedo_a2 instead",
        )),
        (law, mu) => Ok(xs
            .iter()
            .enumerate()
            .map(|(j, &x)| law.albedo(x, mu.map_or(0.0, |m| m[j]), spec.ice_albedo))
            .collect()),
    }
}

impl EnergyBalanceModel {
    /// Sets up the model; validates the spec (errors name `climate.*` fields) and checks that
    /// the insolation table matches the grid.
    pub fn new(spec: &ClimateSpec, insolation: BandInsolation) -> Result<Self, SpecError> {
        spec.validate("climate")?;
        let grid = ClimateGrid::new(spec.bands)?;
        if insolation.bands() != grid.len() {
            return Err(SpecError::inconsistent(
                "climate.bands",
                format!(
                    "the insolation table has {} bands, the spec {}",
                    insolation.bands(),
                    grid.len()
                ),
            ));
        }
        let heat_capacity = spec.heat_capacity_j_m2_per_k();
        let dt_s = insolation.year_s() / insolation.steps() as f64;
        let n = grid.len();
        let dx = grid.dx();
        // Edge conductances k_e = D (1 − x_e²)/Δx² for the interior edges 1..n.
        let edges = grid.x_edges();
        let k: Vec<f64> = (0..=n)
            .map(|e| {
                if e == 0 || e == n {
                    0.0
                } else {
                    spec.diffusion_w_m2_per_k * (1.0 - edges[e] * edges[e]) / (dx * dx)
                }
            })
            .collect();
        let lower: Vec<f64> = (0..n).map(|j| -k[j]).collect();
        let upper: Vec<f64> = (0..n).map(|j| -k[j + 1]).collect();
        let b = spec.olr_b_w_m2_per_k;
        let diag_steady: Vec<f64> = (0..n).map(|j| b + k[j] + k[j + 1]).collect();
        let c_dt = heat_capacity / dt_s;
        let diag_step: Vec<f64> = diag_steady.iter().map(|d| d + c_dt).collect();
        let coalbedo_free = band_ice_free_albedo(spec, &grid, &insolation)?
            .iter()
            .map(|a| 1.0 - a)
            .collect();
        let match_k = LIMB_MATCH_C + 273.15;
        let limb_emissivity = (spec.olr_a_w_m2 + spec.olr_b_w_m2_per_k * LIMB_MATCH_C)
            / (STEFAN_BOLTZMANN_W_M2_K4 * match_k.powi(4));
        // The gray body minus the linear law is convex in T, zero at the match point: it has at
        // most one other root, below it, found by bisection.
        let excess = |t: f64| {
            limb_emissivity * STEFAN_BOLTZMANN_W_M2_K4 * (t + 273.15).powi(4)
                - (spec.olr_a_w_m2 + spec.olr_b_w_m2_per_k * t)
        };
        let limb_cold_c = if excess(ABSOLUTE_ZERO_C) > 0.0 {
            let (mut lo, mut hi) = (ABSOLUTE_ZERO_C, LIMB_MATCH_C - 1.0);
            for _ in 0..60 {
                let mid = 0.5 * (lo + hi);
                if excess(mid) > 0.0 {
                    lo = mid
                } else {
                    hi = mid
                }
            }
            lo
        } else {
            f64::NEG_INFINITY
        };
        Ok(EnergyBalanceModel {
            spec: spec.clone(),
            limb_cold_c,
            coalbedo_ice: 1.0 - spec.ice_albedo,
            step_matrix: Tridiagonal::factorise(&lower, &diag_step, &upper),
            steady_matrix: Tridiagonal::factorise(&lower, &diag_steady, &upper),
            lower,
            upper,
            diag_step,
            diag_steady,
            limb_emissivity,
            grid,
            insolation,
            heat_capacity,
            dt_s,
            coalbedo_free,
        })
    }

    /// Ice-free albedo of each band (dimensionless), as the model uses it.
    pub fn ice_free_albedo(&self) -> Vec<f64> {
        self.coalbedo_free.iter().map(|c| 1.0 - c).collect()
    }

    /// The latitude grid.
    pub fn grid(&self) -> &ClimateGrid {
        &self.grid
    }

    /// The spec the model was built from.
    pub fn spec(&self) -> &ClimateSpec {
        &self.spec
    }

    /// Step length, s.
    pub fn dt_s(&self) -> f64 {
        self.dt_s
    }

    /// Band heat capacity, J m⁻² K⁻¹.
    pub fn heat_capacity_j_m2_per_k(&self) -> f64 {
        self.heat_capacity
    }

    /// Model steps per year.
    pub fn steps_per_year(&self) -> usize {
        self.insolation.steps()
    }

    /// Whether a band at temperature `t_c` (°C) is ice covered.
    #[inline]
    pub fn is_ice(&self, t_c: f64) -> bool {
        self.spec.ice_enabled && t_c < self.spec.ice_temperature_c
    }

    /// Co-albedo (absorbed fraction of sunlight) of band `j` at temperature `t_c` (°C).
    #[inline]
    pub fn coalbedo(&self, j: usize, t_c: f64) -> f64 {
        if self.is_ice(t_c) {
            self.coalbedo_ice
        } else {
            self.coalbedo_free[j]
        }
    }

    /// Emission beyond the linear law at `t_c` (°C), W m⁻², and its slope, W m⁻² K⁻¹.
    ///
    /// The outgoing longwave radiation is `max(A + B·T, ε σ T_K⁴)`: the linear law within its
    /// range, and a gray body of emissivity ε (matched to the linear law at
    /// [`LIMB_MATCH_C`]) where the linear law would emit less — on very hot bands, where a
    /// straight line lets temperatures run away, and on very cold ones, where it would fall to
    /// zero and below. Zero in between, so Earth-like climates are unchanged.
    #[inline]
    pub fn limb_emission_w_m2(&self, t_c: f64) -> (f64, f64) {
        if !self.on_limb(t_c) {
            return (0.0, 0.0);
        }
        let tk = (t_c + 273.15).max(0.0);
        let gray = self.limb_emissivity * STEFAN_BOLTZMANN_W_M2_K4 * tk.powi(4);
        let linear = self.spec.olr_a_w_m2 + self.spec.olr_b_w_m2_per_k * t_c;
        if gray > linear {
            let slope = 4.0 * self.limb_emissivity * STEFAN_BOLTZMANN_W_M2_K4 * tk.powi(3)
                - self.spec.olr_b_w_m2_per_k;
            (gray - linear, slope.max(0.0))
        } else {
            (0.0, 0.0)
        }
    }

    /// `true` where the gray-body limb emits more than the linear law (two comparisons).
    #[inline]
    pub fn on_limb(&self, t_c: f64) -> bool {
        t_c > LIMB_MATCH_C || t_c < self.limb_cold_c
    }

    /// Outgoing longwave radiation at `t_c` (°C), W m⁻²: `A + B·T` plus the limb's extra.
    pub fn olr_w_m2(&self, t_c: f64) -> f64 {
        self.spec.olr_a_w_m2 + self.spec.olr_b_w_m2_per_k * t_c + self.limb_emission_w_m2(t_c).0
    }

    /// Advances `temps_c` (one value per band, °C) by one step to the end of step `k`, i.e. to
    /// year fraction `(k + 1)/steps`, using the insolation at that time. `scratch` must have one
    /// entry per band. Returns nothing; no allocation.
    pub fn step(&self, k: usize, temps_c: &mut [f64], scratch: &mut [f64]) {
        let q = self.insolation.row((k + 1) % self.insolation.steps());
        let c_dt = self.heat_capacity / self.dt_s;
        let a = self.spec.olr_a_w_m2;
        let mut limb = false;
        for (j, (r, &t)) in scratch.iter_mut().zip(temps_c.iter()).enumerate() {
            *r = c_dt * t + q[j] * self.coalbedo(j, t) - a;
            limb |= self.on_limb(t);
        }
        if limb {
            // Bands on the radiative limb: its emission linearised about the old temperature,
            // `R(T) ≈ R(T₀) + R'(T₀)(T − T₀)`, which changes the diagonal (semi-implicit, so a
            // hot band cannot overshoot). Only such worlds pay for a fresh factorisation.
            let mut diag = self.diag_step.clone();
            for (j, (r, &t)) in scratch.iter_mut().zip(temps_c.iter()).enumerate() {
                let (extra, slope) = self.limb_emission_w_m2(t);
                *r -= extra - slope * t;
                diag[j] += slope;
            }
            Tridiagonal::factorise(&self.lower, &diag, &self.upper).solve_in_place(scratch);
            // Linearised far from it, a band could step past absolute zero.
            for t in scratch.iter_mut() {
                *t = t.max(ABSOLUTE_ZERO_C);
            }
        } else {
            self.step_matrix.solve_in_place(scratch);
        }
        temps_c.copy_from_slice(scratch);
    }

    /// Runs one year from `temps_c` (state at year fraction 0) and writes the state at the start
    /// of every step into `trajectory` (`steps × bands`, row-major); `temps_c` ends at year end.
    pub fn run_year(&self, temps_c: &mut [f64], trajectory: &mut [f64], scratch: &mut [f64]) {
        let nb = self.grid.len();
        for k in 0..self.insolation.steps() {
            trajectory[k * nb..(k + 1) * nb].copy_from_slice(temps_c);
            self.step(k, temps_c, scratch);
        }
    }

    /// Steady state under the annual-mean insolation, °C per band: `(B − L)·T = Q̄·a(T) − A`,
    /// with the ice mask found by fixed-point iteration from an ice-free start (at most 100
    /// passes; the ice-free branch is found when it exists) and the radiative limb by Newton
    /// steps in the same passes. This is the analytic annual-mean
    /// solution of North (1975) in discrete form, and the start of the seasonal integration.
    pub fn steady_annual_mean(&self) -> Vec<f64> {
        let qbar = self.insolation.mean_per_band();
        let n = self.grid.len();
        let mut t = vec![f64::INFINITY; n];
        let mut next = vec![0.0; n];
        for _ in 0..100 {
            let mut diag: Option<Vec<f64>> = None;
            for j in 0..n {
                next[j] = qbar[j] * self.coalbedo(j, t[j]) - self.spec.olr_a_w_m2;
                // The radiative limb, linearised about the last pass (Newton's method on it).
                let (extra, slope) = if t[j].is_finite() {
                    self.limb_emission_w_m2(t[j])
                } else {
                    (0.0, 0.0)
                };
                if extra > 0.0 {
                    next[j] -= extra - slope * t[j];
                    diag.get_or_insert_with(|| self.diag_steady.clone())[j] += slope;
                }
            }
            let on_limb = diag.is_some();
            match diag {
                Some(d) => {
                    Tridiagonal::factorise(&self.lower, &d, &self.upper).solve_in_place(&mut next);
                    // Newton steps from far away could pass absolute zero; it bounds them.
                    for t in next.iter_mut() {
                        *t = t.max(ABSOLUTE_ZERO_C);
                    }
                }
                None => self.steady_matrix.solve_in_place(&mut next),
            }
            let same_mask = t
                .iter()
                .zip(&next)
                .all(|(&a, &b)| self.is_ice(a) == self.is_ice(b));
            // Settled when the limb plays no part, or when the Newton steps have converged.
            let needs_limb = next.iter().any(|&x| self.on_limb(x));
            let settled = !(on_limb || needs_limb)
                || t.iter().zip(&next).all(|(&a, &b)| (a - b).abs() < 1e-6);
            std::mem::swap(&mut t, &mut next);
            if same_mask && settled {
                break;
            }
        }
        t
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn longwave_limb_only_outside_the_linear_range() {
        let spec = ClimateSpec::climlab_seasonal();
        let grid = ClimateGrid::new(spec.bands).unwrap();
        let forcing = crate::climate::AnnualForcing {
            s0_w_m2: 1361.0,
            year_s: 3.15e7,
            samples: vec![
                crate::climate::SeasonSample {
                    declination_rad: 0.0,
                    distance_factor: 1.0
                };
                12
            ],
        };
        let ins = BandInsolation::from_forcing(&forcing, &grid, spec.steps_per_year).unwrap();
        let m = EnergyBalanceModel::new(&spec, ins).unwrap();
        // Earth's range: the linear law as it stands.
        for t in [-60.0, -20.0, 0.0, 15.0, 30.0, 59.0] {
            assert_eq!(m.limb_emission_w_m2(t), (0.0, 0.0), "{t} °C");
            assert_eq!(m.olr_w_m2(t), spec.olr_a_w_m2 + spec.olr_b_w_m2_per_k * t);
        }
        // Continuous where it takes over, and a gray body far above: σT⁴ grows as T_K⁴.
        assert!(m.limb_emission_w_m2(60.001).0 < 1e-2);
        let ratio = m.olr_w_m2(400.0) / m.olr_w_m2(200.0);
        let expected = (673.15f64 / 473.15).powi(4);
        assert!(
            (ratio / expected - 1.0).abs() < 1e-9,
            "{ratio} vs {expected}"
        );
        // Very cold: the linear law would emit nothing at −A/B; the limb keeps emission positive.
        let cold = -spec.olr_a_w_m2 / spec.olr_b_w_m2_per_k;
        assert!(m.olr_w_m2(cold) > 0.0 && m.olr_w_m2(-270.0) >= 0.0);
    }

    #[test]
    fn thomas_solves_a_small_system() {
        // [2 -1 0; -1 2 -1; 0 -1 2] x = [1 0 1] → x = [1 1 1].
        let m = Tridiagonal::factorise(&[0.0, -1.0, -1.0], &[2.0, 2.0, 2.0], &[-1.0, -1.0, 0.0]);
        let mut r = [1.0, 0.0, 1.0];
        m.solve_in_place(&mut r);
        for v in r {
            assert!((v - 1.0).abs() < 1e-14);
        }
    }

    #[test]
    fn analytic_annual_mean_p2_solution() {
        // climlab `tests/test_ebm.py::test_analytical` (formula and tolerance 0.02 read there):
        // constant albedo 0.3, no ice, Q = S0/4 (1 + s2 P2), S0 1365.2, s2 −0.48, A 210, B 2,
        // D 0.555: T(x) = [(1 − a0) S0/4 (1 + s2 P2(x)/(1 + 6D/B)) − A]/B. The listed values are
        // computed from that formula (regression): 25.213, 17.144, 9.076, 1.008, −7.060 °C.
        let spec = ClimateSpec {
            ice_free_albedo: IceFreeAlbedo::legendre(0.3, 0.0),
            ice_enabled: false,
            ..ClimateSpec::climlab_defaults()
        };
        let grid = ClimateGrid::new(spec.bands).unwrap();
        let ins = BandInsolation::annual_mean_p2(&grid, 36, 3.15e7, 1365.2, -0.48).unwrap();
        let model = EnergyBalanceModel::new(&spec, ins).unwrap();
        let t = model.steady_annual_mean();
        let exact = |x: f64| {
            let p2 = 0.5 * (3.0 * x * x - 1.0);
            (0.7 * 1365.2 / 4.0 * (1.0 - 0.48 * p2 / (1.0 + 6.0 * 0.555 / 2.0)) - 210.0) / 2.0
        };
        for (j, &x) in grid.x_centres().iter().enumerate() {
            assert!(
                (t[j] - exact(x)).abs() < 0.02,
                "band {j}: {} vs {}",
                t[j],
                exact(x)
            );
        }
        for (lat, want) in [
            (0.0, 25.213),
            (30.0, 17.144),
            (45.0, 9.076),
            (60.0, 1.008),
            (90.0, -7.060),
        ] {
            let got = grid.interpolate(&t, f64::to_radians(lat));
            assert!((got - want).abs() < 0.02, "{lat}: {got} vs {want}");
        }
        let global = grid.global_mean(&t);
        assert!((global - 14.455).abs() < 0.02, "{global}");
    }

    #[test]
    fn step_conserves_energy_without_sunlight_gradients() {
        // Uniform forcing and uniform start: diffusion does nothing, every band relaxes alike.
        let spec = ClimateSpec {
            ice_enabled: false,
            ice_free_albedo: IceFreeAlbedo::legendre(0.33, 0.0),
            ..ClimateSpec::climlab_seasonal()
        };
        let grid = ClimateGrid::new(spec.bands).unwrap();
        let ins = BandInsolation::from_fn(&grid, 50, 3.15e7, |_, _| 300.0).unwrap();
        let model = EnergyBalanceModel::new(&spec, ins).unwrap();
        let mut t = vec![5.0; grid.len()];
        let mut s = vec![0.0; grid.len()];
        model.step(0, &mut t, &mut s);
        assert!(t.iter().all(|v| (v - t[0]).abs() < 1e-9));
    }
}
