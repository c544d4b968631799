//! The clock part: world time and its advance each frame.

use bevy::prelude::*;

use crate::clock::advance_world_clock;
use crate::{InsolaSystems, WorldClock};

/// Adds the [`WorldClock`] (unless the app already has one) and advances it each frame in
/// [`InsolaSystems::AdvanceClock`].
#[derive(Debug, Clone, Default)]
pub struct InsolaClockPlugin {
    /// The clock the app starts with.
    pub clock: WorldClock,
}

impl Plugin for InsolaClockPlugin {
    fn build(&self, app: &mut App) {
        super::configure_sets(app);
        app.register_type::<WorldClock>();
        if !app.world().contains_resource::<WorldClock>() {
            app.insert_resource(self.clock.clone());
        }
        app.add_systems(
            PostUpdate,
            advance_world_clock.in_set(InsolaSystems::AdvanceClock),
        );
    }
}
