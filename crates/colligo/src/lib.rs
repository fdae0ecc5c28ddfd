//! The Colligo desktop app and its command line, over `colligo-core`.

pub mod app;
pub mod cli;
pub mod csv_out;

/// The cautions shown with every result a person may act on: the results
/// panel, and the command line's `eval`, `solve`, and the JSON of `freeze`
/// and `sweep`.
pub const CAUTIONS: &str = "Predictions are estimates from published models. Confirm with a calibrated water-activity \
measurement (e.g. ISO 18787) before relying on a formula, and defer to local food or cosmetic codes and to a \
process authority or other licensed practice for safety decisions.";
