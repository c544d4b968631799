//! Event finder checks on invented worlds: order, interval, splitting, agreement with the
//! lighting state, eclipses, phases, errors.

use super::*;
use crate::error::QueryError;
use crate::light::TwilightBand;
use crate::lighting::LightMode;
use crate::occlusion::Occluder;
use crate::{Place, Planet, WorldSpec};

/// A moon as large in the sky as the star, new at time zero in the ecliptic (invented).
fn shaded_world() -> Planet {
    let text = r#"(name: "Umbrel", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
        orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 360),
        spin: (obliquity_deg: 0, solar_day_hours: 24),
        moons: [(name: "Shade", radius_km: 1800, distance_km: 380000, period_days: 27, phase_at_zero_deg: 0)])"#;
    Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
}

/// A tilted, eccentric world with a slow and a fast inclined moon (invented).
fn busy_world() -> Planet {
    let text = r#"(name: "Quillon", star: (temperature_k: 5300, radius_r_sun: 0.9, luminosity_l_sun: 0.7),
        orbit: (semi_major_axis_au: 0.85, eccentricity: 0.06, periapsis_longitude_deg: 40, period_days: 280),
        spin: (obliquity_deg: 28, solar_day_hours: 21),
        moons: [
            (name: "Brann", radius_km: 1500, distance_km: 350000, period_days: 25, inclination_deg: 3, phase_at_zero_deg: 80),
            (name: "Pip", radius_km: 300, distance_km: 60000, period_days: 0.9, inclination_deg: 1.5, ascending_node_deg: 70, phase_at_zero_deg: 10),
        ])"#;
    Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
}

fn all(p: &Planet, place: Place, from: f64, to: f64) -> Vec<SkyEvent> {
    p.sky_events_between(place, from, to, &EventFilter::all())
        .unwrap()
}

#[test]
fn events_are_sorted_inside_the_interval_and_splitting_changes_nothing() {
    let p = busy_world();
    let place = Place::from_degrees(35.0, 20.0).unwrap();
    let (from, to) = (1.0e5, 1.0e5 + 20.0 * p.day_s());
    let whole = all(&p, place, from, to);
    assert!(whole.len() > 300, "{}", whole.len());
    assert!(whole.windows(2).all(|w| w[0].at_s <= w[1].at_s));
    assert!(whole.iter().all(|e| e.at_s >= from && e.at_s < to));
    // Cut at uneven places, including one just after an event.
    let cut1 = whole[57].at_s + 2e-4;
    let cut2 = from + 13.37 * p.day_s();
    let mut parts = all(&p, place, from, cut1);
    parts.extend(all(&p, place, cut1, cut2));
    parts.extend(all(&p, place, cut2, to));
    assert_eq!(parts.len(), whole.len());
    for (a, b) in parts.iter().zip(&whole) {
        assert_eq!(a.kind.group(), b.kind.group());
        assert!(
            (a.at_s - b.at_s).abs() <= 2.0 * EVENT_TIME_TOLERANCE_S,
            "{a} / {b}"
        );
    }
}

#[test]
fn the_star_rises_where_its_light_turns_on_and_the_moons_too() {
    let p = busy_world();
    let place = Place::from_degrees(-20.0, 100.0).unwrap();
    let filter = EventFilter::only([EventGroup::RiseSet]);
    let events = p
        .sky_events_between(place, 0.0, 4.0 * p.day_s(), &filter)
        .unwrap();
    let mut moons_seen = 0;
    for e in &events {
        let (body, rises) = match e.kind {
            SkyEventKind::Rise(b) => (b, true),
            SkyEventKind::Set(b) => (b, false),
            _ => unreachable!(),
        };
        let up = |t: f64| {
            let l = p.lighting(t, place, LightMode::Ground);
            match body {
                SkyBody::Star(_) => l.star.is_up,
                SkyBody::Moon(i) => l.moons[i].light.is_up,
            }
        };
        if let SkyBody::Moon(_) = body {
            moons_seen += 1;
        }
        // Old state at the event, new state within the tolerance after it.
        assert_eq!(up(e.at_s), !rises, "{e}");
        assert_eq!(up(e.at_s + EVENT_TIME_TOLERANCE_S * 1.01), rises, "{e}");
    }
    assert!(moons_seen >= 4, "{moons_seen}");
}

#[test]
fn twilight_boundaries_follow_the_phase() {
    let p = busy_world();
    let place = Place::from_degrees(50.0, -30.0).unwrap();
    let filter = EventFilter::only([EventGroup::Twilight]);
    let events = p
        .sky_events_between(place, 0.0, 3.0 * p.day_s(), &filter)
        .unwrap();
    assert_eq!(events.len(), 18, "{events:?}");
    for e in events {
        let phase = |t: f64| p.lighting(t, place, LightMode::Ground).twilight;
        let (before, after) = match e.kind {
            SkyEventKind::Dawn(b) => (b.phase_below(), b.phase()),
            SkyEventKind::Dusk(b) => (b.phase(), b.phase_below()),
            _ => unreachable!(),
        };
        assert_eq!(phase(e.at_s), before, "{e}");
        assert_eq!(phase(e.at_s + 1.01 * EVENT_TIME_TOLERANCE_S), after, "{e}");
    }
}

#[test]
fn the_eclipse_at_time_zero_has_three_stages() {
    let p = shaded_world();
    let place = Place::from_degrees(0.0, 180.0).unwrap();
    let filter = EventFilter::only([EventGroup::StarEclipse]);
    let events = p
        .sky_events_between(place, -6.0 * 3600.0, 6.0 * 3600.0, &filter)
        .unwrap();
    let stages: Vec<_> = events
        .iter()
        .map(|e| match e.kind {
            SkyEventKind::StarEclipse { star: 0, by, stage } => {
                assert_eq!(by, Occluder::Moon(0));
                stage
            }
            _ => unreachable!(),
        })
        .collect();
    assert_eq!(stages.len(), 3, "{events:?}");
    assert_eq!(stages[0], EclipseStage::Begins);
    assert_eq!(stages[2], EclipseStage::Ends);
    let EclipseStage::Greatest { fraction } = stages[1] else {
        panic!("{stages:?}")
    };
    assert!(fraction > 0.99, "{fraction}");
    assert!(events[0].at_s < 0.0 && events[2].at_s > 0.0);
    // The greatest stage is where the seam's cover is largest: a little either side is less.
    let cover = |t: f64| p.star_eclipse_fraction(&p.star_instant(t), place);
    assert!((cover(events[1].at_s) - fraction).abs() < 1e-12);
    // Cover is zero at the begin instant and positive just after it (the seam decides).
    assert_eq!(cover(events[0].at_s), 0.0);
    assert!(cover(events[0].at_s + 1.01 * EVENT_TIME_TOLERANCE_S) > 0.0);
    // Starting inside the eclipse still finds the greatest stage and the end.
    let inside = p
        .sky_events_between(place, events[0].at_s + 60.0, 6.0 * 3600.0, &filter)
        .unwrap();
    assert_eq!(inside.len(), 2);
    assert!((inside[0].at_s - events[1].at_s).abs() < 2.0 * EVENT_TIME_TOLERANCE_S);
    // At full moon the same moon is in the planet's shadow.
    let half = 0.5 * crate::moons::synodic_period_s(27.0 * 86_400.0, p.year_s());
    let lunar = p
        .sky_events_between(
            place,
            half - 86_400.0,
            half + 86_400.0,
            &EventFilter::only([EventGroup::MoonEclipse]),
        )
        .unwrap();
    assert_eq!(lunar.len(), 3, "{lunar:?}");
    let SkyEventKind::MoonEclipse {
        moon: 0,
        stage: EclipseStage::Greatest { fraction },
    } = lunar[1].kind
    else {
        panic!("{lunar:?}")
    };
    assert!(fraction > 0.99, "{fraction}");
}

#[test]
fn phases_come_in_order_once_per_synodic_month() {
    let p = busy_world();
    let place = Place::from_degrees(0.0, 0.0).unwrap();
    let filter = EventFilter::only([EventGroup::MoonPhase]).with_moons([0]);
    let events = p
        .sky_events_between(place, 0.0, 200.0 * 86_400.0, &filter)
        .unwrap();
    let order = [
        MoonPhase::New,
        MoonPhase::FirstQuarter,
        MoonPhase::Full,
        MoonPhase::LastQuarter,
    ];
    let phases: Vec<_> = events
        .iter()
        .map(|e| match e.kind {
            SkyEventKind::MoonPhase { moon: 0, phase } => phase,
            _ => unreachable!(),
        })
        .collect();
    let start = order.iter().position(|&q| q == phases[0]).unwrap();
    for (k, phase) in phases.iter().enumerate() {
        assert_eq!(*phase, order[(start + k) % 4]);
    }
    let news: Vec<f64> = events
        .iter()
        .filter(|e| {
            matches!(
                e.kind,
                SkyEventKind::MoonPhase {
                    phase: MoonPhase::New,
                    ..
                }
            )
        })
        .map(|e| e.at_s)
        .collect();
    let synodic = crate::moons::synodic_period_s(25.0 * 86_400.0, p.year_s());
    for w in news.windows(2) {
        // The eccentric planet's orbit shifts each lunation by hours (bound from memory of
        // the equation of centre: 2e of a synodic month's angle).
        assert!(
            ((w[1] - w[0]) / synodic - 1.0).abs() < 0.05,
            "{}",
            w[1] - w[0]
        );
    }
}

#[test]
fn calendar_marks_are_exact_and_days_count_up() {
    let p = busy_world();
    let place = Place::from_degrees(10.0, 45.0).unwrap();
    let filter = EventFilter::only([EventGroup::NewDay, EventGroup::NewYear, EventGroup::Season]);
    let events = p
        .sky_events_between(place, -p.year_s() * 0.5, 2.0 * p.year_s(), &filter)
        .unwrap();
    let years: Vec<_> = events
        .iter()
        .filter_map(|e| match e.kind {
            SkyEventKind::NewYear { year } => Some((year, e.at_s)),
            _ => None,
        })
        .collect();
    let first = p.calendar().first_year;
    assert_eq!(years, vec![(first, 0.0), (first + 1, p.year_s())]);
    // Each mark once a year, exactly a year apart (2.5 years: two or three of each).
    for mark in crate::seasons::SeasonMark::ALL {
        let times: Vec<f64> = events
            .iter()
            .filter(|e| e.kind == SkyEventKind::Season(mark))
            .map(|e| e.at_s)
            .collect();
        assert!((2..=3).contains(&times.len()), "{mark}: {times:?}");
        for w in times.windows(2) {
            assert!((w[1] - w[0] - p.year_s()).abs() < 1e-6 * p.year_s());
        }
    }
    let days: Vec<i64> = events
        .iter()
        .filter_map(|e| match e.kind {
            SkyEventKind::NewDay { day } => Some(day),
            _ => None,
        })
        .collect();
    assert!(days.windows(2).all(|w| w[1] == w[0] + 1));
    for e in &events {
        if let SkyEventKind::NewDay { day } = e.kind {
            let count = p.local_day_count(e.at_s + 1e-3, place.longitude_rad);
            assert_eq!(count.floor() as i64, day);
        }
    }
}

#[test]
fn bad_intervals_are_typed_errors_and_empty_ones_are_empty() {
    let p = busy_world();
    let place = Place::from_degrees(0.0, 0.0).unwrap();
    let f = EventFilter::all();
    for (a, b) in [(f64::NAN, 1.0), (0.0, f64::INFINITY), (10.0, 5.0)] {
        assert!(matches!(
            p.sky_events_between(place, a, b, &f),
            Err(QueryError::BadInterval { .. })
        ));
    }
    assert!(
        p.sky_events_between(place, 7.0, 7.0, &f)
            .unwrap()
            .is_empty()
    );
    assert!(matches!(
        p.sky_events_between(place, 0.0, 1.0e15, &f),
        Err(QueryError::IntervalTooLong { .. })
    ));
    // Without the groups that sample, a long interval is fine.
    let years = EventFilter::only([EventGroup::NewYear]);
    assert_eq!(
        p.sky_events_between(place, 0.0, 1.0e3 * p.year_s(), &years)
            .unwrap()
            .len(),
        1000
    );
}

#[test]
fn plain_words() {
    assert_eq!(
        SkyEventKind::Rise(SkyBody::Star(0)).to_string(),
        "star rises"
    );
    assert_eq!(
        SkyEventKind::Dawn(TwilightBand::Nautical).to_string(),
        "dawn: nautical twilight begins"
    );
    assert_eq!(
        SkyEventKind::MoonPhase {
            moon: 1,
            phase: MoonPhase::FirstQuarter
        }
        .to_string(),
        "moon 1 first quarter"
    );
    let e = SkyEventKind::StarEclipse {
        star: 0,
        by: Occluder::Moon(0),
        stage: EclipseStage::Greatest { fraction: 0.5 },
    };
    assert_eq!(e.to_string(), "eclipse of star by moon 0 greatest (50 %)");
    let json = serde_json::to_string(&SkyEvent { at_s: 1.5, kind: e }).unwrap();
    let back: SkyEvent = serde_json::from_str(&json).unwrap();
    assert_eq!(back.kind, e);
    for g in EventGroup::ALL {
        assert_eq!(EventGroup::from_name(g.name()), Some(g));
    }
}
