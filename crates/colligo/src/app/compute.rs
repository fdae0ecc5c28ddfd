//! What the views show, computed only when the formula or conditions
//! change: the property set (on the UI thread, it takes tens of
//! microseconds) and chart data (on a worker thread, so a heavy sweep never
//! stalls a frame).

use std::collections::hash_map::DefaultHasher;
use std::hash::{Hash, Hasher};
use std::sync::Arc;
use std::sync::mpsc::{self, Receiver, Sender};
use std::time::{Duration, Instant};

use colligo_core::formula::Resolved;
use colligo_core::models::ModelChoice;
use colligo_core::properties::{
    self, Conditions, FreezingCurve, LineShare, ModelResult, Properties, VaporPoint, Wanted,
    WaterAt,
};
use colligo_core::sweep::{self, QuickSweep};
use colligo_core::water::T_ZERO_C;
use colligo_core::{Formula, Library};

use super::document::Document;

/// One evaluation of the active variant.
#[derive(Debug, Clone)]
pub struct Evaluation {
    /// Key of the inputs.
    pub key: u64,
    /// Resolved formula (line masses), or the reason it failed.
    pub resolved: Result<Resolved, String>,
    /// Properties under the chosen model.
    pub props: Result<Properties, String>,
    /// Per line.
    pub lines: Vec<LineShare>,
    /// Every model's a_w.
    pub comparison: Vec<ModelResult>,
    /// Lowest and highest a_w among applicable models (not `ideal`).
    pub band: Option<(f64, f64)>,
    /// Time it took.
    pub elapsed: Duration,
}

/// Hash of everything an evaluation depends on: the formula's lines, the
/// conditions, the model and the revision of the library.
pub fn key_of(
    library_revision: u64,
    formula: &Formula,
    cond: &Conditions,
    model: ModelChoice,
) -> u64 {
    let mut h = DefaultHasher::new();
    for l in &formula.lines {
        l.ingredient.hash(&mut h);
        l.amount.to_bits().hash(&mut h);
        (l.unit as u8).hash(&mut h);
    }
    cond.temperature_k.to_bits().hash(&mut h);
    cond.pressure_pa.to_bits().hash(&mut h);
    cond.storage_temperature_k.to_bits().hash(&mut h);
    model.hash(&mut h);
    library_revision.hash(&mut h);
    h.finish()
}

/// Hash of what a view of the whole project depends on: every variant's
/// name and [`key_of`] inputs. Views key on values, not on the document's
/// revision, so no path that changes the project (or replaces the
/// document) without a new revision can leave them stale.
pub fn project_key(doc: &Document) -> u64 {
    let cond = doc.project.conditions.to_conditions();
    let mut h = DefaultHasher::new();
    doc.project.variants.len().hash(&mut h);
    for v in &doc.project.variants {
        v.name.hash(&mut h);
        key_of(doc.library_revision, v, &cond, doc.project.model).hash(&mut h);
    }
    h.finish()
}

/// [`key_of`] the document's active variant.
pub fn active_key(doc: &Document) -> u64 {
    key_of(
        doc.library_revision,
        doc.formula(),
        &doc.project.conditions.to_conditions(),
        doc.project.model,
    )
}

/// Evaluates the formula under the chosen model and under every model for
/// the comparison; `key` is [`key_of`] its inputs.
pub fn evaluate(
    key: u64,
    lib: &Library,
    formula: &Formula,
    cond: &Conditions,
    model: ModelChoice,
) -> Evaluation {
    let start = Instant::now();
    let resolved = formula.resolve(lib).map_err(|e| e.to_string());
    let (props, lines, spread) = match &resolved {
        Err(e) => (
            Err(e.clone()),
            vec![LineShare::default(); formula.lines.len()],
            None,
        ),
        Ok(r) => {
            let props = properties::evaluate(lib, &r.composition, model, cond, Wanted::ALL)
                .map_err(|e| e.to_string());
            let lines = properties::line_shares(lib, r, props.as_ref().ok());
            let spread = properties::compare_models(lib, &r.composition, cond);
            (props, lines, Some(spread))
        }
    };
    let (comparison, band) = match spread {
        Some(s) => (s.results, s.band),
        None => (Vec::new(), None),
    };
    Evaluation {
        key,
        resolved,
        props,
        lines,
        comparison,
        band,
        elapsed: start.elapsed(),
    }
}

/// Which property a sweep plots.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
pub enum SweepProperty {
    /// Water activity.
    #[default]
    WaterActivity,
    /// Freezing point, °C.
    FreezingPoint,
    /// Vapour pressure, Pa.
    VaporPressure,
}

impl SweepProperty {
    /// All.
    pub const ALL: [SweepProperty; 3] = [
        SweepProperty::WaterActivity,
        SweepProperty::FreezingPoint,
        SweepProperty::VaporPressure,
    ];

    /// Axis label with unit.
    pub fn label(self) -> &'static str {
        match self {
            SweepProperty::WaterActivity => "water activity a_w",
            SweepProperty::FreezingPoint => "freezing point, °C",
            SweepProperty::VaporPressure => "vapour pressure, Pa",
        }
    }
}

/// A chart to compute.
#[derive(Debug, Clone, PartialEq)]
pub enum ChartJob {
    /// One ingredient over a range.
    Sweep {
        /// Ingredient id.
        ingredient: String,
        /// From, g.
        from_g: f64,
        /// To, g.
        to_g: f64,
    },
    /// Every ingredient of the formula: a_w lowering against grams added.
    PerGram {
        /// Largest amount added, g.
        up_to_g: f64,
    },
    /// Ice fraction from 0 °C down to `to_c`.
    Freezing {
        /// Coldest temperature, °C.
        to_c: f64,
    },
    /// Vapour pressure of the formula and of water over a temperature range.
    VaporPressure {
        /// From, °C.
        from_c: f64,
        /// To, °C.
        to_c: f64,
    },
}

impl Hash for ChartJob {
    fn hash<H: Hasher>(&self, h: &mut H) {
        std::mem::discriminant(self).hash(h);
        match self {
            ChartJob::Sweep {
                ingredient,
                from_g,
                to_g,
            } => {
                ingredient.hash(h);
                from_g.to_bits().hash(h);
                to_g.to_bits().hash(h);
            }
            ChartJob::PerGram { up_to_g } => up_to_g.to_bits().hash(h),
            ChartJob::Freezing { to_c } => to_c.to_bits().hash(h),
            ChartJob::VaporPressure { from_c, to_c } => {
                from_c.to_bits().hash(h);
                to_c.to_bits().hash(h);
            }
        }
    }
}

/// Computed chart data.
#[derive(Debug, Clone)]
pub enum ChartData {
    /// A sweep: amounts (g), a_w, freezing point (°C), vapour pressure (Pa).
    Sweep {
        /// Ingredient id.
        ingredient: String,
        /// The result.
        sweep: QuickSweep,
        /// Vapour pressure at each amount, Pa.
        vapor_pa: Vec<f64>,
    },
    /// Per ingredient: (id, grams added, Δa_w lowering).
    PerGram(Vec<(String, Vec<f64>, Vec<f64>)>),
    /// A freezing curve.
    Freezing(FreezingCurve),
    /// Vapour pressure of the formula and of water against temperature.
    VaporPressure(Vec<VaporPoint>),
    /// The chart could not be computed.
    Failed(String),
}

/// A request with everything it needs, so the worker owns its inputs.
#[derive(Debug, Clone)]
struct Request {
    key: u64,
    /// The [`Document::id`] it was asked for.
    document: u64,
    /// Repainted when the result is ready.
    ctx: Option<egui::Context>,
    lib: Arc<Library>,
    formula: Formula,
    cond: Conditions,
    model: ModelChoice,
    job: ChartJob,
}

impl Default for ChartWorker {
    fn default() -> Self {
        Self::new()
    }
}

/// Chart computations on a worker thread; the newest request wins.
pub struct ChartWorker {
    tx: Sender<Request>,
    rx: Receiver<ChartResult>,
    /// Key of the last request sent.
    pub requested: Option<u64>,
    /// Latest result.
    pub latest: Option<ChartResult>,
}

/// A finished chart computation.
#[derive(Debug, Clone)]
pub struct ChartResult {
    /// Key of its request.
    pub key: u64,
    /// The [`Document::id`] it was computed for.
    pub document: u64,
    /// The data.
    pub data: ChartData,
    /// Time taken.
    pub elapsed: Duration,
}

impl ChartWorker {
    /// Starts the worker; it repaints the requesting context when a result is ready.
    pub fn new() -> Self {
        let (tx, jobs) = mpsc::channel::<Request>();
        let (done, rx) = mpsc::channel();
        std::thread::Builder::new()
            .name("colligo-charts".into())
            .spawn(move || {
                while let Ok(mut req) = jobs.recv() {
                    // Skip to the newest request.
                    while let Ok(r) = jobs.try_recv() {
                        req = r;
                    }
                    let start = Instant::now();
                    let data = compute_chart(&req);
                    let result = ChartResult {
                        key: req.key,
                        document: req.document,
                        data,
                        elapsed: start.elapsed(),
                    };
                    if done.send(result).is_err() {
                        break;
                    }
                    if let Some(ctx) = &req.ctx {
                        ctx.request_repaint();
                    }
                }
            })
            .ok();
        ChartWorker {
            tx,
            rx,
            requested: None,
            latest: None,
        }
    }

    /// Asks for a chart of the document's active variant unless the same
    /// one is already asked for.
    pub fn request(&mut self, ctx: &egui::Context, doc: &Document, job: ChartJob) {
        let formula = doc.formula();
        let cond = doc.project.conditions.to_conditions();
        let model = doc.project.model;
        let mut h = DefaultHasher::new();
        key_of(doc.library_revision, formula, &cond, model).hash(&mut h);
        job.hash(&mut h);
        let key = h.finish();
        if self.requested == Some(key) {
            return;
        }
        self.requested = Some(key);
        let _ = self.tx.send(Request {
            key,
            document: doc.id,
            ctx: Some(ctx.clone()),
            lib: doc.lib.clone(),
            formula: formula.clone(),
            cond,
            model,
            job,
        });
    }

    /// Collects finished results.
    pub fn poll(&mut self) {
        while let Ok(r) = self.rx.try_recv() {
            self.latest = Some(r);
        }
    }

    /// The latest data when it matches the last request.
    pub fn current(&self) -> Option<&ChartData> {
        match (&self.latest, self.requested) {
            (Some(l), Some(r)) if l.key == r => Some(&l.data),
            _ => None,
        }
    }

    /// What to show for `doc`: the latest data computed for this document,
    /// even if a newer request is still being computed; never another
    /// document's (in the first frame after a document is replaced, the
    /// last request is still the old document's).
    pub fn shown(&self, doc: &Document) -> Option<&ChartData> {
        self.latest
            .as_ref()
            .filter(|l| l.document == doc.id)
            .map(|l| &l.data)
    }

    /// Whether a request is still being computed.
    pub fn busy(&self) -> bool {
        self.requested.is_some() && self.latest.as_ref().map(|l| l.key) != self.requested
    }
}

/// Computes one chart (also used synchronously by exports and tests).
fn compute_chart(req: &Request) -> ChartData {
    let Request {
        lib,
        formula,
        cond,
        model,
        job,
        ..
    } = req;
    let t = cond.temperature_k;
    match job {
        ChartJob::Sweep {
            ingredient,
            from_g,
            to_g,
        } => {
            let amounts = sweep::linspace(from_g / 1000.0, to_g / 1000.0, 121);
            match sweep::quick_sweep(lib, formula, ingredient, &amounts, *model, t, true) {
                Ok(s) => {
                    let pure = WaterAt::new(t);
                    let vapor_pa = s
                        .water_activity
                        .iter()
                        .map(|&a| pure.vapor_pressure_pa(a))
                        .collect();
                    ChartData::Sweep {
                        ingredient: ingredient.clone(),
                        sweep: s,
                        vapor_pa,
                    }
                }
                Err(e) => ChartData::Failed(e.to_string()),
            }
        }
        ChartJob::PerGram { up_to_g } => {
            let mut ids: Vec<String> = Vec::new();
            for l in &formula.lines {
                if !ids.contains(&l.ingredient) {
                    ids.push(l.ingredient.clone());
                }
            }
            let resolved = match formula.resolve(lib) {
                Ok(r) => r,
                Err(e) => return ChartData::Failed(e.to_string()),
            };
            let base_kg = |id: &str| resolved.kg_of(formula, id);
            let added = sweep::linspace(0.0, up_to_g / 1000.0, 41);
            let jobs: Vec<(String, Vec<f64>)> = ids
                .iter()
                .map(|id| {
                    let b = base_kg(id);
                    (id.clone(), added.iter().map(|a| b + a).collect())
                })
                .collect();
            match sweep::quick_sweeps(lib, formula, &jobs, *model, t, false) {
                Ok(sweeps) => ChartData::PerGram(
                    ids.iter()
                        .zip(sweeps)
                        .map(|(id, s)| {
                            let a0 = s.water_activity.first().copied().unwrap_or(f64::NAN);
                            let g: Vec<f64> = added.iter().map(|a| a * 1000.0).collect();
                            let d: Vec<f64> = s.water_activity.iter().map(|a| a0 - a).collect();
                            (id.clone(), g, d)
                        })
                        .collect(),
                ),
                Err(e) => ChartData::Failed(e.to_string()),
            }
        }
        ChartJob::Freezing { to_c } => {
            let comp = match formula.composition(lib) {
                Ok(c) => c,
                Err(e) => return ChartData::Failed(e.to_string()),
            };
            let n = 120;
            let temps: Vec<f64> = (0..=n)
                .map(|i| T_ZERO_C - 0.05 + (to_c + 0.05) * f64::from(i) / f64::from(n))
                .collect();
            match properties::freezing_curve(lib, &comp, *model, cond, &temps) {
                Ok(c) => ChartData::Freezing(c),
                Err(e) => ChartData::Failed(e.to_string()),
            }
        }
        ChartJob::VaporPressure { from_c, to_c } => {
            let comp = match formula.composition(lib) {
                Ok(c) => c,
                Err(e) => return ChartData::Failed(e.to_string()),
            };
            let n = 100;
            let temps: Vec<f64> = (0..=n)
                .map(|i| from_c + (to_c - from_c) * f64::from(i) / f64::from(n))
                .collect();
            match properties::vapor_pressure_curve(lib, &comp, *model, &temps) {
                Ok(pts) => ChartData::VaporPressure(pts),
                Err(e) => ChartData::Failed(e.to_string()),
            }
        }
    }
}

/// Computes a chart on the calling thread (exports, tests).
pub fn chart_now(
    lib: &Arc<Library>,
    formula: &Formula,
    cond: &Conditions,
    model: ModelChoice,
    job: ChartJob,
) -> ChartData {
    compute_chart(&Request {
        key: 0,
        document: 0,
        ctx: None,
        lib: lib.clone(),
        formula: formula.clone(),
        cond: *cond,
        model,
        job,
    })
}

/// CSV text of chart data.
pub fn chart_csv(d: &ChartData) -> String {
    crate::csv_out::text(|w| {
        match d {
            ChartData::Sweep {
                ingredient,
                sweep,
                vapor_pa,
            } => {
                w.write_record([
                    format!("{ingredient}_g").as_str(),
                    "water_activity",
                    "freezing_point_c",
                    "vapor_pressure_pa",
                ])?;
                for i in 0..sweep.amount_kg.len() {
                    w.write_record([
                        (sweep.amount_kg[i] * 1000.0).to_string(),
                        sweep.water_activity[i].to_string(),
                        sweep
                            .freezing_point_c
                            .get(i)
                            .copied()
                            .unwrap_or(f64::NAN)
                            .to_string(),
                        vapor_pa[i].to_string(),
                    ])?;
                }
            }
            ChartData::PerGram(series) => {
                w.write_record(["ingredient", "grams_added", "aw_lowering"])?;
                for (id, g, d) in series {
                    for (x, y) in g.iter().zip(d) {
                        w.write_record([id.as_str(), &x.to_string(), &y.to_string()])?;
                    }
                }
            }
            ChartData::Freezing(c) => {
                w.write_record([
                    "temperature_c",
                    "ice_fraction_of_water",
                    "ice_fraction_of_total",
                    "water_activity",
                ])?;
                for p in &c.points {
                    w.write_record([
                        p.temperature_c.to_string(),
                        p.ice_fraction_of_water.to_string(),
                        p.ice_fraction_of_total.to_string(),
                        p.water_activity.to_string(),
                    ])?;
                }
            }
            ChartData::VaporPressure(pts) => {
                w.write_record([
                    "temperature_c",
                    "formula_vapor_pressure_pa",
                    "water_vapor_pressure_pa",
                ])?;
                for p in pts {
                    w.write_record([
                        p.temperature_c.to_string(),
                        p.formula_pa.to_string(),
                        p.water_pa.to_string(),
                    ])?;
                }
            }
            ChartData::Failed(e) => {
                w.write_record(["error"])?;
                w.write_record([e.as_str()])?;
            }
        }
        Ok(())
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_chart_computes_and_exports() {
        let lib = Arc::new(Library::builtin().unwrap_or_else(|e| panic!("{e}")));
        let project = crate::app::files::sample(&lib, 3).unwrap_or_else(|e| panic!("{e}"));
        let f = project.active().clone();
        let cond = project.conditions.to_conditions();
        let jobs = [
            ChartJob::Sweep {
                ingredient: "sucrose".into(),
                from_g: 0.0,
                to_g: 200.0,
            },
            ChartJob::PerGram { up_to_g: 50.0 },
            ChartJob::Freezing { to_c: -30.0 },
            ChartJob::VaporPressure {
                from_c: 0.0,
                to_c: 100.0,
            },
        ];
        for job in jobs {
            let d = chart_now(&lib, &f, &cond, ModelChoice::Auto, job.clone());
            assert!(!matches!(d, ChartData::Failed(_)), "{job:?}: {d:?}");
            let csv = chart_csv(&d);
            let rows = csv.lines().count();
            assert!(rows > 20, "{job:?}: {rows} rows");
            assert!(!csv.contains("NaN,NaN"), "{job:?}");
        }
        // The ice fraction of the ice-cream mix grows as it cools.
        if let ChartData::Freezing(c) = chart_now(
            &lib,
            &f,
            &cond,
            ModelChoice::Auto,
            ChartJob::Freezing { to_c: -30.0 },
        ) {
            let f: Vec<f64> = c.points.iter().map(|p| p.ice_fraction_of_water).collect();
            assert!(f.windows(2).all(|w| w[1] >= w[0] - 1e-9));
            assert!(f.last().copied().unwrap_or(0.0) > 0.5);
        }
    }
}
