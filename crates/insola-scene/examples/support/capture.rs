//! Windowless rendering to images: no display, no window system, works on software Vulkan.
//!
//! [`headless_plugins`] is `DefaultPlugins` without a window and without winit, run in a loop
//! by the `ScheduleRunnerPlugin`. The camera renders into an [`Image`] ([`render_target`]).
//! [`CapturePlugin`] takes one picture per [`Shot`]: it moves the world clock to the shot's
//! instant (paused), waits until the picture stops changing — shader pipelines compile in the
//! background over the first frames, and a picture taken before they are ready misses objects
//! — then keeps it (and writes it as PNG if asked), and exits the app after the last shot.

#![allow(
    dead_code,
    reason = "shared by the examples and the render test, each using part"
)]

use std::path::PathBuf;
use std::sync::{Arc, Mutex};
use std::time::Duration;

use bevy::app::{PluginGroupBuilder, ScheduleRunnerPlugin};
use bevy::asset::RenderAssetUsages;
use bevy::camera::RenderTarget;
use bevy::prelude::*;
use bevy::render::render_resource::{Extent3d, TextureDimension, TextureFormat, TextureUsages};
use bevy::render::view::screenshot::{Screenshot, ScreenshotCaptured};
use bevy::window::ExitCondition;
use bevy::winit::WinitPlugin;
use bevy_insola::{WorldClock, WorldInstant};

/// `DefaultPlugins` for rendering without a window: no primary window, no winit, the app
/// loop driven by the `ScheduleRunnerPlugin` (add it: [`runner`]).
pub fn headless_plugins() -> PluginGroupBuilder {
    DefaultPlugins
        .set(WindowPlugin {
            primary_window: None,
            primary_cursor_options: None,
            exit_condition: ExitCondition::DontExit,
            close_when_requested: false,
        })
        .disable::<WinitPlugin>()
}

/// The loop runner for a windowless app: as fast as it goes.
pub fn runner() -> ScheduleRunnerPlugin {
    ScheduleRunnerPlugin::run_loop(Duration::ZERO)
}

/// A `width × height` sRGB image a camera can render into.
pub fn render_target(images: &mut Assets<Image>, width: u32, height: u32) -> Handle<Image> {
    let mut image = Image::new_fill(
        Extent3d {
            width: width.max(1),
            height: height.max(1),
            depth_or_array_layers: 1,
        },
        TextureDimension::D2,
        &[0, 0, 0, 255],
        TextureFormat::Rgba8UnormSrgb,
        RenderAssetUsages::default(),
    );
    image.texture_descriptor.usage = TextureUsages::TEXTURE_BINDING
        | TextureUsages::COPY_DST
        | TextureUsages::COPY_SRC
        | TextureUsages::RENDER_ATTACHMENT;
    images.add(image)
}

/// A camera target for [`render_target`]'s image.
pub fn image_target(handle: &Handle<Image>) -> RenderTarget {
    RenderTarget::Image(handle.clone().into())
}

/// One picture to take.
#[derive(Debug, Clone)]
pub struct Shot {
    /// A name for the picture (used in log lines).
    pub label: String,
    /// World time to show, seconds since time zero; `None` keeps the clock where it is.
    pub world_time_s: Option<f64>,
    /// Where to write the PNG, if anywhere.
    pub path: Option<PathBuf>,
}

/// A picture taken.
#[derive(Debug, Clone)]
pub struct Captured {
    /// The shot's label.
    pub label: String,
    /// The picture.
    pub image: Image,
    /// Frames rendered for this shot before it settled.
    pub frames: u32,
}

/// Pictures taken so far, shared with the code that started the app.
pub type CaptureSink = Arc<Mutex<Vec<Captured>>>;

/// Takes the [`Shot`]s in order, then sends `AppExit`.
pub struct CapturePlugin {
    /// The pictures to take.
    pub shots: Vec<Shot>,
    /// The image the camera renders into.
    pub target: Handle<Image>,
    /// Frames to render before the first sample of the first shot (pipelines compile).
    pub warmup_frames: u32,
    /// Frames to render before the first sample of later shots (shadows, exposure).
    pub settle_frames: u32,
    /// Give up waiting for a picture to settle after this many frames (and keep the last
    /// sample, with a warning).
    pub max_frames: u32,
    /// Where the pictures go.
    pub sink: CaptureSink,
}

#[derive(Resource)]
struct CaptureState {
    shots: Vec<Shot>,
    target: Handle<Image>,
    warmup_frames: u32,
    settle_frames: u32,
    max_frames: u32,
    sink: CaptureSink,
    index: usize,
    frames_in_shot: u32,
    waiting: bool,
    previous: Option<Image>,
    /// Samples in a row that matched the one before.
    steady: u32,
    started: bool,
}

/// Samples in a row that must match before a picture counts as settled.
const STEADY_SAMPLES: u32 = 3;

#[derive(Resource, Default)]
struct Inbox(Option<Image>);

impl Plugin for CapturePlugin {
    fn build(&self, app: &mut App) {
        app.insert_resource(CaptureState {
            shots: self.shots.clone(),
            target: self.target.clone(),
            warmup_frames: self.warmup_frames,
            settle_frames: self.settle_frames.max(1),
            max_frames: self.max_frames.max(1),
            sink: self.sink.clone(),
            index: 0,
            frames_in_shot: 0,
            waiting: false,
            previous: None,
            steady: 0,
            started: false,
        })
        .init_resource::<Inbox>()
        .add_systems(Last, drive_capture);
    }
}

/// Mean absolute difference between two pictures of the same size, 0–255 per channel;
/// `f64::INFINITY` when they cannot be compared.
pub fn mean_abs_difference(a: &Image, b: &Image) -> f64 {
    match (a.data.as_deref(), b.data.as_deref()) {
        (Some(x), Some(y)) if x.len() == y.len() && !x.is_empty() => {
            let sum: u64 = x
                .iter()
                .zip(y)
                .map(|(p, q)| u64::from(p.abs_diff(*q)))
                .sum();
            sum as f64 / x.len() as f64
        }
        _ => f64::INFINITY,
    }
}

fn drive_capture(
    mut commands: Commands,
    mut state: ResMut<CaptureState>,
    mut inbox: ResMut<Inbox>,
    mut clock: ResMut<WorldClock>,
    mut exit: MessageWriter<AppExit>,
) {
    let state = &mut *state;
    if state.index >= state.shots.len() {
        exit.write(AppExit::Success);
        return;
    }
    if !state.started {
        state.started = true;
        if let Some(t) = state.shots[state.index].world_time_s {
            clock.jump_to(WorldInstant::from_secs_f64(t));
        }
        clock.pause();
    }
    state.frames_in_shot += 1;
    if let Some(image) = inbox.0.take() {
        state.waiting = false;
        let same = state
            .previous
            .as_ref()
            .is_some_and(|p| mean_abs_difference(p, &image) < 0.25);
        state.steady = if same { state.steady + 1 } else { 0 };
        let settled = state.steady >= STEADY_SAMPLES;
        let give_up = state.frames_in_shot >= state.max_frames;
        if settled || give_up {
            let shot = state.shots[state.index].clone();
            if give_up && !settled {
                warn!(
                    "capture `{}`: picture still changing after {} frames; keeping it",
                    shot.label, state.frames_in_shot
                );
            }
            if let Some(path) = &shot.path {
                save_png(&image, path);
            }
            info!("capture `{}`: {} frames", shot.label, state.frames_in_shot);
            if let Ok(mut sink) = state.sink.lock() {
                sink.push(Captured {
                    label: shot.label,
                    image,
                    frames: state.frames_in_shot,
                });
            }
            state.index += 1;
            state.frames_in_shot = 0;
            state.previous = None;
            state.steady = 0;
            if let Some(next) = state.shots.get(state.index)
                && let Some(t) = next.world_time_s
            {
                clock.jump_to(WorldInstant::from_secs_f64(t));
            }
            return;
        }
        state.previous = Some(image);
    }
    let wait = if state.index == 0 {
        state.warmup_frames
    } else {
        state.settle_frames
    };
    if !state.waiting && state.frames_in_shot >= wait {
        state.waiting = true;
        commands
            .spawn(Screenshot::image(state.target.clone()))
            .observe(
                |captured: On<ScreenshotCaptured>, mut inbox: ResMut<Inbox>| {
                    inbox.0 = Some(captured.image.clone());
                },
            );
    }
}

/// Writes a picture as an 8-bit RGB PNG (alpha dropped), creating the folder; logs errors.
pub fn save_png(image: &Image, path: &std::path::Path) {
    if let Some(dir) = path.parent().filter(|d| !d.as_os_str().is_empty())
        && let Err(e) = std::fs::create_dir_all(dir)
    {
        error!("cannot create {}: {e}", dir.display());
        return;
    }
    match image.clone().try_into_dynamic() {
        Ok(picture) => match picture.to_rgb8().save(path) {
            Ok(()) => info!("wrote {}", path.display()),
            Err(e) => error!("cannot write {}: {e}", path.display()),
        },
        Err(e) => error!("cannot convert the picture for {}: {e}", path.display()),
    }
}
