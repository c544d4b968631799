//! Checks of the ring's shadow, daily mean and sky against independent computations.

use std::f64::consts::{FRAC_PI_2, PI, TAU};

use glam::DVec3;

use super::daily_mean::{ring_daily_mean_w_m2, ring_day_moments};
use super::shadow::RingGeometry;
use crate::lighting::LightMode;
use crate::seasons::SeasonMark;
use crate::world::{AnnulusSpec, RingSpec};
use crate::{Place, Planet, WorldSpec};

/// A small seeded generator (SplitMix64; Steele, Lea & Flood 2014) so the random checks repeat.
struct SplitMix(u64);

impl SplitMix {
    fn next(&mut self) -> f64 {
        self.0 = self.0.wrapping_add(0x9E37_79B9_7F4A_7C15);
        let mut z = self.0;
        z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
        z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
        ((z ^ (z >> 31)) >> 11) as f64 / (1u64 << 53) as f64
    }

    fn range(&mut self, lo: f64, hi: f64) -> f64 {
        lo + (hi - lo) * self.next()
    }
}

/// A place from radians.
fn rad_place(latitude_rad: f64, longitude_rad: f64) -> Place {
    Place {
        latitude_rad,
        longitude_rad,
    }
}

fn annulus(inner: f64, outer: f64, tau: f64) -> AnnulusSpec {
    AnnulusSpec {
        name: String::new(),
        inner_radius_km: inner,
        outer_radius_km: outer,
        optical_depth: tau,
    }
}

/// An invented ringed test world: obliquity, planet radius (km) and annuli given.
fn ringed(obliquity_deg: f64, radius_km: f64, annuli: Vec<AnnulusSpec>) -> Planet {
    let text = format!(
        r#"(name: "Annulet", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
            orbit: (semi_major_axis_au: 1, eccentricity: 0.03, periapsis_longitude_deg: 40, period_days: 300),
            spin: (obliquity_deg: {obliquity_deg}, solar_day_hours: 21),
            body: (radius_km: {radius_km}))"#
    );
    let mut spec = WorldSpec::from_ron_str(&text).unwrap();
    spec.ring = Some(RingSpec { annuli });
    Planet::new(&spec).unwrap()
}

/// The shipped world files (read here, not through `built_in_worlds`, so the tests run
/// without that feature).
const SHIPPED: [(&str, &str); 5] = [
    ("verdance", include_str!("../../worlds/verdance.world.ron")),
    ("calvenne", include_str!("../../worlds/calvenne.world.ron")),
    ("oromar", include_str!("../../worlds/oromar.world.ron")),
    ("thalcary", include_str!("../../worlds/thalcary.world.ron")),
    (
        "earth-reference",
        include_str!("../../worlds/reference/earth.world.ron"),
    ),
];

pub(crate) fn thalcary() -> Planet {
    Planet::new(&WorldSpec::from_ron_str(SHIPPED[3].1).unwrap()).unwrap()
}

/// The same world without its ring.
fn without_ring(p: &Planet) -> Planet {
    let mut spec = p.spec().clone();
    spec.ring = None;
    Planet::new(&spec).unwrap()
}

/// Independent transmission by ray marching: step from the ground point toward the star through
/// a slab of thickness `slab_km` about the equatorial plane, inside which each annulus has the
/// extinction coefficient `τ / slab_km`, and sum the optical depth met (midpoint rule; outside
/// the slab the step is the distance to it along the ray, so no part of the slab is skipped).
/// Returns the transmission and the distance from the axis where the ray met `z = 0`.
fn ray_march(
    planet_r_km: f64,
    annuli: &[AnnulusSpec],
    ground: DVec3,
    star: DVec3,
    slab_km: f64,
) -> (f64, Option<f64>) {
    let p0 = ground * planet_r_km;
    let half = 0.5 * slab_km;
    let fine = slab_km / star.z.abs().max(1e-6) / 4000.0;
    let far = 4.0 * annuli.last().unwrap().outer_radius_km;
    let (mut t, mut depth, mut crossing) = (0.0, 0.0, None);
    let mut last_z = p0.z;
    while t < 10.0 * far {
        let p = p0 + star * t;
        if p.z.abs() > half {
            // Heading away from the slab, or beyond the ring: nothing more to meet.
            if p.z * star.z > 0.0 || p.truncate().length() > far {
                break;
            }
            t += ((p.z.abs() - half) / star.z.abs()).max(fine);
            last_z = p.z;
            continue;
        }
        let mid = p0 + star * (t + 0.5 * fine);
        let rho = mid.truncate().length();
        if let Some(a) = annuli
            .iter()
            .find(|a| rho >= a.inner_radius_km && rho < a.outer_radius_km)
        {
            depth += a.optical_depth / slab_km * fine;
        }
        if crossing.is_none() && (mid.z == 0.0 || mid.z * last_z < 0.0) {
            crossing = Some(rho);
        }
        last_z = mid.z;
        t += fine;
    }
    ((-depth).exp(), crossing)
}

/// The unit vector of a local east-north-up direction in the rotating frame.
fn rotating_from_enu(place: Place, enu: DVec3) -> DVec3 {
    let (sl, cl) = place.latitude_rad.sin_cos();
    let (so, co) = place.longitude_rad.sin_cos();
    let east = DVec3::new(-so, co, 0.0);
    let north = DVec3::new(-sl * co, -sl * so, cl);
    let up = DVec3::new(cl * co, cl * so, sl);
    east * enu.x + north * enu.y + up * enu.z
}

#[test]
fn shadow_matches_ray_marching_through_a_thin_slab() {
    // Independent check: Beer–Lambert along the ray through a thin slab, integrated step by
    // step, for random worlds, places and instants; the star's direction comes from the
    // east-north-up position turned into the rotating frame, not from the shadow code's own.
    let mut rng = SplitMix(0x5eed_0014);
    let slab_km = 0.01;
    let (mut shaded, mut checked) = (0, 0);
    for _ in 0..700 {
        let r = rng.range(2000.0, 60000.0);
        let mut edge = r * rng.range(1.0, 1.4);
        let annuli: Vec<AnnulusSpec> = (0..1 + (rng.next() * 3.0) as usize)
            .map(|_| {
                let inner = edge + r * rng.range(0.0, 0.3);
                let outer = inner + r * rng.range(0.1, 1.0);
                edge = outer;
                annulus(inner, outer, rng.range(0.0, 2.5))
            })
            .collect();
        // Forward and backward spins alike (obliquity past 90°).
        let p = ringed(rng.range(5.0, 175.0), r, annuli.clone());
        let t = rng.range(0.0, 2.0 * p.year_s());
        let place = Place::from_degrees(rng.range(-89.0, 89.0), rng.range(-180.0, 180.0)).unwrap();
        let instant = p.star_instant(t);
        let pos = p.star_position_at(&instant, place);
        let star = rotating_from_enu(place, pos.direction_enu);
        assert!((star - p.star_direction_rotating(&instant)).length() < 1e-12);
        let got = p.ring_shadow(&instant, place);
        if pos.altitude_rad <= 0.0 || star.z.abs() < 0.05 {
            continue; // Below the horizon the ring is not asked; grazing rays march too long.
        }
        let ground = super::shadow::place_unit_vector(place);
        let (want, crossing) = ray_march(r, &annuli, ground, star, slab_km);
        // Skip rays that cross within the slab's smear of an edge (the slab is not a plane).
        let smear = 2.0 * slab_km / star.z.abs();
        if let Some(rho) = crossing
            && annuli.iter().any(|a| {
                (rho - a.inner_radius_km).abs() < smear || (rho - a.outer_radius_km).abs() < smear
            })
        {
            continue;
        }
        checked += 1;
        if got.annulus.is_some() {
            shaded += 1;
        }
        assert!(
            (got.transmission - want).abs() < 2e-3,
            "r {r}, {annuli:?}, {place:?}, t {t}: {got:?} vs marched {want}"
        );
        if let (Some(a), Some(b)) = (got.crossing_radius_km, crossing) {
            assert!((a - b).abs() < 1e-3 * r, "{a} vs {b}");
        }
    }
    assert!(
        checked > 300 && shaded > 25,
        "{checked} checked, {shaded} shaded"
    );
}

#[test]
fn shadow_band_latitudes_on_the_meridian_match_the_closed_form() {
    // Closed form (parallel rays, the meridian facing the star): the place at latitude φ is
    // R(cos φ, 0, sin φ), the star (cos δ, 0, sin δ). The ray meets z = 0 at t = −R sin φ / sin δ,
    // at x = R cos φ − R sin φ cos δ / sin δ = R sin(δ − φ) / sin δ: so ρ = R sin(δ − φ)/sin δ,
    // and a ring edge of radius ρ lies over φ = δ − asin((ρ/R) sin δ) (the principal branch:
    // with the star up at noon, δ − φ < 90°).
    let r = 7000.0;
    let (inner, outer) = (1.3 * r, 1.9 * r);
    let p = ringed(27.0, r, vec![annulus(inner, outer, 0.8)]);
    for mark in [SeasonMark::NorthernSolstice, SeasonMark::SouthernSolstice] {
        let t = p.time_of_season_mark(mark, 0.0);
        let instant = p.star_instant(t);
        let s = p.star_direction_rotating(&instant);
        let lon = s.y.atan2(s.x); // the sub-star meridian: hour angle 0
        let d = instant.declination_rad;
        let edge_lat = |rho: f64| d - ((rho / r) * d.sin()).asin();
        assert_eq!(
            super::noon_shadow_latitude_rad(r, inner, d),
            Some(edge_lat(inner))
        );
        assert_eq!(super::noon_shadow_latitude_rad(r, 10.0 * r, d), None);
        let (phi_in, phi_out) = (edge_lat(inner), edge_lat(outer));
        assert!(phi_in.abs() < phi_out.abs() && phi_in * d < 0.0);
        let at = |phi: f64| p.ring_shadow(&instant, rad_place(phi, lon));
        let eps = 1e-7;
        let toward_pole = -d.signum();
        // Inside the band just past the inner edge's latitude and just short of the outer's.
        assert_eq!(at(phi_in + toward_pole * eps).annulus, Some(0), "{mark:?}");
        assert_eq!(at(phi_out - toward_pole * eps).annulus, Some(0), "{mark:?}");
        assert_eq!(at(phi_in - toward_pole * eps).annulus, None, "{mark:?}");
        assert_eq!(at(phi_out + toward_pole * eps).annulus, None, "{mark:?}");
        // The crossing radius follows ρ = R sin(δ − φ)/sin δ across the hemisphere.
        for k in 1..20 {
            let phi = toward_pole * k as f64 * 3f64.to_radians();
            if phi.abs() > FRAC_PI_2 - d.abs() - 0.01 {
                break;
            }
            let rho = at(phi).crossing_radius_km.unwrap();
            let want = r * (d - phi).sin() / d.sin();
            assert!((rho - want).abs() < 1e-9 * want, "{phi}: {rho} vs {want}");
        }
        // The transmission inside is Beer–Lambert with the slant path 1/|sin δ|.
        let mid = at(0.5 * (phi_in + phi_out));
        assert!((mid.transmission - (-0.8 / d.sin().abs()).exp()).abs() < 1e-12);
        // The summer hemisphere sees no shadow.
        assert_eq!(at(-0.5 * (phi_in + phi_out)), super::RingShadow::CLEAR);
    }
}

/// Every shipped world with a transparent ring added.
fn with_clear_ring(p: &Planet) -> Planet {
    let mut spec = p.spec().clone();
    let r = p.body().radius_km;
    spec.ring = Some(RingSpec {
        annuli: vec![
            annulus(1.2 * r, 2.5 * r, 0.0),
            annulus(2.6 * r, 3.0 * r, 0.0),
        ],
    });
    Planet::new(&spec).unwrap()
}

#[test]
fn a_ring_of_zero_optical_depth_changes_nothing() {
    use crate::sky_events::EventFilter;
    for (name, ron) in SHIPPED {
        let mut spec = WorldSpec::from_ron_str(ron).unwrap();
        spec.ring = None;
        let bare = Planet::new(&spec).unwrap();
        let clear = with_clear_ring(&bare);
        assert!(!clear.has_ring_shadow() && !clear.daily_mean_needs_quadrature());
        for k in 0..40 {
            let t = k as f64 * 0.137 * bare.year_s();
            let place =
                Place::from_degrees(-80.0 + 4.1 * k as f64, -170.0 + 8.7 * k as f64).unwrap();
            for mode in [LightMode::Ground, LightMode::TopOfAtmosphere] {
                let (a, b) = (
                    bare.lighting(t, place, mode),
                    clear.lighting(t, place, mode),
                );
                assert_eq!(a, b, "{name}");
            }
            let i = bare.star_instant(t);
            let d = (bare.top_of_atmosphere_insolation_w_m2(&i, place)
                - clear.top_of_atmosphere_insolation_w_m2(&i, place))
            .abs();
            assert!(d <= 1e-12, "{name}");
            let lat = place.latitude_rad;
            let (q0, q1) = (
                bare.daily_mean_insolation_w_m2(t, lat),
                clear.ring_daily_mean_insolation_w_m2(t, lat),
            );
            assert!((q0 - q1).abs() <= 1e-12, "{name}: {q0} {q1}");
            let f = bare.star_frame(t).at(place);
            let g = clear.star_frame(t).at(place);
            assert_eq!(f, g);
        }
        let place = Place::from_degrees(-20.0, 10.0).unwrap();
        let days = 3.0 * bare.day_s().min(bare.year_s());
        let filter = EventFilter::all();
        assert_eq!(
            bare.sky_events_between(place, 0.0, days, &filter).unwrap(),
            clear.sky_events_between(place, 0.0, days, &filter).unwrap(),
            "{name}"
        );
        if let (Ok(a), Ok(b)) = (bare.equilibrate_climate(), clear.equilibrate_climate()) {
            for k in 0..12 {
                let f = k as f64 / 12.0;
                for lat in [-60.0f64, -20.0, 0.0, 30.0, 70.0] {
                    let (ta, tb) = (
                        a.temperature_c(lat.to_radians(), f),
                        b.temperature_c(lat.to_radians(), f),
                    );
                    assert!((ta - tb).abs() <= 1e-12, "{name}: {ta} {tb}");
                }
            }
        }
    }
}

#[test]
fn quadrature_equals_berger_without_a_ring() {
    // Berger (1978) closed form against the piecewise Gauss–Legendre quadrature with a
    // transparent ring (so the breakpoints are still put in), 1e-6 relative.
    let geometry = RingGeometry::new(
        &RingSpec {
            annuli: vec![annulus(7000.0, 9000.0, 0.0), annulus(9500.0, 15000.0, 0.0)],
        },
        6000.0,
    );
    for lat in (-18..=18).map(|k| (k as f64 * 5.0).to_radians()) {
        for decl in (-9..=9).map(|k| (k as f64 * 4.0).to_radians()) {
            let want = crate::insolation::daily_mean_w_m2(1361.0, lat, decl, 1.02);
            let got = ring_daily_mean_w_m2(&geometry, 1361.0, lat, decl, 1.02);
            assert!(
                (got - want).abs() <= 1e-6 * want.max(1e-3),
                "{lat} {decl}: {got} vs {want}"
            );
        }
    }
}

#[test]
fn quadrature_with_a_ring_matches_a_fine_sum_and_never_exceeds_the_ringless_mean() {
    // A midpoint sum over 200 000 hour angles (independent of the breakpoints), to 0.1 W m⁻².
    let p = thalcary();
    let geometry = p.ring_geometry().unwrap();
    let s0 = p.flux_at_mean_distance_w_m2();
    let mut dimmed = 0;
    for lat in (-17..=17).map(|k| (k as f64 * 5.0).to_radians()) {
        for decl in (-7..=7).map(|k| (k as f64 * 4.0).to_radians()) {
            let q = ring_daily_mean_w_m2(&geometry, s0, lat, decl, 1.0);
            let bare = crate::insolation::daily_mean_w_m2(s0, lat, decl, 1.0);
            assert!(q <= bare + 1e-9, "{lat} {decl}: {q} > {bare}");
            if q < bare - 1.0 {
                dimmed += 1;
            }
            let n = 200_000;
            let (sp, cp) = lat.sin_cos();
            let (sd, cd) = decl.sin_cos();
            let ground = DVec3::new(cp, 0.0, sp);
            let mut sum = 0.0;
            for k in 0..n {
                let h = -PI + TAU * (k as f64 + 0.5) / n as f64;
                let mu = sp * sd + cp * cd * h.cos();
                if mu > 0.0 {
                    let star = DVec3::new(cd * h.cos(), -cd * h.sin(), sd);
                    sum += s0 * mu * geometry.shadow(ground, star).transmission;
                }
            }
            let fine = sum / n as f64;
            assert!((q - fine).abs() < 0.1, "{lat} {decl}: {q} vs {fine}");
        }
    }
    assert!(dimmed > 20, "{dimmed}");
    // The moments give Berger's weighted cosine without a ring.
    let (m1, m2) = ring_day_moments(&geometry, 0.0, 0.0);
    assert!((m1 - 1.0).abs() < 1e-12 && (m2 / m1 - PI / 4.0).abs() < 1e-12);
}

#[test]
fn the_ringed_world_has_a_colder_winter_under_the_shadow() {
    let ringed = thalcary();
    let bare = without_ring(&ringed);
    let (a, b) = (
        ringed.equilibrate_climate().unwrap(),
        bare.equilibrate_climate().unwrap(),
    );
    // Southern winter: the northern solstice; the noon shadow of the dense band lies south of
    // about 25°S then (see the world file), so a band at 35°S is under it.
    let f = ringed.year_fraction(ringed.time_of_season_mark(SeasonMark::NorthernSolstice, 0.0));
    let lat = (-35f64).to_radians();
    let (cold, warm) = (a.temperature_c(lat, f), b.temperature_c(lat, f));
    assert!(cold < warm - 1.0, "ringed {cold} vs ringless {warm}");
    // The ring only takes light away: no band is warmer for it at that instant (beyond the
    // model's convergence tolerance).
    for k in -8..=8 {
        let lat = (k as f64 * 10.0).to_radians();
        assert!(
            a.temperature_c(lat, f) < b.temperature_c(lat, f) + 0.05,
            "{k}: {} vs {}",
            a.temperature_c(lat, f),
            b.temperature_c(lat, f)
        );
    }
}

#[test]
fn energy_balance_holds_under_the_ring() {
    // As the climate's own budget check (North, Cahalan & Coakley 1981): over the periodic
    // year the area- and time-mean absorbed sunlight equals the outgoing longwave to
    // 0.1 W m⁻², now with the ring's table.
    use crate::climate::{ClimateGrid, EnergyBalanceModel, Start, equilibrate_model};
    let p = thalcary();
    let spec = p.climate_spec();
    let forcing = p.annual_forcing(spec.steps_per_year);
    let grid = ClimateGrid::new(spec.bands).unwrap();
    let table = p
        .ring_band_insolation(&forcing, &grid, spec.steps_per_year)
        .unwrap();
    let m = EnergyBalanceModel::new(&spec, table).unwrap();
    let cycle = equilibrate_model(&m, Some(&forcing), &Start::SteadyAnnualMean).unwrap();
    let (nb, steps) = (m.grid().len(), m.steps_per_year());
    let (mut absorbed, mut olr) = (0.0, 0.0);
    for k in 0..steps {
        let now = cycle.temperatures_c(k);
        let next = cycle.temperatures_c((k + 1) % steps);
        let q = m.insolation.row((k + 1) % steps);
        for j in 0..nb {
            absorbed += q[j] * m.coalbedo(j, now[j]);
            olr += m.olr_w_m2(next[j]);
        }
    }
    let n = (steps * nb) as f64;
    let (absorbed, olr) = (absorbed / n, olr / n);
    assert!(
        (absorbed - olr).abs() < 0.1,
        "absorbed {absorbed:.3} vs outgoing {olr:.3} W/m²"
    );
}

#[test]
fn the_ring_dims_every_consumer_alike_and_is_named() {
    let p = thalcary();
    let t = p.time_of_season_mark(SeasonMark::NorthernSolstice, 0.0);
    let instant = p.star_instant(t);
    let s = p.star_direction_rotating(&instant);
    // Noon on the sub-star meridian at 35°S: under the dense band.
    let place = rad_place((-35f64).to_radians(), s.y.atan2(s.x));
    let shadow = p.ring_shadow(&instant, place);
    assert_eq!(shadow.annulus, Some(1));
    assert!(shadow.is_shadowed());
    let o = p.star_occlusion(&instant, place);
    assert_eq!(o.by, Some(crate::occlusion::Occluder::Ring));
    assert_eq!(crate::occlusion::Occluder::Ring.to_string(), "ring");
    assert!((o.transmitted_fraction() - shadow.transmission).abs() < 1e-12);
    let light = p.lighting(t, place, LightMode::Ground);
    assert_eq!(
        light.star_occluded_by,
        Some(crate::occlusion::Occluder::Ring)
    );
    assert_eq!(light.star_eclipse_fraction, o.hidden_fraction);
    let bare = without_ring(&p).lighting(t, place, LightMode::Ground);
    assert!(
        (light.star.illuminance_lux - bare.star.illuminance_lux * shadow.transmission).abs()
            < 1e-9 * bare.star.illuminance_lux
    );
    let toa = p.top_of_atmosphere_insolation_w_m2(&instant, place);
    assert!((light.toa_insolation_w_m2 - toa).abs() < 1e-9);
    let frame = p.star_frame(t);
    assert!(frame.eclipse_possible());
    let sky = frame.at(place);
    assert!((sky.toa_insolation_w_m2 - toa).abs() < 1e-9 * toa.max(1.0));
    assert_eq!(sky.occlusion.by, Some(crate::occlusion::Occluder::Ring));
    let f32_sky = frame.to_f32().at(&crate::PlaceF32::new(place));
    assert!((f64::from(f32_sky.toa_insolation_w_m2) - toa).abs() < 1e-3 * toa);
    // The ringless path of a ringless world is untouched: no ring sight at all.
    assert!(without_ring(&p).star_frame(t).ring_sight().is_none());
}

#[test]
fn from_the_equator_the_ring_is_edge_on() {
    // An observer in the ring plane sees every ring point in that plane: the directions have
    // no north component, so they lie on the great circle through east, zenith and west.
    let p = thalcary();
    let view = p
        .ring_view(1.0e6, Place::from_degrees(0.0, 33.0).unwrap())
        .unwrap();
    assert_eq!(view.seen_face, super::RingFace::EdgeOn);
    assert!(!view.sees_lit_face());
    assert_eq!(view.arcs.len(), 3);
    for arc in &view.arcs {
        for point in arc.inner.iter().chain(&arc.outer) {
            assert!(point.direction_enu.y.abs() < 1e-12, "{point:?}");
            assert!(point.altitude_rad >= 0.0);
        }
    }
}

#[test]
fn highest_point_of_the_arc_matches_the_closed_form() {
    // In the meridian plane the edge point toward the equator is at distance r from the centre;
    // from the place at R(cos φ, sin φ) the sight line is (r − R cos φ, −R sin φ), whose parts
    // along up (cos φ, sin φ) and toward the equator (sin φ, −cos φ) are r cos φ − R and
    // r sin φ: tan(alt) = (r cos φ − R)/(r sin φ), azimuth due south in the north.
    let p = thalcary();
    let r_planet = p.body().radius_km;
    for lat_deg in [5.0f64, 20.0, 35.0, -25.0] {
        let phi = lat_deg.to_radians();
        let view = p.ring_view(0.0, rad_place(phi, 1.0)).unwrap();
        for arc in &view.arcs {
            let r = p.ring().unwrap().annuli[arc.annulus].outer_radius_km;
            let want = ((r * phi.cos() - r_planet) / (r * phi.sin().abs())).atan();
            let top = arc
                .outer
                .iter()
                .max_by(|a, b| a.altitude_rad.total_cmp(&b.altitude_rad))
                .unwrap();
            assert!(
                (top.altitude_rad - want).abs() < 1e-9,
                "{lat_deg}: {top:?} vs {want}"
            );
            let south = if phi > 0.0 { PI } else { 0.0 };
            let daz = crate::angle::wrap_pi(top.azimuth_rad - south).abs();
            assert!(daz < 1e-9, "{lat_deg}: {}", top.azimuth_rad);
            // The ends of the arc sit on the horizon.
            assert!(arc.outer[0].altitude_rad.abs() < 1e-7);
        }
        assert_eq!(
            view.seen_face,
            if phi > 0.0 {
                super::RingFace::North
            } else {
                super::RingFace::South
            }
        );
    }
    // Far toward the pole the ring sinks below the horizon (r cos φ ≤ R for every edge).
    let polar = p
        .ring_view(0.0, Place::from_degrees(75.0, 0.0).unwrap())
        .unwrap();
    assert!(polar.arcs.is_empty());
}

#[test]
fn map_forcing_takes_the_ring_in_every_form() {
    use crate::map_climate::{ForcingMode, MapForcing, MapGrid};
    // Daily-mean form (a fast rotator): the rows are the zonal model's ringed table.
    let p = thalcary();
    let grid = MapGrid::new(24, 36).unwrap();
    let f = MapForcing::from_planet(&p, &grid, 96).unwrap();
    assert_eq!(f.mode(), ForcingMode::DailyMean);
    let table = p
        .ring_band_insolation(&p.annual_forcing(96), grid.rows(), 96)
        .unwrap();
    assert_eq!(f.daily_table().unwrap(), &table);
    // Instantaneous form (a slow rotator): no cell gets more than without the ring, and the
    // shadow takes at least a tenth from many cells over the year.
    let mut spec = p.spec().clone();
    spec.spin.solar_day_hours = Some(24.0 * 40.0);
    let slow = Planet::new(&spec).unwrap();
    let bare = without_ring(&slow);
    let (fr, fb) = (
        MapForcing::from_planet(&slow, &grid, 360).unwrap(),
        MapForcing::from_planet(&bare, &grid, 360).unwrap(),
    );
    assert!(matches!(fr.mode(), ForcingMode::Instantaneous { .. }));
    let mut dimmed = 0;
    for k in (0..360).step_by(7) {
        let (qr, qb) = (fr.insolation_w_m2(k, &grid), fb.insolation_w_m2(k, &grid));
        for (&a, &b) in qr.iter().zip(&qb) {
            assert!(a <= b + 1e-9 && a >= 0.0);
            if a < 0.9 * b {
                dimmed += 1;
            }
        }
    }
    assert!(dimmed > 50, "{dimmed}");
}

#[test]
fn the_bulk_sight_and_the_single_query_agree() {
    let p = thalcary();
    let mut rng = SplitMix(77);
    for _ in 0..500 {
        let t = rng.range(0.0, p.year_s());
        let place = rad_place(rng.range(-1.5, 1.5), rng.range(-PI, PI));
        let instant = p.star_instant(t);
        let single = p.ring_shadow(&instant, place);
        let bulk = p
            .ring_sight(&instant)
            .unwrap()
            .shadow_at(super::shadow::place_unit_vector(place));
        assert_eq!(single, bulk);
    }
}

#[test]
fn arc_points_lie_on_the_ring_edges_and_above_the_horizon() {
    // Independent check of the arcs: follow each point's direction from the place back to the
    // ring plane and measure the distance from the axis there; it must be the edge's radius.
    let p = thalcary();
    let r_planet = p.body().radius_km;
    let mut rng = SplitMix(4242);
    for _ in 0..40 {
        let place = rad_place(rng.range(-1.2, 1.2), rng.range(-PI, PI));
        let view = p.ring_view(rng.range(0.0, p.year_s()), place).unwrap();
        let ground = super::shadow::place_unit_vector(place) * r_planet;
        for arc in &view.arcs {
            let a = &p.ring().unwrap().annuli[arc.annulus];
            for (points, radius) in [
                (&arc.inner, a.inner_radius_km),
                (&arc.outer, a.outer_radius_km),
            ] {
                for point in points.iter() {
                    assert!(point.altitude_rad >= 0.0 && point.altitude_rad <= FRAC_PI_2);
                    let d = rotating_from_enu(place, point.direction_enu);
                    if d.z.abs() < 1e-9 {
                        continue; // In the plane (the equator): no single crossing.
                    }
                    let t = -ground.z / d.z;
                    assert!(t > 0.0, "{point:?}");
                    let hit = ground + d * t;
                    let rho = (hit.x * hit.x + hit.y * hit.y).sqrt();
                    assert!((rho - radius).abs() < 1e-6 * radius, "{rho} vs {radius}");
                }
            }
        }
    }
}

#[test]
fn arcs_kept_for_a_place_and_a_moment_per_instant_equal_the_full_view() {
    // What a caller that keeps the arcs of one place (the plugin, every frame) shows must be
    // the full view of each instant: the arcs computed once, at no particular time, agree to
    // 1e-12 with those of a view at any instant, and the moment's face and shadow are the
    // view's and the shadow query's.
    let p = thalcary();
    let mut rng = SplitMix(9191);
    for _ in 0..20 {
        let place = rad_place(rng.range(-1.4, 1.4), rng.range(-PI, PI));
        let kept = p.ring_arcs(place).unwrap();
        assert_eq!(kept.place, place);
        for _ in 0..10 {
            let t = rng.range(-3.0 * p.year_s(), 3.0 * p.year_s());
            let view = p.ring_view(t, place).unwrap();
            let instant = p.star_instant(t);
            let moment = p.ring_moment(&instant, place).unwrap();
            assert_eq!(moment.t_s, t);
            assert_eq!(moment.lit_face, view.lit_face);
            assert_eq!(kept.seen_face, view.seen_face);
            assert_eq!(kept.sees_lit_face(&moment), view.sees_lit_face());
            assert_eq!(moment.shadow, view.shadow);
            assert_eq!(moment.shadow, p.ring_shadow(&instant, place));
            assert_eq!(kept.arcs.len(), view.arcs.len());
            for (a, b) in kept.arcs.iter().zip(&view.arcs) {
                assert_eq!(a.annulus, b.annulus);
                for (pa, pb) in [(&a.inner, &b.inner), (&a.outer, &b.outer)] {
                    assert_eq!(pa.len(), pb.len());
                    for (x, y) in pa.iter().zip(pb.iter()) {
                        assert!((x.direction_enu - y.direction_enu).length() < 1e-12);
                        assert!((x.altitude_rad - y.altitude_rad).abs() < 1e-12);
                        assert!((x.azimuth_rad - y.azimuth_rad).abs() < 1e-12);
                    }
                }
            }
            assert_eq!(kept.view_at(&moment), view);
        }
    }
    let no_ring = without_ring(&p);
    let place = rad_place(0.5, 0.1);
    assert!(no_ring.ring_arcs(place).is_none());
    assert!(
        no_ring
            .ring_moment(&no_ring.star_instant(0.0), place)
            .is_none()
    );
}
