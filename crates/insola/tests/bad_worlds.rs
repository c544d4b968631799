//! The corpus of broken world files in `tests/bad-worlds/`: each starts with a comment
//! `// expect: ...` saying which error it must give — `field:<dotted path>` for a validation
//! error naming that field, `syntax` for a parse error with line and column, or
//! `unknown:<name>` for an unknown field reported with the list of known ones.

use insola::{SpecError, WorldSpec};

use insola_test_support::bad_worlds::{Expected, corpus};

#[test]
fn corpus_has_at_least_thirty_files() {
    assert!(corpus().len() >= 30);
}

#[test]
fn every_broken_world_gives_the_expected_error() {
    for bad in corpus() {
        let path = bad.path.display().to_string();
        let err = WorldSpec::from_path(&bad.path).expect_err(&path);
        let shown = err.to_string();
        match &bad.expected {
            Expected::Field(field) => {
                assert_eq!(err.field(), Some(field.as_str()), "{path}: {shown}");
                assert!(
                    shown.contains(field.as_str()),
                    "{path}: message must name the field: {shown}"
                );
            }
            Expected::Unknown(name) => match &err {
                SpecError::UnknownField {
                    field, known, line, ..
                } => {
                    assert_eq!(field, name, "{path}");
                    assert!(!known.is_empty() && *line >= 1, "{path}: {shown}");
                }
                other => panic!("{path}: expected an unknown-field error, got {other}"),
            },
            Expected::Syntax => match &err {
                SpecError::Syntax { line, column, .. } => {
                    assert!(*line >= 1 && *column >= 1, "{path}: {shown}");
                    assert!(shown.contains("line"), "{path}: {shown}");
                }
                other => panic!("{path}: expected a syntax error, got {other}"),
            },
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
