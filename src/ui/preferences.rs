//! How the window shows things, kept between sessions (eframe storage).

use crate::ui::theme::Theme;
use crate::ui::units::LengthUnit;

/// Storage key under which an earlier version kept the view preferences in eframe's `app.ron`
/// (read once when its state is taken over; see `working_copy`).
pub const PREFERENCES_KEY: &str = "tankwright.view";

/// How the window shows things (kept between sessions).
#[derive(Clone, Copy, Debug, PartialEq, serde::Serialize, serde::Deserialize)]
#[serde(default)]
pub struct Preferences {
    /// Lengths in millimetres or inches.
    #[serde(with = "unit_serde")]
    pub unit: LengthUnit,
    /// Light or dark.
    pub theme: Theme,
    /// Whether the field solution of the coil leads the resonance (on by default; off, the
    /// classical model leads and no worker runs).
    pub field_solution: bool,
}

impl Default for Preferences {
    fn default() -> Self {
        Self {
            unit: LengthUnit::default(),
            theme: Theme::default(),
            field_solution: true,
        }
    }
}

impl Preferences {
    /// What the figures stand on under this setting (the one place the window keeps it).
    pub fn footing(&self) -> crate::recipe::Footing {
        crate::recipe::Footing::of_setting(self.field_solution)
    }
}

/// `LengthUnit` lives in `units.rs` without serde; stored here as a short name.
mod unit_serde {
    use crate::ui::units::LengthUnit;
    use serde::{Deserialize, Deserializer, Serializer};

    pub fn serialize<S: Serializer>(unit: &LengthUnit, s: S) -> Result<S::Ok, S::Error> {
        s.serialize_str(unit.suffix())
    }

    pub fn deserialize<'de, D: Deserializer<'de>>(d: D) -> Result<LengthUnit, D::Error> {
        let name = String::deserialize(d)?;
        Ok(if name == LengthUnit::Inches.suffix() {
            LengthUnit::Inches
        } else {
            LengthUnit::Millimetres
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn preferences_survive_a_round_trip_and_missing_fields_default() {
        let chosen = Preferences {
            unit: LengthUnit::Inches,
            theme: Theme::Light,
            field_solution: false,
        };
        let text = ron::to_string(&chosen).expect("serialise");
        assert_eq!(ron::from_str::<Preferences>(&text), Ok(chosen));
        let older: Preferences = ron::from_str("(theme: Light)").expect("parse");
        assert_eq!(older.unit, LengthUnit::Millimetres);
        assert_eq!(older.theme, Theme::Light);
        assert!(
            older.field_solution,
            "the field solution is on unless switched off"
        );
    }
}
