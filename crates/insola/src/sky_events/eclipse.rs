//! Eclipses: of the star by each occluder at a place (through the occlusion seam), and of each
//! moon by the planet's shadow. Both walk along a clearance — the angular gap between two
//! discs, negative while they overlap — with a bound on its rate.

use super::filter::EventFilter;
use super::kind::{EclipseStage, SkyBody, SkyEvent};
use crate::occlusion::{Occluder, OccluderMotion};
use crate::planet::Planet;
use crate::search::{refine_change, walk_to_sign_change};
use crate::sky::Place;
use crate::sky_events::{EVENT_TIME_TOLERANCE_S, SkyEventKind};

/// The smallest walking step as a fraction of the shortest central eclipse (common practice,
/// no source): an eclipse shorter than this fraction of it can be missed.
const MIN_STEP_FRACTION: f64 = 1e-3;

/// Half-width of the central difference that tells falling from rising clearance, seconds.
const SLOPE_HALF_WIDTH_S: f64 = 0.5;

/// One eclipse found by the walk: its begin and end, where known within the walk's reach.
struct Span {
    begins_s: Option<f64>,
    ends_s: Option<f64>,
}

/// Every eclipse (interval where `clearance < 0`) that touches `[from_s, to_s)`, with each
/// stage reported when it falls in the interval: `emit(at_s, stage)`. `fraction` gives the
/// hidden fraction at an instant, for the greatest stage.
fn eclipses(
    from_s: f64,
    to_s: f64,
    motion: OccluderMotion,
    clearance: &dyn Fn(f64) -> f64,
    fraction: &dyn Fn(f64) -> f64,
    emit: &mut dyn FnMut(f64, EclipseStage),
) {
    let rate = motion.max_rate_rad_s;
    if !(rate.is_finite() && rate > 0.0) {
        return;
    }
    let min_step = (MIN_STEP_FRACTION * motion.min_contact_rad / rate).max(EVENT_TIME_TOLERANCE_S);
    let reach = motion.longest_s.max(min_step);
    let mut g = |t: f64| clearance(t);
    let inside = |t: f64| clearance(t) < 0.0;
    let mut spans = Vec::new();
    let mut t = from_s;
    let mut begins_s = if inside(from_s) {
        // Already in an eclipse: find where it began, for its greatest stage.
        walk_to_sign_change(from_s, from_s - reach, rate, min_step, &mut g).map(
            |(still_inside, outside)| {
                refine_change(outside, still_inside, false, &mut |t| inside(t))
            },
        )
    } else {
        let (a, b) = match walk_to_sign_change(from_s, to_s, rate, min_step, &mut g) {
            Some(bracket) => bracket,
            None => return,
        };
        t = b;
        Some(refine_change(a, b, false, &mut |t| inside(t)))
    };
    loop {
        // `t` is inside an eclipse; walk to its end, first within the interval (so `to_s` is
        // sampled and an end after it is left to the next interval), then beyond for the
        // greatest stage.
        let within = walk_to_sign_change(t, to_s, rate, min_step, &mut g);
        let Some((a, b)) = within else {
            let ends_s = walk_to_sign_change(to_s, to_s + reach, rate, min_step, &mut g)
                .map(|(a, b)| refine_change(a, b, true, &mut |t| inside(t)));
            spans.push(Span { begins_s, ends_s });
            break;
        };
        let ends_s = refine_change(a, b, true, &mut |t| inside(t));
        spans.push(Span {
            begins_s,
            ends_s: Some(ends_s),
        });
        match walk_to_sign_change(b, to_s, rate, min_step, &mut g) {
            Some((a, b2)) => {
                begins_s = Some(refine_change(a, b2, false, &mut |t| inside(t)));
                t = b2;
            }
            None => break,
        }
    }
    let in_interval = |t: f64| t >= from_s && t < to_s;
    // Clearance rising (the centres moving apart) at `t`.
    let receding = |t: f64| clearance(t + SLOPE_HALF_WIDTH_S) > clearance(t - SLOPE_HALF_WIDTH_S);
    for span in spans {
        if let Some(t) = span.begins_s.filter(|&t| in_interval(t)) {
            emit(t, EclipseStage::Begins);
        }
        // Greatest: where the clearance turns from falling to rising, sampled at the span's
        // ends clipped to the interval so that consecutive intervals agree.
        let lo = span.begins_s.map_or(from_s, |b| b.max(from_s));
        let hi = span.ends_s.map_or(to_s, |e| e.min(to_s));
        if hi > lo && !receding(lo) && receding(hi) {
            let t = refine_change(lo, hi, false, &mut |t| receding(t));
            emit(
                t,
                EclipseStage::Greatest {
                    fraction: fraction(t),
                },
            );
        }
        if let Some(t) = span.ends_s.filter(|&t| in_interval(t)) {
            emit(t, EclipseStage::Ends);
        }
    }
}

impl Planet {
    /// Eclipses of each shining star at `place` in `[from_s, to_s)` by every occluder
    /// `filter` follows (moons by index, the other star), through the occlusion seam; star 0
    /// first, each star's occluders in [`Planet::occluders`] order.
    pub(super) fn star_eclipses_into(
        &self,
        place: Place,
        from_s: f64,
        to_s: f64,
        filter: &EventFilter,
        out: &mut Vec<SkyEvent>,
    ) {
        let occluders: Vec<_> = self.occluders().collect();
        for star in self.shining_stars() {
            for &by in &occluders {
                let followed = match by {
                    Occluder::Moon(i) => filter.follows(SkyBody::Moon(i)),
                    Occluder::Star(k) => filter.follows(SkyBody::Star(k)),
                };
                let Some(motion) = self.occluder_motion_against(by, star).filter(|_| followed)
                else {
                    continue;
                };
                let instant = |t: f64| {
                    self.star_instant_of(star, t)
                        .unwrap_or_else(|| self.star_instant(t))
                };
                let clearance = |t: f64| self.occluder_clearance_rad(by, &instant(t), place);
                let fraction = |t: f64| self.occluder_cover(by, &instant(t), place);
                eclipses(
                    from_s,
                    to_s,
                    motion,
                    &clearance,
                    &fraction,
                    &mut |at_s, stage| {
                        out.push(SkyEvent {
                            at_s,
                            kind: SkyEventKind::StarEclipse { star, by, stage },
                        })
                    },
                );
            }
        }
    }

    /// Eclipses of moon `moon` by the planet's shadow in `[from_s, to_s)` (the same for every
    /// place).
    pub(super) fn moon_eclipses_into(
        &self,
        moon: usize,
        from_s: f64,
        to_s: f64,
        out: &mut Vec<SkyEvent>,
    ) {
        let Some(motion) = self.moon_shadow_motion(moon) else {
            return;
        };
        let clearance = |t: f64| self.moon_shadow_clearance_rad(moon, t);
        let fraction = |t: f64| {
            let orbit = &self.moon_orbits()[moon];
            let instant = self.star_instant(t);
            let g = self.shadow_geometry(&instant, orbit.position_at(t));
            crate::light::moon_shadow_dimming(
                g.star_radius_rad,
                g.planet_radius_rad,
                g.separation_rad,
            )
        };
        eclipses(
            from_s,
            to_s,
            motion,
            &clearance,
            &fraction,
            &mut |at_s, stage| {
                out.push(SkyEvent {
                    at_s,
                    kind: SkyEventKind::MoonEclipse { moon, stage },
                })
            },
        );
    }
}
