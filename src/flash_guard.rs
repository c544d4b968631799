//! The flash guard: what the lights show when the clock runs so fast that the exact sky would
//! flash.
//!
//! # Why
//!
//! At high clock rates day and night alternate several times a real second, and the whole
//! screen would swing between bright and dark. Flashes of the whole view at 3 to 30 a second can
//! trigger seizures in people with photosensitive epilepsy. The published limit for general
//! flashes (WCAG 2.x success criterion 2.3.1, "three flashes or below threshold"; ITU-R BT.1702
//! for broadcast) allows at most three flashes in any one second, a flash being a pair of
//! opposing changes in relative luminance of 10 % or more where the darker state is below 0.80.
//!
//! # How
//!
//! Every cycle of the sky that lasts less than [`FlashGuard::On`]'s `min_real_period_s` real
//! seconds (default 1 s, so a cycle that is shown gives at most one flash a second, a
//! threefold margin) is shown at its mean instead of as it is:
//!
//! - the local day faster than the limit: the lights show the **mean of the local day** at the
//!   reference place (star light with the day's mean horizontal illuminance, from where the star
//!   stands highest that day; the sky light's mean), constant through the day;
//! - the year faster as well: the **mean of the year** (constant);
//! - moons are not shown while the day is held (their light would come and go with their own
//!   cycles); on a world of two suns the second star is held at its own mean over the same
//!   instants, as the primary is (from where it stood highest, with its mean horizontal
//!   light), so both lights stand still through a held day and the held ground light (which
//!   already counted the second star) is what the lights show.
//!
//! A cycle shown exactly lasts at least the limit, so it flashes at most once a second however
//! the frames fall; a held cycle does not flash at all. Only what is displayed changes: the
//! clock, [`SkyState`], notices, observers and climate stay exact. When the
//! day lasts longer than the limit the displayed sky is the exact one, to the last bit.

use bevy::color::LinearRgba;
use bevy::prelude::*;
use insola::{Place, Planet};

use crate::sky_state::SceneBody;
use crate::{ActiveWorld, InsolaSettings, SceneCompass, SkyState, WorldClock};

/// How the lights guard against flashing at high clock rates (see the [module docs](self)).
#[derive(Debug, Clone, Copy, PartialEq, Reflect)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub enum FlashGuard {
    /// Cycles of the sky shorter than `min_real_period_s` real seconds are shown at their mean.
    /// The default, with 1 s.
    On {
        /// Shortest cycle shown as it is, real seconds. Values below 1/3 s (three cycles a
        /// second) are raised to 1/3 s: the guard cannot be set looser than the limit.
        min_real_period_s: f64,
    },
    /// The lights always show the exact sky, and can flash at high clock rates. For tools and
    /// tests; a game that ships with it off must keep its clock slow itself.
    Off,
}

impl Default for FlashGuard {
    fn default() -> Self {
        FlashGuard::On {
            min_real_period_s: 1.0,
        }
    }
}

/// Shortest cycle the guard lets through, real seconds: three flashes a second at most.
const LOOSEST_PERIOD_S: f64 = 1.0 / 3.0;

/// Samples over a held local day.
const DAY_SAMPLES: usize = 48;
/// Days sampled over a held year (each with [`DAY_SAMPLES`] instants).
const YEAR_DAY_SAMPLES: usize = 24;

/// Which cycle the displayed sky holds at its mean.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Reflect)]
pub enum SkyHold {
    /// The exact sky.
    #[default]
    Exact,
    /// The mean of the local day.
    Day,
    /// The mean of the year.
    Year,
}

/// The sky the lights, the ambient light and the exposure show this frame: the exact sky, or
/// its mean over a cycle the clock runs through too fast to show (see the [module docs](self)).
#[derive(Resource, Debug, Clone, PartialEq, Default, Reflect)]
#[reflect(Resource, Debug, Default, Clone)]
pub struct DisplayedSky {
    /// `true` once a world's sky has been displayed.
    pub ready: bool,
    /// Which cycle is held at its mean.
    pub hold: SkyHold,
    /// The star's light as shown.
    pub star: SceneBody,
    /// Each moon's light as shown (all down while a cycle is held).
    pub moons: Vec<SceneBody>,
    /// Each star after the primary as shown, by index from 1 (at its mean while a cycle is
    /// held).
    pub other_stars: Vec<SceneBody>,
    /// Diffuse light of the sky on a horizontal surface, lux.
    pub sky_illuminance_lux: f64,
    /// Colour of the sky's light, linear sRGB with the largest channel 1.
    pub sky_color: LinearRgba,
    /// Total light on a horizontal surface at the ground, lux (what exposure meters read).
    pub horizontal_illuminance_lux: f64,
}

impl DisplayedSky {
    /// The exact sky as displayed.
    pub fn exact(sky: &SkyState) -> DisplayedSky {
        DisplayedSky {
            ready: sky.ready,
            hold: SkyHold::Exact,
            star: sky.star,
            moons: sky.moons.iter().map(|m| m.body).collect(),
            other_stars: sky.other_stars.iter().map(|o| o.body).collect(),
            sky_illuminance_lux: sky.sky_illuminance_lux,
            sky_color: sky.sky_color,
            horizontal_illuminance_lux: sky.horizontal_illuminance_lux,
        }
    }
}

impl FlashGuard {
    /// The cycle to hold for a world whose local day lasts `day_s` and year `year_s` world
    /// seconds, with the clock at `rate` world seconds per real second.
    pub fn hold_for(&self, day_s: f64, year_s: f64, rate: f64) -> SkyHold {
        let FlashGuard::On { min_real_period_s } = *self else {
            return SkyHold::Exact;
        };
        let limit = if min_real_period_s.is_finite() {
            min_real_period_s.max(LOOSEST_PERIOD_S)
        } else {
            LOOSEST_PERIOD_S
        };
        let speed = rate.abs();
        // A cycle lasts `period / speed` real seconds; compare without dividing by zero.
        let too_fast = |period_s: f64| period_s.is_finite() && period_s < limit * speed;
        if too_fast(year_s) {
            SkyHold::Year
        } else if too_fast(day_s) {
            SkyHold::Day
        } else {
            SkyHold::Exact
        }
    }
}

/// The mean of the sky over `times` at `place` (the core's [`Planet::mean_lighting`]), as
/// displayed: moons down, every star at its mean.
fn mean_sky(
    planet: &Planet,
    place: Place,
    settings: &InsolaSettings,
    times: impl Iterator<Item = f64>,
    hold: SkyHold,
) -> DisplayedSky {
    let Some(mean) = planet.mean_lighting(place, settings.attenuation.light_mode(), times) else {
        return DisplayedSky::default();
    };
    let compass = &settings.compass;
    let [r, g, b] = mean.sky.colour_linear_srgb;
    DisplayedSky {
        ready: true,
        hold,
        star: SceneBody::from_core(&mean.star, compass),
        moons: mean
            .moons
            .iter()
            .map(|m| SceneBody::from_core(m, compass))
            .collect(),
        // By index from 1; a star missing from the mean (none on a shipped world) is down.
        other_stars: (1..planet.star_count())
            .map(|k| {
                mean.other_stars
                    .get(k - 1)
                    .map_or_else(SceneBody::default, |b| SceneBody::from_core(b, compass))
            })
            .collect(),
        sky_illuminance_lux: mean.sky.illuminance_lux,
        sky_color: LinearRgba::rgb(r as f32, g as f32, b as f32),
        horizontal_illuminance_lux: mean.ground_horizontal_illuminance_lux,
    }
}

/// What the held sky was computed for: a new world, place, mode, hold or day recomputes it.
#[derive(Default)]
pub(crate) struct HeldSkyCache {
    key: Option<(u64, [u64; 2], bool, SkyHold, i64, SceneCompass)>,
    sky: DisplayedSky,
}

/// Sets [`DisplayedSky`] from the exact sky or its held mean.
pub(crate) fn update_displayed_sky(
    world: Res<ActiveWorld>,
    clock: Res<WorldClock>,
    settings: Res<InsolaSettings>,
    sky: Res<SkyState>,
    mut shown: ResMut<DisplayedSky>,
    mut cache: Local<HeldSkyCache>,
) {
    let Some(planet) = world.planet().filter(|_| sky.ready) else {
        return;
    };
    let hold = settings
        .flash_guard
        .hold_for(planet.day_s(), planet.year_s(), clock.rate());
    if hold == SkyHold::Exact {
        *shown = DisplayedSky::exact(&sky);
        return;
    }
    let place = settings.reference_place_clamped();
    let day = match hold {
        SkyHold::Day => sky.local_day,
        _ => 0,
    };
    let key = (
        world.generation(),
        [place.latitude_rad.to_bits(), place.longitude_rad.to_bits()],
        matches!(
            settings.attenuation.light_mode(),
            insola::lighting::LightMode::TopOfAtmosphere
        ),
        hold,
        day,
        settings.compass,
    );
    if cache.key != Some(key) {
        cache.sky = held_sky(planet, place, &settings, hold, day);
        cache.key = Some(key);
    }
    *shown = cache.sky.clone();
}

/// The held sky: the mean over local day `day`, or over the first year.
fn held_sky(
    planet: &Planet,
    place: Place,
    settings: &InsolaSettings,
    hold: SkyHold,
    day: i64,
) -> DisplayedSky {
    let day_s = planet.day_s();
    let step = day_s / DAY_SAMPLES as f64;
    match hold {
        SkyHold::Day => {
            let start = planet.local_day_start_s(day as f64, place.longitude_rad);
            let times = (0..DAY_SAMPLES).map(move |i| start + (i as f64 + 0.5) * step);
            mean_sky(planet, place, settings, times, hold)
        }
        _ => {
            let year_s = planet.year_s();
            let times = (0..YEAR_DAY_SAMPLES).flat_map(move |d| {
                // Days spread over the year; within each, instants spread over the day.
                let start = (d as f64 + 0.5) / YEAR_DAY_SAMPLES as f64 * year_s;
                (0..DAY_SAMPLES).map(move |i| start + (i as f64 + 0.5) * step)
            });
            mean_sky(planet, place, settings, times, hold)
        }
    }
}
