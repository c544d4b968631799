//! The mean of the star's and the sky's light over a set of instants: what a display shows
//! for a cycle too fast to show as it is (a day passing in under a second).

use glam::DVec3;

use super::{BodyLight, LightMode, SkyLight};
use crate::place::Place;
use crate::planet::Planet;

/// The star's and the sky's light averaged over instants; moons are left out (each has its
/// own cycle, so its mean belongs to a longer span).
#[derive(Debug, Clone, PartialEq)]
pub struct MeanLighting {
    /// The star as a light that gives the mean light on a horizontal surface: its direction
    /// where it stood highest among the instants, its `illuminance_lux` the mean horizontal
    /// illuminance divided by the sine of that altitude; colour and correlated colour
    /// temperature are weighted by the horizontal light. `is_up` when that light is positive.
    pub star: BodyLight,
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
        let mut star_h = 0.0; // star light on a horizontal surface, lux (summed)
        let mut star_colour = DVec3::ZERO;
        let mut cct = 0.0;
        let mut sky_lux = 0.0;
        let mut sky_colour = DVec3::ZERO;
        let mut ground = 0.0;
        let mut highest = None::<super::LightingState>;
        for t in times {
            let l = self.lighting(t, place, mode);
            n += 1;
            let h = l.star.illuminance_lux * l.star.direction_enu.z.max(0.0);
            star_h += h;
            star_colour += DVec3::from(l.star.colour_linear_srgb) * h;
            cct += l.star.cct_k * h;
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
        let mean_h = star_h / count;
        let up = highest.star.direction_enu.z;
        let is_up = mean_h > 0.0 && up > 0.0;
        let star = BodyLight {
            illuminance_lux: if is_up { mean_h / up } else { 0.0 },
            colour_linear_srgb: largest_channel_one(star_colour),
            cct_k: if star_h > 0.0 {
                cct / star_h
            } else {
                highest.star.cct_k
            },
            is_up,
            ..highest.star
        };
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
}
