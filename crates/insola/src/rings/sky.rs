//! The ring in a place's sky, as data a scene can draw: the edges of each annulus as arcs of
//! points above the horizon, which face the star lights, which face the place sees, and the
//! ring's shadow there now.
//!
//! Geometry: an edge of radius `r` is the circle `E(ψ) = r(cos ψ, sin ψ, 0)` in the rotating
//! frame; the place is `P = R n` at latitude `φ`, east longitude `λ`. A point of the circle
//! is above the horizon when `(E − P)·n > 0`, that is `r cos φ cos(ψ − λ) > R`: one arc centred
//! on the place's meridian (`ψ = λ`), of half-width `acos(R / (r cos φ))`, none when
//! `r cos φ ≤ R` (the edge is below the horizon, as for any edge seen from near the poles).
//! Along the arc the altitude grows with `cos(ψ − λ)`, so the arc is highest on the meridian,
//! toward the equator, at `tan(alt) = (r cos φ − R) / (r |sin φ|)`.

use glam::DVec3;
use serde::{Deserialize, Serialize};

use super::shadow::{RingShadow, place_unit_vector};
use crate::planet::Planet;
use crate::sky::{Place, StarInstant};

/// Points sampled along each edge's visible arc (odd, so one falls on the meridian).
pub const RING_ARC_POINTS: usize = 65;

/// A face of the ring, or neither.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum RingFace {
    /// The face toward the north pole.
    North,
    /// The face toward the south pole.
    South,
    /// Neither: the ring is seen (or lit) exactly edge-on.
    EdgeOn,
}

impl RingFace {
    /// The face on the side of the ring plane where the rotating-frame `z` is `z`.
    fn of_side(z: f64) -> RingFace {
        if z > 0.0 {
            RingFace::North
        } else if z < 0.0 {
            RingFace::South
        } else {
            RingFace::EdgeOn
        }
    }
}

impl std::fmt::Display for RingFace {
    /// `north face`, `south face`, `edge-on`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            RingFace::North => "north face",
            RingFace::South => "south face",
            RingFace::EdgeOn => "edge-on",
        })
    }
}

/// One sampled point of a ring edge in the place's sky.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct RingEdgePoint {
    /// Azimuth, radians clockwise from north, `[0, 2π)` (as the star's).
    pub azimuth_rad: f64,
    /// Geometric altitude above the horizon, radians (≥ 0).
    pub altitude_rad: f64,
    /// Unit vector toward the point, local east-north-up frame.
    pub direction_enu: DVec3,
}

/// The visible part of one annulus: its inner and outer edges as arcs across the sky.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct RingArc {
    /// Index of the annulus (world-file order).
    pub annulus: usize,
    /// Points along the inner edge above the horizon, in order of increasing ring longitude
    /// (empty when that edge is below the horizon).
    pub inner: Vec<RingEdgePoint>,
    /// Points along the outer edge above the horizon, likewise.
    pub outer: Vec<RingEdgePoint>,
}

/// The ring seen from one place at one instant.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct RingView {
    /// World time, seconds since time zero.
    pub t_s: f64,
    /// Each annulus whose outer edge shows above the horizon, inside out.
    pub arcs: Vec<RingArc>,
    /// The face the star lights: the star's side of the ring plane (sign of its declination).
    pub lit_face: RingFace,
    /// The face the place looks at: the place's side of the plane (sign of its latitude).
    pub seen_face: RingFace,
    /// The ring's shadow at the place now, with the transmission of the star's beam.
    pub shadow: RingShadow,
}

impl RingView {
    /// `true` if the place looks at the face the star lights (both on one side of the plane).
    pub fn sees_lit_face(&self) -> bool {
        self.lit_face == self.seen_face && self.lit_face != RingFace::EdgeOn
    }
}

/// The visible arc of the edge of radius `r_km` seen from `n` (unit position) on a planet of
/// radius `planet_r_km`, with the place's local axes `east`, `north`.
fn edge_arc(
    r_km: f64,
    planet_r_km: f64,
    n: DVec3,
    east: DVec3,
    north: DVec3,
    lon_rad: f64,
) -> Vec<RingEdgePoint> {
    let horizontal = (n.x * n.x + n.y * n.y).sqrt();
    let reach = r_km * horizontal;
    if reach <= planet_r_km {
        return Vec::new();
    }
    let half = (planet_r_km / reach).acos();
    let p = n * planet_r_km;
    (0..RING_ARC_POINTS)
        .map(|k| {
            let f = k as f64 / (RING_ARC_POINTS - 1) as f64;
            let psi = lon_rad - half + 2.0 * half * f;
            let (s, c) = psi.sin_cos();
            let d = (DVec3::new(r_km * c, r_km * s, 0.0) - p).normalize();
            let enu = DVec3::new(d.dot(east), d.dot(north), d.dot(n));
            let (alt, az) = crate::frames::altitude_azimuth(enu);
            RingEdgePoint {
                azimuth_rad: az,
                altitude_rad: alt.max(0.0),
                direction_enu: enu,
            }
        })
        .collect()
}

/// The part of the ring's view that depends only on the world and the place, not on the
/// time: each annulus's arcs across the sky and the face the place looks at. Compute it once
/// per place with [`Planet::ring_arcs`] and pair it with a [`RingMoment`] per instant (the ring
/// does not move in the rotating frame, so the arcs stand still in a place's sky).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct RingArcs {
    /// The place the arcs are seen from.
    pub place: Place,
    /// Each annulus whose outer edge shows above the horizon, inside out.
    pub arcs: Vec<RingArc>,
    /// The face the place looks at: the place's side of the plane (sign of its latitude).
    pub seen_face: RingFace,
}

impl RingArcs {
    /// `true` if the place looks at the face the star lights at `moment` (both on one side of
    /// the plane).
    pub fn sees_lit_face(&self, moment: &RingMoment) -> bool {
        self.seen_face == moment.lit_face && moment.lit_face != RingFace::EdgeOn
    }

    /// The full view at `moment` (clones the arcs; a caller that keeps the arcs needs only
    /// the moment).
    pub fn view_at(&self, moment: &RingMoment) -> RingView {
        RingView {
            t_s: moment.t_s,
            arcs: self.arcs.clone(),
            lit_face: moment.lit_face,
            seen_face: self.seen_face,
            shadow: moment.shadow,
        }
    }
}

/// The part of the ring's view that changes with time at one place: the face the star lights
/// and the ring's shadow there ([`Planet::ring_moment`]). A few multiplications and at most
/// one exponential; nothing allocated.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct RingMoment {
    /// World time, seconds since time zero.
    pub t_s: f64,
    /// The face the star lights: the star's side of the ring plane (sign of its declination).
    pub lit_face: RingFace,
    /// The ring's shadow at the place now, with the transmission of the star's beam.
    pub shadow: RingShadow,
}

impl Planet {
    /// The ring seen from `place` at world time `t_s` (see the [module docs](self)); `None`
    /// on worlds without a ring. The same as [`Planet::ring_arcs`] with
    /// [`Planet::ring_moment`]; a caller asking every frame for one place keeps the arcs and
    /// asks only for the moment.
    pub fn ring_view(&self, t_s: f64, place: Place) -> Option<RingView> {
        let arcs = self.ring_arcs(place)?;
        let moment = self.ring_moment(&self.star_instant(t_s), place)?;
        Some(RingView {
            t_s: moment.t_s,
            arcs: arcs.arcs,
            lit_face: moment.lit_face,
            seen_face: arcs.seen_face,
            shadow: moment.shadow,
        })
    }

    /// The ring's arcs in `place`'s sky, which depend on the world and the place only; `None`
    /// on worlds without a ring.
    pub fn ring_arcs(&self, place: Place) -> Option<RingArcs> {
        let ring = self.ring()?;
        let n = place_unit_vector(place);
        let (so, co) = place.longitude_rad.sin_cos();
        let (sl, cl) = place.latitude_rad.sin_cos();
        let east = DVec3::new(-so, co, 0.0);
        let north = DVec3::new(-sl * co, -sl * so, cl);
        let r = self.body().radius_km;
        let arcs = ring
            .annuli
            .iter()
            .enumerate()
            .map(|(i, a)| RingArc {
                annulus: i,
                inner: edge_arc(a.inner_radius_km, r, n, east, north, place.longitude_rad),
                outer: edge_arc(a.outer_radius_km, r, n, east, north, place.longitude_rad),
            })
            .filter(|arc| !arc.outer.is_empty())
            .collect();
        Some(RingArcs {
            place,
            arcs,
            seen_face: RingFace::of_side(place.latitude_rad),
        })
    }

    /// The lit face and the ring's shadow at `place` at a precomputed instant of the primary
    /// star (`instant.t_s` is the moment's time); `None` on worlds without a ring.
    pub fn ring_moment(&self, instant: &StarInstant, place: Place) -> Option<RingMoment> {
        self.ring()?;
        Some(RingMoment {
            t_s: instant.t_s,
            lit_face: RingFace::of_side(instant.sin_declination),
            shadow: self.ring_shadow(instant, place),
        })
    }
}
