//! The ring's shadow on the ground: where the ray toward the star crosses the ring plane, and
//! how much of the direct beam gets through (see the [module docs](super) for the model).

use glam::DVec3;
use serde::{Deserialize, Serialize};

use crate::planet::Planet;
use crate::sky::{Place, StarInstant};
use crate::world::RingSpec;

/// Transmission below which a place counts as *in the ring's shadow* for the events
/// ([`crate::sky_events::SkyEventKind::RingShadow`]) and the almanac: the ring takes more than
/// half of the direct beam (our choice, common practice for "in shadow", no source). A faint
/// annulus whose transmission stays above it never puts a place in shadow, though it still
/// dims the light.
pub const RING_SHADOW_THRESHOLD: f64 = 0.5;

/// The ring's effect on the star's direct beam at one place and instant.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct RingShadow {
    /// Fraction of the direct beam the ring lets through, 0–1 (1 outside the shadow).
    pub transmission: f64,
    /// Index of the annulus the ray toward the star crosses (world-file order), if any.
    pub annulus: Option<usize>,
    /// Distance from the planet's centre at which the ray toward the star crosses the ring
    /// plane, kilometres; `None` when it does not (the star on the place's side of the plane,
    /// in the plane, or below the horizon).
    pub crossing_radius_km: Option<f64>,
}

impl RingShadow {
    /// No ring in the way.
    pub const CLEAR: RingShadow = RingShadow {
        transmission: 1.0,
        annulus: None,
        crossing_radius_km: None,
    };

    /// `true` if the transmission is below [`RING_SHADOW_THRESHOLD`].
    pub fn is_shadowed(&self) -> bool {
        self.transmission < RING_SHADOW_THRESHOLD
    }
}

/// One annulus in the form the shadow needs: inner and outer radius squared (km²) and the
/// normal optical depth.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
struct Band {
    inner_sq_km2: f64,
    outer_sq_km2: f64,
    optical_depth: f64,
}

/// The ring in the form the shadow needs, without the star: the planet's radius and the
/// annuli (for the daily-mean quadrature, which turns the star over a day).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub(crate) struct RingGeometry {
    /// The planet's radius, kilometres.
    planet_radius_km: f64,
    /// The annuli, inside out.
    bands: Vec<Band>,
}

impl RingGeometry {
    pub(crate) fn new(ring: &RingSpec, planet_radius_km: f64) -> RingGeometry {
        RingGeometry {
            planet_radius_km,
            bands: ring
                .annuli
                .iter()
                .map(|a| Band {
                    inner_sq_km2: a.inner_radius_km * a.inner_radius_km,
                    outer_sq_km2: a.outer_radius_km * a.outer_radius_km,
                    optical_depth: a.optical_depth,
                })
                .collect(),
        }
    }

    /// The planet's radius, kilometres.
    pub(crate) fn planet_radius_km(&self) -> f64 {
        self.planet_radius_km
    }

    /// Inner and outer radius of every annulus, kilometres.
    pub(crate) fn edges_km(&self) -> impl Iterator<Item = f64> + '_ {
        self.bands
            .iter()
            .flat_map(|b| [b.inner_sq_km2.sqrt(), b.outer_sq_km2.sqrt()])
    }

    /// The shadow at the place whose unit position vector (rotating frame) is `n`, with the
    /// star toward the unit vector `s`.
    ///
    /// Derivation: the ground point is `P = R·n`; the ray `P + t·s` meets `z = 0` at
    /// `t = −R n_z / s_z`, ahead of the place (`t > 0`) only when `n_z` and `s_z` differ in
    /// sign. There the distance from the axis is `ρ = |P_xy + t·s_xy|`; inside an annulus
    /// `[r_in, r_out)` the beam keeps `exp(−τ/|s_z|)` (Beer–Lambert along the slant path;
    /// `s_z = sin B`, `B` the star's elevation above the ring plane). A star below the
    /// geometric horizon (`n·s ≤ 0`) gives [`RingShadow::CLEAR`]: its beam is the horizon's
    /// business, not the ring's.
    #[inline]
    pub(crate) fn shadow(&self, n: DVec3, s: DVec3) -> RingShadow {
        shadow_through(
            self.planet_radius_km,
            n,
            s,
            self.bands
                .iter()
                .map(|b| (b.inner_sq_km2, b.outer_sq_km2, b.optical_depth)),
        )
    }
}

/// The law of [`RingGeometry::shadow`] over annuli given as (inner radius², outer radius², τ),
/// km² and dimensionless, inside out.
#[inline]
fn shadow_through(
    r: f64,
    n: DVec3,
    s: DVec3,
    bands: impl Iterator<Item = (f64, f64, f64)>,
) -> RingShadow {
    if n.dot(s) <= 0.0 || n.z * s.z >= 0.0 {
        return RingShadow::CLEAR;
    }
    let t = -r * n.z / s.z;
    let x = r * n.x + t * s.x;
    let y = r * n.y + t * s.y;
    let rho_sq = x * x + y * y;
    let crossing = Some(rho_sq.sqrt());
    for (i, (inner_sq, outer_sq, tau)) in bands.enumerate() {
        if rho_sq >= inner_sq && rho_sq < outer_sq {
            return RingShadow {
                transmission: (-tau / s.z.abs()).exp(),
                annulus: Some(i),
                crossing_radius_km: crossing,
            };
        }
    }
    RingShadow {
        crossing_radius_km: crossing,
        ..RingShadow::CLEAR
    }
}

/// The ring and the star's direction at one instant, in the planet's rotating frame: what any
/// place needs to find the ring's shadow (for the bulk paths, one per instant).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct RingSight {
    /// Unit vector toward the star, rotating frame.
    star: [f64; 3],
    geometry: RingGeometry,
}

impl RingSight {
    /// The sight of `ring` on a planet of `planet_radius_km` with the star toward the unit
    /// vector `star` (rotating frame).
    pub fn new(ring: &RingSpec, planet_radius_km: f64, star: DVec3) -> RingSight {
        RingSight {
            star: star.to_array(),
            geometry: RingGeometry::new(ring, planet_radius_km),
        }
    }

    /// Unit vector toward the star, rotating frame.
    pub fn star_direction(&self) -> DVec3 {
        DVec3::from_array(self.star)
    }

    /// The shadow at the place whose unit position vector (rotating frame) is `n` (see the
    /// [module docs](super) for the law).
    #[inline]
    pub fn shadow_at(&self, n: DVec3) -> RingShadow {
        self.geometry.shadow(n, self.star_direction())
    }

    /// The transmission at the place of latitude sine `sin_lat`, cosine `cos_lat` and east
    /// longitude sine `sin_lon`, cosine `cos_lon` (the bulk paths' form).
    #[inline]
    pub fn transmission(&self, sin_lat: f64, cos_lat: f64, sin_lon: f64, cos_lon: f64) -> f64 {
        self.shadow_at(DVec3::new(cos_lat * cos_lon, cos_lat * sin_lon, sin_lat))
            .transmission
    }
}

/// Latitude, radians, over which the edge of radius `ring_radius_km` casts its shadow on the
/// meridian facing the star (local noon) when the star's declination is `declination_rad`, on
/// a planet of `planet_radius_km`: `φ = δ − asin((ρ/R) sin δ)`, from `ρ = R sin(δ − φ)/sin δ`
/// for the ray from `R(cos φ, 0, sin φ)` toward `(cos δ, 0, sin δ)` (parallel rays). `None`
/// when the star stands in the ring plane or that edge's shadow falls beyond the noon
/// meridian's sunlit part (`(ρ/R)|sin δ| > 1`).
pub fn noon_shadow_latitude_rad(
    planet_radius_km: f64,
    ring_radius_km: f64,
    declination_rad: f64,
) -> Option<f64> {
    let x = ring_radius_km / planet_radius_km * declination_rad.sin();
    if declination_rad == 0.0 || !x.is_finite() || x.abs() > 1.0 {
        return None;
    }
    Some(declination_rad - x.asin())
}

/// Unit position vector of `place` in the rotating frame.
pub(crate) fn place_unit_vector(place: Place) -> DVec3 {
    let (sl, cl) = place.latitude_rad.sin_cos();
    let (so, co) = place.longitude_rad.sin_cos();
    DVec3::new(cl * co, cl * so, sl)
}

impl Planet {
    /// Unit vector toward the star at a precomputed instant, in the planet's rotating frame
    /// (x toward the prime meridian on the equator, z toward the north pole):
    /// `(cos δ cos(α − θ), cos δ sin(α − θ), sin δ)`, with `θ` the rotation angle of the prime
    /// meridian, so that its dot product with a place's position vector is the sine of the
    /// star's altitude there.
    pub fn star_direction_rotating(&self, instant: &StarInstant) -> DVec3 {
        let (s, c) = (instant.right_ascension_rad - instant.sidereal_angle_rad).sin_cos();
        DVec3::new(
            instant.cos_declination * c,
            instant.cos_declination * s,
            instant.sin_declination,
        )
    }

    /// The ring and the star at a precomputed instant, for many places; `None` when the world
    /// has no ring that casts a shadow ([`Planet::has_ring_shadow`]) or the star stands in the
    /// ring plane (no shadow anywhere).
    pub fn ring_sight(&self, instant: &StarInstant) -> Option<RingSight> {
        let ring = self.ring().filter(|r| r.casts_shadow())?;
        if instant.sin_declination == 0.0 {
            return None;
        }
        Some(RingSight::new(
            ring,
            self.body().radius_km,
            self.star_direction_rotating(instant),
        ))
    }

    /// The ring's shadow at `place` at a precomputed instant ([`RingShadow::CLEAR`] on worlds
    /// without a shadow-casting ring).
    pub fn ring_shadow(&self, instant: &StarInstant, place: Place) -> RingShadow {
        let Some(ring) = self.ring().filter(|r| r.casts_shadow()) else {
            return RingShadow::CLEAR;
        };
        if instant.sin_declination == 0.0 {
            return RingShadow::CLEAR;
        }
        // The same law as `RingSight::shadow_at`, straight from the world file's annuli (no
        // allocation per query).
        shadow_through(
            self.body().radius_km,
            place_unit_vector(place),
            self.star_direction_rotating(instant),
            ring.annuli.iter().map(|a| {
                (
                    a.inner_radius_km * a.inner_radius_km,
                    a.outer_radius_km * a.outer_radius_km,
                    a.optical_depth,
                )
            }),
        )
    }

    /// Fraction of the star's direct beam the ring lets through at `place` at a precomputed
    /// instant, 0–1 (1 without a ring).
    pub fn ring_transmission(&self, instant: &StarInstant, place: Place) -> f64 {
        self.ring_shadow(instant, place).transmission
    }
}
