//! Ringed worlds: the shadow a flat ring casts on the ground, the daily-mean insolation under
//! it, and the ring as seen in the sky.
//!
//! # Model
//!
//! The ring is the world file's [`crate::world::RingSpec`]: infinitely thin annuli in the
//! planet's equatorial plane, each with a normal optical depth `τ`. Everything here works in
//! the planet's **rotating frame** (x toward the prime meridian on the equator, z toward the
//! north pole), where the ring does not move: a place is `R·n` with `n` its unit position
//! vector, the star a unit direction `s` (parallel rays: the star is far compared with the
//! ring).
//!
//! - **Shadow** ([`shadow`]): the ray from the ground point toward the star, `R·n + t·s`,
//!   crosses the ring plane `z = 0` once, at `t = −R·n_z / s_z`, if `t > 0` (the place and the
//!   star are on opposite sides of the plane: the winter hemisphere). If the crossing radius
//!   lies inside an annulus, the direct beam keeps `exp(−τ / |sin B|)` of its light, `B` the
//!   star's elevation above the ring plane (`sin B = s_z`): the Beer–Lambert law along the
//!   slanted path, whose length through a layer of normal optical depth `τ` is `τ / |sin B|`.
//!   One plane crossing means one annulus, so there is nothing to multiply over annuli. The
//!   star is a point: the shadow's edges are sharp (the penumbra of a real star's disc, about
//!   `2 α t` wide, is left out). Only the direct beam is dimmed; the sky light follows it
//!   through the occlusion seam ([`crate::occlusion`]), where the ring is
//!   [`crate::occlusion::Occluder::Ring`].
//! - **Daily mean** ([`daily_mean`]): under a ring the analytic Berger (1978) daily mean no
//!   longer holds, so the climate forcing integrates the instantaneous insolation with the
//!   ring's transmission over the hour angle ([`Planet::ring_daily_mean_insolation_w_m2`]).
//! - **Sky** ([`sky`]): the ring's edges as arcs of points across a place's sky, the lit face
//!   and the shadow now ([`Planet::ring_view`]); the arcs depend on the place only
//!   ([`Planet::ring_arcs`]), the rest on the instant ([`Planet::ring_moment`]).
//!
//! A ring of zero optical depth everywhere changes nothing: every path checks
//! [`Planet::has_ring_shadow`] first, so a ringless or transparent-ring world runs exactly as
//! before.

pub mod daily_mean;
pub mod shadow;
pub mod sky;

#[cfg(test)]
pub(crate) mod tests;

pub use daily_mean::RING_DAILY_MEAN_NODES;
pub use shadow::{RING_SHADOW_THRESHOLD, RingShadow, RingSight, noon_shadow_latitude_rad};
pub use sky::{RING_ARC_POINTS, RingArc, RingArcs, RingEdgePoint, RingFace, RingMoment, RingView};

use crate::climate::BandInsolation;
use crate::planet::Planet;
use crate::world::RingSpec;

impl Planet {
    /// The world's ring system, if its file has one.
    pub fn ring(&self) -> Option<&RingSpec> {
        self.spec().ring.as_ref()
    }

    /// `true` if the world has a ring that can dim the star (some annulus with a positive
    /// optical depth). Every ring path is skipped when this is `false`.
    pub fn has_ring_shadow(&self) -> bool {
        self.ring().is_some_and(RingSpec::casts_shadow)
    }

    /// `true` if the daily-mean insolation of this world cannot use the analytic Berger (1978)
    /// formula alone: when a ring dims the star (integrated over the hour angle) or a second
    /// star shines (each star's table, summed). See [`Planet::star_band_tables`].
    pub fn daily_mean_needs_quadrature(&self) -> bool {
        self.has_ring_shadow() || self.has_shining_companion()
    }

    /// The climate's daily-mean insolation table of every shining star, summed: per star its
    /// own forcing (declination, distance and flux at each step; the primary's is `primary`),
    /// by quadrature under the ring when there is one ([`Planet::ring_band_insolation`]), else
    /// by the closed form ([`BandInsolation::from_forcing`]); the bands' mean zenith cosines are
    /// weighted by each star's share ([`BandInsolation::summed`]).
    pub fn star_band_tables(
        &self,
        primary: &crate::climate::AnnualForcing,
        grid: &crate::climate::ClimateGrid,
        steps: usize,
    ) -> Result<BandInsolation, crate::error::SpecError> {
        let forcings = if self.has_shining_companion() {
            self.star_forcings(steps)
        } else {
            vec![primary.clone()]
        };
        let tables = forcings
            .iter()
            .map(|f| self.ring_band_insolation(f, grid, steps))
            .collect::<Result<Vec<_>, _>>()?;
        BandInsolation::summed(tables)
    }
}
