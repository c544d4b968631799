//! `--land FILE`: the designer's land and sea for the map climate (`insola map`, `climate`,
//! `check`).
//!
//! Two kinds of file, told apart by the extension:
//!
//! * `.png`: a land/sea mask in equirectangular projection (row 0 at 90° N, column 0 at
//!   180° W, any size up to 16384 px a side). A pixel is land when it is dark: its luma
//!   (Rec. 601 weights, as the `image` crate converts to grey) below 128 of 255, and it is not
//!   transparent (alpha below 128 counts as sea). Black continents on a white sea, say.
//! * `.ron`: a layout of shapes in degrees ([`insola::map_climate::SurfaceLayout`], as
//!   `assets/worlds/verdance.land.ron`), drawn at 1440 × 720 px.
//!
//! The core carries the raster to the model grid by exact area fractions.

use insola::map_climate::{MapGrid, SurfaceKind, SurfaceLayout, SurfaceMap};

/// Raster size a RON layout is drawn at, px (0.25° pixels).
const LAYOUT_RASTER: (usize, usize) = (1440, 720);

/// Luma below which a mask pixel is land (of 255).
pub const LAND_BELOW_LUMA: u8 = 128;

/// A surface read from a file, with a name for titles.
pub struct Land {
    /// The file name without folders.
    pub name: String,
    /// The raster.
    pub map: SurfaceMap,
}

/// Reads `--land FILE`.
pub fn load(path: &str) -> Result<Land, String> {
    let p = std::path::Path::new(path);
    let name = p
        .file_name()
        .map_or_else(|| path.to_string(), |n| n.to_string_lossy().into_owned());
    let ext = p
        .extension()
        .and_then(|e| e.to_str())
        .map(str::to_ascii_lowercase);
    let map = match ext.as_deref() {
        Some("png") => from_png(path)?,
        Some("ron") => from_layout(path)?,
        _ => {
            return Err(format!(
                "--land {path}: a land file is a PNG mask (.png) or a layout of shapes (.ron)"
            ));
        }
    };
    Ok(Land { name, map })
}

fn from_png(path: &str) -> Result<SurfaceMap, String> {
    let img = image::open(path)
        .map_err(|e| format!("--land {path}: cannot read the PNG: {e}"))?
        .to_luma_alpha8();
    let (w, h) = img.dimensions();
    let land: Vec<bool> = img
        .pixels()
        .map(|p| p.0[1] >= 128 && p.0[0] < LAND_BELOW_LUMA)
        .collect();
    SurfaceMap::from_land_mask(w as usize, h as usize, &land)
        .map_err(|e| format!("--land {path}: {e}"))
}

fn from_layout(path: &str) -> Result<SurfaceMap, String> {
    let text =
        std::fs::read_to_string(path).map_err(|e| format!("--land {path}: cannot read: {e}"))?;
    let layout = SurfaceLayout::from_ron_str(&text).map_err(|e| format!("--land {path}: {e}"))?;
    layout
        .validate()
        .map_err(|e| format!("--land {path}: {e}"))?;
    layout
        .rasterise(LAYOUT_RASTER.0, LAYOUT_RASTER.1)
        .map_err(|e| format!("--land {path}: {e}"))
}

/// Whether the surface at a place is land (an ice sheet counts), degrees.
pub fn is_land(map: &SurfaceMap, lat_deg: f64, lon_deg: f64) -> bool {
    map.kind_at(lat_deg, lon_deg) != SurfaceKind::Sea
}

/// Parses `--grid COLUMNSxROWS` (e.g. `128x64`).
pub fn parse_grid(text: &str) -> Result<MapGrid, String> {
    let bad = |why: String| format!("--grid {text}: {why} (expected COLUMNSxROWS, e.g. 128x64)");
    let (c, r) = text
        .split_once(['x', 'X', '×'])
        .ok_or_else(|| bad("no `x` between the two numbers".into()))?;
    let num = |s: &str| {
        s.trim()
            .parse::<usize>()
            .map_err(|_| bad(format!("`{s}` is not a whole number")))
    };
    let (c, r) = (num(c)?, num(r)?);
    if c.saturating_mul(r) > MAX_GRID_CELLS {
        return Err(bad(format!(
            "{c} × {r} cells; at most {MAX_GRID_CELLS} (e.g. 512x256): the year of every cell is kept in memory"
        )));
    }
    MapGrid::new(c, r).map_err(|e| bad(e.to_string()))
}

/// Most model cells the CLI runs: 512 × 256, whose stored year at 180 steps is about 94 MB.
pub const MAX_GRID_CELLS: usize = 512 * 256;

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn grids_parse_and_bad_ones_say_why() {
        let g = parse_grid("64x32").unwrap();
        assert_eq!((g.columns(), g.row_count()), (64, 32));
        for bad in ["64", "ax32", "64x", "2x2", "64x-3", "4096x2000"] {
            assert!(parse_grid(bad).unwrap_err().contains("--grid"), "{bad}");
        }
    }
}
