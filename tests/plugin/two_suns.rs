//! A world of two suns in the plugin: one light per star, the sky state with both, shadows on
//! the brighter, notices tagged with the star.

use std::time::Duration;

use crate::common::*;
use bevy::prelude::*;
use bevy_insola::prelude::*;
use insola::sky_events::SkyBody;

const FRAME: Duration = Duration::from_millis(16);

/// Tessaly: an invented circumbinary world, a yellow star and an orange one (invented numbers,
/// stable by the Holman–Wiegert limit the core checks).
pub(crate) const TESSALY: &str = r#"(
    name: "Tessaly",
    star: (temperature_k: 5800, radius_r_sun: 1.0, luminosity_l_sun: 1.0, mass_m_sun: 1.0),
    orbit: (semi_major_axis_au: 1.1, eccentricity: 0.01, periapsis_longitude_deg: 0, period_days: 323.2),
    spin: (obliquity_deg: 20, solar_day_hours: 24),
    companion: (
        star: (temperature_k: 4400, radius_r_sun: 0.7, luminosity_l_sun: 0.2, mass_m_sun: 0.7),
        arrangement: Circumbinary,
        orbit: (period_days: 15, eccentricity: 0.05, periapsis_longitude_deg: 0, phase_at_zero_deg: 90),
    ),
)"#;

fn lights(app: &mut App) -> Vec<(StarLight, DirectionalLight, Visibility)> {
    let mut q = app
        .world_mut()
        .query::<(&StarLight, &DirectionalLight, &Visibility)>();
    let mut v: Vec<_> = q.iter(app.world()).map(|(s, l, v)| (*s, *l, *v)).collect();
    v.sort_by_key(|(s, _, _)| s.star);
    v
}

#[test]
fn each_star_drives_its_own_light_and_the_brighter_casts_the_shadows() {
    let planet = planet(TESSALY);
    let mut app = app(TESSALY, settings_at(20.0, 0.0), 0.0, FRAME);
    app.world_mut().spawn(StarLight::PRIMARY);
    app.world_mut().spawn((
        StarLight::of(1),
        DirectionalLight {
            shadow_maps_enabled: true,
            ..default()
        },
    ));
    let place = insola::Place::from_degrees(20.0, 0.0).unwrap();
    let mut seen_both_up = false;
    let mut seen_only_companion = false;
    // Step through a few days, hour by hour.
    for step in 0..(24 * 20) {
        let t = f64::from(step) * 3600.0;
        app.world_mut()
            .resource_mut::<WorldClock>()
            .jump_to(WorldInstant::from_secs_f64(t));
        app.update();
        let sky = app.world().resource::<SkyState>().clone();
        assert_eq!(sky.other_stars.len(), 1);
        let core = planet.lighting(t, place, insola::lighting::LightMode::Ground);
        let companion = &core.other_stars[0];
        assert_eq!(sky.other_stars[0].star, 1);
        assert_approx_eq!(
            sky.other_stars[0].body.illuminance_lux,
            companion.light.illuminance_lux,
            1e-9 * companion.light.illuminance_lux.max(1.0)
        );
        let ls = lights(&mut app);
        assert_eq!(ls.len(), 2);
        let (primary, second) = (&ls[0], &ls[1]);
        // A light is on while its star is up and gives light (the plugin's rule).
        let on = |b: &insola::lighting::BodyLight| b.is_up && b.illuminance_lux > 0.0;
        assert_eq!(primary.2 == Visibility::Hidden, !on(&core.star));
        assert_eq!(second.2 == Visibility::Hidden, !on(&companion.light));
        // One set of shadows: on the star giving more light among those up.
        assert!(!(primary.1.shadow_maps_enabled && second.1.shadow_maps_enabled));
        let companion_brighter = companion.light.is_up
            && (!core.star.is_up || companion.light.illuminance_lux > core.star.illuminance_lux);
        assert_eq!(second.1.shadow_maps_enabled, companion_brighter, "t {t}");
        seen_both_up |= core.star.is_up && companion.light.is_up;
        seen_only_companion |= !core.star.is_up && companion.light.is_up;
    }
    assert!(seen_both_up && seen_only_companion);
}

#[test]
fn notices_name_the_star_they_are_about() {
    let mut app = app(TESSALY, settings_at(20.0, 0.0), 3600.0, FRAME);
    for _ in 0..2000 {
        app.update();
    }
    let rises_of = |k: usize| {
        notices(&app)
            .iter()
            .filter(|n| n.kind == SkyEventKind::Rise(SkyBody::Star(k)))
            .count()
    };
    assert!(
        rises_of(0) > 0 && rises_of(1) > 0,
        "{} {}",
        rises_of(0),
        rises_of(1)
    );
}
