//! The corpus of broken world files in `tests/bad-worlds/`: each starts with a comment
//! `// expect: ...` saying which error it must give — `field:<dotted path>` for a validation
//! error naming that field, `syntax` for a parse error with line and column, or
//! `unknown:<name>` for an unknown field reported with the list of known ones.

use insola::{SpecError, WorldSpec};

fn corpus() -> Vec<(String, String, String)> {
    let dir = concat!(env!("CARGO_MANIFEST_DIR"), "/tests/bad-worlds");
    let mut out = Vec::new();
    for entry in std::fs::read_dir(dir).expect("corpus folder") {
        let path = entry.unwrap().path();
        let text = std::fs::read_to_string(&path).unwrap();
        let expect = text
            .lines()
            .next()
            .unwrap_or("")
            .trim_start_matches("// expect:")
            .trim()
            .to_string();
        out.push((path.display().to_string(), expect, text));
    }
    out.sort();
    out
}

#[test]
fn corpus_has_at_least_thirty_files() {
    assert!(corpus().len() >= 30);
}

#[test]
fn every_broken_world_gives_the_expected_error() {
    for (path, expect, _) in corpus() {
        let err = WorldSpec::from_path(&path).expect_err(&path);
        let shown = err.to_string();
        if let Some(field) = expect.strip_prefix("field:") {
            assert_eq!(err.field(), Some(field), "{path}: {shown}");
            assert!(
                shown.contains(field),
                "{path}: message must name the field: {shown}"
            );
        } else if let Some(name) = expect.strip_prefix("unknown:") {
            match &err {
                SpecError::UnknownField {
                    field, known, line, ..
                } => {
                    assert_eq!(field, name, "{path}");
                    assert!(!known.is_empty() && *line >= 1, "{path}: {shown}");
                }
                other => panic!("{path}: expected an unknown-field error, got {other}"),
            }
        } else if expect == "syntax" {
            match &err {
                SpecError::Syntax { line, column, .. } => {
                    assert!(*line >= 1 && *column >= 1, "{path}: {shown}");
                    assert!(shown.contains("line"), "{path}: {shown}");
                }
                other => panic!("{path}: expected a syntax error, got {other}"),
            }
        } else {
            panic!("{path}: unreadable expectation `{expect}`");
        }
    }
}

#[test]
fn parse_errors_point_at_the_right_line() {
    // The corpus files start with one comment line; the bad token is on line 6.
    let path = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/bad-worlds/syntax-bad-token.world.ron"
    );
    match WorldSpec::from_path(path).unwrap_err() {
        SpecError::Syntax { line, .. } => assert_eq!(line, 6),
        other => panic!("{other}"),
    }
}
