//! CSV written into memory the same way for every export and table of the
//! app and the command line: the `csv` crate's RFC 4180 quoting (a field
//! with a comma, a quote or a line break is quoted) and `\n` line ends.

use csv::{Terminator, Writer, WriterBuilder};

/// The writer settings: `\n` line ends, records of any length.
pub fn builder() -> WriterBuilder {
    let mut b = WriterBuilder::new();
    b.terminator(Terminator::Any(b'\n')).flexible(true);
    b
}

/// A writer into memory with [`builder`]'s settings.
pub fn writer() -> Writer<Vec<u8>> {
    builder().from_writer(Vec::new())
}

/// The bytes written to `w`.
///
/// # Errors
/// The final flush (which cannot fail in memory).
pub fn finish(w: Writer<Vec<u8>>) -> Result<Vec<u8>, csv::Error> {
    w.into_inner().map_err(|e| csv::Error::from(e.into_error()))
}

/// The CSV text that `rows` writes with [`builder`]'s settings.
pub fn text(rows: impl FnOnce(&mut Writer<Vec<u8>>) -> csv::Result<()>) -> String {
    text_with(&builder(), rows)
}

/// The text that `rows` writes with the settings of `b`. Writing into
/// memory does not fail; if it did, the text is a one-column `error` table
/// with the reason, as the chart export writes for a failed chart.
pub fn text_with(
    b: &WriterBuilder,
    rows: impl FnOnce(&mut Writer<Vec<u8>>) -> csv::Result<()>,
) -> String {
    let mut w = b.from_writer(Vec::new());
    match rows(&mut w).and_then(|()| finish(w)) {
        Ok(bytes) => String::from_utf8(bytes)
            .unwrap_or_else(|e| String::from_utf8_lossy(e.as_bytes()).into_owned()),
        Err(e) => format!("error\n{}\n", quote(&e.to_string())),
    }
}

/// One field as a CSV file holds it: quoted when it contains a comma, a
/// quote or a line break, as is otherwise.
pub fn quote(field: &str) -> String {
    if field.is_empty() {
        // Alone on its line, an empty field would be written as `""`.
        return String::new();
    }
    // A quoted field is closed only when its record ends.
    let mut w = writer();
    match w.write_record([field]).and_then(|()| finish(w)) {
        Ok(mut b) if b.last() == Some(&b'\n') => {
            b.pop();
            String::from_utf8(b).unwrap_or_else(|_| field.to_string())
        }
        _ => field.to_string(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn fields_are_quoted_only_when_needed() {
        assert_eq!(quote("plain"), "plain");
        assert_eq!(quote(""), "");
        assert_eq!(quote("x,y"), "\"x,y\"");
        assert_eq!(quote("say \"a_w\""), "\"say \"\"a_w\"\"\"");
        assert_eq!(quote("two\nlines"), "\"two\nlines\"");
        let t = text(|w| {
            w.write_record(["a", "b, c"])?;
            w.write_record(["1", ""])
        });
        assert_eq!(t, "a,\"b, c\"\n1,\n");
    }

    #[test]
    fn quoted_line_breaks_read_back() {
        let name = "two\nlines, \"quoted\"";
        let t = text(|w| w.write_record([name, "0.5"]));
        let mut r = csv::ReaderBuilder::new()
            .has_headers(false)
            .from_reader(t.as_bytes());
        let rows: Vec<csv::StringRecord> = r.records().filter_map(Result::ok).collect();
        assert_eq!(rows.len(), 1);
        assert_eq!(rows[0].get(0), Some(name));
        assert_eq!(rows[0].get(1), Some("0.5"));
    }

    #[test]
    fn comparison_export_reads_back_names_and_errors_with_line_breaks() {
        use crate::app::panels::compare::{Comparison, VariantRow};
        use colligo_core::properties::{self, Wanted};
        let lib = colligo_core::Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let f = colligo_core::Formula::new(
            "syrup",
            colligo_core::formula::parse_mix("water=100g, sucrose=50g")
                .unwrap_or_else(|e| panic!("{e}")),
        );
        let comp = f.composition(&lib).unwrap_or_else(|e| panic!("{e}"));
        let p = properties::evaluate(
            &lib,
            &comp,
            colligo_core::ModelChoice::Auto,
            &colligo_core::Conditions::default(),
            Wanted::ALL,
        )
        .unwrap_or_else(|e| panic!("{e}"));
        let aw = p.water_activity;
        let mut cmp = Comparison::default();
        cmp.rows = vec![
            VariantRow {
                name: "Syrup, \"light\"\nsecond line".into(),
                props: Ok(p),
            },
            VariantRow {
                name: "Dry".into(),
                props: Err("no water\n(check the lines)".into()),
            },
        ];
        let text = cmp.csv();
        let mut r = csv::ReaderBuilder::new().from_reader(text.as_bytes());
        let rows: Vec<csv::StringRecord> = r.records().filter_map(Result::ok).collect();
        assert_eq!(rows.len(), 2, "{text}");
        assert_eq!(rows[0].get(0), Some("Syrup, \"light\"\nsecond line"));
        assert_eq!(rows[0].get(1).and_then(|s| s.parse().ok()), Some(aw));
        assert_eq!(rows[0].get(8), Some(""));
        assert_eq!(rows[1].get(0), Some("Dry"));
        assert_eq!(rows[1].get(1), Some(""));
        assert_eq!(rows[1].get(8), Some("no water\n(check the lines)"));
    }
}
