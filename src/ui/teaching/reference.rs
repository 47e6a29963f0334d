//! A known-good build pinned for comparison: its curve stays on the spacing chart in a muted
//! style and the differences from the present recipe are listed (turns, length, wire, tank,
//! predicted and measured frequency). The reference is evaluated by the same
//! [`crate::recipe::figures()`] as the recipe itself; it is never saved in the recipe.

use crate::model::Coil;
use crate::recipe::{Figures, Footing, Recipe, figures_on};
use crate::tuning::digits;
use crate::tuning::sweep::spacing_sweep;
use crate::ui::charts::{ChartOverlay, OverlayKind};
use crate::ui::units::LengthUnit;
use crate::units::{to_mm, to_pf};

/// Points in the reference's curve.
const SAMPLES: usize = 200;

/// The pinned build.
#[derive(Clone, Debug, PartialEq)]
pub struct Reference {
    /// What it is called on the chart and in the list (a file name, or the recipe's name).
    pub name: String,
    /// The recipe as pinned.
    pub recipe: Recipe,
    /// Its figures.
    pub figures: Figures,
    /// Resonance against length at its own trimmer setting: (metres, hertz).
    pub curve: Vec<[f64; 2]>,
    /// What its figures stand on (the window's at the time).
    pub footing: Footing,
}

/// Legend name of a reference called `name`.
pub fn legend_name(name: &str) -> String {
    format!("reference: {name}")
}

impl Reference {
    /// Pin `recipe` as `name`, its figures on `footing` (the window's: with its field
    /// solution solved here, or the classical model alone); refused, with the engine's reason,
    /// if its coil or tank is.
    pub fn new(name: String, recipe: Recipe, footing: Footing) -> Result<Self, String> {
        let figures = figures_on(&recipe, footing)
            .map_err(|e| format!("the reference cannot be evaluated: {e}"))?;
        let coil = figures.coil;
        let curve = spacing_sweep(
            &coil,
            &figures.tank,
            &figures.conditions,
            &[figures.tank.trimmer_setting],
            super::sweep::range(&coil),
            SAMPLES,
        )
        .into_iter()
        .next()
        .map(|c| c.points)
        .unwrap_or_default();
        Ok(Self {
            name,
            recipe,
            figures,
            curve,
            footing,
        })
    }

    /// Its curve and point on the spacing chart.
    pub fn overlay(&self) -> ChartOverlay {
        ChartOverlay {
            name: legend_name(&self.name),
            kind: OverlayKind::Reference,
            coil: self.figures.coil,
            curve: self.curve.clone(),
            marker: Some([self.figures.coil.length(), self.figures.analysis.resonance]),
        }
    }

    /// How the present recipe (with its `present` figures) differs from the reference.
    pub fn differences(
        &self,
        recipe: &Recipe,
        present: &Figures,
        unit: LengthUnit,
    ) -> Vec<Difference> {
        let (a, b) = (&present.coil, &self.figures.coil);
        let (ta, tb) = (&recipe.tank, &self.recipe.tank);
        let length = |c: &Coil| unit.show(c.length());
        let per = unit.suffix();
        let in_unit = |m: f64| digits::signed(unit.from_metres(m), unit.decimals());
        let mut rows = vec![
            Difference::new(
                "Turns",
                format!("{}", a.turns()),
                format!("{}", b.turns()),
                digits::signed(a.turns() - b.turns(), 2),
            ),
            Difference::new(
                "Coil length",
                length(a),
                length(b),
                format!("{} {per}", in_unit(a.length() - b.length())),
            ),
            Difference::new(
                "Gap",
                unit.show(a.gap()),
                unit.show(b.gap()),
                format!("{} {per}", in_unit(a.gap() - b.gap())),
            ),
            Difference::new(
                "Mean diameter",
                unit.show(a.mean_diameter()),
                unit.show(b.mean_diameter()),
                format!("{} {per}", in_unit(a.mean_diameter() - b.mean_diameter())),
            ),
            Difference::new("Wire", wire(a), wire(b), "different".to_owned()),
            Difference::new(
                "Fixed capacitor",
                format!("{:.1} pF", to_pf(ta.fixed)),
                format!("{:.1} pF", to_pf(tb.fixed)),
                format!("{} pF", digits::signed(to_pf(ta.fixed - tb.fixed), 1)),
            ),
            Difference::new(
                "Trimmer",
                trimmer(ta),
                trimmer(tb),
                format!(
                    "{} pF",
                    digits::signed(
                        to_pf(
                            ta.trimmer_at(ta.trimmer_setting) - tb.trimmer_at(tb.trimmer_setting)
                        ),
                        1
                    )
                ),
            ),
            Difference::new(
                "Stray",
                format!("{:.1} pF", to_pf(ta.stray)),
                format!("{:.1} pF", to_pf(tb.stray)),
                format!("{} pF", digits::signed(to_pf(ta.stray - tb.stray), 1)),
            ),
            Difference::new(
                "Predicted",
                digits::mhz(present.uncalibrated.resonance),
                digits::mhz(self.figures.uncalibrated.resonance),
                digits::offset(
                    present.uncalibrated.resonance - self.figures.uncalibrated.resonance,
                ),
            ),
        ];
        let measured = |r: &Recipe| r.bench_log.last().map(|e| e.measured);
        let (ma, mb) = (measured(recipe), measured(&self.recipe));
        let shown = |m: Option<f64>| m.map_or_else(|| "none logged".to_owned(), digits::mhz);
        rows.push(Difference::new(
            "Measured (last reading)",
            shown(ma),
            shown(mb),
            match (ma, mb) {
                (Some(x), Some(y)) => digits::offset(x - y),
                _ => String::new(),
            },
        ));
        rows
    }
}

fn wire(c: &Coil) -> String {
    if c.is_bare() {
        format!("bare {:.2} mm", to_mm(c.wire_bare()))
    } else {
        format!("enamelled {:.2} mm", to_mm(c.wire_bare()))
    }
}

fn trimmer(t: &crate::model::Tank) -> String {
    format!(
        "{:.1}–{:.1} pF at {:.0} %",
        to_pf(t.trimmer_min),
        to_pf(t.trimmer_max),
        t.trimmer_setting * 100.0
    )
}

/// One line of the list of differences.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Difference {
    /// The quantity.
    pub quantity: &'static str,
    /// In the present recipe.
    pub present: String,
    /// In the reference.
    pub reference: String,
    /// Present minus reference, in words ("same" when they read alike).
    pub change: String,
}

impl Difference {
    fn new(quantity: &'static str, present: String, reference: String, change: String) -> Self {
        let change = if present == reference {
            "same".to_owned()
        } else {
            change
        };
        Self {
            quantity,
            present,
            reference,
            change,
        }
    }
}

/// The pinning controls' state: the typed path shown when no dialog can be, and the last
/// message.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct PinState {
    /// The path typed when no system dialog can be shown (`Some` while the field is shown).
    pub typed: Option<String>,
    /// Why no dialog was shown.
    pub reason: String,
    /// The last message (a refusal, or what was pinned).
    pub message: Option<(String, bool)>,
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::recipe::figures;

    #[test]
    fn a_recipe_against_itself_differs_in_nothing() {
        let recipe = Recipe::demo();
        let pinned =
            Reference::new("demo".into(), recipe.clone(), Footing::FieldSolution).expect("valid");
        let rows = pinned.differences(&recipe, &pinned.figures, LengthUnit::Millimetres);
        assert!(rows.iter().all(|r| r.change == "same"), "{rows:?}");
        let mut longer = recipe.clone();
        longer.winding.turns += 1.0;
        let present = figures(&longer).expect("valid");
        let rows = pinned.differences(&longer, &present, LengthUnit::Millimetres);
        let turns = rows
            .iter()
            .find(|r| r.quantity == "Turns")
            .expect("turns row");
        assert_eq!(turns.change, "+1.00");
    }

    #[test]
    fn a_reference_is_evaluated_on_the_windows_footing() {
        let recipe = Recipe::demo();
        let solved =
            Reference::new("demo".into(), recipe.clone(), Footing::FieldSolution).expect("valid");
        assert_eq!(solved.figures, figures(&recipe).expect("valid"));
        let classical =
            Reference::new("demo".into(), recipe.clone(), Footing::Classical).expect("valid");
        let model = crate::model::evaluate(&recipe.winding, &recipe.tank, &recipe.conditions)
            .expect("valid");
        assert_eq!(classical.figures.analysis, model);
        // Switching the setting evaluates a pinned reference again.
        let mut bench = crate::ui::teaching::Teaching::default();
        bench
            .pin("demo".into(), recipe, Footing::FieldSolution)
            .expect("valid");
        assert_eq!(
            bench.reference().map(|r| r.figures.analysis.resonance),
            Some(solved.figures.analysis.resonance)
        );
        bench.follow_footing(Footing::Classical);
        assert_eq!(
            bench.reference().map(|r| r.figures.analysis.resonance),
            Some(model.resonance)
        );
    }
}
