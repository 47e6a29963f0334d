//! What the search ruled out, per part on the list: for each former, wire, fixed capacitor and
//! trimmer with no candidate that passed, the furthest test any of its combinations reached
//! and why the closest one failed there ("no candidate with the 5 mm former: the trimmer's
//! travel leaves the band or reaches protected frequencies (closest: …)").

use super::judge::Stage;
use super::parts::{PartsOnHand, wire_label};
use super::{fixed_label, parts::short};

#[derive(Clone, Debug, Default)]
struct Slot {
    used: bool,
    furthest: Option<(Stage, String)>,
}

impl Slot {
    fn note(&mut self, stage: Stage, text: &str) {
        if self.furthest.as_ref().is_none_or(|(s, _)| stage > *s) {
            self.furthest = Some((stage, text.to_owned()));
        }
    }
}

/// The failures seen, kept per part.
#[derive(Clone, Debug)]
pub struct Tally {
    slots: [Vec<Slot>; 4],
    stages: [usize; 5],
    furthest: Option<(Stage, String)>,
    unconfirmed: Vec<(Stage, String)>,
}

impl Tally {
    /// An empty tally for `parts`.
    pub fn new(parts: &PartsOnHand) -> Self {
        Self {
            slots: [
                vec![Slot::default(); parts.formers.len()],
                vec![Slot::default(); parts.wires.len()],
                vec![Slot::default(); parts.fixed.len()],
                vec![Slot::default(); parts.trimmers.len()],
            ],
            stages: [0; 5],
            furthest: None,
            unconfirmed: Vec::new(),
        }
    }

    /// A failure of the combination `key` (former, wire, fixed, trimmer indices).
    pub fn fail(&mut self, key: [usize; 4], (stage, text): (Stage, String)) {
        for (slots, &i) in self.slots.iter_mut().zip(&key) {
            if let Some(slot) = slots.get_mut(i) {
                slot.note(stage, &text);
            }
        }
        if let Some(n) = Stage::ALL.iter().position(|s| *s == stage) {
            self.stages[n] += 1;
        }
        if self.furthest.as_ref().is_none_or(|(s, _)| stage > *s) {
            self.furthest = Some((stage, text));
        }
    }

    /// A screened candidate that failed on the field-solved tank.
    pub fn fail_confirmed(&mut self, key: [usize; 4], failure: (Stage, String)) {
        self.unconfirmed.push(failure.clone());
        self.fail(key, failure);
    }

    /// Many failures.
    pub fn merge(&mut self, failures: Vec<([usize; 4], (Stage, String))>) {
        for (key, f) in failures {
            self.fail(key, f);
        }
    }

    /// A combination that passed the screen: its parts are not ruled out.
    pub fn passed(&mut self, key: [usize; 4]) {
        for (slots, &i) in self.slots.iter_mut().zip(&key) {
            if let Some(slot) = slots.get_mut(i) {
                slot.used = true;
            }
        }
    }

    /// The ruled-out list in words: first, when nothing is proposed, the constraint that ruled
    /// everything out (the furthest test reached, with counts per test); then each part with no
    /// candidate.
    pub fn words(&self, parts: &PartsOnHand, nothing: bool, passed_screen: usize) -> Vec<String> {
        let mut out = Vec::new();
        if nothing {
            let counts: Vec<String> = Stage::ALL
                .iter()
                .zip(self.stages)
                .filter(|(_, n)| *n > 0)
                .map(|(s, n)| format!("{n} because {}", s.label()))
                .collect();
            match &self.furthest {
                Some((stage, text)) => out.push(format!(
                    "no candidate: {} (the closest: {text}). Tried: {}",
                    stage.label(),
                    counts.join("; ")
                )),
                None if passed_screen > 0 => out.push(
                    "no candidate: none of the screened candidates could be confirmed".to_owned(),
                ),
                None => out.push("no candidate: nothing to try".to_owned()),
            }
        }
        if let Some((stage, text)) = self.unconfirmed.first() {
            out.push(format!(
                "{} of the screened candidates failed once solved on the field-solved tank, \
                 e.g. {text} ({})",
                self.unconfirmed.len(),
                stage.label()
            ));
        }
        let names: [Vec<String>; 4] = [
            parts
                .formers
                .iter()
                .map(|f| format!("the {} mm former", short(f * 1e3)))
                .collect(),
            parts
                .wires
                .iter()
                .map(|w| format!("the {} wire", wire_label(w)))
                .collect(),
            parts.fixed.iter().map(|&c| fixed_label(c)).collect(),
            parts
                .trimmers
                .iter()
                .map(|t| format!("the {} trimmer", t.label()))
                .collect(),
        ];
        for (slots, names) in self.slots.iter().zip(&names) {
            for (slot, name) in slots.iter().zip(names) {
                if slot.used {
                    continue;
                }
                match &slot.furthest {
                    Some((stage, text)) => out.push(format!(
                        "no candidate with {name}: {} (closest: {text})",
                        stage.label()
                    )),
                    None => out.push(format!("no candidate with {name}")),
                }
            }
        }
        out
    }
}
