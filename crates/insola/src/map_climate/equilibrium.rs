//! Finding the periodic seasonal state of the map model.
//!
//! Convergence rule (the zonal model's): a year run from state `S` ends in `S'`; the cycle is
//! accepted when `max over cells |S' − S| < tolerance_k`, checked on a plainly run year, and
//! the stored cycle is that year.
//!
//! Speed-up: the year map `S ↦ S'` is nearly affine (exactly so while the ice mask and the
//! gray-body limb stay put), with a few slow modes set by the ocean's heat capacity. Anderson
//! acceleration (Anderson 1965, J. ACM 12, 547; in the form of Walker & Ni 2011, SIAM J. Numer.
//! Anal. 49, 1715) finds the fixed point of such a map in a handful of years: the next start is
//! the combination of the last few years' ends whose residuals cancel best in the least-squares
//! sense. The zonal model jumps its two known slowest modes instead; with land and sea side by
//! side those are no longer known in closed form, so the map model learns them from its own
//! years. The history restarts when a year's residual grows (an ice flip), so a nonlinear
//! jump never compounds.
//!
//! Start: the steady state under annual-mean sunlight. With daily-mean forcing and a surface
//! without ice sheets or elevation that is the zonal model's own steady state (heat capacity
//! does not enter a steady state), copied to every column; otherwise it is found by the split
//! step run as a pseudo-time iteration with a cycle of pseudo heat capacities (the classic
//! alternating-direction parameter cycle, Peaceman & Rachford 1955, J. SIAM 3, 28).

use super::cycle::MapClimate;
use super::error::MapClimateError;
use super::forcing::ForcingMode;
use super::model::MapEnergyBalanceModel;
use crate::error::{SpecError, check_range};

/// Years of history Anderson acceleration keeps.
const HISTORY: usize = 5;

/// Where the seasonal integration starts.
#[derive(Debug, Clone, PartialEq)]
pub enum MapStart {
    /// The steady state under annual-mean sunlight (the default).
    SteadyAnnualMean,
    /// Every cell at this sea-level temperature, °C (e.g. very cold, to look for a snowball).
    Uniform(f64),
    /// One sea-level temperature per cell, °C, in grid order.
    Given(Vec<f64>),
}

/// The periodic state of a prepared model from a chosen start.
pub fn equilibrate_map(
    model: &MapEnergyBalanceModel,
    start: &MapStart,
) -> Result<MapClimate, MapClimateError> {
    let spec = model.spec();
    let n = model.grid().len();
    let steps = model.steps_per_year();
    let mut state = match start {
        MapStart::SteadyAnnualMean => steady_annual_mean(model),
        MapStart::Uniform(t) => vec![check_range("start_c", *t, -273.15, 1e4)?; n],
        MapStart::Given(v) => {
            if v.len() != n {
                return Err(SpecError::inconsistent(
                    "start_c",
                    format!("{} values given for {n} cells", v.len()),
                )
                .into());
            }
            for (c, &t) in v.iter().enumerate() {
                check_range(&format!("start_c[{c}]"), t, -273.15, 1e4)?;
            }
            v.clone()
        }
    };
    let mut ws = model.workspace();
    let mut trajectory = vec![0.0f32; steps * n];
    let mut end = vec![0.0; n];
    let mut residual = f64::INFINITY;
    let mut years_run = 0;
    let mut anderson = Anderson::new(n);
    for year in 1..=spec.max_years {
        end.copy_from_slice(&state);
        for k in 0..steps {
            let row = &mut trajectory[k * n..(k + 1) * n];
            for ((o, &t), &l) in row.iter_mut().zip(&end).zip(&model.lapse_k) {
                *o = (t - l).max(-273.15) as f32;
            }
            model.step(k, &mut end, &mut ws);
        }
        years_run = year;
        let last = residual;
        residual = end
            .iter()
            .zip(&state)
            .map(|(a, b)| (a - b).abs())
            .fold(0.0, f64::max);
        if !residual.is_finite() {
            break;
        }
        if residual < spec.tolerance_k {
            return Ok(MapClimate::from_year(
                model, trajectory, year, residual, true,
            ));
        }
        if residual > last {
            anderson.clear();
        }
        let start = state.clone();
        anderson.next_start(&start, &end, &mut state);
    }
    let last = MapClimate::from_year(model, trajectory, years_run, residual, false);
    Err(MapClimateError::NotConverged {
        years: years_run,
        residual_k: residual,
        tolerance_k: spec.tolerance_k,
        last: Box::new(last),
    })
}

/// The steady state under annual-mean sunlight, sea-level °C per cell (see the module docs).
pub fn steady_annual_mean(model: &MapEnergyBalanceModel) -> Vec<f64> {
    let grid = model.grid();
    let cols = grid.columns();
    let s = model.surface();
    let zonal_symmetric =
        s.ice_sheet_fraction.iter().all(|&f| f == 0.0) && s.elevation_m.iter().all(|&z| z == 0.0);
    if matches!(model.forcing().mode(), ForcingMode::DailyMean) && zonal_symmetric {
        let rows = model.longwave.steady_annual_mean();
        return rows
            .iter()
            .flat_map(|&t| std::iter::repeat_n(t, cols))
            .collect();
    }
    let spec = model.spec();
    let mut ws = model.workspace();
    let free = model.ice_free_albedo();
    // Radiative balance of each cell without transport, ice free, bounded: a first guess.
    let mut t: Vec<f64> = model
        .mean_insolation
        .iter()
        .zip(&free)
        .map(|(q, a)| {
            ((q * (1.0 - a) - spec.olr_a_w_m2) / spec.olr_b_w_m2_per_k).clamp(-80.0, 80.0)
        })
        .collect();
    let (lo, hi) = (spec.olr_b_w_m2_per_k, model.max_coupling());
    let ratio = (hi / lo).max(1.0);
    const PARAMS: usize = 8;
    for _cycle in 0..4 {
        for p in 0..PARAMS {
            // Geometric from the stiffest to the softest mode in each cycle.
            let cap = hi / ratio.powf(p as f64 / (PARAMS - 1) as f64);
            ws.set_insolation(&model.mean_insolation);
            model.step_with(&mut t, &mut ws, 1.0, Some(cap));
        }
    }
    t
}

/// Anderson acceleration of a fixed-point map (see the module docs).
struct Anderson {
    /// Differences of successive residuals and of successive map values.
    d_res: Vec<Vec<f64>>,
    d_val: Vec<Vec<f64>>,
    last_res: Option<Vec<f64>>,
    last_val: Option<Vec<f64>>,
    res: Vec<f64>,
}

impl Anderson {
    fn new(n: usize) -> Self {
        Anderson {
            d_res: Vec::new(),
            d_val: Vec::new(),
            last_res: None,
            last_val: None,
            res: vec![0.0; n],
        }
    }

    fn clear(&mut self) {
        self.d_res.clear();
        self.d_val.clear();
        self.last_res = None;
        self.last_val = None;
    }

    /// From the start `x` and its year's end `g`, writes the next start into `out`.
    fn next_start(&mut self, x: &[f64], g: &[f64], out: &mut [f64]) {
        for ((r, a), b) in self.res.iter_mut().zip(g).zip(x) {
            *r = a - b;
        }
        if let (Some(lr), Some(lv)) = (&self.last_res, &self.last_val) {
            if self.d_res.len() == HISTORY {
                self.d_res.remove(0);
                self.d_val.remove(0);
            }
            self.d_res
                .push(self.res.iter().zip(lr).map(|(a, b)| a - b).collect());
            self.d_val
                .push(g.iter().zip(lv).map(|(a, b)| a - b).collect());
        }
        self.last_res = Some(self.res.clone());
        self.last_val = Some(g.to_vec());
        let m = self.d_res.len();
        out.copy_from_slice(g);
        if m == 0 {
            return;
        }
        // Normal equations of min ‖res − ΔR γ‖, lightly regularised.
        let mut a = vec![0.0; m * m];
        let mut rhs = vec![0.0; m];
        for p in 0..m {
            for q in 0..=p {
                let v: f64 = self.d_res[p]
                    .iter()
                    .zip(&self.d_res[q])
                    .map(|(x, y)| x * y)
                    .sum();
                a[p * m + q] = v;
                a[q * m + p] = v;
            }
            rhs[p] = self.d_res[p]
                .iter()
                .zip(&self.res)
                .map(|(x, y)| x * y)
                .sum();
        }
        let trace: f64 = (0..m).map(|p| a[p * m + p]).sum();
        if trace.is_nan() || trace <= 0.0 {
            return;
        }
        for p in 0..m {
            a[p * m + p] += 1e-10 * trace;
        }
        let Some(gamma) = solve_small(&mut a, &mut rhs, m) else {
            return;
        };
        for (p, gp) in gamma.iter().enumerate() {
            for (o, d) in out.iter_mut().zip(&self.d_val[p]) {
                *o -= gp * d;
            }
        }
    }
}

/// Gaussian elimination with partial pivoting on an `m × m` system (m ≤ 5).
fn solve_small(a: &mut [f64], b: &mut [f64], m: usize) -> Option<Vec<f64>> {
    for col in 0..m {
        let piv =
            (col..m).max_by(|&i, &j| a[i * m + col].abs().total_cmp(&a[j * m + col].abs()))?;
        if a[piv * m + col].abs() < 1e-300 {
            return None;
        }
        if piv != col {
            for k in 0..m {
                a.swap(col * m + k, piv * m + k);
            }
            b.swap(col, piv);
        }
        for r in col + 1..m {
            let f = a[r * m + col] / a[col * m + col];
            for k in col..m {
                a[r * m + k] -= f * a[col * m + k];
            }
            b[r] -= f * b[col];
        }
    }
    let mut x = vec![0.0; m];
    for r in (0..m).rev() {
        let s: f64 = (r + 1..m).map(|k| a[r * m + k] * x[k]).sum();
        x[r] = (b[r] - s) / a[r * m + r];
    }
    x.iter().all(|v| v.is_finite()).then_some(x)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn anderson_solves_a_linear_map_in_few_steps() {
        // x ↦ M x + b with slow modes 0.95 and 0.8 (diagonal): plain iteration needs ~180
        // steps to 1e-4, Anderson a few.
        let diag = [0.95, 0.8, 0.3, 0.1];
        let b = [1.0, -2.0, 0.5, 3.0];
        let fixed: Vec<f64> = (0..4).map(|i| b[i] / (1.0 - diag[i])).collect();
        let mut x = vec![0.0; 4];
        let mut acc = Anderson::new(4);
        let mut out = vec![0.0; 4];
        let mut steps = 0;
        for _ in 0..50 {
            let g: Vec<f64> = (0..4).map(|i| diag[i] * x[i] + b[i]).collect();
            steps += 1;
            if g.iter().zip(&x).all(|(a, b)| (a - b).abs() < 1e-4) {
                break;
            }
            acc.next_start(&x, &g, &mut out);
            x.copy_from_slice(&out);
        }
        assert!(steps < 10, "{steps}");
        for (a, f) in x.iter().zip(&fixed) {
            assert!((a - f).abs() < 1e-3);
        }
    }
}
