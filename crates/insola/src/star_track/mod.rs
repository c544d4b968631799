//! Time series at one place: the star's position and the top-of-atmosphere insolation over
//! many instants, evenly spaced or given, written into the caller's buffers.
//!
//! What a table, a year of baked light, `insola year` or an offline tool needs is one place at
//! many instants. [`Planet::star_position`] pays the whole per-instant chain each time (Kepler's
//! equation, three arctangents, four `sin_cos`); a track does the place's work once (its
//! latitude's sine and cosine) and carries the per-instant work from one sample to the next
//! (see `cursor`): in blocks of 64 samples anchored on the scalar formulas, Kepler's equation
//! is solved from the anchor's anomaly by a Taylor step and one Newton step, the planet's spin
//! turns by a fixed rotation per step, the right ascension moves by a small-angle step. On evenly
//! spaced instants the samples after each anchor depend on the anchor alone, so they are
//! computed eight at a time on the processor's vector lanes (`cursor::even_lanes`; the widest
//! lanes the processor has, chosen at run time, give the same numbers bit for bit). The results equal the scalar ones to
//! 1e-9 rad and the insolation to 1e-9 of the star's flux (property tests over random worlds,
//! places and spans; the azimuth as an arc on the sky, since it has no value at the zenith); the parallel forms give the serial results bit for bit, whatever the number of
//! threads, because their chunks start on the same anchors.
//!
//! No allocation: the output buffers are the caller's.
//!
//! Clear sky and the primary star: a track leaves out what can hide the star (moons, a ring's
//! shadow, the other star of a pair) and a second star's light; ask
//! [`Planet::top_of_atmosphere_insolation_w_m2`] or [`Planet::lighting`] for those.

mod cursor;

use crate::error::QueryError;
use crate::planet::Planet;
use crate::sky::{Place, PreparedPlace, StarPosition};
use crate::widest_vectors::widest_vectors;
use cursor::{ANCHOR_EVERY, Cursor, LANES};

/// Samples per parallel work item: a whole number of anchor blocks, large enough that
/// scheduling costs vanish.
const CHUNK: usize = ANCHOR_EVERY * 64;

/// The instants of a time series, world seconds since time zero.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum TrackTimes<'a> {
    /// `count` instants `start_s + k · step_s`, `k = 0 … count − 1` (the fast form).
    Even {
        /// First instant, s.
        start_s: f64,
        /// Spacing, s (any finite value; negative runs backwards).
        step_s: f64,
        /// Number of instants.
        count: usize,
    },
    /// The given instants, s, in any order; close successive instants are the fastest.
    Given(&'a [f64]),
}

impl TrackTimes<'_> {
    /// Number of instants.
    pub fn len(&self) -> usize {
        match self {
            TrackTimes::Even { count, .. } => *count,
            TrackTimes::Given(t) => t.len(),
        }
    }

    /// `true` when there are no instants.
    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }

    /// Instant `k`, s (`k` below [`TrackTimes::len`]).
    #[inline]
    pub fn time_s(&self, k: usize) -> f64 {
        match self {
            TrackTimes::Even {
                start_s, step_s, ..
            } => start_s + k as f64 * step_s,
            TrackTimes::Given(t) => t[k],
        }
    }

    /// Checks the instants are finite and `out_len` matches their number.
    fn check(&self, out_len: usize) -> Result<(), QueryError> {
        match self {
            TrackTimes::Even {
                start_s, step_s, ..
            } => {
                crate::error::check_arg("start_s", *start_s, f64::MIN, f64::MAX, "finite")?;
                crate::error::check_arg("step_s", *step_s, f64::MIN, f64::MAX, "finite")?;
            }
            TrackTimes::Given(t) => {
                if let Some(bad) = t.iter().find(|x| !x.is_finite()) {
                    return Err(QueryError::OutOfRange {
                        name: "times_s",
                        value: *bad,
                        allowed: "finite",
                    });
                }
            }
        }
        if out_len != self.len() {
            return Err(QueryError::BufferLength {
                needed: self.len(),
                given: out_len,
            });
        }
        Ok(())
    }

    /// The spacing of evenly spaced instants.
    fn step_s(&self) -> Option<f64> {
        match self {
            TrackTimes::Even { step_s, .. } => Some(*step_s),
            TrackTimes::Given(_) => None,
        }
    }
}

impl Planet {
    /// The star seen from `place` at every instant of `times`, written to `out` (one element
    /// per instant): the numbers of [`Planet::star_position`] to 1e-9 rad and the insolation to
    /// 1e-9 of the star's flux, several times faster (module docs).
    ///
    /// Errors: a non-finite instant, or `out.len()` not the number of instants.
    ///
    /// ```
    /// # use insola::{Place, Planet, WorldSpec, StarPosition};
    /// # use insola::star_track::TrackTimes;
    /// # let planet = Planet::new(&WorldSpec::from_ron_str(r#"(
    /// #     name: "Tessary",
    /// #     star: (temperature_k: 5300, radius_r_sun: 0.9, luminosity_l_sun: 0.8),
    /// #     orbit: (semi_major_axis_au: 0.9, eccentricity: 0.03,
    /// #             periapsis_longitude_deg: 70, period_days: 310),
    /// #     spin: (obliquity_deg: 25, solar_day_hours: 26),
    /// # )"#).unwrap()).unwrap();
    /// let place = Place::from_degrees(41.0, -12.0).unwrap();
    /// let times = TrackTimes::Even { start_s: 0.0, step_s: 600.0, count: 144 };
    /// let mut day = vec![planet.star_position(0.0, place); times.len()];
    /// planet.star_track_into(place, times, &mut day).unwrap();
    /// let highest = day.iter().map(|s| s.altitude_rad).fold(f64::MIN, f64::max);
    /// assert!(highest > 0.0);
    /// ```
    pub fn star_track_into(
        &self,
        place: Place,
        times: TrackTimes<'_>,
        out: &mut [StarPosition],
    ) -> Result<(), QueryError> {
        self.run_track(place, times, out, false, Self::positions_block)
    }

    /// Parallel form of [`Planet::star_track_into`] (serial below two chunks of 4096 samples,
    /// where threads would cost more than they save); the same results bit for bit.
    pub fn star_track_par(
        &self,
        place: Place,
        times: TrackTimes<'_>,
        out: &mut [StarPosition],
    ) -> Result<(), QueryError> {
        self.run_track(place, times, out, true, Self::positions_block)
    }

    /// Top-of-atmosphere insolation on a horizontal surface at `place` at every instant of
    /// `times`, W m⁻², written to `out`: [`crate::StarPosition::toa_insolation_w_m2`] to 1e-9
    /// of the star's flux, without the angles (cheaper than [`Planet::star_track_into`]).
    ///
    /// Errors: as [`Planet::star_track_into`].
    pub fn toa_insolation_track_into(
        &self,
        place: Place,
        times: TrackTimes<'_>,
        out: &mut [f64],
    ) -> Result<(), QueryError> {
        self.run_track(place, times, out, false, Self::insolation_block)
    }

    /// Parallel form of [`Planet::toa_insolation_track_into`]; the same results bit for bit.
    pub fn toa_insolation_track_par(
        &self,
        place: Place,
        times: TrackTimes<'_>,
        out: &mut [f64],
    ) -> Result<(), QueryError> {
        self.run_track(place, times, out, true, Self::insolation_block)
    }

    /// The one driver of every track: checks the instants and the buffer, then fills `out` by
    /// `block` (samples `first …` into a slice), in one piece or, when `parallel` and the
    /// track is long enough to pay for threads, in chunks that start on anchor blocks (so the
    /// numbers are the same either way).
    fn run_track<T: Send>(
        &self,
        place: Place,
        times: TrackTimes<'_>,
        out: &mut [T],
        parallel: bool,
        block: fn(&Self, PreparedPlace, &TrackTimes<'_>, usize, &mut [T]),
    ) -> Result<(), QueryError> {
        times.check(out.len())?;
        let place = PreparedPlace::new(place);
        if !parallel || out.len() < 2 * CHUNK {
            block(self, place, &times, 0, out);
        } else {
            crate::parallel::for_each_chunk(out, CHUNK, |c, chunk| {
                block(self, place, &times, c * CHUNK, chunk)
            });
        }
        Ok(())
    }

    /// Samples `first …` of `times` into `out`; `first` is a multiple of the anchor spacing so
    /// that every split gives the same numbers.
    fn positions_block(
        &self,
        place: PreparedPlace,
        times: &TrackTimes<'_>,
        first: usize,
        out: &mut [StarPosition],
    ) {
        positions_widest(self, place, times, first, out);
    }

    /// [`Planet::positions_block`] for the insolation alone.
    fn insolation_block(
        &self,
        place: PreparedPlace,
        times: &TrackTimes<'_>,
        first: usize,
        out: &mut [f64],
    ) {
        let mut cursor = Cursor::new(self, place, times.step_s());
        for (j, o) in out.iter_mut().enumerate() {
            let k = first + j;
            let raw = cursor.sample::<false>(times.time_s(k), k % ANCHOR_EVERY);
            *o = raw.toa_flux_w_m2 * raw.enu.z.max(0.0);
        }
    }
}

widest_vectors! {
    /// [`positions`] with the widest vector lanes this processor has.
    fn positions_widest(
        planet: &Planet,
        place: PreparedPlace,
        times: &TrackTimes<'_>,
        first: usize,
        out: &mut [StarPosition],
    ) => positions;
}

/// Samples `first …` into `out`: evenly spaced samples after each block's anchor [`LANES`] at
/// a time (`cursor::even_lanes`), anchors, given instants and lanes the series cannot take one
/// by one.
#[inline(always)]
fn positions(
    planet: &Planet,
    place: PreparedPlace,
    times: &TrackTimes<'_>,
    first: usize,
    out: &mut [StarPosition],
) {
    let mut cursor = Cursor::new(planet, place, times.step_s());
    let even = times.step_s().is_some();
    let mut j = 0;
    while j < out.len() {
        let k = first + j;
        let in_block = k % ANCHOR_EVERY;
        let left_in_block = (ANCHOR_EVERY - in_block).min(out.len() - j);
        // A group of lanes ending where this run of the block ends; it starts earlier (lanes
        // already written, computed again to the same numbers) when fewer are left.
        let back = LANES.saturating_sub(left_in_block);
        if even && in_block > back && j >= back {
            let start = in_block - back;
            let mut group = [out[j]; LANES];
            let mut ok = [false; LANES];
            cursor.even_lanes(start, &mut group, &mut ok);
            let taken = LANES - back;
            for lane in back..LANES {
                out[j + lane - back] = if ok[lane] {
                    group[lane]
                } else {
                    let raw = cursor.sample::<true>(times.time_s(k + lane - back), start + lane);
                    cursor.position(raw)
                };
            }
            j += taken;
        } else {
            let raw = cursor.sample::<true>(times.time_s(k), in_block);
            out[j] = cursor.position(raw);
            j += 1;
        }
    }
}

#[cfg(test)]
mod tests;
