//! Many places at once: star directions and insolation for large sets of observers.
//!
//! A [`PlaceBatch`] stores each place's sine and cosine of latitude and of longitude in
//! separate arrays (structure of arrays), so the per-instant work ([`Planet::star_instant`]) is
//! done once (the same per-instant meridian as [`crate::star_frame`]) and each place costs a handful of multiply-adds: the hour angle's sine and cosine
//! come from the angle-sum rule with the instant's hour angle at longitude 0, not from a
//! `sin_cos` per place. At a million places the work is then bound by memory traffic. The
//! parallel forms split the places into chunks over rayon's thread pool; results are identical
//! to the serial forms bit for bit, whatever the number of threads, and agree with single
//! queries ([`Planet::star_position_at`]) to about 1e-15.

use glam::DVec3;

use crate::planet::Planet;
use crate::sky::{Place, StarInstant};
use crate::star_frame::Meridian;

/// Places prepared for batch queries.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct PlaceBatch {
    sin_lat: Vec<f64>,
    cos_lat: Vec<f64>,
    sin_lon: Vec<f64>,
    cos_lon: Vec<f64>,
}

/// Places per parallel work item: large enough that scheduling costs vanish.
const CHUNK: usize = 16_384;

/// Below this many places the parallel forms run serially: waking the pool's threads costs
/// tens of microseconds, more than the work itself (about 1.4 ns per place on one thread).
const SERIAL_BELOW: usize = 4 * CHUNK;

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
            sin_lon: Vec::with_capacity(n),
            cos_lon: Vec::with_capacity(n),
        }
    }

    /// Adds a place.
    pub fn push(&mut self, place: Place) {
        let (s, c) = place.latitude_rad.sin_cos();
        self.sin_lat.push(s);
        self.cos_lat.push(c);
        let (s, c) = place.longitude_rad.sin_cos();
        self.sin_lon.push(s);
        self.cos_lon.push(c);
    }

    /// Number of places.
    pub fn len(&self) -> usize {
        self.sin_lat.len()
    }

    /// `true` when there are no places.
    pub fn is_empty(&self) -> bool {
        self.sin_lat.is_empty()
    }
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
        let frame = Meridian::new(instant);
        let n = batch.len().min(out.len());
        fill_chunk(batch.columns(0, n), &mut out[..n], &|p| frame.direction(p));
    }

    /// Parallel form of [`Planet::star_directions_into`].
    pub fn star_directions_par(
        &self,
        instant: &StarInstant,
        batch: &PlaceBatch,
        out: &mut [DVec3],
    ) {
        let frame = Meridian::new(instant);
        fill_par(batch, out, |p| frame.direction(p));
    }

    /// Sine of the star's altitude (the "up" component of its direction) for every place, in
    /// parallel; multiply by [`StarInstant::toa_flux_w_m2`] (clamped at 0) for insolation.
    pub fn star_sin_altitudes_par(
        &self,
        instant: &StarInstant,
        batch: &PlaceBatch,
        out: &mut [f64],
    ) {
        let frame = Meridian::new(instant);
        fill_par(batch, out, |p| frame.up_component(p));
    }
}

/// The four columns of a run of places, as slices of one length.
type Columns<'a> = [&'a [f64]; 4];

impl PlaceBatch {
    /// Places `first … first + n` as their four columns (`first + n` at most [`Self::len`]).
    fn columns(&self, first: usize, n: usize) -> Columns<'_> {
        let r = first..first + n;
        [
            &self.sin_lat[r.clone()],
            &self.cos_lat[r.clone()],
            &self.sin_lon[r.clone()],
            &self.cos_lon[r],
        ]
    }
}

/// Writes `f(place)` for a run of places: the columns are zipped with the output, so the loop
/// reads each array once and checks no bounds per place.
#[inline]
fn fill_chunk<T>(columns: Columns<'_>, out: &mut [T], f: &impl Fn([f64; 4]) -> T) {
    let [a, b, c, d] = columns;
    let places = a.iter().zip(b).zip(c).zip(d);
    for (o, (((&a, &b), &c), &d)) in out.iter_mut().zip(places) {
        *o = f([a, b, c, d]);
    }
}

/// Writes `f(place)` for every place into `out`, in chunks over the thread pool (serially below
/// [`SERIAL_BELOW`] places). Each element depends only on its own place, so the result does not
/// depend on the number of threads.
fn fill_par<T: Send>(batch: &PlaceBatch, out: &mut [T], f: impl Fn([f64; 4]) -> T + Sync) {
    let n = batch.len().min(out.len());
    if n < SERIAL_BELOW {
        return fill_chunk(batch.columns(0, n), &mut out[..n], &f);
    }
    crate::parallel::for_each_chunk(&mut out[..n], CHUNK, |c, chunk| {
        fill_chunk(batch.columns(c * CHUNK, chunk.len()), chunk, &f);
    });
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::WorldSpec;

    #[test]
    fn batch_matches_single_queries_and_parallel_matches_serial_bit_for_bit() {
        let text = include_str!("../../../assets/worlds/calvenne.world.ron");
        let p = Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap();
        let places: Vec<Place> = (0..100_000)
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
            assert!((single - serial[k]).length() < 1e-14);
            assert_eq!(serial[k], par[k]);
            assert_eq!(up[k], par[k].z);
        }
    }
}
