//! One struct per panel and tool window; each implements [`Panel`]: it
//! reads the document and its evaluation ([`View`]) and emits commands.

pub mod charts;
pub mod compare;
pub mod conditions;
pub mod formula;
pub mod goal;
pub mod library;
pub mod results;
pub mod stability;

use super::commands::Command;
use super::compute::{ChartData, Evaluation};
use super::document::Document;

/// What every panel reads this frame.
#[derive(Clone, Copy)]
pub struct View<'a> {
    /// The open document.
    pub doc: &'a Document,
    /// The evaluation of its active variant, once there is one.
    pub eval: Option<&'a Evaluation>,
    /// The chart data to show (the newest, or the last while a newer one
    /// is computed).
    pub chart: Option<&'a ChartData>,
    /// Whether a chart is being computed.
    pub chart_busy: bool,
}

/// One signature for every panel and tool window.
pub trait Panel {
    /// Shows the panel (a tool window shows itself over `ui`'s context)
    /// and pushes what the user asked for onto `out`.
    fn ui(&mut self, ui: &mut egui::Ui, view: &View<'_>, out: &mut Vec<Command>);
}
