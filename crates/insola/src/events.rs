//! Events of a local day: rise, set, transit and the three twilights, and the day length.
//!
//! The search samples the star's height over the local day and refines each crossing by
//! bisection, so it works for any world: fast and slow rotators, days longer than the year,
//! eccentric orbits whose star lingers. A crossing shorter than the sampling step can be missed;
//! the step is a fraction of the day (see [`EVENT_SAMPLES_PER_DAY`]).
//!
//! For every event over any interval (moons, eclipses, phases, seasons as well), in time
//! order, see [`crate::sky_events`]; the twilight bands are [`crate::light::TwilightBand`].

use serde::{Deserialize, Serialize};

use crate::light::TwilightBand;
use crate::planet::Planet;
pub use crate::search::Crossing;
use crate::search::{crossings_of, refine_change};
use crate::sky::Place;

/// Samples of the star's height per local day used to find crossings.
pub const EVENT_SAMPLES_PER_DAY: usize = 480;

/// The star stays above (or below) a threshold for the whole local day.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum Polar {
    /// Never sets during this local day.
    Day,
    /// Never rises during this local day.
    Night,
}

/// The crossings of one altitude threshold during a local day.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct Crossings {
    /// First upward crossing (world seconds since time zero), if any.
    pub rise_s: Option<f64>,
    /// Last downward crossing, if any.
    pub set_s: Option<f64>,
    /// Time above the threshold during the day, seconds.
    pub time_above_s: f64,
    /// Set when there is no crossing: above all day, or below all day.
    pub polar: Option<Polar>,
}

/// Events of one local day at one place.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct DayEvents {
    /// Start of the local day (local mean midnight), world seconds.
    pub day_start_s: f64,
    /// Length of the local day, seconds.
    pub day_length_s: f64,
    /// Upper transit (star on the meridian), if it happens this day.
    pub transit_s: Option<f64>,
    /// Altitude of the star's centre at transit, radians.
    pub transit_altitude_rad: Option<f64>,
    /// Rise and set at the standard altitude (refraction and disc included).
    pub sunlight: Crossings,
    /// Dawn and dusk of civil twilight (−6°).
    pub civil: Crossings,
    /// Dawn and dusk of nautical twilight (−12°).
    pub nautical: Crossings,
    /// Dawn and dusk of astronomical twilight (−18°).
    pub astronomical: Crossings,
}

impl DayEvents {
    /// Converts a world time of this day to hours since local mean midnight.
    pub fn local_hours(&self, t_s: f64) -> f64 {
        (t_s - self.day_start_s) / 3600.0
    }
}

impl Planet {
    /// Events of local day `day` (day 0 contains time zero at the prime meridian) at `place`.
    ///
    /// On a tidally locked world the "day" is the sidereal day (the year).
    pub fn day_events(&self, day: i64, place: Place) -> DayEvents {
        let start = self.local_day_start_s(day as f64, place.longitude_rad);
        self.events_between(start, self.day_s(), place)
    }

    /// Events in the window `[start_s, start_s + length_s)` at `place`.
    pub fn events_between(&self, start_s: f64, length_s: f64, place: Place) -> DayEvents {
        let n = EVENT_SAMPLES_PER_DAY;
        let step = length_s / n as f64;
        let times: Vec<f64> = (0..=n).map(|i| start_s + i as f64 * step).collect();
        let alts: Vec<f64> = times
            .iter()
            .map(|&t| self.star_position(t, place).altitude_rad)
            .collect();
        let alt_at = |t: f64| self.star_position(t, place).altitude_rad;
        let crossings = |h: f64| find_crossings(&times, &alts, h, &alt_at);
        let (transit_s, transit_altitude_rad) = match self.find_transit(&times, place) {
            Some(t) => (Some(t), Some(alt_at(t))),
            None => (None, None),
        };
        DayEvents {
            day_start_s: start_s,
            day_length_s: length_s,
            transit_s,
            transit_altitude_rad,
            sunlight: crossings(self.standard_rise_altitude_rad()),
            civil: crossings(TwilightBand::Civil.lower_limit_rad()),
            nautical: crossings(TwilightBand::Nautical.lower_limit_rad()),
            astronomical: crossings(TwilightBand::Astronomical.lower_limit_rad()),
        }
    }

    /// Upper transit: the hour angle passes from negative to positive through zero.
    fn find_transit(&self, times: &[f64], place: Place) -> Option<f64> {
        let ha = |t: f64| self.star_position(t, place).hour_angle_rad;
        let mut prev = ha(times[0]);
        // Sampled as the event finder's transit: last instant at or before zero.
        for w in times.windows(2) {
            let next = ha(w[1]);
            // A wrap from +π to −π is not a transit; a small step through zero is.
            if prev <= 0.0 && next > 0.0 && next - prev < std::f64::consts::PI {
                return Some(refine_change(w[0], w[1], false, &mut |t| ha(t) > 0.0));
            }
            prev = next;
        }
        None
    }
}

impl Planet {
    /// Every crossing of `threshold_rad` by the star's centre at `place` reported in
    /// `[t0_s, t1_s)` (each passage in `(t0_s, t1_s]`, so consecutive intervals report it
    /// once), in time order. Samples at most every 1/96 of a day, so a long interval (a fast-running
    /// clock) still yields each sunrise and sunset once; appends to `out` (no allocation when
    /// `out` has room).
    pub fn altitude_crossings_into(
        &self,
        place: Place,
        t0_s: f64,
        t1_s: f64,
        threshold_rad: f64,
        out: &mut Vec<Crossing>,
    ) {
        let max_step = self.day_s().min(self.year_s()) / 96.0;
        let f = |t: f64| self.star_position(t, place).altitude_rad - threshold_rad;
        crossings_of(&f, t0_s, t1_s, max_step, out);
    }
}

fn find_crossings(times: &[f64], alts: &[f64], h: f64, alt_at: &dyn Fn(f64) -> f64) -> Crossings {
    let mut rise = None;
    let mut set = None;
    let mut above_s = 0.0;
    let mut any = false;
    for i in 0..times.len() - 1 {
        let (a0, a1) = (alts[i] - h, alts[i + 1] - h);
        let (t0, t1) = (times[i], times[i + 1]);
        if (a0 >= 0.0) == (a1 >= 0.0) {
            if a0 >= 0.0 {
                above_s += t1 - t0;
            }
            continue;
        }
        any = true;
        let t = refine_change(t0, t1, a0 >= 0.0, &mut |t| alt_at(t) - h >= 0.0);
        if a1 >= 0.0 {
            rise.get_or_insert(t);
            above_s += t1 - t;
        } else {
            set = Some(t);
            above_s += t - t0;
        }
    }
    let polar = if any {
        None
    } else if alts[0] >= h {
        Some(Polar::Day)
    } else {
        Some(Polar::Night)
    };
    Crossings {
        rise_s: rise,
        set_s: set,
        time_above_s: above_s,
        polar,
    }
}
