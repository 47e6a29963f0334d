//! A bounded, seeded fault campaign over the three readers of outside input (issue 22,
//! "Tests"): the command-line flags of `evaluate`, the recipe reader and the `.model` reader.
//! A few thousand cases, run in-process (no process per case), deterministic from the seed;
//! each asserts no panic, no NaN or inf printed as a figure, and that a refusal names what it
//! refuses. The cases are the campaign's own kinds: numbers past every range, NaN, inf,
//! SPICE suffixes, empty and cut words, bidirectional controls, deleted and doubled bytes.

use std::panic::{AssertUnwindSafe, catch_unwind};
use tankwright::cli::{refuse_undefined, run_evaluate};

/// xorshift64* (G. Marsaglia, "Xorshift RNGs", J. Stat. Software 8, 2003; S. Vigna's
/// multiplier, 2016): enough for picking cases, and the same cases on every machine.
struct Rng(u64);

impl Rng {
    fn next(&mut self) -> u64 {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        self.0.wrapping_mul(0x2545_f491_4f6c_dd1d)
    }
    fn below(&mut self, n: usize) -> usize {
        (self.next() % n as u64) as usize
    }
    fn pick<'a>(&mut self, items: &[&'a str]) -> &'a str {
        items[self.below(items.len())]
    }
}

const SEED: u64 = 0x7a4e_2022_dec4_0022;

/// Values a user or a script might give, and ones only a fault campaign would.
fn nasty(rng: &mut Rng) -> String {
    const FIXED: [&str; 24] = [
        "-19",
        "-100",
        "-1e6",
        "0",
        "-0",
        "1e308",
        "-1e308",
        "1e-300",
        "NaN",
        "nan",
        "inf",
        "-inf",
        "1p",
        "",
        " ",
        "5 5",
        "0x10",
        "\u{202e}5",
        "1_000",
        "+",
        "1e",
        "3.",
        ".5",
        "99999999999999999999999999999999999999",
    ];
    match rng.below(3) {
        0 => FIXED[rng.below(FIXED.len())].to_owned(),
        1 => {
            // A finite number on a wide log scale, either sign.
            let exp = rng.below(40) as i32 - 20;
            let sign = if rng.below(4) == 0 { "-" } else { "" };
            format!("{sign}{}e{exp}", 1 + rng.below(9))
        }
        _ => format!("{}.{}", rng.below(400), rng.below(100)),
    }
}

/// The flags `evaluate` knows (coil, tank, stray, junction, drift).
const FLAGS: [&str; 32] = [
    "mean-diameter-mm",
    "turns",
    "length-mm",
    "wire-mm",
    "lead-mm",
    "capacitance-pf",
    "stray-pf",
    "temperature-c",
    "trimmer-min-pf",
    "trimmer-max-pf",
    "trimmer-pct",
    "target-mhz",
    "tolerance-khz",
    "capacitance-tolerance-pct",
    "junction-cj0-pf",
    "junction-vj",
    "junction-m",
    "bias-v",
    "audio-peak-v",
    "coupling-pf",
    "audio-max-khz",
    "supply-v",
    "supply-change-v",
    "temperature-change-k",
    "hand-pf",
    "load-change-pf",
    "channel-tolerance-khz",
    "gap-mm",
    "awg",
    "enamel",
    "model",
    "construction",
];

/// A small coil (two turns: the field solution stays cheap) with a junction, so the drift
/// and modulation lines are all made.
fn base() -> Vec<(String, String)> {
    [
        ("mean-diameter-mm", "6"),
        ("turns", "2"),
        ("length-mm", "4"),
        ("wire-mm", "1"),
        ("capacitance-pf", "30"),
        ("junction-cj0-pf", "10"),
        ("junction-vj", "0.7"),
        ("junction-m", "0.5"),
        ("bias-v", "4"),
        ("audio-peak-v", "0.1"),
    ]
    .iter()
    .map(|(k, v)| ((*k).to_owned(), (*v).to_owned()))
    .collect()
}

/// What a refusal may name instead of the flag: the field or part, in the model's words.
const NAMED: [&str; 14] = [
    "junction",
    "coil",
    "wire",
    "turn",
    "diameter",
    "pitch",
    "length",
    "capacitance",
    "trimmer",
    "temperature",
    "lead",
    "gap",
    "target",
    "tolerance",
];

fn has_undefined(text: &str) -> bool {
    refuse_undefined(text).is_err()
}

/// A message's own words: what it quotes back of the input ('…') is left out, since a word
/// the user typed ("nan") is shown as typed.
fn own_words(message: &str) -> String {
    message
        .split('\'')
        .enumerate()
        .filter(|(i, _)| i % 2 == 0)
        .map(|(_, part)| part)
        .collect::<Vec<_>>()
        .join(" ")
}

/// The longest run of digits in `text`.
fn longest_digits(text: &str) -> usize {
    text.split(|c: char| !c.is_ascii_digit())
        .map(str::len)
        .max()
        .unwrap_or(0)
}

#[test]
fn evaluate_flags_fuzzed_in_process() {
    let mut rng = Rng(SEED);
    let (mut accepted, mut refused) = (0, 0);
    for case in 0..1500 {
        let mut flags = base();
        let mut touched = Vec::new();
        for _ in 0..1 + rng.below(2) {
            let name = rng.pick(&FLAGS).to_owned();
            let value = nasty(&mut rng);
            touched.push(name.clone());
            match flags.iter_mut().find(|(k, _)| *k == name) {
                Some(slot) => slot.1 = value,
                None => flags.push((name, value)),
            }
        }
        let json = rng.below(2) == 0;
        let mut words: Vec<String> = Vec::new();
        for (k, v) in &flags {
            words.push(format!("--{k}"));
            words.push(v.clone());
        }
        if json {
            words.push("--json".to_owned());
        }
        let shown = words.join(" ");
        let result = catch_unwind(AssertUnwindSafe(|| run_evaluate(words.clone())))
            .unwrap_or_else(|_| panic!("case {case} panicked: {shown}"));
        match result {
            Ok(out) => {
                accepted += 1;
                assert!(!has_undefined(&out), "case {case}: {shown}\n{out}");
                if json {
                    let v: serde_json::Value = serde_json::from_str(&out)
                        .unwrap_or_else(|e| panic!("case {case}: not JSON ({e}): {shown}"));
                    for line in v["drift"].as_array().into_iter().flatten() {
                        assert!(line["shift_khz"].is_f64(), "case {case}: {shown}: {line}");
                    }
                    if let Some(m) = v["modulation"].as_object() {
                        for (key, x) in m {
                            assert!(!x.is_null(), "case {case}: {key} null: {shown}");
                        }
                    }
                }
            }
            Err(e) => {
                refused += 1;
                // As main.rs prints it.
                let e = tankwright::cli::for_terminal(&e);
                assert!(!has_undefined(&own_words(&e)), "case {case}: {shown}\n{e}");
                assert!(longest_digits(&e) <= 16, "case {case}: a long number: {e}");
                assert!(e.len() < 400, "case {case}: a long message: {e}");
                // The refusal names a flag, a field or the part it concerns.
                let names = touched.iter().any(|t| e.contains(t.as_str()))
                    || e.contains("--")
                    || NAMED.iter().any(|w| e.contains(w));
                assert!(
                    names,
                    "case {case}: the refusal names nothing: {e}\n{shown}"
                );
                assert!(
                    !e.contains('\u{202e}'),
                    "case {case}: a bidirectional control in: {e}"
                );
            }
        }
    }
    // The campaign reaches both sides.
    assert!(
        accepted > 100 && refused > 100,
        "{accepted} accepted, {refused} refused"
    );
}

/// The demo recipe's text with one number, or a few bytes, changed.
#[test]
fn recipe_reader_fuzzed() {
    use tankwright::recipe::format::{read_text, to_text};
    let demo = to_text(&tankwright::recipe::Recipe::demo());
    // Where the numbers are: each run of digits, by byte offset.
    let numbers: Vec<(usize, usize)> = {
        let b = demo.as_bytes();
        let mut v = Vec::new();
        let mut i = 0;
        while i < b.len() {
            if b[i].is_ascii_digit() {
                let start = i;
                while i < b.len() && (b[i].is_ascii_digit() || b[i] == b'.') {
                    i += 1;
                }
                v.push((start, i));
            } else {
                i += 1;
            }
        }
        v
    };
    let mut rng = Rng(SEED ^ 0x5eed);
    for case in 0..1500 {
        let text = match rng.below(3) {
            0 | 1 => {
                let (a, b) = numbers[rng.below(numbers.len())];
                format!("{}{}{}", &demo[..a], nasty(&mut rng), &demo[b..])
            }
            _ => {
                let mut bytes = demo.clone().into_bytes();
                for _ in 0..1 + rng.below(3) {
                    let at = rng.below(bytes.len());
                    if rng.below(2) == 0 {
                        bytes.remove(at);
                    } else {
                        let c = bytes[rng.below(bytes.len())];
                        bytes.insert(at, c);
                    }
                }
                String::from_utf8_lossy(&bytes).into_owned()
            }
        };
        let read = catch_unwind(AssertUnwindSafe(|| read_text(&text)))
            .unwrap_or_else(|_| panic!("case {case} panicked:\n{text}"));
        match read {
            Ok(opened) => {
                // What was read is written back as read, and reads back the same (a NaN
                // stays NaN: compared by the text).
                let again = to_text(&opened.recipe);
                let back = read_text(&again)
                    .unwrap_or_else(|e| panic!("case {case}: written text unreadable: {e}"));
                assert_eq!(to_text(&back.recipe), again, "case {case}");
                if let Some(r) = &opened.refusal {
                    assert!(
                        r.field.is_some() || r.position.is_some(),
                        "case {case}: a refusal with neither field nor place: {r}"
                    );
                    assert!(!r.to_string().contains('\u{202e}'), "case {case}: {r}");
                }
            }
            Err(e) => {
                let said = e.to_string();
                assert!(
                    e.position.is_some() || e.field.is_some(),
                    "case {case}: an error with neither place nor field: {said}"
                );
                assert!(said.len() < 600, "case {case}: a long message: {said}");
            }
        }
    }
}

#[test]
fn model_line_reader_fuzzed() {
    use tankwright::tuning::spice_model::{CONTACT_POTENTIAL_V, parse_model};
    const KEYS: [&str; 12] = [
        "CJO", "CJ0", "VJ", "PB", "M", "FC", "CJC", "VJC", "MJC", "IS", "RS", "BV",
    ];
    const TYPES: [&str; 5] = ["D", "NPN", "PNP", "JFET", "d"];
    let mut rng = Rng(SEED ^ 0x0de1);
    for case in 0..1500 {
        let mut params = Vec::new();
        for _ in 0..rng.below(5) {
            let value = match rng.below(3) {
                0 => nasty(&mut rng),
                1 => format!(
                    "{}{}",
                    1 + rng.below(99),
                    rng.pick(&["p", "n", "u", "f", "", "meg"])
                ),
                _ => format!("0.{}", rng.below(999)),
            };
            params.push(format!("{}={value}", rng.pick(&KEYS)));
        }
        let line = format!(
            "{}.model X{} {}({})",
            if rng.below(20) == 0 { "* " } else { "" },
            rng.below(10),
            rng.pick(&TYPES),
            params.join(" ")
        );
        let read = catch_unwind(AssertUnwindSafe(|| parse_model(&line)))
            .unwrap_or_else(|_| panic!("case {case} panicked: {line}"));
        match read {
            Ok(m) => {
                let (lo, hi) = CONTACT_POTENTIAL_V;
                assert!(m.law.cj0.is_finite() && m.law.cj0 > 0.0, "{line}");
                assert!((lo..=hi).contains(&m.law.contact_potential), "{line}");
                assert!(m.law.grading > 0.0 && m.law.grading < 5.0, "{line}");
                let c = m.law.capacitance(4.0);
                assert!(
                    c.is_finite() && c > 0.0,
                    "case {case}: C(4 V) = {c}: {line}"
                );
            }
            Err(e) => {
                assert!(e.0.contains(".model"), "case {case}: {} for {line}", e.0);
                assert!(!has_undefined(&own_words(&e.0)), "case {case}: {}", e.0);
            }
        }
    }
}
