//! Light of the sky: how bright and what colour the star's light, the sky, twilight and moons
//! are at the ground of any world.
//!
//! Start with [`StarLightModel`]: build it once from the star's effective temperature and the
//! world's [`AtmosphereSpec`], then ask it, for the star's geometric altitude and the
//! top-of-atmosphere irradiance, for the direct beam ([`BeamLight`]), the sky light
//! ([`SkyLight`]) and the total on a horizontal surface.
//!
//! Where each number comes from, and its limits:
//!
//! | quantity | model | limits |
//! |---|---|---|
//! | star spectrum | Planck black body at T_eff (`spectrum`) | no absorption lines, no limb darkening |
//! | colour | CIE 1931 2° observer, 1 nm, 360–830 nm (CIE 015) → linear sRGB (IEC 61966-2-1); CCT by nearest Planckian point in CIE 1960 (u, v) (`colour`, `cie1931`) | negative sRGB channels clamped |
//! | luminous efficacy | 683 lm/W × ∫ȳE / ∫E, whole-spectrum denominator σT⁴ | – |
//! | air mass | Kasten & Young 1989; Young 1994 (`airmass`) | Earth's air profile on every world; held at the horizon value below it |
//! | refraction | Sæmundsson 1986 × pressure × √(Rayleigh scale), capped at 4× Earth | no ray tracing |
//! | extinction | Rayleigh: Bodhaine et al. 1999 eq. 30 × pressure × scale; aerosol: Ångström (`extinction`) | no ozone or water-vapour absorption |
//! | direct beam | exp(−τ(λ) m) × fraction of the disc above the horizon (`star_light`) | flat horizon |
//! | daylight sky | IES 1984 clear-sky diffuse illuminance, scaled by star illuminance and a two-stream optical-depth ratio (`daylight`) | clear sky only; no clouds |
//! | twilight | monotone spline in log lux through handbook values at 0°, −6°, −12°, −18° (AMS Glossary, "Lux"), joined to the IES curve at +3°; USNO night floor 0.0005 lx (`twilight`) | twilight length in altitude kept as on Earth |
//! | sky colour | single-scattering zenith sky E★ [e^(−τ) − e^(−τm)]/(m − 1), twilight blued by extra Rayleigh weighting (`daylight`, `twilight`) | documented simple approach; no ozone |
//! | moons | Lambert sphere, p = 2A/3; Earth's Moon by Allen / Krisciunas & Schaefer 1991 (`moonlight`) | no opposition surge for invented moons |
//! | eclipses | overlap of flat uniform discs (`eclipse`) | no limb darkening, no light refracted into the shadow |
//!
//! Earth numbers (the Sun, the Moon, the default atmosphere) appear only as validation
//! references and defaults.

mod airmass;
pub mod cie1931;
mod colour;
mod daylight;
mod eclipse;
mod extinction;
mod horizon;
mod moonlight;
mod sky_light;
mod spectrum;
mod star_light;
mod twilight;

pub use crate::world::{AtmosphereSpec, MAX_SURFACE_PRESSURE_KPA, REFERENCE_PRESSURE_KPA};
pub use airmass::*;
pub use colour::*;
pub use daylight::*;
pub use eclipse::*;
pub use extinction::*;
pub use horizon::*;
pub use moonlight::*;
pub use sky_light::*;
pub use spectrum::*;
pub use star_light::*;
pub use twilight::*;
