//! The build sheet and the apprentice's worksheet as content: headings, rows of label and
//! value, paragraphs and an empty table, every figure from [`crate::recipe::figures()`] (the
//! same figures as the window and `report`) and the expectation from
//! [`crate::recipe::expectation()`]. No layout and no I/O: [`super::pdf`] lays it out.

use super::chart_data::{ChartData, ChartKind, chart_data};
use crate::model::{Coating, Gauge};
use crate::recipe::expectation::DRAWS;
use crate::recipe::{Figures, Footing, Recipe, expectation, figures_on};
use crate::tuning::BandPlan;
use crate::tuning::bands::us_fm_channel_number;
use crate::tuning::buildable::former_drills;
use crate::tuning::digits;
use crate::units::{to_khz, to_khz_per_mm, to_mhz, to_mm, to_pf};

/// A label and its value.
pub type Row = (String, String);

/// Columns of the worksheet's bench table.
pub const BENCH_COLUMNS: [&str; 6] = [
    "#",
    "frequency (MHz)",
    "length (mm)",
    "trimmer (%)",
    "instrument",
    "note",
];

/// Empty rows of the bench table (recorded readings fill the first ones).
pub const BENCH_ROWS: usize = 12;

/// Everything printed.
#[derive(Clone, Debug, PartialEq)]
pub struct Sheet {
    /// The recipe's name.
    pub name: String,
    /// Its notes (may be empty).
    pub notes: String,
    /// What the figures rest on (see [`crate::recipe::Figures::basis_text`]).
    pub basis: String,
    /// The verdict in a few lines.
    pub verdict: Vec<String>,
    /// The coil to wind.
    pub coil: Vec<Row>,
    /// The tank.
    pub tank: Vec<Row>,
    /// The target and how to reach it.
    pub target: Vec<Row>,
    /// What to expect before the first measurement.
    pub expect: Vec<String>,
    /// The spacing chart.
    pub spacing: ChartData,
    /// The worksheet's steps.
    pub steps: Vec<String>,
    /// Readings already recorded, in the bench table's columns.
    pub readings: Vec<[String; 6]>,
    /// The cautions: (heading, text).
    pub cautions: Vec<(String, String)>,
}

/// The sheet for `recipe` with its figures on `footing` (the headless command: the field
/// solution; the window: its setting), or the reason they cannot be made.
pub fn sheet(recipe: &Recipe, footing: Footing) -> Result<Sheet, String> {
    let f = figures_on(recipe, footing).map_err(|e| format!("invalid recipe: {e}"))?;
    let basis = format!("{}.", f.basis_text());
    let v = &f.verdict;
    let mut verdict = vec![v.channel_text(), v.safety_text(), v.next_step()];
    verdict.extend(v.flags.iter().map(|flag| format!("Caution: {}", flag.text)));
    Ok(Sheet {
        name: recipe.name.trim().to_owned(),
        notes: recipe.notes.trim().to_owned(),
        basis,
        verdict,
        coil: coil_rows(recipe, &f),
        tank: tank_rows(recipe),
        target: target_rows(recipe, &f),
        expect: expect_lines(recipe, &f),
        spacing: chart_data(ChartKind::Spacing, recipe, &f),
        steps: steps(recipe, &f),
        readings: recipe
            .bench_log
            .iter()
            .enumerate()
            .map(|(i, e)| {
                [
                    (i + 1).to_string(),
                    digits::fixed(to_mhz(e.measured), 4),
                    digits::fixed(to_mm(e.length), 2),
                    digits::fixed(e.trimmer_setting * 100.0, 0),
                    e.instrument.clone(),
                    e.note.clone(),
                ]
            })
            .collect(),
        cautions: crate::cautions::NOTE
            .iter()
            .map(|(h, t)| ((*h).to_owned(), (*t).to_owned()))
            .collect(),
    })
}

fn row(label: &str, value: String) -> Row {
    (label.to_owned(), value)
}

/// The wire in words: "1.000 mm bare copper", "AWG 18 (1.024 mm), enamel grade 1, …".
fn wire_words(recipe: &Recipe, f: &Figures) -> String {
    let g = &f.coil;
    let size = match recipe.winding.wire.gauge {
        Gauge::Awg(n) => format!("AWG {n} ({:.3} mm)", to_mm(g.wire_bare())),
        Gauge::Swg(n) => format!("SWG {n} ({:.3} mm)", to_mm(g.wire_bare())),
        Gauge::Metric(d) => format!("{:.3} mm", to_mm(d)),
    };
    let coating = match recipe.winding.wire.coating {
        Coating::Bare => "bare copper".to_owned(),
        Coating::EnamelGrade1 => {
            format!("enamel grade 1, {:.3} mm overall", to_mm(g.wire_overall()))
        }
        Coating::EnamelGrade2 => {
            format!("enamel grade 2, {:.3} mm overall", to_mm(g.wire_overall()))
        }
    };
    format!("{size}, {coating}")
}

fn drill_words(f: &Figures) -> Option<String> {
    let drills = former_drills(&f.coil);
    let words: Vec<String> = [drills.metric, drills.inch]
        .into_iter()
        .flatten()
        .map(|d| {
            format!(
                "{} ({} mm from the former)",
                d.label,
                digits::signed(to_mm(d.difference), 2)
            )
        })
        .collect();
    (!words.is_empty()).then(|| words.join(" or "))
}

fn coil_rows(recipe: &Recipe, f: &Figures) -> Vec<Row> {
    let g = &f.coil;
    let mut rows = vec![row(
        "former",
        format!(
            "{} mm (mean diameter {} mm)",
            digits::fixed(to_mm(g.former_diameter()), 3),
            digits::fixed(to_mm(g.mean_diameter()), 3)
        ),
    )];
    if let Some(d) = drill_words(f) {
        rows.push(row("nearest drill or rod", d));
    }
    rows.push(row("wire", wire_words(recipe, f)));
    rows.push(row("turns", digits::fixed(g.turns(), 2)));
    rows.push(row(
        "length (turns × pitch)",
        format!(
            "{} mm, a gap of {} mm between turns",
            digits::fixed(to_mm(g.length()), 2),
            digits::fixed(to_mm(g.gap()), 2)
        ),
    ));
    rows.push(row(
        "leads",
        format!("{} mm each", digits::fixed(to_mm(g.lead_length()), 1)),
    ));
    rows.push(row(
        "wire to cut",
        format!(
            "{} (the helix and both leads)",
            digits::wire_to_cut_mm(g.wire_length())
        ),
    ));
    rows
}

fn pf(c: f64) -> String {
    format!("{} pF", digits::fixed(to_pf(c), 2))
}

fn tank_rows(recipe: &Recipe) -> Vec<Row> {
    let t = &recipe.tank;
    let mut rows = vec![row("fixed capacitor", pf(t.fixed))];
    if t.is_fixed() {
        rows.push(row("trimmer", fixed_trimmer_words(t)));
    } else {
        rows.push(row(
            "trimmer",
            format!(
                "{}–{} pF, set to {} % ({})",
                digits::fixed(to_pf(t.trimmer_min), 1),
                digits::fixed(to_pf(t.trimmer_max), 1),
                digits::fixed(t.trimmer_setting * 100.0, 0),
                pf(t.trimmer_at(t.trimmer_setting))
            ),
        ));
    }
    rows.push(row("stray (as entered)", pf(t.stray)));
    if let Some(d) = t.feedback {
        rows.push(row(
            "feedback divider",
            format!(
                "{} over {} in series: {}",
                pf(d.upper),
                pf(d.lower),
                pf(d.series_capacitance())
            ),
        ));
    }
    rows.push(row(
        "across the coil",
        format!(
            "{} (without its self-capacitance)",
            pf(t.external_capacitance())
        ),
    ));
    rows
}

/// A fixed tank's trimmer: none, naming a capacitance of no span entered as a trimmer.
fn fixed_trimmer_words(t: &crate::model::Tank) -> String {
    if t.trimmer_min > 0.0 {
        format!(
            "none: a fixed tank ({} of no span entered as a trimmer)",
            pf(t.trimmer_min)
        )
    } else {
        "none: a fixed tank".to_owned()
    }
}

fn target_rows(recipe: &Recipe, f: &Figures) -> Vec<Row> {
    let t = &f.target;
    // Channel numbers belong to the US plan (47 CFR §73.201).
    let number = matches!(recipe.target.plan, BandPlan::UsFm)
        .then(|| us_fm_channel_number(t.channel))
        .flatten()
        .map(|n| format!(" (channel {n})"))
        .unwrap_or_default();
    let mut rows = vec![
        row("band plan", recipe.target.plan.label().to_string()),
        row(
            "target channel",
            format!(
                "{} MHz{number}, on channel within ±{} kHz",
                digits::channel_mhz(t.channel),
                digits::fixed(to_khz(t.tolerance), 0)
            ),
        ),
        row(
            "predicted now",
            format!(
                "{}, offset {}",
                digits::mhz(t.resonance),
                digits::offset(t.offset)
            ),
        ),
    ];
    // A fixed tank reaches one frequency: no range from a frequency to itself.
    if !recipe.tank.is_fixed() {
        rows.push(row(
            "trimmer reaches",
            digits::mhz_range(t.window.0, t.window.1),
        ));
    }
    rows.push(match &t.length_for_target {
        Ok(l) => row(
            "length for the target",
            format!(
                "{} mm ({} mm from now)",
                digits::fixed(to_mm(*l), 2),
                digits::signed(to_mm(l - f.coil.length()), 2)
            ),
        ),
        Err(e) => row("length for the target", format!("not proposed: {e}")),
    });
    if !recipe.tank.is_fixed() {
        rows.push(match &t.setting_for_target {
            Ok(s) => row(
                "or trimmer at",
                format!("{} % at the present length", digits::fixed(s * 100.0, 0)),
            ),
            Err(e) => row("trimmer alone", format!("not enough: {e}")),
        });
    }
    rows.push(row(
        "stretching moves it",
        format!(
            "{} kHz per mm",
            digits::fixed(to_khz_per_mm(t.stretch_sensitivity), 0)
        ),
    ));
    rows
}

fn expect_lines(recipe: &Recipe, f: &Figures) -> Vec<String> {
    let settings = &recipe.stray_estimate;
    let e = expectation(recipe, f, &[]);
    let s = e.estimate.stray_term();
    vec![
        format!(
            "A {} build typically adds {} of stray ({}–{} pF) where this recipe has {} \
             entered; with that estimate instead the resonance would be {} (typical {}).",
            settings.construction.label(),
            pf(s.typical),
            digits::fixed(to_pf(s.low), 2),
            digits::fixed(to_pf(s.high), 2),
            pf(recipe.tank.stray),
            digits::spread_range(e.window.low, e.window.high),
            digits::mhz_at(
                e.window.typical,
                digits::spread_decimals(e.window.high - e.window.low)
            )
        ),
        format!(
            "With the stray as entered, the estimate's range around it and the builder's \
             tolerances ({}): expect {} before the first measurement (95 % of {DRAWS} \
             simulated builds).",
            settings.tolerances.in_words(),
            digits::spread_range(e.before.expected.0, e.before.expected.1)
        ),
    ]
}

fn steps(recipe: &Recipe, f: &Figures) -> Vec<String> {
    let g = &f.coil;
    let former = match drill_words(f) {
        Some(d) => format!(
            "{} mm former (nearest drill or rod: {d})",
            digits::fixed(to_mm(g.former_diameter()), 2)
        ),
        None => format!("{} mm former", digits::fixed(to_mm(g.former_diameter()), 2)),
    };
    let fixed = recipe.tank.is_fixed();
    let cut = format!(
        "Cut {} mm of {} and wind {} turns close on the {former}.",
        digits::fixed(to_mm(g.wire_length()), 0),
        wire_words(recipe, f),
        digits::fixed(g.turns(), 2)
    );
    let spread = format!(
        "Spread the turns evenly to {} mm (a gap of {} mm), leaving {} mm leads.",
        digits::fixed(to_mm(g.length()), 2),
        digits::fixed(to_mm(g.gap()), 2),
        digits::fixed(to_mm(g.lead_length()), 1)
    );
    let per_mm = digits::fixed(to_mhz(f.target.stretch_sensitivity.abs()), 0);
    if fixed {
        // A fixed tank: the length is the only adjustment (no trimmer to set or finish on).
        return vec![
            cut,
            spread,
            "Power up into a dummy load and measure the frequency.".to_owned(),
            "Write every reading in the table: frequency, length and the instrument used."
                .to_owned(),
            format!(
                "Squeeze the turns to go lower, spread them to go higher (about {per_mm} kHz \
                 per mm): the length is the only adjustment of a fixed tank, so finish on it \
                 and fix the turns in place."
            ),
        ];
    }
    vec![
        cut,
        spread,
        format!(
            "Set the trimmer to {} %, power up into a dummy load and measure the frequency.",
            digits::fixed(recipe.tank.trimmer_setting * 100.0, 0)
        ),
        "Write every reading in the table: frequency, length, trimmer and the instrument used."
            .to_owned(),
        format!(
            "Squeeze the turns to go lower, spread them to go higher (about {per_mm} kHz per \
             mm), and finish on the trimmer."
        ),
    ]
}
