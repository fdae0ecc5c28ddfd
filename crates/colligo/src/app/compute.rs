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
use colligo_core::models::ModelId;
use colligo_core::properties::{self, Conditions, FreezingCurve, Properties, Wanted};
use colligo_core::sweep::{self, QuickSweep};
use colligo_core::warnings::Warning;
use colligo_core::water::{self, T_ZERO_C};
use colligo_core::{Formula, Library};

/// Per line: computed columns of the formula table.
#[derive(Debug, Clone, Default)]
pub struct LineInfo {
    /// Mass, g.
    pub grams: f64,
    /// Share of the batch, %.
    pub percent: f64,
    /// Solutes of this line that stay undissolved, g.
    pub undissolved_g: f64,
    /// This line's share of the lowering of ln a_w, % (sums to 100).
    pub lowering_percent: f64,
}

/// a_w of the formula under one model, for the comparison table.
#[derive(Debug, Clone)]
pub struct ModelResult {
    /// Model.
    pub model: ModelId,
    /// a_w, or why not.
    pub water_activity: Result<f64, String>,
    /// Freezing point, °C.
    pub freezing_point_c: Option<f64>,
    /// Whether the model has parameters for every solute here (no
    /// "treated as ideal" substitutions).
    pub applicable: bool,
}

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
    pub lines: Vec<LineInfo>,
    /// Every model's a_w.
    pub comparison: Vec<ModelResult>,
    /// Lowest and highest a_w among applicable models (not `ideal`).
    pub band: Option<(f64, f64)>,
    /// Time it took.
    pub elapsed: Duration,
}

/// Hash of everything an evaluation depends on.
pub fn key_of(lib: &Library, formula: &Formula, cond: &Conditions, model: ModelId) -> u64 {
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
    lib.solutes.len().hash(&mut h);
    lib.ingredients.len().hash(&mut h);
    (lib as *const Library as usize).hash(&mut h);
    h.finish()
}

/// Evaluates the formula under the chosen model and under every model for
/// the comparison.
pub fn evaluate(lib: &Library, formula: &Formula, cond: &Conditions, model: ModelId) -> Evaluation {
    let start = Instant::now();
    let key = key_of(lib, formula, cond, model);
    let resolved = formula.resolve(lib).map_err(|e| e.to_string());
    let (props, lines, comparison) = match &resolved {
        Err(e) => (
            Err(e.clone()),
            vec![LineInfo::default(); formula.lines.len()],
            Vec::new(),
        ),
        Ok(r) => {
            let props = properties::evaluate(lib, &r.composition, model, cond, Wanted::ALL)
                .map_err(|e| e.to_string());
            let lines = line_info(lib, r, props.as_ref().ok());
            let comparison = ModelId::CONCRETE
                .iter()
                .map(|&m| {
                    let p = properties::evaluate(
                        lib,
                        &r.composition,
                        m,
                        cond,
                        Wanted {
                            freezing_point: true,
                            ..Wanted::WATER_ACTIVITY
                        },
                    );
                    match p {
                        Ok(p) => ModelResult {
                            model: m,
                            water_activity: Ok(p.water_activity),
                            freezing_point_c: p.freezing_point_c,
                            applicable: !p.warnings.iter().any(|w| {
                                matches!(
                                    w,
                                    Warning::TreatedAsIdeal { .. } | Warning::VolatileByRoss { .. }
                                )
                            }),
                        },
                        Err(e) => ModelResult {
                            model: m,
                            water_activity: Err(e.to_string()),
                            freezing_point_c: None,
                            applicable: false,
                        },
                    }
                })
                .collect();
            (props, lines, comparison)
        }
    };
    let band = band_of(&comparison);
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

fn band_of(c: &[ModelResult]) -> Option<(f64, f64)> {
    let vals: Vec<f64> = c
        .iter()
        .filter(|r| r.applicable && r.model != ModelId::Ideal)
        .filter_map(|r| r.water_activity.as_ref().ok().copied())
        .collect();
    if vals.len() < 2 {
        return None;
    }
    let lo = vals.iter().copied().fold(f64::INFINITY, f64::min);
    let hi = vals.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    Some((lo, hi))
}

/// Computed columns: each line's share of the batch, of the undissolved
/// solids and of the lowering (each solute's share split among the lines
/// that bring it, by mass).
fn line_info(lib: &Library, r: &Resolved, props: Option<&Properties>) -> Vec<LineInfo> {
    let total: f64 = r.line_kg.iter().sum();
    let mut out: Vec<LineInfo> = r
        .line_kg
        .iter()
        .map(|kg| LineInfo {
            grams: kg * 1000.0,
            percent: if total > 0.0 { 100.0 * kg / total } else { 0.0 },
            ..LineInfo::default()
        })
        .collect();
    let Some(p) = props else { return out };
    let ln_total: f64 = p.solutes.iter().map(|s| s.ln_aw_share).sum();
    for s in &p.solutes {
        let Some(si) = lib.solute(&s.id) else {
            continue;
        };
        // kg of this solute brought by each line.
        let by_line: Vec<f64> = r
            .line_ingredient
            .iter()
            .zip(&r.line_kg)
            .map(|(&ing, &kg)| {
                lib.ingredients[ing]
                    .solutes
                    .iter()
                    .filter(|(s2, _, _)| *s2 == si)
                    .map(|(_, frac, _)| frac * kg)
                    .sum::<f64>()
            })
            .collect();
        let sum: f64 = by_line.iter().sum();
        if sum <= 0.0 {
            continue;
        }
        for (info, kg) in out.iter_mut().zip(&by_line) {
            let f = kg / sum;
            info.undissolved_g += f * s.undissolved_g;
            if ln_total != 0.0 {
                info.lowering_percent += 100.0 * f * s.ln_aw_share / ln_total;
            }
        }
    }
    out
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
    /// (T °C, formula p Pa, water p Pa).
    VaporPressure(Vec<(f64, f64, f64)>),
    /// The chart could not be computed.
    Failed(String),
}

/// A request with everything it needs, so the worker owns its inputs.
#[derive(Debug, Clone)]
struct Request {
    key: u64,
    /// Repainted when the result is ready.
    ctx: Option<egui::Context>,
    lib: Arc<Library>,
    formula: Formula,
    cond: Conditions,
    model: ModelId,
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
    rx: Receiver<(u64, ChartData, Duration)>,
    /// Key of the last request sent.
    pub requested: Option<u64>,
    /// Latest result: (key, data, time taken).
    pub latest: Option<(u64, ChartData, Duration)>,
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
                    if done.send((req.key, data, start.elapsed())).is_err() {
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

    /// Asks for a chart unless the same one is already asked for.
    pub fn request(
        &mut self,
        ctx: &egui::Context,
        lib: &Arc<Library>,
        formula: &Formula,
        cond: &Conditions,
        model: ModelId,
        job: ChartJob,
    ) {
        let mut h = DefaultHasher::new();
        key_of(lib, formula, cond, model).hash(&mut h);
        format!("{job:?}").hash(&mut h);
        let key = h.finish();
        if self.requested == Some(key) {
            return;
        }
        self.requested = Some(key);
        let _ = self.tx.send(Request {
            key,
            ctx: Some(ctx.clone()),
            lib: lib.clone(),
            formula: formula.clone(),
            cond: *cond,
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
            (Some((k, d, _)), Some(r)) if *k == r => Some(d),
            _ => None,
        }
    }

    /// The latest data even if a newer request is still being computed.
    pub fn last(&self) -> Option<&ChartData> {
        self.latest.as_ref().map(|(_, d, _)| d)
    }

    /// Whether a request is still being computed.
    pub fn busy(&self) -> bool {
        self.requested.is_some() && self.latest.as_ref().map(|l| l.0) != self.requested
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
                    let p = water::p_sat_liquid(t);
                    let vapor_pa = s.water_activity.iter().map(|a| a * p).collect();
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
            let mut ev = colligo_core::models::Evaluator::new(lib, &comp, *model);
            let n = 100;
            let pts = (0..=n)
                .map(|i| {
                    let tc = from_c + (to_c - from_c) * f64::from(i) / f64::from(n);
                    let tk = tc + T_ZERO_C;
                    let aw = ev
                        .ln_aw(
                            tk,
                            comp.water_kg,
                            &colligo_core::models::CapMode::Equilibrium,
                        )
                        .exp();
                    let p = water::p_sat_liquid(tk);
                    (tc, aw * p, p)
                })
                .collect();
            ChartData::VaporPressure(pts)
        }
    }
}

/// Computes a chart on the calling thread (exports, tests).
pub fn chart_now(
    lib: &Arc<Library>,
    formula: &Formula,
    cond: &Conditions,
    model: ModelId,
    job: ChartJob,
) -> ChartData {
    compute_chart(&Request {
        key: 0,
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
                for (t, p, v) in pts {
                    w.write_record([t.to_string(), p.to_string(), v.to_string()])?;
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
            let d = chart_now(&lib, &f, &cond, ModelId::Auto, job.clone());
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
            ModelId::Auto,
            ChartJob::Freezing { to_c: -30.0 },
        ) {
            let f: Vec<f64> = c.points.iter().map(|p| p.ice_fraction_of_water).collect();
            assert!(f.windows(2).all(|w| w[1] >= w[0] - 1e-9));
            assert!(f.last().copied().unwrap_or(0.0) > 0.5);
        }
    }
}
