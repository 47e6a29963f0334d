//! The machine-readable form of an [`Analysis`], in display units named in the keys.

use crate::model::{Analysis, InductanceModel};
use crate::tuning::field_tank::FieldBasis;
use crate::units::{to_mhz, to_mm, to_nh, to_pf};
use serde_json::{Value, json};

/// One JSON object with every figure; units in the key names (nh, pf, mhz, mm, ohm).
pub fn analysis_json(a: &Analysis) -> Value {
    let i = &a.inductance;
    let g = &a.coil;
    let mut inductance_nh = serde_json::Map::new();
    for m in InductanceModel::ALL {
        inductance_nh.insert(m.json_key().to_owned(), json!(i.by_model(m).map(to_nh)));
    }
    for (key, henries) in [
        ("round_wire_low_freq", i.round_wire_low_freq),
        ("leads", i.leads),
        ("total", a.total_inductance),
        ("apparent", a.apparent_inductance),
    ] {
        inductance_nh.insert(key.to_owned(), json!(to_nh(henries)));
    }
    json!({
        "nagaoka_coefficient": a.nagaoka_coefficient,
        "inductance_nh": inductance_nh,
        "model": a.model.label(),
        "rosa_k_s": i.k_s,
        "rosa_k_m": i.k_m,
        "internal_inductance_fraction": i.internal_inductance_fraction,
        "self_capacitance_pf": to_pf(a.self_capacitance),
        "medhurst_h": a.medhurst_factor,
        "external_capacitance_pf": to_pf(a.external_capacitance),
        "total_capacitance_pf": to_pf(a.total_capacitance),
        "resonance_mhz": to_mhz(a.resonance),
        "self_resonance_mhz": {
            "lumped": to_mhz(a.self_resonance.lumped),
            "helical": to_mhz(a.self_resonance.helical),
        },
        "skin_depth_um": a.skin_depth * 1e6,
        "skin_resistance_ratio": a.skin_resistance_ratio,
        "proximity_factor": a.proximity_factor,
        "dc_resistance_ohm": a.dc_resistance,
        "ac_resistance_ohm": a.ac_resistance,
        "q": a.q,
        "wire_length_mm": to_mm(g.wire_length()),
        "geometry_mm": {
            "mean_diameter": to_mm(g.mean_diameter()),
            "former_diameter": to_mm(g.former_diameter()),
            "wire_bare": to_mm(g.wire_bare()),
            "wire_overall": to_mm(g.wire_overall()),
            "pitch": to_mm(g.pitch()),
            "gap": to_mm(g.gap()),
            "length": to_mm(g.length()),
            "lead_length": to_mm(g.lead_length()),
        },
        "turns": g.turns(),
        "length_over_diameter": g.length_over_diameter(),
        "warnings": a.warnings.iter().map(|w| w.message.clone()).collect::<Vec<_>>(),
    })
}

/// Put the field solution into an [`analysis_json`] object of the driving analysis (the model
/// moved onto the field solution, see [`crate::tuning::field_tank::FieldBasis`]), so
/// `resonance_mhz`, the offsets and the verdict are the field-solved tank's when the field
/// solution is available, and the classical model's otherwise. `resonance_source` says which
/// (`field_solved` or `classical`), `field_inductance_factor` the factor on the model's
/// inductance that meets the field solution; the classical figures are kept as
/// `resonance_mhz_classical` and `inductance_nh.apparent_classical`; `inductance_nh.apparent`
/// is the field solution's X/ω at the resonance. `self_resonance_mhz.field_solved` is the
/// first parallel self-resonance at the terminals (leads as given). When the field solution
/// refuses the coil, `field_solved` is null and `field_solution_note` says why.
pub fn add_field_solution(v: &mut Value, classical: &Analysis, basis: &FieldBasis) {
    v["inductance_nh"]["apparent_classical"] = json!(to_nh(classical.apparent_inductance));
    v["resonance_mhz_classical"] = json!(to_mhz(classical.resonance));
    v["resonance_source"] = json!(basis.json_name());
    v["field_inductance_factor"] = json!(basis.scale());
    match basis {
        FieldBasis::Solved { tank: f, .. } => {
            v["inductance_nh"]["apparent"] = json!(to_nh(f.apparent_inductance));
            v["self_resonance_mhz"]["field_solved"] = json!(to_mhz(f.self_resonance));
            v["field_series_resistance_ohm"] = json!(f.series_resistance);
            v["field_q"] = json!(f.q());
            v["field_segments"] = json!(f.segments);
        }
        FieldBasis::Held { .. } => {
            v["self_resonance_mhz"]["field_solved"] = Value::Null;
        }
        FieldBasis::Classical { why } => {
            v["inductance_nh"]["apparent"] = json!(to_nh(classical.apparent_inductance));
            v["self_resonance_mhz"]["field_solved"] = Value::Null;
            v["field_solution_note"] = json!(why.to_string());
        }
    }
}
