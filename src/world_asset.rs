//! The world as an asset: `*.world.ron` files, their loader, hot reload, and the active world.
//!
//! [`WorldFile`] is the asset (a parsed and validated [`WorldSpec`]); [`WorldFileLoader`] reads
//! it. [`ActiveWorld`] is the resource every other system reads: the [`Planet`] built from the
//! last good world. When a watched file changes, the world is rebuilt before the next frame's
//! sky; a file that fails to parse or validate leaves the last good world running, logs the
//! error and sends a [`WorldRejected`] message. Without an asset server (a headless server, a
//! test) set the world directly with [`ActiveWorld::set_spec`] or
//! [`InsolaPlugins::with_world_spec`](crate::InsolaPlugins::with_world_spec).

use std::sync::Arc;

use bevy::asset::io::Reader;
use bevy::asset::{AssetLoadError, AssetLoadFailedEvent, AssetLoader, LoadContext};
use bevy::prelude::*;
use insola::{Planet, SpecError, WorldSpec};

use crate::messages::{WorldChangeCause, WorldChanged, WorldRejected};

/// A world file: the parsed and validated description of a planet, its star and its sky.
#[derive(Asset, TypePath, Debug, Clone, PartialEq)]
pub struct WorldFile {
    /// The world description.
    pub spec: WorldSpec,
}

/// Loads `*.world.ron` files into [`WorldFile`] assets (parse and validate; errors carry the
/// line, column and field).
#[derive(Debug, Default, Clone, Copy, TypePath)]
pub struct WorldFileLoader;

/// Why a world file could not be loaded.
#[derive(Debug, thiserror::Error)]
pub enum WorldFileError {
    /// The bytes could not be read.
    #[error("cannot read the world file: {0}")]
    Io(#[from] std::io::Error),
    /// The file is not UTF-8 text.
    #[error("the world file is not UTF-8 text: {0}")]
    NotText(#[from] std::str::Utf8Error),
    /// The text is not a valid world (syntax, unknown field, value out of range...).
    #[error("{0}")]
    Spec(#[from] SpecError),
}

impl AssetLoader for WorldFileLoader {
    type Asset = WorldFile;
    type Settings = ();
    type Error = WorldFileError;

    async fn load(
        &self,
        reader: &mut dyn Reader,
        _settings: &(),
        _load_context: &mut LoadContext<'_>,
    ) -> Result<WorldFile, WorldFileError> {
        let mut bytes = Vec::new();
        reader.read_to_end(&mut bytes).await?;
        let text = std::str::from_utf8(&bytes)?;
        let spec = WorldSpec::from_ron_str(text)?;
        Ok(WorldFile { spec })
    }

    fn extensions(&self) -> &[&str] {
        // `WORLD_FILE_SUFFIX` without its leading dot.
        &["world.ron"]
    }
}

/// The world every Insola system uses: the [`Planet`] built from the last good world.
///
/// Empty until a world is loaded or set; systems that need a world do nothing until then.
///
/// ```
/// use bevy_insola::ActiveWorld;
/// let text = r#"(name: "Ennavel",
///     star: (temperature_k: 5600, radius_r_sun: 1.0, luminosity_l_sun: 1.0),
///     orbit: (semi_major_axis_au: 1.0, eccentricity: 0.02, periapsis_longitude_deg: 100, period_days: 300),
///     spin: (obliquity_deg: 20, solar_day_hours: 22))"#;
/// let mut world = ActiveWorld::default();
/// world.set_spec(&insola::WorldSpec::parse_unchecked(text).unwrap()).unwrap();
/// assert_eq!(world.planet().unwrap().spec().name, "Ennavel");
/// assert_eq!(world.generation(), 1);
/// ```
#[derive(Resource, Debug, Default)]
pub struct ActiveWorld {
    planet: Option<Arc<Planet>>,
    generation: u64,
    handle: Option<Handle<WorldFile>>,
    last_error: Option<String>,
    /// The last reason reported from a world file and the real time of that report, s: Bevy
    /// retries a failed reload once more, and under load that echo can arrive after a good
    /// save has already replaced the world.
    last_file_failure: Option<(String, f64)>,
    pending: Vec<PendingReport>,
}

/// Real seconds within which a failure repeating the last one reported from the file is taken
/// for the asset server's retry of that same load, not news (common practice, no source: a
/// retry follows within frames; nobody saves the same mistake twice in a second).
const RETRY_ECHO_S: f64 = 2.0;

#[derive(Debug)]
enum PendingReport {
    Changed(WorldChangeCause),
    Rejected {
        source: String,
        reason: String,
        field: Option<String>,
    },
}

impl ActiveWorld {
    /// The planet, once a world is loaded.
    pub fn planet(&self) -> Option<&Planet> {
        self.planet.as_deref()
    }

    /// A shared handle to the planet (for background work).
    pub fn planet_arc(&self) -> Option<Arc<Planet>> {
        self.planet.clone()
    }

    /// Counts the worlds that have been made active: 0 before the first, then +1 at each load,
    /// reload or [`ActiveWorld::set_spec`]. Compare it to notice a change of world.
    pub fn generation(&self) -> u64 {
        self.generation
    }

    /// The world file this world follows, if it came from the asset server.
    pub fn handle(&self) -> Option<&Handle<WorldFile>> {
        self.handle.as_ref()
    }

    /// The last error met while loading or rebuilding the world (cleared by the next success).
    pub fn last_error(&self) -> Option<&str> {
        self.last_error.as_deref()
    }

    /// Makes `spec` the active world. On an invalid spec the current world stays and the
    /// error is returned (and reported with a [`WorldRejected`] message).
    pub fn set_spec(&mut self, spec: &WorldSpec) -> Result<(), SpecError> {
        self.apply_spec(spec, WorldChangeCause::Set, "inline world")
    }

    /// Makes an already built `planet` the active world.
    pub fn set_planet(&mut self, planet: Planet) {
        self.install(planet, WorldChangeCause::Set);
    }

    /// Follows the world file behind `handle`: loads and reloads of that asset replace the
    /// world.
    pub fn follow(&mut self, handle: Handle<WorldFile>) {
        self.handle = Some(handle);
    }

    fn apply_spec(
        &mut self,
        spec: &WorldSpec,
        cause: WorldChangeCause,
        source: &str,
    ) -> Result<(), SpecError> {
        match Planet::new(spec) {
            Ok(planet) => {
                self.install(planet, cause);
                Ok(())
            }
            Err(error) => {
                self.reject(
                    source.to_string(),
                    error.to_string(),
                    error.field().map(str::to_string),
                );
                Err(error)
            }
        }
    }

    fn install(&mut self, planet: Planet, cause: WorldChangeCause) {
        self.planet = Some(Arc::new(planet));
        self.generation += 1;
        self.last_error = None;
        self.pending.push(PendingReport::Changed(cause));
    }

    pub(crate) fn reject(&mut self, source: String, reason: String, field: Option<String>) {
        let kept = match self.planet() {
            Some(p) => format!("keeping world `{}`", p.spec().name),
            None => "no world loaded yet".to_string(),
        };
        error!("Insola: world rejected ({source}): {reason}; {kept}");
        self.last_error = Some(reason.clone());
        self.pending.push(PendingReport::Rejected {
            source,
            reason,
            field,
        });
    }
}

/// Applies loads and reloads of the followed [`WorldFile`] to the [`ActiveWorld`], and reports
/// files that failed to load.
pub(crate) fn apply_world_files(
    mut events: MessageReader<AssetEvent<WorldFile>>,
    mut failures: MessageReader<AssetLoadFailedEvent<WorldFile>>,
    files: Res<Assets<WorldFile>>,
    mut world: ResMut<ActiveWorld>,
    real: Option<Res<Time<Real>>>,
) {
    let now_s = real.map_or(0.0, |t| t.elapsed_secs_f64());
    let Some(id) = world.handle.as_ref().map(Handle::id) else {
        events.clear();
        failures.clear();
        return;
    };
    let mut cause = None;
    for event in events.read() {
        match event {
            AssetEvent::Added { id: e } if *e == id => {
                cause = cause.or(Some(WorldChangeCause::Loaded))
            }
            AssetEvent::Modified { id: e } if *e == id => cause = Some(WorldChangeCause::Reloaded),
            _ => {}
        }
    }
    if let Some(cause) = cause
        && let Some(file) = files.get(id)
    {
        let spec = file.spec.clone();
        let source = world
            .handle
            .as_ref()
            .and_then(|h| h.path())
            .map_or_else(|| "world file".to_string(), |p| p.to_string());
        let _ = world.apply_spec(&spec, cause, &source);
    }
    for failure in failures.read() {
        if failure.id != id {
            continue;
        }
        let (reason, field) = load_failure(&failure.error);
        // When a reload fails, Bevy retries it as an untyped load, which fails the same way: a
        // failure that repeats the standing error is the same news and is not reported again.
        let echo = world
            .last_file_failure
            .as_ref()
            .is_some_and(|(last, at_s)| *last == reason && now_s - at_s < RETRY_ECHO_S);
        if world.last_error.as_deref() != Some(reason.as_str()) && !echo {
            world.last_file_failure = Some((reason.clone(), now_s));
            world.reject(failure.path.to_string(), reason, field);
        }
    }
}

/// A load failure in plain words, with the field at fault when the file was read but is not a
/// valid world. Bevy's own wording (which may carry a captured backtrace) is kept to its first
/// line for other failures.
fn load_failure(error: &AssetLoadError) -> (String, Option<String>) {
    if let AssetLoadError::AssetLoaderError(e) = error
        && let Some(ours) = e.error().downcast_ref::<WorldFileError>()
    {
        let field = match ours {
            WorldFileError::Spec(spec) => spec.field().map(str::to_string),
            _ => None,
        };
        // The path is the rejection's `source`; the reason is the fault alone.
        return (ours.to_string(), field);
    }
    let text = error.to_string();
    (text.lines().next().unwrap_or_default().to_string(), None)
}

/// Sends the [`WorldChanged`] and [`WorldRejected`] messages queued by [`ActiveWorld`].
pub(crate) fn report_world_changes(
    mut world: ResMut<ActiveWorld>,
    mut changed: MessageWriter<WorldChanged>,
    mut rejected: MessageWriter<WorldRejected>,
) {
    if world.pending.is_empty() {
        return;
    }
    let reports = core::mem::take(&mut world.pending);
    let name = world
        .planet()
        .map(|p| p.spec().name.clone())
        .unwrap_or_default();
    let generation = world.generation;
    for report in reports {
        match report {
            PendingReport::Changed(cause) => {
                changed.write(WorldChanged {
                    name: name.clone(),
                    generation,
                    cause,
                });
            }
            PendingReport::Rejected {
                source,
                reason,
                field,
            } => {
                rejected.write(WorldRejected {
                    source,
                    reason,
                    field,
                    kept_world: world.planet().is_some(),
                });
            }
        }
    }
}
