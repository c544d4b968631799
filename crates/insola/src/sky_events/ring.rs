//! The ring's events: its shadow entering and leaving a place, and the star crossing the ring
//! plane.
//!
//! - **Shadow**: a place is in the ring's shadow while the ring passes less than
//!   [`crate::rings::RING_SHADOW_THRESHOLD`] (half) of the star's beam there
//!   ([`crate::rings::RingShadow::is_shadowed`], the one rule the almanac uses too). The state
//!   is sampled every 1/192 of the shorter of the day and the year and each change refined by
//!   bisection, as the star's events are; a shadow (or a gap in one) shorter than a sample can
//!   be missed. [`SkyEventKind::RingShadow`] names the annulus: the one entered, or the one
//!   just left.
//! - **Ring-plane crossing**: the ring lies in the equatorial plane, so the star crosses it
//!   where its declination passes zero, at the equinoxes; reported at the equinoxes' exact
//!   instants ([`Planet::time_of_season_mark`]), the same for every place. There the lit face
//!   of the ring changes and the shadow leaves one hemisphere for the other.

use super::kind::{RingShadowStage, SkyEvent, SkyEventKind};
use crate::planet::Planet;
use crate::search::{Grid, refine_change};
use crate::seasons::SeasonMark;
use crate::sky::Place;

impl Planet {
    /// Sampling step of the ring's shadow, seconds: 1/192 of the shorter of the day and year.
    pub(crate) fn ring_shadow_step_s(&self) -> f64 {
        self.day_s().min(self.year_s()) / 192.0
    }

    /// The annulus casting a shadow (transmission below the threshold) at `place` and `t_s`.
    fn ring_shadow_state(&self, t_s: f64, place: Place) -> Option<usize> {
        let shadow = self.ring_shadow(&self.star_instant(t_s), place);
        shadow.annulus.filter(|_| shadow.is_shadowed())
    }

    /// The ring's shadow entering and leaving `place` in `[from_s, to_s)`.
    pub(super) fn ring_shadow_events_into(
        &self,
        place: Place,
        from_s: f64,
        to_s: f64,
        out: &mut Vec<SkyEvent>,
    ) {
        if !self.has_ring_shadow() {
            return;
        }
        let grid = Grid::new(from_s, to_s, self.ring_shadow_step_s());
        let mut a = self.ring_shadow_state(from_s, place);
        for (ta, tb) in grid.steps() {
            let b = self.ring_shadow_state(tb, place);
            if a.is_some() != b.is_some() {
                let old = a.is_some();
                let at_s = refine_change(ta, tb, old, &mut |t| {
                    self.ring_shadow_state(t, place).is_some()
                });
                let (stage, annulus) = match (a, b) {
                    (None, _) => (
                        RingShadowStage::Enters,
                        self.ring_shadow_state(at_s + crate::search::EVENT_TIME_TOLERANCE_S, place)
                            .or(b),
                    ),
                    (Some(i), _) => (RingShadowStage::Leaves, Some(i)),
                };
                out.push(SkyEvent {
                    at_s,
                    kind: SkyEventKind::RingShadow {
                        stage,
                        annulus: annulus.unwrap_or(0),
                    },
                });
            }
            a = b;
        }
    }

    /// The star crossing the ring plane in `[from_s, to_s)` (the equinoxes; nothing on a
    /// world without a ring that casts a shadow: a transparent ring changes nothing).
    pub(super) fn ring_plane_crossings_into(
        &self,
        from_s: f64,
        to_s: f64,
        out: &mut Vec<SkyEvent>,
    ) {
        if !self.has_ring_shadow() {
            return;
        }
        for (mark, northward) in [
            (SeasonMark::NorthwardEquinox, true),
            (SeasonMark::SouthwardEquinox, false),
        ] {
            let mut at_s = self.time_of_season_mark(mark, from_s);
            while at_s < to_s {
                out.push(SkyEvent {
                    at_s,
                    kind: SkyEventKind::RingPlaneCrossing { northward },
                });
                let next = self.time_of_season_mark(mark, at_s + 0.5 * self.year_s());
                if next <= at_s {
                    break;
                }
                at_s = next;
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::sky_events::{EventFilter, EventGroup};

    fn thalcary() -> Planet {
        crate::rings::tests::thalcary()
    }

    #[test]
    fn shadow_events_bracket_the_geometric_shadow() {
        // Around the southern winter solstice at 30°S the dense band's shadow crosses the place
        // every day; each event sits within the tolerance before the state changes, and the
        // state between an entry and the next exit is shadowed (checked on the geometry).
        let p = thalcary();
        let place = Place::from_degrees(-30.0, 40.0).unwrap();
        let t0 = p.time_of_season_mark(SeasonMark::NorthernSolstice, 0.0);
        let filter = EventFilter::only([EventGroup::RingShadow]);
        let events = p
            .sky_events_between(place, t0, t0 + 5.0 * p.day_s(), &filter)
            .unwrap();
        assert!(events.len() >= 8, "{events:?}");
        let tol = crate::search::EVENT_TIME_TOLERANCE_S;
        for pair in events.windows(2) {
            let (a, b) = (pair[0], pair[1]);
            let SkyEventKind::RingShadow { stage, .. } = a.kind else {
                panic!("{a:?}");
            };
            let inside = stage == RingShadowStage::Enters;
            // Just after each event the new state holds; just before, the old.
            assert_eq!(
                p.ring_shadow_state(a.at_s + 2.0 * tol, place).is_some(),
                inside
            );
            assert_eq!(p.ring_shadow_state(a.at_s, place).is_some(), !inside);
            // Midway to the next event the state is the new one; entries and exits alternate.
            let mid = 0.5 * (a.at_s + b.at_s);
            assert_eq!(p.ring_shadow_state(mid, place).is_some(), inside);
            let SkyEventKind::RingShadow { stage: next, .. } = b.kind else {
                panic!("{b:?}");
            };
            assert_ne!(stage, next);
        }
        // Each shadow lasts as the closed form says: at latitude φ with declination δ the ray
        // meets the ring plane at ρ² = R² cos² φ + 2 R k cos φ cos h + k², k = R|sin φ| cot δ
        // (see `rings::daily_mean`), so it is under the dense band (inner edge r = 12 500 km,
        // the only annulus below the threshold) while cos h > (r² − R² cos² φ − k²)/(2 R k cos φ):
        // for 2·acos(that)/2π of a solar day (the declination barely moves in a day).
        let (r_planet, r_edge) = (p.body().radius_km, 12_500.0);
        let phi = place.latitude_rad;
        let mut spans = 0;
        for pair in events.windows(2) {
            if let (
                SkyEventKind::RingShadow {
                    stage: RingShadowStage::Enters,
                    annulus: 1,
                },
                SkyEventKind::RingShadow {
                    stage: RingShadowStage::Leaves,
                    annulus: 1,
                },
            ) = (pair[0].kind, pair[1].kind)
            {
                let d = p
                    .star_instant(0.5 * (pair[0].at_s + pair[1].at_s))
                    .declination_rad;
                let k = r_planet * phi.sin().abs() / d.tan();
                let c = (r_edge * r_edge - (r_planet * phi.cos()).powi(2) - k * k)
                    / (2.0 * r_planet * k * phi.cos());
                let want = 2.0 * c.acos() / std::f64::consts::TAU * p.day_s();
                let got = pair[1].at_s - pair[0].at_s;
                assert!((got - want).abs() < 1e-2 * want, "{got} vs {want}");
                spans += 1;
            }
        }
        assert!(spans >= 4);
        // Splitting the interval gives the same events, to the tolerance (the grids differ).
        let mid = t0 + 2.3 * p.day_s();
        let mut split = p.sky_events_between(place, t0, mid, &filter).unwrap();
        split.extend(
            p.sky_events_between(place, mid, t0 + 5.0 * p.day_s(), &filter)
                .unwrap(),
        );
        assert_eq!(split.len(), events.len());
        for (a, b) in split.iter().zip(&events) {
            assert_eq!(a.kind, b.kind);
            assert!((a.at_s - b.at_s).abs() <= tol, "{a:?} vs {b:?}");
        }
        // In summer the same place is never in the shadow.
        let t1 = p.time_of_season_mark(SeasonMark::SouthernSolstice, 0.0);
        let summer = p
            .sky_events_between(place, t1, t1 + 5.0 * p.day_s(), &filter)
            .unwrap();
        assert!(summer.is_empty(), "{summer:?}");
    }

    #[test]
    fn the_star_crosses_the_ring_plane_at_zero_declination() {
        let p = thalcary();
        let place = Place::from_degrees(10.0, 0.0).unwrap();
        let filter = EventFilter::only([EventGroup::RingPlane]);
        let events = p
            .sky_events_between(place, 0.0, 3.0 * p.year_s(), &filter)
            .unwrap();
        assert_eq!(events.len(), 6, "{events:?}");
        for e in &events {
            let SkyEventKind::RingPlaneCrossing { northward } = e.kind else {
                panic!("{e:?}");
            };
            // The declination passes zero there, in the stated direction (the geometry, not the
            // season marks: the ring plane is the equatorial plane).
            let d = |t: f64| p.star_instant(t).declination_rad;
            assert!(d(e.at_s).abs() < 1e-9, "{}", d(e.at_s));
            assert_eq!(d(e.at_s + 3600.0) > d(e.at_s - 3600.0), northward);
            // The lit face changes across it.
            let before = p.ring_view(e.at_s - 3600.0, place).unwrap().lit_face;
            let after = p.ring_view(e.at_s + 3600.0, place).unwrap().lit_face;
            assert_ne!(before, after);
        }
        // A ringless world has neither kind.
        let mut spec = p.spec().clone();
        spec.ring = None;
        let bare = Planet::new(&spec).unwrap();
        let all = EventFilter::only([EventGroup::RingPlane, EventGroup::RingShadow]);
        assert!(
            bare.sky_events_between(place, 0.0, p.year_s(), &all)
                .unwrap()
                .is_empty()
        );
    }
}
