//! Scaffolding shared by the examples: the shipped worlds, command-line options for the
//! rendering examples, a windowed or windowless app, an orbiting camera, and the on-screen
//! status line. (Bevy's atmosphere made from a world's air is the plugin's
//! `engine-atmosphere` part.)
//!
//! Each example uses part of it; the parts are small and independent.

#![allow(dead_code, reason = "each example uses part of the shared scaffolding")]

pub mod capture;
#[cfg(feature = "tuning-panel")]
pub mod panel;
pub mod ring;
pub mod stars;

use std::path::PathBuf;

use bevy::camera::Exposure;
use bevy::input::mouse::{AccumulatedMouseMotion, AccumulatedMouseScroll};
use bevy::prelude::*;
use bevy_insola::prelude::*;
use bevy_insola::{ActiveWorld, WorldFile};
use clap::Parser;
use insola::Planet;

/// The invented worlds shipped in `assets/worlds/`, by short name (the core's one list).
pub fn world_names() -> impl Iterator<Item = &'static str> {
    insola::built_in_worlds::invented_world_names()
}

/// Asset path of a shipped world (`"verdance"` → `"worlds/verdance.world.ron"`).
pub fn world_asset_path(name: &str) -> String {
    format!("worlds/{name}.world.ron")
}

/// File path of a shipped world, from the package root.
pub fn world_file_path(name: &str) -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("assets")
        .join(world_asset_path(name))
}

/// Reads a shipped world file (or any `*.world.ron` path) into a checked spec.
pub fn read_world(name_or_path: &str) -> Result<insola::WorldSpec, String> {
    let path = if name_or_path.ends_with(".ron") {
        PathBuf::from(name_or_path)
    } else {
        world_file_path(name_or_path)
    };
    let text = std::fs::read_to_string(&path)
        .map_err(|e| format!("cannot read {}: {e}", path.display()))?;
    let spec =
        insola::WorldSpec::from_ron_str(&text).map_err(|e| format!("{}: {e}", path.display()))?;
    Planet::new(&spec).map_err(|e| format!("{}: {e}", path.display()))?;
    Ok(spec)
}

/// Reads `WIDTHxHEIGHT` (each 64 to 8192 pixels).
fn parse_window_size(text: &str) -> Result<(u32, u32), String> {
    let (w, h) = text
        .split_once('x')
        .ok_or_else(|| format!("`{text}`: expected WIDTHxHEIGHT, e.g. 1280x900"))?;
    let side = |s: &str| {
        s.trim()
            .parse::<u32>()
            .ok()
            .filter(|v| (64..=8192).contains(v))
            .ok_or_else(|| {
                format!("`{s}`: a window side is a whole number of pixels from 64 to 8192")
            })
    };
    Ok((side(w)?, side(h)?))
}

/// Options of the rendering examples.
#[derive(Parser, Debug, Clone)]
#[command(about = "A small place on an invented world, lit by Insola")]
pub struct SceneOptions {
    /// World to start on: verdance, calvenne, oromar or thalcary.
    #[arg(long, default_value = "verdance", value_parser = clap::builder::PossibleValuesParser::new(world_names()))]
    pub world: String,
    /// Latitude of the place, degrees north (negative: south).
    #[arg(long, default_value_t = 40.0, allow_hyphen_values = true, value_parser = latitude)]
    pub lat: f64,
    /// Local time to show, in local days: the whole part is the day number, the fraction the
    /// local mean solar time (100.5 is noon of local day 100, which the status line's calendar,
    /// counting from 1, shows as day 101). Repeat for several pictures.
    #[arg(long = "at", value_name = "DAYS")]
    pub at: Vec<f64>,
    /// Render without a window and write PNG files into this folder (or to this `.png` file).
    #[arg(long, value_name = "PATH")]
    pub out: Option<PathBuf>,
    /// With a window: save a screenshot of it (panel included) to this `.png` file after
    /// `--frames` frames, then quit.
    #[arg(long, value_name = "PNG", conflicts_with = "out")]
    pub window_shot: Option<PathBuf>,
    /// Frames to render before the picture is taken (shader pipelines compile over the first
    /// frames); after them, frames are rendered until the picture stops changing.
    #[arg(long, default_value_t = 100)]
    pub frames: u32,
    /// Picture width in pixels (headless).
    #[arg(long, default_value_t = 320)]
    pub width: u32,
    /// Picture height in pixels (headless).
    #[arg(long, default_value_t = 180)]
    pub height: u32,
    /// Window size in pixels, `WIDTHxHEIGHT` (with a window; the tuner's plots need about 900
    /// pixels of height to show whole).
    #[arg(long, default_value = "1280x720", value_parser = parse_window_size)]
    pub window_size: (u32, u32),
    /// Direction the camera faces: degrees clockwise from north, or `star` to face the star.
    #[arg(long, default_value = "0")]
    pub look: String,
    /// Camera pitch, degrees below the horizontal (negative looks up).
    #[arg(long, default_value_t = 12.0, allow_hyphen_values = true)]
    pub pitch: f64,
    /// Vertical field of view, degrees.
    #[arg(long, default_value_t = 45.0)]
    pub fov: f64,
    /// Camera distance from the sundial, metres.
    #[arg(long, default_value_t = 26.0)]
    pub distance: f64,
    /// World seconds per real second when the clock runs (windowed).
    #[arg(long, default_value_t = 600.0)]
    pub rate: f64,
}

fn latitude(s: &str) -> Result<f64, String> {
    let v: f64 = s.parse().map_err(|e| format!("`{s}`: {e}"))?;
    if v.is_finite() && (-90.0..=90.0).contains(&v) {
        Ok(v)
    } else {
        Err(format!("latitude {v} is out of range: allowed -90 to 90"))
    }
}

impl SceneOptions {
    /// Parses the command line, exiting with a message on bad options.
    pub fn from_args() -> SceneOptions {
        SceneOptions::parse()
    }

    /// The direction the camera faces, or `None` for "face the star".
    pub fn look_azimuth_deg(&self) -> Result<Option<f64>, String> {
        if self.look.eq_ignore_ascii_case("star") {
            return Ok(None);
        }
        self.look
            .parse::<f64>()
            .ok()
            .filter(|v| v.is_finite())
            .map(Some)
            .ok_or_else(|| format!("--look `{}`: a number of degrees or `star`", self.look))
    }

    /// World time of local day count `days` at this place's longitude (0).
    pub fn world_time_s(planet: &Planet, days: f64) -> f64 {
        planet.local_day_start_s(days, 0.0)
    }
}

/// A camera circling a point: drag with the left mouse button or use the arrow keys to turn,
/// scroll or PageUp/PageDown to move closer or farther.
#[derive(Component, Debug, Clone, Copy)]
pub struct OrbitCamera {
    /// The point looked at.
    pub focus: Vec3,
    /// Distance from the focus, metres.
    pub distance: f32,
    /// Direction the camera faces, radians clockwise from north.
    pub look_azimuth: f32,
    /// Angle below the horizontal, radians.
    pub pitch: f32,
}

impl OrbitCamera {
    /// The camera transform for these settings (scene axes: +Y up, −Z north, +X east).
    ///
    /// The eye stays at least 1.6 m above the ground: when looking up, it stands behind the
    /// focus at eye height and tilts its view instead of sinking below the ground.
    pub fn transform(&self) -> Transform {
        let (s, c) = self.look_azimuth.sin_cos();
        let forward_h = Vec3::new(s, 0.0, -c);
        let along = |pitch: f32| (forward_h * pitch.cos() - Vec3::Y * pitch.sin()).normalize();
        let mut eye = self.focus - along(self.pitch.max(0.05)) * self.distance;
        eye.y = eye.y.max(1.6);
        Transform::from_translation(eye).looking_to(along(self.pitch), Vec3::Y)
    }
}

/// Turns and zooms [`OrbitCamera`]s from the mouse and keyboard.
pub fn orbit_camera_controls(
    keys: Res<ButtonInput<KeyCode>>,
    buttons: Res<ButtonInput<MouseButton>>,
    motion: Res<AccumulatedMouseMotion>,
    scroll: Res<AccumulatedMouseScroll>,
    time: Res<Time<Real>>,
    mut cameras: Query<(&mut OrbitCamera, &mut Transform)>,
) {
    let dt = time.delta_secs();
    for (mut orbit, mut transform) in &mut cameras {
        let mut turn = Vec2::ZERO;
        if buttons.pressed(MouseButton::Left) {
            turn += motion.delta * 0.005;
        }
        let key_rate = 1.2 * dt;
        if keys.pressed(KeyCode::ArrowLeft) {
            turn.x -= key_rate;
        }
        if keys.pressed(KeyCode::ArrowRight) {
            turn.x += key_rate;
        }
        if keys.pressed(KeyCode::ArrowUp) {
            turn.y -= key_rate;
        }
        if keys.pressed(KeyCode::ArrowDown) {
            turn.y += key_rate;
        }
        let mut zoom = -scroll.delta.y * 0.1;
        if keys.pressed(KeyCode::PageUp) {
            zoom -= dt;
        }
        if keys.pressed(KeyCode::PageDown) {
            zoom += dt;
        }
        orbit.look_azimuth = (orbit.look_azimuth + turn.x).rem_euclid(std::f32::consts::TAU);
        orbit.pitch = (orbit.pitch + turn.y).clamp(-0.6, 1.5);
        orbit.distance = (orbit.distance * (1.0 + zoom)).clamp(3.0, 200.0);
        *transform = orbit.transform();
    }
}

/// Marks the on-screen status text.
#[derive(Component)]
pub struct StatusLine {
    /// Show the clock's rate (or "paused") at the end of the line.
    pub show_rate: bool,
}

/// Spawns the status line (top left) and a key help line (bottom left, if not empty) for
/// `camera`, with text sized for a view `view_height_px` pixels high.
pub fn spawn_status_line(commands: &mut Commands, camera: Entity, help: &str, view_height_px: f32) {
    let size = (view_height_px * 0.036).clamp(9.0, 16.0);
    commands.spawn((
        Text::new("..."),
        TextFont {
            font_size: FontSize::Px(size),
            ..default()
        },
        TextColor(Color::srgb(0.95, 0.95, 0.9)),
        thin_shadow(),
        Node {
            position_type: PositionType::Absolute,
            top: Val::Px(size * 0.5),
            left: Val::Px(size * 0.7),
            ..default()
        },
        UiTargetCamera(camera),
        StatusLine {
            show_rate: !help.is_empty(),
        },
    ));
    if !help.is_empty() {
        commands.spawn((
            Text::new(help),
            TextFont {
                font_size: FontSize::Px(size * 0.8),
                ..default()
            },
            TextColor(Color::srgba(0.95, 0.95, 0.9, 0.8)),
            thin_shadow(),
            Node {
                position_type: PositionType::Absolute,
                bottom: Val::Px(size * 0.5),
                left: Val::Px(size * 0.7),
                ..default()
            },
            UiTargetCamera(camera),
        ));
    }
}

fn thin_shadow() -> TextShadow {
    TextShadow {
        offset: Vec2::splat(1.0),
        color: Color::srgba(0.0, 0.0, 0.0, 0.7),
    }
}

/// The status line's text: world, date and time, season; then star altitude, twilight phase,
/// temperature and clock rate on a second line.
pub fn status_text(
    world: &ActiveWorld,
    sky: &SkyState,
    climate: &SeasonalClimate,
    settings: &InsolaSettings,
    clock: &WorldClock,
    show_rate: bool,
) -> String {
    let Some(planet) = world.planet() else {
        return match world.last_error() {
            Some(e) => format!("world not loaded: {e}"),
            None => "loading the world...".to_string(),
        };
    };
    let name = &planet.spec().name;
    let d = &sky.date;
    let date = match &d.month_name {
        Some(month) => format!("year {} {} {}", d.year, d.day_of_month, month),
        None => format!("year {} day {}", d.year, d.day_of_year + 1),
    };
    let place = settings.reference_place_clamped();
    // Local mean time to the nearest minute (a world's day may have more or fewer than 24 h).
    let day_min = (planet.day_s() / 60.0).round().max(1.0);
    let local_min = (planet.local_mean_time_fraction(sky.world_time_s, place.longitude_rad)
        * planet.day_s()
        / 60.0)
        .round()
        .rem_euclid(day_min);
    let temperature = climate
        .local_temperature_c(planet, place, sky.world_time_s)
        .map_or("... C".to_string(), |t| format!("{t:.1} C"));
    let rate = if !show_rate {
        String::new()
    } else if clock.is_paused() {
        " | paused".to_string()
    } else {
        format!(
            " | 1 day = {:.0} s",
            planet.day_s() / clock.rate().abs().max(1e-9)
        )
    };
    // The second sun and the ring, where the world has them.
    let mut extra = String::new();
    for o in &sky.other_stars {
        extra += &format!(", 2nd star {:+.1} deg", o.body.altitude_rad.to_degrees());
    }
    if let Some(ring) = &sky.ring
        && ring.shadow_transmission < 1.0
    {
        extra += &format!(
            ", ring shadow {:.0}% through",
            100.0 * ring.shadow_transmission
        );
    }
    // Plain ASCII: Bevy's built-in font has no degree sign. Two lines, split where the reader's
    // eye expects (where and when; then the sky), so that long twilight names never wrap
    // mid-phrase on narrow views.
    format!(
        "{name} {lat:.0}{ns} | {date} {hh:02}:{mm:02} | {season}\nstar {alt:+.1} deg{extra}, {phase} | {temperature}{rate}",
        lat = settings.reference_latitude_deg.abs(),
        ns = if settings.reference_latitude_deg >= 0.0 {
            "N"
        } else {
            "S"
        },
        hh = (local_min / 60.0).floor() as u32,
        mm = local_min.rem_euclid(60.0) as u32,
        season = sky.season,
        alt = sky.star.altitude_rad.to_degrees(),
        phase = sky.phase,
    )
}

/// Updates the [`StatusLine`] text.
pub fn update_status_line(
    world: Res<ActiveWorld>,
    sky: Res<SkyState>,
    climate: Res<SeasonalClimate>,
    settings: Res<InsolaSettings>,
    clock: Res<WorldClock>,
    mut lines: Query<(&mut Text, &StatusLine)>,
) {
    for (mut line, status) in &mut lines {
        let text = status_text(&world, &sky, &climate, &settings, &clock, status.show_rate);
        if line.0 != text {
            line.0 = text;
        }
    }
}

/// A camera exposure that follows the light at once (for pictures: no adaptation delay).
pub fn instant_exposure() -> (ExposureFollowsSky, Exposure) {
    (
        ExposureFollowsSky {
            max_change_ev_per_s: f64::INFINITY,
            ..default()
        },
        Exposure::default(),
    )
}

/// `true` once the asset for a world file is loaded (for examples that wait on it).
pub fn world_loaded(world: &ActiveWorld, files: &Assets<WorldFile>) -> bool {
    world.planet().is_some() || world.handle().is_some_and(|h| files.get(h).is_some())
}
