//! The daily-mean insolation under a ring, by quadrature over the hour angle.
//!
//! Berger's (1978) closed form `Q̄ = (S/π)(h₀ sin φ sin δ + cos φ cos δ sin h₀)` integrates
//! `S·max(0, μ(h))` over the day with nothing in the way. Under a ring the beam is multiplied
//! by the ring's transmission `T(h)`, which is constant between the hour angles where the ray
//! toward the star crosses an annulus edge, so here the day's mean
//!
//! ```text
//! Q̄ = (1/π) ∫₀^h₀ S μ(h) T(h) dh,   μ(h) = sin φ sin δ + cos φ cos δ cos h
//! ```
//!
//! (the integrand is even in `h`) is taken by Gauss–Legendre quadrature on each piece between
//! sunrise, the edge crossings and sunset, declination and distance held for the day as Berger
//! holds them. On a piece the integrand is `T·S·μ(h)`, a constant plus a cosine, and the
//! [`RING_DAILY_MEAN_NODES`]-point Gauss–Legendre rule's error on an interval of length `L` is
//! `L¹⁷ (8!)⁴ / (17 (16!)³) · max|f⁽¹⁶⁾|` (its error term, Abramowitz & Stegun §25.4, from
//! memory); for `L ≤ π` and `f = A cos h` that is below `5e-15 · A`, some 1e-12 W m⁻² for
//! `A = S/π`: far inside the ~0.1 W m⁻² the climate needs. Tested against Berger without a ring (1e-6 relative) and
//! against a fine midpoint sum with one (0.1 W m⁻²).
//!
//! Edge crossings: with the place at `R(cos φ, 0, sin φ)` and the star at
//! `(cos δ cos h, −cos δ sin h, sin δ)`, the ray meets the ring plane at `t = −R sin φ / sin δ`
//! and, with `k = t cos δ`, at a distance `ρ` from the axis with
//! `ρ² = R² cos² φ + 2 R k cos φ cos h + k²`; so the ray crosses an edge of radius `r` where
//! `cos h = (r² − R² cos² φ − k²) / (2 R k cos φ)`, once in `[0, π]` at most (`ρ` falls as `h`
//! grows).

use std::f64::consts::PI;

use glam::DVec3;

use super::shadow::RingGeometry;
use crate::climate::{AnnualForcing, BandInsolation, ClimateGrid};
use crate::error::{SpecError, check_range};
use crate::planet::Planet;

/// Gauss–Legendre nodes per smooth piece of the day (between sunrise, each crossing of an
/// annulus edge, and sunset).
pub const RING_DAILY_MEAN_NODES: usize = 8;

/// The 8-point Gauss–Legendre rule on [−1, 1]: positive nodes and their weights (the nodes are
/// symmetric). Abramowitz & Stegun, *Handbook of Mathematical Functions*, table 25.4.
const GAUSS_8: [(f64, f64); 4] = [
    (0.183_434_642_495_649_8, 0.362_683_783_378_362),
    (0.525_532_409_916_329, 0.313_706_645_877_887_3),
    (0.796_666_477_413_626_7, 0.222_381_034_453_374_5),
    (0.960_289_856_497_536_3, 0.101_228_536_290_376_3),
];

/// `∫_a^b f` by the 8-point Gauss–Legendre rule.
fn gauss_8(a: f64, b: f64, f: &mut impl FnMut(f64) -> f64) -> f64 {
    let (mid, half) = (0.5 * (a + b), 0.5 * (b - a));
    let mut sum = 0.0;
    for &(x, w) in &GAUSS_8 {
        sum += w * (f(mid - half * x) + f(mid + half * x));
    }
    sum * half
}

/// `∫₀^h0 f(h) dh` by Gauss–Legendre on each piece between the sorted `breaks` (values outside
/// `(0, h0)` are ignored).
pub(crate) fn integrate_pieces(
    h0: f64,
    breaks: &mut Vec<f64>,
    f: &mut impl FnMut(f64) -> f64,
) -> f64 {
    breaks.retain(|&b| b > 0.0 && b < h0);
    breaks.sort_by(f64::total_cmp);
    let mut total = 0.0;
    let mut from = 0.0;
    for &b in breaks.iter().chain(std::iter::once(&h0)) {
        if b > from {
            total += gauss_8(from, b, f);
            from = b;
        }
    }
    total
}

/// One day's integrals under the ring at latitude `lat_rad`, declination `decl_rad`:
/// `(∫₀^h₀ μT dh, ∫₀^h₀ μ²T dh)` over the hour angle (radians), the first giving the daily
/// mean `Q̄ = S/π · ∫μT` and both the insolation-weighted mean cosine of the zenith angle.
pub(crate) fn ring_day_moments(ring: &RingGeometry, lat_rad: f64, decl_rad: f64) -> (f64, f64) {
    let h0 = crate::insolation::sunset_hour_angle_rad(lat_rad, decl_rad);
    if h0 <= 0.0 {
        return (0.0, 0.0);
    }
    let (sp, cp) = lat_rad.sin_cos();
    let (sd, cd) = decl_rad.sin_cos();
    let n = DVec3::new(cp, 0.0, sp);
    let mut breaks = Vec::new();
    let r = ring.planet_radius_km();
    if sd != 0.0 && sp * sd < 0.0 && cp > 0.0 {
        let k = -r * sp / sd * cd;
        if k > 0.0 {
            let base = r * r * cp * cp + k * k;
            let scale = 2.0 * r * k * cp;
            for edge in ring.edges_km() {
                let c = (edge * edge - base) / scale;
                if c.abs() < 1.0 {
                    breaks.push(c.acos());
                }
            }
        }
    }
    let mu = |h: f64| (sp * sd + cp * cd * h.cos()).max(0.0);
    let t = |h: f64| {
        let (sh, ch) = h.sin_cos();
        ring.shadow(n, DVec3::new(cd * ch, -cd * sh, sd))
            .transmission
    };
    let m1 = integrate_pieces(h0, &mut breaks.clone(), &mut |h| mu(h) * t(h));
    let m2 = integrate_pieces(h0, &mut breaks, &mut |h| {
        let m = mu(h);
        m * m * t(h)
    });
    (m1, m2)
}

/// Daily-mean top-of-atmosphere insolation under the ring, W m⁻², for flux `s0_w_m2` at the
/// mean distance, latitude `lat_rad`, declination `decl_rad` and distance factor `rho`
/// (declination and distance held for the day, as in Berger 1978).
pub(crate) fn ring_daily_mean_w_m2(
    ring: &RingGeometry,
    s0_w_m2: f64,
    lat_rad: f64,
    decl_rad: f64,
    rho: f64,
) -> f64 {
    let (m1, _) = ring_day_moments(ring, lat_rad, decl_rad);
    (s0_w_m2 / (PI * rho * rho) * m1).max(0.0)
}

impl Planet {
    /// The ring in the form the quadrature needs (`None` without a shadow-casting ring).
    pub(crate) fn ring_geometry(&self) -> Option<RingGeometry> {
        let ring = self.ring().filter(|r| r.casts_shadow())?;
        Some(RingGeometry::new(ring, self.body().radius_km))
    }

    /// Daily-mean top-of-atmosphere insolation at `latitude_rad` on the day containing `t_s`,
    /// W m⁻², with the ring's shadow: the quadrature of the [module docs](self) on ringed
    /// worlds, Berger's closed form ([`Planet::daily_mean_insolation_w_m2`]) on the others.
    /// Never above the ringless value.
    pub fn ring_daily_mean_insolation_w_m2(&self, t_s: f64, latitude_rad: f64) -> f64 {
        let i = self.star_instant(t_s);
        let Some(ring) = self.ring_geometry() else {
            return crate::insolation::daily_mean_w_m2(
                self.flux_at_mean_distance_w_m2(),
                latitude_rad,
                i.declination_rad,
                i.distance_factor,
            );
        };
        ring_daily_mean_w_m2(
            &ring,
            self.flux_at_mean_distance_w_m2(),
            latitude_rad,
            i.declination_rad,
            i.distance_factor,
        )
    }

    /// The climate's band table for this world when [`Planet::daily_mean_needs_quadrature`]:
    /// the daily mean under the ring at every band centre of `grid` and every model step
    /// (declination and distance interpolated from `forcing` as
    /// [`BandInsolation::from_forcing`] does), with each band's insolation-weighted mean
    /// cosine of the zenith angle from the same quadrature. Without a shadow-casting ring it
    /// is [`BandInsolation::from_forcing`].
    pub fn ring_band_insolation(
        &self,
        forcing: &AnnualForcing,
        grid: &ClimateGrid,
        steps: usize,
    ) -> Result<BandInsolation, SpecError> {
        let Some(ring) = self.ring_geometry() else {
            return BandInsolation::from_forcing(forcing, grid, steps);
        };
        forcing.validate()?;
        check_range("climate.steps_per_year", steps as f64, 1.0, 1e6)?;
        let lats = grid.lat_centres_rad();
        let nb = lats.len();
        let s0 = forcing.s0_w_m2;
        // Per step and band: (insolation, weighted ∫μT, weighted ∫μ²T), weight 1/ρ²; one step
        // per chunk (each depends only on its own step, so serial and parallel builds agree).
        let mut cells = vec![(0.0, 0.0, 0.0); steps * nb];
        if nb > 0 {
            crate::parallel::for_each_chunk(&mut cells, nb, |k, row| {
                let s = forcing.sample_at(k as f64 / steps as f64);
                let w = 1.0 / (s.distance_factor * s.distance_factor);
                for (cell, &lat) in row.iter_mut().zip(lats) {
                    let (m1, m2) = ring_day_moments(&ring, lat, s.declination_rad);
                    *cell = ((s0 * w / PI * m1).max(0.0), w * m1, w * m2);
                }
            });
        }
        let w_m2 = cells.iter().map(|c| c.0).collect();
        let mean_cos_zenith = (0..nb)
            .map(|j| {
                let (mut num, mut den) = (0.0, 0.0);
                for k in 0..steps {
                    let c = cells[k * nb + j];
                    den += c.1;
                    num += c.2;
                }
                if den > 0.0 {
                    (num / den).clamp(0.0, 1.0)
                } else {
                    0.0
                }
            })
            .collect();
        Ok(BandInsolation::from_table_parts(
            steps,
            nb,
            forcing.year_s,
            w_m2,
            Some(mean_cos_zenith),
        ))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_gauss_rule_is_exact_to_degree_fifteen() {
        // An n-point Gauss–Legendre rule integrates polynomials up to degree 2n − 1 exactly
        // (Abramowitz & Stegun §25.4): ∫₋₁¹ x^k = 2/(k+1) for even k, 0 for odd.
        for k in 0..=15 {
            let got = gauss_8(-1.0, 1.0, &mut |x: f64| x.powi(k));
            let want = if k % 2 == 0 {
                2.0 / (k as f64 + 1.0)
            } else {
                0.0
            };
            assert!((got - want).abs() < 1e-14, "x^{k}: {got} vs {want}");
        }
        // The pieces add up: a cosine over [0, 2] split anywhere gives sin 2.
        let mut breaks = vec![0.3, 1.7, 5.0, -1.0];
        let got = integrate_pieces(2.0, &mut breaks, &mut f64::cos);
        assert!((got - 2f64.sin()).abs() < 1e-15);
    }
}
