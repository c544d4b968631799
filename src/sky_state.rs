//! The sky state: everything that lights the scene's reference place this frame.
//!
//! [`SkyState`] holds the core's full [`LightingState`] for the reference place of
//! [`InsolaSettings`] at the clock's instant — the star, the sky's diffuse light, each moon, the
//! twilight phase — plus the calendar date and the season, in reflected fields so inspectors
//! can show them. It is recomputed every frame in
//! [`InsolaSystems::ComputeSky`](crate::InsolaSystems).

use bevy::color::LinearRgba;
use bevy::math::DVec3;
use bevy::prelude::*;
use insola::events::DayEvents;
use insola::lighting::{BodyLight, LightingState};
use insola::{Place, Planet};

use crate::clock::WorldClock;
use crate::season::SeasonOfYear;
use crate::settings::{InsolaSettings, SceneCompass};
use crate::world_asset::ActiveWorld;

/// Day, a twilight or night at the reference place: the core's one set of bands.
pub use insola::light::TwilightPhase;

/// One body (the star or a moon) as the scene sees it.
#[derive(Debug, Clone, Copy, PartialEq, Default, Reflect)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub struct SceneBody {
    /// Unit vector from the scene toward the body, in scene axes (see [`SceneCompass`]).
    pub direction: Vec3,
    /// Unit vector toward the body in the local east-north-up frame (`f64`, from the core).
    pub direction_enu: DVec3,
    /// Geometric altitude of the body's centre, radians.
    pub altitude_rad: f64,
    /// Azimuth clockwise from north, radians.
    pub azimuth_rad: f64,
    /// Illuminance on a surface facing the body, lux, in the mode of
    /// [`InsolaSettings::attenuation`] (0 when the body is down).
    pub illuminance_lux: f64,
    /// Colour of the light, linear sRGB with the largest channel 1.
    pub color: LinearRgba,
    /// Correlated colour temperature, kelvin.
    pub cct_k: f64,
    /// Angular radius of the disc, radians.
    pub angular_radius_rad: f64,
    /// `true` while the body is up: its upper limb above the refracted horizon, the core's one
    /// rise rule ([`BodyLight::is_up`]); the rise and set notices fall where this changes.
    pub is_up: bool,
}

impl SceneBody {
    pub(crate) fn from_core(body: &BodyLight, compass: &SceneCompass) -> SceneBody {
        let [r, g, b] = body.colour_linear_srgb;
        SceneBody {
            direction: compass.to_scene(body.direction_enu).normalize_or_zero(),
            direction_enu: body.direction_enu,
            altitude_rad: body.altitude_rad,
            azimuth_rad: body.azimuth_rad,
            illuminance_lux: body.illuminance_lux,
            color: LinearRgba::rgb(r as f32, g as f32, b as f32),
            cct_k: body.cct_k,
            angular_radius_rad: body.angular_radius_rad,
            is_up: body.is_up,
        }
    }

    /// Illuminance this body gives a horizontal surface, lux.
    pub fn horizontal_illuminance_lux(&self) -> f64 {
        self.illuminance_lux * self.direction_enu.z.max(0.0)
    }
}

/// One moon as the scene sees it.
#[derive(Debug, Clone, PartialEq, Default, Reflect)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub struct SkyMoon {
    /// The moon's name from the world file.
    pub name: String,
    /// Direction and light.
    pub body: SceneBody,
    /// Phase angle (star–moon–observer), radians: 0 full, π new.
    pub phase_angle_rad: f64,
    /// Illuminated fraction of the disc, 0–1.
    pub illuminated_fraction: f64,
    /// Fraction of the moon's light removed by the planet's shadow, 0–1.
    pub eclipse_fraction: f64,
}

/// A star after the primary (a world's companion) as the scene sees it.
#[derive(Debug, Clone, Copy, PartialEq, Default, Reflect)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub struct SkyStar {
    /// Index of the star: 1 for the companion (0 is the primary, [`SkyState::star`]).
    pub star: usize,
    /// Direction and light (already dimmed by `eclipse_fraction`).
    pub body: SceneBody,
    /// Fraction of its disc hidden by a moon or the other star, 0–1.
    pub eclipse_fraction: f64,
    /// Its top-of-atmosphere insolation on a horizontal surface, W m⁻² (included in
    /// [`SkyState::toa_insolation_w_m2`]).
    pub toa_insolation_w_m2: f64,
}

/// One annulus of the ring as the scene sees it: its edges as directions from the scene
/// (above the horizon only), so a scene can draw the band across its sky.
#[derive(Debug, Clone, PartialEq, Default, Reflect)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub struct SkyRingArc {
    /// Index of the annulus in the world file's `ring.annuli`.
    pub annulus: usize,
    /// Unit vectors toward points along the inner edge, in scene axes, in order along the ring
    /// (empty when that edge is below the horizon).
    pub inner: Vec<Vec3>,
    /// Likewise along the outer edge.
    pub outer: Vec<Vec3>,
}

/// The ring seen from the reference place: the arc of each annulus, which face is lit, and its
/// shadow here (the core's [`Planet::ring_arcs`], kept per place, and [`Planet::ring_moment`]).
#[derive(Debug, Clone, PartialEq, Default, Reflect)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub struct SkyRing {
    /// Each annulus whose outer edge shows above the horizon, inside out.
    pub arcs: Vec<SkyRingArc>,
    /// `true` if the place looks at the face the star lights (draw it bright); `false` for the
    /// unlit face, seen by the light that filters through (draw it dim), or edge-on.
    pub sees_lit_face: bool,
    /// Fraction of the star's direct beam the ring lets through here now, 0–1 (already
    /// applied to the star's light).
    pub shadow_transmission: f64,
    /// Index of the annulus whose shadow falls here now, if any.
    pub shadow_annulus: Option<usize>,
}

impl SkyRing {
    /// The ring at `moment`, around arcs already in scene axes.
    fn at(arcs: SceneRingArcs, moment: &insola::rings::RingMoment) -> SkyRing {
        SkyRing {
            sees_lit_face: arcs.core_face == moment.lit_face
                && moment.lit_face != insola::rings::RingFace::EdgeOn,
            arcs: arcs.arcs,
            shadow_transmission: moment.shadow.transmission,
            shadow_annulus: moment.shadow.annulus,
        }
    }
}

/// The ring's arcs at one place in scene axes, with the face the place sees: the part of
/// [`SkyRing`] that depends on the world, the place and the compass only (the core's
/// [`insola::rings::RingArcs`]), so the frame's system keeps it instead of recomputing a few
/// hundred sampled directions every frame.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct SceneRingArcs {
    arcs: Vec<SkyRingArc>,
    core_face: insola::rings::RingFace,
}

impl SceneRingArcs {
    fn from_core(arcs: &insola::rings::RingArcs, compass: &SceneCompass) -> SceneRingArcs {
        let to_scene = |points: &[insola::rings::RingEdgePoint]| {
            points
                .iter()
                .map(|p| compass.to_scene(p.direction_enu).normalize_or_zero())
                .collect()
        };
        SceneRingArcs {
            arcs: arcs
                .arcs
                .iter()
                .map(|a| SkyRingArc {
                    annulus: a.annulus,
                    inner: to_scene(&a.inner),
                    outer: to_scene(&a.outer),
                })
                .collect(),
            core_face: arcs.seen_face,
        }
    }

    /// The arcs of `place`'s sky on `planet` (`None` on worlds without a ring).
    fn of(planet: &Planet, place: Place, compass: &SceneCompass) -> Option<SceneRingArcs> {
        planet
            .ring_arcs(place)
            .map(|a| SceneRingArcs::from_core(&a, compass))
    }
}

/// The calendar reading of the clock's instant.
#[derive(Debug, Clone, PartialEq, Default, Reflect)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub struct SkyDate {
    /// Year number on the world's calendar.
    pub year: i64,
    /// Calendar day within the year, from 0 (shown to people from 1, as `insola --date`
    /// reads it).
    pub day_of_year: u64,
    /// Month index into the calendar's months (from 0), if it has months.
    pub month: Option<usize>,
    /// Month name, if the world's calendar has months.
    pub month_name: Option<String>,
    /// Day within the month (or year, without months), from 1.
    pub day_of_month: u64,
    /// Hours since local mean midnight at the prime meridian.
    pub hour_of_day: f64,
    /// Fraction of the calendar year elapsed, `[0, 1)`.
    pub year_fraction: f64,
    /// Day of the week (from 0), if the calendar has weeks.
    pub weekday: Option<u32>,
    /// Name of the weekday, if the calendar names them.
    pub weekday_name: Option<String>,
    /// `true` in a leap year (one more day than a common year).
    pub leap_year: bool,
}

impl SkyDate {
    /// Clock time as `HH:MM` in hours of the world's day (which may have more than 24).
    pub fn clock(&self) -> String {
        let total_min = (self.hour_of_day * 60.0).floor().max(0.0) as u64;
        format!("{:02}:{:02}", total_min / 60, total_min % 60)
    }
}

/// The sky at the reference place this frame.
///
/// `ready` is `false` until a world is loaded; then every field is this frame's.
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::{SkyState, TwilightPhase};
/// fn report(sky: Res<SkyState>) {
///     if sky.ready && sky.phase == TwilightPhase::Day {
///         info!("star at {:.1}°, {:.0} lux", sky.star.altitude_rad.to_degrees(), sky.star.illuminance_lux);
///     }
/// }
/// # App::new().init_resource::<SkyState>().add_systems(Update, report).update();
/// ```
#[derive(Resource, Debug, Clone, PartialEq, Default, Reflect)]
#[reflect(Resource, Debug, Default, Clone)]
pub struct SkyState {
    /// `true` once a world is loaded and the state has been computed.
    pub ready: bool,
    /// World time of this state, seconds since time zero.
    pub world_time_s: f64,
    /// The star (the primary, index 0, on a world of two).
    pub star: SceneBody,
    /// Fraction of the star's disc covered by moons (or the other star), 0–1 (already applied
    /// to its light).
    pub star_eclipse_fraction: f64,
    /// Every star after the primary, by index (empty on a one-star world). Drive a light with
    /// [`StarLight::of`](crate::StarLight::of).
    pub other_stars: Vec<SkyStar>,
    /// The ring in the sky and its shadow here (`None` on worlds without a ring).
    pub ring: Option<SkyRing>,
    /// Top-of-atmosphere insolation on a horizontal surface from every star, W m⁻².
    pub toa_insolation_w_m2: f64,
    /// Diffuse light of the sky dome on a horizontal surface, lux (always as at the ground).
    pub sky_illuminance_lux: f64,
    /// Colour of the sky's diffuse light, linear sRGB with the largest channel 1.
    pub sky_color: LinearRgba,
    /// Each moon, in world-file order.
    pub moons: Vec<SkyMoon>,
    /// Day, a twilight, or night (the core's bands, of the stars' combined light: night only
    /// when every star is down; not reflected).
    #[reflect(ignore)]
    pub phase: TwilightPhase,
    /// Total illuminance on a horizontal surface at the ground (star, sky and moons), lux; what
    /// an incident-light meter lying on the ground reads, whichever light mode the lights use.
    /// Feeds [`crate::ExposureFollowsSky`].
    pub horizontal_illuminance_lux: f64,
    /// The calendar date.
    pub date: SkyDate,
    /// Number of the local solar day at the reference place (day 0 holds time zero at the
    /// prime meridian); it changes at local mean midnight. Counts on across years, unlike
    /// [`SkyDate::day_of_year`].
    pub local_day: i64,
    /// Today's events at the reference place: rise, transit and set of the star, each
    /// twilight's dawn and dusk, and the daylight (time the star is up). Recomputed once per
    /// local day (not reflected).
    #[reflect(ignore)]
    pub today: Option<DayEvents>,
    /// The season in the reference place's hemisphere.
    pub season: SeasonOfYear,
    /// The core's full lighting state (not reflected).
    #[reflect(ignore)]
    pub lighting: Option<LightingState>,
}

impl SkyState {
    /// Computes the sky state from the core for `t_s` and the settings' reference place.
    pub fn compute(planet: &Planet, t_s: f64, settings: &InsolaSettings) -> SkyState {
        let place = settings.reference_place_clamped();
        let arcs = SceneRingArcs::of(planet, place, &settings.compass);
        SkyState::compute_around(planet, t_s, settings, arcs)
    }

    /// [`SkyState::compute`] around the ring's arcs for the settings' reference place and
    /// compass, already computed ([`SceneRingArcs::of`]); only the ring's lit face and shadow
    /// are this instant's.
    fn compute_around(
        planet: &Planet,
        t_s: f64,
        settings: &InsolaSettings,
        ring_arcs: Option<SceneRingArcs>,
    ) -> SkyState {
        let place = settings.reference_place_clamped();
        let lighting = planet.lighting(t_s, place, settings.attenuation.light_mode());
        let compass = &settings.compass;
        let star = SceneBody::from_core(&lighting.star, compass);
        let moons: Vec<SkyMoon> = lighting
            .moons
            .iter()
            .map(|m| SkyMoon {
                name: m.name.clone(),
                body: SceneBody::from_core(&m.light, compass),
                phase_angle_rad: m.phase_angle_rad,
                illuminated_fraction: m.illuminated_fraction,
                eclipse_fraction: m.eclipse_fraction,
            })
            .collect();
        let other_stars = lighting
            .other_stars
            .iter()
            .map(|o| SkyStar {
                star: o.star,
                body: SceneBody::from_core(&o.light, compass),
                eclipse_fraction: o.eclipse_fraction,
                toa_insolation_w_m2: o.toa_insolation_w_m2,
            })
            .collect();
        // The meter reads the light at the ground, also when the lights carry the light above
        // the air (the engine's atmosphere then dims them on their way to the scene).
        let horizontal = lighting.ground_horizontal_illuminance_lux;
        let date = planet.date_at(t_s);
        let instant = planet.star_instant(t_s);
        let ecliptic_longitude = instant.ecliptic_longitude_rad;
        let ring = ring_arcs.zip(planet.ring_moment(&instant, place));
        let [r, g, b] = lighting.sky.colour_linear_srgb;
        SkyState {
            ready: true,
            world_time_s: t_s,
            star,
            star_eclipse_fraction: lighting.star_eclipse_fraction,
            other_stars,
            ring: ring.map(|(arcs, moment)| SkyRing::at(arcs, &moment)),
            toa_insolation_w_m2: lighting.toa_insolation_w_m2,
            sky_illuminance_lux: lighting.sky.illuminance_lux,
            sky_color: LinearRgba::rgb(r as f32, g as f32, b as f32),
            moons,
            phase: lighting.twilight,
            horizontal_illuminance_lux: horizontal,
            date: SkyDate {
                year: date.year,
                day_of_year: date.day_of_year,
                month: date.month,
                month_name: date.month_name,
                day_of_month: date.day_of_month,
                hour_of_day: date.hour_of_day,
                year_fraction: date.year_fraction,
                weekday: date.weekday,
                weekday_name: date.weekday_name,
                leap_year: date.leap_year,
            },
            season: SeasonOfYear::at(ecliptic_longitude, place.latitude_rad),
            local_day: local_day(planet, t_s, place),
            today: None,
            lighting: Some(lighting),
        }
    }

    /// [`SkyState::compute`] with today's events filled in.
    pub fn compute_with_today(planet: &Planet, t_s: f64, settings: &InsolaSettings) -> SkyState {
        let mut sky = SkyState::compute(planet, t_s, settings);
        let place = settings.reference_place_clamped();
        sky.today = Some(planet.day_events(sky.local_day, place));
        sky
    }
}

/// The local solar day holding `t_s` at `place`.
fn local_day(planet: &Planet, t_s: f64, place: Place) -> i64 {
    planet.local_day_count(t_s, place.longitude_rad).floor() as i64
}

/// What today's events were computed for: a new day, world or place recomputes them.
#[derive(Default)]
pub(crate) struct TodayKey {
    key: Option<(u64, i64, [u64; 2])>,
    events: Option<DayEvents>,
}

/// The ring's arcs in the reference place's sky, kept while the world, the place and the
/// compass stay (they do not change with time; see [`SceneRingArcs`]).
#[derive(Default)]
pub(crate) struct RingArcsKey {
    key: Option<(u64, [u64; 2], SceneCompass)>,
    arcs: Option<SceneRingArcs>,
}

/// Recomputes [`SkyState`] for this frame's instant.
pub(crate) fn compute_sky_state(
    world: Res<ActiveWorld>,
    clock: Res<WorldClock>,
    settings: Res<InsolaSettings>,
    mut sky: ResMut<SkyState>,
    mut today: Local<TodayKey>,
    mut ring_arcs: Local<RingArcsKey>,
) {
    let Some(planet) = world.planet() else {
        return;
    };
    let place = settings.reference_place_clamped();
    let ring_key = (
        world.generation(),
        [place.latitude_rad.to_bits(), place.longitude_rad.to_bits()],
        settings.compass,
    );
    if ring_arcs.key != Some(ring_key) {
        ring_arcs.arcs = SceneRingArcs::of(planet, place, &settings.compass);
        ring_arcs.key = Some(ring_key);
    }
    // Last frame's arcs, if they are still the kept ones, are moved into this frame's state
    // instead of copied (nothing allocated for the ring from frame to frame).
    let arcs = ring_arcs.arcs.as_ref().map(|kept| match sky.ring.take() {
        Some(last) if last.arcs == kept.arcs => SceneRingArcs {
            arcs: last.arcs,
            core_face: kept.core_face,
        },
        _ => kept.clone(),
    });
    let mut state = SkyState::compute_around(planet, clock.world_time_s(), &settings, arcs);
    let key = (
        world.generation(),
        state.local_day,
        [place.latitude_rad.to_bits(), place.longitude_rad.to_bits()],
    );
    if today.key != Some(key) {
        today.events = Some(planet.day_events(state.local_day, place));
        today.key = Some(key);
    }
    state.today = today.events;
    *sky = state;
}
