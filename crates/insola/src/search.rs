//! The search primitives every event search shares: an even sample grid, bisection of a state
//! change, threshold crossings, and a bounded-rate walk toward a zero. A leaf module: the
//! searches in `events`, `moons` and `sky_events` all build on it.
//!
//! A state change between two samples is refined by bisection until the bracket is at most
//! [`EVENT_TIME_TOLERANCE_S`] wide; the reported instant is the bracket's lower end, the last
//! instant found in the old state. So an event lies within the tolerance *before* the change it
//! marks, and for an interval `[from, to)` whose ends are sampled, every change in `(from, to]`
//! is reported once, at an instant in `[from, to)`: consecutive intervals report each change
//! exactly once.

use serde::{Deserialize, Serialize};

/// Largest error of an event's instant, seconds: bisection stops when the bracket is this
/// narrow (or cannot be split in `f64`), and reports its lower end.
pub const EVENT_TIME_TOLERANCE_S: f64 = 1e-3;

/// Sample intervals covering `[from, to]` in `n` equal steps of at most `max_step`; the last
/// interval ends exactly at `to`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Grid {
    from: f64,
    to: f64,
    n: usize,
}

impl Grid {
    /// The grid for `[from, to]`; callers check `to > from`, finite values and the sample count
    /// (see [`Grid::count`]) first.
    pub(crate) fn new(from: f64, to: f64, max_step: f64) -> Grid {
        Grid {
            from,
            to,
            n: Grid::count(from, to, max_step).max(1.0) as usize,
        }
    }

    /// Number of samples a grid of at most `max_step` over `[from, to]` needs (may be huge or
    /// infinite: check it before building).
    pub(crate) fn count(from: f64, to: f64, max_step: f64) -> f64 {
        ((to - from) / max_step).ceil()
    }

    /// The `i`-th sample time, `0 ..= n`.
    pub(crate) fn time(&self, i: usize) -> f64 {
        if i >= self.n {
            self.to
        } else {
            self.from + (self.to - self.from) * (i as f64 / self.n as f64)
        }
    }

    /// Consecutive sample pairs `(ta, tb)` from `from` to `to`.
    pub(crate) fn steps(&self) -> impl Iterator<Item = (f64, f64)> + '_ {
        (0..self.n).map(|i| (self.time(i), self.time(i + 1)))
    }
}

/// The last instant in `[lo, hi)` at which `state` still reads `old`, within
/// [`EVENT_TIME_TOLERANCE_S`] before the change; `state(lo)` must be `old` and `state(hi)` not.
pub(crate) fn refine_change(
    mut lo: f64,
    mut hi: f64,
    old: bool,
    state: &mut dyn FnMut(f64) -> bool,
) -> f64 {
    for _ in 0..200 {
        if hi - lo <= EVENT_TIME_TOLERANCE_S {
            break;
        }
        let mid = 0.5 * (lo + hi);
        if mid <= lo || mid >= hi {
            break;
        }
        if state(mid) == old {
            lo = mid
        } else {
            hi = mid
        }
    }
    lo
}

/// Walks from `t` toward `limit` (either direction) over a quantity `g` whose rate of change
/// is at most `max_rate` per second, and returns the last sampled instant still on the side of
/// zero `g` has at `t` (the sides are `g < 0` and `g >= 0`) with the first sampled instant
/// past it, or `None` if `g` stays on its side up to `limit` (which is sampled). Each step is `|g| / max_rate` — `g` cannot change sign sooner — but at least
/// `min_step`, so a sign change lasting less than `min_step` can be stepped over.
pub(crate) fn walk_to_sign_change(
    t: f64,
    limit: f64,
    max_rate: f64,
    min_step: f64,
    g: &mut dyn FnMut(f64) -> f64,
) -> Option<(f64, f64)> {
    let dir = if limit >= t { 1.0 } else { -1.0 };
    let mut at = t;
    let mut value = g(t);
    let negative = value < 0.0;
    loop {
        if (limit - at) * dir <= 0.0 {
            return None;
        }
        let step = (value.abs() / max_rate).max(min_step);
        let next = if (limit - at) * dir <= step {
            limit
        } else {
            at + dir * step
        };
        value = g(next);
        if (value < 0.0) != negative {
            return Some((at, next));
        }
        at = next;
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn grid_ends_exactly_and_refine_reports_the_old_side() {
        let g = Grid::new(10.0, 20.0, 3.0);
        let steps: Vec<_> = g.steps().collect();
        assert_eq!(steps.len(), 4);
        assert_eq!(steps[0].0, 10.0);
        assert_eq!(steps[3].1, 20.0);
        let t = refine_change(10.0, 20.0, false, &mut |t| t > 12.345_678);
        assert!(
            t <= 12.345_678 && 12.345_678 - t <= EVENT_TIME_TOLERANCE_S,
            "{t}"
        );
    }

    #[test]
    fn the_walk_never_steps_over_a_change_it_can_see() {
        // g = |t − 50| − 1 with rate 1: the sign changes at 49; the walk must bracket it.
        let mut g = |t: f64| (t - 50.0).abs() - 1.0;
        let (a, b) = walk_to_sign_change(0.0, 100.0, 1.0, 1e-6, &mut g).unwrap();
        assert!(a <= 49.0 && b >= 49.0 && b - a < 1.0, "{a} {b}");
        // Backwards from inside the dip, to where it began.
        let (a, b) = walk_to_sign_change(50.0, 0.0, 1.0, 1e-6, &mut g).unwrap();
        assert!(b <= 49.0 && a >= 49.0, "{a} {b}");
        assert!(walk_to_sign_change(60.0, 100.0, 1.0, 1e-6, &mut g).is_none());
    }
}

/// One passage through an altitude threshold: the last instant on the old side, within
/// [`EVENT_TIME_TOLERANCE_S`] of the passage.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct Crossing {
    /// World time of the crossing, seconds since time zero.
    pub t_s: f64,
    /// `true` when the body goes above the threshold (strictly: the "is up" rule), `false`
    /// when it goes back to it or below.
    pub rising: bool,
}

/// Every sign change of `f` (positive or not) between samples at most `max_step` apart over
/// `[t0_s, t1_s]`, each reported at the last instant before it (so in `[t0_s, t1_s)`); `rising`
/// when `f` turns positive. Deterministic: the value at an interval's end is the value at the
/// next interval's start, so consecutive intervals report each crossing exactly once.
pub(crate) fn crossings_of(
    f: &dyn Fn(f64) -> f64,
    t0_s: f64,
    t1_s: f64,
    max_step: f64,
    out: &mut Vec<Crossing>,
) {
    // Written to reject NaN as well as empty intervals.
    if t1_s.partial_cmp(&t0_s) != Some(std::cmp::Ordering::Greater)
        || max_step.partial_cmp(&0.0) != Some(std::cmp::Ordering::Greater)
    {
        return;
    }
    let grid = Grid::new(t0_s, t1_s, max_step.max((t1_s - t0_s) / 1.0e7));
    let mut a = f(t0_s) > 0.0;
    for (ta, tb) in grid.steps() {
        let b = f(tb) > 0.0;
        if a != b {
            out.push(Crossing {
                t_s: refine_change(ta, tb, a, &mut |t| f(t) > 0.0),
                rising: b,
            });
        }
        a = b;
    }
}

/// How fast an occluder can move against the star: what the event finder needs to walk
/// toward an eclipse without stepping over it.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct OccluderMotion {
    /// Upper bound on the rate of change of [`crate::Planet::occluder_clearance_rad`], rad/s.
    pub max_rate_rad_s: f64,
    /// Smallest sum of the two discs' angular radii, radians: the scale of the shortest
    /// eclipse.
    pub min_contact_rad: f64,
    /// Longest an eclipse could last, seconds (the occluder's synodic period, at most a year).
    pub longest_s: f64,
}
