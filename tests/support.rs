//! Support for the reference-check suite: reading the published tables in
//! `tests/data/*.csv` and comparing them with a stated tolerance.
//!
//! Every row carries a `source` and a `tag`. Rows tagged `Pub` (read in the
//! published source) and `Lib` (computed with a named general-purpose
//! library) are hard checks. Rows tagged `Mem` (recalled, unconfirmed) are
//! compared and reported but never fail the suite.

use std::collections::HashMap;
use std::path::PathBuf;

/// One row of a table, by column name.
#[derive(Debug, Clone)]
pub struct Row {
    /// Line number in the file (1-based, header is line 1).
    pub line: usize,
    fields: HashMap<String, String>,
}

impl Row {
    /// A field as text (panics with the column name when missing: a broken
    /// data file is a test failure).
    pub fn str(&self, col: &str) -> &str {
        self.fields
            .get(col)
            .map(String::as_str)
            .unwrap_or_else(|| panic!("line {}: no column `{col}`", self.line))
    }

    /// A field as a number.
    pub fn num(&self, col: &str) -> f64 {
        let s = self.str(col).trim();
        s.parse()
            .unwrap_or_else(|_| panic!("line {}: `{s}` in `{col}` is not a number", self.line))
    }

    /// A field as a number, `None` when the cell is empty.
    pub fn opt_num(&self, col: &str) -> Option<f64> {
        let s = self.str(col).trim();
        (!s.is_empty()).then(|| self.num(col))
    }

    /// A `;`-separated list of numbers.
    pub fn nums(&self, col: &str) -> Vec<f64> {
        self.str(col)
            .split(';')
            .map(|s| {
                s.trim().parse().unwrap_or_else(|_| {
                    panic!("line {}: `{s}` in `{col}` is not a number", self.line)
                })
            })
            .collect()
    }

    /// The source column.
    pub fn source(&self) -> &str {
        self.str("source")
    }

    /// True for rows that are hard checks (`Pub` or `Lib`).
    pub fn hard(&self) -> bool {
        matches!(self.str("tag").trim(), "Pub" | "Lib")
    }
}

/// Reads `tests/data/<name>.csv`: a header, then one row per record (RFC
/// 4180 quoting, so a quoted field may span lines); blank lines and lines
/// starting with `#` are skipped.
pub fn table(name: &str) -> Vec<Row> {
    let path: PathBuf = [env!("CARGO_MANIFEST_DIR"), "data", &format!("{name}.csv")]
        .iter()
        .collect();
    let text = std::fs::read_to_string(&path).unwrap_or_else(|e| panic!("{}: {e}", path.display()));
    let mut records = csv::ReaderBuilder::new()
        .has_headers(false)
        .flexible(true)
        .comment(Some(b'#'))
        .from_reader(text.as_bytes())
        .into_records()
        .map(|r| r.unwrap_or_else(|e| panic!("{name}.csv: {e}")))
        .filter(|r| !(r.len() == 1 && r.get(0).is_some_and(|f| f.trim().is_empty())));
    let header: Vec<String> = records
        .next()
        .unwrap_or_else(|| panic!("{name}.csv is empty"))
        .iter()
        .map(str::to_string)
        .collect();
    records
        .map(|f| {
            let line = f.position().map_or(0, |p| p.line() as usize);
            assert_eq!(
                f.len(),
                header.len(),
                "{name}.csv line {line}: {} fields, header has {}",
                f.len(),
                header.len()
            );
            Row {
                line,
                fields: header
                    .iter()
                    .cloned()
                    .zip(f.iter().map(str::to_string))
                    .collect(),
            }
        })
        .collect()
}

/// How far a value may be from the reference.
#[derive(Debug, Clone, Copy)]
pub enum Tol {
    /// |got − want| ≤ value.
    Abs(f64),
    /// |got − want| ≤ value · |want|.
    Rel(f64),
}

impl Tol {
    fn ok(self, got: f64, want: f64) -> bool {
        match self {
            Tol::Abs(t) => (got - want).abs() <= t,
            Tol::Rel(t) => (got - want).abs() <= t * want.abs(),
        }
    }
}

/// Collects comparisons for one table, reports the worst deviation, and
/// fails (naming each failing row's source) at [`Check::finish`].
#[derive(Debug)]
pub struct Check {
    name: String,
    n: usize,
    worst_abs: (f64, String),
    worst_rel: (f64, String),
    failures: Vec<String>,
    soft: Vec<String>,
}

impl Check {
    /// A new check named after its table.
    pub fn new(name: &str) -> Self {
        Check {
            name: name.to_string(),
            n: 0,
            worst_abs: (0.0, String::new()),
            worst_rel: (0.0, String::new()),
            failures: Vec::new(),
            soft: Vec::new(),
        }
    }

    /// Compares `got` with the row's reference `want`.
    pub fn compare(&mut self, row: &Row, label: &str, got: f64, want: f64, tol: Tol) {
        let d = got - want;
        let r = if want != 0.0 { d / want } else { d };
        let desc = format!("{label}: got {got:.6}, want {want:.6} ({})", row.source());
        if !row.hard() {
            self.soft.push(format!(
                "{desc} — soft (tag {}), deviation {d:+.3e}",
                row.str("tag")
            ));
            return;
        }
        self.n += 1;
        if !got.is_finite() || !tol.ok(got, want) {
            self.failures
                .push(format!("line {}: {desc}, tolerance {tol:?}", row.line));
        }
        if d.abs() > self.worst_abs.0 || !got.is_finite() {
            self.worst_abs = (d.abs(), desc.clone());
        }
        if r.abs() > self.worst_rel.0 {
            self.worst_rel = (r.abs(), desc);
        }
    }

    /// Prints the summary; returns the failure text, if any.
    pub fn report(self) -> Option<String> {
        println!("[{}] {} hard checks", self.name, self.n);
        println!(
            "  worst absolute deviation {:.3e}: {}",
            self.worst_abs.0, self.worst_abs.1
        );
        println!(
            "  worst relative deviation {:.3e}: {}",
            self.worst_rel.0, self.worst_rel.1
        );
        for s in &self.soft {
            println!("  {s}");
        }
        if self.n == 0 {
            return Some(format!("[{}] no hard checks ran", self.name));
        }
        (!self.failures.is_empty()).then(|| {
            format!(
                "[{}] {} of {} checks outside tolerance:\n{}",
                self.name,
                self.failures.len(),
                self.n,
                self.failures.join("\n")
            )
        })
    }

    /// Reports and fails on any hard deviation beyond tolerance.
    pub fn finish(self) {
        if let Some(f) = self.report() {
            panic!("{f}");
        }
    }
}

/// Reports every check, then fails with all failures together.
pub fn finish_all(checks: impl IntoIterator<Item = Check>) {
    let failures: Vec<String> = checks.into_iter().filter_map(Check::report).collect();
    assert!(failures.is_empty(), "{}", failures.join("\n\n"));
}

/// The built-in library (panics with the loader's message if broken).
pub fn library() -> colligo_core::Library {
    colligo_core::Library::builtin().unwrap_or_else(|e| panic!("built-in library: {e}"))
}
