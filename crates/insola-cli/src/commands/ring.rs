//! What the commands say about a world's ring: its annuli and solstice shadow (`check`), the
//! ring in the sky now (`sky`), the day's shadow spans (`day`) and the sunlight it takes from
//! the climate (`climate`). Every command leaves these out on worlds without a ring.

use insola::climate::{BandInsolation, ClimateGrid};
use insola::rings::{RingFace, noon_shadow_latitude_rad};
use insola::sky_events::{EventFilter, EventGroup, RingShadowStage, SkyEventKind};
use insola::{Place, Planet};
use serde::Serialize;

/// One annulus in `check`.
#[derive(Debug, Serialize)]
pub struct AnnulusFacts {
    /// Name from the world file (may be empty).
    pub name: String,
    /// Inner radius, km.
    pub inner_radius_km: f64,
    /// Outer radius, km.
    pub outer_radius_km: f64,
    /// Normal optical depth.
    pub optical_depth: f64,
    /// Transmission of the star's beam through it at a solstice, `exp(−τ / sin ε)`.
    pub solstice_transmission: f64,
    /// At a solstice, the latitudes in the winter hemisphere (degrees, negative: mirror them
    /// for the other solstice) over which its inner and outer edges cast their shadow at local
    /// noon; null where that edge's shadow misses the noon meridian.
    pub solstice_noon_shadow_lat_deg: [Option<f64>; 2],
}

/// The annuli of a ringed world (`None` without a ring).
pub fn facts(p: &Planet) -> Option<Vec<AnnulusFacts>> {
    let ring = p.ring()?;
    let tilt = p.spin().tilt_rad;
    let r = p.body().radius_km;
    // The northern solstice: declination = +tilt, shadow in the south.
    let noon = |rho: f64| noon_shadow_latitude_rad(r, rho, tilt).map(f64::to_degrees);
    Some(
        ring.annuli
            .iter()
            .map(|a| AnnulusFacts {
                name: a.name.clone(),
                inner_radius_km: a.inner_radius_km,
                outer_radius_km: a.outer_radius_km,
                optical_depth: a.optical_depth,
                solstice_transmission: if tilt > 0.0 {
                    (-a.optical_depth / tilt.sin()).exp()
                } else {
                    0.0
                },
                solstice_noon_shadow_lat_deg: [noon(a.inner_radius_km), noon(a.outer_radius_km)],
            })
            .collect(),
    )
}

/// Prints the annuli for `check`.
pub fn print_facts(annuli: &[AnnulusFacts]) {
    say!(
        "  ring             {} annuli in the equatorial plane",
        annuli.len()
    );
    for (i, a) in annuli.iter().enumerate() {
        let lat = |x: Option<f64>| x.map_or_else(|| "beyond noon".into(), |v| format!("{v:.1}°"));
        say!(
            "    {i} {:<12} {:>8.0}–{:<8.0} km  τ {:.3}  solstice beam {:5.1} %  noon shadow {} to {}",
            a.name,
            a.inner_radius_km,
            a.outer_radius_km,
            a.optical_depth,
            100.0 * a.solstice_transmission,
            lat(a.solstice_noon_shadow_lat_deg[0]),
            lat(a.solstice_noon_shadow_lat_deg[1]),
        );
    }
}

/// The ring in the sky for `sky`.
#[derive(Debug, Serialize)]
pub struct RingSkyReport {
    /// Fraction of the star's beam the ring lets through here now.
    pub transmission: f64,
    /// `true` while the ring takes more than half of the beam.
    pub in_shadow: bool,
    /// The annulus the ray toward the star crosses, if any.
    pub annulus: Option<usize>,
    /// The face the star lights: `north`, `south` or `edge-on`.
    pub lit_face: String,
    /// The face seen from here.
    pub seen_face: String,
    /// Per visible annulus: index, and the highest point of its outer edge (altitude,
    /// azimuth, degrees).
    pub arcs: Vec<RingArcTop>,
}

/// The top of one annulus's arc.
#[derive(Debug, Serialize)]
pub struct RingArcTop {
    /// Index of the annulus.
    pub annulus: usize,
    /// Altitude of the highest point of the outer edge, degrees.
    pub altitude_deg: f64,
    /// Its azimuth, degrees clockwise from north.
    pub azimuth_deg: f64,
}

fn face(f: RingFace) -> String {
    match f {
        RingFace::North => "north",
        RingFace::South => "south",
        RingFace::EdgeOn => "edge-on",
    }
    .into()
}

/// The ring seen from `place` at `t_s` (`None` without a ring).
pub fn sky(p: &Planet, t_s: f64, place: Place) -> Option<RingSkyReport> {
    let v = p.ring_view(t_s, place)?;
    Some(RingSkyReport {
        transmission: v.shadow.transmission,
        in_shadow: v.shadow.is_shadowed(),
        annulus: v.shadow.annulus,
        lit_face: face(v.lit_face),
        seen_face: face(v.seen_face),
        arcs: v
            .arcs
            .iter()
            .filter_map(|a| {
                let top = a
                    .outer
                    .iter()
                    .max_by(|x, y| x.altitude_rad.total_cmp(&y.altitude_rad))?;
                Some(RingArcTop {
                    annulus: a.annulus,
                    altitude_deg: top.altitude_rad.to_degrees(),
                    azimuth_deg: top.azimuth_rad.to_degrees(),
                })
            })
            .collect(),
    })
}

/// Prints the ring lines of `sky`.
pub fn print_sky(r: &RingSkyReport) {
    say!(
        "  ring      beam through the ring {:.1} %{}  lit face {}, seen face {}",
        100.0 * r.transmission,
        match (r.in_shadow, r.annulus) {
            (true, Some(i)) => format!(" (in the shadow of annulus {i})"),
            (false, Some(i)) => format!(" (through annulus {i})"),
            _ => String::new(),
        },
        r.lit_face,
        r.seen_face
    );
    for a in &r.arcs {
        say!(
            "            annulus {} arches to altitude {:.1}° at azimuth {:.1}°",
            a.annulus,
            a.altitude_deg,
            a.azimuth_deg
        );
    }
}

/// One span of the ring's shadow in a local day (`day`).
#[derive(Debug, Serialize)]
pub struct ShadowSpan {
    /// The annulus casting it.
    pub annulus: usize,
    /// Local mean time the shadow arrives, hours (null if it was there at the day's start).
    pub enters_h: Option<f64>,
    /// Local mean time it leaves, hours (null if still there at the day's end).
    pub leaves_h: Option<f64>,
}

/// The ring's shadow spans in the local day `[start_s, start_s + length_s)` at `place`.
pub fn day_spans(p: &Planet, place: Place, start_s: f64, length_s: f64) -> Vec<ShadowSpan> {
    if !p.has_ring_shadow() {
        return Vec::new();
    }
    let filter = EventFilter::only([EventGroup::RingShadow]);
    let Ok(events) = p.sky_events_between(place, start_s, start_s + length_s, &filter) else {
        return Vec::new();
    };
    let hours = |t: f64| (t - start_s) / 3600.0;
    let mut spans: Vec<ShadowSpan> = Vec::new();
    for e in events {
        if let SkyEventKind::RingShadow { stage, annulus } = e.kind {
            match stage {
                RingShadowStage::Enters => spans.push(ShadowSpan {
                    annulus,
                    enters_h: Some(hours(e.at_s)),
                    leaves_h: None,
                }),
                RingShadowStage::Leaves => match spans.last_mut() {
                    Some(s) if s.leaves_h.is_none() => s.leaves_h = Some(hours(e.at_s)),
                    _ => spans.push(ShadowSpan {
                        annulus,
                        enters_h: None,
                        leaves_h: Some(hours(e.at_s)),
                    }),
                },
            }
        }
    }
    spans
}

/// The sunlight the ring takes from the climate (`climate`).
#[derive(Debug, Serialize)]
pub struct RingClimateNote {
    /// Global annual-mean top-of-atmosphere insolation lost to the ring, W m⁻².
    pub global_loss_w_m2: f64,
    /// The band losing the most: latitude, degrees.
    pub largest_loss_lat_deg: f64,
    /// Its annual-mean loss, W m⁻².
    pub largest_loss_w_m2: f64,
}

/// What the ring takes from the climate's forcing (`None` without a shadow-casting ring).
pub fn climate_note(p: &Planet) -> Option<RingClimateNote> {
    if !p.has_ring_shadow() {
        return None;
    }
    let spec = p.climate_spec();
    let grid = ClimateGrid::new(spec.bands).ok()?;
    let forcing = p.annual_forcing(spec.steps_per_year);
    let bare = BandInsolation::from_forcing(&forcing, &grid, spec.steps_per_year).ok()?;
    let ringed = p
        .ring_band_insolation(&forcing, &grid, spec.steps_per_year)
        .ok()?;
    let loss: Vec<f64> = bare
        .mean_per_band()
        .iter()
        .zip(ringed.mean_per_band())
        .map(|(a, b)| a - b)
        .collect();
    let (j, largest) = loss
        .iter()
        .copied()
        .enumerate()
        .max_by(|a, b| a.1.total_cmp(&b.1))?;
    Some(RingClimateNote {
        global_loss_w_m2: grid.global_mean(&loss),
        largest_loss_lat_deg: grid.lat_centres_rad()[j].to_degrees(),
        largest_loss_w_m2: largest,
    })
}
