package infer

// Template is a commented evidence file; `whichreg evidence init` writes it.
// It measures nothing: every measurement is a commented line with an
// example, so an untouched template gives the prior only. Uncommenting a
// line (and writing the reading) records a measurement. Every line fits 80
// columns.
const Template = `# Evidence about one unmarked three-terminal regulator, for 'whichreg infer'.
# Every measurement below is commented out: an untouched file measures
# nothing. To record a reading, delete the '#' at the start of its line and
# write what you measured; uncomment a [table] line with the first key under
# it. Leave out what you have not measured, and never guess.
# Numbers may carry units and prefixes: "4k7", "0R22", "2200u", "12.6".
#
# SAFETY: measure voltages with the equipment powered only with care: mains
# wiring is live, filter capacitors hold their charge after switch-off, and
# the regulator's tab or can may be live. Discharge capacitors before probing
# for continuity. Follow local codes and qualified practice.

ref       = "U1"              # board reference
equipment = "what it is, which board"
# What is legible of the marking: ? one unreadable character, * any run.
# marking = "?M3?7"
# An outline name from 'whichreg catalog list'; or give [outline] instead.
# package = "TO-220"
# year = 1985                 # when the equipment was made (nearby date codes)

# Measured with calipers, when the package name is in doubt.
# [outline]
# leads = 3                   # leads counted, not the tab
# pitch_mm = 2.54             # centre to centre of adjacent leads
# hole_spacing_mm = 30.2      # mounting holes of a TO-3/TO-66 can
# metal_can = false

# One table per lead, numbered as 'whichreg catalog show' draws the outline
# (TO-220: marked face toward you, leads down, 1-2-3 from the left).
# wired_to, power off, ohmmeter: unregulated, load, ground, network, open or
# inductor. volts: DC volts to board ground, powered, at normal load.
# [pins.1]
# wired_to = "unregulated"
# volts = 12.0
# [pins.2]
# wired_to = "ground"
# volts = 0
# [pins.3]
# wired_to = "load"
# volts = 5.0

# The tab or metal can. On a TO-3 the can is the third terminal.
# [case]
# tied_to_pin = 2             # continuity to which lead; 0 for none
# wired_to = "ground"         # where the case goes on the board
# volts = 0

# What feeds the part: a rectifier (bridge, center-tap, half-wave) or "dc".
# [input]
# rectifier = "bridge"
# secondary_vrms = 12.6       # loaded secondary (per half for center-tap)
# secondary_regulation = 0.10 # no-load rise as a fraction
# filter_uf = 2200            # the reservoir capacitor
# mains_hz = 50
# mains_tolerance = 0.10      # fraction either way
# dc_volts = 13.8             # rectifier "dc": the nominal DC input
# dc_volts_min = 10           # rectifier "dc": lowest (weak battery)
# dc_volts_max = 16           # rectifier "dc": highest (charging, fault)
# transient_volts = 40        # surges the part must survive (load dump)
# trough_volts = 11.2         # scope: lowest input voltage under load

# The regulated rail. cap_type: ceramic, tantalum, electrolytic or none.
# [output]
# amps = 0.5                  # normal (maximum) load current
# min_amps = 0.05             # lightest load
# cap_uf = 10                 # capacitor at the output
# cap_type = "electrolytic"

# [bypass]
# ohms = 10                   # resistor from input to output (booster)

# What sits in the common/ADJ lead.
# [network]
# r_top_ohms = 240            # output to common/ADJ
# r_bottom_ohms = 720         # common/ADJ to the return rail
# bottom_to_volts = 0         # the return rail (0 for ground)
# trimmer = false
# diode_drops = 1             # silicon diodes in series (lifted ground)
# zener_volts = 3.3           # a zener (or LED string)

# An external pass transistor around the regulator.
# [booster]
# transistor = "pnp"          # pnp or npn
# r_sense_ohms = 0.33         # its drop turns the transistor on

# Bench tests, powered: a current-limited bench supply in place of the input
# (dropout_volts: input minus output when the output first falls 2 %, the
# supply lowered at normal load), or a test load raised in steps (holds_amps:
# the largest load the output holds within 2 % for ten seconds).
# [bench]
# dropout_volts = 1.8
# holds_amps = 1.0

# How the part is cooled. insulator: none, grease, mica, silicone, unknown.
# [mount]
# heatsink_c_per_w = 5.0      # 0 for free air
# insulator = "mica"
# chassis_heatsink = true     # the sink is bonded to chassis or ground
# ambient_c = 40
`
