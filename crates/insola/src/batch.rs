//! Many places at once: star directions and insolation for large sets of observers.
//!
//! A [`PlaceBatch`] stores each place's sine and cosine of latitude and its longitude in
//! separate arrays (structure of arrays), so the per-instant work ([`Planet::star_instant`]) is
//! done once and each place costs one `sin_cos` and a handful of multiplications. The parallel
//! forms split the places into chunks over rayon's thread pool; results are identical to the
//! serial forms bit for bit, whatever the number of threads.

use glam::DVec3;
use rayon::prelude::*;

use crate::planet::Planet;
use crate::sky::{Place, StarInstant};

/// Places prepared for batch queries.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct PlaceBatch {
    sin_lat: Vec<f64>,
    cos_lat: Vec<f64>,
    lon_rad: Vec<f64>,
}

/// Places per parallel work item: large enough that scheduling costs vanish.
const CHUNK: usize = 4096;

impl PlaceBatch {
    /// Prepares `places`.
    pub fn new(places: &[Place]) -> Self {
        let mut b = PlaceBatch::with_capacity(places.len());
        for p in places {
            b.push(*p);
        }
        b
    }

    /// An empty batch with room for `n` places.
    pub fn with_capacity(n: usize) -> Self {
        PlaceBatch {
            sin_lat: Vec::with_capacity(n),
            cos_lat: Vec::with_capacity(n),
            lon_rad: Vec::with_capacity(n),
        }
    }

    /// Adds a place.
    pub fn push(&mut self, place: Place) {
        let (s, c) = place.latitude_rad.sin_cos();
        self.sin_lat.push(s);
        self.cos_lat.push(c);
        self.lon_rad.push(place.longitude_rad);
    }

    /// Number of places.
    pub fn len(&self) -> usize {
        self.lon_rad.len()
    }

    /// `true` when there are no places.
    pub fn is_empty(&self) -> bool {
        self.lon_rad.is_empty()
    }
}

#[inline]
fn up_component(i: &StarInstant, sin_lat: f64, cos_lat: f64, lon: f64, sd: f64, cd: f64) -> f64 {
    let h = i.sidereal_angle_rad + lon - i.right_ascension_rad;
    sin_lat * sd + cos_lat * cd * h.cos()
}

impl Planet {
    /// Unit vectors toward the star (east, north, up) for every place of `batch`, written to
    /// `out` (which must have `batch.len()` elements; extra elements are left untouched).
    pub fn star_directions_into(
        &self,
        instant: &StarInstant,
        batch: &PlaceBatch,
        out: &mut [DVec3],
    ) {
        let (sd, cd) = (instant.sin_declination, instant.cos_declination);
        let n = batch.len().min(out.len());
        for (k, o) in out[..n].iter_mut().enumerate() {
            *o = direction(
                instant,
                batch.sin_lat[k],
                batch.cos_lat[k],
                batch.lon_rad[k],
                sd,
                cd,
            );
        }
    }

    /// Parallel form of [`Planet::star_directions_into`].
    pub fn star_directions_par(
        &self,
        instant: &StarInstant,
        batch: &PlaceBatch,
        out: &mut [DVec3],
    ) {
        let (sd, cd) = (instant.sin_declination, instant.cos_declination);
        fill_par(batch, out, |s, c, l| direction(instant, s, c, l, sd, cd));
    }

    /// Sine of the star's altitude (the "up" component of its direction) for every place, in
    /// parallel; multiply by [`StarInstant::toa_flux_w_m2`] (clamped at 0) for insolation.
    pub fn star_sin_altitudes_par(
        &self,
        instant: &StarInstant,
        batch: &PlaceBatch,
        out: &mut [f64],
    ) {
        let (sd, cd) = (instant.sin_declination, instant.cos_declination);
        fill_par(batch, out, |s, c, l| up_component(instant, s, c, l, sd, cd));
    }
}

/// Writes `f(sin lat, cos lat, lon)` for every place into `out`, in chunks over rayon's pool.
/// Each element depends only on its own place, so the result does not depend on the number of
/// threads.
fn fill_par<T: Send>(batch: &PlaceBatch, out: &mut [T], f: impl Fn(f64, f64, f64) -> T + Sync) {
    let n = batch.len().min(out.len());
    out[..n]
        .par_chunks_mut(CHUNK)
        .enumerate()
        .for_each(|(c, chunk)| {
            let base = c * CHUNK;
            for (j, o) in chunk.iter_mut().enumerate() {
                let k = base + j;
                *o = f(batch.sin_lat[k], batch.cos_lat[k], batch.lon_rad[k]);
            }
        });
}

#[inline]
fn direction(i: &StarInstant, sin_lat: f64, cos_lat: f64, lon: f64, sd: f64, cd: f64) -> DVec3 {
    let (sh, ch) = (i.sidereal_angle_rad + lon - i.right_ascension_rad).sin_cos();
    DVec3::new(
        -cd * sh,
        cos_lat * sd - sin_lat * cd * ch,
        sin_lat * sd + cos_lat * cd * ch,
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::WorldSpec;

    #[test]
    fn batch_matches_single_queries_bit_for_bit() {
        let text = include_str!("../../../assets/worlds/tessaly-reach.world.ron");
        let p = Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap();
        let places: Vec<Place> = (0..10_000)
            .map(|k| {
                Place::from_degrees(-90.0 + (k % 181) as f64, (k as f64 * 0.37) % 360.0 - 180.0)
                    .unwrap()
            })
            .collect();
        let batch = PlaceBatch::new(&places);
        let i = p.star_instant(123_456.7);
        let mut serial = vec![DVec3::ZERO; places.len()];
        let mut par = vec![DVec3::ZERO; places.len()];
        let mut up = vec![0.0; places.len()];
        p.star_directions_into(&i, &batch, &mut serial);
        p.star_directions_par(&i, &batch, &mut par);
        p.star_sin_altitudes_par(&i, &batch, &mut up);
        for (k, place) in places.iter().enumerate() {
            let single = p.star_position_at(&i, *place).direction_enu;
            assert!((single - serial[k]).length() < 1e-12);
            assert_eq!(serial[k], par[k]);
            assert_eq!(up[k], par[k].z);
        }
    }
}
