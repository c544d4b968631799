//! The sky part: the reference place's sky each frame and the notices between frames.

use bevy::prelude::*;

use crate::messages::send_sky_notices;
use crate::sky_state::compute_sky_state;
use crate::{InsolaSettings, InsolaSystems, SkyNotice, SkyState};

/// Adds [`SkyState`] (computed each frame in [`InsolaSystems::ComputeSky`]) and the
/// [`SkyNotice`] messages. Needs the clock and world parts.
#[derive(Debug, Clone, Default)]
pub struct InsolaSkyPlugin {
    /// Settings shared by every part (the first part to build inserts them).
    pub settings: InsolaSettings,
}

impl Plugin for InsolaSkyPlugin {
    fn build(&self, app: &mut App) {
        super::configure_sets(app);
        super::insert_settings_once(app, &self.settings);
        app.register_type::<SkyState>()
            .init_resource::<SkyState>()
            .add_message::<SkyNotice>()
            .add_systems(
                PostUpdate,
                (compute_sky_state, send_sky_notices).in_set(InsolaSystems::ComputeSky),
            );
    }
}
