//! Moonlight: reflected starlight from each moon (Lambert sphere or the measured lunar phase
//! law), dimmed by the planet's shadow, through the air like the star's beam.

use super::{BodyLight, LightMode, MoonLighting};
use crate::light::{
    earth_moon_magnitude, illuminated_fraction, lambert_geometric_albedo, magnitude_to_lux,
    moon_illuminance_lux,
};
use crate::planet::Planet;
use crate::sky::{Place, StarInstant};

impl Planet {
    /// Light of every moon for `place` at a precomputed instant.
    pub fn moon_lighting(
        &self,
        instant: &StarInstant,
        place: Place,
        mode: LightMode,
    ) -> Vec<MoonLighting> {
        let model = self.light_model();
        self.moon_orbits()
            .iter()
            .enumerate()
            .filter_map(|(i, orbit)| {
                let view = self.moon_view(instant, i, place)?;
                let spec = &self.spec().moons[i];
                let star_lux_at_moon = model
                    .top_of_atmosphere(instant.toa_flux_w_m2)
                    .illuminance_lux
                    * (1.0 - view.shadow_fraction);
                let toa_lux = if spec.lunar_photometry {
                    // Measured lunar law, scaled for the star's brightness relative to the Sun
                    // at 1 AU (the law is calibrated for the Sun's light).
                    let sun_lux = 1361.0
                        * crate::light::blackbody_luminous_efficacy(
                            crate::constants::SUN_TEMPERATURE_K,
                        );
                    magnitude_to_lux(earth_moon_magnitude(view.phase_angle_rad, view.distance_m))
                        * star_lux_at_moon
                        / sun_lux
                } else {
                    moon_illuminance_lux(
                        star_lux_at_moon,
                        lambert_geometric_albedo(spec.bond_albedo),
                        orbit.radius_m,
                        view.distance_m,
                        view.phase_angle_rad,
                    )
                };
                // Moonlight is reflected starlight: at the ground it has the same extinction
                // as the star's beam at the moon's altitude.
                let rise = self.moon_rise_altitude_rad(i);
                let beam = model.direct_beam_of_disc(
                    view.altitude_rad,
                    1.0,
                    view.angular_radius_rad,
                    rise,
                );
                let toa = model.top_of_atmosphere(1.0);
                let ground_lux =
                    toa_lux * beam.illuminance_lux / toa.illuminance_lux.max(f64::MIN_POSITIVE);
                let (lux, colour) = match mode {
                    LightMode::TopOfAtmosphere => {
                        let fade = crate::light::disc_fraction_above_rise(
                            view.altitude_rad,
                            rise,
                            view.angular_radius_rad,
                        );
                        (toa_lux * fade, toa.colour)
                    }
                    LightMode::Ground => (ground_lux, beam.colour),
                };
                let finite = |x: f64| if x.is_finite() { x.max(0.0) } else { 0.0 };
                Some(MoonLighting {
                    name: spec.name.clone(),
                    light: BodyLight {
                        direction_enu: view.direction_enu,
                        altitude_rad: view.altitude_rad,
                        azimuth_rad: view.azimuth_rad,
                        illuminance_lux: finite(lux),
                        colour_linear_srgb: colour.linear_srgb,
                        cct_k: colour.cct_k,
                        angular_radius_rad: view.angular_radius_rad,
                        is_up: view.altitude_rad > rise,
                    },
                    phase_angle_rad: view.phase_angle_rad,
                    illuminated_fraction: illuminated_fraction(view.phase_angle_rad),
                    eclipse_fraction: view.shadow_fraction,
                    ground_illuminance_lux: finite(ground_lux),
                })
            })
            .collect()
    }
}
