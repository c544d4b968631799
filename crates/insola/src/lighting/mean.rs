//! The mean of the stars' and the sky's light over a set of instants: what a display shows
//! for a cycle too fast to show as it is (a day passing in under a second).

use glam::DVec3;

use super::{BodyLight, LightMode, SkyLight};
use crate::place::Place;
use crate::planet::Planet;

/// The stars' and the sky's light averaged over instants; moons are left out (each has its
/// own cycle, so its mean belongs to a longer span).
#[derive(Debug, Clone, PartialEq)]
pub struct MeanLighting {
    /// The star as a light that gives the mean light on a horizontal surface: its direction
    /// where it stood highest among the instants, its `illuminance_lux` the mean horizontal
    /// illuminance divided by the sine of that altitude; colour and correlated colour
    /// temperature are weighted by the horizontal light. `is_up` when that light is positive.
    pub star: BodyLight,
    /// Every star after the primary, by index from 1 (as
    /// [`LightingState::other_stars`](super::LightingState::other_stars); empty on a one-star
    /// world), each averaged as `star` is: from where that star stood highest, with its own
    /// mean horizontal light (already dimmed by eclipses, as the instants' are).
    pub other_stars: Vec<BodyLight>,
    /// The sky's mean diffuse light (colour weighted by its illuminance).
    pub sky: SkyLight,
    /// Each moon's direction at the instant the star stood highest, marked down with no light.
    pub moons: Vec<BodyLight>,
    /// Mean light on a horizontal surface at the ground from the star and the sky, lux.
    pub ground_horizontal_illuminance_lux: f64,
    /// Number of instants averaged.
    pub samples: usize,
}

impl Planet {
    /// The mean of [`Planet::lighting`] over `times` at `place` in `mode`, for the star and
    /// the sky. `None` when `times` is empty.
    pub fn mean_lighting(
        &self,
        place: Place,
        mode: LightMode,
        times: impl IntoIterator<Item = f64>,
    ) -> Option<MeanLighting> {
        let mut n = 0usize;
        let mut primary = BeamMean::default();
        let mut others: Vec<BeamMean> = Vec::new();
        let mut sky_lux = 0.0;
        let mut sky_colour = DVec3::ZERO;
        let mut ground = 0.0;
        let mut highest = None::<super::LightingState>;
        for t in times {
            let l = self.lighting(t, place, mode);
            n += 1;
            primary.add(&l.star);
            for o in &l.other_stars {
                let Some(i) = o.star.checked_sub(1) else {
                    continue;
                };
                if others.len() <= i {
                    others.resize_with(i + 1, BeamMean::default);
                }
                others[i].add(&o.light);
            }
            sky_lux += l.sky.illuminance_lux;
            sky_colour += DVec3::from(l.sky.colour_linear_srgb) * l.sky.illuminance_lux;
            let moons_ground: f64 = l
                .moons
                .iter()
                .map(|m| m.ground_illuminance_lux * m.light.direction_enu.z.max(0.0))
                .sum();
            ground += l.ground_horizontal_illuminance_lux - moons_ground;
            if highest
                .as_ref()
                .is_none_or(|best| l.star.altitude_rad > best.star.altitude_rad)
            {
                highest = Some(l);
            }
        }
        let highest = highest?;
        let count = n as f64;
        let star = primary.finish(count)?;
        let other_stars = others.into_iter().filter_map(|o| o.finish(count)).collect();
        let moons = highest
            .moons
            .iter()
            .map(|m| BodyLight {
                illuminance_lux: 0.0,
                is_up: false,
                ..m.light
            })
            .collect();
        Some(MeanLighting {
            star,
            other_stars,
            sky: SkyLight {
                illuminance_lux: sky_lux / count,
                colour_linear_srgb: largest_channel_one(sky_colour),
            },
            moons,
            ground_horizontal_illuminance_lux: (ground / count).max(0.0),
            samples: n,
        })
    }
}

/// One star's beam summed over instants, and where the star stood highest among them.
#[derive(Default)]
struct BeamMean {
    /// Light on a horizontal surface, lux, summed.
    horizontal_lux: f64,
    /// Colour weighted by the horizontal light.
    colour: DVec3,
    /// Correlated colour temperature weighted by the horizontal light, K × lux.
    cct_weighted: f64,
    /// The beam at the instant the star stood highest.
    highest: Option<BodyLight>,
}

impl BeamMean {
    fn add(&mut self, light: &BodyLight) {
        let h = light.illuminance_lux * light.direction_enu.z.max(0.0);
        self.horizontal_lux += h;
        self.colour += DVec3::from(light.colour_linear_srgb) * h;
        self.cct_weighted += light.cct_k * h;
        if self
            .highest
            .is_none_or(|best| light.altitude_rad > best.altitude_rad)
        {
            self.highest = Some(*light);
        }
    }

    /// The light that gives the mean horizontal light over `count` instants from where the
    /// star stood highest (see [`MeanLighting::star`]); `None` before any instant.
    fn finish(self, count: f64) -> Option<BodyLight> {
        let highest = self.highest?;
        let mean_h = self.horizontal_lux / count;
        let up = highest.direction_enu.z;
        let is_up = mean_h > 0.0 && up > 0.0;
        Some(BodyLight {
            illuminance_lux: if is_up { mean_h / up } else { 0.0 },
            colour_linear_srgb: largest_channel_one(self.colour),
            cct_k: if self.horizontal_lux > 0.0 {
                self.cct_weighted / self.horizontal_lux
            } else {
                highest.cct_k
            },
            is_up,
            ..highest
        })
    }
}

/// A colour with its largest channel at 1 (white for black).
fn largest_channel_one(c: DVec3) -> [f64; 3] {
    let m = c.max_element();
    if m > 0.0 && m.is_finite() {
        (c / m).to_array()
    } else {
        [1.0; 3]
    }
}

#[cfg(test)]
mod tests {
    use crate::lighting::LightMode;
    use crate::{Place, Planet, WorldSpec};

    #[test]
    fn the_mean_of_one_daylit_instant_is_that_instant() {
        let text = r#"(name: "Ennavel", star: (temperature_k: 5600, radius_r_sun: 1, luminosity_l_sun: 1),
            orbit: (semi_major_axis_au: 1, eccentricity: 0.02, periapsis_longitude_deg: 100, period_days: 300),
            spin: (obliquity_deg: 20, solar_day_hours: 22))"#;
        let p = Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap();
        let place = Place::from_degrees(10.0, 0.0).unwrap();
        // Local noon of day 3 at longitude 0.
        let t = p.local_day_start_s(3.5, 0.0);
        let exact = p.lighting(t, place, LightMode::Ground);
        let mean = p.mean_lighting(place, LightMode::Ground, [t]).unwrap();
        assert!(exact.star.is_up);
        assert!(
            (mean.star.illuminance_lux - exact.star.illuminance_lux).abs()
                < 1e-9 * exact.star.illuminance_lux
        );
        assert!((mean.sky.illuminance_lux - exact.sky.illuminance_lux).abs() < 1e-9);
        assert_eq!(mean.star.direction_enu, exact.star.direction_enu);
        assert!(p.mean_lighting(place, LightMode::Ground, []).is_none());
        // Over a whole day the mean ground light lies between night and noon.
        let day = (0..48).map(|i| p.local_day_start_s(3.0 + (i as f64 + 0.5) / 48.0, 0.0));
        let m = p.mean_lighting(place, LightMode::Ground, day).unwrap();
        assert!(m.ground_horizontal_illuminance_lux > 0.0);
        assert!(m.ground_horizontal_illuminance_lux < exact.ground_horizontal_illuminance_lux);
    }

    #[test]
    #[cfg(feature = "built-in-worlds")]
    fn each_other_star_is_averaged_as_the_primary_is() {
        let spec = crate::built_in_worlds::built_in_world("ambrivane")
            .unwrap()
            .spec()
            .unwrap();
        let p = Planet::new(&spec).unwrap();
        let place = Place::from_degrees(20.0, 0.0).unwrap();
        // A whole local day: the companion's mean horizontal light is the plain mean of its
        // instants' (an independent sum here), shown from where it stood highest.
        let times: Vec<f64> = (0..48)
            .map(|i| p.local_day_start_s(40.0 + (i as f64 + 0.5) / 48.0, 0.0))
            .collect();
        let states: Vec<_> = times
            .iter()
            .map(|&t| p.lighting(t, place, LightMode::Ground))
            .collect();
        let mean = p
            .mean_lighting(place, LightMode::Ground, times.iter().copied())
            .unwrap();
        assert_eq!(mean.other_stars.len(), 1);
        let c = mean.other_stars[0];
        let horizontal =
            |l: &crate::lighting::BodyLight| l.illuminance_lux * l.direction_enu.z.max(0.0);
        let expected = states
            .iter()
            .map(|s| horizontal(&s.other_stars[0].light))
            .sum::<f64>()
            / 48.0;
        assert!(expected > 0.0 && c.is_up);
        assert!((horizontal(&c) - expected).abs() < 1e-9 * expected);
        let top = states
            .iter()
            .map(|s| s.other_stars[0].light.altitude_rad)
            .fold(f64::NEG_INFINITY, f64::max);
        assert_eq!(c.altitude_rad, top);
        // The primary's mean is what it was without the companion's (the same sums).
        let primary = states.iter().map(|s| horizontal(&s.star)).sum::<f64>() / 48.0;
        assert!((horizontal(&mean.star) - primary).abs() < 1e-9 * primary);
        // One instant with the companion up: its mean is that instant.
        let noon = p.local_day_start_s(40.5, 0.0);
        let exact = p.lighting(noon, place, LightMode::Ground);
        let one = p.mean_lighting(place, LightMode::Ground, [noon]).unwrap();
        let e = exact.other_stars[0].light;
        assert!(e.is_up);
        assert!(
            (one.other_stars[0].illuminance_lux - e.illuminance_lux).abs()
                < 1e-9 * e.illuminance_lux
        );
        assert_eq!(one.other_stars[0].direction_enu, e.direction_enu);
        // Night all through: down, no light.
        let night = (0..8).map(|i| p.local_day_start_s(40.0 + 0.01 * i as f64, 0.0));
        let dark = p.mean_lighting(place, LightMode::Ground, night).unwrap();
        assert!(!dark.other_stars[0].is_up && dark.other_stars[0].illuminance_lux == 0.0);
    }
}
