//! Camera exposure that follows the sky, so physical light values read well from noon to
//! starlight.
//!
//! Physical lights span eight orders of magnitude (about 10⁵ lux at noon, 10⁻³ lux under
//! starlight). A fixed exposure shows either the day or the night. [`ev100_from_illuminance`]
//! is the incident-light meter's reading; [`ExposureFollowsSky`] on a camera sets its
//! [`Exposure`] from the scene's horizontal illuminance each frame, compensating only part of
//! the change so that night still looks darker than day.

use bevy::camera::Exposure;
use bevy::prelude::*;

use crate::flash_guard::DisplayedSky;

/// Calibration constant of an incident-light meter with a flat receptor, lux·s (ISO 2720
/// gives a range of about 240–400 for flat receptors; 250 is a common choice — from memory).
pub const INCIDENT_METER_CALIBRATION_LUX_S: f64 = 250.0;

/// The exposure value at ISO 100 that an incident-light meter reads under `illuminance_lux`:
/// EV100 = log₂(E · 100 / C), with C = [`INCIDENT_METER_CALIBRATION_LUX_S`]. Noon sunlight
/// (about 100 000 lux) reads about 15.3, full moonlight (0.25 lux) 6.6, starlight (0.001 lux)
/// −1.3. Non-positive illuminance reads as 10⁻⁶ lux.
///
/// ```
/// let ev = bevy_insola::ev100_from_illuminance(100_000.0);
/// assert!((ev - 15.29).abs() < 0.01);
/// ```
pub fn ev100_from_illuminance(illuminance_lux: f64) -> f64 {
    (illuminance_lux.max(1e-6) * 100.0 / INCIDENT_METER_CALIBRATION_LUX_S).log2()
}

/// Sets the camera's [`Exposure`] from the sky each frame.
///
/// The target is `reference_ev100 + adaptation × (metered − reference_ev100)`, clamped to
/// `[min_ev100, max_ev100]`, where `metered` is [`ev100_from_illuminance`] of the sky state's
/// horizontal illuminance. With `adaptation` 1 the night is as bright on screen as the day;
/// with 0 the exposure stays at `reference_ev100`.
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::ExposureFollowsSky;
/// fn setup(mut commands: Commands) {
///     commands.spawn((Camera3d::default(), ExposureFollowsSky::default()));
/// }
/// ```
#[derive(Component, Debug, Clone, Copy, PartialEq, Reflect)]
#[reflect(Component, Debug, Default, Clone)]
#[require(Exposure)]
pub struct ExposureFollowsSky {
    /// Share of the change in scene brightness the exposure compensates, 0–1. Default 0.8
    /// (night a few stops darker than day; a taste, common practice, no source).
    pub adaptation: f64,
    /// The exposure the adaptation pivots on, EV100. Default 15 (Bevy's
    /// `Exposure::EV100_SUNLIGHT`).
    pub reference_ev100: f64,
    /// Lowest exposure value written, EV100. Default −2.
    pub min_ev100: f64,
    /// Highest exposure value written, EV100. Default 16.
    pub max_ev100: f64,
    /// Fastest change, EV per real second (eye or camera adaptation). Default 3; use
    /// `f64::INFINITY` to follow at once.
    pub max_change_ev_per_s: f64,
    /// The exposure last written (`None` until the first frame, which snaps to the target).
    pub current_ev100: Option<f64>,
}

impl Default for ExposureFollowsSky {
    fn default() -> Self {
        ExposureFollowsSky {
            adaptation: 0.8,
            reference_ev100: 15.0,
            min_ev100: -2.0,
            max_ev100: 16.0,
            max_change_ev_per_s: 3.0,
            current_ev100: None,
        }
    }
}

impl ExposureFollowsSky {
    /// The exposure this setting aims for under `horizontal_illuminance_lux`, EV100.
    pub fn target_ev100(&self, horizontal_illuminance_lux: f64) -> f64 {
        let metered = ev100_from_illuminance(horizontal_illuminance_lux);
        let a = self.adaptation.clamp(0.0, 1.0);
        let (lo, hi) = (
            self.min_ev100.min(self.max_ev100),
            self.max_ev100.max(self.min_ev100),
        );
        (self.reference_ev100 + a * (metered - self.reference_ev100)).clamp(lo, hi)
    }

    /// Moves `current_ev100` toward the target over `real_dt_s` seconds and returns it.
    pub fn advance(&mut self, horizontal_illuminance_lux: f64, real_dt_s: f64) -> f64 {
        let target = self.target_ev100(horizontal_illuminance_lux);
        let next = match self.current_ev100 {
            None => target,
            Some(current) => {
                let max_step = (self.max_change_ev_per_s * real_dt_s.max(0.0)).max(0.0);
                current + (target - current).clamp(-max_step, max_step)
            }
        };
        let next = if next.is_finite() { next } else { target };
        self.current_ev100 = Some(next);
        next
    }
}

/// Writes [`Exposure`] on cameras with [`ExposureFollowsSky`].
pub(crate) fn follow_sky_exposure(
    sky: Res<DisplayedSky>,
    real: Res<Time<Real>>,
    mut cameras: Query<(&mut ExposureFollowsSky, &mut Exposure)>,
) {
    if !sky.ready {
        return;
    }
    let dt = real.delta_secs_f64();
    for (mut follow, mut exposure) in &mut cameras {
        let ev = follow.advance(sky.horizontal_illuminance_lux, dt) as f32;
        if exposure.ev100 != ev {
            exposure.ev100 = ev;
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn meter_readings_span_noon_to_starlight() {
        // EV100 of bright sun is about 15 (the "sunny 16" rule; common practice, no source).
        assert!((ev100_from_illuminance(100_000.0) - 15.0).abs() < 0.5);
        assert!(ev100_from_illuminance(0.001) < 0.0);
        let f = ExposureFollowsSky::default();
        let (noon, night) = (f.target_ev100(100_000.0), f.target_ev100(0.001));
        assert!(noon > 14.0 && night < 3.0 && night >= f.min_ev100);
    }

    #[test]
    fn adaptation_is_rate_limited() {
        let mut f = ExposureFollowsSky::default();
        assert_eq!(f.advance(100_000.0, 0.0), f.target_ev100(100_000.0));
        let ev = f.advance(0.001, 1.0);
        assert!((f.target_ev100(100_000.0) - ev - 3.0).abs() < 1e-9);
    }
}
