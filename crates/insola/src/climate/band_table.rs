//! The climate's insolation table in one pass over the latitude × step grid: the Berger (1978)
//! daily mean of every cell and, from the same sunset hour angle, the moments of the cosine of
//! the zenith angle that weigh each band's mean cosine ([`super::albedo`]).
//!
//! The per-cell formulas are those of [`crate::insolation::daily_mean_w_m2`] and
//! `albedo::daily_cos_zenith_moments`, arranged as [`crate::insolation::daily_mean_grid_w_m2`]
//! arranges them: the sines and cosines of each latitude and each step's declination once, per
//! cell one `acos` and one square root (`sin h0 = √(1 − cos² h0)`, `sin 2h0 = 2 sin h0 cos h0`).
//! Steps are spread over rayon's threads; the sums over the year run in step order on one
//! thread, so the result does not depend on the number of threads.

use std::f64::consts::PI;

/// Steps per parallel work item (whole rows; small tables stay on one thread).
const ROWS_PER_TASK: usize = 16;

/// Daily-mean insolation, W m⁻², row-major by step (`out[k · lats + j]`), and the
/// insolation-weighted mean cosine of the zenith angle per latitude (0–1; 0 where the star
/// never rises), for the steps `days[k] = (declination_rad, distance_factor)`.
pub(crate) fn band_table(
    s0_w_m2: f64,
    lats_rad: &[f64],
    days: &[(f64, f64)],
) -> (Vec<f64>, Vec<f64>) {
    let n = lats_rad.len();
    let trig: Vec<(f64, f64)> = lats_rad.iter().map(|l| l.sin_cos()).collect();
    let mut w_m2 = vec![0.0; n * days.len()];
    // Per cell the weighted first and second moments, summed per band afterwards.
    let mut m1 = vec![0.0; n * days.len()];
    let mut m2 = vec![0.0; n * days.len()];
    if n == 0 {
        return (w_m2, vec![]);
    }
    let task = ROWS_PER_TASK * n;
    crate::parallel::for_each_chunk3(&mut w_m2, &mut m1, &mut m2, task, |c, q, m1, m2| {
        let first = c * ROWS_PER_TASK;
        let days = &days[first..(first + ROWS_PER_TASK).min(days.len())];
        for (r, &(decl, rho)) in days.iter().enumerate() {
            let row = r * n..(r + 1) * n;
            fill_row(
                s0_w_m2,
                &trig,
                decl,
                rho,
                &mut q[row.clone()],
                &mut m1[row.clone()],
                &mut m2[row],
            );
        }
    });
    let mut mean_cos = vec![0.0; n];
    for (j, mu) in mean_cos.iter_mut().enumerate() {
        let (mut num, mut den) = (0.0, 0.0);
        for k in 0..days.len() {
            num += m2[k * n + j];
            den += m1[k * n + j];
        }
        *mu = if den > 0.0 {
            (num / den).clamp(0.0, 1.0)
        } else {
            0.0
        };
    }
    (w_m2, mean_cos)
}

/// One step's row: insolation and the weighted moments `w · ∫μ`, `w · ∫μ²` with `w = 1/ρ²`.
fn fill_row(
    s0: f64,
    trig: &[(f64, f64)],
    decl: f64,
    rho: f64,
    q: &mut [f64],
    m1: &mut [f64],
    m2: &mut [f64],
) {
    let (sd, cd) = decl.sin_cos();
    let k = s0 / (PI * rho * rho);
    let w = 1.0 / (rho * rho);
    let cells = q.iter_mut().zip(m1.iter_mut()).zip(m2.iter_mut()).zip(trig);
    for (((q, m1), m2), &(sp, cp)) in cells {
        let a = sp * sd;
        let b = cp * cd;
        // cos h0 = −a/b (Berger 1978), polar night and day without dividing.
        let (h0, s, c) = if -a >= b {
            (0.0, 0.0, 1.0)
        } else if -a <= -b {
            (PI, 0.0, -1.0)
        } else {
            let c = -a / b;
            (c.acos(), (1.0 - c * c).sqrt(), c)
        };
        *q = (k * (h0 * a + b * s)).max(0.0);
        let first = 2.0 * (a * h0 + b * s);
        let second = 2.0 * (a * a * h0 + 2.0 * a * b * s + b * b * (0.5 * h0 + 0.5 * s * c));
        *m1 = w * first.max(0.0);
        *m2 = w * second.max(0.0);
    }
}
