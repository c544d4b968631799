//! A ringed world in the plugin: the ring's arcs and shadow in the sky state, the star's light
//! dimmed by the shadow.

use std::time::Duration;

use crate::common::*;
use bevy_insola::prelude::*;

const FRAME: Duration = Duration::from_millis(16);

const THALCARY: &str = include_str!("../../crates/insola/worlds/thalcary.world.ron");

#[test]
fn the_sky_state_carries_the_ring_and_its_shadow() {
    let planet = planet(THALCARY);
    let place = insola::Place::from_degrees(30.0, 0.0).unwrap();
    let mut app = app(THALCARY, settings_at(30.0, 0.0), 0.0, FRAME);
    let mut shadowed = 0;
    // Hourly over the year's first half: the northern winter puts the ring's shadow here.
    for step in (0..(planet.year_s() / 3600.0) as u32).step_by(7) {
        let t = f64::from(step) * 3600.0;
        app.world_mut()
            .resource_mut::<WorldClock>()
            .jump_to(WorldInstant::from_secs_f64(t));
        app.update();
        let sky = app.world().resource::<SkyState>();
        let ring = sky
            .ring
            .as_ref()
            .expect("a ringed world has a ring in its sky");
        let view = planet.ring_view(t, place).unwrap();
        assert_eq!(ring.arcs.len(), view.arcs.len());
        assert_eq!(ring.sees_lit_face, view.sees_lit_face());
        assert_approx_eq!(ring.shadow_transmission, view.shadow.transmission, 1e-12);
        // Every arc point is above the horizon (scene up is +Y by default) and a unit vector.
        for arc in &ring.arcs {
            for p in arc.inner.iter().chain(&arc.outer) {
                assert!(p.y >= -1e-6 && (p.length() - 1.0).abs() < 1e-5, "{p:?}");
            }
        }
        let clear = planet.star_position(t, place);
        if clear.altitude_rad > 0.1 && ring.shadow_transmission < 0.9 {
            shadowed += 1;
            // The direct light carries the shadow (top of atmosphere irradiance through the
            // ring = clear × transmission × what moons leave).
            let lit = planet.lighting(t, place, insola::lighting::LightMode::Ground);
            assert_approx_eq!(
                sky.star.illuminance_lux,
                lit.star.illuminance_lux,
                1e-9 * lit.star.illuminance_lux.max(1.0)
            );
            assert!(sky.toa_insolation_w_m2 < clear.toa_insolation_w_m2 * 0.9 + 1e-9);
        }
    }
    assert!(
        shadowed > 0,
        "no ring shadow seen at 30° N over half a year"
    );
}

#[test]
fn the_kept_arcs_follow_the_place_and_equal_a_fresh_computation() {
    // The frame's system keeps the ring's arcs between frames (they do not change with
    // time); what it shows must be what `SkyState::compute` gives from nothing, also after the
    // reference place moves or someone writes into the sky state.
    let planet = planet(THALCARY);
    let mut app = app(THALCARY, settings_at(30.0, 0.0), 3600.0, FRAME);
    let fresh = |app: &bevy::prelude::App| {
        let settings = app.world().resource::<InsolaSettings>();
        let t = app.world().resource::<SkyState>().world_time_s;
        SkyState::compute(&planet, t, settings).ring.unwrap()
    };
    for frame in 0..40 {
        if frame == 10 {
            app.world_mut()
                .resource_mut::<InsolaSettings>()
                .reference_latitude_deg = -42.0;
        }
        if frame == 20 {
            // A scene writing into the sky state gets this frame's arcs back next frame.
            app.world_mut()
                .resource_mut::<SkyState>()
                .ring
                .as_mut()
                .unwrap()
                .arcs
                .clear();
        }
        app.update();
        let shown = app.world().resource::<SkyState>().ring.clone().unwrap();
        let expected = fresh(&app);
        assert!(!shown.arcs.is_empty());
        assert_eq!(shown, expected, "frame {frame}");
    }
    // The arcs are those of 42° S now: the highest point of the outer edge is toward the
    // north (toward the equator), so the scene's north component is positive there.
    let shown = app.world().resource::<SkyState>().ring.clone().unwrap();
    let north = app.world().resource::<InsolaSettings>().compass.north();
    let top = shown.arcs[0].outer[shown.arcs[0].outer.len() / 2];
    assert!(top.dot(north) > 0.0, "{top:?}");
}
