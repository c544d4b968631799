//! A world with both a ring and two suns: the ring's shadow dims each star's beam along that
//! star's own ray, and the climate is forced by every star's ring-shadowed table, summed.

use insola::lighting::LightMode;
use insola::{Place, Planet, WorldSpec};

/// The invented two-sun world Ambrivane with an invented ring added.
fn ambrivane_with_ring(optical_depth: f64) -> Planet {
    let mut spec = WorldSpec::from_ron_str(include_str!("../worlds/ambrivane.world.ron")).unwrap();
    let ring = format!(
        "(annuli: [(inner_radius_km: 9000, outer_radius_km: 16000, optical_depth: {optical_depth})])"
    );
    spec.ring = Some(ron::from_str(&ring).unwrap());
    Planet::new(&spec).unwrap()
}

#[test]
fn the_ring_dims_each_star_along_its_own_ray() {
    let ringed = ambrivane_with_ring(0.8);
    let place = Place::from_degrees(25.0, 10.0).unwrap();
    let mut shadowed = 0;
    for step in 0..2000 {
        let t = f64::from(step) * 0.173 * ringed.day_s();
        let lit = ringed.lighting(t, place, LightMode::TopOfAtmosphere);
        for other in &lit.other_stars {
            let instant = ringed.star_instant_of(other.star, t).unwrap();
            let transmission = ringed.ring_transmission(&instant, place);
            let clear = ringed
                .star_position_of(other.star, t, place)
                .unwrap()
                .toa_insolation_w_m2;
            // The companion's hidden fraction holds the ring's share (layers multiply), and its
            // insolation is its clear-sky value times what gets through.
            assert!(other.eclipse_fraction >= 1.0 - transmission - 1e-12);
            let want = clear * (1.0 - other.eclipse_fraction);
            assert!(
                (other.toa_insolation_w_m2 - want).abs() <= 1e-9 * clear.max(1.0),
                "t {t}: {} vs {want}",
                other.toa_insolation_w_m2
            );
            shadowed += usize::from(transmission < 0.99 && clear > 0.0);
        }
    }
    assert!(shadowed > 0, "the ring never shadowed the companion here");
}

#[test]
fn a_clear_ring_on_a_two_sun_world_changes_no_temperature() {
    let clear = ambrivane_with_ring(0.0).equilibrate_climate().unwrap();
    let plain = Planet::new(
        &WorldSpec::from_ron_str(include_str!("../worlds/ambrivane.world.ron")).unwrap(),
    )
    .unwrap()
    .equilibrate_climate()
    .unwrap();
    for (a, b) in clear.band_stats().iter().zip(plain.band_stats()) {
        assert!(
            (a.mean_c - b.mean_c).abs() < 1e-6,
            "{} vs {}",
            a.mean_c,
            b.mean_c
        );
    }
}

#[test]
fn the_ring_cools_a_two_sun_world() {
    let ringed = ambrivane_with_ring(0.8).equilibrate_climate().unwrap();
    let clear = ambrivane_with_ring(0.0).equilibrate_climate().unwrap();
    let mean = |c: &insola::climate::ClimateCycle| c.global_mean_c();
    assert!(
        mean(&ringed) < mean(&clear) - 0.5,
        "{} vs {}",
        mean(&ringed),
        mean(&clear)
    );
}
