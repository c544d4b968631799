//! The corpus of broken world files in `crates/insola/tests/bad-worlds/`, read the same way by
//! the core's, the command's and the plugin's tests.
//!
//! Every file starts with a comment saying which error it must give: `// expect:
//! field:<dotted path>` for a validation error naming that field, `// expect: syntax` for a
//! parse error with line and column, `// expect: unknown:<name>` for an unknown field.

use std::path::{Path, PathBuf};

/// The error a broken file must give.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Expected {
    /// A validation error naming this dotted field.
    Field(String),
    /// An unknown field of this name.
    Unknown(String),
    /// A parse error with line and column.
    Syntax,
}

/// One broken world file.
#[derive(Debug, Clone)]
pub struct BadWorld {
    /// Where it is.
    pub path: PathBuf,
    /// Its file name, for messages.
    pub name: String,
    /// What it must give.
    pub expected: Expected,
    /// Its whole text.
    pub text: String,
}

/// The corpus folder (beside the core's tests, where new broken files are added).
pub fn corpus_dir() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("../insola/tests/bad-worlds")
}

/// The whole corpus, sorted by file name.
pub fn corpus() -> Vec<BadWorld> {
    bad_worlds(&corpus_dir())
}

/// Every `*.world.ron` file of `dir`, sorted by name; panics on a file whose first line does
/// not say what it expects.
pub fn bad_worlds(dir: &Path) -> Vec<BadWorld> {
    let mut out: Vec<BadWorld> = std::fs::read_dir(dir)
        .expect("corpus folder")
        .map(|entry| entry.expect("corpus entry").path())
        .filter(|path| path.to_string_lossy().ends_with(".world.ron"))
        .map(|path| {
            let text = std::fs::read_to_string(&path).expect("readable corpus file");
            let name = path.file_name().unwrap().to_string_lossy().into_owned();
            let line = text.lines().next().unwrap_or("");
            let expect = line
                .strip_prefix("// expect:")
                .unwrap_or_else(|| panic!("{name}: first line must say `// expect: ...`"))
                .trim();
            let expected = if let Some(field) = expect.strip_prefix("field:") {
                Expected::Field(field.to_string())
            } else if let Some(unknown) = expect.strip_prefix("unknown:") {
                Expected::Unknown(unknown.to_string())
            } else if expect == "syntax" {
                Expected::Syntax
            } else {
                panic!("{name}: unreadable expectation `{expect}`")
            };
            BadWorld {
                path,
                name,
                expected,
                text,
            }
        })
        .collect();
    out.sort_by(|a, b| a.name.cmp(&b.name));
    out
}
