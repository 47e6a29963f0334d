//! `tankwright design`: the coil, capacitor and trimmer from the parts on hand that land a
//! target (the search is [`crate::tuning::design::search`]; this file reads flags, converts
//! units and writes the answer). Every flag is checked before any solve.

use super::args::{ArgError, Args};
use crate::model::Coating;
use crate::tuning::construction::Construction;
use crate::tuning::design::parts::{
    self, PartsOnHand, entries, parse_fixed_list, parse_former, parse_trimmer, parse_wire,
    wire_label,
};
use crate::tuning::design::{Candidate, Design, DesignSettings, plan_for, search};
use crate::tuning::digits::{mhz, mhz_range, mm, spread_range};
use crate::tuning::verdict::Aim;
use crate::units::{from_mm, to_mhz, to_mm, to_pf};
use serde_json::{Value, json};

/// Most candidates `--count` accepts.
pub const COUNT_MAX: usize = 20;

/// The flag each part list is read from, for messages.
fn flag_of(list: &str) -> &'static str {
    match list {
        parts::FORMERS => "--formers-mm",
        parts::WIRES => "--wires-mm",
        parts::FIXED => "--fixed-pf",
        parts::TRIMMERS => "--trimmers-pf",
        parts::LEAD => "--lead-mm",
        _ => "--target-mhz",
    }
}

/// A design request read from flags.
struct Request {
    parts: PartsOnHand,
    aim: Aim,
    settings: DesignSettings,
    save: Option<std::path::PathBuf>,
    json: bool,
}

fn list<T>(
    args: &Args,
    name: &str,
    example: &str,
    read: impl Fn(&str) -> Result<T, String>,
) -> Result<Vec<T>, ArgError> {
    let text = args
        .text(name)
        .ok_or_else(|| ArgError(format!("--{name} is missing (e.g. --{name} {example})")))?;
    let tokens = entries(text);
    if tokens.is_empty() {
        return Err(ArgError(format!(
            "--{name} is empty (e.g. --{name} {example})"
        )));
    }
    tokens
        .into_iter()
        .map(|t| read(t).map_err(|e| ArgError(format!("--{name}: {e}"))))
        .collect()
}

fn request(args: &Args) -> Result<Request, ArgError> {
    let target_text = args
        .text("target-mhz")
        .ok_or_else(|| ArgError("--target-mhz is missing (e.g. --target-mhz 98.7)".to_owned()))?;
    let target = crate::tuning::channel_list::parse_target_mhz(target_text)
        .map_err(|e| ArgError(format!("--target-mhz: {e}")))?;
    let coating = match args.integer("enamel")? {
        None => Coating::Bare,
        Some(1) => Coating::EnamelGrade1,
        Some(2) => Coating::EnamelGrade2,
        Some(g) => return Err(ArgError(format!("--enamel {g}: the grade is 1 or 2"))),
    };
    let formers = list(args, "formers-mm", "5,6,1/4in", parse_former)?;
    let wires = list(args, "wires-mm", "0.8,1.0,awg18", |t| {
        parse_wire(t, coating)
    })?;
    let fixed_text = args.text("fixed-pf").ok_or_else(|| {
        ArgError("--fixed-pf is missing (e.g. --fixed-pf 4.7,6.8,10 or E12:4.7-47)".to_owned())
    })?;
    let fixed = parse_fixed_list(fixed_text).map_err(|e| ArgError(format!("--fixed-pf: {e}")))?;
    let trimmers = list(args, "trimmers-pf", "2-10,4-20", parse_trimmer)?;
    let lead = from_mm(args.number("lead-mm")?.unwrap_or(5.0));
    let construction =
        super::stray_flags::construction_flag(args)?.unwrap_or(Construction::CopperClad);
    let count = match args.integer("count")? {
        None => 5,
        Some(n) if (1..=COUNT_MAX as i32).contains(&n) => n as usize,
        Some(n) => {
            return Err(ArgError(format!("--count {n} is outside 1–{COUNT_MAX}")));
        }
    };
    let save = match args.text("save-best") {
        None => None,
        Some(f) if f.ends_with(".ron") => Some(std::path::PathBuf::from(f)),
        Some(f) => {
            return Err(ArgError(format!(
                "--save-best '{}': a recipe file ends in .ron",
                super::clean(f)
            )));
        }
    };
    args.reject_unknown()?;
    args.reject_positional()?;
    let parts = PartsOnHand {
        formers,
        wires,
        fixed,
        trimmers,
        lead_length: lead,
        construction,
    };
    parts
        .check()
        .map_err(|e| ArgError(format!("{}: {}", flag_of(e.list), e.message)))?;
    let settings = DesignSettings {
        count,
        confirm: (8 * count).max(40),
        ..DesignSettings::default()
    };
    Ok(Request {
        aim: Aim::new(plan_for(target), Some(target)),
        parts,
        settings,
        save,
        json: args.switch("json"),
    })
}

/// One candidate in the JSON, units in the keys.
pub fn candidate_json(c: &Candidate) -> Value {
    let enamel = match c.wire.coating {
        Coating::Bare => Value::Null,
        Coating::EnamelGrade1 => json!(1),
        Coating::EnamelGrade2 => json!(2),
    };
    json!({
        "former_mm": to_mm(c.former),
        "wire_mm": c.wire.bare_diameter().map(to_mm),
        "wire": wire_label(&c.wire),
        "enamel": enamel,
        "turns": c.turns,
        "length_mm": to_mm(c.length),
        "lead_mm": to_mm(c.lead_length),
        "fixed_pf": to_pf(c.fixed),
        "trimmer_min_pf": to_pf(c.trimmer.min),
        "trimmer_max_pf": to_pf(c.trimmer.max),
        "trimmer_pct": c.trimmer_setting * 100.0,
        "stray_pf": to_pf(c.stray),
        "resonance_mhz": to_mhz(c.resonance),
        "trimmer_reach_mhz": [to_mhz(c.reach.0), to_mhz(c.reach.1)],
        "resonance_range_mhz": [to_mhz(c.spread.0), to_mhz(c.spread.1)],
        "khz_per_mm": c.khz_per_mm(),
        "q": c.q,
        "self_resonance_mhz": to_mhz(c.self_resonance),
        "wire_to_cut_mm": to_mm(c.wire_to_cut),
        "resonance_source": if c.field_solved { "field_solved" } else { "classical" },
        "reasons": c.reasons,
    })
}

/// The design as JSON: `{"candidates": [...], "ruled_out": [...]}`.
pub fn design_json(d: &Design) -> Value {
    json!({
        "candidates": d.candidates.iter().map(candidate_json).collect::<Vec<_>>(),
        "ruled_out": d.ruled_out,
    })
}

/// The design as text for a reader.
fn design_text(d: &Design, target: f64) -> String {
    let mut s = format!("Designs for {} from the parts on hand\n", mhz(target));
    for (i, c) in d.candidates.iter().enumerate() {
        s.push_str(&format!(
            "\n{}. {} turns, {} former, {}, {} long; {}, {} trimmer at {:.0} %\n   lands {}, \
             reach {}, build lands within {}\n",
            i + 1,
            parts::short(c.turns),
            mm(c.former, 2),
            wire_label(&c.wire),
            mm(c.length, 1),
            crate::tuning::design::fixed_label(c.fixed),
            c.trimmer.label(),
            100.0 * c.trimmer_setting,
            mhz(c.resonance),
            mhz_range(c.reach.0, c.reach.1),
            spread_range(c.spread.0, c.spread.1),
        ));
        for r in &c.reasons {
            s.push_str(&format!("   - {r}\n"));
        }
    }
    if !d.ruled_out.is_empty() {
        s.push_str("\nRuled out:\n");
        for r in &d.ruled_out {
            s.push_str(&format!("  - {r}\n"));
        }
    }
    s.push_str(&format!(
        "\n{} coils landed the target at a buildable length; {} passed the screen; {} were \
         tried on the field-solved tank.\n",
        d.landed, d.passed_screen, d.confirmed
    ));
    s
}

/// Run `design` on the words after the subcommand; Ok(stdout) or Err(one-line message).
pub fn run_design(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &["json"]).map_err(|e| e.to_string())?;
    let req = request(&args).map_err(|e| e.to_string())?;
    let design = search(&req.parts, &req.aim, &req.settings)
        .map_err(|e| format!("{}: {}", flag_of(e.list), e.message))?;
    if let Some(path) = &req.save {
        let best = design.candidates.first().ok_or_else(|| {
            format!(
                "nothing saved to {}: {}",
                path.display(),
                design.ruled_out.first().cloned().unwrap_or_default()
            )
        })?;
        let recipe = crate::recipe::from_design::recipe_of(
            best,
            &req.aim,
            &req.settings,
            req.parts.construction,
        );
        crate::recipe::save(path, &recipe).map_err(|e| e.to_string())?;
    }
    let target = req.aim.target.unwrap_or_default();
    Ok(if req.json {
        let mut s = design_json(&design).to_string();
        s.push('\n');
        s
    } else {
        design_text(&design, target)
    })
}
