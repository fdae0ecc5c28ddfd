//! UI preferences, kept through `eframe::Storage` (losing them is harmless:
//! unreadable values fall back to defaults). Documents never live here.

use std::path::PathBuf;

use serde::{Deserialize, Serialize};

/// Storage key.
pub const KEY: &str = "colligo.prefs.v1";
/// Most recent files kept.
pub const RECENT_MAX: usize = 8;

/// Which chart the chart panel shows.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, Default)]
pub enum ChartTab {
    /// One ingredient varied.
    #[default]
    Sweep,
    /// a_w lowering per gram of each ingredient.
    PerGram,
    /// Ice fraction against temperature.
    Freezing,
    /// Vapour pressure against temperature.
    VaporPressure,
    /// Every variant side by side.
    Variants,
    /// Which ingredient moves a_w most per gram.
    Ranking,
}

/// Preferences.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(default)]
pub struct Prefs {
    /// Recently opened or saved projects, newest first.
    pub recent: Vec<PathBuf>,
    /// Chart tab shown.
    pub chart_tab: ChartTab,
    /// Height of the chart panel, points.
    pub chart_height: f32,
    /// Width of the results column, points.
    pub results_width: f32,
    /// Units for new projects (the last ones chosen).
    pub units: colligo_core::project::UnitPrefs,
}

impl Default for Prefs {
    fn default() -> Self {
        Prefs {
            recent: Vec::new(),
            chart_tab: ChartTab::Sweep,
            chart_height: 300.0,
            results_width: 380.0,
            units: colligo_core::project::UnitPrefs::default(),
        }
    }
}

impl Prefs {
    /// Puts `path` first in the recent list.
    pub fn remember(&mut self, path: PathBuf) {
        self.recent.retain(|p| p != &path);
        self.recent.insert(0, path);
        self.recent.truncate(RECENT_MAX);
    }
}
