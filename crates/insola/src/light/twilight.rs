//! Sky light through the whole day: daylight, the three twilights and night, with one
//! continuous curve, its colour and the twilight phase.
//!
//! The Earth reference curve (clear sky, horizontal illuminance from the sky alone, star of
//! 127.5 klx at the top of the atmosphere) is a monotone cubic Hermite spline (Fritsch–Butland
//! slopes) through log₁₀ of handbook values at the star's geometric altitude h:
//!
//! | h | lux | source |
//! |---|---|---|
//! | −18° | 6 × 10⁻⁴ | AMS Glossary, "astronomical twilight" |
//! | −12° | 0.008 | same |
//! | −6° | 3.4 | "Lux" handbook value; AMS Glossary "civil twilight" gives ~2–3.5 |
//! | −0.833° (sunset) | 450 | "Lux" gives ~400 and the AMS Glossary 410–585; 450 sits in both |
//! | +3° | IES 1984 clear sky | joined with equal slope; above 3° the IES curve itself is used |
//!
//! Below −18° the curve goes on falling at its slope there (about 0.19 decades per degree).
//! A constant night floor of [`NIGHT_SKY_FLOOR_LUX`] (airglow and starlight; the 0.0005 lx floor
//! of USNO Circular 171) is reported separately; the moonless clear night is also quoted as
//! ~0.002 lx elsewhere.
//!
//! On another world the curve is multiplied by the star's top-of-atmosphere illuminance over
//! 127.5 klx and by [`super::sky_brightness_scale`]. The twilight altitudes are kept as on
//! Earth: a thicker or taller atmosphere would stretch twilight, which this model does not do.
//! An airless world has no sky light, only the night floor.
//!
//! Twilight colour: the skylight spectrum of `daylight` with the star on the horizon, weighted
//! further by (τ_R(λ)/τ_R(550 nm))^n with n rising linearly from 0 at the horizon to
//! [`TWILIGHT_BLUE_POWER`] at −12° and held below. This documented simple approach stands in for
//! the blueing of the twilight sky by ozone (Chappuis band) and by repeated scattering, which are
//! not modelled.

use serde::{Deserialize, Serialize};

use super::daylight::ies_clear_sky_diffuse_lux;

/// Standard rise/set altitude of the Sun's centre on Earth, in degrees: −(34′ refraction + 16′
/// semidiameter) (Explanatory Supplement to the Astronomical Almanac).
pub const STANDARD_RISE_ALTITUDE_DEG: f64 = -0.8333;
/// End of civil twilight: star's centre at −6°.
pub const CIVIL_TWILIGHT_DEG: f64 = -6.0;
/// End of nautical twilight: star's centre at −12°.
pub const NAUTICAL_TWILIGHT_DEG: f64 = -12.0;
/// End of astronomical twilight: star's centre at −18°.
pub const ASTRONOMICAL_TWILIGHT_DEG: f64 = -18.0;
/// Horizontal illuminance of the moonless clear night sky (airglow + starlight), in lux: the
/// floor used by USNO Circular 171.
pub const NIGHT_SKY_FLOOR_LUX: f64 = 5e-4;
/// Exponent of the extra Rayleigh weighting of the twilight sky from −12° down
/// (dimensionless).
pub const TWILIGHT_BLUE_POWER: f64 = 0.8;

/// Altitude, in degrees, above which the IES clear-sky curve is used as it is.
pub const DAYLIGHT_JOIN_DEG: f64 = 3.0;

/// Part of the day by the star's geometric altitude: the one set of twilight bands that the
/// lighting state, the sky light and the event finder all use.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Serialize, Deserialize)]
pub enum TwilightPhase {
    /// Star above its rise/set altitude (the star's light is on: `BodyLight::is_up`).
    Day,
    /// Between the rise/set altitude and −6°.
    Civil,
    /// Between −6° and −12°.
    Nautical,
    /// Between −12° and −18°.
    Astronomical,
    /// Below −18°. The default (nothing computed yet).
    #[default]
    Night,
}

impl std::fmt::Display for TwilightPhase {
    /// `day`, `civil twilight`, `nautical twilight`, `astronomical twilight`, `night`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            TwilightPhase::Day => f.write_str("day"),
            TwilightPhase::Night => f.write_str("night"),
            TwilightPhase::Civil => write!(f, "{} twilight", TwilightBand::Civil),
            TwilightPhase::Nautical => write!(f, "{} twilight", TwilightBand::Nautical),
            TwilightPhase::Astronomical => write!(f, "{} twilight", TwilightBand::Astronomical),
        }
    }
}

impl TwilightPhase {
    /// The phase for a geometric altitude of the star's centre and the world's rise/set
    /// altitude (both radians; the rise altitude is clamped to 0 … −6°). Day is strictly above
    /// the rise altitude, the same rule as the star's `is_up`, so the phase turns to day
    /// exactly at the rise event; each twilight includes its lower limit. On airless worlds
    /// the phases only name altitude bands. NaN gives `Night`.
    pub fn from_altitude(geometric_altitude_rad: f64, rise_altitude_rad: f64) -> Self {
        let h = geometric_altitude_rad.to_degrees();
        let rise = rise_altitude_rad
            .to_degrees()
            .clamp(CIVIL_TWILIGHT_DEG, 0.0);
        if h > rise {
            Self::Day
        } else if h >= CIVIL_TWILIGHT_DEG {
            Self::Civil
        } else if h >= NAUTICAL_TWILIGHT_DEG {
            Self::Nautical
        } else if h >= ASTRONOMICAL_TWILIGHT_DEG {
            Self::Astronomical
        } else {
            Self::Night
        }
    }

    /// The twilight this phase is, if it is one.
    pub fn band(self) -> Option<TwilightBand> {
        match self {
            TwilightPhase::Civil => Some(TwilightBand::Civil),
            TwilightPhase::Nautical => Some(TwilightBand::Nautical),
            TwilightPhase::Astronomical => Some(TwilightBand::Astronomical),
            TwilightPhase::Day | TwilightPhase::Night => None,
        }
    }
}

/// One of the three twilights, named by its band of the star's altitude; its lower limit is
/// the boundary crossed at its dawn and dusk.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum TwilightBand {
    /// Rise/set altitude down to −6° ([`CIVIL_TWILIGHT_DEG`]).
    Civil,
    /// −6° down to −12° ([`NAUTICAL_TWILIGHT_DEG`]).
    Nautical,
    /// −12° down to −18° ([`ASTRONOMICAL_TWILIGHT_DEG`]).
    Astronomical,
}

impl std::fmt::Display for TwilightBand {
    /// `civil`, `nautical` or `astronomical`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            TwilightBand::Civil => "civil",
            TwilightBand::Nautical => "nautical",
            TwilightBand::Astronomical => "astronomical",
        })
    }
}

impl TwilightBand {
    /// All three, from the horizon down.
    pub const ALL: [TwilightBand; 3] = [
        TwilightBand::Civil,
        TwilightBand::Nautical,
        TwilightBand::Astronomical,
    ];

    /// Altitude of the star's centre at the band's lower limit, degrees (−6, −12, −18).
    pub fn lower_limit_deg(self) -> f64 {
        match self {
            TwilightBand::Civil => CIVIL_TWILIGHT_DEG,
            TwilightBand::Nautical => NAUTICAL_TWILIGHT_DEG,
            TwilightBand::Astronomical => ASTRONOMICAL_TWILIGHT_DEG,
        }
    }

    /// Altitude of the star's centre at the band's lower limit, radians.
    pub fn lower_limit_rad(self) -> f64 {
        self.lower_limit_deg().to_radians()
    }

    /// The phase while the star is in this band.
    pub fn phase(self) -> TwilightPhase {
        match self {
            TwilightBand::Civil => TwilightPhase::Civil,
            TwilightBand::Nautical => TwilightPhase::Nautical,
            TwilightBand::Astronomical => TwilightPhase::Astronomical,
        }
    }

    /// The phase just below the band's lower limit (the next deeper band, or night).
    pub fn phase_below(self) -> TwilightPhase {
        match self {
            TwilightBand::Civil => TwilightPhase::Nautical,
            TwilightBand::Nautical => TwilightPhase::Astronomical,
            TwilightBand::Astronomical => TwilightPhase::Night,
        }
    }
}

const KNOT_DEG: [f64; 5] = [
    -18.0,
    -12.0,
    -6.0,
    STANDARD_RISE_ALTITUDE_DEG,
    DAYLIGHT_JOIN_DEG,
];
const KNOT_LUX: [f64; 4] = [6e-4, 0.008, 3.4, 450.0];

/// d log₁₀(IES diffuse)/dh at `h_deg`, per degree.
fn ies_log_slope(h_deg: f64) -> f64 {
    let s = h_deg.to_radians().sin();
    let de = 15_500.0 * 0.5 / s.sqrt() * h_deg.to_radians().cos() * 1f64.to_radians();
    de / (ies_clear_sky_diffuse_lux(h_deg) * std::f64::consts::LN_10)
}

/// The Earth reference sky curve with its spline slopes worked out once.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct EarthSkyCurve {
    y: [f64; 5],
    d: [f64; 5],
}

impl Default for EarthSkyCurve {
    fn default() -> Self {
        Self::new()
    }
}

impl EarthSkyCurve {
    /// Builds the spline through the knots listed in the module notes.
    pub fn new() -> Self {
        let y: [f64; 5] = [
            KNOT_LUX[0].log10(),
            KNOT_LUX[1].log10(),
            KNOT_LUX[2].log10(),
            KNOT_LUX[3].log10(),
            ies_clear_sky_diffuse_lux(DAYLIGHT_JOIN_DEG).log10(),
        ];
        let sec: [f64; 4] =
            std::array::from_fn(|k| (y[k + 1] - y[k]) / (KNOT_DEG[k + 1] - KNOT_DEG[k]));
        // Fritsch–Butland slopes: harmonic mean of neighbouring secants (monotone), the secant
        // at the lower end, the IES slope at the upper end (clamped to 3 × secant so the piece
        // stays monotone).
        let mut d = [0.0; 5];
        d[0] = sec[0];
        for k in 1..4 {
            d[k] = 2.0 / (1.0 / sec[k - 1] + 1.0 / sec[k]);
        }
        d[4] = ies_log_slope(DAYLIGHT_JOIN_DEG).min(3.0 * sec[3]);
        Self { y, d }
    }

    /// Clear-sky horizontal illuminance from the sky alone (no direct beam, no night floor), in
    /// lux, for the star's geometric altitude in degrees and a 127.5 klx star; continuous and
    /// non-decreasing in altitude, positive and finite everywhere (NaN is treated as −90°).
    pub fn lux(&self, geometric_altitude_deg: f64) -> f64 {
        let h = if geometric_altitude_deg.is_nan() {
            -90.0
        } else {
            geometric_altitude_deg.clamp(-90.0, 90.0)
        };
        if h >= DAYLIGHT_JOIN_DEG {
            return ies_clear_sky_diffuse_lux(h);
        }
        let (y, d) = (&self.y, &self.d);
        if h <= KNOT_DEG[0] {
            return 10f64.powf(y[0] + d[0] * (h - KNOT_DEG[0]));
        }
        let k = (0..4).find(|&k| h <= KNOT_DEG[k + 1]).unwrap_or(3);
        let w = KNOT_DEG[k + 1] - KNOT_DEG[k];
        let t = (h - KNOT_DEG[k]) / w;
        let (t2, t3) = (t * t, t * t * t);
        let v = (2.0 * t3 - 3.0 * t2 + 1.0) * y[k]
            + (t3 - 2.0 * t2 + t) * w * d[k]
            + (-2.0 * t3 + 3.0 * t2) * y[k + 1]
            + (t3 - t2) * w * d[k + 1];
        10f64.powf(v)
    }
}

/// Earth clear-sky horizontal illuminance from the sky alone, in lux, for the star's geometric
/// altitude in degrees and a 127.5 klx star; see [`EarthSkyCurve::lux`].
pub fn earth_clear_sky_lux(geometric_altitude_deg: f64) -> f64 {
    EarthSkyCurve::new().lux(geometric_altitude_deg)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn within_factor(v: f64, want: f64, f: f64) -> bool {
        v >= want / f && v <= want * f
    }

    #[test]
    fn handbook_values() {
        // AMS Glossary ("astronomical twilight"): 0.008 lx at −12°, 6e-4 lx at −18°; "Lux"
        // handbook value 3.4 lx at −6° (AMS ~2–3.5). Knots, so within 1 %.
        assert!(within_factor(earth_clear_sky_lux(-18.0), 6e-4, 1.01));
        assert!(within_factor(earth_clear_sky_lux(-12.0), 0.008, 1.01));
        assert!(within_factor(earth_clear_sky_lux(-6.0), 3.4, 1.01));
        // Sunset: ~400 lx ("Lux"), AMS 410–585 lx.
        let sunset = earth_clear_sky_lux(STANDARD_RISE_ALTITUDE_DEG);
        assert!((400.0..=585.0).contains(&sunset), "{sunset}");
        // At the geometric horizon the IES model gives 800 lx (IES 1984, A coefficient); the
        // curve stays within 25 % of it (tolerance common practice, no source).
        assert!(
            within_factor(earth_clear_sky_lux(0.0), 800.0, 1.25),
            "{}",
            earth_clear_sky_lux(0.0)
        );
        // Above the join it is the IES curve.
        assert_eq!(earth_clear_sky_lux(30.0), ies_clear_sky_diffuse_lux(30.0));
    }

    #[test]
    fn continuous_and_monotonic() {
        let mut last = 0.0;
        let n = 36_000;
        for i in 0..=n {
            let h = -90.0 + 180.0 * i as f64 / n as f64;
            let v = earth_clear_sky_lux(h);
            assert!(v.is_finite() && v > 0.0);
            assert!(v >= last, "not monotonic at {h}");
            // No jumps: at most 2 % change per 0.005° step.
            if last > 0.0 {
                assert!(v / last < 1.02, "jump at {h}: {last} -> {v}");
            }
            last = v;
        }
        assert!(earth_clear_sky_lux(f64::NAN) > 0.0);
    }

    #[test]
    fn phases() {
        let rise = STANDARD_RISE_ALTITUDE_DEG.to_radians();
        let p = |d: f64| TwilightPhase::from_altitude(d.to_radians(), rise);
        assert_eq!(p(10.0), TwilightPhase::Day);
        assert_eq!(p(-0.5), TwilightPhase::Day);
        assert_eq!(p(-1.0), TwilightPhase::Civil);
        assert_eq!(p(-6.5), TwilightPhase::Nautical);
        assert_eq!(p(-12.5), TwilightPhase::Astronomical);
        assert_eq!(p(-18.5), TwilightPhase::Night);
        assert_eq!(p(f64::NAN), TwilightPhase::Night);
        // Day is strictly above the rise altitude (as `is_up`); each twilight keeps its limit.
        assert_eq!(p(STANDARD_RISE_ALTITUDE_DEG), TwilightPhase::Civil);
        for band in TwilightBand::ALL {
            // (Degrees to radians and back is not exact, hence the small offset.)
            assert_eq!(p(band.lower_limit_deg() + 1e-9), band.phase());
            assert_eq!(p(band.lower_limit_deg() - 1e-6), band.phase_below());
            assert_eq!(band.phase().band(), Some(band));
        }
        assert_eq!(TwilightPhase::Nautical.to_string(), "nautical twilight");
        assert_eq!(TwilightPhase::Day.to_string(), "day");
        let s = ron::to_string(&TwilightPhase::Civil).unwrap();
        assert_eq!(
            ron::from_str::<TwilightPhase>(&s).unwrap(),
            TwilightPhase::Civil
        );
    }
}
