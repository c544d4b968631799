//! The star at one instant, ready for many places: one frame per instant, a few multiply-adds
//! per place.
//!
//! [`Planet::star_frame`] does the per-instant work once — the star's position on its path
//! ([`Planet::star_instant`]), the hour angle at longitude 0, the rise altitude, and the
//! planet-wide eclipse test of [`Planet::occluders_in_reach`] — and [`StarFrame::at`] answers
//! for any place with the same formulas as [`Planet::lighting`]: the star's altitude, whether it
//! is up, and the top-of-atmosphere insolation with the star's occlusion applied.
//!
//! [`StarFrameF32`] is the same frame in single precision for bulk work (a million places per
//! update): a place is stored once as the sines and cosines of its latitude and longitude
//! ([`PlaceF32`], 16 bytes; about 0.3 m on an Earth-sized planet), so a place costs one
//! angle-sum rule and no trigonometry. Its sines of altitude agree with the f64 frame to about
//! 1e-6. Eclipses cost a place nothing unless an occluder can reach the planet at that instant;
//! then only places with the star above the horizon compute the cover, in f64 from the place's
//! stored sines and cosines.

use crate::occlusion::{OccluderSight, Occlusion, occlusion_among};
use crate::planet::Planet;
use crate::rings::RingSight;
use crate::sky::{Place, StarInstant, StarPosition, star_position_from};

/// The star seen from one place, from a [`StarFrame`].
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlaceSky {
    /// Where the star stands (geometric altitude of its centre, azimuth, hour angle,
    /// direction); its `toa_insolation_w_m2` is the clear value, before occlusion.
    pub position: StarPosition,
    /// Sine of the geometric altitude of the star's centre (−1 to 1).
    pub sin_altitude: f64,
    /// Top-of-atmosphere insolation on a horizontal surface with the star's occlusion
    /// applied, W m⁻² (as [`crate::lighting::LightingState::toa_insolation_w_m2`]).
    pub toa_insolation_w_m2: f64,
    /// How much of the star's disc is hidden, and by what.
    pub occlusion: Occlusion,
    /// `true` while the star is up: its centre above [`Planet::standard_rise_altitude_rad`]
    /// (as [`crate::lighting::BodyLight::is_up`]).
    pub is_up: bool,
}

/// What every place's work needs from one instant: the star's declination and the hour angle
/// at longitude 0, as sines and cosines (shared with [`crate::batch`]).
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Meridian {
    pub(crate) sin_dec: f64,
    pub(crate) cos_dec: f64,
    pub(crate) sin_h0: f64,
    pub(crate) cos_h0: f64,
}

impl Meridian {
    pub(crate) fn new(i: &StarInstant) -> Meridian {
        let (sin_h0, cos_h0) = (i.sidereal_angle_rad - i.right_ascension_rad).sin_cos();
        Meridian {
            sin_dec: i.sin_declination,
            cos_dec: i.cos_declination,
            sin_h0,
            cos_h0,
        }
    }

    /// Sine and cosine of the geometric hour angle at a longitude of sine `sl` and cosine `cl`.
    #[inline]
    pub(crate) fn hour_angle(&self, sl: f64, cl: f64) -> (f64, f64) {
        (
            self.sin_h0 * cl + self.cos_h0 * sl,
            self.cos_h0 * cl - self.sin_h0 * sl,
        )
    }

    /// Unit vector toward the star (east, north, up) at a place given as (sin lat, cos lat,
    /// sin lon, cos lon).
    #[inline]
    pub(crate) fn direction(&self, p: [f64; 4]) -> glam::DVec3 {
        let [sin_lat, cos_lat, sl, cl] = p;
        let (sh, ch) = self.hour_angle(sl, cl);
        glam::DVec3::new(
            -self.cos_dec * sh,
            cos_lat * self.sin_dec - sin_lat * self.cos_dec * ch,
            sin_lat * self.sin_dec + cos_lat * self.cos_dec * ch,
        )
    }

    /// The "up" component of [`Meridian::direction`]: the sine of the star's altitude.
    #[inline]
    pub(crate) fn up_component(&self, p: [f64; 4]) -> f64 {
        let [sin_lat, cos_lat, sl, cl] = p;
        let (_, ch) = self.hour_angle(sl, cl);
        sin_lat * self.sin_dec + cos_lat * self.cos_dec * ch
    }
}

/// The star at one instant, for any number of places (see the module docs).
#[derive(Debug, Clone, PartialEq)]
pub struct StarFrame {
    instant: StarInstant,
    meridian: Meridian,
    /// +1 on forward-spinning worlds, −1 on backward ones.
    sense: f64,
    rise_altitude_rad: f64,
    /// The occluders that can reach the planet at this instant (usually none).
    sights: Vec<OccluderSight>,
    /// The ring and the star at this instant (`None` without a shadow-casting ring).
    ring: Option<RingSight>,
}

impl Planet {
    /// The star's frame at world time `t_s`, seconds since time zero.
    pub fn star_frame(&self, t_s: f64) -> StarFrame {
        self.star_frame_at(self.star_instant(t_s))
    }

    /// The star's frame at a precomputed instant. The instant may be any star's
    /// ([`Planet::star_instant_of`]): the frame then answers for that star, with its own rise
    /// altitude and what can hide it.
    pub fn star_frame_at(&self, instant: StarInstant) -> StarFrame {
        StarFrame {
            meridian: Meridian::new(&instant),
            sense: self.spin().sense.sign(),
            rise_altitude_rad: self
                .standard_rise_altitude_of_rad(instant.star)
                .unwrap_or_else(|| self.standard_rise_altitude_rad()),
            sights: self.occluders_in_reach(&instant),
            ring: self.ring_sight(&instant),
            instant,
        }
    }
}

impl StarFrame {
    /// The place-independent state of the star this frame was built from.
    pub fn instant(&self) -> &StarInstant {
        &self.instant
    }

    /// World time, seconds since time zero.
    pub fn t_s(&self) -> f64 {
        self.instant.t_s
    }

    /// `true` if an occluder can hide part of the star from somewhere on the planet at this
    /// instant (a moon within reach, or a shadow-casting ring with the star off its plane);
    /// when `false`, no place sees an eclipse or a ring shadow.
    pub fn eclipse_possible(&self) -> bool {
        !self.sights.is_empty() || self.ring.is_some()
    }

    /// The ring and the star at this instant, if the world has a shadow-casting ring.
    pub fn ring_sight(&self) -> Option<&RingSight> {
        self.ring.as_ref()
    }

    /// The occluders within reach of the planet at this instant.
    pub fn occluders_in_reach(&self) -> &[OccluderSight] {
        &self.sights
    }

    /// Geometric hour angle at longitude 0 (rotation angle − right ascension), radians
    /// `[0, 2π)`, in the planet's own east-positive sense (not the sense the sky turns).
    pub fn hour_angle_0_rad(&self) -> f64 {
        (self.instant.sidereal_angle_rad - self.instant.right_ascension_rad)
            .rem_euclid(std::f64::consts::TAU)
    }

    /// +1 on forward-spinning worlds, −1 on backward ones (the sign that turns a geometric hour
    /// angle into one that grows with time).
    pub fn spin_sign(&self) -> f64 {
        self.sense
    }

    /// The star's local hour angle at east longitude `longitude_rad` in the sense the sky
    /// turns (0 at local transit, growing with time), radians, not wrapped: what the climate's
    /// day-night cycle takes.
    pub fn hour_angle_at_rad(&self, longitude_rad: f64) -> f64 {
        self.sense * (self.hour_angle_0_rad() + longitude_rad)
    }

    /// Standard rise altitude of the star's centre, radians (negative).
    pub fn rise_altitude_rad(&self) -> f64 {
        self.rise_altitude_rad
    }

    /// The star seen from `place`: the same numbers as [`Planet::lighting`] gives there.
    pub fn at(&self, place: Place) -> PlaceSky {
        let position = star_position_from(&self.instant, place, self.sense);
        let occlusion = if self.sights.is_empty() && self.ring.is_none() {
            Occlusion::CLEAR
        } else {
            let (sin_lat, cos_lat) = place.latitude_rad.sin_cos();
            let (sin_lon, cos_lon) = place.longitude_rad.sin_cos();
            let moons = occlusion_among(&self.sights, sin_lat, cos_lat, sin_lon, cos_lon);
            match &self.ring {
                Some(ring) => moons
                    .with_ring_transmission(ring.transmission(sin_lat, cos_lat, sin_lon, cos_lon)),
                None => moons,
            }
        };
        PlaceSky {
            sin_altitude: position.direction_enu.z,
            toa_insolation_w_m2: position.toa_insolation_w_m2 * occlusion.transmitted_fraction(),
            occlusion,
            is_up: position.altitude_rad > self.rise_altitude_rad,
            position,
        }
    }

    /// The single-precision form of this frame, for bulk work.
    pub fn to_f32(&self) -> StarFrameF32 {
        let m = &self.meridian;
        StarFrameF32 {
            instant: Some(self.instant),
            sin_dec: m.sin_dec as f32,
            cos_dec_sin_h0: (m.cos_dec * m.sin_h0) as f32,
            cos_dec_cos_h0: (m.cos_dec * m.cos_h0) as f32,
            toa_flux_w_m2: self.instant.toa_flux_w_m2 as f32,
            sin_rise_altitude: self.rise_altitude_rad.sin() as f32,
            hour_angle_0_rad: self.hour_angle_0_rad(),
            sense: self.sense,
            sights: self.sights.clone(),
            ring: self.ring.clone(),
        }
    }
}

/// A place for bulk work: the single-precision sines and cosines of its latitude and east
/// longitude (16 bytes).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlaceF32 {
    /// Sine of the latitude.
    pub sin_lat: f32,
    /// Cosine of the latitude (≥ 0).
    pub cos_lat: f32,
    /// Sine of the east longitude.
    pub sin_lon: f32,
    /// Cosine of the east longitude.
    pub cos_lon: f32,
}

impl Default for PlaceF32 {
    /// Latitude 0, longitude 0.
    fn default() -> Self {
        PlaceF32::new(Place {
            latitude_rad: 0.0,
            longitude_rad: 0.0,
        })
    }
}

impl PlaceF32 {
    /// `place`, normalised first ([`Place::normalise`]: latitude clamped, longitude wrapped,
    /// non-finite values taken as 0).
    pub fn new(place: Place) -> PlaceF32 {
        let p = place.normalise();
        let (sin_lat, cos_lat) = p.latitude_rad.sin_cos();
        let (sin_lon, cos_lon) = p.longitude_rad.sin_cos();
        PlaceF32 {
            sin_lat: sin_lat as f32,
            cos_lat: cos_lat as f32,
            sin_lon: sin_lon as f32,
            cos_lon: cos_lon as f32,
        }
    }

    /// Latitude, radians.
    pub fn latitude_rad(&self) -> f64 {
        f64::from(self.sin_lat).atan2(f64::from(self.cos_lat))
    }

    /// East longitude, radians, −π…π.
    pub fn longitude_rad(&self) -> f64 {
        f64::from(self.sin_lon).atan2(f64::from(self.cos_lon))
    }

    /// The place as a [`Place`].
    pub fn place(&self) -> Place {
        Place {
            latitude_rad: self.latitude_rad(),
            longitude_rad: self.longitude_rad(),
        }
    }
}

/// The star seen from one place, from a [`StarFrameF32`].
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct PlaceSkyF32 {
    /// Sine of the geometric altitude of the star's centre (−1 to 1).
    pub sin_altitude: f32,
    /// Top-of-atmosphere insolation on a horizontal surface with the star's occlusion
    /// applied, W m⁻².
    pub toa_insolation_w_m2: f32,
    /// Fraction of the star's disc hidden, 0–1 (computed only while the star is above the
    /// horizon; 0 below it, where it dims nothing).
    pub star_hidden_fraction: f32,
    /// `true` while the star is up (centre above the standard rise altitude).
    pub is_up: bool,
}

/// [`StarFrame`] in single precision, for a million places per update (see the module docs).
/// The default frame has no instant: every place sees the star on the horizon with no light.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct StarFrameF32 {
    instant: Option<StarInstant>,
    sin_dec: f32,
    /// cos δ · sin H₀ and cos δ · cos H₀, taken once per frame in double precision so a
    /// place's altitude costs one product fewer.
    cos_dec_sin_h0: f32,
    cos_dec_cos_h0: f32,
    toa_flux_w_m2: f32,
    sin_rise_altitude: f32,
    hour_angle_0_rad: f64,
    sense: f64,
    sights: Vec<OccluderSight>,
    ring: Option<RingSight>,
}

impl StarFrameF32 {
    /// The instant this frame was built from (`None` for the default frame).
    pub fn instant(&self) -> Option<&StarInstant> {
        self.instant.as_ref()
    }

    /// World time, seconds since time zero (0 for the default frame).
    pub fn t_s(&self) -> f64 {
        self.instant.map_or(0.0, |i| i.t_s)
    }

    /// See [`StarFrame::hour_angle_0_rad`].
    pub fn hour_angle_0_rad(&self) -> f64 {
        self.hour_angle_0_rad
    }

    /// See [`StarFrame::spin_sign`] (0 for the default frame).
    pub fn spin_sign(&self) -> f64 {
        self.sense
    }

    /// See [`StarFrame::hour_angle_at_rad`].
    pub fn hour_angle_at_rad(&self, longitude_rad: f64) -> f64 {
        self.sense * (self.hour_angle_0_rad + longitude_rad)
    }

    /// See [`StarFrame::eclipse_possible`].
    pub fn eclipse_possible(&self) -> bool {
        !self.sights.is_empty() || self.ring.is_some()
    }

    /// The star seen from `place`.
    #[inline(always)]
    pub fn at(&self, place: &PlaceF32) -> PlaceSkyF32 {
        if self.is_clear() {
            return self.at_clear(place);
        }
        let sin_alt = self.sin_altitude(place);
        let clear = self.toa_flux_w_m2 * sin_alt.max(0.0);
        let hidden = if sin_alt <= 0.0 {
            0.0
        } else {
            self.hidden_fraction(place)
        };
        PlaceSkyF32 {
            sin_altitude: sin_alt,
            toa_insolation_w_m2: clear * (1.0 - hidden),
            star_hidden_fraction: hidden,
            is_up: sin_alt > self.sin_rise_altitude,
        }
    }

    /// `true` when nothing can hide the star anywhere at this instant (no moon in reach of
    /// its disc, no ring): then [`StarFrameF32::at_clear`] is [`StarFrameF32::at`]. Bulk
    /// loops ask this once and run the clear form, which has no branch per place.
    #[inline]
    pub fn is_clear(&self) -> bool {
        self.sights.is_empty() && self.ring.is_none()
    }

    /// The sky at `place` with nothing hiding the star: [`StarFrameF32::at`] when
    /// [`StarFrameF32::is_clear`] holds (and the clear sky, not the true one, otherwise).
    #[inline(always)]
    pub fn at_clear(&self, place: &PlaceF32) -> PlaceSkyF32 {
        let sin_alt = self.sin_altitude(place);
        PlaceSkyF32 {
            sin_altitude: sin_alt,
            toa_insolation_w_m2: self.toa_flux_w_m2 * sin_alt.max(0.0),
            star_hidden_fraction: 0.0,
            is_up: sin_alt > self.sin_rise_altitude,
        }
    }

    /// Sine of the star's altitude at `place`: sin φ sin δ + cos φ cos δ cos(H₀ + λ), the
    /// cosine of the hour angle by the angle-sum rule from the stored sine and cosine of λ.
    #[inline(always)]
    fn sin_altitude(&self, place: &PlaceF32) -> f32 {
        let cos_dec_cos_h =
            self.cos_dec_cos_h0 * place.cos_lon - self.cos_dec_sin_h0 * place.sin_lon;
        (place.sin_lat * self.sin_dec + place.cos_lat * cos_dec_cos_h).clamp(-1.0, 1.0)
    }

    /// The eclipse path, kept out of line so the common path stays small.
    #[inline(never)]
    fn hidden_fraction(&self, place: &PlaceF32) -> f32 {
        let p = [
            f64::from(place.sin_lat),
            f64::from(place.cos_lat),
            f64::from(place.sin_lon),
            f64::from(place.cos_lon),
        ];
        let moons = occlusion_among(&self.sights, p[0], p[1], p[2], p[3]);
        match &self.ring {
            Some(ring) => moons.with_ring_transmission(ring.transmission(p[0], p[1], p[2], p[3])),
            None => moons,
        }
        .hidden_fraction as f32
    }
}
