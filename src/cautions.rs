//! The cautions, one source of the text for the window (its foot line and the note), the
//! report and the printed hand-outs. Text only: no egui, no I/O.

/// The one-line reminder: at the foot of the window, in the report and on the hand-outs.
pub const ONE_LINE: &str = "Radiating on FM broadcast or 2 m needs a licence in most places, \
     and nothing may ever radiate in 108–137 MHz (aircraft). Power the bench from batteries \
     or a bench supply, never from mains or a telephone line.";

/// Paragraphs of the full note: (heading, text).
pub const NOTE: [(&str, &str); 6] = [
    (
        "Licences for transmitting",
        "An oscillator tuned to the FM broadcast band (88–108 MHz) is a transmitter as soon as \
         it reaches an antenna or a long lead. Most countries require a licence for any \
         emission there. Some allow unlicensed devices of very low power only, within strict \
         limits (in the US, for example, 47 CFR §15.239 bounds the field strength and the \
         bandwidth); many countries allow nothing at all. Work into a dummy load or a screened \
         box and keep the leads short.",
    ),
    (
        "The 2 m amateur band",
        "144–148 MHz (144–146 MHz in ITU Region 1) is for licensed radio amateurs. Without an \
         amateur licence, build and measure there only with the oscillator into a dummy load, \
         and never connect an antenna.",
    ),
    (
        "Aeronautical band: 108–137 MHz",
        "Navigation aids and air-traffic voice use 108–137 MHz, just above FM broadcast. No \
         bench oscillator may ever radiate there, even briefly or at low power; interference \
         with it endangers aircraft. The readouts flag a resonance that lands in this band, and \
         a harmonic of a lower oscillator can land there too.",
    ),
    (
        "Dangerous voltages",
        "Telephone lines carry ringing voltages that can exceed 90 V, and mains voltage can kill. \
         Never power a bench oscillator from either, and never connect one to them. Build from \
         batteries or a current-limited bench supply.",
    ),
    (
        "Soldering",
        "A soldering iron tip is near 350 °C: use a stand, and keep cables clear of the tip. \
         Flux fumes irritate the lungs and eyes: work with ventilation or fume extraction, and \
         wash hands after handling leaded solder. Wear eye protection when trimming leads.",
    ),
    (
        "Local rules come first",
        "These notes are general reminders, not legal advice. The rules of your country and the \
         practice of licensed operators, club instructors and workshop supervisors take \
         precedence over anything this program shows.",
    ),
];
